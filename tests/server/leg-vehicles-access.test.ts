import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type Agent, type TestApp } from './helpers.ts';
import { insertCrate, tourTestProduction } from './tour-helpers.ts';

/**
 * A venue at street level needs a tail lift for each crate (the crate and the 65 kg pallet truck on it).
 * The leg brings two trucks: one with a 1,000 kg lift, one with a 500 kg lift. The manifest and the tour's
 * access matrix check each crate with the truck the leg puts it on; a crate not placed on a truck yet
 * with the worse of the two.
 */
let t: TestApp;
let planner: Agent;
let productionId: string;
let engagementId: string;
const crates: Record<string, string> = {};

beforeAll(async () => {
  t = await createTestApp();
  const ids = await tourTestProduction(t.db, 'Leg vehicles');
  productionId = ids.productionId;
  await t.db('venues')
    .where({ id: ids.ownVenueId })
    .update({ access: JSON.stringify({ doors: [], dock: { kind: 'street' }, handlingEquipmentKg: 65 }) });
  const day = '2027-04-01';
  [{ id: engagementId }] = await t.db('engagements')
    .insert({ production_id: productionId, venue_id: ids.ownVenueId, load_in_on: day, show_first_on: day, show_last_on: day, load_out_on: day })
    .returning('id');
  const truck = async (code: string, tailLiftCapacityKg: number) =>
    (await t.db('vehicles').insert({ production_id: productionId, code, name: `Truck ${code}`, kind: 'custom', spec: JSON.stringify({ tailLiftCapacityKg }) }).returning('id'))[0].id as string;
  const big = await truck('BIG', 1000);
  const small = await truck('SMALL', 500);
  for (const code of ['ON-BIG', 'ON-SMALL', 'NOT-PLACED']) crates[code] = await insertCrate(t.db, productionId, { code, lengthMm: 800, widthMm: 600, heightMm: 700, tareKg: 40, contentsKg: 480 });
  const [leg] = await t.db('tour_legs').insert({ production_id: productionId, to_engagement_id: engagementId }).returning('id');
  await t.db('leg_vehicles').insert([
    { leg_id: leg.id, vehicle_id: big, sort_order: 0 },
    { leg_id: leg.id, vehicle_id: small, sort_order: 1 },
  ]);
  await t.db('leg_crates').insert([
    { leg_id: leg.id, crate_id: crates['ON-BIG'], vehicle_id: big, load_order: 1 },
    { leg_id: leg.id, crate_id: crates['ON-SMALL'], vehicle_id: small, load_order: 2 },
    { leg_id: leg.id, crate_id: crates['NOT-PLACED'], vehicle_id: null, load_order: 3 },
  ]);
  planner = await t.signIn('planner');
});
afterAll(async () => {
  await t?.close();
});

type Finding = { check: string; verdict: string; reason: string };

describe('the trucks of a leg at a street-level venue', () => {
  it('the manifest checks each crate with its own truck, and a crate not placed with the worse truck', async () => {
    const m = (await planner.get(`/api/productions/${productionId}/tour/engagements/${engagementId}/manifest`).expect(200)).body.manifest;
    const dock = (code: string) => (m.crates.find((c: { code: string }) => c.code === code).access.findings as Finding[]).find((f) => f.check === 'dock')!;
    // 520 kg gross + 65 kg pallet truck = 585 kg on the platform.
    expect(dock('ON-BIG')).toMatchObject({ verdict: 'pass' });
    expect(dock('ON-BIG').reason).toMatch(/585 kg .* 1,?000 kg/);
    expect(dock('ON-SMALL')).toMatchObject({ verdict: 'fail' });
    expect(dock('ON-SMALL').reason).toMatch(/tail lift 500 kg is short of 585 kg/);
    expect(dock('NOT-PLACED')).toMatchObject({ verdict: 'fail' });
    expect(m.crates.find((c: { code: string }) => c.code === 'ON-SMALL').vehicleName).toBe('Truck SMALL');
  });

  it('the tour matrix does the same, and names both trucks for the engagement', async () => {
    const m = (await planner.get(`/api/productions/${productionId}/tour/access-matrix`).expect(200)).body.matrix;
    const dock = (code: string) =>
      (m.cells.find((c: { rowId: string; engagementId: string }) => c.rowId === crates[code] && c.engagementId === engagementId).findings as Finding[]).find((f) => f.check === 'dock')!.verdict;
    expect([dock('ON-BIG'), dock('ON-SMALL'), dock('NOT-PLACED')]).toEqual(['pass', 'fail', 'fail']);
    expect(m.columns.find((c: { engagementId: string }) => c.engagementId === engagementId).vehicleName).toBe('Truck BIG, Truck SMALL');
  });
});
