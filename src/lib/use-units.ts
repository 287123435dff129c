import { useMemo } from 'react';
import { formatLength, formatMass, type ForceUnit, type PressureUnit, type UnitSystem } from '@domain/units.ts';
import { useSessionUser } from './session.ts';

export interface Units {
  /** The signed-in person's choice; metric when nobody is signed in. */
  system: UnitSystem;
  /** Display unit for lengths: `mm` or `in`. */
  lengthUnit: 'mm' | 'in';
  /** Display unit for masses: `kg` or `lb`. */
  massUnit: 'kg' | 'lb';
  /** Display unit for floor ratings: `kN/m²` or `psf`. */
  pressureUnit: PressureUnit;
  /** Display unit for point loads: `kN` or `lbf`. */
  forceUnit: ForceUnit;
  /** A length held in millimetres, for people, e.g. "1,250 mm" or "49.2 in". */
  formatLength: (lengthMm: number, digits?: number) => string;
  /** A mass held in kilograms, for people, e.g. "418.5 kg" or "922.6 lb". */
  formatMass: (massKg: number, digits?: number) => string;
}

/**
 * The units every screen shows numbers in. Data stays in mm and kg everywhere; this converts
 * for display only, following the per-user preference set on the account page.
 */
export function useUnits(): Units {
  const system: UnitSystem = useSessionUser()?.units ?? 'metric';
  return useMemo(
    () => ({
      system,
      lengthUnit: system === 'imperial' ? 'in' : 'mm',
      massUnit: system === 'imperial' ? 'lb' : 'kg',
      pressureUnit: system === 'imperial' ? 'psf' : 'kN/m²',
      forceUnit: system === 'imperial' ? 'lbf' : 'kN',
      formatLength: (lengthMm: number, digits?: number) => formatLength(lengthMm, system, digits),
      formatMass: (massKg: number, digits?: number) => formatMass(massKg, system, digits),
    }),
    [system],
  );
}
