import knexFactory, { type Knex } from 'knex';
import pg from 'pg';

// Return NUMERIC and BIGINT as JavaScript numbers: Ballast's quantities fit a double exactly enough
// (masses to the gram, positions to the micrometre) and the domain works in numbers.
pg.types.setTypeParser(pg.types.builtins.NUMERIC, (v) => Number(v));
pg.types.setTypeParser(pg.types.builtins.INT8, (v) => Number(v));

export function createDb(url: string, poolMax = 10): Knex {
  return knexFactory({
    client: 'pg',
    connection: { connectionString: url, connectionTimeoutMillis: 5_000, statement_timeout: 30_000 } as Knex.PgConnectionConfig,
    pool: { min: 0, max: poolMax, acquireTimeoutMillis: 5_000 },
    acquireConnectionTimeout: 5_000,
  });
}

export type Db = Knex;
