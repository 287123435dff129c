import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { existsSync, rmSync } from 'node:fs';
import { deflateRawSync } from 'node:zlib';
import type { Knex } from 'knex';
import { routeTable, type MountedRoute, type UploadInfo } from '../../server/http/routes.ts';
import { roleMay } from '../../src/domain/policy/index.ts';
import { hashPassword } from '../../server/security/passwords.ts';
import { createTestApp, type Agent, type TestApp } from './helpers.ts';
import { jsonSchemaOf, setPath, stringPaths, topLevelFields, validSample, wrongTypeFor, type SampleContext } from './hostile-sample.ts';
import { binaryStl, boxTriangles } from './machine-helpers.ts';

/**
 * Hostile input, generated from the route table the app mounts: every state-changing route, signed in as a
 * role that may use it, gets oversized bodies, wrong types, deep nesting, arrays for objects, prototype keys,
 * NUL characters, forged roles and other productions' ids, path tricks in its ids, and (for uploads) files
 * that are not what they claim, archive bombs, files over the limit and path tricks in file names. Each gets a
 * 4xx with a JSON message, nothing is written (a checksum of every table before and after), and the server
 * keeps answering its health check. Text with SQL, script and spreadsheet-formula fragments is either refused
 * or stored as given and returned unchanged. A new route is covered without anyone adding a case.
 *
 * The writes go to two productions of this file's own with people of its own, and failed sign-ins are
 * counted under a documentation address (TRUST_PROXY), so no other test file sees any of it.
 */

const t: TestApp = await createTestApp({ TRUST_PROXY: 'true', SIGNIN_MAX_PER_ADDRESS: '100000', SIGNIN_MAX_PER_ACCOUNT: '100000' });
const db: Knex = t.db;
/** RFC 5737 documentation address: the sign-in limits count this file's failures under it. */
const CLIENT_ADDRESS = '198.51.100.77';
const runTag = randomUUID().slice(0, 8);
const PASSWORD = `hostile-pass-${runTag}`;

type Role = 'planner' | 'rigger' | 'venue';
const people: Record<string, { id: string; email: string }> = {};
const agents: Record<string, Agent> = {};
let own = '';
let stranger = '';
let tables: { name: string; hasProductionId: boolean }[] = [];
const figures = { routes: 0, statefulRoutes: 0, refusedCases: 0, fragmentCases: 0, fragmentsStored: 0, uploadCases: 0, pathCases: 0, noSample: [] as string[], fragmentStatus: {} as Record<number, number> };

const STATE_CHANGING = routeTable.filter((r) => r.method !== 'get');
/** Sign-out ends the agent's session by design; it takes no body and no ids. */
const SKIP = new Set(['post /api/auth/sign-out']);
const ROUTES = STATE_CHANGING.filter((r) => !SKIP.has(`${r.method} ${r.path}`));
/** Every upload middleware marks itself with declareUpload (server/http/routes.ts), so the table knows its file. */
const uploadOf = (r: MountedRoute): UploadInfo | undefined => r.upload;

