import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createHash, randomUUID } from 'node:crypto';
import { existsSync, readdirSync } from 'node:fs';
import { Readable, Writable } from 'node:stream';
import { gunzipSync, gzipSync } from 'node:zlib';
import tar from 'tar-stream';
import type { Knex } from 'knex';
import { createDb } from '../../server/db/knex.ts';
import { migrateLatest } from '../../server/db/migrate.ts';
import { seed } from '../../seeds/01_demo.ts';
import { hashPassword } from '../../server/security/passwords.ts';
import { writeArchive } from '../../server/modules/archive/archive.service.ts';
import { createTestApp, demoProductionId, type Agent, type TestApp } from './helpers.ts';
import { binaryStl, boxTriangles } from './machine-helpers.ts';

/**
 * A production archive, end to end: the demo tour production (with meshes, check-in scans and their photos
 * added) is downloaded from one installation and restored into a second, freshly migrated database with no
 * demo; every production table is then compared row by row (all columns, by primary key) and every stored
 * file byte by byte. Damaged, tampered and path-trick archives are refused with the entry named and nothing
 * written; only administrators may download or restore.
 *
 * Both databases live on a cluster of this file's own, so the uploads added here reach no other test file.
 */

/**
 * Tables that are not a production's, or not carried: everything else must be in the archive (a new table
 * fails here). production_revisions holds cache revisions, raised anew by the restore's own inserts.
 */
const NOT_PRODUCTION = new Set(['users', 'session', 'rate_limits', 'caught_mail', 'password_resets', 'knex_migrations', 'knex_migrations_lock', 'invitations', 'production_revisions']);
/** Tables whose rows belong to a production through a parent row rather than a production_id column. */
const THROUGH_PARENT: Record<string, string> = {
  leg_crates: 'leg_id in (select id from tour_legs where production_id = ?)',
  leg_vehicles: 'leg_id in (select id from tour_legs where production_id = ?)',
};
const FILE_COLUMNS: [string, string][] = [
  ['machine_meshes', 'stl'],
  ['crate_scan_photos', 'content'],
];
const PASSWORD = 'archive-test-admin-pass';
const PNG_1PX = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64');

interface Cluster {
  url: string;
  createDatabase(name: string): string;
  stop(o?: { remove?: boolean }): void;
}

let cluster: Cluster;
let src: TestApp;
let dst: TestApp;
let merge: TestApp;
const agents: Record<string, Agent> = {};
let dstAdmin: Agent;
let productionId: string;
let archive: Buffer;
const figures = { archiveBytes: 0, exportMs: 0, restoreMs: 0, tables: 0, rows: 0, files: 0, fileBytes: 0, perTable: '' };

const sha = (b: Buffer) => createHash('sha256').update(b).digest('hex');

async function freshDatabase(name: string): Promise<string> {
  const url = cluster.createDatabase(name);
  const db = createDb(url, 2);
  try {
    await migrateLatest(db);
  } finally {
    await db.destroy();
  }
  return url;
}

async function adminOf(app: TestApp): Promise<Agent> {
  const email = `archive-admin-${randomUUID().slice(0, 8)}@example.com`;
  await app.db('users').insert({ email, name: 'Archive test admin', is_admin: true, password_hash: await hashPassword(PASSWORD) });
  return app.signIn({ email, password: PASSWORD });
}

