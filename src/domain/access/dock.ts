/**
 * Dock check: how the crate comes off the vehicle.
 *
 * At a loading dock the vehicle's bed must meet the dock within the dock leveller's reach (bed height
 * against dock height; docks are about 1.2 m in Europe and 48 in, 1.22 m, in North America:
 * REFERENCES §4.5 [S, 3rd party]/[CP]). With no leveller recorded the reach is taken as 0 mm, so only a
 * matching bed passes. At street level the crate needs a tail lift (on the vehicle, rated for the
 * crate and the pallet truck standing on it) or a forklift on site rated for the crate [CP].
 */
import { isForklift, HANDLING_LABEL } from './handling.ts';
import { fmt, isKnownNonNegative, isKnownPositive } from './known.ts';
import type { AccessCrate, AccessDock, AccessFinding, AccessOptions, HandlingEquipment, MaybeNumber } from './types.ts';

function streetLevel(
  crate: AccessCrate,
  equipment: HandlingEquipment[],
  vehicle: AccessOptions['vehicle'],
  handlingEquipmentKg: MaybeNumber,
  why: string,
): AccessFinding {
  const base = { check: 'dock' as const, where: 'unloading' };
  if (!isKnownPositive(crate.grossKg)) {
    return { ...base, verdict: 'unknown', reason: `not checked: ${why}; crate gross mass unknown` };
  }
  const gross = crate.grossKg;
  if (crate.carriedByHand) {
    return { ...base, verdict: 'pass', reason: `${why}: carried by hand off the bed (${fmt(gross)} kg)` };
  }
  const tail = vehicle?.tailLiftCapacityKg;
  const onPlatform = gross + (isKnownNonNegative(handlingEquipmentKg) ? handlingEquipmentKg : 0);
  if (isKnownPositive(tail) && tail >= onPlatform && isKnownNonNegative(handlingEquipmentKg)) {
    return {
      ...base,
      verdict: 'pass',
      reason: `${why}: tail lift needed; ${fmt(onPlatform)} kg (crate and pallet truck) against its ${fmt(tail)} kg`,
      margin: tail - onPlatform,
      marginUnit: 'kg',
      marginRatio: tail / onPlatform - 1,
    };
  }
  const fork = equipment
    .filter((e) => isForklift(e.kind) && isKnownPositive(e.capacityKg))
    .sort((a, b) => Number(b.capacityKg) - Number(a.capacityKg))[0];
  if (fork && Number(fork.capacityKg) >= gross) {
    const cap = Number(fork.capacityKg);
    return {
      ...base,
      verdict: 'pass',
      reason: `${why}: forklift needed; ${HANDLING_LABEL[fork.kind]} rated ${fmt(cap)} kg (at its rated load centre) for ${fmt(gross)} kg`,
      margin: cap - gross,
      marginUnit: 'kg',
      marginRatio: cap / gross - 1,
    };
  }
  // No pass yet: is one still possible with what is unknown?
  const eqKnown = isKnownNonNegative(handlingEquipmentKg);
  const noTail = tail === null || tail === 0;
  const tailOpen = !noTail && (!isKnownPositive(tail) || (tail >= gross && !eqKnown));
  const forkOpen = equipment.some((e) => isForklift(e.kind) && !isKnownPositive(e.capacityKg));
  if (tailOpen || forkOpen) {
    const open = [tailOpen ? (isKnownPositive(tail) ? 'the pallet truck mass on the tail lift' : "the vehicle's tail lift") : '', forkOpen ? "the forklift's capacity" : '']
      .filter(Boolean)
      .join(' and ');
    return { ...base, verdict: 'unknown', reason: `not checked: ${why}; a tail lift or forklift is needed and ${open} unknown` };
  }
  const tailText = isKnownPositive(tail) ? `tail lift ${fmt(tail)} kg is short of ${fmt(onPlatform)} kg` : 'no tail lift';
  const forkText = fork ? `forklift rated ${fmt(Number(fork.capacityKg))} kg is short` : 'no forklift on site';
  return { ...base, verdict: 'fail', reason: `${why}: ${tailText} and ${forkText}; bring a tail lift or a forklift for ${fmt(gross)} kg` };
}

export function checkDock(
  crate: AccessCrate,
  dock: AccessDock,
  equipment: HandlingEquipment[],
  vehicle: AccessOptions['vehicle'],
  handlingEquipmentKg: MaybeNumber,
): AccessFinding {
  const base = { check: 'dock' as const, where: 'loading dock' };
  if (dock.kind === 'street') return streetLevel(crate, equipment, vehicle, handlingEquipmentKg, 'street level, no dock');
  if (dock.kind !== 'dock') return { ...base, verdict: 'unknown', reason: 'not checked: dock or street level unknown' };
  if (!isKnownPositive(dock.heightMm)) return { ...base, verdict: 'unknown', reason: 'not checked: dock height unknown' };
  const bed = vehicle?.bedHeightMm;
  if (!isKnownPositive(bed)) {
    return { ...base, verdict: 'unknown', reason: `not checked: vehicle bed height unknown (dock ${fmt(dock.heightMm)} mm)` };
  }
  const reach = isKnownNonNegative(dock.levellerRangeMm) ? dock.levellerRangeMm : 0;
  const diff = bed - dock.heightMm;
  const margin = reach - Math.abs(diff);
  const rel = diff === 0 ? 'level with' : `${fmt(Math.abs(diff))} mm ${diff > 0 ? 'above' : 'below'}`;
  const text = `bed ${fmt(bed)} mm is ${rel} the ${fmt(dock.heightMm)} mm dock; leveller reach ±${fmt(reach)} mm`;
  if (margin >= 0) {
    return { ...base, verdict: 'pass', reason: `loading dock: ${text}`, margin, marginUnit: 'mm' };
  }
  // The dock does not serve this vehicle; it may still be unloaded at street level.
  const street = streetLevel(crate, equipment, vehicle, handlingEquipmentKg, `${text}, so the dock cannot be used`);
  return { ...street, where: 'loading dock' };
}
