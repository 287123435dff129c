import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ImpactView } from '../../src/domain/contracts/split.ts';
import { createTestApp, type Agent, type TestApp } from './helpers.ts';
import { demoCopy } from './split-helpers.ts';

/** The impact view on a copy of the demo production: drafts evaluated without saving, then applied. */

let t: TestApp;
let planner: Agent;
let p: string;
let venueIds: Map<string, string>;

beforeAll(async () => {
  t = await createTestApp();
  planner = await t.signIn('planner');
  ({ productionId: p, venueIds } = await demoCopy(t.db, 'Impact view'));
}, 60_000);
afterAll(async () => t?.close());

const evaluate = async (draft: unknown): Promise<ImpactView> => {
  const res = await planner.post(`/api/productions/${p}/impact/evaluate`).set('x-csrf-token', planner.csrf).send({ draft });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body.impact;
};

describe('impact', () => {
  it('a narrower door turns crates from pass to fail at that venue, and nothing is saved', async () => {
    const venueId = venueIds.get('Loomworks Hall')!;
    const before = await t.db('venues').where({ id: venueId }).first('access', 'version');
    const impact = await evaluate({ venueDoors: [{ venueId, doorIndex: 0, widthMm: 500 }] });
    const failing = impact.rows.filter((r) => r.kind === 'access' && r.change === 'pass→fail' && r.label.startsWith('Crate') && r.label.includes('Loomworks Hall'));
    expect(failing.length).toBeGreaterThan(0);
    expect(failing[0].after.figure).toMatch(/-[\d,]+ mm/);
    const after = await t.db('venues').where({ id: venueId }).first('access', 'version');
    expect(after).toEqual(before);
  });

  it('a heavier part withdraws a lift plan approval in the impact list without saving anything; applying it does', async () => {
    const bq1 = await t.db('machine_sections').where({ production_id: p, code: 'BQ1' }).first('id');
    const dcPlan = await t.db('lift_plans').where({ production_id: p }).first('inputs');
    const created = await planner
      .post(`/api/productions/${p}/lifting/plans`)
      .set('x-csrf-token', planner.csrf)
      .send({ inputs: { ...dcPlan.inputs, title: 'BQ1 onto the stage', sectionId: bq1.id } });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const planId = created.body.plan.id as string;
    // Approved as it stands (set here directly: the sign-off flow has its own tests).
    await t.db('lift_plans').where({ id: planId }).update({ status: 'approved', approved_fingerprint: t.db.ref('fingerprint') });
    const line = await t
      .db('machine_part_lines as l')
      .join('machine_assemblies as a', 'a.id', 'l.assembly_id')
      .where({ 'l.production_id': p, 'a.section_id': null })
      .whereIn('a.parent_id', t.db('machine_assemblies').where({ production_id: p, section_id: bq1.id }).select('id'))
      .whereNotNull('l.unit_mass_kg')
      .first('l.id', 'l.unit_mass_kg', 'l.version');
    expect(line).toBeDefined();
    const draft = { partMasses: [{ lineId: line.id, unitMassKg: Number(line.unit_mass_kg) + 40, massSource: 'weighed', version: line.version }] };
    const impact = await evaluate(draft);
    expect(impact.approvalsWithdrawn.map((a) => a.planId)).toContain(planId);
    const planRow = impact.rows.find((r) => r.kind === 'lift-plan' && r.id === planId);
    expect(planRow?.note).toMatch(/approval would be withdrawn/);
    const sectionRow = impact.rows.find((r) => r.kind === 'section' && r.id === bq1.id);
    expect(sectionRow).toBeDefined();
    // Nothing saved.
    expect((await t.db('lift_plans').where({ id: planId }).first('status')).status).toBe('approved');
    expect(Number((await t.db('machine_part_lines').where({ id: line.id }).first('unit_mass_kg')).unit_mass_kg)).toBeCloseTo(Number(line.unit_mass_kg), 6);

    // A rigger may not apply a breakdown change.
    const rigger = await t.signIn('rigger');
    await rigger.post(`/api/productions/${p}/impact/apply`).set('x-csrf-token', rigger.csrf).send({ draft }).expect(403);

    const applied = await planner.post(`/api/productions/${p}/impact/apply`).set('x-csrf-token', planner.csrf).send({ draft });
    expect(applied.status, JSON.stringify(applied.body)).toBe(200);
    expect(Number((await t.db('machine_part_lines').where({ id: line.id }).first('unit_mass_kg')).unit_mass_kg)).toBeCloseTo(Number(line.unit_mass_kg) + 40, 6);
    expect((await t.db('lift_plans').where({ id: planId }).first('status')).status).toBe('draft');
    const events = await t.db('lift_plan_events').where({ plan_id: planId }).pluck('kind');
    expect(events).toContain('approval-withdrawn');
    // The same draft again is stale: the line's version moved on.
    await planner.post(`/api/productions/${p}/impact/apply`).set('x-csrf-token', planner.csrf).send({ draft }).expect(409);
  });

  it("writes the rows' masses and CoG in the person's units", async () => {
    const bq1 = await t.db('machine_sections').where({ production_id: p, code: 'BQ1' }).first('id');
    const draft = { newAssemblies: [{ number: `UNITS-${Date.now()}`, name: '', parentId: null, sectionId: bq1.id, massKg: 25, cogMm: [0, 0, 500], bboxMm: null }] };
    const metric = (await evaluate(draft)).rows.find((r) => r.kind === 'section' && r.id === bq1.id)!;
    const user = await t.db('users').where({ email: 'planner@ballast.example' }).first('id', 'units');
    await t.db('users').where({ id: user.id }).update({ units: 'imperial' });
    try {
      const imperial = (await evaluate(draft)).rows.find((r) => r.kind === 'section' && r.id === bq1.id)!;
      expect(metric.after.figure).toMatch(/kg.*CoG .* mm/);
      expect(imperial.after.figure).toMatch(/lb .*CoG .* in/);
      expect(imperial.after.figure).not.toMatch(/kg|mm/);
      // The same mass: 1 lb = 0.453 592 37 kg exactly (NIST SP 811, 2008, B.8); both figures rounded to 0.1.
      const first = (text: string) => Number(/([\d,]+\.\d)/.exec(text)![1].replace(/,/g, ''));
      expect(Math.abs(first(imperial.after.figure) * 0.45359237 - first(metric.after.figure))).toBeLessThan(0.1);
    } finally {
      await t.db('users').where({ id: user.id }).update({ units: user.units });
    }
  });
});
