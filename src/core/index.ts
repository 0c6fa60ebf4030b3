// The one public entry of the core, but for the instruments room. Everything here is SI: K, Pa, kg, m³, m³/kg, J/kg, J/(kg·K), m/s.
// The instruments room (src/core/instrument/index.ts, and its files from the UI) is not re-exported
// here: every module an index re-exports lands in the check engine's shared chunk, and the room's
// limits, due dates and drift estimator would take that chunk over its 25 KB budget (measured: 30.2 KB
// with it, 25.3 KB without); the screens that use them load them with themselves.
export { InputError, requireInRange } from './errors.ts';
export type { InputProblem } from './errors.ts';
export * from './units/index.ts';
export * from './steam/index.ts';
export * from './check/index.ts';
export * from './statistics/index.ts';
export * from './cycle/index.ts';
export * from './periodic-tests/index.ts';
export type { Graded, GradedOutcome } from './graded-result.ts';
