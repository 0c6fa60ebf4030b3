// The sterilising-cycle room's public surface: lethality (F-value), cycle types, the cycle
// evaluation and the chart data. All SI (K, Pa, s; F-values in minutes).
export { lethality, lethalRate, LETHALITY_DEFAULTS, LETHALITY_LIMITS } from './lethality.ts';
export { COMMON_CYCLE_TYPES, CYCLE_TYPE_DEFAULTS, CYCLE_TYPE_LIMITS, resolveCycleType } from './cycle-type.ts';
export type { CycleType, CycleTypeInput } from './cycle-type.ts';
export { evaluateCycle } from './evaluate-cycle.ts';
export type { CycleEvaluation, CycleReading, CycleRecordInput, HoldSaturation } from './cycle-evaluation.ts';
export type { CycleHold, Equilibration, HoldStatus } from './hold.ts';
export type { PressureMeasurement, SaturationColumns } from './saturation-pairs.ts';
export { CYCLE_CAUTION_RULES, CYCLE_STANDING_NOTE, CYCLE_STANDING_RULES, SPARSE_READINGS_FRACTION_OF_HOLD, durationText } from './cycle-cautions.ts';
export type { CycleCautionRule } from './cycle-cautions.ts';
export { cycleChart } from './cycle-chart.ts';
export type { CycleChart } from './cycle-chart.ts';
export { SERIES_LIMITS } from './time-series.ts';
