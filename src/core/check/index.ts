// The check engine's public surface: evaluateCheck, planFill, the vessel geometry helpers and the
// types they take and return. All SI (K, Pa, kg, m³, m³/kg, J, J/kg, W, s).
export { evaluateCheck } from './evaluate-check.ts';
export type { CheckResult, Hazards } from './evaluate-check.ts';
export { planFill } from './plan-fill.ts';
export type { ChargeState, FillPlan, FillRequest, FillTarget } from './plan-fill.ts';
export { validateVessel, VESSEL_LIMITS } from './vessel-spec.ts';
export type { InstrumentAccuracy, ReadingUnits, TemperatureSensorTolerance, VesselSpec } from './vessel-spec.ts';
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
export { ACT_NOW_RULES, CAUTION_RULES, STANDING_NOTE, quantityText } from './cautions.ts';
export type { Caution, CautionPart, CautionQuantity, CautionRule, SignalWord } from './cautions.ts';
export type { SaturationCheck, SaturationVerdict } from './saturation-consistency.ts';
export type { Inventory } from './inventory.ts';
export type { Band, InventoryBands } from './uncertainty.ts';
export { SITE_ATMOSPHERE_TOLERANCE_PA, temperatureToleranceK } from './uncertainty.ts';
export type { EnvelopeEvent, HeatUpEnvelope } from './heat-up-envelope.ts';
export type { CooledState, FlashOnRelease, PressureMargin } from './hazards.ts';
export type { IdealGasComparison } from './ideal-gas.ts';