beforeAll(async () => {
  const [p1] = await db('productions').insert({ name: `Hostile input own ${runTag}` }).returning('id');
  const [p2] = await db('productions').insert({ name: `Hostile input stranger ${runTag}` }).returning('id');
  own = p1.id;
  stranger = p2.id;
  const hash = await hashPassword(PASSWORD);
  const [venue] = await db('venues').insert({ production_id: own, name: `Hostile venue ${runTag}` }).returning('id');
  for (const who of ['planner', 'rigger', 'venue', 'stranger', 'admin'] as const) {
    const email = `hostile-${who}-${runTag}@example.com`;
    const [u] = await db('users').insert({ email, name: `Hostile ${who}`, password_hash: hash, is_admin: who === 'admin' }).returning('id');
    people[who] = { id: u.id, email };
    if (who === 'planner' || who === 'rigger' || who === 'venue') {
      await db('memberships').insert({ production_id: own, user_id: u.id, role: who, venue_ids: who === 'venue' ? [venue.id] : [] });
    }
    if (who === 'stranger') await db('memberships').insert({ production_id: stranger, user_id: u.id, role: 'planner' });
    agents[who] = await t.signIn({ email, password: PASSWORD });
  }
  agents.anonymous = await t.anonymous();
  const cols = await db('information_schema.columns').where({ table_schema: 'public' }).select('table_name', 'column_name');
  const byTable = new Map<string, Set<string>>();
  for (const c of cols) byTable.set(c.table_name, (byTable.get(c.table_name) ?? new Set()).add(c.column_name));
  tables = [...byTable]
    .filter(([name]) => !['session', 'knex_migrations', 'knex_migrations_lock'].includes(name))
    .map(([name, c]) => ({ name, hasProductionId: c.has('production_id') }));
  // Give both productions one row per creatable kind, so ids in paths and bodies can point at real rows.
  for (const production of [own, stranger]) {
    const as = production === own ? agents.planner : agents.stranger;
    for (let pass = 0; pass < 3; pass++) {
      for (const r of ROUTES.filter((x) => x.method === 'post' && x.body && x.path.includes(':productionId') && !uploadOf(x))) {
        const url = await concrete(r, production);
        if (!url) continue;
        const body = await sampleFor(r, production);
        if (body) await send(as, r.method, url).send(body);
      }
    }
  }
}, 180_000);

afterAll(async () => {
  try {
    await db('productions').whereIn('id', [own, stranger].filter(Boolean)).delete();
    await db('users').whereIn('id', Object.values(people).map((p) => p.id)).delete();
    await db('rate_limits').where('key', 'like', `%${CLIENT_ADDRESS}%`).orWhere('key', 'like', '%hostile-%@example.com%').delete();
  } catch {
    // rows other tables still point at stay: they belong to this file's productions only
  }
  await t.close();
});

function send(agent: Agent, method: MountedRoute['method'], url: string) {
  const req = agent[method](url).set('x-forwarded-for', CLIENT_ADDRESS);
  return method === 'get' ? req : req.set('x-csrf-token', agent.csrf);
}

/** The agent of a role that may use the route (own production), or undefined when none may. */
function agentFor(r: MountedRoute): Agent | undefined {
  if (r.access.kind === 'public') return agents.anonymous;
  if (r.access.kind === 'signed-in') return agents.planner;
  const action = r.access.action;
  if (!r.path.includes(':productionId')) return roleMay(null, true, action) ? agents.admin : undefined;
  for (const role of ['planner', 'rigger', 'venue'] as Role[]) if (roleMay(role, false, action)) return agents[role];
  return roleMay(null, true, action) ? agents.admin : undefined;
}

const snake = (s: string) => s.replace(/([a-z0-9])([A-Z])/g, '$1_$2').toLowerCase();

/** The table a name such as `sectionId` or `liftPlanId` points at, by Ballast's naming of tables. */
function tableFor(param: string): string | undefined {
  const base = snake(param.replace(/Id$/, ''));
  if (base === 'user') return 'users';
  const plural = base.endsWith('s') ? base : base.endsWith('y') ? `${base.slice(0, -1)}ies` : `${base}s`;
  const matches = tables.filter((x) => x.hasProductionId && (x.name === plural || x.name.endsWith(`_${plural}`))).map((x) => x.name);
  return matches.sort((a, b) => a.length - b.length)[0];
}

async function rowFor(param: string, production: string): Promise<{ id: string; version?: number } | undefined> {
  if (param === 'userId') return { id: people.planner.id };
  const table = tableFor(param);
  if (!table) return undefined;
  try {
    return await db(table).where({ production_id: production }).orderBy('id').first();
  } catch {
    return undefined;
  }
}

