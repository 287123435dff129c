/**
 * Handling equipment limits.
 *
 * Largest ramp gradient each kind of truck is commonly allowed to climb loaded, in percent
 * (REFERENCES §4.5 [S, 3rd party]): hand pallet truck 3 %, electric pallet truck 7 %, electric lift
 * truck 10 %, gas forklift 15 %. The maker's figure for the actual truck prevails (maxGradientPct).
 */
import type { HandlingEquipment, HandlingKind } from './types.ts';
import { isKnownPositive } from './known.ts';

export const RAMP_LIMIT_PCT: Readonly<Record<HandlingKind, number>> = {
  'hand-pallet-truck': 3,
  'electric-pallet-truck': 7,
  'electric-lift-truck': 10,
  'gas-forklift': 15,
};

export const HANDLING_LABEL: Readonly<Record<HandlingKind, string>> = {
  'hand-pallet-truck': 'hand pallet truck',
  'electric-pallet-truck': 'electric pallet truck',
  'electric-lift-truck': 'electric lift truck',
  'gas-forklift': 'gas forklift',
};

/** The gradient limit of one piece of equipment, %. */
export function rampLimitPct(e: HandlingEquipment): number {
  return isKnownPositive(e.maxGradientPct) ? e.maxGradientPct : RAMP_LIMIT_PCT[e.kind];
}

/** True for trucks that lift a load off a road-level bed (forklifts, lift trucks). */
export function isForklift(kind: HandlingKind): boolean {
  return kind === 'electric-lift-truck' || kind === 'gas-forklift';
}
