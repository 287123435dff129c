/**
 * The Revised NIOSH Lifting Equation: RWL = LC × HM × VM × DM × AM × FM × CM, LI = load / RWL.
 *
 * Source: Waters, Putz-Anderson, Garg, *Applications Manual for the Revised NIOSH Lifting Equation*,
 * DHHS (NIOSH) Publication No. 94-110, 1994, revised September 2021 (public domain); page numbers are
 * the 2021 revision's. Multipliers are computed from the formulas (p. 7: "each multiplier should be
 * computed from the appropriate formula"); the printed Tables 1–4 are rounded to two decimals and a few
 * rows disagree with the formula, so they are not used.
 *
 * Two kinds of "no" are kept apart:
 * - the manual's own zeros (H > 63 cm, V > 175 cm, D > 175 cm, A > 135°, F above the column's maximum):
 *   the multiplier is 0, so the RWL is 0 ("zero, or no load", p. 12). The method applies and its
 *   answer is "no manual lift at this geometry"; `applies` stays true and a reason says why;
 * - the task is outside the method (a p. 6 limitation such as one-handed or seated lifting, more than
 *   8 hours, a negative or non-finite input): `applies` is false, with reasons, and `rwlKg` is NaN so
 *   that no number can be mistaken for a limit (NaN fails every comparison, so it never passes).
 */
import {
  CM_TABLE,
  durationBand,
  frequencyMultiplier,
  maxFrequencyPerMin,
  type Coupling,
  type DurationBand,
  type VerticalColumn,
} from './niosh-tables.ts';

export type { Coupling, DurationBand } from './niosh-tables.ts';

/**
 * Task conditions under which the manual says the equation does not apply (p. 6, section 1.2).
 * The crew records them; Ballast does not guess them.
 */
export const NIOSH_LIMITATIONS = {
  'one-handed': 'lifting or lowering with one hand',
  'seated-or-kneeling': 'lifting or lowering while seated or kneeling',
  'restricted-space': 'lifting or lowering in a restricted work space',
  'unstable-load': 'lifting or lowering an unstable object (centre of mass moves significantly during the lift)',
  'carrying-pushing-pulling': 'lifting or lowering while carrying, pushing or pulling (more than one or two steps)',
  'wheelbarrow-or-shovel': 'lifting or lowering with wheelbarrows or shovels',
  'high-speed': 'lifting or lowering with high-speed motion (faster than about 76 cm/s)',
  'poor-floor-friction': 'unreasonable foot/floor coupling (coefficient of friction below 0.4)',
  'unfavourable-environment': 'unfavourable environment (temperature well outside 19–26 °C or humidity outside 35–50 %)',
} as const;
export type NioshLimitation = keyof typeof NIOSH_LIMITATIONS;

/** Input of {@link nioshRwl}: distances in cm, angle in degrees, frequency in lifts per minute. */
export interface NioshInput {
  /** Horizontal distance of the hands from the midpoint between the inner ankle bones, cm. */
  hCm: number;
  /** Vertical height of the hands above the floor at the point evaluated (origin or destination), cm. */
  vCm: number;
  /** Vertical travel distance |V_destination − V_origin|, cm. */
  dCm: number;
  /** Asymmetry angle, degrees (0 = in front of the body). */
  asymmetryDeg: number;
  /** Average lifts per minute over a 15-minute period. */
  liftsPerMin: number;
  /** Length of the lifting session, hours (bands ≤ 1, ≤ 2, ≤ 8). */
  durationHours: number;
  coupling: Coupling;
  /** V at the origin, cm; selects the FM column (p. 15). Defaults to `vCm`. */
  vOriginCm?: number;
  /** Recorded task conditions outside the method (p. 6). Any one makes `applies` false. */
  limitations?: NioshLimitation[];
}

/** Result of {@link nioshRwl}. Multipliers are dimensionless; `rwlKg` is NaN when `applies` is false. */
export interface NioshResult {
  rwlKg: number;
  applies: boolean;
  reasons: string[];
  hm: number;
  vm: number;
  dm: number;
  am: number;
  fm: number;
  cm: number;
  /** Load constant used, kg (23). */
  lcKg?: number;
  /** Table 5 band used, or null when the duration is outside the method. */
  durationBand?: DurationBand | null;
  /** Which V column of Tables 5 and 7 was used ('low' = V < 75 cm). */
  frequencyColumn?: VerticalColumn;
}

/** Constants of one unit system of the equation (manual p. 7, both columns). */
interface NioshConstants {
  lc: number;
  unit: string;
  massUnit: string;
  hMin: number;
  hMax: number;
  vOpt: number;
  vCoef: number;
  vMax: number;
  dMin: number;
  dMax: number;
  dNum: number;
  /** Boundary of the V columns of Tables 5 and 7 (75 cm / 30 in). */
  vColumn: number;
}

