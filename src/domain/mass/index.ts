/** Public entry point of the mass core. Benchmarks and reference checks import it: add, never rename. */
export { combineMasses, type PointMass } from './combine.ts';
export { meshMassProperties, type MeshMassProperties, type MeshMassOptions } from './mesh-mass-properties.ts';
export { findMeshClosureProblems, type MeshClosureReport, type MeshClosureProblems } from './mesh-closure.ts';
export { parseStl, type ParsedStl, type StlLengthUnit, type ParseStlOptions } from './stl.ts';
export {
  massProperties,
  partLineFlags,
  type PartLineFlags,
  type MassPropertiesResult,
  type NodeMassProperties,
  type MassConfidence,
  type MassGap,
} from './mass-properties.ts';
export {
  weighingFromLoadCells,
  compareWeighing,
  type LoadCellReading,
  type WeighingResult,
  type WeighingComparison,
  type WeighingTolerances,
} from './weighing.ts';
export { DEFAULT_MATERIALS, findMaterial, cadMassKg, type Material } from './materials.ts';
export {
  cuboidInertia,
  pointMassInertia,
  shiftFromCog,
  shiftToCog,
  rotateTensor,
  zeroTensor,
  type InertiaTensor,
} from './inertia.ts';
export { rotationFromEulerZyxDeg, rotateVec, IDENTITY_MAT3, type Mat3 } from './rotation.ts';
export type {
  MassPartLine,
  MassAssembly,
  MassSection,
  MassAddOn,
  MassPropertiesInput,
  MassSource,
  PartInstance,
} from '../contracts/mass.ts';
