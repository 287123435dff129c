/**
 * Ballast packing engine: items into one container (packBoxes) and into as few vehicles as possible
 * (packVehicles), with a validator that checks any packing against the same rules. Pure core: no I/O.
 */
export { packBoxes, DEFAULT_TIME_LIMIT_MS } from './pack-boxes.ts';
export { packVehicles } from './pack-vehicles.ts';
export { validatePacking, type PackingCheck } from './validate.ts';
export { allowedDims, passesDoor } from './orientations.ts';
export { loadsOnTopKg } from './stack-load.ts';
export type { PackContainer, PackVehicle, PackItem, PackOptions, Placement, Unplaced, PackResult, PackVehiclesResult, VerticalAxis } from './types.ts';
