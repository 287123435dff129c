import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { designCrate, tippingCheck, ROAD_1G, EUR_PALLET } from '../../src/domain/crates/index.ts';
import { handlingVerdict } from '../../src/domain/lifting/index.ts';
import { createTestApp, demoProductionId, type Agent, type TestApp } from './helpers.ts';

/**
 * The crates API on the real database. Figures are checked against the cores called here on the same input
 * (the cores themselves are checked against their published sources in tests/domain), and against
 * statics worked by hand where that is short.
 */
const t: TestApp = await createTestApp();
let planner: Agent;
let rigger: Agent;
let venue: Agent;
let pid: string;
const tag = randomUUID().slice(0, 6);
const base = () => `/api/productions/${pid}/crates`;
const post = (a: Agent, path: string, body: unknown) => a.post(base() + path).set('x-csrf-token', a.csrf).send(body as object);
const patch = (a: Agent, path: string, body: unknown) => a.patch(base() + path).set('x-csrf-token', a.csrf).send(body as object);

beforeAll(async () => {
  pid = await demoProductionId(t.db);
  planner = await t.signIn('planner');
  rigger = await t.signIn('rigger');
  venue = await t.signIn('venue');
});
afterAll(async () => {
  await t.db('crates').where({ production_id: pid }).andWhere('code', 'like', `%${tag}`).delete();
  await t.close();
});

describe('the demo crates', () => {
  it('lists the Orrery Seven crates with figures, cautions and packing-list notes', async () => {
    const { crates } = (await planner.get(base()).expect(200)).body;
    const codes = crates.map((c: { code: string }) => c.code);
    for (const c of ['BQ1', 'BQ2', 'BQ3', 'BQ4', 'DC', 'AC', 'CD', 'PC01', 'PC16', 'TF']) expect(codes).toContain(c);
    for (const c of crates) {
      // Gross = tare + net, always, and every verdict carries the lifting cautions.
      expect(c.figures.grossKg).toBeCloseTo(c.figures.tareKg + c.figures.netKg, 6);
      expect(c.figures.handling.cautions.join(' ')).toMatch(/Never stand or pass under a suspended load/);
    }
    const dc = crates.find((c: { code: string }) => c.code === 'DC');
    // The drive core (~420 kg + crate) is beyond any team: mechanical aid.
    expect(dc.figures.handling.verdict).toBe('mechanical aid required');
    expect(dc.thisWayUp).toBe(false);
    expect(dc.mayTilt).toBe(true);
    const tf = crates.find((c: { code: string }) => c.code === 'TF');
    expect(tf.kind).toBe('pallet');
    expect(tf.ispm15Required).toBe(true);
    expect(tf.figures.packingListNotes.join(' ')).toMatch(/ISPM 15/);
  });

  it('is readable by the rigger and refused to the venue user', async () => {
    await rigger.get(base()).expect(200);
    await venue.get(base()).expect(403);
  });
});

