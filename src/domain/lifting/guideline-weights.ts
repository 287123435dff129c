/**
 * The UK guideline-weight filter for lifting and lowering: HSE INDG143(rev4) *Manual handling at
 * work* (2020), Figure 1, and L23 *Manual Handling Operations Regulations 1992, Guidance* (2016),
 * Appendix 3 [PUB-2]. It is a filter, not a safe limit: above the figure a fuller assessment is needed.
 *
 * - Zones of the hands; where the hands pass through several zones the smallest figure counts.
 * - Men's or women's column (a production setting).
 * - Repetition: −30 % at once or twice a minute, −50 % at five to eight times a minute, −80 % above
 *   about twelve times a minute. The figures themselves hold for up to about 30 lifts an hour
 *   (0.5/min). The guidance leaves gaps between the bands (2–5/min, 8–12/min); Ballast takes the next
 *   stricter band there — our reading, on the safe side.
 * - Twisting: −10 % beyond 45°, −20 % beyond 90°. Repetition and twist reductions are multiplied
 *   together (our reading: the guidance lists both without saying how to combine them).
 */

export const GUIDELINE_ZONES = ['above-shoulder', 'elbow-to-shoulder', 'knuckle-to-elbow', 'lower-leg-to-knuckle', 'below-lower-leg'] as const;
export type GuidelineZone = (typeof GUIDELINE_ZONES)[number];
export type GuidelineColumn = 'men' | 'women';
export type GuidelineReach = 'close' | 'extended';

/** INDG143 Figure 1, kg, by zone, column and reach (hands close to the body or at arm's length). */
export const GUIDELINE_WEIGHTS_KG: Record<GuidelineZone, Record<GuidelineColumn, Record<GuidelineReach, number>>> = {
  'above-shoulder': { men: { close: 10, extended: 5 }, women: { close: 7, extended: 3 } },
  'elbow-to-shoulder': { men: { close: 20, extended: 10 }, women: { close: 13, extended: 7 } },
  'knuckle-to-elbow': { men: { close: 25, extended: 15 }, women: { close: 16, extended: 10 } },
  'lower-leg-to-knuckle': { men: { close: 20, extended: 10 }, women: { close: 13, extended: 7 } },
  'below-lower-leg': { men: { close: 10, extended: 5 }, women: { close: 7, extended: 3 } },
};

export interface GuidelineTask {
  /** Every zone the hands pass through during the lift. */
  zones: GuidelineZone[];
  reach: GuidelineReach;
  column: GuidelineColumn;
  liftsPerMin: number;
  /** Trunk twist during the lift, degrees. */
  twistDeg: number;
}

export interface GuidelineResult {
  /** Filter figure for one person after reductions, kg; NaN when it does not apply. */
  guidelineKg: number;
  applies: boolean;
  baseKg: number;
  repetitionReduction: number;
  twistReduction: number;
  reasons: string[];
}

/** Repetition reduction as a fraction (0.3 = 30 %). */
export function repetitionReduction(liftsPerMin: number): number {
  if (liftsPerMin <= 0.5) return 0;
  if (liftsPerMin <= 2) return 0.3;
  if (liftsPerMin <= 8) return 0.5;
  return 0.8;
}

/** Twist reduction as a fraction: 10 % beyond 45°, 20 % beyond 90°. */
export function twistReduction(twistDeg: number): number {
  if (twistDeg > 90) return 0.2;
  if (twistDeg > 45) return 0.1;
  return 0;
}

/** The guideline figure for one person doing this task. */
export function guidelineWeightKg(task: GuidelineTask): GuidelineResult {
  const reasons: string[] = [];
  let applies = true;
  if (!Array.isArray(task.zones) || task.zones.length === 0) {
    applies = false;
    reasons.push('No hand zone given: the guideline filter needs the zones the hands pass through.');
  }
  for (const z of task.zones ?? []) {
    if (!(z in GUIDELINE_WEIGHTS_KG)) {
      applies = false;
      reasons.push(`Unknown hand zone "${String(z)}".`);
    }
  }
  if (task.column !== 'men' && task.column !== 'women') {
    applies = false;
    reasons.push(`Column must be men or women (got ${String(task.column)}).`);
  }
  if (task.reach !== 'close' && task.reach !== 'extended') {
    applies = false;
    reasons.push(`Reach must be close or extended (got ${String(task.reach)}).`);
  }
  if (!Number.isFinite(task.liftsPerMin) || task.liftsPerMin < 0) {
    applies = false;
    reasons.push(`Lifts per minute must be a finite number not below 0 (got ${String(task.liftsPerMin)}).`);
  }
  if (!Number.isFinite(task.twistDeg) || task.twistDeg < 0) {
    applies = false;
    reasons.push(`Twist must be a finite number of degrees not below 0 (got ${String(task.twistDeg)}).`);
  }
  if (!applies) return { guidelineKg: Number.NaN, applies, baseKg: Number.NaN, repetitionReduction: 0, twistReduction: 0, reasons };

  let baseKg = Infinity;
  let governing: GuidelineZone = task.zones[0];
  for (const z of task.zones) {
    const kg = GUIDELINE_WEIGHTS_KG[z][task.column][task.reach];
    if (kg < baseKg) {
      baseKg = kg;
      governing = z;
    }
  }
  reasons.push(`Guideline ${baseKg} kg: ${task.column}, ${task.reach}, zone ${governing}${task.zones.length > 1 ? ' (smallest of the zones passed through)' : ''}.`);
  const rep = repetitionReduction(task.liftsPerMin);
  if (rep > 0) reasons.push(`Reduced by ${Math.round(rep * 100)} % for ${task.liftsPerMin} lifts/min.`);
  if (task.liftsPerMin > 12) reasons.push('More than about 12 lifts a minute: consider whether manual handling is suitable at all.');
  const tw = twistReduction(task.twistDeg);
  if (tw > 0) reasons.push(`Reduced by ${Math.round(tw * 100)} % for a ${task.twistDeg}° twist.`);
  return { guidelineKg: baseKg * (1 - rep) * (1 - tw), applies, baseKg, repetitionReduction: rep, twistReduction: tw, reasons };
}
