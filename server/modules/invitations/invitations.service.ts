import type { Knex } from 'knex';
import type { Logger } from 'pino';
import type { InvitationBody } from '../../../src/domain/contracts/auth.ts';
import { hashPassword, hashToken, newToken } from '../../security/passwords.ts';
import { AppError, invalid, notFound } from '../../http/errors.ts';
import type { Mailer } from '../../mail/mailer.ts';

const INVITATION_TTL_MS = 7 * 24 * 60 * 60 * 1000;

export function invitationsService(deps: { db: Knex; mailer: Mailer; appUrl: string; log: Logger }) {
  const { db } = deps;

  async function venuesBelong(trx: Knex, productionId: string, venueIds: string[]): Promise<void> {
    if (!venueIds.length) return;
    const found = await trx('venues').where({ production_id: productionId }).whereIn('id', venueIds).pluck('id');
    const missing = venueIds.filter((v) => !found.includes(v));
    if (missing.length) throw invalid('Some venues are not part of this production.', [{ path: 'membership.venueIds', message: `Unknown venue ${missing[0]}.` }]);
  }

  return {
    venuesBelong,
    async invite(body: InvitationBody, invitedBy: string) {
      if (body.membership) {
        const production = await db('productions').where({ id: body.membership.productionId }).first();
        if (!production) throw invalid('No such production.', [{ path: 'membership.productionId', message: 'Unknown production.' }]);
        if (body.membership.role === 'venue' && body.membership.venueIds.length === 0) {
          throw invalid('A venue user needs at least one venue.', [{ path: 'membership.venueIds', message: 'Pick the venues this person works for.' }]);
        }
        await venuesBelong(db, body.membership.productionId, body.membership.venueIds);
      }
      const existing = await db('users').whereRaw('lower(email) = lower(?)', [body.email]).first();
      if (existing) throw invalid('A person with this e-mail already has an account.', [{ path: 'email', message: 'Already has an account.' }]);
      const { token, hash } = newToken();
      const expiresAt = new Date(Date.now() + INVITATION_TTL_MS);
      const [row] = await db('invitations')
        .insert({
          email: body.email,
          name: body.name,
          is_admin: body.isAdmin,
          production_id: body.membership?.productionId ?? null,
          role: body.membership?.role ?? null,
          venue_ids: body.membership?.venueIds ?? [],
          token_hash: hash,
          expires_at: expiresAt,
          invited_by: invitedBy,
        })
        .returning(['id', 'email', 'expires_at']);
      const link = `${deps.appUrl}/invite/${encodeURIComponent(token)}`;
      let delivered = true;
      try {
        await deps.mailer.send({
          to: body.email,
          subject: 'You are invited to Ballast',
          text: `Hello ${body.name},\n\nYou have been invited to Ballast, where the crew plans how the machine is split, crated, lifted and shipped.\n\nChoose your password here within seven days:\n\n${link}\n`,
        });
      } catch (err) {
        delivered = false;
        deps.log.error({ err }, 'invitation e-mail could not be sent');
      }
      return { invitation: { id: row.id, email: row.email, expiresAt: new Date(row.expires_at).toISOString(), delivered } };
    },

    async peek(token: string) {
      const row = await db('invitations').where({ token_hash: hashToken(token) }).whereNull('accepted_at').where('expires_at', '>', db.fn.now()).first();
      if (!row) throw notFound('This invitation');
      return { email: row.email as string, name: row.name as string };
    },

    /** Creates the account and its membership in one transaction; the invitation is used once. */
    async accept(token: string, name: string, password: string): Promise<string> {
      const passwordHash = await hashPassword(password);
      return db.transaction(async (trx) => {
        const inv = await trx('invitations').where({ token_hash: hashToken(token) }).whereNull('accepted_at').where('expires_at', '>', trx.fn.now()).forUpdate().first();
        if (!inv) throw new AppError('not_found', 'This invitation is not valid any more. Ask for a new one.', { code: 'invalid_token' });
        const taken = await trx('users').whereRaw('lower(email) = lower(?)', [inv.email]).first();
        if (taken) throw invalid('An account with this e-mail exists already. Sign in instead.');
        const [user] = await trx('users').insert({ email: inv.email, name, password_hash: passwordHash, is_admin: inv.is_admin }).returning('id');
        if (inv.production_id && inv.role) {
          await trx('memberships').insert({ production_id: inv.production_id, user_id: user.id, role: inv.role, venue_ids: inv.venue_ids });
        }
        await trx('invitations').where({ id: inv.id }).update({ accepted_at: trx.fn.now(), updated_at: trx.fn.now() });
        return user.id as string;
      });
    },
  };
}
