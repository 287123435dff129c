/**
 * Public shapes of Ballast's packing engine. Units: millimetres and kilograms.
 * Frame: x along the length from the front wall (x = 0) to the doors (x = lengthMm),
 * y across the width, z up from the floor. A placement's lengthMm/widthMm/heightMm are its
 * extents along x, y and z as placed (after any rotation).
 */

/** A cargo space: container, trailer box, truck bed or crate interior. */
export interface PackContainer {
  /** Inside length along x, mm (> 0). */
  lengthMm: number;
  /** Inside width along y, mm (> 0). */
  widthMm: number;
  /** Inside height along z, mm (> 0). */
  heightMm: number;
  /** Largest total cargo mass, kg. Absent = no mass limit. */
  maxPayloadKg?: number;
  /** Clear width of the door opening, mm. Absent = the inside width. */
  doorWidthMm?: number;
  /** Clear height of the door opening, mm. Absent = the inside height. */
  doorHeightMm?: number;
}

/** A vehicle or container for {@link packVehicles}; `id` is echoed on every placement in it. */
export type PackVehicle = PackContainer & { id: string };

/** Which dimension of an item may stand vertical. */
export type VerticalAxis = 'length' | 'width' | 'height';

/**
 * One line of cargo: `quantity` identical items.
 * - orientation 'fixed': placed exactly as given (length along x, width along y, height up);
 *   'upright': height stays vertical, may turn on the floor; 'any': every axis-aligned turn.
 * - verticalAxes, where given, further lists which dimensions may stand vertical.
 */
export interface PackItem {
  id: string;
  lengthMm: number;
  widthMm: number;
  heightMm: number;
  /** Mass of ONE item, kg. Absent = 0 (mass limits then cannot bind). */
  massKg?: number;
  quantity: number;
  orientation: 'any' | 'upright' | 'fixed';
  verticalAxes?: VerticalAxis[];
  /** False = nothing may stand on this item. Default true. */
  stackable?: boolean;
  /** Largest mass that may rest on ONE item (directly and through items above it), kg. Absent = no limit. */
  maxLoadOnTopKg?: number;
  /**
   * Stop at which the item is unloaded: a lower stopIndex is unloaded earlier and so sits nearer the
   * doors. Absent = unloaded after every numbered stop (it is loaded first, at the front).
   */
  stopIndex?: number;
}

/** Options of a packing run. */
export interface PackOptions {
  /**
   * Wall-clock budget, ms. Default 2000 when maxIterations is absent; when only maxIterations is given
   * there is no time limit (fully deterministic run).
   */
  timeLimitMs?: number;
  /** Largest number of search iterations (greedy completions). Same seed + same value = same result. */
  maxIterations?: number;
  /** Seed of the search's pseudo-random choices. Default 1. */
  seed?: number;
  /**
   * Every item's base must rest fully on the floor or on the tops of items below. Default TRUE:
   * real loads must not hang in the air. Set false only for the benchmark's unsupported variant.
   */
  fullSupport?: boolean;
  /**
   * Let one search step place a block of items from different lines (side by side or stacked, filling at
   * least 98 % of its box, 95 % with full support). Default: automatic (on when lines hold few items on average).
   */
  mixedBlocks?: boolean;
  /** Called now and then with the share of the budget used (0..1) and the best volume utilisation so far (0..1). */
  onProgress?: (fraction: number, bestUtilisation: number) => void;
}

/** One placed item. */
export interface Placement {
  id: string;
  xMm: number;
  yMm: number;
  zMm: number;
  lengthMm: number;
  widthMm: number;
  heightMm: number;
}

/** Items that were not placed, with why (naming the item and the limit). */
export interface Unplaced {
  id: string;
  quantity: number;
  reason: string;
}

/** Result of {@link packBoxes}. */
export interface PackResult {
  placements: Placement[];
  unplaced: Unplaced[];
  /** Placed item volume / container volume, 0..1. */
  volumeUtilisation: number;
}

/** Result of {@link packVehicles}. */
export interface PackVehiclesResult {
  placements: (Placement & { vehicleId: string })[];
  unplaced: Unplaced[];
  /** Number of vehicles that carry at least one item. */
  vehiclesUsed: number;
}
