import type { Knex } from 'knex';
import { checkCrateAccess, overallVerdict, tightestFinding, describeMargin, type AccessVenue } from '../../../src/domain/access/index.ts';
import type { LimitSource, MassLimitView, SizeLimitView, SplitLimitsQuery, SplitLimitsView } from '../../../src/domain/contracts/split.ts';
import type { GearItem, HoistItem, SlingItem, ShackleItem } from '../../../src/domain/contracts/lifting.ts';
import type { VenueAccessData } from '../../../src/domain/contracts/tour.ts';
import { designCrate } from '../../../src/domain/crates/index.ts';
import {
  gearUsableOn,
  guidelineWeightKg,
  handlingCautions,
  hoistRatingForUse,
  liftPlanCautions,
  teamCapacityKg,
  MAX_TEAM_WITH_PUBLISHED_FACTOR,
  type LiftPlanResult,
} from '../../../src/domain/lifting/index.ts';
import type { Vehicle } from '../../../src/domain/vehicles/index.ts';
import { CRATE_HANDLING_TASK } from '../crates/crate-figures.ts';
import { ensureMachine } from '../machine/machine.repository.ts';
import { ensureSettings, gearItems, type SettingsRow } from '../lifting/lifting.repository.ts';
import { venueForCore } from '../tour/access.service.ts';
import { engagementsQuery } from '../tour/tour.repository.ts';

/**
 * The split advisor's limits, each derived from another module's data with that module's core, never
 * typed in again: the largest usable hoist (lifting core), the team hand-lift capacity (lifting core's
 * guideline weights and team rule), and the largest crate that passes every venue of the tour (the
 * access core's door and lift rules, inverted, then checked forward), less the crate core's walls.
 */

const today = () => new Date().toISOString().slice(0, 10);
const kg = (v: number) => `${Math.round(v).toLocaleString('en-GB')} kg`;
const mm = (v: number) => `${Math.round(v).toLocaleString('en-GB')} mm`;

/** Rigging below the hook: the heaviest of the production's evaluated lift plans, else a four-leg set from the inventory. */
export async function defaultRigging(db: Knex, productionId: string, gear: GearItem[], date: string): Promise<{ kg: number; source: string }> {
  const plans = await db('lift_plans').where({ production_id: productionId }).select('title', 'result');
  let best: { kg: number; source: string } | null = null;
  for (const p of plans) {
    const r = p.result as LiftPlanResult | null;
    const k = r?.loads?.riggingBelowHookKg;
    if (typeof k === 'number' && Number.isFinite(k) && (!best || k > best.kg)) best = { kg: k, source: `rigging below the hook in lift plan "${p.title}"` };
  }
  if (best) return best;
  // No plan yet: a four-leg bridle of the heaviest usable slings and shackles [PRACTICE]: on the safe side.
  const usable = gear.filter((g) => gearUsableOn(g, date).usable);
  const slings = usable.filter((g): g is SlingItem => g.kind === 'sling').map((g) => g.massKg).sort((a, b) => b - a).slice(0, 4);
  const shackles = usable.filter((g): g is ShackleItem => g.kind === 'shackle').map((g) => g.massKg).sort((a, b) => b - a).slice(0, 4);
  const total = [...slings, ...shackles].reduce((a, b) => a + b, 0);
  return { kg: total, source: `no lift plan yet: the ${slings.length} heaviest slings and ${shackles.length} heaviest shackles in the inventory (a four-leg set)` };
}

