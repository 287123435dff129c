/**
 * Freight lift check: the crate must pass the lift door, fit the car, and be carried within the lift's
 * loading class.
 *
 * Geometry: the crate enters straight through the lift door (see door.ts for the face rule) and rests in
 * the car as it entered: its vertical size must clear the door and the car height, its across size the
 * door width, and its footprint (along × across) must fit the car floor. We do not know which wall the
 * door is in, so the footprint may lie either way in the car. Not modelled: a diagonal placement in the
 * car (not assumed: safe side), and turning the crate inside the car (assumed impossible).
 *
 * Load, by ASME A17.1 freight loading class (REFERENCES §4.5 and the classification summaries it
 * quotes [S, 3rd party] unless marked):
 *  - A, general freight (and any lift whose class is not known): no single piece over 25 % of the rated
 *    load, the hand truck or pallet truck that carries it included [S, 3rd party].
 *  - B, motor vehicles only: a crate is not a motor vehicle, so the class A one-piece rule is applied
 *    [PRACTICE]; the lift owner may allow more.
 *  - C1, industrial truck carried with the load: truck + load ≤ rated load [S, 3rd party].
 *  - C2, forklift loading, truck not carried: a one-piece load up to the rated load; the platform takes
 *    150 % of the rated load statically during loading, so load + truck ≤ 1.5 × rated is also checked
 *    (the whole truck's mass is counted: safe side) [S, 3rd party]/[MEM].
 *  - C3, heavy concentrated loads by other means: load + any equipment carried ≤ rated load [MEM]; the
 *    car's design for concentrated loads must be confirmed with the lift's owner.
 */
import { bestFit, type Clearance } from './fit.ts';
import { fmt, isKnownNonNegative, isKnownPositive } from './known.ts';
import { carryOrientations, type CarryOrientation } from './orientations.ts';
import type { AccessCrate, AccessFinding, AccessLift, LoadingClass, MaybeNumber } from './types.ts';

function liftClearances(lift: AccessLift) {
  return (o: CarryOrientation): Clearance[] => {
    // The footprint may lie either way in the car: take the better assignment, keep it one clearance
    // pair so that an unknown car size stays unknown.
    const carL = lift.carLengthMm;
    const carW = lift.carWidthMm;
    let alongLimit: MaybeNumber = carL;
    let acrossLimit: MaybeNumber = carW;
    if (isKnownPositive(carL) && isKnownPositive(carW)) {
      const a = Math.min(carL - o.alongMm, carW - o.acrossMm);
      const b = Math.min(carW - o.alongMm, carL - o.acrossMm);
      if (b > a) {
        alongLimit = carW;
        acrossLimit = carL;
      }
    }
    return [
      { label: 'lift door width', limitMm: lift.doorWidthMm, neededMm: o.acrossMm },
      { label: 'lift door height', limitMm: lift.doorHeightMm, neededMm: o.verticalMm },
      { label: 'lift car height', limitMm: lift.carHeightMm, neededMm: o.verticalMm },
      { label: 'lift car depth', limitMm: alongLimit, neededMm: o.alongMm },
      { label: 'lift car width', limitMm: acrossLimit, neededMm: o.acrossMm },
    ];
  };
}

/** Size finding: door and car. Crate sizes must already be validated. */
export function checkLiftSize(crate: AccessCrate, lift: AccessLift): AccessFinding {
  const where = lift.name?.trim() || 'freight lift';
  const fit = bestFit(carryOrientations(crate.lengthMm, crate.widthMm, crate.heightMm, crate.mayTilt), liftClearances(lift));
  const base = { check: 'lift' as const, where };
  if (fit.status === 'unknown') {
    return { ...base, verdict: 'unknown', reason: `not checked: ${fit.unknown.join(', ')} unknown (${where})` };
  }
  const margin = fit.marginMm ?? 0;
  const t = fit.tightest;
  const ratio = t && typeof t.limitMm === 'number' ? t.limitMm / t.neededMm - 1 : undefined;
  const o = fit.orientation;
  if (fit.status === 'pass') {
    return {
      ...base,
      verdict: 'pass',
      reason: `${where}: enters ${o.kind === 'upright' ? 'upright' : 'tilted on its side'} and fits the car (no diagonal assumed); ${fmt(margin)} mm to spare on the ${t?.label ?? 'lift'}`,
      margin,
      marginUnit: 'mm',
      marginRatio: ratio,
      orientation: o.kind,
    };
  }
  return {
    ...base,
    verdict: 'fail',
    reason: `${where}: does not go in${crate.mayTilt ? ', even tilted' : ' upright (tilting not allowed)'}; ${fmt(-margin)} mm over the ${t?.label ?? 'lift'} of ${fmt(Number(t?.limitMm ?? 0))} mm (no diagonal placement assumed)`,
    margin,
    marginUnit: 'mm',
    marginRatio: ratio,
    orientation: o.kind,
  };
}