const METRIC: NioshConstants = {
  lc: 23, unit: 'cm', massUnit: 'kg', hMin: 25, hMax: 63, vOpt: 75, vCoef: 0.003, vMax: 175, dMin: 25, dMax: 175, dNum: 4.5, vColumn: 75,
};
const US: NioshConstants = {
  lc: 51, unit: 'in', massUnit: 'lb', hMin: 10, hMax: 25, vOpt: 30, vCoef: 0.0075, vMax: 70, dMin: 10, dMax: 70, dNum: 1.8, vColumn: 30,
};

interface RawInput {
  h: number; v: number; d: number; a: number; f: number; hours: number; coupling: Coupling; vOrigin?: number; limitations?: NioshLimitation[];
}

function computeRwl(k: NioshConstants, inp: RawInput) {
  const reasons: string[] = [];
  let applies = true;
  const u = k.unit;
  const fields: [string, number][] = [['H', inp.h], ['V', inp.v], ['D', inp.d], ['asymmetry angle', inp.a], ['frequency', inp.f], ['duration', inp.hours]];
  if (inp.vOrigin !== undefined) fields.push(['V at the origin', inp.vOrigin]);
  for (const [name, value] of fields) {
    if (typeof value !== 'number' || !Number.isFinite(value) || value < 0) {
      applies = false;
      reasons.push(`${name} must be a finite number not below 0 (got ${String(value)}).`);
    }
  }
  if (!(inp.hours > 0) && Number.isFinite(inp.hours)) {
    applies = false;
    reasons.push('Duration must be more than 0 hours.');
  }
  if (!(inp.coupling in CM_TABLE)) {
    applies = false;
    reasons.push(`Coupling must be good, fair or poor (got ${String(inp.coupling)}).`);
  }
  for (const lim of inp.limitations ?? []) {
    applies = false;
    reasons.push(`The equation does not apply to ${NIOSH_LIMITATIONS[lim] ?? lim} (manual p. 6).`);
  }

  // HM: H below the minimum counts as the minimum; beyond the maximum HM = 0 (p. 8).
  let hm = k.hMin / Math.max(inp.h, k.hMin);
  if (inp.h > k.hMax) {
    hm = 0;
    reasons.push(`HM = 0: H ${inp.h} ${u} is beyond ${k.hMax} ${u}, where the manual recommends no load (p. 8).`);
  }
  // VM: 1 − c·|V − V_opt|; above the reach limit VM = 0 (p. 9).
  let vm = 1 - k.vCoef * Math.abs(inp.v - k.vOpt);
  if (inp.v > k.vMax) {
    vm = 0;
    reasons.push(`VM = 0: V ${inp.v} ${u} is above the reach limit of ${k.vMax} ${u} (p. 9).`);
  }
  // DM: D below the minimum counts as the minimum; beyond the maximum DM = 0 (pp. 10–11).
  let dm = 0.82 + k.dNum / Math.max(inp.d, k.dMin);
  if (inp.d > k.dMax) {
    dm = 0;
    reasons.push(`DM = 0: D ${inp.d} ${u} is beyond ${k.dMax} ${u} (p. 11).`);
  }
  // AM: 1 − 0.0032·A; above 135° AM = 0 (p. 12).
  let am = 1 - 0.0032 * inp.a;
  if (inp.a > 135) {
    am = 0;
    reasons.push(`AM = 0: asymmetry ${inp.a}° is beyond 135°, "zero, or no load" (p. 12).`);
  }
  const vOrigin = inp.vOrigin ?? inp.v;
  const column: VerticalColumn = vOrigin < k.vColumn ? 'low' : 'high';
  const band = Number.isFinite(inp.hours) ? durationBand(inp.hours) : null;
  let fm = Number.NaN;
  if (band === null) {
    applies = false;
    if (Number.isFinite(inp.hours)) reasons.push(`Duration ${inp.hours} h is over 8 hours: the manual gives no limit for more than eight hours (p. 14).`);
  } else if (Number.isFinite(inp.f) && inp.f >= 0) {
    fm = frequencyMultiplier(inp.f, band, column);
    if (fm === 0) {
      reasons.push(
        `FM = 0: ${inp.f} lifts/min is above the maximum of ${maxFrequencyPerMin(band, column)} lifts/min for this duration and V ` +
          `${column === 'low' ? '<' : '≥'} ${k.vColumn} ${u} at the origin (Table 5, p. 15).`,
      );
    }
  }
  if (inp.f < 0.2 && inp.f >= 0) reasons.push(`F ${inp.f} lifts/min is below 0.2: counted as 0.2 (p. 14).`);
  if (inp.h < k.hMin && inp.h >= 0) reasons.push(`H ${inp.h} ${u} is below ${k.hMin} ${u}: counted as ${k.hMin} ${u} (p. 8).`);
  if (inp.d < k.dMin && inp.d >= 0) reasons.push(`D ${inp.d} ${u} is below ${k.dMin} ${u}: counted as ${k.dMin} ${u} (p. 10).`);
  // CM uses V at the point evaluated (Example 4, Fig. 14: fair coupling gives .95 at V = 22 in, 1.0 at 59 in).
  const cmColumn: VerticalColumn = inp.v < k.vColumn ? 'low' : 'high';
  const cm = CM_TABLE[inp.coupling]?.[cmColumn] ?? Number.NaN;

  const product = k.lc * hm * vm * dm * am * fm * cm;
  const rwl = applies && Number.isFinite(product) ? product : Number.NaN;
  return { rwl, applies, reasons, hm, vm, dm, am, fm, cm, band, column };
}

