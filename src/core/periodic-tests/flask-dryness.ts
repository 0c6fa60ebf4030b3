// Dryness value by the vacuum-flask (calorimetric) method of the sterilising standards: steam from
// the supply is led into a weighed vacuum flask of cold water until the water is warm; the flask
// is weighed again. The heat the water and flask gained came from the condensate:
//
//   D = [ (T₁ − T₀)·(c·M_w + A) / M_c − c·(T_s − T₁) ] / L
//
// M_w water mass, M_c condensate mass (the gain in weight), T₀ and T₁ the water temperatures
// before and after, A the flask's effective heat capacity, c = 4.18 kJ/(kg·K) for water, T_s and L
// the saturation temperature and latent heat of the supply steam (here from IAPWS-IF97 at the
// supply pressure). The formula and the constant c are from memory (EN 285 cl. 21.2 / HTM 2010, the
// method cited in field-practice.md §4.3); the energy balance itself is common practice.
//
// The result is a test value: it approximates the dryness fraction and is not the same quantity as
// the dryness fraction from a throttling calorimeter (it lumps the flask, the sampling line and the
// constants of the method). Superheated steam or a measurement error can give more than 1.

import { InputError, requireInRange } from '../errors.ts';
import { requireFiniteData } from '../check/finite-data.ts';
import type { Caution } from '../check/cautions.ts';
import { FORMULATION_ID } from '../steam/index.ts';
import type { Graded } from '../graded-result.ts';
import { requireLinePressure, saturatedAtPressure } from './steam-line.ts';
import { gradeTest, STEAM_SAMPLING_HOT, testCaution } from './test-cautions.ts';

/** Specific heat capacity of water the method uses, J/(kg·K) (4.18 kJ/(kg·K); from memory, EN 285 cl. 21.2 / HTM 2010). */
export const FLASK_METHOD_WATER_SPECIFIC_HEAT_J_PER_KG_K = 4180;

/** Valid ranges, SI. Water temperatures stay below boiling at one atmosphere. */
export const FLASK_DRYNESS_LIMITS = {
  emptyFlaskMassKg: { min: 0, max: 50, unit: 'kg' },
  massKg: { min: 0, max: 100, unit: 'kg' },
  waterTemperatureK: { min: 273.16, max: 373.15, unit: 'K' },
  flaskHeatCapacityJPerK: { min: 0, max: 1e5, unit: 'J/K' },
} as const;

export interface FlaskDrynessReading {
  /** Supply pressure at the sampling point, Pa absolute, 10 kPa–10 MPa: gives T_s and L. */
  supplyPressurePa: number;
  /** Empty flask (with its stopper and fittings as weighed), kg. */
  emptyFlaskMassKg: number;
  /** Flask with the cold water, before sampling, kg. */
  massBeforeKg: number;
  /** Flask with water and condensate, after sampling, kg. */
  massAfterKg: number;
  /** Water temperature before and after sampling, K. */
  temperatureBeforeK: number;
  temperatureAfterK: number;
  /** Effective heat capacity of the flask, J/K (found by the method's own calibration). */
  flaskHeatCapacityJPerK: number;
}

export interface FlaskDryness {
  /** The dryness value D (a test value; may exceed 1). */
  drynessValue: number;
  waterMassKg: number;
  condensateMassKg: number;
  /** T_s at the supply pressure, K, and L = h_g − h_f there, J/kg (IF97). */
  steamTemperatureK: number;
  latentHeatJPerKg: number;
}

/**
 * Dryness value by the vacuum-flask method.
 * @throws InputError naming the field: "supply pressure" (10 kPa–10 MPa), "empty flask mass"
 *   (0–50 kg), "mass before" (above the empty flask, up to 100 kg), "mass after" (above the mass
 *   before, up to 100 kg), "water temperature before" (273.16–373.15 K), "water temperature after"
 *   (above the temperature before, below T_s and 373.15 K), "flask heat capacity" (0–1e5 J/K)
 */
