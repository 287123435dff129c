import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, demoProductionId, type Agent, type TestApp } from './helpers.ts';
import { asciiStl, binaryStl, boxTriangles, machineTestProduction, reversed } from './machine-helpers.ts';

const t: TestApp = await createTestApp();
let planner: Agent;
let rigger: Agent;
let venue: Agent;
let pid: string;
const base = () => `/api/productions/${pid}/machine`;

beforeAll(async () => {
  pid = await machineTestProduction(t.db, 'Machine CRUD');
  planner = await t.signIn('planner');
  rigger = await t.signIn('rigger');
  venue = await t.signIn('venue');
});
afterAll(async () => t.close());

const post = (a: Agent, path: string, body: unknown) => a.post(base() + path).set('x-csrf-token', a.csrf).send(body as object);
const patch = (a: Agent, path: string, body: unknown) => a.patch(base() + path).set('x-csrf-token', a.csrf).send(body as object);

describe('the demo machine', () => {
  it('has the scenario sections with roughly the scenario masses, and its gaps listed', async () => {
    const demo = await demoProductionId(t.db);
    const m = await planner.get(`/api/productions/${demo}/machine`).expect(200);
    const codes = m.body.sections.map((s: { code: string }) => s.code);
    expect(codes).toEqual(['BQ1', 'BQ2', 'BQ3', 'BQ4', 'DC', 'AC', 'PC', 'CD', 'TF']);
    expect(m.body.lineCount).toBeGreaterThan(2000);
    const mp = (await planner.get(`/api/productions/${demo}/machine/mass-properties`).expect(200)).body.massProperties;
    const byCode = Object.fromEntries(m.body.sections.map((s: { id: string; code: string }) => [s.code, mp.sections[s.id]]));
    // SCENARIO.md: BQ 4 × ~95 kg, DC ~420 kg, AC ~180 kg, CD ~70 kg, TF ~260 kg (with its frames).
    for (const code of ['BQ1', 'BQ2', 'BQ3', 'BQ4']) {
      expect(byCode[code].massKg).toBeGreaterThan(80);
      expect(byCode[code].massKg).toBeLessThan(110);
    }
    expect(byCode.DC.massKg).toBeGreaterThan(400);
    expect(byCode.DC.massKg).toBeLessThan(480);
    expect(byCode.AC.massKg).toBeGreaterThan(160);
    expect(byCode.AC.massKg).toBeLessThan(320);
    expect(byCode.CD.massKg).toBeGreaterThan(55);
    expect(byCode.CD.massKg).toBeLessThan(85);
    expect(byCode.TF.massKg).toBeGreaterThan(200);
    // DC carries its own 10 % margin; the machine's 5 % applies elsewhere.
    expect(byCode.DC.massWithMarginKg).toBeCloseTo(byCode.DC.massKg * 1.1, 6);
    expect(byCode.AC.massWithMarginKg).toBeCloseTo(byCode.AC.massKg * 1.05, 6);
    expect(mp.gaps.length).toBeGreaterThan(0);
    expect(byCode.BQ1.weighing.massKg).toBeGreaterThan(90);
    expect(byCode.BQ1.weighing.comparison.notes.join(' ')).toMatch(/govern/);
  });

  it('pages and filters the breakdown on the server', async () => {
    const demo = await demoProductionId(t.db);
    const all = (await planner.get(`/api/productions/${demo}/machine/breakdown?limit=50`).expect(200)).body;
    expect(all.lines).toHaveLength(50);
    expect(all.total).toBeGreaterThan(2000);
    const sections = (await planner.get(`/api/productions/${demo}/machine`)).body.sections;
    const dc = sections.find((s: { code: string }) => s.code === 'DC');
    const inDc = (await planner.get(`/api/productions/${demo}/machine/breakdown?limit=20000&sectionId=${dc.id}`).expect(200)).body;
    expect(inDc.total).toBeGreaterThan(100);
    expect(inDc.total).toBeLessThan(all.total);
    expect(inDc.lines.every((l: { effectiveSectionId: string }) => l.effectiveSectionId === dc.id)).toBe(true);
    const heavy = (await planner.get(`/api/productions/${demo}/machine/breakdown?limit=5&sort=lineMassKg&dir=desc`).expect(200)).body.lines;
    const masses = heavy.map((l: { quantity: number; unitMassKg: number }) => l.quantity * l.unitMassKg);
    expect([...masses].sort((a, b) => b - a)).toEqual(masses);
    const gaps = (await planner.get(`/api/productions/${demo}/machine/breakdown?gaps=true`).expect(200)).body;
    expect(gaps.total).toBeGreaterThan(0);
    expect(gaps.lines.every((l: { unitMassKg: number | null; cogMm: unknown }) => l.unitMassKg === null || l.cogMm === null)).toBe(true);
    await planner.get(`/api/productions/${demo}/machine/breakdown?limit=0`).expect(400);
  });
});

