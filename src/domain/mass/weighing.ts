import type { Vec3 } from '../geometry/vec3.ts';

/** One load-cell (or scale) reading under a support point. */
export interface LoadCellReading {
  /** Plan position of the support point (x, y), mm, in the frame of the section being weighed. */
  positionMm: [number, number];
  /** Reading net of tare, kg (what the cell shows with the load on, less what it showed without). */
  readingKg: number;
}

/** Mass and plan CoG found by weighing. */
export interface WeighingResult {
  /** Sum of the readings, kg. */
  massKg: number;
  /** CoG in plan (x, y), mm; null with a single reading (one scale gives mass only). */
  cogPlanMm: [number, number] | null;
  cellCount: number;
  /** How the CoG was found, and what it cannot tell (z is never found by weighing on one level). */
  notes: string[];
}

/**
 * Mass and centre of gravity in plan from readings on load cells at known support points, by statics:
 * the body rests in equilibrium, so the vertical reactions sum to its weight (ΣRᵢ = W) and their moments
 * about any axis balance the weight's (x̄ = ΣRᵢxᵢ / ΣRᵢ, ȳ = ΣRᵢyᵢ / ΣRᵢ). Valid for any number of cells,
 * including four (statically indeterminate reactions: whatever share each cell takes, what it reads is the
 * real reaction, and the balance holds). One reading gives the mass only. Two give a CoG on the line between
 * them, which is where a body balanced on two supports must have it. Three cells in a line cannot sense the
 * offset across that line either: noted. Height of the CoG is not found by weighing on one level.
 *
 * @throws naming the reading when a position or reading is not finite or a reading is negative, or when there
 *   are no readings or their total is zero.
 */
export function weighingFromLoadCells(readings: { positionMm: [number, number]; readingKg: number }[]): WeighingResult {
  if (!Array.isArray(readings) || readings.length === 0) throw new Error('Weighing: no readings; at least one is needed.');
  let m = 0;
  let mx = 0;
  let my = 0;
  const notes: string[] = [];
  readings.forEach((r, i) => {
    const label = `Weighing reading ${i + 1}`;
    if (!Number.isFinite(r.readingKg)) throw new Error(`${label}: reading must be a finite number of kilograms (got ${String(r.readingKg)}).`);
    if (r.readingKg < 0) {
      throw new Error(`${label}: reading ${r.readingKg} kg is negative: the cell was zeroed under load or the load lifted off it; weigh again.`);
    }
    const p = r.positionMm;
    if (readings.length > 1 && (!Array.isArray(p) || p.length !== 2 || !Number.isFinite(p[0]) || !Number.isFinite(p[1]))) {
      throw new Error(`${label}: support position must be two finite numbers (x, y) in millimetres.`);
    }
    if (r.readingKg === 0 && readings.length > 1) {
      notes.push(`${label} is zero: the load may be rocking off that support; the CoG still follows from the others.`);
    }
    m += r.readingKg;
    if (readings.length > 1) {
      mx += r.readingKg * p[0];
      my += r.readingKg * p[1];
    }
  });
  if (!(m > 0)) throw new Error('Weighing: the readings add up to zero; there is no mass and no centre of gravity.');
  if (readings.length === 1) {
    return { massKg: m, cogPlanMm: null, cellCount: 1, notes: ['A single reading gives the mass only, not the centre of gravity.'] };
  }
  if (readings.length === 2) {
    notes.push('Two supports: the CoG found lies on the line between them; its offset across that line is not measured.');
  } else if (collinear(readings.map((r) => r.positionMm))) {
    notes.push('The supports lie on one line: the CoG offset across that line is not measured.');
  }
  notes.push('Weighing on one level gives the CoG in plan only; its height is not measured.');
  return { massKg: m, cogPlanMm: [mx / m, my / m], cellCount: readings.length, notes };
}

/** True when all points lie within a hair of one straight line (relative to their spread). */
function collinear(points: [number, number][]): boolean {
  const [ax, ay] = points[0];
  let far = points[1];
  let best = 0;
  for (const p of points) {
    const d = Math.hypot(p[0] - ax, p[1] - ay);
    if (d > best) {
      best = d;
      far = p;
    }
  }
  if (best === 0) return true;
  const ux = (far[0] - ax) / best;
  const uy = (far[1] - ay) / best;
  return points.every((p) => Math.abs((p[0] - ax) * uy - (p[1] - ay) * ux) <= best * 1e-6);
}

