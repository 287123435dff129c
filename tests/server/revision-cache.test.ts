import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type Agent, type TestApp } from './helpers.ts';
import { machineTestProduction } from './machine-helpers.ts';
import { FingerprintCache, machineFingerprint, revisionFingerprint } from '../../server/db/revision-cache.ts';
import { REVISION_TABLES } from '../../migrations/20261202110000_create-production-revisions.ts';

/**
 * Mass properties and the breakdown's order are cached per state of the breakdown. Two app instances on one
 * database stand for two app servers: what one writes, the other must show at once, never a stale figure.
 */
let a: TestApp;
let b: TestApp;
let onA: Agent;
let onB: Agent;
let productionId: string;
let base: string;
let sectionId: string;
let otherSectionId: string;
const lines: { id: string; version: number }[] = [];

beforeAll(async () => {
  a = await createTestApp();
  b = await createTestApp();
  productionId = await machineTestProduction(a.db, 'Machine cache');
  base = `/api/productions/${productionId}/machine`;
  onA = await a.signIn('planner');
  onB = await b.signIn('planner');
  sectionId = (await onA.post(`${base}/sections`).set('x-csrf-token', onA.csrf).send({ code: 'S1' }).expect(201)).body.section.id;
  otherSectionId = (await onA.post(`${base}/sections`).set('x-csrf-token', onA.csrf).send({ code: 'S2' }).expect(201)).body.section.id;
  for (let i = 0; i < 6; i++) {
    const res = await onA
      .post(`${base}/lines`)
      .set('x-csrf-token', onA.csrf)
      .send({ partNumber: `P-${i}`, sectionId, quantity: 1, unitMassKg: 10, massSource: 'weighed', cogMm: [i * 100, 0, 0], bboxMm: { minMm: [i * 100 - 10, -10, -10], maxMm: [i * 100 + 10, 10, 10] } })
      .expect(201);
    lines.push({ id: res.body.line.id, version: res.body.line.version });
  }
});
afterAll(async () => {
  await a?.close();
  await b?.close();
});

const massOf = async (agent: Agent, id: string) => (await agent.get(`${base}/mass-properties`).expect(200)).body.massProperties.sections[id]?.massKg ?? 0;

describe('mass properties cache', () => {
  it('shows a save made through another app server at once', async () => {
    expect(await massOf(onA, sectionId)).toBeCloseTo(60, 6);
    expect(await massOf(onA, sectionId)).toBeCloseTo(60, 6); // now served from A's cache
    const l = lines[0];
    const saved = await onB.patch(`${base}/lines/${l.id}`).set('x-csrf-token', onB.csrf).send({ version: l.version, unitMassKg: 25 }).expect(200);
    l.version = saved.body.line.version;
    expect(await massOf(onA, sectionId)).toBeCloseTo(75, 6);
  });

  it('follows deletes and section changes written straight into the database', async () => {
    await a.db('machine_part_lines').where({ id: lines[1].id }).delete();
    expect(await massOf(onA, sectionId)).toBeCloseTo(65, 6);
    await a.db('machine_sections').where({ id: sectionId }).update({ margin_percent: 50 });
    const mp = (await onA.get(`${base}/mass-properties`).expect(200)).body.massProperties;
    expect(mp.sections[sectionId].massWithMarginKg).toBeCloseTo(65 * 1.5, 6);
  });
});

describe('breakdown order cache', () => {
  const page = async (agent: Agent, query: string) => (await agent.get(`${base}/breakdown?${query}`).expect(200)).body as { lines: { id: string; partNumber: string }[]; total: number };

  it('pages through one order, and moves a line to another section for every server at once', async () => {
    const first = await page(onA, `sectionId=${sectionId}&sort=partNumber&limit=2`);
    const second = await page(onA, `sectionId=${sectionId}&sort=partNumber&limit=2&offset=2`);
    expect(first.total).toBe(5);
    expect([...first.lines, ...second.lines].map((l) => l.partNumber)).toEqual(['P-0', 'P-2', 'P-3', 'P-4']);

    const l = lines[2];
    const moved = await onB.patch(`${base}/lines/${l.id}`).set('x-csrf-token', onB.csrf).send({ version: l.version, sectionId: otherSectionId }).expect(200);
    l.version = moved.body.line.version;
    const after = await page(onA, `sectionId=${sectionId}&sort=partNumber&limit=10`);
    expect(after.total).toBe(4);
    expect(after.lines.map((x) => x.partNumber)).toEqual(['P-0', 'P-3', 'P-4', 'P-5']);
    expect((await page(onA, `sectionId=${otherSectionId}&limit=10`)).lines.map((x) => x.partNumber)).toEqual(['P-2']);
  });

  it('keeps filters apart and reports the total past the last page', async () => {
    await a.db('machine_part_lines').where({ id: lines[3].id }).update({ mass_source: 'estimated' });
    expect((await page(onA, `massSource=estimated&limit=10`)).lines.map((x) => x.partNumber)).toEqual(['P-3']);
    expect((await page(onA, `massSource=weighed&sort=partNumber&dir=desc&limit=10`)).lines.map((x) => x.partNumber)).toEqual(['P-5', 'P-4', 'P-2', 'P-0']);
    const past = await page(onA, `sectionId=${sectionId}&offset=100&limit=10`);
    expect(past).toMatchObject({ lines: [], total: 4 });
  });
});

