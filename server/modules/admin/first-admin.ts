import type { Knex } from 'knex';
import { newToken } from '../../security/passwords.ts';

/** How long the link that sets the new administrator's password stays valid. */
export const FIRST_ADMIN_LINK_TTL_MS = 24 * 60 * 60 * 1000;

/**
 * Makes `email` an active administrator (creating the person when the address is new) and opens a one-time link
 * to set their password, for an installation started without the demo, or after restoring archives, where no
 * administrator can sign in yet. Runs in one transaction; the password itself never passes through here.
 */
export async function ensureAdministrator(db: Knex, input: { email: string; name?: string }, appUrl: string): Promise<{ userId: string; created: boolean; link: string }> {
  const email = input.email.trim().toLowerCase();
  if (!/^[^@\s]+@[^@\s]+\.[^@\s]+$/.test(email)) throw new Error(`"${input.email}" is not an e-mail address.`);
  return db.transaction(async (trx) => {
    const existing = await trx('users').whereRaw('lower(email) = ?', [email]).forUpdate().first('id');
    let userId: string;
    if (existing) {
      userId = existing.id;
      await trx('users').where({ id: userId }).update({ is_admin: true, active: true, version: trx.raw('version + 1'), updated_at: trx.fn.now() });
    } else {
      const name = input.name?.trim() || email.split('@')[0];
      const [row] = await trx('users').insert({ email, name, is_admin: true, active: true }).returning('id');
      userId = row.id;
    }
    const { token, hash } = newToken();
    await trx('password_resets').insert({ user_id: userId, token_hash: hash, expires_at: new Date(Date.now() + FIRST_ADMIN_LINK_TTL_MS) });
    return { userId, created: !existing, link: `${appUrl.replace(/\/$/, '')}/reset-password?token=${encodeURIComponent(token)}` };
  });
}
