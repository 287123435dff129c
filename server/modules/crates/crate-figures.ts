import type { CrateFiguresView, HandlingView } from '../../../src/domain/contracts/crate-loads.ts';
import { ROAD_1G, tippingCheck, type CrateMakeUp } from '../../../src/domain/crates/index.ts';
import { handlingVerdict, type GuidelineTask } from '../../../src/domain/lifting/index.ts';
import { combineMasses, type PointMass } from '../../../src/domain/mass/index.ts';
import type { ContentRow, CrateRow } from './crates.repository.ts';

type Vec3 = [number, number, number];

/** What the crate's `design` column holds: the core's design (designed crates) or the catalogue entry. */
export interface CrateDesignRecord {
  makeUp?: CrateMakeUp;
  options?: unknown;
  stockId?: string;
  /** CoG of the empty crate in the crate frame, mm. */
  tareCogMm?: Vec3;
  sectionOffsetMm?: Vec3;
  warnings?: string[];
  [key: string]: unknown;
}

/**
 * The manual-handling task a crate is screened against: lifted from the floor to waist height (the hands
 * pass from below the knuckle to the elbow), close to the body, at most 30 lifts an hour, no twist.
 * [PRACTICE] the usual first screen of a case lift; a task of its own needs its own assessment.
 */
export const CRATE_HANDLING_TASK: Omit<GuidelineTask, 'column'> = Object.freeze({
  zones: ['lower-leg-to-knuckle', 'knuckle-to-elbow'],
  reach: 'close',
  liftsPerMin: 0.5,
  twistDeg: 0,
}) as Omit<GuidelineTask, 'column'>;

/**
 * The figures of one crate with its contents, all from the cores: masses and CoG by combineMasses,
 * tipping under the road profile by tippingCheck, the manual-handling verdict by handlingVerdict
 * (always with its cautions). Missing input never passes: a content line without a mass makes net and
 * gross lower bounds and withholds the tipping and handling verdicts, saying why.
 */
export function crateFigures(crate: CrateRow, contents: readonly ContentRow[], settings: { handlingColumn: 'men' | 'women' }): CrateFiguresView {
  const L = Number(crate.outer_length_mm);
  const W = Number(crate.outer_width_mm);
  const H = Number(crate.outer_height_mm);
  const tareKg = Number(crate.tare_kg);
  const middle: Vec3 = [L / 2, W / 2, H / 2];
  const tareCogMm: Vec3 = crate.design?.tareCogMm ?? middle;
  const warnings: string[] = [...(crate.design?.warnings ?? [])];
  const parts: PointMass[] = tareKg > 0 ? [{ massKg: tareKg, cogMm: tareCogMm }] : [];
  let netKg = 0;
  const missingMass: string[] = [];
  for (const c of contents) {
    const label = c.description || 'content line';
    if (c.mass_kg === null) {
      missingMass.push(label);
      continue;
    }
    const m = Number(c.mass_kg);
    netKg += m;
    if (m === 0) continue;
    let cog = c.cog_mm;
    if (!cog) {
      // Loose parts spread through a case: their CoG taken at the middle of the crate [PRACTICE], said aloud.
      cog = middle;
      warnings.push(`CoG of "${label}" not given: taken at the middle of the crate; the tipping check rests on that.`);
    }
    parts.push({ massKg: m, cogMm: cog });
  }
  const massComplete = missingMass.length === 0;
  if (!massComplete) warnings.push(`No mass for ${missingMass.map((m) => `"${m}"`).join(', ')}: net and gross are lower bounds until it is known.`);
  const grossKg = tareKg + netKg;
  const cogMm = parts.length > 0 && grossKg > 0 ? (combineMasses(parts).cogMm as Vec3) : null;
  const maxGross = crate.max_gross_kg === null ? null : Number(crate.max_gross_kg);
  if (maxGross !== null && grossKg > maxGross) warnings.push(`Gross ${Math.round(grossKg)} kg is over the crate's maximum gross ${Math.round(maxGross)} kg.`);
  if (contents.length === 0) warnings.push('The crate is empty: add its contents.');

  let tipping: CrateFiguresView['tipping'] = null;
  let tippingUnknownReason: string | null = null;
  if (!massComplete) tippingUnknownReason = 'No tipping verdict: a content line has no mass, so the CoG is not known.';
  else if (!cogMm) tippingUnknownReason = 'No tipping verdict: the crate has no mass to place.';
  else {
    try {
      // The ride is not planned yet in the catalogue: every edge gets the worst acceleration ('any').
      const t = tippingCheck({ lengthMm: L, widthMm: W }, cogMm, ROAD_1G, 'any');
      tipping = { action: t.action, tips: t.tips, note: t.note, worstMarginG: t.worst.marginG, profile: t.profile };
    } catch (e) {
      tippingUnknownReason = `No tipping verdict: ${(e as Error).message}`;
    }
  }

  const v = handlingVerdict({
    label: `Crate ${crate.code}`,
    // An unknown content mass gives no verdict (the core answers 'no verdict' for a missing mass).
    massKg: massComplete ? grossKg : Number.NaN,
    method: 'uk-guideline',
    guideline: { ...CRATE_HANDLING_TASK, zones: [...CRATE_HANDLING_TASK.zones], column: settings.handlingColumn },
  });
  const handling: HandlingView = {
    verdict: v.verdict,
    teamSize: v.teamSize,
    capacityKg: Number.isFinite(v.capacityKg) ? v.capacityKg : null,
    method: v.method,
    reasons: [...v.reasons, 'Task assumed: floor to waist height, close to the body, at most 30 lifts an hour, no twist.'],
    cautions: v.cautions,
  };

  const notes: string[] = [];
  if (tipping?.tips) notes.push(`LASH OR BLOCK: ${tipping.note}`);
  if (!tipping) notes.push(`Tipping not checked: ${tippingUnknownReason}`);
  if (crate.ispm15_required) notes.push('ISPM 15: solid wood: heat-treated timber with the ISPM 15 mark is needed on an international leg.');
  if (crate.this_way_up) notes.push('This way up.');
  if (crate.fragile) notes.push('Fragile.');
  if (!crate.stackable) notes.push('Do not stack on this crate.');
  else if (crate.max_load_on_top_kg !== null) notes.push(`May be stacked on: at most ${Math.floor(Number(crate.max_load_on_top_kg))} kg on top.`);
  else notes.push('May be stacked on.');

  return { tareKg, netKg, grossKg, massComplete, cogMm, tareCogMm, tipping, tippingUnknownReason, handling, warnings, packingListNotes: notes };
}