/**
 * Recommended Weight Limit of one lift by the Revised NIOSH Lifting Equation, metric form
 * (LC 23 kg, HM 25/H, VM 1 − 0.003·|V − 75|, DM 0.82 + 4.5/D, AM 1 − 0.0032·A; manual p. 7).
 * See the module note for `applies` and the zeros.
 */
export function nioshRwl(input: {
  hCm: number;
  vCm: number;
  dCm: number;
  asymmetryDeg: number;
  liftsPerMin: number;
  durationHours: number;
  coupling: 'good' | 'fair' | 'poor';
  vOriginCm?: number;
  limitations?: NioshLimitation[];
}): NioshResult {
  const r = computeRwl(METRIC, {
    h: input.hCm, v: input.vCm, d: input.dCm, a: input.asymmetryDeg, f: input.liftsPerMin, hours: input.durationHours,
    coupling: input.coupling, vOrigin: input.vOriginCm, limitations: input.limitations,
  });
  return {
    rwlKg: r.rwl, applies: r.applies, reasons: r.reasons, hm: r.hm, vm: r.vm, dm: r.dm, am: r.am, fm: r.fm, cm: r.cm,
    lcKg: METRIC.lc, durationBand: r.band, frequencyColumn: r.column,
  };
}

/**
 * The same equation in the manual's U.S. customary form (LC 51 lb, HM 10/H, VM 1 − 0.0075·|V − 30|,
 * DM 0.82 + 1.8/D; inches and pounds). The two forms are parallel, not exact conversions of each
 * other (51 lb ≈ 23.13 kg, 10 in = 25.4 cm), so a task gives slightly different limits in each.
 * Kept so that the manual's worked examples, printed in U.S. units, can be checked as printed.
 */
export function nioshRwlUs(input: {
  hIn: number;
  vIn: number;
  dIn: number;
  asymmetryDeg: number;
  liftsPerMin: number;
  durationHours: number;
  coupling: Coupling;
  vOriginIn?: number;
  limitations?: NioshLimitation[];
}): Omit<NioshResult, 'rwlKg' | 'lcKg'> & { rwlLb: number } {
  const r = computeRwl(US, {
    h: input.hIn, v: input.vIn, d: input.dIn, a: input.asymmetryDeg, f: input.liftsPerMin, hours: input.durationHours,
    coupling: input.coupling, vOrigin: input.vOriginIn, limitations: input.limitations,
  });
  return {
    rwlLb: r.rwl, applies: r.applies, reasons: r.reasons, hm: r.hm, vm: r.vm, dm: r.dm, am: r.am, fm: r.fm, cm: r.cm,
    durationBand: r.band, frequencyColumn: r.column,
  };
}

/**
 * Lifting Index LI = load / RWL (manual p. 1, p. 19). Infinity when the RWL is 0 ("no load") and the
 * load is not; NaN when the RWL is not a number (the method did not apply) or the load is missing.
 */
export function liftingIndex(loadKg: number, rwlKg: number): number {
  if (!Number.isFinite(loadKg) || loadKg < 0 || Number.isNaN(rwlKg)) return Number.NaN;
  if (rwlKg === 0) return loadKg === 0 ? 0 : Number.POSITIVE_INFINITY;
  return loadKg / rwlKg;
}

/**
 * What the manual says about an LI (p. 20): ≤ 1.0 is the design goal; above 1.0 an increased risk of
 * lifting-related low back pain for some fraction of the workforce; above 3.0 (a figure the manual
 * attributes to some experts) nearly all workers are at increased risk.
 */
export function liftingIndexBand(li: number): 'goal met' | 'increased risk for some workers' | 'increased risk for nearly all workers' | 'unknown' {
  if (Number.isNaN(li)) return 'unknown';
  if (li <= 1) return 'goal met';
  if (li <= 3) return 'increased risk for some workers';
  return 'increased risk for nearly all workers';
}