/** The route's path with real ids of `production` (random uuids where no row is found). */
async function concrete(r: MountedRoute, production: string, override?: Record<string, string>): Promise<string | undefined> {
  let url = r.path;
  for (const [, name] of r.path.matchAll(/:(\w+)/g)) {
    let v = override?.[name];
    if (v === undefined) v = name === 'productionId' ? production : name === 'token' ? 'not-a-token-at-all' : ((await rowFor(name, production))?.id ?? randomUUID());
    url = url.replace(`:${name}`, v);
  }
  return url;
}

async function sampleFor(r: MountedRoute, production: string): Promise<Record<string, unknown> | undefined> {
  if (!r.body) return undefined;
  const ids: Record<string, string> = {};
  let version: number | undefined;
  const params = [...r.path.matchAll(/:(\w+)/g)].map((m) => m[1]).filter((n) => n !== 'productionId');
  for (const name of params) {
    const row = await rowFor(name, production);
    if (row) version = row.version ?? version;
  }
  const fields = topLevelFields(jsonSchemaOf(r.body)).filter((f) => /Id$/.test(f.name) && f.name !== 'productionId');
  for (const f of fields) {
    const row = await rowFor(f.name, production);
    if (row) ids[f.name] = row.id;
  }
  if (r.path.endsWith('/members/:userId') || r.path.endsWith('/members')) ids.userId = people.planner.id;
  if (fields.some((f) => f.name === 'productionId')) ids.productionId = production;
  let n = 0;
  const ctx: SampleContext = { resolveId: (name) => ids[name], version, unique: () => `${runTag}${++n}${Math.floor(Math.random() * 1e6)}` };
  return validSample(r.body, ctx);
}

/** count and a checksum of every row of every table: equal before and after means nothing was written. */
async function snapshot(): Promise<Map<string, string>> {
  const sql = tables.map((x) => `select '${x.name}' as t, count(*)::text || ':' || coalesce(sum(hashtext(r::text)::bigint), 0)::text as v from "${x.name}" r`).join(' union all ');
  const res = await db.raw(sql);
  return new Map(res.rows.map((row: { t: string; v: string }) => [row.t, row.v]));
}

function changedTables(a: Map<string, string>, b: Map<string, string>): string[] {
  return [...a.keys()].filter((k) => a.get(k) !== b.get(k));
}

async function expectServing(): Promise<void> {
  const h = await agents.anonymous.get('/api/health');
  expect(h.status, 'health after hostile input').toBe(200);
}

function expectClearRefusal(res: { status: number; body: unknown; text?: string }, what: string): void {
  expect(res.status, `${what}: ${res.text?.slice(0, 300)}`).toBeGreaterThanOrEqual(400);
  expect(res.status, `${what}: ${res.text?.slice(0, 300)}`).toBeLessThan(500);
  const body = res.body as { error?: { code?: unknown; message?: unknown } };
  expect(typeof body?.error?.message, `${what}: JSON error message`).toBe('string');
  expect(String(body.error!.message).length, what).toBeGreaterThan(5);
  expect(typeof body.error!.code, what).toBe('string');
}

const name = (r: MountedRoute) => `${r.method.toUpperCase()} ${r.path}`;

/** Hostile bodies every route refuses before its handler, with or without a schema. */
function globalCases(): [string, { raw?: string; json?: unknown; type?: string }, number[]][] {
  let deep: unknown = 'bottom';
  for (let i = 0; i < 5_000; i++) deep = { a: deep };
  return [
    ['body over the 1 MB JSON limit', { json: { name: 'x'.repeat(1_100_000) } }, [413]],
    ['deeply nested JSON (5,000 levels)', { json: deep }, [400]],
    ['deeply nested arrays in raw JSON (100,000 levels)', { raw: '['.repeat(100_000) + ']'.repeat(100_000) }, [400]],
    ['__proto__ key', { raw: '{"__proto__": {"isAdmin": true}, "name": "x"}' }, [400]],
    ['constructor.prototype keys', { json: { constructor: { prototype: { isAdmin: true } } } }, [400]],
    ['NUL character in text', { json: { name: 'a\u0000b', code: 'A\u0000', notes: '\u0000' } }, [400]],
    ['malformed JSON', { raw: '{"name": "x",', type: 'application/json' }, [400]],
    ['JSON in an unsupported charset', { raw: '{}', type: 'application/json; charset=latin1' }, [415]],
  ];
}

