// The shapes the check engine returns: a check's result, a fill plan, and the cautions inside both.
// They live here, apart from the code that builds them, so the modules that build results
// (evaluate-check.ts, plan-fill.ts) and the one that words their cautions (cautions.ts) each import
// types from this file only, never from each other. All SI (K, Pa, kg, m³, m³/kg, J, W, s).
import type { FORMULATION_ID } from '../steam/index.ts';
import type { HeatUpEnvelope } from './heat-up-envelope.ts';
import type { CooledState, FlashOnRelease, PressureMargin } from './hazards.ts';
import type { IdealGasComparison } from './ideal-gas.ts';
import type { Inventory } from './inventory.ts';
import type { ResolvedReading } from './reading.ts';
import type { SaturationCheck } from './saturation-consistency.ts';
import type { InventoryBands } from './uncertainty.ts';

/** The ISO 3864-2 / ANSI Z535.4 signal words, most severe first. */
export type SignalWord = 'DANGER' | 'WARNING' | 'CAUTION' | 'NOTICE';

/** A check's outcome: the worst signal word among its findings, 'none' when it has none. */
export type Outcome = SignalWord | 'none';

export interface Caution {
  signal: SignalWord;
  /** The wording with quantities in °C, K (differences), kPa and kg: what the log stores. */
  message: string;
  /** Rule id from RULE_CATALOGUE (cautions.ts). */
  rule: string;
  /** The same wording as text and SI quantities, so a screen can show the person's own units. */
  parts?: readonly CautionPart[];
}

/** A quantity inside a caution's wording, in SI. `decimals` is for the stored °C/K/kPa/kg text. */
export type CautionQuantity =
  | { kind: 'temperature'; K: number; decimals?: number }
  | { kind: 'temperature-difference'; K: number; decimals?: number }
  | { kind: 'pressure'; Pa: number; decimals?: number }
  | { kind: 'mass'; kg: number; decimals?: number };
export type CautionPart = string | CautionQuantity;

export interface Hazards {
  /** Flash of the liquid if released to atmosphere; null when there is no liquid (superheated, or beyond IF97). */
  flash: FlashOnRelease | null;
  /** Isentropic expansion work of the whole contents down to atmosphere: an indicator of stored energy, not a blast prediction. */
  storedEnergy: { expansionWorkJ: number; tntEquivalentKg: number } | null;
  mawpMargin: PressureMargin;
  reliefSetMargin: PressureMargin;
  /** The sealed contents after cooling, or warming, to the vessel's ambient. */
  cooled: CooledState;
}

/** The atmosphere behind the gauge/absolute conversion, and what the stored site value implies. */
export interface AtmosphereCheck {
  /** The vessel's stored site (station) atmospheric pressure, Pa. */
  sitePa: number;
  /**
   * The geometric elevation at which the US Standard Atmosphere 1976 has the stored pressure, m;
   * null outside the standard's troposphere (−500 to 11 000 m). A site far from it suggests a
   * sea-level value kept for a high site, or the reverse.
   */
  siteElevationM: number | null;
  /** The barometer reading given with this check, Pa; null when none. */
  measuredPa: number | null;
  /** Barometer reading minus the stored site value, Pa; null without a reading. */
  differencePa: number | null;
  /** How far weather moves station pressure from a stored value, ± Pa (SITE_ATMOSPHERE_TOLERANCE_PA). */
  weatherBandPa: number;
}

