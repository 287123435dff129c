/**
 * Estimate of the NIOSH horizontal distance H from the load's depth, for when the crew has not
 * measured it. The manual says H "should be measured", and where it cannot be, "H may be approximated"
 * (Applications Manual for the Revised NIOSH Lifting Equation, NIOSH 94-110, 2021 rev., p. 8,
 * section 1.3.1.1; read in a faithful secondary transcription [PUB-2]):
 *   H = 20 + W/2 for V ≥ 25 cm,   H = 25 + W/2 for V < 25 cm,
 * W being the width of the load in the sagittal plane (its depth away from the body), cm.
 * The result is always flagged as an estimate so that the screens and the PDF can say so.
 */
export interface HandDistanceEstimate {
  hCm: number;
  estimated: true;
  basis: string;
}

export function estimateHandDistanceCm(input: { loadDepthCm: number; vCm: number }): HandDistanceEstimate {
  const { loadDepthCm, vCm } = input;
  if (!Number.isFinite(loadDepthCm) || loadDepthCm < 0) {
    throw new RangeError(`Load depth must be a finite number of centimetres not below 0 (got ${String(loadDepthCm)}).`);
  }
  if (!Number.isFinite(vCm) || vCm < 0) {
    throw new RangeError(`Hand height V must be a finite number of centimetres not below 0 (got ${String(vCm)}).`);
  }
  const near = vCm >= 25 ? 20 : 25;
  return {
    hCm: near + loadDepthCm / 2,
    estimated: true,
    basis:
      `Estimate, not a measurement: H = ${near} + W/2 with W = ${loadDepthCm} cm load depth at V ${vCm >= 25 ? '≥' : '<'} 25 cm ` +
      '(NIOSH Applications Manual, p. 8: H should be measured; where it cannot be, it may be approximated so).',
  };
}