beforeAll(async () => {
  const { register } = await import('tsx/esm/api');
  register();
  // @ts-expect-error plain JS module without types
  const { startCluster } = await import('../../scripts/lib/postgres.mjs');
  cluster = (await startCluster({ persistent: false, log: () => undefined })) as Cluster;
  const seedDb = createDb(cluster.url, 2);
  try {
    await migrateLatest(seedDb);
    await seed(seedDb);
  } finally {
    await seedDb.destroy();
  }
  const dstUrl = await freshDatabase('ballast_archive_restore');
  const mergeUrl = await freshDatabase('ballast_archive_merge');
  src = await createTestApp({ DATABASE_URL: cluster.url });
  dst = await createTestApp({ DATABASE_URL: dstUrl });
  merge = await createTestApp({ DATABASE_URL: mergeUrl });
  for (const role of ['admin', 'planner', 'rigger', 'venue'] as const) agents[role] = await src.signIn(role);
  dstAdmin = await adminOf(dst);
  productionId = await demoProductionId(src.db);

  // Stored files: meshes on two part lines (planner), two check-in scans with photos (rigger).
  const lines = await src.db('machine_part_lines').where({ production_id: productionId }).orderBy('sort_order').limit(2).select('id');
  for (const [i, line] of lines.entries()) {
    const res = await agents.planner
      .post(`/api/productions/${productionId}/machine/lines/${line.id}/mesh`)
      .set('x-csrf-token', agents.planner.csrf)
      .field('unit', 'mm')
      .attach('file', binaryStl(boxTriangles([0, 0, 0], [100 + 10 * i, 200, 50 + i])), { filename: `part-${i}.stl`, contentType: 'application/octet-stream' });
    expect(res.status, res.text).toBeLessThan(300);
  }
  const leg = await src.db('leg_crates as lc').join('tour_legs as l', 'l.id', 'lc.leg_id').where('l.production_id', productionId).first('l.to_engagement_id as engagementId', 'lc.crate_id as crateId');
  for (const [i, state] of (['arrived', 'damaged'] as const).entries()) {
    const scan = await agents.rigger
      .post(`/api/productions/${productionId}/tour/engagements/${leg.engagementId}/scans`)
      .set('x-csrf-token', agents.rigger.csrf)
      .send({ idempotencyKey: `archive-test-${i}-${randomUUID()}`, crateId: leg.crateId, direction: 'in', state, note: `Dent on the lid 'left' \\ side\n漢字 😀 ${i}` });
    expect(scan.status, scan.text).toBeLessThan(300);
    const photo = await agents.rigger
      .post(`/api/productions/${productionId}/tour/engagements/${leg.engagementId}/scans/${scan.body.scan.id}/photos`)
      .set('x-csrf-token', agents.rigger.csrf)
      .attach('photo', Buffer.concat([PNG_1PX, Buffer.from([i, 0, 255, 10, 13])]), { filename: `dent-${i}.png`, contentType: 'image/png' });
    expect(photo.status, photo.text).toBe(201);
  }
  // One row in each table the demo leaves empty, so that every table is compared with rows in it.
  const planner = await src.db('users').where({ email: 'planner@ballast.example' }).first('id');
  const machine = await src.db('machines').where({ production_id: productionId }).first('id');
  const section = await src.db('machine_sections').where({ production_id: productionId }).orderBy('code').first('id');
  const [job] = await src.db('jobs').insert({ production_id: productionId, kind: 'split', status: 'done', progress: 1, payload: JSON.stringify({ note: 'archive test' }) }).returning('id');
  await src.db('split_runs').insert({
    production_id: productionId,
    job_id: job.id,
    status: 'done',
    progress: 1,
    limits: JSON.stringify({ maxMassKg: 1200.5 }),
    input: JSON.stringify({ sections: [] }),
    options: JSON.stringify({}),
    stamp: 'archive-test',
    machine_version: 3,
    result: JSON.stringify({ proposals: [] }),
    created_by: planner.id,
  });
  await src.db('machine_imports').insert({ production_id: productionId, machine_id: machine.id, file_name: 'parts.csv', status: 'committed', headers: JSON.stringify(['Part', 'Mass']), rows: JSON.stringify([['A-1', '12.5']]), created_by: planner.id });
  await src.db('handling_tasks').insert({ production_id: productionId, item_kind: 'section', item_id: section.id, task: JSON.stringify({ frequencyPerMin: 0.2 }), updated_by: planner.id });
  await src.db('engagement_mailings').insert({ production_id: productionId, engagement_id: leg.engagementId, kind: 'manifest', recipient: 'venue@ballast.example', subject: 'Manifest', body_text: 'Attached.', status: 'sent', sent_by: planner.id });
  // Values whose text form is easy to get wrong: a double that is not a short decimal, a numeric with many digits.
  await src.db('machine_part_lines').where({ id: lines[0].id }).update({ unit_mass_kg: 0.1 + 0.2, notes: 'tab\there, quote " and \\N' });
  await src.db('machine_sections').where({ production_id: productionId }).orderBy('code').limit(1).update({ cog_uncertainty_mm: 123456789.123 });
}, 240_000);

afterAll(async () => {
  await src?.close();
  await dst?.close();
  await merge?.close();
  cluster?.stop({ remove: true });
  console.info(
    `production archive: ${figures.tables} tables, ${figures.rows} rows, ${figures.files} files (${figures.fileBytes} bytes); ` +
      `archive ${figures.archiveBytes} bytes, exported in ${figures.exportMs} ms, restored in ${figures.restoreMs} ms; rows per table: ${figures.perTable}`,
  );
});

