/**
 * Door check: does the crate pass a door on the route?
 *
 * Geometry (our rule, stated so that a reviewer can check it): a box carried straight through a
 * rectangular opening passes when the face it presents, the cross-section perpendicular to the way,
 * fits the opening: across ≤ clear width and vertical ≤ clear height. Upright, the crate's height
 * stands vertical and its longer plan dimension runs along the way, so it presents
 * min(length, width) × height. When it may tilt it may present any face, and the best face is its two
 * smallest dimensions (either way up). Doors are checked one by one with the crate carried straight.
 *
 * Limits of the rule, all to be checked on site:
 *  - corners, turns and corridors after a door are NOT modelled: a long crate that passes a door may
 *    still not turn the corner behind it (the swept path needs the corridor widths and the turn);
 *  - a crate rotated in the plane of the door (a diagonal through the opening) is not assumed, which
 *    errs on the safe side;
 *  - the height the crate is carried at (pallet truck forks, dolly) is not added: give the crate's
 *    height with its carrier, or the door's clear height less the carrier's lift;
 *  - the door's measured clear opening is used, never the nominal size (REFERENCES §4.5 [CP]).
 */
import { bestFit, type Clearance } from './fit.ts';
import { fmt } from './known.ts';
import { carryOrientations, type CarryOrientation } from './orientations.ts';
import type { AccessCrate, AccessDoor, AccessFinding } from './types.ts';

export function doorClearances(door: AccessDoor) {
  return (o: CarryOrientation): Clearance[] => [
    { label: 'door width', limitMm: door.widthMm, neededMm: o.acrossMm },
    { label: 'door height', limitMm: door.heightMm, neededMm: o.verticalMm },
  ];
}

/** The door finding for one door. The crate's sizes must already be validated (positive, finite). */
export function checkDoor(crate: AccessCrate, door: AccessDoor, index: number): AccessFinding {
  const where = door.name?.trim() || `door ${index + 1}`;
  const fit = bestFit(carryOrientations(crate.lengthMm, crate.widthMm, crate.heightMm, crate.mayTilt), doorClearances(door));
  const o = fit.orientation;
  const face = `${fmt(o.acrossMm)} wide × ${fmt(o.verticalMm)} high`;
  const base = { check: 'door' as const, where };
  if (fit.status === 'unknown') {
    return { ...base, verdict: 'unknown', reason: `not checked: ${fit.unknown.join(' and ')} unknown (${where})` };
  }
  const margin = fit.marginMm ?? 0;
  const limit = fit.tightest?.label ?? 'door';
  const ratio = fit.tightest && typeof fit.tightest.limitMm === 'number' ? fit.tightest.limitMm / fit.tightest.neededMm - 1 : undefined;
  if (fit.status === 'pass') {
    const how = o.kind === 'upright' ? 'upright' : 'tilted on its side';
    return {
      ...base,
      verdict: 'pass',
      reason: `${where}: passes ${how}, presenting ${face}; ${fmt(margin)} mm to spare on the ${limit}`,
      margin,
      marginUnit: 'mm',
      marginRatio: ratio,
      orientation: o.kind,
    };
  }
  const tiltNote = crate.mayTilt ? 'even tilted' : 'upright (this way up; tilting not allowed)';
  return {
    ...base,
    verdict: 'fail',
    reason: `${where}: does not pass ${tiltNote}; best face ${face} is ${fmt(-margin)} mm over the ${limit} of ${fmt(fit.tightest?.limitMm ?? 0)} mm`,
    margin,
    marginUnit: 'mm',
    marginRatio: ratio,
    orientation: o.kind,
  };
}
