/**
 * EN 13414-1:2003 (steel wire rope slings) Table 4 leg factors for multi-leg slings, the "uniform
 * load" method [PUB-2, read in makers' sheets quoting the standard]: the working load limit of the
 * assembly is the single-leg WLL times a factor set by the number of legs and the band of the angle
 * β between each leg and the vertical:
 *   1 leg 1.0; 2 legs 1.4 (β ≤ 45°), 1.0 (45° < β ≤ 60°); 3 and 4 legs 2.1 (β ≤ 45°), 1.5 (45° < β ≤ 60°).
 * For 3 and 4 legs this assumes that three legs share the load, which holds for symmetric loads only.
 * Ballast offers it only as an explicit, labelled choice; its default is that two legs carry.
 */

export const EN13414_LABEL = 'EN 13414-1 Table 4 leg factors (uniform load method: symmetric loads only)';

/**
 * The EN 13414-1 factor, or null with a reason where the standard gives none (β over 60° from the
 * vertical, i.e. below 30° from the horizontal, or more than four legs).
 */
export function en13414LegFactor(input: { legs: number; betaFromVerticalDeg: number }): { factor: number | null; reason: string } {
  const { legs, betaFromVerticalDeg: beta } = input;
  if (!Number.isInteger(legs) || legs < 1) return { factor: null, reason: `Number of legs must be a whole number of at least 1 (got ${String(legs)}).` };
  if (!Number.isFinite(beta) || beta < 0) return { factor: null, reason: `Leg angle from vertical must be a finite number not below 0 (got ${String(beta)}).` };
  if (legs > 4) return { factor: null, reason: `EN 13414-1 gives no leg factor for ${legs} legs.` };
  if (legs === 1) return beta <= 1e-9 ? { factor: 1, reason: '1 leg, vertical: 1.0.' } : { factor: null, reason: 'A single leg hangs vertically.' };
  if (beta > 60 + 1e-9) return { factor: null, reason: `β ${beta.toFixed(1)}° from vertical is over 60°: not permitted.` };
  const low = beta <= 45 + 1e-9;
  if (legs === 2) return { factor: low ? 1.4 : 1.0, reason: `2 legs, β ${low ? '≤ 45°' : '45°–60°'}: ${low ? '1.4' : '1.0'}.` };
  return { factor: low ? 2.1 : 1.5, reason: `${legs} legs, β ${low ? '≤ 45°' : '45°–60°'}: ${low ? '2.1' : '1.5'} (three legs share: symmetric loads only).` };
}