describe('designing a crate around a section', () => {
  let crate: { id: string; version: number; contents: { id: string; version: number; massKg: number }[] };

  it('sizes it with the crate core from the section the server holds', async () => {
    const machine = (await planner.get(`/api/productions/${pid}/machine`).expect(200)).body;
    const bq2 = machine.sections.find((s: { code: string }) => s.code === 'BQ2');
    const mp = (await planner.get(`/api/productions/${pid}/machine/mass-properties`).expect(200)).body.massProperties.sections[bq2.id];
    const res = await post(planner, '/', { code: `T1-${tag}`, kind: 'designed', sectionId: bq2.id, designOptions: { clearanceMm: 40 } }).expect(201);
    crate = res.body.crate;
    const c = res.body.crate;
    // The same design by the core on the same section (mass: weighing if any, else with margin).
    const massKg = mp.weighing?.massKg ?? mp.massWithMarginKg;
    const d = designCrate({ massKg, cogMm: mp.cogMm, bboxMinMm: mp.bboxMm.minMm, bboxMaxMm: mp.bboxMm.maxMm }, { clearanceMm: 40, thisWayUp: true });
    expect(c.outerMm[0]).toBeCloseTo(d.outerMm[0], 2);
    expect(c.innerMm[2]).toBeCloseTo(d.innerMm[2], 2);
    expect(c.tareKg).toBeCloseTo(d.tareKg, 2);
    expect(c.figures.grossKg).toBeCloseTo(d.grossKg, 2);
    for (let i = 0; i < 3; i++) expect(c.figures.cogMm[i]).toBeCloseTo(d.cogMm[i], 1);
    // Tipping: b/h of the nearest edge against 0.5 g sideways / 1.0 g forward, by the core and by hand.
    const tip = tippingCheck({ lengthMm: c.outerMm[0], widthMm: c.outerMm[1] }, c.figures.cogMm, ROAD_1G, 'any');
    expect(c.figures.tipping.action).toBe(tip.action);
    const [x, y, h] = c.figures.cogMm;
    const bMin = Math.min(x, c.outerMm[0] - x, y, c.outerMm[1] - y);
    // [COMP] rigid-block statics: tips when a > b/h (c_z = 1): with a = 1.0 g on every edge ('any').
    expect(c.figures.tipping.tips).toBe(1.0 > bMin / h);
    expect(c.contents).toHaveLength(1);
    expect(c.contents[0].sectionId).toBe(bq2.id);
  });

  it('adds and edits content lines, and gross follows', async () => {
    const before = (await planner.get(`${base()}/${crate.id}`).expect(200)).body.crate;
    const add = await post(planner, `/${crate.id}/contents`, { description: 'Spare levellers', quantity: 4, massKg: 6, cogMm: [300, 300, 200] }).expect(201);
    expect(add.body.crate.figures.grossKg).toBeCloseTo(before.figures.grossKg + 6, 6);
    const line = add.body.content;
    const unknown = await patch(planner, `/${crate.id}/contents/${line.id}`, { version: line.version, massKg: null }).expect(200);
    // A line without mass: lower bounds, no tipping and no handling verdict, each saying why.
    expect(unknown.body.crate.figures.massComplete).toBe(false);
    expect(unknown.body.crate.figures.tipping).toBeNull();
    expect(unknown.body.crate.figures.tippingUnknownReason).toMatch(/no mass/);
    expect(unknown.body.crate.figures.handling.verdict).toBe('no verdict');
    expect(unknown.body.crate.figures.handling.cautions.length).toBeGreaterThan(3);
    // Stale version: 409 with the current line.
    const stale = await patch(planner, `/${crate.id}/contents/${line.id}`, { version: line.version, massKg: 5 }).expect(409);
    expect(stale.body.error.current.version).toBe(line.version + 1);
    await planner.delete(`${base()}/${crate.id}/contents/${line.id}`).set('x-csrf-token', planner.csrf).expect(204);
  });

  it('designs again with new options, with a version check', async () => {
    const cur = (await planner.get(`${base()}/${crate.id}`).expect(200)).body.crate;
    const res = await patch(planner, `/${crate.id}`, { version: cur.version, designOptions: { clearanceMm: 80 } }).expect(200);
    expect(res.body.crate.innerMm[0]).toBeCloseTo(cur.innerMm[0] + 80, 6);
    expect(res.body.crate.contents.filter((c: { sectionId: string | null }) => c.sectionId)).toHaveLength(1);
    const stale = await patch(planner, `/${crate.id}`, { version: cur.version, name: 'old' }).expect(409);
    expect(stale.body.error.current.id).toBe(crate.id);
    expect(stale.body.error.current.figures).toBeDefined();
  });

  it('refuses the rigger and the venue user any change', async () => {
    await post(rigger, '/', { code: `R-${tag}`, kind: 'stock', stockId: 'case-600x400x400' }).expect(403);
    await patch(rigger, `/${crate.id}`, { version: 1, name: 'x' }).expect(403);
    await post(venue, '/', { code: `V-${tag}`, kind: 'stock', stockId: 'case-600x400x400' }).expect(403);
  });
});

describe('stock cases and pallets', () => {
  it('takes sizes and tare from the catalogue; a pallet adds its tare to its working load', async () => {
    const res = await post(planner, '/', { code: `P1-${tag}`, kind: 'pallet', stockId: 'eur-pallet', outerMm: [1200, 800, 900] }).expect(201);
    const c = res.body.crate;
    expect(c.outerMm).toEqual([1200, 800, 900]);
    expect(c.tareKg).toBe(EUR_PALLET.tareKg);
    expect(c.maxGrossKg).toBe(EUR_PALLET.maxLoadKg! + EUR_PALLET.tareKg);
    // Empty pallet: its own figures only, and a warning that it is empty.
    expect(c.figures.grossKg).toBe(EUR_PALLET.tareKg);
    expect(c.figures.warnings.join(' ')).toMatch(/empty/);
    // 25 kg by the HSE filter for the men's or women's column: the core's verdict, whichever it is.
    const v = handlingVerdict({ label: 'x', massKg: 25, method: 'uk-guideline', guideline: { zones: ['lower-leg-to-knuckle', 'knuckle-to-elbow'], reach: 'close', column: 'women', liftsPerMin: 0.5, twistDeg: 0 } });
    expect(c.figures.handling.verdict).toBe(v.verdict);
  });

  it('names the field of every bad input', async () => {
    const bad = await post(planner, '/', { code: '', kind: 'stock' }).expect(400);
    const paths = bad.body.error.issues.map((i: { path: string }) => i.path);
    expect(paths).toContain('code');
    expect(paths).toContain('outerMm');
    const noSection = await post(planner, '/', { code: `X-${tag}`, kind: 'designed' }).expect(400);
    expect(noSection.body.error.issues[0].path).toBe('sectionId');
    const negative = await post(planner, '/', { code: `Y-${tag}`, kind: 'stock', outerMm: [600, -1, 400], tareKg: 5 }).expect(400);
    expect(negative.body.error.issues[0].path).toMatch(/^outerMm/);
    const unknown = await post(planner, '/', { code: `Z-${tag}`, kind: 'stock', stockId: 'no-such-case' }).expect(400);
    expect(unknown.body.error.issues[0].path).toBe('stockId');
    const dup = await post(planner, '/', { code: 'BQ1', kind: 'stock', stockId: 'case-600x400x400' }).expect(400);
    expect(dup.body.error.issues[0].path).toBe('code');
  });
});