export function hoistMassLimit(input: { gear: GearItem[]; date: string; settings: Pick<SettingsRow, 'dynamic_factor' | 'dynamic_factor_source' | 'hoist_rule_set'>; marginPercent: number; rigging: { kg: number; source: string } }): MassLimitView {
  const problems: string[] = [];
  const working: string[] = [];
  const sources: LimitSource[] = [];
  let best: { hoist: HoistItem; effective: number } | null = null;
  for (const g of input.gear) {
    if (g.kind !== 'hoist') continue;
    const use = gearUsableOn(g, input.date);
    if (!use.usable) {
      working.push(`${use.reason} Left out.`);
      continue;
    }
    const r = hoistRatingForUse({ ratedLoadKg: g.ratedLoadKg, hoistClass: g.hoistClass, hasSecondBrake: g.hasSecondBrake, ruleSetId: input.settings.hoist_rule_set, label: `hoist ${g.identifier}` });
    if (r.effectiveRatingKg === null || r.problems.length > 0) {
      working.push(`hoist ${g.identifier}: ${r.problems.join(' ')} Left out.`);
      continue;
    }
    if (!best || r.effectiveRatingKg > best.effective) best = { hoist: g, effective: r.effectiveRatingKg };
  }
  const df = Number(input.settings.dynamic_factor);
  if (!best) {
    problems.push(`No usable hoist on ${input.date}: add one to the gear inventory, or bring the inspection dates up to date. No mass limit, so no split can be proposed by hoist.`);
    return { mode: 'hoist', maxSectionMassKg: null, working, sources, problems };
  }
  const margin = 1 + input.marginPercent / 100;
  const limit = (best.effective - input.rigging.kg) / df / margin;
  working.push(
    `hoist ${best.hoist.identifier}: rated ${kg(best.hoist.ratedLoadKg)} as ${best.hoist.hoistClass} → ${kg(best.effective)} under the production's hoist rules`,
    `− rigging below the hook ${kg(input.rigging.kg)} (${input.rigging.source})`,
    `÷ dynamic factor ${df} (${input.settings.dynamic_factor_source})`,
    `÷ (1 + contingency ${input.marginPercent} %)`,
    `= ${kg(limit)} of parts per section`,
  );
  sources.push({ what: `hoist ${best.hoist.identifier}`, detail: `the largest usable hoist, ${kg(best.effective)}` });
  if (!(limit > 0)) {
    problems.push(`The rigging (${kg(input.rigging.kg)}) leaves nothing of hoist ${best.hoist.identifier}'s rating for the load.`);
    return { mode: 'hoist', maxSectionMassKg: null, working, sources, problems };
  }
  return {
    mode: 'hoist',
    maxSectionMassKg: limit,
    working,
    sources,
    problems,
    hoist: {
      gearId: best.hoist.id,
      identifier: best.hoist.identifier,
      ratedLoadKg: best.hoist.ratedLoadKg,
      effectiveRatingKg: best.effective,
      riggingKg: input.rigging.kg,
      riggingSource: input.rigging.source,
      dynamicFactor: df,
      dynamicFactorSource: input.settings.dynamic_factor_source,
      marginPercent: input.marginPercent,
    },
  };
}

/** A team's hand-lift capacity for the crate screening task (floor to waist, close, ≤ 30 lifts an hour). */
export function handMassLimit(input: { column: 'men' | 'women'; maxTeamSize: number; marginPercent: number }): MassLimitView {
  const g = guidelineWeightKg({ ...CRATE_HANDLING_TASK, zones: [...CRATE_HANDLING_TASK.zones], column: input.column });
  if (!g.applies || !Number.isFinite(g.guidelineKg)) {
    return { mode: 'hand', maxSectionMassKg: null, working: g.reasons, sources: [], problems: ['The guideline figure does not apply to the screening task: no hand-lift limit.'] };
  }
  const team = Math.max(1, Math.min(Math.floor(input.maxTeamSize), MAX_TEAM_WITH_PUBLISHED_FACTOR));
  const capacity = teamCapacityKg(Array.from({ length: team }, () => g.guidelineKg));
  if (capacity === null) return { mode: 'hand', maxSectionMassKg: null, working: [], sources: [], problems: [`No published team factor for ${team} people.`] };
  const limit = capacity / (1 + input.marginPercent / 100);
  return {
    mode: 'hand',
    maxSectionMassKg: limit,
    working: [
      `guideline weight ${kg(g.guidelineKg)} per person (${input.column}, floor to waist, close to the body, ≤ 30 lifts an hour)`,
      `team of ${team}: ${kg(capacity)} (team rule)`,
      `÷ (1 + contingency ${input.marginPercent} %) = ${kg(limit)} per section`,
    ],
    sources: [{ what: 'manual handling guideline', detail: `team of ${team}, production's ${input.column}'s column` }],
    problems: [],
    hand: { perPersonKg: g.guidelineKg, teamSize: team, teamCapacityKg: capacity, marginPercent: input.marginPercent, method: 'uk-guideline' },
  };
}

export interface VenueForSize {
  id: string;
  name: string;
  access: VenueAccessData | null;
}

/** Crate walls, skids, cleats and clearance around a section, per axis, from the crate core's own design. */
export function crateOverheadMm(): [number, number, number] {
  const probe = 1000;
  const d = designCrate({ massKg: 100, cogMm: [probe / 2, probe / 2, probe / 2], bboxMinMm: [0, 0, 0], bboxMaxMm: [probe, probe, probe] });
  return [d.outerMm[0] - probe, d.outerMm[1] - probe, d.outerMm[2] - probe];
}