describe('breakdown page lines', () => {
  it('carry their placed instances in order, and the machine\'s assemblies come with the page', async () => {
    const l = lines[5];
    const instances = [
      { positionMm: [10, 20, 30], eulerZyxDeg: [90, 0, 0] },
      { positionMm: [-10.5, 0, 0.25], eulerZyxDeg: [0, 0, 180] },
    ];
    const saved = await onB.patch(`${base}/lines/${l.id}`).set('x-csrf-token', onB.csrf).send({ version: l.version, instances }).expect(200);
    l.version = saved.body.line.version;
    await onA.post(`${base}/assemblies`).set('x-csrf-token', onA.csrf).send({ number: 'ASM-1' }).expect(201);
    const body = (await onA.get(`${base}/breakdown?sectionId=${sectionId}&sort=partNumber&limit=10`).expect(200)).body;
    const line = body.lines.find((x: { id: string }) => x.id === l.id);
    expect(line.instances).toEqual(instances);
    expect(line.quantity).toBe(2);
    expect(body.lines.find((x: { id: string }) => x.id !== l.id).instances).toEqual([]);
    expect(body.assemblies.map((a: { number: string }) => a.number)).toEqual(['ASM-1']);
  });

  it('are served again from the cache, and show a mesh added straight into the database at once', async () => {
    const l = lines[5];
    const hasMesh = async () => (await onA.get(`${base}/breakdown?sectionId=${sectionId}&sort=partNumber&limit=10`).expect(200)).body.lines.find((x: { id: string }) => x.id === l.id).hasMesh;
    expect(await hasMesh()).toBe(false);
    expect(await hasMesh()).toBe(false);
    await a.db('machine_meshes').insert({ production_id: productionId, part_line_id: l.id, file_name: 'x.stl', length_unit: 'mm', stl: Buffer.alloc(84), size_bytes: 84, triangle_count: 0, volume_mm3: 0, cog_mm: JSON.stringify([0, 0, 0]), bbox_mm: JSON.stringify({ minMm: [0, 0, 0], maxMm: [0, 0, 0] }) });
    expect(await hasMesh()).toBe(true);
  });
});