function download(agent: Agent, id: string) {
  return agent
    .get(`/api/productions/${id}/archive`)
    .buffer(true)
    .parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    });
}

function upload(agent: Agent, file: Buffer, filename = 'production.tar.gz') {
  return agent.post('/api/archive/restore').set('x-csrf-token', agent.csrf).attach('archive', file, { filename, contentType: 'application/gzip' });
}

interface Entry {
  name: string;
  type: string;
  data: Buffer;
}

async function unpack(gz: Buffer): Promise<Entry[]> {
  const extract = tar.extract();
  Readable.from([gunzipSync(gz)]).pipe(extract);
  const out: Entry[] = [];
  for await (const e of extract) {
    const chunks: Buffer[] = [];
    for await (const c of e) chunks.push(c as Buffer);
    out.push({ name: e.header.name, type: e.header.type ?? 'file', data: Buffer.concat(chunks) });
  }
  return out;
}

interface PackEntry {
  name: string;
  data: Buffer;
  type?: string;
  linkname?: string;
}

async function repack(entries: PackEntry[]): Promise<Buffer> {
  const pack = tar.pack();
  const chunks: Buffer[] = [];
  pack.on('data', (c) => chunks.push(c as Buffer));
  const ended = new Promise<void>((resolve) => pack.on('end', () => resolve()));
  for (const e of entries) {
    await new Promise<void>((resolve, reject) =>
      e.type === 'symlink' ? pack.entry({ name: e.name, type: 'symlink', linkname: e.linkname }, (err) => (err ? reject(err) : resolve())) : pack.entry({ name: e.name, size: e.data.length }, e.data, (err) => (err ? reject(err) : resolve())),
    );
  }
  pack.finalize();
  await ended;
  return gzipSync(Buffer.concat(chunks));
}

async function publicTables(db: Knex): Promise<{ name: string; hasProductionId: boolean }[]> {
  const rows: { table_name: string; has: boolean }[] = (
    await db.raw(`
      select t.table_name, exists (select 1 from information_schema.columns c where c.table_schema = 'public' and c.table_name = t.table_name and c.column_name = 'production_id') as has
      from information_schema.tables t where t.table_schema = 'public' and t.table_type = 'BASE TABLE' order by t.table_name`)
  ).rows;
  return rows.map((r) => ({ name: r.table_name, hasProductionId: r.has }));
}

async function productionTables(db: Knex): Promise<{ name: string; where: string }[]> {
  return (await publicTables(db))
    .filter((t) => !NOT_PRODUCTION.has(t.name))
    .map((t) => {
      const where = t.name === 'productions' ? 'id = ?' : t.hasProductionId ? 'production_id = ?' : THROUGH_PARENT[t.name];
      if (!where) throw new Error(`Table ${t.name} has no production_id and no known parent: say how its rows belong to a production.`);
      return { name: t.name, where };
    });
}

async function primaryKey(db: Knex, table: string): Promise<string[]> {
  const r = await db.raw(
    `select a.attname from pg_index i join lateral unnest(i.indkey) with ordinality k(attnum, ord) on true
     join pg_attribute a on a.attrelid = i.indrelid and a.attnum = k.attnum where i.indrelid = ?::regclass and i.indisprimary order by k.ord`,
    [table],
  );
  return r.rows.map((x: { attname: string }) => x.attname);
}

/** Every row of a production table, all columns, ordered by primary key (bytea as its hex text). */
async function rowsOf(db: Knex, table: string, where: string, id: string): Promise<unknown[]> {
  const pk = await primaryKey(db, table);
  expect(pk.length, `${table} has a primary key`).toBeGreaterThan(0);
  return db.transaction(async (trx) => {
    await trx.raw(`set local timezone = 'UTC'`);
    const r = await trx.raw(`select to_jsonb(r) as j from "${table}" r where ${where} order by ${pk.map((c) => `r."${c}"`).join(', ')}`, [id]);
    return r.rows.map((x: { j: unknown }) => x.j);
  });
}

/** count and checksum of every table: equal before and after means nothing was written. */
async function snapshot(db: Knex): Promise<Record<string, string>> {
  const out: Record<string, string> = {};
  for (const t of await publicTables(db)) {
    if (t.name === 'session' || t.name === 'rate_limits') continue;
    const r = await db.raw(`select count(*)::text || ':' || coalesce(sum(hashtext(r::text)::bigint), 0)::text as v from "${t.name}" r`);
    out[t.name] = r.rows[0].v;
  }
  return out;
}

