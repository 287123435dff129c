/**
 * Lookup tables of the Revised NIOSH Lifting Equation.
 *
 * Source: Waters, Putz-Anderson, Garg, *Applications Manual for the Revised NIOSH Lifting Equation*,
 * DHHS (NIOSH) Publication No. 94-110, 1994, revised September 2021 (public domain).
 * Table 5 (frequency multiplier, p. 15) and Table 7 (coupling multiplier, p. 18), transcribed as printed.
 */

export type Coupling = 'good' | 'fair' | 'poor';

/** Work-duration band of Table 5: ≤ 1 h, > 1 h but ≤ 2 h, > 2 h but ≤ 8 h. */
export type DurationBand = '1h' | '2h' | '8h';

/** Which Table 5 / Table 7 column: the vertical hand height below or at/above 75 cm (30 in). */
export type VerticalColumn = 'low' | 'high';

/** Frequencies (lifts/min) of the rows of Table 5. Below 0.2 the manual sets F = 0.2. */
export const FM_FREQUENCIES = [0.2, 0.5, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15] as const;

/**
 * Table 5, one array per column, in the order of {@link FM_FREQUENCIES}. Above 15 lifts/min every
 * column is 0. Key: duration band, then V column ('low' V < 75 cm, 'high' V ≥ 75 cm, V at the origin).
 */
export const FM_TABLE: Record<DurationBand, Record<VerticalColumn, readonly number[]>> = {
  '1h': {
    low: [1.0, 0.97, 0.94, 0.91, 0.88, 0.84, 0.8, 0.75, 0.7, 0.6, 0.52, 0.45, 0.41, 0.37, 0.0, 0.0, 0.0],
    high: [1.0, 0.97, 0.94, 0.91, 0.88, 0.84, 0.8, 0.75, 0.7, 0.6, 0.52, 0.45, 0.41, 0.37, 0.34, 0.31, 0.28],
  },
  '2h': {
    low: [0.95, 0.92, 0.88, 0.84, 0.79, 0.72, 0.6, 0.5, 0.42, 0.35, 0.3, 0.26, 0.0, 0.0, 0.0, 0.0, 0.0],
    high: [0.95, 0.92, 0.88, 0.84, 0.79, 0.72, 0.6, 0.5, 0.42, 0.35, 0.3, 0.26, 0.23, 0.21, 0.0, 0.0, 0.0],
  },
  '8h': {
    low: [0.85, 0.81, 0.75, 0.65, 0.55, 0.45, 0.35, 0.27, 0.22, 0.18, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0],
    high: [0.85, 0.81, 0.75, 0.65, 0.55, 0.45, 0.35, 0.27, 0.22, 0.18, 0.15, 0.13, 0.0, 0.0, 0.0, 0.0, 0.0],
  },
};

/** Table 7: coupling multiplier by coupling class and V column (V < 75 cm / V ≥ 75 cm). */
export const CM_TABLE: Record<Coupling, Record<VerticalColumn, number>> = {
  good: { low: 1.0, high: 1.0 },
  fair: { low: 0.95, high: 1.0 },
  poor: { low: 0.9, high: 0.9 },
};

/** The Table 5 band for a duration in hours, or null above 8 h (the manual gives no limit there, p. 14). */
export function durationBand(durationHours: number): DurationBand | null {
  if (durationHours <= 1) return '1h';
  if (durationHours <= 2) return '2h';
  if (durationHours <= 8) return '8h';
  return null;
}

/**
 * FM from Table 5 with linear interpolation between the two nearest rows (manual p. 7: "when the
 * measured frequency is not a whole number, the appropriate multiplier must be interpolated").
 *
 * Our reading of two points the manual leaves open, both on the safe side:
 * - F below 0.2 lifts/min counts as 0.2 (manual p. 14: that one is stated);
 * - F above the column's last non-zero row gives 0 ("lifting above the maximum frequency results in
 *   a RWL of 0.0", p. 15), so we never interpolate between a non-zero row and a row of 0.
 */
export function frequencyMultiplier(liftsPerMin: number, band: DurationBand, column: VerticalColumn): number {
  const col = FM_TABLE[band][column];
  const f = Math.max(liftsPerMin, FM_FREQUENCIES[0]);
  let lastNonZero = 0;
  for (let i = 0; i < col.length; i++) if (col[i] > 0) lastNonZero = i;
  if (f > FM_FREQUENCIES[lastNonZero]) return 0;
  for (let i = 0; i < FM_FREQUENCIES.length - 1; i++) {
    const f0 = FM_FREQUENCIES[i];
    const f1 = FM_FREQUENCIES[i + 1];
    if (f >= f0 && f <= f1) {
      const t = (f - f0) / (f1 - f0);
      return col[i] + t * (col[i + 1] - col[i]);
    }
  }
  return col[lastNonZero];
}

/** The highest frequency (lifts/min) with a non-zero FM in a column: the method's maximum there. */
export function maxFrequencyPerMin(band: DurationBand, column: VerticalColumn): number {
  const col = FM_TABLE[band][column];
  let lastNonZero = 0;
  for (let i = 0; i < col.length; i++) if (col[i] > 0) lastNonZero = i;
  return FM_FREQUENCIES[lastNonZero];
}
