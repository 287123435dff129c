import type { Knex } from 'knex';
import type { GearInput, LiftPlanFields } from '../../../src/domain/contracts/lifting-api.ts';
import { weighingFromLoadCells } from '../../../src/domain/mass/index.ts';
import type { Actor } from '../../../src/domain/policy/index.ts';
import { sectionLoads } from './lift-loads.ts';
import { createPlan, submitPlan } from './lift-plans.service.ts';
import { ensureSettings, gearColumns } from './lifting.repository.ts';

/**
 * Demo lifting data for the tour (inside the seed's transaction): the rigging kit that travels with
 * Orrery Seven, Loomworks Hall's 500 kg hanging points, and a lift plan for the drive core that the
 * planner has submitted for a rigger's review. Ratings are plausible catalogue-style figures, invented.
 */
const GEAR: GearInput[] = [
  { kind: 'hoist', identifier: 'CH-1000-01', description: '1 t electric chain hoist, 18 m chain', ratedLoadKg: 1000, selfWeightKg: 38, chainWeightKg: 22, liftingSpeedMPerMin: 4, hoistClass: 'D8+', hasSecondBrake: true, nextInspectionDate: '2027-09-30' },
  { kind: 'hoist', identifier: 'CH-500-01', description: '500 kg electric chain hoist, 18 m chain', ratedLoadKg: 500, selfWeightKg: 24, chainWeightKg: 14, liftingSpeedMPerMin: 4, hoistClass: 'D8+', hasSecondBrake: true, nextInspectionDate: '2027-09-30' },
  { kind: 'sling', identifier: 'RS-1T-1.5-A', description: 'Roundsling 1 t, 1.5 m', slingType: 'roundsling', verticalRatingKg: 1000, lengthMm: 1500, massKg: 0.8, nextInspectionDate: '2027-06-30' },
  { kind: 'sling', identifier: 'RS-1T-1.5-B', description: 'Roundsling 1 t, 1.5 m', slingType: 'roundsling', verticalRatingKg: 1000, lengthMm: 1500, massKg: 0.8, nextInspectionDate: '2027-06-30' },
  { kind: 'sling', identifier: 'RS-2T-2.0-A', description: 'Roundsling 2 t, 2 m', slingType: 'roundsling', verticalRatingKg: 2000, lengthMm: 2000, massKg: 1.4, nextInspectionDate: '2027-06-30' },
  { kind: 'sling', identifier: 'RS-2T-2.0-B', description: 'Roundsling 2 t, 2 m', slingType: 'roundsling', verticalRatingKg: 2000, lengthMm: 2000, massKg: 1.4, nextInspectionDate: '2027-06-30' },
  { kind: 'shackle', identifier: 'SH-1T-01', description: 'Bow shackle 1 t', ratingKg: 1000, massKg: 0.3, nextInspectionDate: '2027-06-30' },
  { kind: 'shackle', identifier: 'SH-1T-02', description: 'Bow shackle 1 t', ratingKg: 1000, massKg: 0.3, nextInspectionDate: '2027-06-30' },
  { kind: 'shackle', identifier: 'SH-2T-01', description: 'Bow shackle 2 t', ratingKg: 2000, massKg: 0.6, nextInspectionDate: '2027-06-30' },
  { kind: 'shackle', identifier: 'SH-1T-03', description: 'Bow shackle 1 t — inspection overdue, quarantined', ratingKg: 1000, massKg: 0.3, nextInspectionDate: '2026-11-30' },
  {
    kind: 'lifting-point', identifier: 'EB-M20-A', description: 'Collar eyebolt M20, drive core top housing', pointType: 'eyebolt', ratingKg: 1200, massKg: 0.4,
    angleDerating: [{ upToDegFromAxis: 15, factor: 1 }, { upToDegFromAxis: 45, factor: 0.5 }], nextInspectionDate: '2027-06-30',
  },
  {
    kind: 'lifting-point', identifier: 'EB-M20-B', description: 'Collar eyebolt M20, drive core top housing', pointType: 'eyebolt', ratingKg: 1200, massKg: 0.4,
    angleDerating: [{ upToDegFromAxis: 15, factor: 1 }, { upToDegFromAxis: 45, factor: 0.5 }], nextInspectionDate: '2027-06-30',
  },
  { kind: 'spreader-beam', identifier: 'SB-2T-2000', description: 'Spreader beam 2 t, 2 m (arm carousel)', ratingKg: 2000, massKg: 60, lengthMm: 2000, nextInspectionDate: '2027-06-30' },
];