/**
 * The largest upright crate that passes every venue: the tightest door width and height, lift door and
 * car (the access core's door and lift rules read backwards: an upright crate presents its width × height
 * to a door; in a lift its footprint may lie either way in the car), and the largest vehicle of the
 * production. Unknown door or lift sizes are listed, never taken as room. The box is then checked forward
 * with checkCrateAccess at every venue.
 */
export function crateSizeLimit(venues: VenueForSize[], vehicles: Pick<Vehicle, 'name' | 'lengthMm' | 'widthMm' | 'heightMm' | 'doorWidthMm' | 'doorHeightMm'>[]): SizeLimitView {
  const problems: string[] = [];
  const axes = ['length', 'width', 'height'] as const;
  const best: ({ limitMm: number; venueId: string; venueName: string; where: string } | null)[] = [null, null, null];
  const offer = (axis: 0 | 1 | 2, limit: number | null | undefined, v: { id: string; name: string }, where: string) => {
    if (typeof limit !== 'number' || !Number.isFinite(limit) || limit <= 0) {
      problems.push(`${v.name}: ${where} unknown; not counted, so the box may not pass there. Measure it.`);
      return;
    }
    if (!best[axis] || limit < best[axis]!.limitMm) best[axis] = { limitMm: limit, venueId: v.id, venueName: v.name, where };
  };
  const cores: { v: VenueForSize; core: AccessVenue }[] = [];
  if (venues.length === 0) problems.push('No venues counted: the crate size is limited only by the vehicles, if any.');
  for (const v of venues) {
    const core = venueForCore(v.access);
    cores.push({ v, core });
    if (core.doors.length === 0) problems.push(`${v.name}: no doors recorded on the route; not counted.`);
    core.doors.forEach((d, i) => {
      const name = d.name?.trim() || `door ${i + 1}`;
      offer(1, d.widthMm, v, `${name} width`);
      offer(2, d.heightMm, v, `${name} height`);
    });
    const lift = core.lift;
    if (lift) {
      const name = lift.name?.trim() || 'freight lift';
      offer(1, lift.doorWidthMm, v, `${name} door width`);
      offer(2, lift.doorHeightMm, v, `${name} door height`);
      offer(2, lift.carHeightMm, v, `${name} car height`);
      const l = lift.carLengthMm;
      const w = lift.carWidthMm;
      if (typeof l === 'number' && typeof w === 'number' && l > 0 && w > 0) {
        offer(1, Math.min(l, w), v, `${name} car ${l <= w ? 'depth' : 'width'}`);
        offer(0, Math.max(l, w), v, `${name} car ${l > w ? 'depth' : 'width'}`);
      } else offer(0, null, v, `${name} car size`);
    }
  }
  // The crate must also fit the largest vehicle (by floor area) through its doors.
  const truck = [...vehicles].sort((a, b) => b.lengthMm * b.widthMm - a.lengthMm * a.widthMm)[0];
  if (truck) {
    const tv = { id: '', name: `vehicle ${truck.name}` };
    offer(0, truck.lengthMm, tv, 'load space length');
    offer(1, Math.min(truck.widthMm, truck.doorWidthMm ?? Infinity), tv, truck.doorWidthMm && truck.doorWidthMm < truck.widthMm ? 'door width' : 'load space width');
    offer(2, Math.min(truck.heightMm, truck.doorHeightMm ?? Infinity), tv, truck.doorHeightMm && truck.doorHeightMm < truck.heightMm ? 'door height' : 'load space height');
  }
  const crateMaxMm = best.map((b) => b?.limitMm ?? null) as [number | null, number | null, number | null];
  // Upright, the length is the longer plan side.
  if (crateMaxMm[0] !== null && crateMaxMm[1] !== null && crateMaxMm[1] > crateMaxMm[0]) crateMaxMm[1] = crateMaxMm[0];
  const overhead = crateOverheadMm();
  const sectionMaxMm =
    crateMaxMm[1] !== null && crateMaxMm[2] !== null
      ? ([crateMaxMm[0] === null ? UNLIMITED_MM : crateMaxMm[0] - overhead[0], crateMaxMm[1] - overhead[1], crateMaxMm[2] - overhead[2]] as [number, number, number])
      : null;
  if (crateMaxMm[0] === null) problems.push('No venue lift or vehicle limits the crate length: the section length is not limited here (corners and turns are not modelled; check them on site).');
  if (sectionMaxMm && sectionMaxMm.some((v) => v <= 0)) problems.push('The crate walls leave no room for a section inside the largest crate that passes.');

  const verified = cores.map(({ v, core }) => {
    if (crateMaxMm[1] === null || crateMaxMm[2] === null) return { venueId: v.id, venueName: v.name, verdict: 'unknown' as const, tightest: null };
    const r = checkCrateAccess({ lengthMm: crateMaxMm[0] ?? UNLIMITED_MM, widthMm: crateMaxMm[1], heightMm: crateMaxMm[2], grossKg: 1, mayTilt: false }, { doors: core.doors, lift: core.lift });
    const fs = r.findings.filter((f) => f.check === 'door' || (f.check === 'lift' && f.marginUnit !== 'kg'));
    const t = tightestFinding(fs);
    return { venueId: v.id, venueName: v.name, verdict: overallVerdict(fs), tightest: t ? describeMargin(t) : null };
  });
  return {
    crateMaxMm,
    crateOverheadMm: overhead,
    sectionMaxMm,
    setBy: best.flatMap((b, i) => (b ? [{ axis: axes[i], ...b }] : [])),
    venuesChecked: venues.length,
    verified,
    problems: [...new Set(problems)],
  };
}

