import { isKnownPositive } from './known.ts';
import type { CarryOrientation } from './orientations.ts';
import type { MaybeNumber } from './types.ts';

/** One clearance that must not be negative: `limit` (possibly unknown) against what the crate needs. */
export interface Clearance {
  /** What is measured, for messages, e.g. "door width". */
  label: string;
  limitMm: MaybeNumber;
  neededMm: number;
}

export interface FitOutcome {
  status: 'pass' | 'fail' | 'unknown';
  orientation: CarryOrientation;
  /** Smallest known clearance in mm (negative on fail); undefined when none is known. */
  marginMm?: number;
  /** The clearance that sets the margin. */
  tightest?: Clearance;
  /** Labels of the limits that are not known. */
  unknown: string[];
}

/**
 * Tries each orientation against its clearances and keeps the best outcome.
 *
 * An orientation fails when a KNOWN clearance is negative, so a known limit that already stops every
 * orientation gives a definite fail even when another limit is unknown. Otherwise an unknown limit
 * makes the outcome unknown, never a pass. Among passing orientations an upright one is preferred (it
 * needs no tilting), then the largest margin.
 */
export function bestFit(orientations: CarryOrientation[], clearances: (o: CarryOrientation) => Clearance[]): FitOutcome {
  const outcomes: FitOutcome[] = orientations.map((o) => {
    const cs = clearances(o);
    let marginMm: number | undefined;
    let tightest: Clearance | undefined;
    const unknown: string[] = [];
    for (const c of cs) {
      if (!isKnownPositive(c.limitMm)) {
        unknown.push(c.label);
        continue;
      }
      const m = c.limitMm - c.neededMm;
      if (marginMm === undefined || m < marginMm) {
        marginMm = m;
        tightest = c;
      }
    }
    const status: FitOutcome['status'] = marginMm !== undefined && marginMm < 0 ? 'fail' : unknown.length > 0 ? 'unknown' : 'pass';
    return { status, orientation: o, marginMm, tightest, unknown };
  });
  const byMargin = (a: FitOutcome, b: FitOutcome) => (b.marginMm ?? -Infinity) - (a.marginMm ?? -Infinity);
  const passes = outcomes.filter((o) => o.status === 'pass');
  const upright = passes.filter((o) => o.orientation.kind === 'upright').sort(byMargin);
  if (upright.length > 0) return upright[0];
  if (passes.length > 0) return passes.sort(byMargin)[0];
  const unknowns = outcomes.filter((o) => o.status === 'unknown').sort(byMargin);
  if (unknowns.length > 0) return unknowns[0];
  return outcomes.sort(byMargin)[0];
}