export async function seedDemoLifting(trx: Knex.Transaction, productionId: string, ids: { plannerId: string; venueIds: Map<string, string> }): Promise<void> {
  await ensureSettings(trx, productionId);
  const rows = await trx('lifting_gear')
    .insert(GEAR.map((g) => ({ production_id: productionId, ...gearColumns(g) })))
    .returning(['id', 'identifier']);
  const gearId = new Map(rows.map((r) => [r.identifier as string, r.id as string]));

  const loomworks = ids.venueIds.get('Loomworks Hall');
  if (loomworks) {
    await trx('hanging_points').insert(
      [1, 2, 3, 4].map((n) => ({ production_id: productionId, venue_id: loomworks, label: `Dock beam ${n}`, rating_kg: 500, notes: 'Venue drawing LH-R-02: 500 kg per point, points 2.4 m apart.' })),
    );
  }

  // The drive core was weighed on its cradle before the tour (three of its gear-train parts still have
  // no mass in the breakdown): the weighing settles the mass the lift plan uses.
  const dcSection = await trx('machine_sections').where({ production_id: productionId, code: 'DC' }).first('id');
  if (!dcSection) return;
  const readings = (
    [
      [-420, -420],
      [420, -420],
      [420, 420],
      [-420, 420],
    ] as [number, number][]
  ).map((positionMm, i) => ({ positionMm, readingKg: [117.2, 114.6, 112.9, 118.1][i] }));
  const derived = weighingFromLoadCells(readings);
  await trx('machine_weighings').insert({
    production_id: productionId,
    section_id: dcSection.id,
    weighed_on: '2027-01-25',
    weighed_by: 'Workshop crew',
    scale: 'Four 250 kg load cells under the cradle feet, calibrated 2026-11',
    readings: JSON.stringify(readings),
    mass_kg: derived.massKg,
    cog_plan_mm: JSON.stringify(derived.cogPlanMm),
    derived_notes: JSON.stringify(derived.notes),
  });

  // The drive core, picked at two eyebolts on its top bearing housing, either side of the CoG.
  const { loads } = await sectionLoads(trx, productionId);
  const dc = loads.find((l) => l.code === 'DC');
  if (!dc || !dc.cogMm || !dc.boundsMm) return;
  const round = (v: number) => Math.round(v / 10) * 10;
  const topZ = round(dc.boundsMm.maxMm[2] - 100);
  const [cx, cy] = [round(dc.cogMm[0]), round(dc.cogMm[1])];
  const fields: LiftPlanFields = {
    title: 'Drive core: lift off the transport cradle and onto the stage',
    sectionId: dc.sectionId,
    venueId: ids.venueIds.get('Kelderwerf Hall') ?? null,
    liftDate: '2027-02-08',
    cogUncertaintyMm: null,
    pickPoints: [
      { id: 'A', positionMm: [cx - 250, cy, topZ], slingGearId: gearId.get('RS-1T-1.5-A'), hitch: 'vertical', shackleGearIds: [gearId.get('SH-1T-01')!], liftingPointGearId: gearId.get('EB-M20-A') },
      { id: 'B', positionMm: [cx + 250, cy, topZ], slingGearId: gearId.get('RS-1T-1.5-B'), hitch: 'vertical', shackleGearIds: [gearId.get('SH-1T-02')!], liftingPointGearId: gearId.get('EB-M20-B') },
    ],
    suspension: { kind: 'single-hook', hoistGearId: gearId.get('CH-1000-01')!, hangingPoint: { label: 'Grid beam G4 (venue drawing KH-03, 1,000 kg)', ratingKg: 1000, source: 'typed' } },
    legRating: 'two-carry',
    peopleBelow: false,
    occupiedAreasMm: [],
    exclusionMarginMm: 1500,
    maxTiltDeg: 5,
    method:
      'Rigger in charge calls every move. Clear and tape the exclusion zone before the hoist takes the load. Take up slack, lift 50 mm and hold: check the tilt and the eyebolts. ' +
      'Lift clear of the cradle, roll the cradle out, lower onto the stage pads. Tag lines on both sides; nobody under or beside the load.',
  };
  const planner: Actor = { userId: ids.plannerId, isAdmin: false, memberships: [{ productionId, role: 'planner', venueIds: [] }] };
  const plan = await createPlan(trx, planner, productionId, fields);
  await submitPlan(trx, planner, productionId, plan.id, plan.version, 'Ready for review.', async () => null);
}
