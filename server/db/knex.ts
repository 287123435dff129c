import knexFactory, { type Knex } from 'knex';
import pg from 'pg';
import type { Logger } from 'pino';

// Return NUMERIC and BIGINT as JavaScript numbers: Ballast's quantities fit a double exactly enough
// (masses to the gram, positions to the micrometre) and the domain works in numbers.
pg.types.setTypeParser(pg.types.builtins.NUMERIC, (v) => Number(v));
pg.types.setTypeParser(pg.types.builtins.INT8, (v) => Number(v));

/**
 * The knex instance. Timeouts are bounded so that a database outage answers 503 within seconds instead of
 * hanging requests: connecting (5 s), waiting for a pooled connection (5 s) and one statement (30 s). With
 * `min: 0` no idle connection is kept that a restart of PostgreSQL would leave broken; a connection that
 * breaks while idle is dropped by the pool and a new one is made on the next request.
 * `log` sends knex's own warnings (e.g. "Connection Error" during an outage) to the app's logger rather
 * than to the console.
 */
export function createDb(url: string, poolMax = 10, log?: Logger): Knex {
  return knexFactory({
    client: 'pg',
    connection: { connectionString: url, connectionTimeoutMillis: 5_000, statement_timeout: 30_000 } as Knex.PgConnectionConfig,
    pool: { min: 0, max: poolMax, acquireTimeoutMillis: 5_000, idleTimeoutMillis: 30_000 },
    acquireConnectionTimeout: 5_000,
    ...(log
      ? {
          log: {
            warn: (message: unknown) => log.warn({ knex: String(message) }, 'database warning'),
            error: (message: unknown) => log.error({ knex: String(message) }, 'database error'),
            deprecate: (message: unknown) => log.warn({ knex: String(message) }, 'knex deprecation'),
            debug: (message: unknown) => log.debug({ knex: String(message) }, 'knex debug'),
          },
        }
      : {}),
  });
}

export type Db = Knex;
