// Runs pending migrations, then the demo seed (which writes only into an empty database).
import { createDb } from '../server/db/knex.ts';
import { migrateLatest } from '../server/db/migrate.ts';
import { seed } from '../seeds/01_demo.ts';

const url = process.env.DATABASE_URL;
if (!url) {
  console.error('DATABASE_URL is not set.');
  process.exit(2);
}
const db = createDb(url, 2);
try {
  const applied = await migrateLatest(db);
  console.log(applied.length ? `Migrations applied: ${applied.join(', ')}` : 'Database schema is up to date.');
  if (process.argv.includes('--seed')) {
    await seed(db);
    console.log('Demo data is in place.');
  }
} finally {
  await db.destroy();
}