/** One evaluated check (evaluateCheck). */
export interface CheckResult {
  /** The shape's version: 2 since findings and standing hazards were told apart (version 1 is CheckResultV1). */
  resultVersion: 2;
  formulationId: typeof FORMULATION_ID;
  reading: ResolvedReading;
  internalVolumeM3: number;
  saturation: SaturationCheck;
  inventory: Inventory | { regime: 'not-weighed' };
  /** ± bands on quality, liquid mass and liquid level, two-phase only. */
  inventoryBands: InventoryBands | null;
  /** Heat-up envelope of this fill; null when not weighed. */
  envelope: HeatUpEnvelope | null;
  hazards: Hazards;
  idealGas: IdealGasComparison;
  atmosphere: AtmosphereCheck;
  /** What this reading says about the vessel now, most severe first; these decide the outcome. */
  findings: Caution[];
  /** Hazards of hot contents whatever the reading, then notes on the method, the standing note last; never the outcome. */
  standing: Caution[];
  /** The worst signal word among the findings; 'none' when there are none. */
  outcome: Outcome;
  /** Findings and standing items together, most severe first, the standing note last (what the log and CSV keep). */
  cautions: Caution[];
}

/** What the charge should give at the target temperature. */
export type FillTarget =
  | { kind: 'quality'; /** Bulk quality, 0–1. */ quality: number }
  | { kind: 'vapor-space-fraction'; /** Vapor volume / internal volume, 0–1. */ fraction: number }
  | { kind: 'dry-saturated' };

export interface FillRequest {
  /** K, 273.15–647.096. */
  targetTemperatureK: number;
  target: FillTarget;
  /** Temperature the sealed charge starts from, K, 273.15 up to the target. */
  startTemperatureK: number;
  /** Heat capacity of the vessel itself, J/K (0 to 1e9); omitted counts as 0. */
  vesselHeatCapacityJPerK?: number;
  /** Heater power reaching the contents, W (above 0 to 1e8); omitted gives no heat-up time. */
  heaterPowerW?: number;
  /** The largest two-phase charge must stay two-phase up to T_sat(relief set pressure) + this, K (0–100). */
  liquidFullMarginK: number;
  /** Atmosphere for gauge ↔ absolute, Pa (30–110 kPa); omitted uses the vessel's site value. */
  atmospherePa?: number;
}

/** Contents of the sealed charge at one temperature. */
export type ChargeState =
  | { regime: 'two-phase'; temperatureK: number; absolutePressurePa: number; quality: number; vaporSpaceFraction: number }
  | { regime: 'liquid-full'; temperatureK: number }
  | { regime: 'superheated'; temperatureK: number; absolutePressurePa: number };

export interface FillPlan {
  formulationId: typeof FORMULATION_ID;
  internalVolumeM3: number;
  target: FillTarget;
  targetTemperatureK: number;
  startTemperatureK: number;
  atmospherePa: number;
  /** Water to charge, kg. */
  waterMassKg: number;
  /** Tare + charge: what the scale should read, kg. */
  expectedGrossWeightKg: number;
  /** p_sat(target), absolute and gauge, Pa. */
  targetSaturationPressurePa: number;
  targetGaugePressurePa: number;
  /** At the target: quality, vapor-space fraction, liquid and vapor mass. */
  atTarget: { quality: number; vaporSpaceFraction: number; liquidMassKg: number; vaporMassKg: number };
  /** The same charge with the vapor as an ideal gas (v_g → R·T/p): mass, kg, and its error against IF97, %. */
  idealGas: { waterMassKg: number; errorPercent: number };
  /** Heat from start to target, J (internal-energy difference of the charge + vessel heat capacity × ΔT); time in s or null without a heater power. */
  heat: { contentsJ: number; vesselJ: number; totalJ: number; heatUpTimeS: number | null } | null;
  startState: ChargeState;
  /**
   * The largest charge that stays two-phase (some vapor space left) up to limitTemperatureK =
   * T_sat(relief set pressure) + margin, capped at the critical point. Not a statement that the
   * charge is safe: only that this fill does not go liquid-full below that temperature.
   */
  largestTwoPhaseCharge: {
    limitTemperatureK: number;
    waterMassKg: number;
    expectedGrossWeightKg: number;
    /** Liquid volume of that charge at the start temperature / internal volume. */
    fillFractionAtStart: number;
  };
  envelope: HeatUpEnvelope;
  cautions: Caution[];
}