describe('hostile input to every state-changing route', () => {
  it('the route table has state-changing routes', () => {
    figures.routes = routeTable.length;
    figures.statefulRoutes = ROUTES.length;
    expect(ROUTES.length).toBeGreaterThan(5);
  });

  it.each(ROUTES.map((r) => [name(r), r] as const))('%s refuses hostile bodies and ids, writing nothing', async (_n, r) => {
    const agent = agentFor(r);
    if (!agent) return;
    const before = await snapshot();
    // A route without a body schema acts on its ids alone (a delete, a submit): it gets ids of no row, so that
    // a hostile body that slipped through could not act on a real one. Routes with a schema get real ids: their
    // schema must refuse the body before the handler runs.
    const ids = r.body ? undefined : Object.fromEntries([...r.path.matchAll(/:(\w+)/g)].filter((m) => m[1] !== 'productionId').map((m) => [m[1], randomUUID()]));
    const url = (await concrete(r, own, ids))!;
    // Requests refused before any handler runs.
    for (const [what, c] of globalCases()) {
      let req = send(agent, r.method, url);
      if (c.raw !== undefined) req = req.set('content-type', c.type ?? 'application/json').send(c.raw);
      else req = req.send(c.json as object);
      const res = await req;
      expectClearRefusal(res, `${name(r)} ${what}`);
      figures.refusedCases++;
    }
    // Schema-driven cases.
    if (r.body) {
      const sample = (await sampleFor(r, own)) ?? {};
      const js = jsonSchemaOf(r.body);
      const cases: [string, unknown][] = [
        ['an array where an object is expected', [sample]],
        ['a string where an object is expected', 'just a string'],
        ['a number where an object is expected', 42],
      ];
      const required = topLevelFields(js).filter((f) => f.required);
      if (required.length) cases.push(['an empty object (required fields missing)', {}]);
      for (const f of topLevelFields(js)) {
        cases.push([`wrong type in ${f.name}`, { ...sample, [f.name]: wrongTypeFor(f.schema) }]);
        const plain = f.schema.anyOf?.find((o) => o.type !== 'null') ?? f.schema;
        if (plain.type === 'string' && plain.maxLength !== undefined && plain.maxLength < 500_000) {
          cases.push([`${f.name} over its ${plain.maxLength}-character limit`, { ...sample, [f.name]: 'y'.repeat(plain.maxLength + 1) }]);
        }
        if ((plain.type === 'number' || plain.type === 'integer') && plain.minimum !== undefined) {
          cases.push([`${f.name} below its minimum ${plain.minimum}`, { ...sample, [f.name]: plain.minimum - 1e6 }]);
        }
        if (plain.type === 'number' || plain.type === 'integer') cases.push([`${f.name} as a huge number (1e309 → Infinity)`, JSON.stringify({ ...sample, [f.name]: 0 }).replace(`"${f.name}":0`, `"${f.name}":1e309`)]);
      }
      for (const [what, body] of cases) {
        let req = send(agent, r.method, url);
        req = typeof body === 'string' && body.startsWith('{') ? req.set('content-type', 'application/json').send(body) : req.set('content-type', 'application/json').send(JSON.stringify(body));
        const res = await req;
        expectClearRefusal(res, `${name(r)} ${what}`);
        figures.refusedCases++;
      }
    }
    // Path tricks in every id of the path.
    const params = [...r.path.matchAll(/:(\w+)/g)].map((m) => m[1]);
    const tricks = ['%2e%2e', '..%2f..%2fetc%2fpasswd', 'a%00b', "1'%20OR%20'1'%3D'1", 'x'.repeat(3000), '%E0%A4%A'];
    const body = r.body ? ((await sampleFor(r, own)) ?? {}) : {};
    for (const p of params) {
      for (const trick of tricks) {
        const trickUrl = (await concrete(r, own, { [p]: trick }))!;
        const res = await send(agent, r.method, trickUrl).send(body);
        expectClearRefusal(res, `${name(r)} with :${p} = ${trick.slice(0, 40)}`);
        figures.pathCases++;
      }
    }
    const after = await snapshot();
    expect(changedTables(before, after), `${name(r)} wrote to these tables while refusing`).toEqual([]);
    await expectServing();
  });
});

