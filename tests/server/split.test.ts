import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkCrateAccess, type AccessVenue } from '../../src/domain/access/index.ts';
import type { SplitRunView, SplitLimitsView } from '../../src/domain/contracts/split.ts';
import type { VenueAccessData } from '../../src/domain/contracts/tour.ts';
import { designCrate } from '../../src/domain/crates/index.ts';
import { fitsInAnyOrientation } from '../../src/domain/geometry/box.ts';
import { gearUsableOn, hoistRatingForUse, type LiftPlanResult } from '../../src/domain/lifting/index.ts';
import { createTestApp, type Agent, type TestApp } from './helpers.ts';
import { demoCopy } from './split-helpers.ts';

/**
 * Split advisor API on copies of the demo production. Each proposal is checked here independently of the
 * advisor: the mass limit recomputed from the gear, the settings and the lift plan with the lifting core;
 * each section crated by the crate core and checked at every venue of the tour by the access core.
 */

let t: TestApp;
let planner: Agent;
let demo: string;
let small: string;

beforeAll(async () => {
  t = await createTestApp();
  planner = await t.signIn('planner');
  demo = (await demoCopy(t.db, 'Split advisor demo')).productionId;
  small = (await demoCopy(t.db, 'Split advisor small machine')).productionId;
  await replaceMachine(t.db, small);
}, 60_000);
afterAll(async () => t?.close());

const base = (p: string) => `/api/productions/${p}/split`;

/** A small machine whose pieces fit the tour's tightest door once divided: two frames of four modules each. */
async function replaceMachine(db: TestApp['db'], productionId: string) {
  await db('machine_part_lines').where({ production_id: productionId }).delete();
  await db('machine_assemblies').where({ production_id: productionId }).delete();
  const machine = await db('machines').where({ production_id: productionId }).first('id');
  const asm = async (number: string, parentId: string | null, keep = false) =>
    (await db('machine_assemblies').insert({ production_id: productionId, machine_id: machine.id, number, name: number, parent_id: parentId, keep_together: keep }).returning('id'))[0].id as string;
  const root = await asm('M', null);
  for (const f of [0, 1]) {
    const frame = await asm(`F${f}`, root);
    for (let k = 0; k < 4; k++) {
      const mod = await asm(`F${f}-${k}`, frame, true);
      const x0 = k * 700;
      const y0 = f * 800;
      await db('machine_part_lines').insert({
        production_id: productionId,
        machine_id: machine.id,
        assembly_id: mod,
        part_number: `P${f}${k}`,
        name: 'module',
        quantity: 1,
        unit_mass_kg: 90 + 40 * k + 25 * f,
        mass_source: 'catalogue',
        cog_mm: JSON.stringify([x0 + 300, y0 + 350, 400]),
        bbox_mm: JSON.stringify({ minMm: [x0, y0, 0], maxMm: [x0 + 650, y0 + 700, 900] }),
      });
    }
  }
}

async function run(p: string, body: Record<string, unknown>): Promise<SplitRunView> {
  const res = await planner.post(`${base(p)}/runs`).set('x-csrf-token', planner.csrf).send({ timeLimitMs: 1000, ...body });
  expect(res.status, JSON.stringify(res.body)).toBe(202);
  let view = res.body.run as SplitRunView;
  for (let i = 0; i < 150 && (view.status === 'queued' || view.status === 'running'); i++) {
    await new Promise((r) => setTimeout(r, 200));
    view = (await planner.get(`${base(p)}/runs/${view.id}`).expect(200)).body.run;
  }
  expect(view.status, view.error ?? '').toBe('done');
  return view;
}

/** The mass limit, recomputed here from the rows with the lifting core. */
async function expectedMassLimit(p: string): Promise<number> {
  const today = new Date().toISOString().slice(0, 10);
  const settings = await t.db('lifting_settings').where({ production_id: p }).first();
  const machine = await t.db('machines').where({ production_id: p }).first('margin_percent');
  const hoists = (await t.db('lifting_gear').where({ production_id: p, kind: 'hoist' })).map((r) => ({ ...r.spec, identifier: r.identifier, kind: 'hoist' as const, nextInspectionDate: r.next_inspection_date }));
  const ratings = hoists
    .filter((h) => gearUsableOn(h, today).usable)
    .map((h) => hoistRatingForUse({ ratedLoadKg: h.ratedLoadKg, hoistClass: h.hoistClass, hasSecondBrake: h.hasSecondBrake, ruleSetId: settings.hoist_rule_set }).effectiveRatingKg ?? 0);
  const plans = await t.db('lift_plans').where({ production_id: p }).select('result');
  const rigging = Math.max(...plans.map((r) => (r.result as LiftPlanResult).loads?.riggingBelowHookKg ?? 0));
  return (Math.max(...ratings) - rigging) / Number(settings.dynamic_factor) / (1 + Number(machine.margin_percent) / 100);
}

