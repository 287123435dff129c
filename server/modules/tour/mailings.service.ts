import type { Knex } from 'knex';
import type { Logger } from 'pino';
import type { InviteVenueStaffBody, MailingView, SendManifestBody } from '../../../src/domain/contracts/tour.ts';
import type { Mailer, OutgoingMail } from '../../mail/mailer.ts';
import { AppError, invalid, notFound } from '../../http/errors.ts';
import { invitationsService } from '../invitations/invitations.service.ts';
import { venueManifestPdf } from '../documents/manifest-document.service.ts';
import { buildManifest, manifestChanges, manifestCsv, manifestText, snapshotOf, type ManifestSnapshot } from './manifest.service.ts';

/**
 * E-mail to a venue: its manifest and invitations for its staff, each logged per engagement with who sent
 * it, when, to whom and what the mail server said. A message the server would not take is kept as it was
 * (text and attachments) so that it can be sent again as it was; an invitation gets a fresh link on retry.
 */
interface MailingRow {
  id: string;
  production_id: string;
  engagement_id: string;
  kind: 'manifest' | 'invitation';
  recipient: string;
  recipient_name: string;
  subject: string;
  body_text: string;
  snapshot: { manifest: ManifestSnapshot; changes: string[] | null } | null;
  attachments: { filename: string; contentType: string; base64: string }[];
  invitation_id: string | null;
  status: 'sent' | 'failed';
  error: string | null;
  message_id: string | null;
  attempts: number;
  sent_by: string | null;
  sent_by_name?: string | null;
  created_at: Date;
  last_attempt_at: Date;
}

function toMailingView(r: MailingRow): MailingView {
  return {
    id: r.id,
    engagementId: r.engagement_id,
    kind: r.kind,
    recipient: r.recipient,
    recipientName: r.recipient_name,
    subject: r.subject,
    status: r.status,
    error: r.error,
    attempts: r.attempts,
    sentBy: r.sent_by_name ?? null,
    createdAt: new Date(r.created_at).toISOString(),
    lastAttemptAt: new Date(r.last_attempt_at).toISOString(),
    changes: r.snapshot?.changes ?? [],
  };
}

/** What the mail server said, in one line: its code and its message (never credentials). */
function describeMailError(err: unknown): string {
  const e = err as { code?: string; responseCode?: number; message?: string };
  const parts = [e.code, e.responseCode ? `SMTP ${e.responseCode}` : undefined].filter(Boolean).join(', ');
  const message = (e.message ?? String(err)).replace(/\/\/[^@\s]*@/g, '//…@').slice(0, 500);
  return parts ? `${parts}: ${message}` : message;
}

