import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type Agent, type TestApp } from './helpers.ts';
import { insertCrate, tourTestProduction } from './tour-helpers.ts';

let t: TestApp;
let planner: Agent;
let venue: Agent;
let rigger: Agent;
let ids: Awaited<ReturnType<typeof tourTestProduction>>;
const base = () => `/api/productions/${ids.productionId}/venues`;

beforeAll(async () => {
  t = await createTestApp();
  ids = await tourTestProduction(t.db, 'Venues test');
  planner = await t.signIn('planner');
  venue = await t.signIn('venue');
  rigger = await t.signIn('rigger');
});
afterAll(async () => t.close());

const access = {
  doors: [
    { name: 'dock door', widthMm: 2400, heightMm: 2800 },
    { name: 'corridor door B2', widthMm: 1100, heightMm: 2000 },
  ],
  lift: null,
  floorRatingKnPerM2: 7.5,
  stageFloorRatingKnPerM2: 5,
  handlingEquipmentKg: 70,
  dock: { kind: 'dock', heightMm: 1200, levellerRangeMm: 150 },
  ramps: [],
  equipment: [{ kind: 'hand-pallet-truck', capacityKg: 2000 }],
};

describe('venues: CRUD and stale saves', () => {
  it('creates, reads, updates with the version, and answers 409 with the current venue on a stale save', async () => {
    const created = await planner.post(base()).set('x-csrf-token', planner.csrf).send({ name: 'Test Pavilion', city: 'Leeds', access }).expect(201);
    const v = created.body.venue;
    expect(v.access.doors).toHaveLength(2);
    expect(v.version).toBe(1);
    const got = await planner.get(`${base()}/${v.id}`).expect(200);
    expect(got.body.venue.access.stageFloorRatingKnPerM2).toBe(5);

    const saved = await planner.patch(`${base()}/${v.id}`).set('x-csrf-token', planner.csrf).send({ version: 1, city: 'Bradford' }).expect(200);
    expect(saved.body.venue).toMatchObject({ city: 'Bradford', version: 2 });
    const stale = await planner.patch(`${base()}/${v.id}`).set('x-csrf-token', planner.csrf).send({ version: 1, city: 'York' }).expect(409);
    expect(stale.body.error.current).toMatchObject({ city: 'Bradford', version: 2 });

    await planner.delete(`${base()}/${v.id}`).set('x-csrf-token', planner.csrf).expect(204);
    await planner.get(`${base()}/${v.id}`).expect(404);
  });

  it('names the field and the limit of bad access data', async () => {
    const res = await planner
      .patch(`${base()}/${ids.ownVenueId}`)
      .set('x-csrf-token', planner.csrf)
      .send({ version: 1, access: { ...access, doors: [{ name: 'stage door', widthMm: -5, heightMm: 2000 }] } })
      .expect(400);
    expect(res.body.error.issues.map((i: { path: string }) => i.path)).toContain('access.doors.0.widthMm');
  });

  it('a rigger reads but may not edit', async () => {
    await rigger.get(`${base()}/${ids.otherVenueId}`).expect(200);
    await rigger.patch(`${base()}/${ids.otherVenueId}`).set('x-csrf-token', rigger.csrf).send({ version: 1, city: 'X' }).expect(403);
  });
});

describe('venue staff are confined to their own venue', () => {
  it('lists only their venue', async () => {
    const res = await venue.get(base()).expect(200);
    expect(res.body.venues.map((v: { id: string }) => v.id)).toEqual([ids.ownVenueId]);
  });

  it('cannot read or write another venue by id', async () => {
    const read = await venue.get(`${base()}/${ids.otherVenueId}`).expect(403);
    expect(read.body.error.message).toMatch(/another venue/);
    await venue.patch(`${base()}/${ids.otherVenueId}`).set('x-csrf-token', venue.csrf).send({ version: 1, city: 'Hijacked' }).expect(403);
    await venue.get(`${base()}/${ids.otherVenueId}/access-check`).expect(403);
    const other = await t.db('venues').where({ id: ids.otherVenueId }).first();
    expect(other.city).toBe('Elsewhere');
    // A venue of a production they are not in: refused before anything is read.
    await venue.get(`/api/productions/${ids.productionId}/venues/00000000-0000-4000-8000-000000000000`).expect(403);
  });

  it('edits their own venue, but may not create or delete venues', async () => {
    const current = (await venue.get(`${base()}/${ids.ownVenueId}`).expect(200)).body.venue;
    const res = await venue
      .patch(`${base()}/${ids.ownVenueId}`)
      .set('x-csrf-token', venue.csrf)
      .send({ version: current.version, access, contacts: [{ name: 'Dock manager', email: 'dock@own-hall.example' }] })
      .expect(200);
    expect(res.body.venue.contacts[0]).toMatchObject({ name: 'Dock manager', receivesManifest: true });
    await venue.post(base()).set('x-csrf-token', venue.csrf).send({ name: 'My new hall' }).expect(403);
    await venue.delete(`${base()}/${ids.otherVenueId}`).set('x-csrf-token', venue.csrf).expect(403);
  });
});

describe('access check of one venue', () => {
  it('missing data gives unknown findings, never a pass; known data gives fail with reason and margin', async () => {
    await insertCrate(t.db, ids.productionId, { code: 'VT-DC', lengthMm: 1200, widthMm: 1120, heightMm: 1050, tareKg: 260, contentsKg: 440 });
    // Other Hall has no access data at all.
    const blank = (await planner.get(`${base()}/${ids.otherVenueId}/access-check`).expect(200)).body.check;
    expect(blank.cells.length).toBeGreaterThan(0);
    for (const cell of blank.cells) expect(cell.verdict).toBe('unknown');
    const reasons = blank.cells.flatMap((c: { findings: { reason: string }[] }) => c.findings.map((f) => f.reason));
    expect(reasons.some((r: string) => /door width unknown/.test(r))).toBe(true);
    expect(reasons.some((r: string) => /floor load rating unknown/.test(r))).toBe(true);

    // Own Hall (given above): the 1,100 mm corridor door stops the 1,120 mm wide crate that may not tilt.
    const own = (await planner.get(`${base()}/${ids.ownVenueId}/access-check`).expect(200)).body.check;
    const row = own.rows.find((r: { code: string }) => r.code === 'VT-DC');
    const cell = own.cells.find((c: { rowId: string }) => c.rowId === row.id);
    expect(cell.verdict).toBe('fail');
    const door = cell.findings.find((f: { where?: string }) => f.where === 'corridor door B2');
    expect(door).toMatchObject({ verdict: 'fail', margin: -20, marginUnit: 'mm' });
    // Floor: the lower of route (7.5) and stage (5.0) counts: 700 kg × g over 1.344 m² is 5.11 kN/m².
    const floor = cell.findings.find((f: { check: string }) => f.check === 'floor');
    expect(floor.verdict).toBe('fail');
    expect(floor.reason).toMatch(/against a rating of 5/);
  });
});