async function tourVenues(p: string): Promise<{ name: string; access: VenueAccessData }[]> {
  return t.db('engagements as e').join('venues as v', 'v.id', 'e.venue_id').where('e.production_id', p).distinct('v.name', 'v.access');
}

describe('limits', () => {
  it('derives the hoist limit from the gear, the settings and the lift plan, and the crate box from the venues', async () => {
    const res = await planner.get(`${base(demo)}/limits`).expect(200);
    const limits = res.body.limits as SplitLimitsView;
    expect(limits.mass.maxSectionMassKg).toBeCloseTo(await expectedMassLimit(demo), 6);
    expect(limits.cautions.join(' ')).toMatch(/suspended load/);
    // The box passes every venue's doors and lift (forward check), and one 20 mm wider or taller fails somewhere.
    const [L, W, H] = limits.size.crateMaxMm as [number, number, number];
    const venues = await tourVenues(demo);
    const verdicts = (l: number, w: number, h: number) =>
      venues.map((v) => {
        const a = v.access as VenueAccessData;
        const venue: AccessVenue = { doors: a.doors ?? [], lift: a.lift ?? null };
        return checkCrateAccess({ lengthMm: l, widthMm: w, heightMm: h, grossKg: 1, mayTilt: false }, venue).findings.filter((f) => f.check === 'door' || (f.check === 'lift' && f.marginUnit === 'mm'));
      });
    expect(verdicts(L, W, H).flat().some((f) => f.verdict === 'fail')).toBe(false);
    expect(verdicts(L, W + 20, H).flat().some((f) => f.verdict === 'fail')).toBe(true);
    expect(verdicts(L, W, H + 20).flat().some((f) => f.verdict === 'fail')).toBe(true);
    // Each axis names its venue and point.
    expect(limits.size.setBy.find((s) => s.axis === 'width')?.where).toMatch(/door|lift/);
    // The section box is the crate box less the crate core's walls.
    const probe = designCrate({ massKg: 50, cogMm: [100, 100, 100], bboxMinMm: [0, 0, 0], bboxMaxMm: [W - limits.size.crateOverheadMm[0], W - limits.size.crateOverheadMm[1], H - limits.size.crateOverheadMm[2]] });
    expect(probe.outerMm[1]).toBeCloseTo(W, 6);
    expect(probe.outerMm[2]).toBeCloseTo(H, 6);
  });

  it('hand-lift limits come from the guideline weights and the team rule', async () => {
    const res = await planner.get(`${base(demo)}/limits?liftMode=hand`).expect(200);
    const mass = (res.body.limits as SplitLimitsView).mass;
    expect(mass.hand?.teamSize).toBeGreaterThan(0);
    // L23 team rule [PUB-2]: 2 people 2/3 of the sum, 3 people 1/2 of the sum.
    const n = mass.hand!.teamSize;
    const factor = n === 1 ? 1 : n === 2 ? 2 / 3 : 0.5;
    expect(mass.hand!.teamCapacityKg).toBeCloseTo(mass.hand!.perPersonKg * n * factor, 9);
  });
});