export function mailingsService(deps: { db: Knex; mailer: Mailer; appUrl: string; log: Logger }) {
  const { db } = deps;

  async function deliver(mail: OutgoingMail): Promise<{ status: 'sent'; messageId: string } | { status: 'failed'; error: string }> {
    try {
      const { messageId } = await deps.mailer.send(mail);
      return { status: 'sent', messageId };
    } catch (err) {
      deps.log.warn({ err: describeMailError(err), to: mail.to }, 'e-mail could not be delivered; kept for retry');
      return { status: 'failed', error: describeMailError(err) };
    }
  }

  /** The invitation service with a mailer that remembers why a delivery failed (the service logs only a flag). */
  async function inviteThroughAdminService(productionId: string, venueId: string, body: InviteVenueStaffBody, invitedBy: string) {
    let failure: string | null = null;
    const mailer: Mailer = {
      catching: deps.mailer.catching,
      close: async () => undefined,
      send: async (m) => {
        try {
          return await deps.mailer.send(m);
        } catch (err) {
          failure = describeMailError(err);
          throw err;
        }
      },
    };
    const service = invitationsService({ db, mailer, appUrl: deps.appUrl, log: deps.log });
    const { invitation } = await service.invite({ email: body.email, name: body.name, isAdmin: false, membership: { productionId, role: 'venue', venueIds: [venueId] } }, invitedBy);
    return { invitationId: invitation.id, delivered: invitation.delivered, error: invitation.delivered ? null : (failure ?? 'The mail server did not take the message.') };
  }

  const listQuery = (productionId: string) =>
    db('engagement_mailings as m').leftJoin('users as u', 'u.id', 'm.sent_by').where('m.production_id', productionId).select('m.*', 'u.name as sent_by_name');

  return {
    async list(productionId: string, filter: { engagementId?: string; status?: 'sent' | 'failed' }): Promise<MailingView[]> {
      const q = listQuery(productionId).orderBy('m.created_at', 'desc').limit(500);
      if (filter.engagementId) q.where('m.engagement_id', filter.engagementId);
      if (filter.status) q.where('m.status', filter.status);
      return ((await q) as MailingRow[]).map(toMailingView);
    },

    async sendManifest(productionId: string, engagementId: string, body: SendManifestBody, sentBy: string): Promise<MailingView[]> {
      const manifest = await buildManifest(db, productionId, engagementId);
      const recipients = body.recipients?.length
        ? body.recipients.map((email) => ({ email, name: manifest.venue.contacts.find((c) => c.email === email)?.name ?? '' }))
        : manifest.venue.contacts.filter((c) => c.receivesManifest && c.email).map((c) => ({ email: c.email, name: c.name }));
      if (recipients.length === 0) {
        throw invalid(`No one to send to: add a contact with an e-mail address to ${manifest.venue.name}, or name the recipients.`, [
          { path: 'recipients', message: `${manifest.venue.name} has no contact that receives the manifest.` },
        ]);
      }
      const previous = (await db('engagement_mailings')
        .where({ engagement_id: engagementId, kind: 'manifest', status: 'sent' })
        .orderBy('created_at', 'desc')
        .first()) as MailingRow | undefined;
      const snapshot = snapshotOf(manifest);
      const changes = previous?.snapshot ? manifestChanges(previous.snapshot.manifest, snapshot) : null;
      const link = `${deps.appUrl}/p/${productionId}/tour/engagements/${engagementId}`;
      const subject = `${changes ? 'Updated manifest' : 'Manifest'}: ${manifest.production.name} at ${manifest.venue.name}, load-in ${manifest.engagement.loadInOn}`;
      const text = manifestText(manifest, { link, changes, message: body.message });
      const csv = new TextEncoder().encode(manifestCsv(manifest));
      const filename = `manifest-${manifest.venue.name.toLowerCase().replace(/[^a-z0-9]+/g, '-')}-${manifest.engagement.loadInOn}.csv`;
      // The printed manifest (rendered by the documents module from the same manifest data) and the crate list.
      const pdf = await venueManifestPdf(db, productionId, engagementId, { userId: sentBy });
      const attachments = [
        { filename: pdf.filename, content: new Uint8Array(pdf.pdf), contentType: 'application/pdf' },
        { filename, content: csv, contentType: 'text/csv' },
      ];
      const out: MailingView[] = [];
      for (const r of recipients) {
        const result = await deliver({ to: r.email, subject, text, attachments });
        const [row] = await db('engagement_mailings')
          .insert({
            production_id: productionId,
            engagement_id: engagementId,
            kind: 'manifest',
            recipient: r.email,
            recipient_name: r.name,
            subject,
            body_text: text,
            snapshot: JSON.stringify({ manifest: snapshot, changes }),
            attachments: JSON.stringify(attachments.map((a) => ({ filename: a.filename, contentType: a.contentType, base64: Buffer.from(a.content).toString('base64') }))),
            status: result.status,
            error: result.status === 'failed' ? result.error : null,
            message_id: result.status === 'sent' ? result.messageId : null,
            sent_by: sentBy,
          })
          .returning('id');
        out.push(toMailingView((await listQuery(productionId).where('m.id', row.id).first()) as MailingRow));
      }
      return out;
    },

    async invite(productionId: string, engagementId: string, venueId: string, body: InviteVenueStaffBody, sentBy: string): Promise<MailingView> {
      const result = await inviteThroughAdminService(productionId, venueId, body, sentBy);
      const [row] = await db('engagement_mailings')
        .insert({
          production_id: productionId,
          engagement_id: engagementId,
          kind: 'invitation',
          recipient: body.email,
          recipient_name: body.name,
          subject: 'You are invited to Ballast',
          body_text: 'Invitation to join the production as venue staff (the link is sent once and not kept).',
          invitation_id: result.invitationId,
          status: result.delivered ? 'sent' : 'failed',
          error: result.error,
          sent_by: sentBy,
        })
        .returning('id');
      return toMailingView((await listQuery(productionId).where('m.id', row.id).first()) as MailingRow);
    },

    /** Sends a failed message again: the same manifest message, or a new invitation link. */
    async retry(productionId: string, mailingId: string, retriedBy: string): Promise<MailingView> {
      const row = (await db('engagement_mailings').where({ id: mailingId, production_id: productionId }).first()) as MailingRow | undefined;
      if (!row) throw notFound('That message');
      if (row.status === 'sent') throw new AppError('conflict', `This message was delivered already (${new Date(row.last_attempt_at).toISOString()}); send a new one instead.`);
      let status: 'sent' | 'failed';
      let error: string | null = null;
      let messageId: string | null = null;
      let invitationId = row.invitation_id;
      if (row.kind === 'manifest') {
        const result = await deliver({
          to: row.recipient,
          subject: row.subject,
          text: row.body_text,
          attachments: row.attachments.map((a) => ({ filename: a.filename, contentType: a.contentType, content: new Uint8Array(Buffer.from(a.base64, 'base64')) })),
        });
        status = result.status;
        if (result.status === 'sent') messageId = result.messageId;
        else error = result.error;
      } else {
        const engagement = await db('engagements').where({ id: row.engagement_id }).first('venue_id');
        // The undelivered invitation's link never reached anyone: replace it with a fresh one.
        if (row.invitation_id) await db('invitations').where({ id: row.invitation_id }).whereNull('accepted_at').delete();
        const result = await inviteThroughAdminService(productionId, engagement.venue_id, { email: row.recipient, name: row.recipient_name || row.recipient }, retriedBy);
        invitationId = result.invitationId;
        status = result.delivered ? 'sent' : 'failed';
        error = result.error;
      }
      await db('engagement_mailings')
        .where({ id: row.id })
        .update({ status, error, message_id: messageId, invitation_id: invitationId, attempts: db.raw('attempts + 1'), last_attempt_at: db.fn.now() });
      return toMailingView((await listQuery(productionId).where('m.id', row.id).first()) as MailingRow);
    },
  };
}
