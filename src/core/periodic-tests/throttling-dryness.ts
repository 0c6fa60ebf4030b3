// Dryness fraction of supply steam by a throttling calorimeter: a sample from the line at p₁ is
// throttled to p₂ and its temperature T₂ read where it is superheated. The throttle keeps the
// enthalpy, so h(p₁, x) = h_f(p₁) + x·(h_g(p₁) − h_f(p₁)) = h(p₂, T₂), and
//
//   x = (h(p₂, T₂) − h_f(p₁)) / (h_g(p₁) − h_f(p₁))
//
// with every enthalpy from IAPWS-IF97 (IAPWS R7-97(2012)). The method needs the throttled state
// superheated: wetter steam stays wet after the throttle and this method cannot give its dryness
// (common practice; at 1 MPa throttled to atmosphere that is below about x = 0.95). Heat lost from
// the calorimeter makes x read low. This is a dryness fraction (mass of vapour per mass of steam),
// not the dryness value of the vacuum-flask test.

import { InputError, requireInRange } from '../errors.ts';
import { requireFiniteData } from '../check/finite-data.ts';
import { FORMULATION_ID } from '../steam/index.ts';
import type { Graded } from '../graded-result.ts';
import {
  requireLinePressure, requireThrottledPressure, saturatedAtPressure, STEAM_LINE_LIMITS, superheatedEnthalpyJPerKg, temperatureFromEnthalpy,
} from './steam-line.ts';
import { gradeTest, STEAM_SAMPLING_HOT, testCaution } from './test-cautions.ts';

export interface ThrottlingCalorimeterReading {
  /** Line pressure before the throttle, Pa absolute, 10 kPa–10 MPa. */
  linePressurePa: number;
  /** Pressure in the calorimeter after the throttle, Pa absolute, 1 kPa up to below the line pressure. */
  calorimeterPressurePa: number;
  /** Temperature in the calorimeter, K, above T_sat at the calorimeter pressure. */
  calorimeterTemperatureK: number;
}

/**
 * Dryness fraction x (0 … 1) of line steam from a throttling calorimeter reading.
 * @throws InputError naming the field: "line pressure" (10 kPa–10 MPa), "calorimeter pressure"
 *   (1 kPa up to below the line pressure), "calorimeter temperature" (273.16–1073.15 K; refused with
 *   the reason when not above T_sat at the calorimeter pressure, or when above what dry saturated
 *   line steam would give)
 */
export function throttlingDryness(reading: ThrottlingCalorimeterReading): { dryness: number } {
  const p1 = requireLinePressure('line pressure', reading?.linePressurePa);
  const p2 = requireThrottledPressure('calorimeter pressure', reading.calorimeterPressurePa, p1, 'line pressure');
  const TL = STEAM_LINE_LIMITS.throttledTemperatureK;
  const T2 = requireInRange('calorimeter temperature', reading.calorimeterTemperatureK, TL.min, TL.max, TL.unit);
  const h2 = superheatedEnthalpyJPerKg(T2, p2);
  const line = saturatedAtPressure(p1);
  if (h2 === null) {
    const Ts2 = saturatedAtPressure(p2).temperatureK;
    throw new InputError('calorimeter temperature', 'inconsistent', T2, { min: Ts2, max: TL.max, unit: 'K' },
      `calorimeter temperature: ${T2} K is not above the saturation temperature at the calorimeter pressure (${Ts2.toFixed(3)} K), so the throttled steam is not superheated. ` +
        'A throttling calorimeter cannot give the dryness of steam this wet (or the calorimeter is losing heat); use a separating calorimeter ahead of it, or another method.');
  }
  const hfg = line.vaporEnthalpyJPerKg - line.liquidEnthalpyJPerKg;
  const dryness = (h2 - line.liquidEnthalpyJPerKg) / hfg;
  // Within 1e-9 of 1 is the rounding of the enthalpies, not a measurement: dry saturated.
  if (dryness > 1 && dryness <= 1 + 1e-9) return { dryness: 1 };
  if (dryness > 1) {
    const Tdry = temperatureFromEnthalpy(p2, line.vaporEnthalpyJPerKg, 'calorimeter temperature');
    throw new InputError('calorimeter temperature', 'inconsistent', T2, { min: saturatedAtPressure(p2).temperatureK, max: Tdry, unit: 'K' },
      `calorimeter temperature: ${T2} K is above what dry saturated steam at the line pressure gives after this throttle (${Tdry.toFixed(3)} K). ` +
        'The line steam is superheated (its dryness fraction is 1), or a pressure or temperature reading is wrong.');
  }
  return { dryness };
}

/** Lowest accepted dryness fraction by default: dry saturated steam with at least 97 % dryness (CDC Guideline for Disinfection and Sterilization in Healthcare Facilities, 2008, via field-practice.md §4.1). */
export const THROTTLING_DRYNESS_DEFAULT_MIN = 0.97;

export interface ThrottlingDrynessEvaluation extends Graded {
  test: 'throttling-dryness';
  formulationId: typeof FORMULATION_ID;
  input: ThrottlingCalorimeterReading;
  dryness: number;
  /** Superheat in the calorimeter, K: T₂ − T_sat(p₂). The smaller it is, the more the result hangs on the thermometer. */
  calorimeterSuperheatK: number;
  limits: { minimumDryness: number };
}

/**
 * The throttling calorimeter test: dryness fraction against a lowest accepted value (default 0.97,
 * 0 … 1). Throws InputError as throttlingDryness, and on "lowest accepted dryness".
 */
export function evaluateThrottlingDryness(
  reading: ThrottlingCalorimeterReading,
  limits: { minimumDryness?: number } = {},
): ThrottlingDrynessEvaluation {
  const minimumDryness = requireInRange('lowest accepted dryness', limits.minimumDryness ?? THROTTLING_DRYNESS_DEFAULT_MIN, 0, 1, '1');
  const { dryness } = throttlingDryness(reading);
  const Ts2 = saturatedAtPressure(reading.calorimeterPressurePa).temperatureK;
  const findings = dryness < minimumDryness
    ? [testCaution('throttling-dryness-below-limit',
      `Dryness fraction ${dryness.toFixed(3)} is below the lowest accepted value (${minimumDryness.toFixed(2)}): the supply carries more water than accepted. Check the separator, steam traps and the lagging of the supply before testing again.`)]
    : [];
  const standing = [
    testCaution('throttling-result-is-dryness-fraction',
      'This is the dryness fraction from a throttling calorimeter (mass of vapour per mass of steam; heat lost from the calorimeter makes it read low). ' +
        'It is not the dryness value of the vacuum-flask test, which is a different quantity with its own limits.'),
    STEAM_SAMPLING_HOT,
  ];
  return requireFiniteData({
    test: 'throttling-dryness' as const,
    formulationId: FORMULATION_ID,
    input: { ...reading },
    dryness,
    calorimeterSuperheatK: reading.calorimeterTemperatureK - Ts2,
    limits: { minimumDryness },
    ...gradeTest(findings, standing),
  });
}
