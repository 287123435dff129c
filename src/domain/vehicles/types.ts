/**
 * Vehicles and containers. Load-space frame as in the packing core: x along the length from the front
 * wall (x = 0) to the doors (x = lengthMm), y across from one side wall, z up from the floor; mm, kg.
 * Axle positions use the same x (negative in front of the load space).
 */

export type VehicleKind = 'container' | 'semi-trailer' | 'rigid-truck' | 'air-pallet' | 'custom';

export interface AxleGroup {
  name: string;
  /** Position along the load space, mm (negative in front of the front wall). */
  positionMm: number;
  /** Load on this group with the vehicle empty, kg. */
  unladenKg: number;
  /** Largest permitted load on this group, kg. */
  permittedKg: number;
  /** Least load it must keep (e.g. a steering axle), kg; optional. */
  minimumKg?: number;
}

/**
 * Road vehicle supports, two groups so that their loads follow from statics alone:
 * a rigid truck on its front and rear axle groups; a semi-trailer on the kingpin (fifth wheel) and
 * its own axle group.
 */
export type AxleLayout =
  | { kind: 'rigid'; front: AxleGroup; rear: AxleGroup; /** Least share of the gross on the front axle (steering), 0–1. */ minFrontShare?: number }
  | { kind: 'semi-trailer'; kingpin: AxleGroup; axles: AxleGroup };

export interface Vehicle {
  id: string;
  name: string;
  kind: VehicleKind;
  /** Usable inside length, width, height, mm. */
  lengthMm: number;
  widthMm: number;
  heightMm: number;
  /** Clear door opening, mm (a 40' high cube's door is lower than its inside). */
  doorWidthMm?: number;
  doorHeightMm?: number;
  maxPayloadKg: number;
  /** Largest gross of the unit itself (container: plated max gross), kg. */
  maxGrossKg?: number;
  tareKg?: number;
  /** Load bed height above the road, mm (for the dock check). */
  bedHeightMm?: number;
  tailLiftCapacityKg?: number | null;
  axles?: AxleLayout;
  /** Largest offset of the load's CoG from the middle of the floor, mm (along and across). */
  cogLimits?: { alongMm?: number; acrossMm?: number };
  /** Where each figure comes from, with its tag. */
  source: string;
}
