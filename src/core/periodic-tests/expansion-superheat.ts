// Superheat of supply steam on free expansion: steam of dryness x at line pressure p₁ expanded
// through an orifice to p₂ keeps its enthalpy (the steady-flow energy equation, no work, no heat;
// common practice), so its temperature after is T₂ with h(p₂, T₂) = h_f(p₁) + x·h_fg(p₁), and its
// superheat is T₂ − T_sat(p₂). Enthalpies from IAPWS-IF97 (IAPWS R7-97(2012)).
//
// The sterilising standards' superheat test expands the sample to atmospheric pressure and measures
// T₂ (limit 25 K; EN 285 via HTM 2010, secondary sources in field-practice.md §4.3): the
// evaluation takes either that measured temperature or a prediction from the line pressure and
// dryness.

import { InputError, requireInRange } from '../errors.ts';
import { celsius, kelvinDifference, kilopascal, say } from '../check/cautions.ts';
import { requireFiniteData } from '../check/finite-data.ts';
import { VESSEL_LIMITS } from '../check/vessel-spec.ts';
import { FORMULATION_ID } from '../steam/index.ts';
import type { Caution } from '../check/cautions.ts';
import type { Graded } from '../graded-result.ts';
import { requireLinePressure, requireThrottledPressure, saturatedAtPressure, STEAM_LINE_LIMITS, temperatureFromEnthalpy } from './steam-line.ts';
import { gradeTest, STEAM_SAMPLING_HOT, testCaution } from './test-cautions.ts';

export interface ExpansionInput {
  /** Line pressure, Pa absolute, 10 kPa–10 MPa. */
  linePressurePa: number;
  /** Dryness fraction of the line steam, 0 … 1 (1 = dry saturated). */
  dryness: number;
  /** Pressure expanded to (the chamber's or the atmosphere's), Pa absolute, 1 kPa up to below the line pressure. */
  downstreamPressurePa: number;
}

/**
 * Temperature after a free (isenthalpic) expansion and its superheat above T_sat there. When the
 * expanded steam is still wet the temperature is T_sat(p₂) and the superheat 0.
 * @throws InputError naming the field: "line pressure" (10 kPa–10 MPa), "dryness" (0–1),
 *   "downstream pressure" (1 kPa up to below the line pressure)
 */
export function expansionSuperheat(input: ExpansionInput): { temperatureK: number; superheatK: number } {
  const p1 = requireLinePressure('line pressure', input?.linePressurePa);
  const x = requireInRange('dryness', input.dryness, 0, 1, '1');
  const p2 = requireThrottledPressure('downstream pressure', input.downstreamPressurePa, p1, 'line pressure');
  const line = saturatedAtPressure(p1);
  const h = line.liquidEnthalpyJPerKg + x * (line.vaporEnthalpyJPerKg - line.liquidEnthalpyJPerKg);
  const after = saturatedAtPressure(p2);
  if (h <= after.vaporEnthalpyJPerKg) return { temperatureK: after.temperatureK, superheatK: 0 };
  const temperatureK = temperatureFromEnthalpy(p2, h, 'dryness');
  return { temperatureK, superheatK: temperatureK - after.temperatureK };
}

/** Highest accepted superheat on free expansion to atmosphere, K (EN 285 via HTM 2010; secondary sources, field-practice.md §4.3). */
export const EXPANSION_SUPERHEAT_DEFAULT_MAX_K = 25;

/** The superheat test: a measured temperature after free expansion, or one predicted from the line. */
export type SuperheatTestInput =
  | { kind: 'measured'; expansionTemperatureK: number; downstreamPressurePa: number }
  | ({ kind: 'predicted' } & ExpansionInput);

export interface ExpansionSuperheatEvaluation extends Graded {
  test: 'expansion-superheat';
  formulationId: typeof FORMULATION_ID;
  input: SuperheatTestInput;
  temperatureK: number;
  superheatK: number;
  /** T_sat at the downstream pressure, K. */
  saturationTemperatureK: number;
  limits: { maximumSuperheatK: number };
}

/**
 * The superheat test against the highest accepted superheat (default 25 K, 0–200 K). A downstream
 * pressure outside 30–110 kPa is not the atmosphere and is said so. Throws InputError as
 * expansionSuperheat for a prediction; for a measurement on "expansion temperature"
 * (273.16–1073.15 K) and "downstream pressure" (1 kPa–10 MPa); on "highest accepted superheat".
 */
export function evaluateExpansionSuperheat(
  input: SuperheatTestInput,
  limits: { maximumSuperheatK?: number } = {},
): ExpansionSuperheatEvaluation {
  const maximumSuperheatK = requireInRange('highest accepted superheat', limits.maximumSuperheatK ?? EXPANSION_SUPERHEAT_DEFAULT_MAX_K, 0, 200, 'K');
  let temperatureK: number;
  let superheatK: number;
  if (input?.kind === 'measured') {
    const P = STEAM_LINE_LIMITS.throttledPressurePa;
    const T = STEAM_LINE_LIMITS.throttledTemperatureK;
    const p2 = requireInRange('downstream pressure', input.downstreamPressurePa, P.min, P.max, P.unit);
    temperatureK = requireInRange('expansion temperature', input.expansionTemperatureK, T.min, T.max, T.unit);
    superheatK = Math.max(0, temperatureK - saturatedAtPressure(p2).temperatureK);
  } else if (input?.kind === 'predicted') {
    ({ temperatureK, superheatK } = expansionSuperheat(input));
  } else {
    throw new InputError('superheat test', 'empty', String((input as { kind?: unknown } | undefined)?.kind), undefined,
      'superheat test: give either a measured expansion temperature or the line pressure and dryness.');
  }
  const p2 = input.downstreamPressurePa;
  const Ts2 = saturatedAtPressure(p2).temperatureK;
  const findings: Caution[] = [];
  if (superheatK > maximumSuperheatK) {
    findings.push(testCaution('expansion-superheat-above-limit', say`Superheat after expansion is ${kelvinDifference(superheatK)} (${celsius(temperatureK)} against a saturation temperature of ${celsius(Ts2)}), above the highest accepted ${kelvinDifference(maximumSuperheatK)}. Superheated steam gives up its heat poorly until it has cooled to saturation; look for the cause upstream (a pressure-reducing valve with a large drop, or a dry, overheated supply).`));
  }
  if (input.kind === 'measured' && temperatureK < Ts2) {
    findings.push(testCaution('expansion-below-saturation', say`The measured temperature is ${kelvinDifference(Ts2 - temperatureK, 2)} below the saturation temperature at the downstream pressure (${celsius(Ts2)}): the steam is still wet after expansion (superheat taken as 0), or the thermometer or the pressure reads wrong.`));
  }
  const A = VESSEL_LIMITS.siteAtmospherePa;
  if (p2 < A.min || p2 > A.max) {
    findings.push(testCaution('expansion-not-to-atmosphere', say`The expansion is to ${kilopascal(p2)} absolute, not to the atmosphere: the superheat limit is set for free expansion to atmospheric pressure, so this comparison is indicative only.`));
  }
  return requireFiniteData({
    test: 'expansion-superheat' as const,
    formulationId: FORMULATION_ID,
    input: { ...input },
    temperatureK,
    superheatK,
    saturationTemperatureK: Ts2,
    limits: { maximumSuperheatK },
    ...gradeTest(findings, [STEAM_SAMPLING_HOT]),
  });
}