export function flaskDryness(reading: FlaskDrynessReading): FlaskDryness {
  const L = FLASK_DRYNESS_LIMITS;
  const p = requireLinePressure('supply pressure', reading?.supplyPressurePa);
  const flask = requireInRange('empty flask mass', reading.emptyFlaskMassKg, L.emptyFlaskMassKg.min, L.emptyFlaskMassKg.max, L.emptyFlaskMassKg.unit);
  const before = requireInRange('mass before', reading.massBeforeKg, L.massKg.min, L.massKg.max, L.massKg.unit);
  if (before <= flask) {
    throw new InputError('mass before', 'inconsistent', before, { min: flask, max: L.massKg.max, unit: 'kg' },
      `mass before: ${before} kg is not above the empty flask (${flask} kg); the flask holds no water.`);
  }
  const after = requireInRange('mass after', reading.massAfterKg, L.massKg.min, L.massKg.max, L.massKg.unit);
  if (after <= before) {
    throw new InputError('mass after', 'inconsistent', after, { min: before, max: L.massKg.max, unit: 'kg' },
      `mass after: ${after} kg is not above the mass before (${before} kg); no condensate was collected.`);
  }
  const W = L.waterTemperatureK;
  const T0 = requireInRange('water temperature before', reading.temperatureBeforeK, W.min, W.max, W.unit);
  const T1 = requireInRange('water temperature after', reading.temperatureAfterK, W.min, W.max, W.unit);
  const steam = saturatedAtPressure(p);
  if (T1 <= T0 || T1 >= steam.temperatureK) {
    throw new InputError('water temperature after', 'inconsistent', T1, { min: T0, max: Math.min(steam.temperatureK, W.max), unit: 'K' },
      `water temperature after: ${T1} K must be above the temperature before (${T0} K) and below the steam's saturation temperature (${steam.temperatureK.toFixed(3)} K).`);
  }
  const A = requireInRange('flask heat capacity', reading.flaskHeatCapacityJPerK, L.flaskHeatCapacityJPerK.min, L.flaskHeatCapacityJPerK.max, L.flaskHeatCapacityJPerK.unit);
  const c = FLASK_METHOD_WATER_SPECIFIC_HEAT_J_PER_KG_K;
  const waterMassKg = before - flask;
  const condensateMassKg = after - before;
  const latentHeatJPerKg = steam.vaporEnthalpyJPerKg - steam.liquidEnthalpyJPerKg;
  const drynessValue = (((T1 - T0) * (c * waterMassKg + A)) / condensateMassKg - c * (steam.temperatureK - T1)) / latentHeatJPerKg;
  return requireFiniteData({ drynessValue, waterMassKg, condensateMassKg, steamTemperatureK: steam.temperatureK, latentHeatJPerKg });
}

/** Lowest accepted dryness value by default: 0.90, and 0.95 for metal loads (EN 285 via HTM 2010; secondary sources, field-practice.md §4.3). */
export const DRYNESS_VALUE_DEFAULT_MIN = { general: 0.9, metalLoads: 0.95 } as const;

export interface FlaskDrynessEvaluation extends Graded {
  test: 'dryness-value';
  formulationId: typeof FORMULATION_ID;
  input: FlaskDrynessReading;
  metalLoads: boolean;
  result: FlaskDryness;
  limits: { minimumDrynessValue: number };
}

/**
 * The dryness value test: against 0.90, or 0.95 when the steriliser processes metal loads, unless a
 * lowest accepted value (0–1) is given. Throws InputError as flaskDryness, and on "lowest accepted dryness value".
 */
export function evaluateFlaskDryness(
  reading: FlaskDrynessReading,
  options: { metalLoads: boolean; minimumDrynessValue?: number },
): FlaskDrynessEvaluation {
  const metalLoads = options?.metalLoads === true;
  const minimumDrynessValue = requireInRange('lowest accepted dryness value',
    options?.minimumDrynessValue ?? (metalLoads ? DRYNESS_VALUE_DEFAULT_MIN.metalLoads : DRYNESS_VALUE_DEFAULT_MIN.general), 0, 1, '1');
  const result = flaskDryness(reading);
  const D = result.drynessValue;
  const findings: Caution[] = [];
  if (D < minimumDrynessValue) {
    findings.push(testCaution('dryness-value-below-limit',
      `Dryness value ${D.toFixed(3)} is below the lowest accepted ${minimumDrynessValue.toFixed(2)}${metalLoads ? ' for metal loads' : ''}: the supply carries more water than accepted, which can leave loads wet. Check the separator, steam traps and the lagging of the supply before testing again.`));
  }
  if (D > 1) {
    findings.push(testCaution('dryness-value-above-one',
      `Dryness value ${D.toFixed(3)} is above 1: the steam may be superheated (run the superheat test), or a weight, a temperature or the flask's heat capacity is off.`));
  }
  const standing = [
    testCaution('dryness-value-is-test-value',
      'The dryness value is the figure of the vacuum-flask test: it approximates the dryness fraction but is not the same quantity as the dryness fraction from a throttling calorimeter, and its limits are its own.'),
    STEAM_SAMPLING_HOT,
  ];
  return requireFiniteData({
    test: 'dryness-value' as const,
    formulationId: FORMULATION_ID,
    input: { ...reading },
    metalLoads,
    result,
    limits: { minimumDrynessValue },
    ...gradeTest(findings, standing),
  });
}
