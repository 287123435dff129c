import { createDb } from '../../server/db/knex.ts';
import { migrateLatest } from '../../server/db/migrate.ts';
import { seed } from '../../seeds/01_demo.ts';

/**
 * The server tests run against a real PostgreSQL. `npm test` starts a throwaway cluster and sets
 * DATABASE_URL; run alone (`npx vitest run --project server`), this starts one itself.
 */
export default async function setup(): Promise<() => Promise<void>> {
  // knex loads migrations with import(); inside the test runner's main process that needs tsx.
  const { register } = await import('tsx/esm/api');
  register();
  let stop: (() => void) | undefined;
  if (!process.env.DATABASE_URL) {
    // @ts-expect-error plain JS module without types
    const { startCluster } = await import('../../scripts/lib/postgres.mjs');
    const cluster = await startCluster({ persistent: false, log: () => undefined });
    process.env.DATABASE_URL = cluster.url;
    stop = () => cluster.stop({ remove: true });
  }
  const db = createDb(process.env.DATABASE_URL!, 2);
  await migrateLatest(db);
  await seed(db);
  await db.destroy();
  return async () => stop?.();
}
