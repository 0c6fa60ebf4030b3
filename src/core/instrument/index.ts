// Instruments: the limit each contributes to a check now (class, indicator, last calibration,
// drift since), whether its calibration is in date, and drift between a gauge and a thermometer
// found in the log. SI inside (Pa, K, kg), times in ms since the epoch, the date now a parameter.
export {
  DEFAULT_DUE_SOON_WINDOW_MS, DEFAULT_INSTRUMENT_SETTINGS, INSTRUMENT_KINDS, MS_PER_DAY, MS_PER_MONTH, MS_PER_YEAR, UNIT_OF_KIND,
} from './instrument-kind.ts';
export type { DriftAllowance, InstrumentKind, InstrumentSettings, InstrumentUnit, KindSettings } from './instrument-kind.ts';
export {
  INSTRUMENT_LIMITS, TIME_LIMITS_MS, instrumentSpan, lastCalibration, validateCalibrations, validateInstrument, validateKindSettings,
} from './instrument-spec.ts';
export type { CalibrationRecord, InstrumentSpec, InstrumentTolerance } from './instrument-spec.ts';
export { CALIBRATION_DUE_WORDS, calibrationDue } from './calibration-due.ts';
export type { CalibrationDue, CalibrationDueState, InstrumentOptions } from './calibration-due.ts';
export { LIMIT_PARTS, instrumentLimit } from './instrument-limit.ts';
export type { InstrumentLimit, LimitOptions, LimitPart } from './instrument-limit.ts';
export {
  DRIFT_DECISION_CONFIDENCE, DRIFT_MIN_CHECKS, DRIFT_OUTLIER_LIMIT, DRIFT_REPORTED_CONFIDENCE, driftFromLog,
} from './log-drift.ts';
export type { DriftContext, Interval, LogDrift, LogDriftEstimate, SaturatedCheck } from './log-drift.ts';
export { INSTRUMENT_RULES, calibrationFinding } from './instrument-findings.ts';
export type { InstrumentPair, InstrumentRule } from './instrument-findings.ts';
export { vesselWithInstruments, withInstrumentFindings } from './vessel-instruments.ts';
export type { CheckInstrumentOptions, FittedForCheck, FittedInstrument, VesselForCheck } from './vessel-instruments.ts';
export type { InstrumentRole, InstrumentUse } from './instrument-use.ts';
