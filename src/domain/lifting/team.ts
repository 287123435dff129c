/**
 * Team handling rule of the UK Manual Handling Operations Regulations 1992 guidance (HSE L23, 2016,
 * Appendix 3, read in a secondary reproduction [PUB-2]): "the capability of a two-person team is
 * two-thirds the sum of their individual capabilities and for a three-person team the capability is
 * half the sum". Nothing is published for four or more ("teams of more than four members are unlikely
 * to work successfully"), so no figure is given there.
 */

/** Largest team the published rule covers. */
export const MAX_TEAM_WITH_PUBLISHED_FACTOR = 3;

/**
 * Capability of a team from each member's individual capability (kg): one person their own, two 2/3 of
 * the sum, three 1/2 of the sum; null for none or four and more (no published factor).
 * Throws, naming the member, on a negative or non-finite capability.
 */
export function teamCapacityKg(individualCapacitiesKg: number[]): number | null {
  individualCapacitiesKg.forEach((c, i) => {
    if (typeof c !== 'number' || !Number.isFinite(c) || c < 0) {
      throw new RangeError(`Team member ${i + 1}: capability must be a finite number of kilograms not below 0 (got ${String(c)}).`);
    }
  });
  const n = individualCapacitiesKg.length;
  const sum = individualCapacitiesKg.reduce((a, b) => a + b, 0);
  if (n === 1) return sum;
  if (n === 2) return (2 / 3) * sum;
  if (n === 3) return 0.5 * sum;
  return null;
}