describe('editing the breakdown', () => {
  let sectionA: { id: string; version: number };
  let sectionB: { id: string; version: number };
  let asm: { id: string; version: number };

  it('creates sections, assemblies and lines, and computes their mass properties', async () => {
    sectionA = (await post(planner, '/sections', { code: 'S1', name: 'First', marginPercent: 10 }).expect(201)).body.section;
    sectionB = (await post(planner, '/sections', { code: 'S2', name: 'Second' }).expect(201)).body.section;
    const dup = await post(planner, '/sections', { code: 'S1' }).expect(409);
    expect(dup.body.error.message).toMatch(/S1/);
    asm = (await post(planner, '/assemblies', { number: 'A1', name: 'Frame', sectionId: sectionA.id }).expect(201)).body.assembly;
    await post(planner, '/lines', { partNumber: 'P-1', assemblyId: asm.id, quantity: 2, unitMassKg: 10, massSource: 'weighed', cogMm: [0, 0, 0] }).expect(201);
    await post(planner, '/lines', { partNumber: 'P-2', assemblyId: asm.id, quantity: 1, unitMassKg: 30, massSource: 'estimated', cogMm: [1000, 0, 0] }).expect(201);
    await post(planner, '/lines', { partNumber: 'P-3', assemblyId: asm.id, quantity: 1, unitMassKg: null, cogMm: [0, 0, 0] }).expect(201);
    const bad = await post(planner, '/lines', { partNumber: 'P-4', quantity: -1, sectionId: '00000000-0000-4000-8000-000000000000' }).expect(400);
    expect(bad.body.error.issues.map((i: { path: string }) => i.path)).toContain('quantity');
    const mp = (await planner.get(`${base()}/mass-properties`).expect(200)).body.massProperties;
    const s = mp.sections[sectionA.id];
    // 2 × 10 kg at x = 0 and 30 kg at x = 1000: 50 kg at x = 600 (hand check); P-3 is a gap, not zero.
    expect(s.massKg).toBeCloseTo(50, 9);
    expect(s.cogMm[0]).toBeCloseTo(600, 9);
    expect(s.massWithMarginKg).toBeCloseTo(55, 9);
    expect(s.confidence.weighedOrCatalogueKg).toBeCloseTo(20, 9);
    expect(s.confidence.estimatedKg).toBeCloseTo(30, 9);
    expect(s.gaps.map((g: { label: string }) => g.label)).toEqual(['P-3']);
    expect(s.complete).toBe(false);
  });

  it('refuses a stale save with 409 and the current record', async () => {
    const line = (await post(planner, '/lines', { partNumber: 'P-9', unitMassKg: 1, cogMm: [0, 0, 0] }).expect(201)).body.line;
    const first = await patch(planner, `/lines/${line.id}`, { version: line.version, name: 'Renamed once' }).expect(200);
    expect(first.body.line.version).toBe(line.version + 1);
    const stale = await patch(planner, `/lines/${line.id}`, { version: line.version, name: 'Renamed twice' }).expect(409);
    expect(stale.body.error.current.name).toBe('Renamed once');
    expect(stale.body.error.current.version).toBe(line.version + 1);
    const staleSection = await patch(planner, `/sections/${sectionA.id}`, { version: sectionA.version + 5, name: 'x' }).expect(409);
    expect(staleSection.body.error.current.code).toBe('S1');
  });

  it('places instances: quantity follows them, a different quantity is refused', async () => {
    const instances = [0, 90, 180, 270].map((deg) => ({ positionMm: [Math.cos((deg * Math.PI) / 180) * 500, Math.sin((deg * Math.PI) / 180) * 500, 0], eulerZyxDeg: [deg, 0, 0] }));
    const line = (await post(planner, '/lines', { partNumber: 'ARM', unitMassKg: 5, massSource: 'cad', cogMm: [100, 0, 0], instances, sectionId: sectionB.id }).expect(201)).body.line;
    expect(line.quantity).toBe(4);
    expect(line.instances).toHaveLength(4);
    await post(planner, '/lines', { partNumber: 'ARM2', quantity: 3, unitMassKg: 5, cogMm: [0, 0, 0], instances }).expect(400);
    const mp = (await planner.get(`${base()}/mass-properties`).expect(200)).body.massProperties;
    // Four arms turned 90° apart about z: their CoGs cancel in plan.
    expect(mp.sections[sectionB.id].massKg).toBeCloseTo(20, 9);
    expect(Math.abs(mp.sections[sectionB.id].cogMm[0])).toBeLessThan(1e-6);
    expect(mp.sections[sectionB.id].approximateLineCount).toBe(0);
  });

  it('moves assemblies and lines between sections in one transaction', async () => {
    const fresh = (await planner.get(`${base()}/breakdown?limit=100`).expect(200)).body;
    const a = fresh.assemblies.find((x: { id: string }) => x.id === asm.id);
    const loose = fresh.lines.find((l: { partNumber: string }) => l.partNumber === 'P-9');
    // One stale version: nothing moves.
    await post(planner, '/move', { sectionId: sectionB.id, assemblies: [{ id: a.id, version: a.version }], lines: [{ id: loose.id, version: loose.version - 1 }] }).expect(409);
    expect((await t.db('machine_assemblies').where({ id: a.id }).first()).section_id).toBe(sectionA.id);
    const ok = await post(planner, '/move', { sectionId: sectionB.id, assemblies: [{ id: a.id, version: a.version }], lines: [{ id: loose.id, version: loose.version }] }).expect(200);
    expect(ok.body.massProperties.sections[sectionB.id].massKg).toBeCloseTo(20 + 50 + 1, 9);
    expect(ok.body.massProperties.sections[sectionA.id].massKg).toBe(0);
  });

  it('refuses an assembly under its own sub-assembly', async () => {
    const child = (await post(planner, '/assemblies', { number: 'A1.1', parentId: asm.id }).expect(201)).body.assembly;
    const cur = (await planner.get(`${base()}/breakdown?limit=1`)).body.assemblies.find((x: { id: string }) => x.id === asm.id);
    const res = await patch(planner, `/assemblies/${asm.id}`, { version: cur.version, parentId: child.id }).expect(400);
    expect(res.body.error.issues[0].path).toBe('parentId');
    await planner.delete(`${base()}/assemblies/${asm.id}`).set('x-csrf-token', planner.csrf).expect(409);
  });

  it('records a weighing on four load cells and compares it with the computed section', async () => {
    const res = await post(planner, `/sections/${sectionB.id}/weighings`, {
      weighedOn: '2027-02-01',
      weighedBy: 'Crew',
      scale: 'Four cells',
      readings: [
        { positionMm: [0, 0], readingKg: 20 },
        { positionMm: [1000, 0], readingKg: 20 },
        { positionMm: [1000, 1000], readingKg: 20 },
        { positionMm: [0, 1000], readingKg: 20 },
      ],
    }).expect(201);
    // Statics: equal readings at the corners of a square put the CoG at its centre.
    expect(res.body.weighing.massKg).toBe(80);
    expect(res.body.weighing.cogPlanMm).toEqual([500, 500]);
    expect(res.body.comparison.differenceKg).toBeCloseTo(80 - 71, 9);
    expect(res.body.comparison.massDifferenceLarge).toBe(true);
    const bad = await post(planner, `/sections/${sectionB.id}/weighings`, { weighedOn: '2027-02-01', weighedBy: 'Crew', readings: [{ positionMm: [0, 0], readingKg: -3 }] }).expect(400);
    expect(bad.body.error.issues[0].path).toMatch(/readings/);
    const list = await planner.get(`${base()}/sections/${sectionB.id}/weighings`).expect(200);
    expect(list.body.weighings).toHaveLength(1);
  });

  it('lets the rigger read but not edit, and refuses the venue role', async () => {
    await rigger.get(`${base()}/mass-properties`).expect(200);
    await post(rigger, '/sections', { code: 'R1' }).expect(403);
    await venue.get(`${base()}`).expect(403);
    await venue.get(`${base()}/breakdown`).expect(403);
    await post(venue, '/sections', { code: 'V1' }).expect(403);
  });
});

