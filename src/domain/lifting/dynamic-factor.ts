/**
 * Dynamic amplification of the hook load: dynamic hook load = static hook load × DAF.
 *
 * Default: 1.10, GL Noble Denton 0027/ND (Rev 11) Table 5-1, onshore single-crane lifts of 3 to
 * 100 t (items under 3 t are taken as 3 t) [PUB-2]. It is a production setting: whoever changes it
 * names the source, and the source travels with every result.
 */

export interface DynamicFactor {
  value: number;
  source: string;
}

export const DEFAULT_DYNAMIC_FACTOR: DynamicFactor = {
  value: 1.1,
  source: 'GL Noble Denton 0027/ND Rev 11, Table 5-1: onshore single-crane lifts 3–100 t, DAF 1.10 [PUB-2]',
};

/**
 * EN 13001-2 hoisting factor φ2 = φ2,min + β2 · v_h (v_h the hoisting speed, m/s), with (β2, φ2,min)
 * by hoisting class HC1 (0.17, 1.05), HC2 (0.34, 1.10), HC3 (0.51, 1.15), HC4 (0.68, 1.20).
 * From memory [MEM], not checked against the standard: offered as an alternative, labelled so.
 */
export function en13001Phi2(input: { hoistingClass: 'HC1' | 'HC2' | 'HC3' | 'HC4'; hoistingSpeedMPerS: number }): DynamicFactor {
  const table = { HC1: [0.17, 1.05], HC2: [0.34, 1.1], HC3: [0.51, 1.15], HC4: [0.68, 1.2] } as const;
  const row = table[input.hoistingClass];
  if (!row) throw new RangeError(`Unknown hoisting class "${String(input.hoistingClass)}" (HC1–HC4).`);
  if (!(Number.isFinite(input.hoistingSpeedMPerS) && input.hoistingSpeedMPerS >= 0)) {
    throw new RangeError(`Hoisting speed must be a finite number of m/s not below 0 (got ${String(input.hoistingSpeedMPerS)}).`);
  }
  return {
    value: row[1] + row[0] * input.hoistingSpeedMPerS,
    source: `EN 13001-2 φ2 for ${input.hoistingClass} at ${input.hoistingSpeedMPerS} m/s [MEM: from memory, not verified]`,
  };
}

/** Why a dynamic factor cannot be used, or null. */
export function dynamicFactorProblem(df: DynamicFactor | undefined): string | null {
  if (!df) return 'No dynamic factor given.';
  if (!(typeof df.value === 'number' && Number.isFinite(df.value) && df.value >= 1)) return `Dynamic factor must be a number of at least 1 (got ${String(df.value)}).`;
  if (!df.source || !df.source.trim()) return 'Dynamic factor has no source: name where the value comes from.';
  return null;
}
