/**
 * Public entry point of the crate core: crates designed around sections, stock cases and pallets,
 * tipping under transport accelerations, ISPM 15. Add exports; never rename or remove them.
 */
export {
  designCrate,
  crateStandardFor,
  stackLimitKg,
  DEFAULT_MAKE_UP,
  DEFAULT_CLEARANCE_MM,
  LID_DESIGN_LOAD_KN_PER_M2,
  MIN_FORK_ENTRY_MM,
  CRATE_STANDARDS,
} from './design.ts';
export { tippingCheck, ROAD_1G, ROAD_CTU, SEA_AREAS, type AccelerationProfile, type TippingResult, type TipDirection, type RideOrientation } from './tipping.ts';
export { ispm15Need, ISPM15_THIN_WOOD_MM, type Ispm15Need } from './ispm15.ts';
export { EUR_PALLET, ISO_6780_PALLETS, STOCK_CASES, type StockItem } from './stock.ts';
export { CRATE_MATERIALS, crateMaterial, type CrateMaterial, type WoodKind } from './materials.ts';
export type * from './types.ts';
export { assessCrateForLeg, crateForAccess, type CrateLegAssessment } from './assess.ts';
