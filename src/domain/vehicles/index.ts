/**
 * Public entry point of the vehicles core: containers, road vehicles, air pallets, custom vehicles;
 * axle-group loads by statics; load plan checks; chargeable weight. Add exports; never rename them.
 */
export { CONTAINER_TYPES, ISO_MAX_GROSS_KG, containerVehicle, type ContainerType } from './containers.ts';
export { EU_SEMI_TRAILER, RIGID_TRUCK_18T } from './road.ts';
export { AIR_PALLET_MAIN_DECK } from './air.ts';
export { customVehicle, vehicleProblems } from './custom.ts';
export { steerLoad, type LoadSteer, type PlacedMass } from './steer.ts';
export { axleLoads, checkLoadPlan, twoSupportReactions, type AxleGroupLoad, type AxleLoadResult, type LoadPlanCheck } from './axle-loads.ts';
export {
  airChargeable,
  roadChargeable,
  seaChargeable,
  AIR_DIVISOR_CM3_PER_KG,
  ROAD_KG_PER_LOADING_METRE,
  LOADING_METRE_WIDTH_M,
  type ShipmentPiece,
  type AirChargeable,
  type RoadChargeable,
  type SeaChargeable,
} from './chargeable.ts';
export type * from './types.ts';
