/**
 * How a box is carried through an opening: which of its dimensions runs along the way, which lies
 * across the opening and which stands vertical.
 *
 * Rule (documented in door.ts): upright keeps the crate's height vertical, so the cross-section
 * presented to an opening is (the smaller of length and width) × height, with the longer plan
 * dimension along the way. A crate that may tilt may present any face; the best is the two smallest
 * dimensions. We enumerate all six axis permutations rather than sorting, so the same code serves the
 * lift car (where the footprint also matters) and the enumeration can be tested against the sorted rule.
 */
export interface CarryOrientation {
  alongMm: number;
  acrossMm: number;
  verticalMm: number;
  /** 'upright' when the crate's own height stands vertical. */
  kind: 'upright' | 'tilted';
}

/** Every axis-aligned way to carry a crate of these sizes, upright ones first. */
export function carryOrientations(lengthMm: number, widthMm: number, heightMm: number, mayTilt: boolean): CarryOrientation[] {
  const out: CarryOrientation[] = [
    { alongMm: lengthMm, acrossMm: widthMm, verticalMm: heightMm, kind: 'upright' },
    { alongMm: widthMm, acrossMm: lengthMm, verticalMm: heightMm, kind: 'upright' },
  ];
  if (mayTilt) {
    out.push(
      { alongMm: lengthMm, acrossMm: heightMm, verticalMm: widthMm, kind: 'tilted' },
      { alongMm: heightMm, acrossMm: lengthMm, verticalMm: widthMm, kind: 'tilted' },
      { alongMm: widthMm, acrossMm: heightMm, verticalMm: lengthMm, kind: 'tilted' },
      { alongMm: heightMm, acrossMm: widthMm, verticalMm: lengthMm, kind: 'tilted' },
    );
  }
  return out;
}
