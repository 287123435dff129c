import type { Knex } from 'knex';

// Used by the knex CLI (`npm run db:migrate`); the app and tests run migrations programmatically
// with the same settings from server/db/migrate.ts.
const config: Knex.Config = {
  client: 'pg',
  connection: process.env.DATABASE_URL,
  migrations: { directory: './migrations', extension: 'ts', loadExtensions: ['.ts'] },
  seeds: { directory: './seeds', extension: 'ts', loadExtensions: ['.ts'] },
};
export default config;
