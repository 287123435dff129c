/**
 * Hitch factors: the fraction (or multiple) of a sling's vertical rating that it may carry in a hitch
 * [PUB-2, sling makers' guidance quoting ASME B30.9 / EN 1492 / EN 818 practice]:
 * - vertical: 1.0;
 * - choker: about 0.75 for wire rope (choke angle 120° or more), 0.8 for web slings, roundslings and
 *   chain; below a 120° choke angle makers reduce further, and Ballast refuses to guess;
 * - basket: 2 × vertical with vertical legs, 2 × vertical × sin θ with legs at θ from horizontal.
 * A maker's own figures for a sling override these defaults.
 */

export type SlingType = 'wire-rope' | 'web' | 'roundsling' | 'chain';
export type Hitch = 'vertical' | 'choker' | 'basket';

/** Default choker factors by sling type. */
export const CHOKER_FACTORS: Record<SlingType, number> = { 'wire-rope': 0.75, web: 0.8, roundsling: 0.8, chain: 0.8 };

/** Smallest choke angle the default choker factors cover, degrees. */
export const MIN_CHOKE_ANGLE_DEG = 120;

export interface HitchFactorResult {
  /** Multiplier on the vertical rating; null where Ballast will not give one. */
  factor: number | null;
  reason: string;
}

/**
 * The hitch factor for a sling. For a basket, `legAngleFromHorizontalDeg` is the angle of the two
 * parts from the horizontal (90° = vertical parts), and the factor rates the basket against the
 * vertical load it carries. `makerFactors` are the sling's own figures.
 */
export function hitchFactor(input: {
  slingType: SlingType;
  hitch: Hitch;
  legAngleFromHorizontalDeg?: number;
  chokeAngleDeg?: number;
  makerFactors?: { choker?: number; basket?: number };
}): HitchFactorResult {
  const { slingType, hitch } = input;
  if (!(slingType in CHOKER_FACTORS)) return { factor: null, reason: `Unknown sling type "${String(slingType)}".` };
  if (hitch === 'vertical') return { factor: 1, reason: 'Vertical hitch: 1.0 × vertical rating.' };
  if (hitch === 'choker') {
    if (input.chokeAngleDeg !== undefined && !(input.chokeAngleDeg >= MIN_CHOKE_ANGLE_DEG)) {
      return { factor: null, reason: `Choke angle ${String(input.chokeAngleDeg)}° is below ${MIN_CHOKE_ANGLE_DEG}°: use the maker's reduced rating; Ballast does not guess it.` };
    }
    const maker = input.makerFactors?.choker;
    if (maker !== undefined) return { factor: maker, reason: `Choker: maker's factor ${maker}.` };
    const f = CHOKER_FACTORS[slingType];
    return { factor: f, reason: `Choker (${slingType}, choke angle ≥ ${MIN_CHOKE_ANGLE_DEG}°): ${f} × vertical rating.` };
  }
  if (hitch === 'basket') {
    const base = input.makerFactors?.basket ?? 2;
    const angle = input.legAngleFromHorizontalDeg ?? 90;
    if (!(angle > 0 && angle <= 90 + 1e-9)) return { factor: null, reason: `Basket leg angle must be above 0° and at most 90° (got ${String(angle)}).` };
    const f = base * Math.sin(Math.min(angle, 90) * (Math.PI / 180));
    return { factor: f, reason: `Basket: ${base} × vertical rating${angle < 90 ? ` × sin ${angle.toFixed(1)}°` : ' (vertical parts)'}.` };
  }
  return { factor: null, reason: `Unknown hitch "${String(hitch)}".` };
}
