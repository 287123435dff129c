import { checkDock } from './dock.ts';
import { checkDoor } from './door.ts';
import { checkFloor, checkPointLoad } from './floor.ts';
import { fmt, isKnownPositive } from './known.ts';
import { checkLiftLoad, checkLiftSize } from './lift.ts';
import { checkRamp } from './ramp.ts';
import type { AccessCrate, AccessFinding, AccessOptions, AccessResult, AccessVenue, AccessVerdict } from './types.ts';

/** Overall verdict: fail if any finding fails, else unknown if any is unknown, else pass. */
export function overallVerdict(findings: readonly { verdict: AccessVerdict }[]): AccessVerdict {
  if (findings.some((f) => f.verdict === 'fail')) return 'fail';
  if (findings.some((f) => f.verdict === 'unknown')) return 'unknown';
  return findings.length > 0 ? 'pass' : 'unknown';
}

/** Problems with the crate's own sizes, each naming the field (empty when all are usable). */
export function crateSizeProblems(crate: AccessCrate): string[] {
  const out: string[] = [];
  for (const k of ['lengthMm', 'widthMm', 'heightMm'] as const) {
    const v = crate[k];
    if (!isKnownPositive(v)) out.push(`crate ${k} must be a positive number of millimetres (got ${String(v)})`);
  }
  return out;
}

/**
 * Checks one crate against one venue's access: every door on the route, the freight lift (size and
 * load by loading class), the floor (average pressure over the upright footprint) and, where the venue
 * records them, the dock, ramps and point-load rating. Missing data gives 'unknown' findings with the
 * reason, never a pass. See door.ts, lift.ts, floor.ts, dock.ts and ramp.ts for each rule and its limits.
 *
 * The optional third argument carries the delivering vehicle (bed height, tail lift) and the equipment
 * the production brings.
 */
export function checkCrateAccess(crate: AccessCrate, venue: AccessVenue, options: AccessOptions = {}): AccessResult {
  const findings: AccessFinding[] = [];
  const sizeProblems = crateSizeProblems(crate);
  const sizesOk = sizeProblems.length === 0;
  const sizeReason = `not checked: ${sizeProblems.join('; ')}`;

  // Doors
  const doors = venue.doors ?? [];
  if (doors.length === 0) {
    findings.push({ check: 'door', verdict: 'unknown', reason: 'not checked: no doors recorded on the route (door width unknown)' });
  } else if (!sizesOk) {
    findings.push({ check: 'door', verdict: 'unknown', reason: sizeReason });
  } else {
    doors.forEach((d, i) => findings.push(checkDoor(crate, d, i)));
  }

  // Lift: absent means there is none on the route.
  if (venue.lift) {
    findings.push(sizesOk ? checkLiftSize(crate, venue.lift) : { check: 'lift', verdict: 'unknown', reason: sizeReason });
    findings.push(checkLiftLoad(crate, venue.lift, crate.carriedByHand ? 0 : venue.handlingEquipmentKg));
  }

  // Floor
  findings.push(sizesOk ? checkFloor(crate, venue.floorRatingKnPerM2) : { check: 'floor', verdict: 'unknown', reason: sizeReason });

  // Further findings, each where the venue records its field.
  const equipment = [...(venue.equipment ?? []), ...(options.touringEquipment ?? [])];
  if (venue.dock) findings.push(checkDock(crate, venue.dock, equipment, options.vehicle, venue.handlingEquipmentKg));
  if (venue.ramps && venue.ramps.length > 0) venue.ramps.forEach((r, i) => findings.push(checkRamp(crate, r, i, equipment)));
  if (venue.pointLoadRatingKn !== undefined) findings.push(checkPointLoad(crate, venue));

  return { verdict: overallVerdict(findings), findings };
}

/**
 * The tightest finding: a fail before an unknown before a pass; among those, the smallest margin
 * ratio (capacity / demand − 1). Undefined for an empty list.
 */
export function tightestFinding(findings: readonly AccessFinding[]): AccessFinding | undefined {
  const rank = { fail: 0, unknown: 1, pass: 2 } as const;
  let best: AccessFinding | undefined;
  for (const f of findings) {
    if (!best) {
      best = f;
      continue;
    }
    const a = rank[f.verdict];
    const b = rank[best.verdict];
    if (a < b || (a === b && (f.marginRatio ?? Infinity) < (best.marginRatio ?? Infinity))) best = f;
  }
  return best;
}

/** One line naming a finding's place and margin, e.g. "corridor door: -50 mm". */
export function describeMargin(f: AccessFinding): string {
  const where = f.where ?? f.check;
  if (f.margin === undefined) return `${where}: ${f.verdict}`;
  const digits = f.marginUnit === 'kN/m²' || f.marginUnit === 'kN' || f.marginUnit === '%' ? 2 : 0;
  return `${where}: ${f.margin >= 0 ? '+' : ''}${fmt(f.margin, digits)} ${f.marginUnit ?? ''}`.trim();
}