/** Thresholds above which a weighing and the computed figures are called far apart. */
export interface WeighingTolerances {
  /** Mass difference as a percentage of the weighed mass. Default 5 % [PRACTICE: common practice, no source]. */
  massPercent?: number;
  /** Plan distance between weighed and computed CoG, mm. Default 50 mm [PRACTICE: common practice, no source]. */
  cogMm?: number;
}

export interface WeighingComparison {
  /** Weighed − computed, kg: positive when the section is heavier than its parts list says. */
  differenceKg: number;
  /** differenceKg as a percentage of the weighed mass (the weighed value governs). */
  differencePercent: number;
  /** Weighed − computed CoG in plan, mm, and its length; null when either has no plan CoG. */
  cogOffsetMm: { dx: number; dy: number; distance: number } | null;
  massDifferenceLarge: boolean;
  cogOffsetLarge: boolean;
  /** True when either is large. */
  large: boolean;
  /** Plain-language reading of the difference, for the section card. */
  notes: string[];
  /** The thresholds used (with their tag). */
  tolerances: { massPercent: number; cogMm: number; source: string };
}

/**
 * Compares a weighing with the computed mass and CoG of the same section. The weighed values govern; a large
 * difference usually means missing or double-counted parts, a wrong unit, or an add-on that was on (or off)
 * the scale. Thresholds default to 5 % of mass and 50 mm of CoG offset: common practice, no source [PRACTICE].
 */
export function compareWeighing(
  computed: { massKg: number; cogMm: Vec3 | null },
  weighed: { massKg: number; cogPlanMm: [number, number] | null },
  tolerances: WeighingTolerances = {},
): WeighingComparison {
  const massPercent = tolerances.massPercent ?? 5;
  const cogTol = tolerances.cogMm ?? 50;
  if (!Number.isFinite(computed.massKg) || computed.massKg < 0) throw new Error(`Weighing comparison: computed mass must be a finite number of kg, not below zero (got ${String(computed.massKg)}).`);
  if (!Number.isFinite(weighed.massKg) || !(weighed.massKg > 0)) throw new Error(`Weighing comparison: weighed mass must be a finite number of kg above zero (got ${String(weighed.massKg)}).`);
  const differenceKg = weighed.massKg - computed.massKg;
  const differencePercent = (differenceKg / weighed.massKg) * 100;
  let cogOffsetMm: WeighingComparison['cogOffsetMm'] = null;
  if (weighed.cogPlanMm && computed.cogMm) {
    const dx = weighed.cogPlanMm[0] - computed.cogMm[0];
    const dy = weighed.cogPlanMm[1] - computed.cogMm[1];
    cogOffsetMm = { dx, dy, distance: Math.hypot(dx, dy) };
  }
  const massDifferenceLarge = Math.abs(differencePercent) > massPercent;
  const cogOffsetLarge = cogOffsetMm !== null && cogOffsetMm.distance > cogTol;
  const notes: string[] = [];
  if (massDifferenceLarge) {
    notes.push(
      differenceKg > 0
        ? `Weighed ${fmt(differenceKg)} kg (${fmt(differencePercent)} %) heavier than computed: look for parts missing from the list or masses in the wrong unit.`
        : `Weighed ${fmt(-differenceKg)} kg (${fmt(-differencePercent)} %) lighter than computed: look for parts counted twice, or parts not on the scale.`,
    );
  }
  if (cogOffsetLarge && cogOffsetMm) notes.push(`Weighed CoG is ${fmt(cogOffsetMm.distance)} mm from the computed one in plan.`);
  if (cogOffsetMm === null) notes.push('No CoG comparison: the weighing or the computed section has no plan CoG.');
  notes.push('The weighed mass and CoG govern over the computed ones.');
  return {
    differenceKg,
    differencePercent,
    cogOffsetMm,
    massDifferenceLarge,
    cogOffsetLarge,
    large: massDifferenceLarge || cogOffsetLarge,
    notes,
    tolerances: { massPercent, cogMm: cogTol, source: '[PRACTICE] common practice, no source' },
  };
}

function fmt(v: number): string {
  return (Math.round(v * 10) / 10).toString();
}