describe('fingerprint and cache', () => {
  it('changes with any write to the production and not with another production', async () => {
    const other = await machineTestProduction(a.db, 'Machine cache, other');
    const before = await machineFingerprint(a.db, productionId);
    await a.db('machine_sections').insert({ production_id: other, machine_id: (await a.db('machines').insert({ production_id: other, name: '' }).returning('id'))[0].id, code: 'X' });
    expect(await machineFingerprint(a.db, productionId)).toBe(before);
    await a.db('machine_part_lines').where({ id: lines[4].id }).update({ notes: 'touched' });
    const afterUpdate = await machineFingerprint(a.db, productionId);
    expect(afterUpdate).not.toBe(before);
    // A rollback leaves no trace.
    await a.db
      .transaction(async (trx) => {
        await trx('machine_part_lines').where({ id: lines[4].id }).update({ notes: 'rolled back' });
        throw new Error('roll back');
      })
      .catch(() => undefined);
    expect(await machineFingerprint(a.db, productionId)).toBe(afterUpdate);
  });

  it('is raised once per committed transaction, however many rows it wrote', async () => {
    const revision = async () => Number((await a.db('production_revisions').where({ production_id: productionId, scope: 'machine' }).first('revision')).revision);
    const r0 = await revision();
    await a.db.transaction(async (trx) => {
      for (const l of lines.slice(3)) await trx('machine_part_lines').where({ id: l.id }).update({ notes: 'batch' });
      // Not before the commit: a reader in the meantime keeps the old value.
      expect(await revision()).toBe(r0);
    });
    expect(await revision()).toBe(r0 + 1);
  });

  it('has a revision trigger for each scope on every table of the scope', async () => {
    const { rows } = (await a.db.raw(
      `select c.relname as table, t.tgname as name, t.tgdeferrable as deferred, (t.tgtype & 32) <> 0 as on_truncate
         from pg_trigger t join pg_class c on c.oid = t.tgrelid
        where t.tgfoid in ('ballast_revision_bump'::regproc, 'ballast_revision_bump_all'::regproc)`,
    )) as { rows: { table: string; name: string; deferred: boolean; on_truncate: boolean }[] };
    const found = rows.map((r) => `${r.table} ${r.name} ${r.deferred ? 'deferred' : ''}${r.on_truncate ? 'truncate' : ''}`).sort();
    const expected = Object.entries(REVISION_TABLES)
      .flatMap(([scope, tables]) => Object.keys(tables).flatMap((t) => [`${t} ${t}_${scope}_revision deferred`, `${t} ${t}_${scope}_revision_truncate truncate`]))
      .sort();
    expect(found).toEqual(expected);
  });

  it('keeps scopes apart, and follows a leg\'s crates through the leg', async () => {
    const machineBefore = await machineFingerprint(a.db, productionId);
    const tourBefore = await revisionFingerprint(a.db, productionId, 'tour');
    const [venue] = await a.db('venues').insert({ production_id: productionId, name: 'Test hall' }).returning('id');
    const day = '2027-03-01';
    const [engagement] = await a.db('engagements').insert({ production_id: productionId, venue_id: venue.id, load_in_on: day, show_first_on: day, show_last_on: day, load_out_on: day }).returning('id');
    const [leg] = await a.db('tour_legs').insert({ production_id: productionId, to_engagement_id: engagement.id }).returning('id');
    const afterLeg = await revisionFingerprint(a.db, productionId, 'tour');
    expect(afterLeg).not.toBe(tourBefore);
    const [vehicle] = await a.db('vehicles').insert({ production_id: productionId, code: 'V1', name: 'Van', kind: 'custom', spec: JSON.stringify({}) }).returning('id');
    const afterVehicle = await revisionFingerprint(a.db, productionId, 'tour');
    expect(afterVehicle).not.toBe(afterLeg);
    await a.db('leg_vehicles').insert({ leg_id: leg.id, vehicle_id: vehicle.id });
    expect(await revisionFingerprint(a.db, productionId, 'tour')).not.toBe(afterVehicle);
    expect(await machineFingerprint(a.db, productionId)).toBe(machineBefore);
    // A leg deleted with its vehicles in one transaction: the leg's own trigger raises the revision.
    const beforeDelete = await revisionFingerprint(a.db, productionId, 'tour');
    await a.db('tour_legs').where({ id: leg.id }).delete();
    expect(await revisionFingerprint(a.db, productionId, 'tour')).not.toBe(beforeDelete);
  });

  it('lets a production with a breakdown be deleted, its revision going with it', async () => {
    const gone = await machineTestProduction(a.db, 'Machine cache, deleted');
    const [m] = await a.db('machines').insert({ production_id: gone, name: '' }).returning('id');
    await a.db('machine_sections').insert({ production_id: gone, machine_id: m.id, code: 'G' });
    expect(await machineFingerprint(a.db, gone)).toMatch(/^\d+@\d+$/);
    await a.db('productions').where({ id: gone }).delete();
    expect(await machineFingerprint(a.db, gone)).toBe('none');
  });

  it('shares one computation between concurrent requests, keeps no failure, and freezes values', async () => {
    const cache = new FingerprintCache<{ n: number[] }>(2);
    let runs = 0;
    const compute = async () => {
      runs++;
      await new Promise((r) => setTimeout(r, 10));
      return { n: [runs] };
    };
    const [x, y] = await Promise.all([cache.get('k', 'f1', compute), cache.get('k', 'f1', compute)]);
    expect(x).toBe(y);
    expect(runs).toBe(1);
    expect(() => x.n.push(2)).toThrow(TypeError);
    expect((await cache.get('k', 'f2', compute)).n).toEqual([2]);
    await expect(cache.get('bad', 'f', () => Promise.reject(new Error('down')))).rejects.toThrow('down');
    expect((await cache.get('bad', 'f', compute)).n).toEqual([3]);
    // At most two keys: the least recently used goes.
    await cache.get('c', 'f', compute);
    await cache.get('k', 'f2', compute);
    expect(runs).toBe(5);
  });
});