describe('advisor', () => {
  it('on the demo machine and the whole tour: no split exists, and it names the assemblies that make it impossible', async () => {
    const view = await run(demo, {});
    expect(view.result?.proposals).toHaveLength(0);
    const box = view.limits!.limits!.maxSectionSizeMm!;
    const massProps = (await planner.get(`/api/productions/${demo}/machine/mass-properties`).expect(200)).body.massProperties;
    expect(view.result!.infeasible.length).toBeGreaterThan(0);
    for (const i of view.result!.infeasible) {
      expect(i.assemblyNumber).toBeTruthy();
      // Independently: the assembly's own box, from the mass core, does not fit the section box.
      const b = massProps.assemblies[i.assemblyId].bboxMm;
      const size = [0, 1, 2].map((k) => b.maxMm[k] - b.minMm[k]) as [number, number, number];
      expect(fitsInAnyOrientation(size, box)).toBe(false);
      expect(i.reason).toMatch(/over by/);
    }
  });

  it('on the demo machine by mass alone: every proposal keeps every section within the hoist limit', async () => {
    const view = await run(demo, { sizeFrom: 'none' });
    const limit = await expectedMassLimit(demo);
    const massProps = (await planner.get(`/api/productions/${demo}/machine/mass-properties`).expect(200)).body.massProperties;
    const input = (await planner.get(`${base(demo)}/input`).expect(200)).body.input;
    expect(view.result!.proposals.length).toBeGreaterThan(0);
    for (const p of view.result!.proposals) {
      const covered: string[] = [];
      for (const s of p.sections) {
        let massKg = 0;
        for (const u of s.units) {
          expect(u.scope).toBe('whole');
          massKg += massProps.assemblies[u.assemblyId].massKg;
          covered.push(u.assemblyId);
        }
        expect(massKg).toBeCloseTo(s.massKg, 6);
        expect(massKg).toBeLessThanOrEqual(limit + 1e-9);
        expect(s.massMarginKg).toBeCloseTo(limit - massKg, 6);
      }
      // Every root assembly's parts in exactly one section.
      const roots = input.assemblies.filter((a: { parentId: string | null }) => a.parentId === null).map((a: { id: string }) => a.id);
      expect(new Set(covered).size).toBe(covered.length);
      for (const r of roots) expect(covered.some((c) => c === r || isBelow(input.assemblies, c, r))).toBe(true);
    }
  });

  it('on a machine that can be crated: every section, crated by the crate core, passes every venue of the tour', async () => {
    const view = await run(small, {});
    const limit = await expectedMassLimit(small);
    const venues = await tourVenues(small);
    expect(view.result!.proposals.length).toBeGreaterThan(0);
    for (const p of view.result!.proposals) {
      for (const s of p.sections) {
        expect(s.massKg).toBeLessThanOrEqual(limit + 1e-9);
        // Crate the section turned so that it fits the section box (length, width, height), as the crate keeps its axes.
        const lim = view.limits!.limits!.maxSectionSizeMm!;
        const [x, y, z] = s.sizeMm;
        const orient = ([[x, y, z], [x, z, y], [y, x, z], [y, z, x], [z, x, y], [z, y, x]] as [number, number, number][]).find((o) => o.every((v, i) => v <= lim[i] + 1e-6));
        expect(orient).toBeDefined();
        const crate = designCrate({ massKg: s.massKg, cogMm: [orient![0] / 2, orient![1] / 2, orient![2] / 2], bboxMinMm: [0, 0, 0], bboxMaxMm: orient! });
        for (const v of venues) {
          const a2 = v.access as VenueAccessData;
          const r = checkCrateAccess({ lengthMm: crate.outerMm[0], widthMm: crate.outerMm[1], heightMm: crate.outerMm[2], grossKg: crate.grossKg, mayTilt: false }, { doors: a2.doors ?? [], lift: a2.lift ?? null });
          const sizeFindings = r.findings.filter((f) => f.check === 'door' || (f.check === 'lift' && f.marginUnit === 'mm'));
          expect(sizeFindings.filter((f) => f.verdict === 'fail'), `${v.name}: ${sizeFindings.map((f) => f.reason).join('; ')}`).toEqual([]);
        }
      }
    }
  });
});

function isBelow(assemblies: { id: string; parentId: string | null }[], id: string, ancestor: string): boolean {
  let cur = assemblies.find((a) => a.id === id);
  while (cur?.parentId) {
    if (cur.parentId === ancestor) return true;
    cur = assemblies.find((a) => a.id === cur!.parentId);
  }
  return false;
}

describe('adopt', () => {
  it('writes the section assignments in one step, answers 409 on a stale breakdown, and refuses riggers and venue staff', async () => {
    const view = await run(small, {});
    const proposal = view.result!.proposals[0];
    const body = { machineVersion: view.machineVersion, stamp: view.stamp, sections: proposal.sections.map((s) => ({ units: s.units })) };
    const rigger = await t.signIn('rigger');
    await rigger.post(`${base(small)}/adopt`).set('x-csrf-token', rigger.csrf).send(body).expect(403);
    const venue = await t.signIn('venue');
    await venue.post(`${base(small)}/adopt`).set('x-csrf-token', venue.csrf).send(body).expect(403);

    const res = await planner.post(`${base(small)}/adopt`).set('x-csrf-token', planner.csrf).send(body);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const adopted = res.body.adopted;
    expect(adopted.sections).toHaveLength(proposal.sections.length);
    // Every unit's assembly (and what hangs under it) now sits in its section.
    const rows = await t.db('machine_assemblies').where({ production_id: small }).select('id', 'section_id');
    const sectionOf = new Map(rows.map((r) => [r.id, r.section_id]));
    proposal.sections.forEach((s, k) => {
      for (const u of s.units) expect(sectionOf.get(u.assemblyId)).toBe(adopted.sections[k].id);
    });
    // The mass core agrees with the proposal, section by section.
    const mp = (await planner.get(`/api/productions/${small}/machine/mass-properties`).expect(200)).body.massProperties;
    proposal.sections.forEach((s, k) => expect(mp.sections[adopted.sections[k].id].massKg).toBeCloseTo(s.massKg, 6));

    // The same body again: the breakdown moved on since the proposal.
    const stale = await planner.post(`${base(small)}/adopt`).set('x-csrf-token', planner.csrf).send(body);
    expect(stale.status).toBe(409);
    expect(stale.body.error.current.stamp).not.toBe(view.stamp);
  });

  it('refuses a hand edit that breaks a limit, naming the section', async () => {
    const input = (await planner.get(`${base(small)}/input`).expect(200)).body.input;
    const root = input.assemblies.find((a: { parentId: string | null }) => a.parentId === null);
    const res = await planner
      .post(`${base(small)}/adopt`)
      .set('x-csrf-token', planner.csrf)
      .send({ machineVersion: input.machineVersion, stamp: input.stamp, sections: [{ units: [{ assemblyId: root.id, scope: 'whole' }] }] });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/Section S1/);
  });
});