/** SQL, script, template and spreadsheet-formula fragments: stored as given, never executed. */
const FRAGMENTS = [
  "Robert'); DROP TABLE users; --",
  '" OR 1=1; DELETE FROM productions; --',
  '<script>alert("x")</script><img src=x onerror=alert(1)>',
  '=HYPERLINK("http://example.com/x","open")',
  '{{7*7}} ${7*7} $(touch /tmp/x) ‮ ñ 漢字 😀',
];

/** Every string value under a property of this name, anywhere in a JSON answer. */
function valuesNamed(value: unknown, key: string, out: string[] = []): string[] {
  if (value === null || typeof value !== 'object') return out;
  for (const [k, v] of Object.entries(value)) {
    if (k === key && typeof v === 'string') out.push(v);
    else valuesNamed(v, key, out);
  }
  return out;
}

describe('text fragments in every free-text field', () => {
  const withBody = ROUTES.filter((r) => r.body && r.method !== 'delete' && !uploadOf(r));
  it.each(withBody.map((r) => [name(r), r] as const))('%s stores them as given or refuses them clearly', async (_n, r) => {
    const agent = agentFor(r);
    if (!agent) return;
    const first = await sampleFor(r, own);
    if (!first) {
      figures.noSample.push(name(r));
      return;
    }
    const usersBefore = await db('users').count({ n: '*' }).first();
    const productionsBefore = await db('productions').count({ n: '*' }).first();
    const paths = [...stringPaths(first), ...topLevelFields(jsonSchemaOf(r.body!)).filter((f) => f.freeText && !(f.name in first)).map((f) => [f.name])]
      .filter((p) => !/(^|\.)(\w*Id|email|password|token|version)$/i.test(p.join('.')))
      .slice(0, 4);
    for (const path of paths) {
      for (const [i, fragment] of FRAGMENTS.entries()) {
        const body = await sampleFor(r, own);
        if (!body) continue;
        const text = `${fragment} ${runTag}${i}`.slice(0, 38).trim();
        setPath(body, path, text);
        const url = (await concrete(r, own))!;
        const res = await send(agent, r.method, url).send(body);
        figures.fragmentCases++;
        figures.fragmentStatus[res.status] = (figures.fragmentStatus[res.status] ?? 0) + 1;
        expect(res.status, `${name(r)} ${path.join('.')} = ${text}: ${res.text?.slice(0, 300)}`).toBeLessThan(500);
        if (res.status >= 400) expectClearRefusal(res, `${name(r)} ${path.join('.')}`);
        else {
          // Where the answer shows the field back, it shows exactly what was sent.
          const shown = valuesNamed(res.body, path[path.length - 1]);
          if (shown.length) {
            expect(shown, `${name(r)} ${path.join('.')}: stored text comes back unchanged`).toContain(text);
            figures.fragmentsStored++;
          }
        }
      }
    }
    // Nothing was executed: the tables the fragments name are all still there, with their rows.
    expect((await db('users').count({ n: '*' }).first())?.n).toBe(usersBefore?.n);
    expect(Number((await db('productions').count({ n: '*' }).first())?.n)).toBeGreaterThanOrEqual(Number(productionsBefore?.n));
    await expectServing();
  });
});

