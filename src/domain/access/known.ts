import type { MaybeNumber } from './types.ts';

/** True when a value is a usable positive measure (not null, undefined, NaN, infinite, zero or below). */
export function isKnownPositive(v: MaybeNumber): v is number {
  return typeof v === 'number' && Number.isFinite(v) && v > 0;
}

/** True when a value is a usable number at or above zero (a mass of equipment may be 0 kg). */
export function isKnownNonNegative(v: MaybeNumber): v is number {
  return typeof v === 'number' && Number.isFinite(v) && v >= 0;
}

const formats = new Map<number, Intl.NumberFormat>();

/**
 * Rounds for messages: whole millimetres and kilograms, two decimals for pressures. One formatter per
 * number of digits, made once: `toLocaleString` with options builds a new one on every call, which made
 * formatting most of a venue manifest's time (the load benchmark).
 */
export function fmt(v: number, digits = 0): string {
  let f = formats.get(digits);
  if (!f) {
    f = new Intl.NumberFormat('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits });
    formats.set(digits, f);
  }
  return f.format(v);
}