/** A limit on a mass, for the load finding. */
interface MassLimit {
  label: string;
  limitKg: number;
  loadKg: number;
}

function classLimits(cls: LoadingClass, rated: number, gross: number, equipment: number): MassLimit[] {
  switch (cls) {
    case 'A':
    case 'B':
      return [{ label: 'one-piece limit (25 % of rated load, equipment included)', limitKg: 0.25 * rated, loadKg: gross + equipment }];
    case 'C1':
      return [{ label: 'rated load (load and truck together)', limitKg: rated, loadKg: gross + equipment }];
    case 'C2':
      return [
        { label: 'rated load (one-piece load; truck leaves the car)', limitKg: rated, loadKg: gross },
        { label: 'loading limit (150 % of rated load, load and truck)', limitKg: 1.5 * rated, loadKg: gross + equipment },
      ];
    case 'C3':
      return [{ label: 'rated load (load and equipment carried)', limitKg: rated, loadKg: gross + equipment }];
  }
}

/** Load finding by loading class. */
export function checkLiftLoad(crate: AccessCrate, lift: AccessLift, handlingEquipmentKg: MaybeNumber): AccessFinding {
  const where = lift.name?.trim() || 'freight lift';
  const base = { check: 'lift' as const, where };
  if (!isKnownPositive(lift.ratedLoadKg)) {
    return { ...base, verdict: 'unknown', reason: `not checked: lift rated load unknown (${where})` };
  }
  if (!isKnownPositive(crate.grossKg)) {
    return { ...base, verdict: 'unknown', reason: `not checked against the lift: crate gross mass unknown` };
  }
  const cls: LoadingClass = lift.loadingClass ?? 'A';
  const classNote = !lift.loadingClass
    ? 'loading class unknown: treated as class A'
    : cls === 'B'
      ? 'class B is for motor vehicles: a crate is held to the class A one-piece rule'
      : `class ${cls}`;
  const rated = lift.ratedLoadKg;
  const gross = crate.grossKg;
  const eqKnown = isKnownNonNegative(handlingEquipmentKg);
  const eq = eqKnown ? handlingEquipmentKg : 0;
  const limits = classLimits(cls, rated, gross, eq);
  // Worst limit with the equipment counted as 0 kg when unknown: if that fails, it fails for sure.
  let worst = limits[0];
  for (const l of limits) if (l.limitKg - l.loadKg < worst.limitKg - worst.loadKg) worst = l;
  const margin = worst.limitKg - worst.loadKg;
  const ratio = worst.limitKg / worst.loadKg - 1;
  const figures = `${fmt(worst.loadKg)} kg against the ${worst.label} of ${fmt(worst.limitKg)} kg (rated ${fmt(rated)} kg; ${classNote})`;
  if (margin < 0) {
    return { ...base, verdict: 'fail', reason: `${where}: too heavy: ${figures}`, margin, marginUnit: 'kg', marginRatio: ratio };
  }
  // Every class counts the equipment in at least one limit, so an unknown equipment mass leaves the
  // check open unless the crate alone already fails.
  if (!eqKnown) {
    return {
      ...base,
      verdict: 'unknown',
      reason: `not checked: handling equipment mass unknown; it counts against the lift (${classNote}); the crate alone is ${fmt(gross)} kg`,
    };
  }
  return { ...base, verdict: 'pass', reason: `${where}: ${figures}`, margin, marginUnit: 'kg', marginRatio: ratio };
}
