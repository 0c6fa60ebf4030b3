// The check engine's public surface: evaluateCheck, planFill, the vessel geometry helpers and the
// types they take and return. All SI (K, Pa, kg, m³, m³/kg, J, J/kg, W, s).
export { evaluateCheck } from './evaluate-check.ts';
export { planFill } from './plan-fill.ts';
export type {
  AtmosphereCheck, Caution, CautionPart, CautionQuantity, ChargeState, CheckResult, FillPlan, FillRequest, FillTarget, Hazards, Outcome, SignalWord,
} from './check-result.ts';
export { findingsOfStoredResult, isCurrentResult } from './stored-result.ts';
export type { CheckResultV1, StoredCheckResult } from './stored-result.ts';
export { DEFAULT_RELIEF_SET_TOLERANCE_PERCENT, isSteamHeated, validateVessel, VESSEL_HEATINGS, VESSEL_LIMITS, VESSEL_SERVICES } from './vessel-spec.ts';
export type { InstrumentAccuracy, ReadingUnits, TareTolerance, TemperatureSensorTolerance, VesselHeating, VesselService, VesselSpec } from './vessel-spec.ts';
export { resolveReading, READING_LIMITS } from './reading.ts';
export type { Reading, ResolvedReading } from './reading.ts';
export {
  headDepthM,
  headVolumeM3,
  liquidLevelFromVolume,
  liquidVolumeFromLevel,
  validateGeometry,
  vesselLevelSpanM,
  vesselVolume,
} from './vessel-geometry.ts';
export type { CylinderGeometry, HeadSpec, VesselGeometry } from './vessel-geometry.ts';
export {
  ACT_NOW_RULES, CAUTION_RULES, isStandingRule, METHOD_RULES, outcomeOf, outcomeOfStoredCautions, quantityText, RETIRED_RULES, RULE_CATALOGUE,
  STANDING_NOTE, STANDING_RULES,
} from './cautions.ts';
export type { CautionRule, RuleEntry, RuleKind } from './cautions.ts';
export { RULE_REASONS } from './rule-reasons.ts';
export type { PressureBandPart, SaturationCheck, SaturationVerdict } from './saturation-consistency.ts';
export { saturationSlopePaPerK } from './saturation-consistency.ts';
export type { Hydraulic, HydraulicBand, Inventory, MawpVerdict } from './inventory.ts';
export type { Band, ClippedBand, InventoryBands, UndeterminedReason } from './uncertainty.ts';
export { gaugeLimitsPa, SITE_ATMOSPHERE_TOLERANCE_PA, temperatureToleranceK, thermometerLimitsK } from './uncertainty.ts';
export type { EnvelopeEvent, HeatUpEnvelope } from './heat-up-envelope.ts';
export type { CooledState, FlashOnRelease, PressureMargin } from './hazards.ts';
export type { IdealGasComparison } from './ideal-gas.ts';
export { checkDue, CHECK_DUE_ORDER, CHECK_INTERVAL_MAX_S, CHECK_INTERVAL_MIN_S } from './check-due.ts';
export type { CheckDue, CheckDueState } from './check-due.ts';
