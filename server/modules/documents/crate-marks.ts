import type { CrateView } from '../../../src/domain/contracts/crate-loads.ts';
import type { HandlingMark } from '../../pdf/handling-marks.ts';

/**
 * Which ISO 780 handling marks a crate carries, each with the reason, from the crate's flags and the
 * figures the cores computed. ISO 780:2015 wants marks only where they apply (REFERENCES §4.3 [S]).
 */

/** Gross mass from which the centre-of-gravity mark is required (insurers' packaging handbook, REFERENCES §4.3 [S]). */
export const COG_MARK_FROM_KG = 1000;

/**
 * A CoG further than this share of the length or width from the middle is marked whatever the mass: the
 * crate will not hang level from a hook over its middle [PRACTICE].
 */
export const COG_OFF_CENTRE_SHARE = 0.1;

/**
 * A crate that needs mechanical aid and weighs this much or more goes by forklift or crane, so its sling
 * positions are marked; a lighter one goes on a pallet truck or sack truck [PRACTICE].
 */
export const SLING_MARK_FROM_KG = 1000;

export function handlingMarksFor(crate: CrateView): HandlingMark[] {
  const marks: HandlingMark[] = [];
  const f = crate.figures;
  if (crate.thisWayUp) marks.push({ kind: 'this-way-up', caption: 'This way up', reason: 'The crate travels upright: its contents must not be turned over or laid down.' });
  if (crate.fragile) marks.push({ kind: 'fragile', caption: 'Fragile', reason: 'The contents are marked fragile: handle with care.' });
  const machineParts = crate.contents.some((c) => c.partLineId !== null || c.sectionId !== null);
  if (machineParts) {
    // [PRACTICE] bearings, drives, gearing and electrics of a machine are harmed by water and corrode.
    marks.push({ kind: 'keep-dry', caption: 'Keep dry', reason: 'Machine parts (bearings, drives, electrics) inside: keep out of rain and standing water.' });
  }
  if (f.cogMm) {
    const [L, W] = crate.outerMm;
    const offX = Math.abs(f.cogMm[0] - L / 2) / L;
    const offY = Math.abs(f.cogMm[1] - W / 2) / W;
    if (f.grossKg >= COG_MARK_FROM_KG) {
      marks.push({ kind: 'centre-of-gravity', caption: 'Centre of gravity', reason: `Gross ${Math.round(f.grossKg)} kg is ${COG_MARK_FROM_KG} kg or more: mark the CoG on at least two adjoining sides.` });
    } else if (offX > COG_OFF_CENTRE_SHARE || offY > COG_OFF_CENTRE_SHARE) {
      marks.push({ kind: 'centre-of-gravity', caption: 'Centre of gravity', reason: 'The CoG lies well off the middle: mark it on at least two adjoining sides.' });
    }
  }
  if (crate.fragile) marks.push({ kind: 'no-hooks', caption: 'Use no hooks', reason: 'Hand hooks would pierce the case and harm its fragile contents.' });
  if (f.handling.verdict === 'mechanical aid required' && f.grossKg >= SLING_MARK_FROM_KG) {
    marks.push({
      kind: 'sling-here',
      caption: 'Sling here',
      reason: 'Too heavy to handle by hand: lift with a forklift or pallet truck, or with slings under the base either side of the CoG (mark the sling positions on the crate).',
    });
  }
  if (!crate.stackable || crate.maxLoadOnTopKg === 0) {
    marks.push({ kind: 'do-not-stack', caption: 'Do not stack', reason: 'Nothing may stand on this crate.' });
  } else if (crate.maxLoadOnTopKg !== null) {
    const limit = Math.floor(crate.maxLoadOnTopKg);
    marks.push({ kind: 'stacking-limit', caption: `Stacking limit ${limit} kg`, figure: `${limit} kg`, reason: `At most ${limit} kg may stand on the lid.` });
  }
  return marks;
}
