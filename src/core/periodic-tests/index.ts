// The periodic tests' public surface: supply steam (throttling dryness, superheat on expansion,
// non-condensable gases, the vacuum-flask dryness value), the chamber's air leakage, and the
// air-removal test record; each with its evaluation against configurable limits. All SI.
export { throttlingDryness, evaluateThrottlingDryness, THROTTLING_DRYNESS_DEFAULT_MIN } from './throttling-dryness.ts';
export type { ThrottlingCalorimeterReading, ThrottlingDrynessEvaluation } from './throttling-dryness.ts';
export { expansionSuperheat, evaluateExpansionSuperheat, EXPANSION_SUPERHEAT_DEFAULT_MAX_K } from './expansion-superheat.ts';
export type { ExpansionInput, ExpansionSuperheatEvaluation, SuperheatTestInput } from './expansion-superheat.ts';
export { noncondensableGas, evaluateNoncondensableGas, NONCONDENSABLE_GAS_DEFAULT_MAX_PERCENT, NONCONDENSABLE_GAS_LIMITS } from './noncondensable-gas.ts';
export type { NoncondensableGasEvaluation, NoncondensableGasReading } from './noncondensable-gas.ts';
export { vacuumLeakRate, evaluateVacuumLeak, VACUUM_LEAK_DEFAULT_MAX_PA_PER_MINUTE, VACUUM_LEAK_LIMITS } from './vacuum-leak-rate.ts';
export type { LeakTestGauge, VacuumLeakEvaluation, VacuumLeakRate } from './vacuum-leak-rate.ts';
export {
  flaskDryness, evaluateFlaskDryness, DRYNESS_VALUE_DEFAULT_MIN, FLASK_DRYNESS_LIMITS, FLASK_METHOD_WATER_SPECIFIC_HEAT_J_PER_KG_K,
} from './flask-dryness.ts';
export type { FlaskDryness, FlaskDrynessEvaluation, FlaskDrynessReading } from './flask-dryness.ts';
export { validateAirRemovalTest, evaluateAirRemovalTest, AIR_REMOVAL_TEST_LIMITS } from './air-removal-test.ts';
export type { AirRemovalTestEvaluation, AirRemovalTestRecord } from './air-removal-test.ts';
export { STEAM_LINE_LIMITS } from './steam-line.ts';
export {
  PERIODIC_TEST_CAUTION_RULES, PERIODIC_TEST_STANDING_NOTE, PERIODIC_TEST_STANDING_RULES,
} from './test-cautions.ts';
export type { PeriodicTestCautionRule } from './test-cautions.ts';
