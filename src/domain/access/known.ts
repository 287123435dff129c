import type { MaybeNumber } from './types.ts';
import { formatNumber } from '../units.ts';

/** True when a value is a usable positive measure (not null, undefined, NaN, infinite, zero or below). */
export function isKnownPositive(v: MaybeNumber): v is number {
  return typeof v === 'number' && Number.isFinite(v) && v > 0;
}

/** True when a value is a usable number at or above zero (a mass of equipment may be 0 kg). */
export function isKnownNonNegative(v: MaybeNumber): v is number {
  return typeof v === 'number' && Number.isFinite(v) && v >= 0;
}

/** Rounds for messages: whole millimetres and kilograms, two decimals for pressures. */
export function fmt(v: number, digits = 0): string {
  return formatNumber(v, digits);
}
