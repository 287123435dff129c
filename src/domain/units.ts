/**
 * Units used across the core. Internally everything is SI-ish engineering units:
 * millimetres for lengths and positions, kilograms for masses, newtons for forces,
 * degrees for angles at the boundary. Names carry the unit where a number crosses a
 * boundary (massKg, lengthMm, angleDeg). Conversion happens only for display.
 */

/** Standard gravity, m/s² (CGPM 1901; ISO 80000-3). */
export const STANDARD_GRAVITY_M_PER_S2 = 9.80665;

/** Exact by definition (international yard and pound agreement, 1959). */
export const MM_PER_INCH = 25.4;
export const KG_PER_POUND = 0.45359237;

/** Pound-force in newtons: a pound mass under standard gravity (exact from the definitions above). */
export const N_PER_LBF = KG_PER_POUND * STANDARD_GRAVITY_M_PER_S2;
/** Pound-force per square foot in kN/m² (a foot is 304.8 mm exactly). */
export const KN_PER_M2_PER_PSF = N_PER_LBF / (0.3048 * 0.3048) / 1000;

export type LengthUnit = 'mm' | 'cm' | 'm' | 'in' | 'ft';
/** Floor ratings: kN/m² (metric) or pounds-force per square foot (imperial). */
export type PressureUnit = 'kN/m²' | 'psf';
/** Point loads: kN (metric) or pounds-force (imperial). */
export type ForceUnit = 'kN' | 'lbf';
export type MassUnit = 'kg' | 'g' | 'lb' | 't';
export type UnitSystem = 'metric' | 'imperial';

const MM_PER: Record<LengthUnit, number> = { mm: 1, cm: 10, m: 1000, in: MM_PER_INCH, ft: 12 * MM_PER_INCH };
const KG_PER: Record<MassUnit, number> = { kg: 1, g: 0.001, lb: KG_PER_POUND, t: 1000 };

export function toMm(value: number, unit: LengthUnit): number {
  return value * MM_PER[unit];
}
export function fromMm(valueMm: number, unit: LengthUnit): number {
  return valueMm / MM_PER[unit];
}
export function toKg(value: number, unit: MassUnit): number {
  return value * KG_PER[unit];
}
export function fromKg(valueKg: number, unit: MassUnit): number {
  return valueKg / KG_PER[unit];
}

export function toKnPerM2(value: number, unit: PressureUnit): number {
  return unit === 'psf' ? value * KN_PER_M2_PER_PSF : value;
}
export function fromKnPerM2(valueKnPerM2: number, unit: PressureUnit): number {
  return unit === 'psf' ? valueKnPerM2 / KN_PER_M2_PER_PSF : valueKnPerM2;
}
export function toKn(value: number, unit: ForceUnit): number {
  return unit === 'lbf' ? (value * N_PER_LBF) / 1000 : value;
}
export function fromKn(valueKn: number, unit: ForceUnit): number {
  return unit === 'lbf' ? (valueKn * 1000) / N_PER_LBF : valueKn;
}

/** Weight force in newtons of a mass in kilograms under standard gravity. */
export function weightN(massKg: number): number {
  return massKg * STANDARD_GRAVITY_M_PER_S2;
}

export interface DisplayQuantity {
  value: number;
  unit: string;
}

/** The display unit for lengths and masses in each unit system. */
export function displayLength(valueMm: number, system: UnitSystem): DisplayQuantity {
  return system === 'imperial' ? { value: fromMm(valueMm, 'in'), unit: 'in' } : { value: valueMm, unit: 'mm' };
}
export function displayMass(valueKg: number, system: UnitSystem): DisplayQuantity {
  return system === 'imperial' ? { value: fromKg(valueKg, 'lb'), unit: 'lb' } : { value: valueKg, unit: 'kg' };
}

/** Formats a length for people, e.g. "1,250 mm" or "49.2 in". */
export function formatLength(valueMm: number, system: UnitSystem, digits?: number): string {
  const q = displayLength(valueMm, system);
  return `${formatNumber(q.value, digits ?? (system === 'imperial' ? 1 : 0))} ${q.unit}`;
}
/** Formats a mass for people, e.g. "418.5 kg" or "922.6 lb". */
export function formatMass(valueKg: number, system: UnitSystem, digits = 1): string {
  const q = displayMass(valueKg, system);
  return `${formatNumber(q.value, digits)} ${q.unit}`;
}
/** Formats a floor rating held in kN/m², e.g. "5.0 kN/m²" or "104 psf". */
export function formatPressure(valueKnPerM2: number, system: UnitSystem): string {
  return system === 'imperial' ? `${formatNumber(fromKnPerM2(valueKnPerM2, 'psf'), 0)} psf` : `${formatNumber(valueKnPerM2, 1)} kN/m²`;
}
const numberFormats = new Map<number, Intl.NumberFormat>();

/**
 * A number for people, en-GB grouping, `digits` decimals; '—' when not finite. One formatter per number of
 * digits, made once: `toLocaleString` with options builds a new one on every call, which made formatting
 * most of a venue manifest's time (the load benchmark).
 */
export function formatNumber(value: number, digits = 0): string {
  if (!Number.isFinite(value)) return '—';
  let f = numberFormats.get(digits);
  if (!f) {
    f = new Intl.NumberFormat('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits });
    numberFormats.set(digits, f);
  }
  return f.format(value);
}
