import { fileURLToPath } from 'node:url';
import type { Knex } from 'knex';

const root = fileURLToPath(new URL('../../', import.meta.url));

export const migrationConfig: Knex.MigratorConfig = {
  directory: `${root}migrations`,
  loadExtensions: ['.ts'],
};

/** Runs every pending migration; safe to call on each start (knex locks the migration table). */
export async function migrateLatest(db: Knex): Promise<string[]> {
  const [, applied] = (await db.migrate.latest(migrationConfig)) as [number, string[]];
  return applied;
}
