import { RateLimiterPostgres, type RateLimiterRes } from 'rate-limiter-flexible';
import type { Knex } from 'knex';
import { AppError } from '../../http/errors.ts';

export interface SignInLimits {
  perAccount: number;
  perAddress: number;
  windowSeconds: number;
}

/**
 * Failed sign-ins counted per account and per client address, in PostgreSQL so that every app
 * server behind a load balancer shares the count (rate-limiter-flexible's Postgres store).
 */
export function createSignInLimiter(db: Knex, limits: SignInLimits) {
  const common = { storeClient: db, storeType: 'knex', tableName: 'rate_limits', tableCreated: true, duration: limits.windowSeconds };
  const byAccount = new RateLimiterPostgres({ ...common, keyPrefix: 'signin_account', points: limits.perAccount });
  const byAddress = new RateLimiterPostgres({ ...common, keyPrefix: 'signin_address', points: limits.perAddress });

  const accountKey = (email: string) => email.trim().toLowerCase();

  function refuse(res: RateLimiterRes | null): never {
    const seconds = Math.max(1, Math.ceil((res?.msBeforeNext ?? limits.windowSeconds * 1000) / 1000));
    const minutes = Math.ceil(seconds / 60);
    throw new AppError('rate_limited', `Too many failed sign-ins. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}, or reset your password.`, {
      code: 'rate_limited',
      retryAfterSeconds: seconds,
    });
  }

  return {
    /** Throws 'rate_limited' when either count is used up, before the password is even checked. */
    async check(email: string, address: string): Promise<void> {
      const [a, b] = await Promise.all([byAccount.get(accountKey(email)), byAddress.get(address)]);
      if (a && a.consumedPoints >= limits.perAccount) refuse(a);
      if (b && b.consumedPoints >= limits.perAddress) refuse(b);
    },
    async recordFailure(email: string, address: string): Promise<void> {
      await Promise.allSettled([byAccount.consume(accountKey(email)), byAddress.consume(address)]);
    },
    async recordSuccess(email: string): Promise<void> {
      await byAccount.delete(accountKey(email));
    },
  };
}
export type SignInLimiter = ReturnType<typeof createSignInLimiter>;
