/**
 * Sling angles and leg tensions of a bridle on a symmetric load.
 *
 * Leg tension of an n-leg bridle, each leg at θ from the horizontal: T = (W / n) / sin θ, with
 * sin θ = H / L for sling length L and height H (ASME B30.9 tables as reproduced by sling makers,
 * NAVEDTRA 14080) [PUB-2]. Below 30° from the horizontal a sling is not to be used (NAVEDTRA 14080;
 * B30.9 sheets) [PUB-2]: Ballast refuses it.
 *
 * Three or more legs on a rigid load are statically indeterminate: "it is possible for two of the
 * legs to take practically the full load" (NAVEDTRA 14080) [PUB-2], so Ballast rates them as if only
 * two legs carry unless told otherwise.
 */

/** Smallest sling angle from the horizontal that Ballast accepts, degrees. */
export const MIN_SLING_ANGLE_FROM_HORIZONTAL_DEG = 30;

const DEG = Math.PI / 180;

/** Why an angle is refused, or null when it is acceptable. */
export function slingAngleProblem(legAngleFromHorizontalDeg: number): string | null {
  if (typeof legAngleFromHorizontalDeg !== 'number' || !Number.isFinite(legAngleFromHorizontalDeg)) {
    return `Sling angle missing or not a number (got ${String(legAngleFromHorizontalDeg)}).`;
  }
  if (legAngleFromHorizontalDeg > 90 + 1e-9) return `Sling angle ${legAngleFromHorizontalDeg.toFixed(1)}° from horizontal is over 90°.`;
  if (legAngleFromHorizontalDeg < MIN_SLING_ANGLE_FROM_HORIZONTAL_DEG - 1e-9) {
    return `Sling angle ${legAngleFromHorizontalDeg.toFixed(1)}° from horizontal is below the ${MIN_SLING_ANGLE_FROM_HORIZONTAL_DEG}° minimum: not to be used.`;
  }
  return null;
}

/** Tension factor 1 / sin θ (θ from horizontal). Throws for angles outside (0°, 90°]. */
export function slingAngleFactor(legAngleFromHorizontalDeg: number): number {
  if (!(legAngleFromHorizontalDeg > 0 && legAngleFromHorizontalDeg <= 90 + 1e-9)) {
    throw new RangeError(`Sling angle must be above 0° and at most 90° from horizontal (got ${String(legAngleFromHorizontalDeg)}).`);
  }
  return 1 / Math.sin(Math.min(90, legAngleFromHorizontalDeg) * DEG);
}

/** Sling angle from the horizontal, degrees, from the sling length L and the height H it rises (sin θ = H / L). */
export function slingAngleFromGeometryDeg(input: { slingLengthMm: number; heightMm: number }): number {
  const { slingLengthMm: L, heightMm: H } = input;
  if (!(L > 0) || !(H > 0)) throw new RangeError(`Sling length and height must be above 0 mm (got L ${String(L)}, H ${String(H)}).`);
  if (H > L) throw new RangeError(`Sling of ${L} mm is shorter than the height of ${H} mm it has to span.`);
  return Math.asin(H / L) / DEG;
}

/**
 * Vertical load a sling leg can carry at angle θ from the horizontal: vertical rating × sin θ
 * (= rating × H / L: the "reduction factor" of sling makers' guidance) [PUB-2].
 */
export function slingRatingAtAngleKg(input: { verticalRatingKg: number; legAngleFromHorizontalDeg: number }): number {
  return input.verticalRatingKg / slingAngleFactor(input.legAngleFromHorizontalDeg);
}

/**
 * Tension in each leg of a bridle with equal legs, kg: (W / n_carrying) / sin θ.
 * One or two legs: all carry. Three or more: two carry unless `carryingLegs` says otherwise.
 * Throws, naming the limit, on an angle below 30° from horizontal, or on a bad count.
 */
export function bridleLegTensionKg(input: { loadKg: number; legs: number; legAngleFromHorizontalDeg: number; carryingLegs?: number }): number {
  const { loadKg, legs, legAngleFromHorizontalDeg, carryingLegs } = input;
  if (!Number.isFinite(loadKg) || loadKg < 0) throw new RangeError(`Load must be a finite number of kilograms not below 0 (got ${String(loadKg)}).`);
  if (!Number.isInteger(legs) || legs < 1) throw new RangeError(`Number of legs must be a whole number of at least 1 (got ${String(legs)}).`);
  const problem = slingAngleProblem(legAngleFromHorizontalDeg);
  if (problem) throw new RangeError(problem);
  let carrying = legs >= 3 ? 2 : legs;
  if (carryingLegs !== undefined) {
    if (!Number.isInteger(carryingLegs) || carryingLegs < 1 || carryingLegs > legs) {
      throw new RangeError(`Carrying legs must be a whole number from 1 to ${legs} (got ${String(carryingLegs)}).`);
    }
    carrying = carryingLegs;
  }
  return loadKg / carrying / Math.sin(legAngleFromHorizontalDeg * DEG);
}
