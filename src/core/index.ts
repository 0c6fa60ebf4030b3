// The one public entry of the core. Everything here is SI: K, Pa, kg, m³, m³/kg, J/kg, J/(kg·K), m/s.
export { InputError, requireInRange } from './errors.ts';
export type { InputProblem } from './errors.ts';
export * from './units/index.ts';
export * from './steam/index.ts';
export * from './check/index.ts';
export * from './statistics/index.ts';
export * from './instrument/index.ts';
export * from './cycle/index.ts';
export * from './periodic-tests/index.ts';
export type { Graded, GradedOutcome } from './graded-result.ts';