describe('forged roles and other productions\u2019 ids in bodies', () => {
  const withBody = ROUTES.filter((r) => r.body && r.path.includes(':productionId') && r.method !== 'delete' && !uploadOf(r));
  it.each(withBody.map((r) => [name(r), r] as const))('%s gives them no effect', async (_n, r) => {
    const agent = agentFor(r);
    if (!agent || agent === agents.admin) return;
    const sample = await sampleFor(r, own);
    if (!sample) return;
    const known = new Set(topLevelFields(jsonSchemaOf(r.body!)).map((f) => f.name));
    const forged: Record<string, unknown> = { role: 'admin', isAdmin: true, is_admin: true, productionId: stranger, production_id: stranger, userId: people.stranger.id, createdBy: people.stranger.id };
    for (const k of known) delete forged[k];
    const strangerRows = async () => {
      const out: Record<string, string> = {};
      for (const x of tables.filter((x) => x.hasProductionId)) {
        const row = await db.raw(`select count(*)::text || ':' || coalesce(sum(hashtext(r::text)::bigint), 0)::text as v from "${x.name}" r where production_id = ?`, [stranger]);
        out[x.name] = row.rows[0].v;
      }
      return out;
    };
    const adminsBefore = await db('users').where({ is_admin: true }).count({ n: '*' }).first();
    const strangerBefore = await strangerRows();
    const res = await send(agent, r.method, (await concrete(r, own))!).send({ ...sample, ...forged });
    expect(res.status, res.text?.slice(0, 300)).toBeLessThan(500);
    // Every id field that the body takes, pointed at a row of a production this person is not in.
    for (const f of topLevelFields(jsonSchemaOf(r.body!)).filter((x) => /Id$/.test(x.name) && x.name !== 'productionId')) {
      const foreign = await rowFor(f.name, stranger);
      if (!foreign) continue;
      const body = (await sampleFor(r, own)) ?? {};
      const res2 = await send(agent, r.method, (await concrete(r, own))!).send({ ...body, [f.name]: foreign.id });
      expectClearRefusal(res2, `${name(r)} with ${f.name} of another production`);
    }
    expect(await strangerRows(), `${name(r)} changed another production's rows`).toEqual(strangerBefore);
    expect((await db('users').where({ is_admin: true }).count({ n: '*' }).first())?.n).toBe(adminsBefore?.n);
    const memberships = await db('memberships').whereIn('user_id', Object.values(people).map((p) => p.id));
    expect(memberships.every((m) => ['planner', 'rigger', 'venue'].includes(m.role))).toBe(true);
  });
});

/** A zip archive (stored by deflate) of one entry: `size` zero bytes that compress to about size/1000. */
function zipBomb(size: number): Buffer {
  const data = deflateRawSync(Buffer.alloc(size));
  const nameBuf = Buffer.from('bomb.bin');
  const local = Buffer.alloc(30);
  local.writeUInt32LE(0x04034b50, 0);
  local.writeUInt16LE(20, 4);
  local.writeUInt16LE(8, 8);
  local.writeUInt32LE(data.length, 18);
  local.writeUInt32LE(size, 22);
  local.writeUInt16LE(nameBuf.length, 26);
  return Buffer.concat([local, nameBuf, data]);
}

const PNG_1PX = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64');

function validFileFor(ext: string): Buffer | undefined {
  if (ext === '.stl') return binaryStl(boxTriangles([0, 0, 0], [100, 100, 100]));
  if (ext === '.png') return PNG_1PX;
  return undefined;
}

/** File formats that are plain text themselves. */
const TEXT_FORMATS = new Set(['.csv', '.txt']);