/** Stands for "not limited" in the core's size triple (100 m). */
export const UNLIMITED_MM = 100_000;

export async function tourVenues(db: Knex, productionId: string): Promise<VenueForSize[]> {
  const engagements = await engagementsQuery(db, productionId);
  const ids = [...new Set(engagements.map((e) => e.venue_id))];
  const q = db('venues').where({ production_id: productionId });
  if (ids.length > 0) q.whereIn('id', ids);
  const rows = await q.orderBy('name').select('id', 'name', 'access');
  return rows.map((r) => ({ id: r.id as string, name: r.name as string, access: (r.access as VenueAccessData | null) ?? null }));
}

export async function productionVehicles(db: Knex, productionId: string): Promise<Vehicle[]> {
  const rows = await db('vehicles').where({ production_id: productionId }).select('id', 'name', 'spec');
  return rows.map((r) => ({ ...(r.spec as Vehicle), id: r.id as string, name: r.name as string }));
}

/** Every limit of the advisor for this production, with its sources. */
export async function splitLimits(db: Knex, productionId: string, q: Partial<SplitLimitsQuery>): Promise<SplitLimitsView> {
  const date = q.evaluationDate ?? today();
  const [machine, settings, gear, venues, vehicles] = await Promise.all([
    ensureMachine(db, productionId),
    ensureSettings(db, productionId),
    gearItems(db, productionId),
    tourVenues(db, productionId),
    productionVehicles(db, productionId),
  ]);
  const marginPercent = Number(machine.margin_percent);
  const mode = q.liftMode ?? 'hoist';
  const mass =
    mode === 'hand'
      ? handMassLimit({ column: settings.guideline_column, maxTeamSize: Number(settings.max_team_size), marginPercent })
      : hoistMassLimit({
          gear,
          date,
          settings,
          marginPercent,
          rigging: q.riggingKg !== undefined ? { kg: q.riggingKg, source: 'typed by the planner' } : await defaultRigging(db, productionId, gear, date),
        });
  const sizeFrom = q.sizeFrom ?? 'tour';
  const size =
    sizeFrom === 'none'
      ? { ...crateSizeLimit([], []), problems: ['Size not limited: the planner chose to leave crate sizes out. No proposal is checked against any door, lift or vehicle.'] }
      : crateSizeLimit(sizeFrom === 'tour' ? venues : [], vehicles);
  const maxSections = q.maxSections ?? null;
  return {
    mass,
    size,
    maxSections,
    limits:
      mass.maxSectionMassKg === null || (size.sectionMaxMm !== null && size.sectionMaxMm.some((v) => v <= 0))
        ? null
        : {
            maxSectionMassKg: mass.maxSectionMassKg,
            ...(size.sectionMaxMm ? { maxSectionSizeMm: size.sectionMaxMm } : {}),
            ...(maxSections !== null ? { maxSections } : {}),
          },
    cautions: mode === 'hand' ? handlingCautions() : liftPlanCautions(),
  };
}

export { mm as formatMm, kg as formatKg };
