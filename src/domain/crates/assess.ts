/**
 * What a packing list says about a designed crate on a leg: tipping (lash or block?) and ISPM 15;
 * and the crate's shape for the venue access check.
 */
import type { AccessCrate } from '../access/types.ts';
import { ispm15Need, type Ispm15Need } from './ispm15.ts';
import { ROAD_1G, tippingCheck, type AccelerationProfile, type RideOrientation, type TippingResult } from './tipping.ts';
import type { CrateDesign } from './types.ts';

export interface CrateLegAssessment {
  tipping: TippingResult;
  ispm15: Ispm15Need;
  /** Lines for the packing list, e.g. "Lash or block: tips under 1 g forward". */
  packingListNotes: string[];
}

export function assessCrateForLeg(
  design: CrateDesign,
  leg: { international: boolean; profile?: AccelerationProfile; ride?: RideOrientation; materials?: readonly { code: string; densityKgPerM3: number }[] },
): CrateLegAssessment {
  const tipping = tippingCheck({ lengthMm: design.outerMm[0], widthMm: design.outerMm[1] }, design.cogMm, leg.profile ?? ROAD_1G, leg.ride ?? 'any');
  const ispm15 = ispm15Need(design.makeUp, leg.international, leg.materials);
  const notes: string[] = [];
  if (tipping.tips) notes.push(`LASH OR BLOCK: ${tipping.note}`);
  if (ispm15.needed) notes.push(`ISPM 15: ${ispm15.reason}`);
  if (design.thisWayUp) notes.push('This way up.');
  if (design.fragile) notes.push('Fragile.');
  notes.push(design.stackable ? `May be stacked on: at most ${Math.floor(design.maxLoadOnTopKg)} kg on the lid.` : 'Do not stack on this crate.');
  return { tipping, ispm15, packingListNotes: notes };
}

/** The designed crate as the venue access check sees it (upright footprint, skids as supports). */
export function crateForAccess(design: CrateDesign, id?: string): AccessCrate {
  const s = design.makeUp.skids;
  return {
    id: id ?? design.sectionId,
    lengthMm: design.outerMm[0],
    widthMm: design.outerMm[1],
    heightMm: design.outerMm[2],
    grossKg: design.grossKg,
    mayTilt: !design.thisWayUp,
    supports: s.count > 0 ? { kind: 'skids', count: s.count, widthMm: s.widthMm } : undefined,
  };
}
