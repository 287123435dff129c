// `npm run admin:create -- --email ops@example.org [--name "Ops Lead"]`: makes that person an administrator of
// the installation that DATABASE_URL points at (created when new) and prints a one-time link, valid 24 hours, to
// set their password. For an installation started without the demo, where nobody can sign in yet.
// APP_URL names the address people open (default http://127.0.0.1:3000).
import { parseArgs } from 'node:util';
import { createDb } from '../server/db/knex.ts';
import { migrateLatest } from '../server/db/migrate.ts';
import { ensureAdministrator } from '../server/modules/admin/first-admin.ts';

const { values } = parseArgs({ options: { email: { type: 'string' }, name: { type: 'string' } } });
const url = process.env.DATABASE_URL;
if (!url || !values.email) {
  console.error('Usage: DATABASE_URL=postgres://… npm run admin:create -- --email person@example.org [--name "Their name"]');
  process.exit(2);
}
const db = createDb(url, 2);
try {
  await migrateLatest(db);
  const r = await ensureAdministrator(db, { email: values.email, name: values.name }, process.env.APP_URL ?? `http://127.0.0.1:${process.env.PORT ?? 3000}`);
  console.log(`${r.created ? 'Created' : 'Made'} ${values.email} ${r.created ? 'as an administrator' : 'an administrator'}.`);
  console.log(`Open this link within 24 hours to set the password (it works once):\n${r.link}`);
} catch (e) {
  console.error((e as Error).message);
  process.exitCode = 1;
} finally {
  await db.destroy();
}
