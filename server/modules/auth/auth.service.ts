import type { Knex } from 'knex';
import type { Logger } from 'pino';
import { hashPassword, hashToken, newToken, verifyPassword } from '../../security/passwords.ts';
import { AppError, invalid } from '../../http/errors.ts';
import type { Mailer } from '../../mail/mailer.ts';
import { usersRepository, type UserRow } from './users.repository.ts';

const RESET_TTL_MS = 60 * 60 * 1000;

export function authService(deps: { db: Knex; mailer: Mailer; appUrl: string; log: Logger }) {
  const users = usersRepository(deps.db);
  return {
    /** Checks credentials; undefined when they do not match an active account. */
    async verifyCredentials(email: string, password: string): Promise<UserRow | undefined> {
      const user = await users.findByEmail(email);
      const ok = await verifyPassword(password, user?.active ? user.password_hash : null);
      return ok && user ? user : undefined;
    },

    async changePassword(userId: string, current: string, next: string): Promise<void> {
      const user = await users.findById(userId);
      if (!user || !(await verifyPassword(current, user.password_hash))) {
        throw invalid('Your current password is not right.', [{ path: 'currentPassword', message: 'Not your current password.' }]);
      }
      await users.setPasswordHash(userId, await hashPassword(next));
    },

    /** Always succeeds from the caller's view, so nobody can probe which addresses have accounts. */
    async requestReset(email: string): Promise<void> {
      const user = await users.findByEmail(email);
      if (!user || !user.active) return;
      const { token, hash } = newToken();
      await deps.db('password_resets').insert({ user_id: user.id, token_hash: hash, expires_at: new Date(Date.now() + RESET_TTL_MS) });
      const link = `${deps.appUrl}/reset-password?token=${encodeURIComponent(token)}`;
      try {
        await deps.mailer.send({
          to: user.email,
          subject: 'Reset your Ballast password',
          text: `Hello ${user.name},\n\nSomeone asked to reset the password of your Ballast account. If it was you, open this link within an hour:\n\n${link}\n\nIf it was not you, ignore this message; your password stays as it is.\n`,
        });
      } catch (err) {
        deps.log.error({ err }, 'password reset e-mail could not be sent');
      }
    },

    async completeReset(token: string, password: string): Promise<void> {
      await deps.db.transaction(async (trx) => {
        const row = await trx('password_resets').where({ token_hash: hashToken(token) }).whereNull('used_at').where('expires_at', '>', trx.fn.now()).forUpdate().first();
        if (!row) throw new AppError('invalid', 'This reset link is not valid any more. Ask for a new one.', { code: 'invalid_token' });
        await users.setPasswordHash(row.user_id, await hashPassword(password), trx);
        await trx('password_resets').where({ id: row.id }).update({ used_at: trx.fn.now() });
        // Every other open link for this account dies with this one.
        await trx('password_resets').where({ user_id: row.user_id }).whereNull('used_at').update({ used_at: trx.fn.now() });
      });
    },
  };
}