describe('hostile files to every upload', () => {
  const uploads = ROUTES.filter((r) => uploadOf(r));
  it('finds the upload routes', () => {
    expect(uploads.length).toBeGreaterThan(0);
  });
  it.each(uploads.map((r) => [name(r), r] as const))('%s refuses them, writing nothing', async (_n, r) => {
    const rule = uploadOf(r)!;
    const agent = agentFor(r);
    if (!agent) return;
    const ext = rule.extensions[0];
    const fields = (await sampleFor(r, own)) ?? {};
    const url = (await concrete(r, own))!;
    const post = (file: Buffer | undefined, fileName: string, fieldName = rule.field) => {
      let req = send(agent, r.method, url);
      for (const [k, v] of Object.entries(fields)) req = req.field(k, typeof v === 'string' ? v : JSON.stringify(v));
      if (file) req = req.attach(fieldName, file, { filename: fileName, contentType: 'application/octet-stream' });
      return req;
    };
    const before = await snapshot();
    const rssBefore = process.memoryUsage().rss;
    const cases: [string, () => ReturnType<typeof post>][] = [
      ['no file', () => post(undefined, '')],
      ['a program with a foreign extension', () => post(Buffer.from('MZ\x90\x00 not what it claims'), 'setup.exe')],
      // Plain text is a well-formed file of a text format (a one-column CSV): that is for the mapping step to judge.
      ...(TEXT_FORMATS.has(ext) ? [] : [[`plain text named ${ext}`, () => post(Buffer.from('this is not a file of that kind at all\n'.repeat(20)), `notes${ext}`)] as [string, () => ReturnType<typeof post>]]),
      [`random bytes named ${ext}`, () => post(Buffer.from(Array.from({ length: 4096 }, (_, i) => (i * 7919) % 251)), `noise${ext}`)],
      [`a zip bomb (200 MB of zeros) named ${ext}`, () => post(zipBomb(200 * 1024 * 1024), `bomb${ext}`)],
      ['a zip bomb with a .zip name', () => post(zipBomb(200 * 1024 * 1024), 'bomb.zip')],
      [`a file one byte over the ${rule.maxBytes}-byte limit`, () => post(Buffer.alloc(rule.maxBytes + 1, 0x20), `huge${ext}`)],
      ['the file in the wrong form field', () => post(validFileFor(ext) ?? Buffer.from('x'), `ok${ext}`, `${rule.field}_other`)],
    ];
    for (const [what, make] of cases) {
      const res = await make();
      expectClearRefusal(res, `${name(r)}: ${what}`);
      if (what.includes('over the')) {
        expect(res.status).toBe(413);
        expect(res.body.error.message).toMatch(/limit/);
      }
      figures.uploadCases++;
    }
    expect(changedTables(before, await snapshot()), `${name(r)} wrote while refusing files`).toEqual([]);
    expect(process.memoryUsage().rss - rssBefore, 'memory growth while refusing hostile files').toBeLessThan(400 * 1024 * 1024);
    // Path tricks in the file name: refused, or stored as a name only (no file appears where the name points).
    const good = validFileFor(ext);
    if (good) {
      const target = `ballast-hostile-${runTag}${ext}`;
      for (const fileName of [`../../../../../../tmp/${target}`, `..\\..\\..\\tmp\\${target}`, `/tmp/${target}`, `%2e%2e%2f%2e%2e%2ftmp%2f${target}`]) {
        const res = await post(good, fileName);
        expect(res.status, `${name(r)} file name ${fileName}: ${res.text?.slice(0, 300)}`).toBeLessThan(500);
        if (res.status >= 400) expectClearRefusal(res, `${name(r)} file name ${fileName}`);
        expect(existsSync(`/tmp/${target}`), `an upload named ${fileName} wrote a file where its name points`).toBe(false);
        figures.uploadCases++;
      }
      rmSync(`/tmp/${target}`, { force: true });
    }
    await expectServing();
  }, 120_000);
});

describe('summary', () => {
  it('tried every kind of hostile input', () => {
    console.info(
      `hostile input: ${figures.statefulRoutes} state-changing routes of ${figures.routes}; ${figures.refusedCases} refused bodies, ${figures.pathCases} path tricks, ` +
        `${figures.uploadCases} hostile files, ${figures.fragmentCases} text fragments (${figures.fragmentsStored} shown back unchanged; answers ${JSON.stringify(figures.fragmentStatus)})` +
        (figures.noSample.length ? `; no valid sample body for: ${figures.noSample.join(', ')}` : ''),
    );
    expect(figures.refusedCases).toBeGreaterThan(0);
  });
});
