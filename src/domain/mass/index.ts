/** Public entry point of the mass core. Benchmarks and reference checks import it: add, never rename. */
export { combineMasses, type PointMass } from './combine.ts';