describe('STL upload', () => {
  let lineId: string;
  beforeAll(async () => {
    lineId = (await post(planner, '/lines', { partNumber: 'MESH-1', material: 'aluminium', makeOrBuy: 'made' }).expect(201)).body.line.id;
  });
  const upload = (file: Buffer, name: string, fields: Record<string, string>) => {
    const req = planner.post(`${base()}/lines/${lineId}/mesh`).set('x-csrf-token', planner.csrf);
    for (const [k, v] of Object.entries(fields)) req.field(k, v);
    return req.attach('file', file, name);
  };

  it('computes volume, CoG and CAD mass of a closed binary mesh in the unit chosen', async () => {
    // A 10 × 20 × 30 cm aluminium block: 6,000 cm³ × 2.7 g/cm³ = 16.2 kg, centre at (5, 10, 15) cm.
    const res = await upload(binaryStl(boxTriangles([0, 0, 0], [10, 20, 30])), 'block.stl', { unit: 'cm' }).expect(201);
    expect(res.body.mesh.volumeMm3).toBeCloseTo(6e6, 3);
    expect(res.body.mesh.massKg).toBeCloseTo(16.2, 9);
    expect(res.body.mesh.cogMm[0]).toBeCloseTo(50, 6);
    expect(res.body.mesh.cogMm[2]).toBeCloseTo(150, 6);
    expect(res.body.line.massSource).toBe('cad');
    expect(res.body.line.unitMassKg).toBeCloseTo(16.2, 9);
    expect(res.body.mesh.flipped).toBe(false);
    const stl = await planner.get(`${base()}/lines/${lineId}/mesh/stl`).buffer(true).expect(200);
    expect(stl.headers['x-length-unit']).toBe('cm');
  });

  it('reads ASCII and turns an inside-out mesh right side out', async () => {
    const res = await upload(asciiStl(reversed(boxTriangles([0, 0, 0], [100, 100, 100]))), 'inside-out.stl', { unit: 'mm' }).expect(201);
    expect(res.body.mesh.flipped).toBe(true);
    expect(res.body.mesh.volumeMm3).toBeCloseTo(1e6, 3);
    expect(res.body.notes.join(' ')).toMatch(/inside out/);
  });

  it('refuses an open mesh with the reason', async () => {
    const open = boxTriangles([0, 0, 0], [100, 100, 100]).slice(0, 9 * 11);
    const res = await upload(binaryStl(open), 'open.stl', { unit: 'mm' }).expect(400);
    expect(res.body.error.code).toBe('mesh_not_closed');
    expect(res.body.error.message).toMatch(/open edge/);
  });

  it('refuses a wrong type, a missing unit, and a file over the limit, naming the limit', async () => {
    const wrong = await upload(Buffer.from('hello'), 'notes.txt', { unit: 'mm' }).expect(415);
    expect(wrong.body.error.message).toMatch(/\.stl/);
    const noUnit = await upload(binaryStl(boxTriangles([0, 0, 0], [1, 1, 1])), 'a.stl', {}).expect(400);
    expect(noUnit.body.error.issues[0].path).toBe('unit');
    const garbage = await upload(Buffer.from('this is not an stl file at all, not even close to one. '.repeat(3)), 'bad.stl', { unit: 'mm' }).expect(400);
    expect(garbage.body.error.message).toMatch(/bad\.stl/);
    const big = await upload(Buffer.alloc(64 * 1024 * 1024 + 10), 'huge.stl', { unit: 'mm' });
    expect(big.status).toBe(413);
    expect(big.body.error.message).toMatch(/64 MB/);
  });
});
