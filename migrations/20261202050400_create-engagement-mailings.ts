import type { Knex } from 'knex';

/**
 * The delivery log of each engagement: every manifest and invitation e-mail, who sent it, when, to whom,
 * and whether the mail server took it (with its error when not). A failed message keeps what is needed to
 * send it again. A manifest keeps a snapshot of what it said, so that the next one can say what changed.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('engagement_mailings', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('production_id').notNullable().references('productions.id').onDelete('CASCADE');
    t.uuid('engagement_id').notNullable().references('engagements.id').onDelete('CASCADE');
    t.text('kind').notNullable();
    t.text('recipient').notNullable();
    t.text('recipient_name').notNullable().defaultTo('');
    t.text('subject').notNullable();
    t.text('body_text').notNullable();
    // Manifest: what the manifest said (crates, dates, access verdicts), for the next send's changes.
    t.jsonb('snapshot');
    // Attachments as sent (name, type, base64), so a retry sends the same message.
    t.jsonb('attachments').notNullable().defaultTo('[]');
    // Invitation: the invitation row it created (replaced on retry).
    t.uuid('invitation_id');
    t.text('status').notNullable();
    t.text('error');
    t.text('message_id');
    t.integer('attempts').notNullable().defaultTo(1);
    t.uuid('sent_by').references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('last_attempt_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['engagement_id', 'created_at']);
    t.index(['production_id', 'status']);
    t.check(`kind in ('manifest', 'invitation')`);
    t.check(`status in ('sent', 'failed')`);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('engagement_mailings');
}
