/**
 * Shapes of the venue access check. Lengths in millimetres, masses in kilograms, floor ratings in
 * kN/m², point-load ratings in kN, gradients in percent (rise / run × 100).
 *
 * The signature declares the required numbers as `number`; here they also accept `null` or
 * `undefined` (a wider input type, so every caller of the signature still compiles). A missing,
 * non-finite or non-positive value means "not known" and gives an 'unknown' finding with the reason,
 * never a pass.
 */

/** What each finding checks. The first three are the issue's; the rest are the further findings. */
export type AccessCheck = 'door' | 'lift' | 'floor' | 'dock' | 'ramp' | 'point-load';

export type AccessVerdict = 'pass' | 'fail' | 'unknown';

/** A number that may not be known yet (null, undefined or NaN mean unknown). */
export type MaybeNumber = number | null | undefined;

/** Handling equipment that moves a crate on the level and up ramps. */
export type HandlingKind = 'hand-pallet-truck' | 'electric-pallet-truck' | 'electric-lift-truck' | 'gas-forklift';

/** ASME A17.1 freight loading classes (see lift.ts). */
export type LoadingClass = 'A' | 'B' | 'C1' | 'C2' | 'C3';

export interface AccessCrate {
  lengthMm: number;
  widthMm: number;
  heightMm: number;
  grossKg: MaybeNumber;
  /** True when the crate may travel on its side or end (not "this way up"). */
  mayTilt: boolean;
  /** Optional id and name, carried into the matrix. */
  id?: string;
  name?: string;
  /**
   * True for a case people carry (no truck): the ramp and street-level checks do not ask for
   * equipment, and no equipment mass counts against a lift. Manual handling limits are the lifting
   * core's job, not this check's.
   */
  carriedByHand?: boolean;
  /**
   * What the crate stands on, for the point-load check. Skids run along the crate's length, the full
   * length; castors and feet are point contacts.
   */
  supports?: CrateSupports;
}

export type CrateSupports =
  | { kind: 'skids'; count: number; widthMm: number; lengthMm?: number }
  | { kind: 'castors' | 'feet'; count: number; contactDiameterMm?: number };

export interface AccessDoor {
  /** Measured clear opening (never the nominal door size: REFERENCES §4.5 [CP]). */
  widthMm: MaybeNumber;
  heightMm: MaybeNumber;
  /** Name on the route, e.g. "corridor door B2"; used to name the tightest point. */
  name?: string;
}

export interface AccessLift {
  carLengthMm: MaybeNumber;
  carWidthMm: MaybeNumber;
  carHeightMm: MaybeNumber;
  doorWidthMm: MaybeNumber;
  doorHeightMm: MaybeNumber;
  ratedLoadKg: MaybeNumber;
  /** Unknown class is treated as class A. */
  loadingClass?: LoadingClass | null;
  name?: string;
}

export interface AccessDock {
  /**
   * 'dock': a loading dock at `heightMm` above the road; 'street': goods come off at road level and
   * need a tail lift or a forklift.
   */
  kind?: 'dock' | 'street' | null;
  heightMm?: MaybeNumber;
  /** Reach of the dock leveller above and below the dock, mm (0 when there is none). */
  levellerRangeMm?: MaybeNumber;
}

export interface AccessRamp {
  /** Gradient in percent (rise over horizontal run × 100). */
  gradientPct: MaybeNumber;
  name?: string;
}

export interface HandlingEquipment {
  kind: HandlingKind;
  /** Rated capacity, kg (for a forklift at its rated load centre). */
  capacityKg?: MaybeNumber;
  /** Gradient the maker allows, %; overrides the default for its kind. */
  maxGradientPct?: MaybeNumber;
}

export interface AccessVenue {
  /** Every door on the route from the vehicle to the stage. */
  doors: AccessDoor[];
  lift?: AccessLift | null;
  /** Floor load rating of the route and the stage, kN/m² (the lowest on the route). */
  floorRatingKnPerM2?: MaybeNumber;
  /** Mass of the handling equipment that travels with the crate into a lift (pallet truck), kg. */
  handlingEquipmentKg?: MaybeNumber;
  // ---- further findings: each appears only where its field is present ----
  dock?: AccessDock | null;
  ramps?: AccessRamp[] | null;
  /** Equipment on site (forklift, pallet trucks). */
  equipment?: HandlingEquipment[] | null;
  /** Concentrated-load rating of the floor, kN, over the area below. */
  pointLoadRatingKn?: MaybeNumber;
  /**
   * Side of the square area the concentrated load acts on, mm. EN 1991-1-1 §6.3.1.2 uses a 50 mm
   * square for Q_k unless stated otherwise [MEM]; default 50.
   */
  pointLoadAreaSideMm?: MaybeNumber;
}

/** The vehicle and touring equipment of the leg that delivers to this venue (optional third argument). */
export interface AccessOptions {
  vehicle?: {
    /** Load bed height above the road, mm. */
    bedHeightMm?: MaybeNumber;
    /** Tail lift capacity, kg; null or absent: no tail lift. */
    tailLiftCapacityKg?: MaybeNumber;
  };
  /** Equipment that travels with the production (added to the venue's own). */
  touringEquipment?: HandlingEquipment[];
}

export interface AccessFinding {
  check: AccessCheck;
  verdict: AccessVerdict;
  reason: string;
  /**
   * How much room is left, in `marginUnit` (negative when it fails). For a door: the smaller of the
   * width and height clearances in mm. Absent when unknown.
   */
  margin?: number;
  marginUnit?: 'mm' | 'kg' | 'kN/m²' | 'kN' | '%';
  /**
   * Dimensionless margin: capacity / demand − 1 (0 at the limit, negative on fail), so that findings
   * of different kinds can be ranked to name the tightest point.
   */
  marginRatio?: number;
  /** The door, lift or ramp concerned, e.g. "corridor door B2". */
  where?: string;
  /** How the crate passes, where that matters: 'upright' or 'tilted'. */
  orientation?: 'upright' | 'tilted';
}

export interface AccessResult {
  verdict: AccessVerdict;
  findings: AccessFinding[];
}