describe('production archive', () => {
  it('refuses every role but administrators, both ways', async () => {
    for (const role of ['planner', 'rigger', 'venue']) {
      const get = await agents[role].get(`/api/productions/${productionId}/archive`);
      expect(get.status, `${role} download`).toBe(403);
      expect(get.body.error.code).toBe('forbidden');
      const post = await upload(agents[role], Buffer.from('not even looked at'));
      expect(post.status, `${role} restore`).toBe(403);
    }
    const anonymous = await src.anonymous();
    expect((await anonymous.get(`/api/productions/${productionId}/archive`)).status).toBe(401);
    expect((await download(agents.admin, randomUUID())).status).toBe(404);
  });

  it('downloads the demo tour production as one .tar.gz with a manifest of every table, row count and file checksum', async () => {
    const started = Date.now();
    const res = await download(agents.admin, productionId);
    figures.exportMs = Date.now() - started;
    expect(res.status, String(res.body).slice(0, 300)).toBe(200);
    expect(res.headers['content-type']).toMatch(/application\/gzip/);
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="ballast-orrery-seven-european-and-canadian-tour-\d{8}-\d{6}\.tar\.gz"$/);
    archive = res.body as Buffer;
    figures.archiveBytes = archive.length;

    const entries = await unpack(archive);
    const manifest = JSON.parse(entries.find((e) => e.name === 'manifest.json')!.data.toString('utf8'));
    const migrations = readdirSync(new URL('../../migrations/', import.meta.url)).filter((f) => f.endsWith('.ts')).sort();
    expect(manifest.format).toBe('ballast-production-archive');
    expect(manifest.schemaVersion).toBe(migrations[migrations.length - 1]);
    expect(manifest.production.id).toBe(productionId);
    // Every production table of the schema is in it, with the number of rows the database has.
    const expected = await productionTables(src.db);
    const listed = manifest.tables.map((t: { name: string }) => t.name);
    expect(new Set(listed)).toEqual(new Set(['users', ...expected.map((t) => t.name)]));
    for (const t of expected) {
      const n = await src.db.raw(`select count(*)::int as n from "${t.name}" where ${t.where}`, [productionId]);
      expect(manifest.tables.find((x: { name: string }) => x.name === t.name).rows, t.name).toBe(n.rows[0].n);
    }
    // Each entry's bytes match the manifest's SHA-256, and each file is the stored bytes.
    for (const t of manifest.tables) expect(sha(entries.find((e) => e.name === t.entry)!.data), t.entry).toBe(t.sha256);
    expect(manifest.files.length).toBeGreaterThanOrEqual(4);
    for (const f of manifest.files) {
      const stored = await src.db(f.table).where({ id: f.rowId }).first(f.column);
      const data = entries.find((e) => e.name === f.entry)!.data;
      expect(sha(stored[f.column]), f.entry).toBe(f.sha256);
      expect(Buffer.compare(stored[f.column], data), f.entry).toBe(0);
    }
    // No password hash and no admin flag travel.
    const users = manifest.tables.find((t: { name: string }) => t.name === 'users');
    expect(users.columns.map((c: { name: string }) => c.name)).not.toContain('password_hash');
    expect(users.columns.map((c: { name: string }) => c.name)).not.toContain('is_admin');
    expect(entries.find((e) => e.name === 'tables/users.jsonl')!.data.toString()).not.toMatch(/\$argon2|\$scrypt|\$2[aby]\$/);
    figures.tables = manifest.tables.length;
    figures.perTable = manifest.tables.map((t: { name: string; rows: number }) => `${t.name} ${t.rows}`).join(', ');
    figures.rows = manifest.tables.reduce((s: number, t: { rows: number }) => s + t.rows, 0);
    figures.files = manifest.files.length;
    figures.fileBytes = manifest.files.reduce((s: number, f: { bytes: number }) => s + f.bytes, 0);
  }, 60_000);

  it('ends an export whose download is cut off, without hanging or holding its transaction', async () => {
    let taken = 0;
    const gone = new Writable({
      write(chunk: Buffer, _enc, cb) {
        taken += chunk.length;
        cb(taken > 1024 ? new Error('the client went away') : null);
      },
    });
    await expect(writeArchive(src.db, productionId, gone)).rejects.toThrow();
    expect(taken).toBeGreaterThan(1024);
    expect(taken).toBeLessThan(archive.length);
    // The pool is free again and the database answers.
    const r = await src.db.raw('select count(*)::int as n from pg_stat_activity where state = ? and datname = current_database()', ['idle in transaction']);
    expect(r.rows[0].n).toBe(0);
  });

  it('refuses an archive with one byte changed, naming the entry, and writes nothing', async () => {
    const entries = await unpack(archive);
    const before = await snapshot(dst.db);
    for (const target of ['tables/crates.jsonl', 'files/machine_meshes/stl/']) {
      const changed = entries.map((e) => {
        if (!e.name.startsWith(target)) return e;
        const data = Buffer.from(e.data);
        const at = Math.floor(data.length / 2);
        data[at] = data[at] === 0x31 ? 0x32 : 0x31;
        return { ...e, data };
      });
      const name = changed.find((e) => e.name.startsWith(target))!.name;
      const res = await upload(dstAdmin, await repack(changed));
      expect(res.status, res.text).toBe(400);
      expect(res.body.error.code).toBe('archive_checksum');
      expect(res.body.error.message).toContain(`"${name}"`);
    }
    // A byte changed in the compressed file itself.
    const damaged = Buffer.from(archive);
    damaged[Math.floor(damaged.length / 2)] ^= 0xff;
    const res = await upload(dstAdmin, damaged);
    expect(res.status, res.text).toBe(400);
    expect(res.body.error.message.length).toBeGreaterThan(10);
    // A cut-short download.
    const cut = await upload(dstAdmin, archive.subarray(0, Math.floor(archive.length * 0.7)));
    expect(cut.status, cut.text).toBe(400);
    expect(await snapshot(dst.db)).toEqual(before);
  }, 60_000);

  it('refuses path tricks, links, unknown entries and another schema version, writing nothing', async () => {
    const entries = await unpack(archive);
    const before = await snapshot(dst.db);
    const marker = `ballast-archive-trick-${randomUUID().slice(0, 8)}`;
    const cases: [string, PackEntry[], RegExp][] = [
      ['a ".." entry', [{ name: `../../../../tmp/${marker}`, data: Buffer.from('x') }, ...entries], /leaves the archive/],
      ['an absolute entry', [...entries.slice(0, 2), { name: `/tmp/${marker}`, data: Buffer.from('x') }, ...entries.slice(2)], /leaves the archive/],
      ['a ".." inside a table name', [{ name: 'tables/../users.jsonl', data: Buffer.from('[]') }, ...entries], /leaves the archive/],
      ['a symbolic link', [{ name: 'tables/link.jsonl', data: Buffer.alloc(0), type: 'symlink', linkname: '/etc/passwd' }, ...entries], /plain files only/],
      ['an unknown entry', [...entries, { name: 'notes.txt', data: Buffer.from('hello') }], /not part of a Ballast production archive/],
    ];
    for (const [what, list, message] of cases) {
      const res = await upload(dstAdmin, await repack(list));
      expect(res.status, `${what}: ${res.text}`).toBe(400);
      expect(res.body.error.message, what).toMatch(message);
      const named = list.find((e) => !entries.includes(e as Entry))!.name;
      expect(res.body.error.message, what).toContain(JSON.stringify(named));
      expect(existsSync(`/tmp/${marker}`)).toBe(false);
    }
    // The manifest carries the schema version; an archive from another version is refused before any write.
    const other = entries.map((e) => (e.name === 'manifest.json' ? { ...e, data: Buffer.from(JSON.stringify({ ...JSON.parse(e.data.toString()), schemaVersion: '20990101000000_from-the-future.ts' })) } : e));
    const res = await upload(dstAdmin, await repack(other));
    expect(res.status, res.text).toBe(400);
    expect(res.body.error.message).toMatch(/20990101000000_from-the-future\.ts.*same version/);
    // Not an archive at all, and the wrong kind of file.
    expect((await upload(dstAdmin, Buffer.from('plain text, not gzip'))).status).toBe(400);
    expect((await upload(dstAdmin, gzipSync(Buffer.from('gzip of plain text, not a tar')))).status).toBe(400);
    expect((await upload(dstAdmin, archive, 'production.zip')).status).toBe(415);
    expect(await snapshot(dst.db)).toEqual(before);
    expect(readdirSync('/tmp').filter((f) => f.startsWith('ballast-restore-'))).toEqual([]);
  }, 60_000);

  it('restores into an empty installation with every row and every file as it was', async () => {
    const started = Date.now();
    const res = await upload(dstAdmin, archive);
    figures.restoreMs = Date.now() - started;
    expect(res.status, res.text).toBe(201);
    expect(res.body.production.id).toBe(productionId);
    expect(res.body.files).toBe(figures.files);

    const tables = await productionTables(dst.db);
    let compared = 0;
    for (const t of tables) {
      const a = await rowsOf(src.db, t.name, t.where, productionId);
      const b = await rowsOf(dst.db, t.name, t.where, productionId);
      expect(b.length, `${t.name} row count`).toBe(a.length);
      expect(b, `${t.name} rows`).toEqual(a);
      compared += a.length;
    }
    expect(compared).toBe(figures.rows - (res.body.users.added as number));
    // Every production table had rows to compare.
    for (const t of tables) {
      const n = await dst.db(t.name).count<{ n: number }[]>('* as n');
      expect(Number(n[0].n), `${t.name} restored rows`).toBeGreaterThan(0);
    }

    // Files, byte by byte.
    for (const [table, column] of FILE_COLUMNS) {
      const a = await src.db(table).where({ production_id: productionId }).orderBy('id').select('id', column);
      const b = await dst.db(table).where({ production_id: productionId }).orderBy('id').select('id', column);
      expect(b.map((r) => r.id)).toEqual(a.map((r) => r.id));
      expect(a.length).toBeGreaterThanOrEqual(2);
      for (const [i, row] of a.entries()) {
        expect(sha(b[i][column]), `${table} ${row.id}`).toBe(sha(row[column]));
        expect(Buffer.from(b[i][column]).equals(Buffer.from(row[column])), `${table} ${row.id}`).toBe(true);
      }
    }

    // The people the production names, without their passwords or admin rights.
    const people = await dst.db('users').whereRaw(`email not like 'archive-admin-%'`).orderBy('id');
    expect(people.length).toBe(res.body.users.added);
    expect(people.map((p) => p.email)).toEqual(expect.arrayContaining(['planner@ballast.example', 'rigger@ballast.example', 'venue@ballast.example']));
    for (const p of people) {
      const before = await src.db('users').where({ id: p.id }).first();
      expect({ ...p, password_hash: undefined, is_admin: undefined }).toEqual({ ...before, password_hash: undefined, is_admin: undefined });
      expect(p.password_hash).toBeNull();
      expect(p.is_admin).toBe(false);
    }
    expect(await dst.db('session').whereRaw(`sess::text like '%planner%'`).count<{ n: number }[]>('* as n')).toEqual([{ n: 0 }]);

    // Downloading the restored production again gives the same entries, byte for byte.
    const again = await download(dstAdmin, productionId);
    expect(again.status).toBe(200);
    const first = (await unpack(archive)).filter((e) => e.name !== 'manifest.json');
    const second = (await unpack(again.body as Buffer)).filter((e) => e.name !== 'manifest.json');
    expect(second.map((e) => e.name)).toEqual(first.map((e) => e.name));
    for (const [i, e] of first.entries()) expect(sha(second[i].data), e.name).toBe(sha(e.data));
  }, 120_000);

  it('refuses to restore a production that is already there, writing nothing', async () => {
    const before = await snapshot(dst.db);
    const res = await upload(dstAdmin, archive);
    expect(res.status, res.text).toBe(409);
    expect(res.body.error.message).toMatch(/already exists/);
    expect(await snapshot(dst.db)).toEqual(before);
  }, 60_000);

  it('matches people already in the installation by e-mail, and points the production\u2019s rows at them', async () => {
    const rigger = await src.db('users').where({ email: 'rigger@ballast.example' }).first();
    const [here] = await merge.db('users').insert({ email: 'Rigger@Ballast.example', name: 'Rigger already here' }).returning('id');
    expect(here.id).not.toBe(rigger.id);
    const admin = await adminOf(merge);
    const res = await upload(admin, archive);
    expect(res.status, res.text).toBe(201);
    expect(res.body.users.matchedByEmail).toBe(1);
    expect(await merge.db('users').where({ id: rigger.id }).first()).toBeUndefined();
    const membership = await merge.db('memberships').where({ production_id: productionId, user_id: here.id }).first();
    expect(membership?.role).toBe('rigger');
    const scans = await src.db('crate_scans').where({ production_id: productionId, scanned_by: rigger.id }).count<{ n: number }[]>('* as n');
    const mapped = await merge.db('crate_scans').where({ production_id: productionId, scanned_by: here.id }).count<{ n: number }[]>('* as n');
    expect(Number(mapped[0].n)).toBe(Number(scans[0].n));
    expect(Number(mapped[0].n)).toBeGreaterThan(0);
  }, 60_000);
});
