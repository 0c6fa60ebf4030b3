// Saturated liquid and vapor at a temperature, over the whole saturation line.
// 273.15 K … 623.15 K: region 1 (liquid) and region 2 (vapor) at p_s(T) from Eq. (30) — the
// boundary ownership of IAPWS R7-97(2012), where both regions include 623.15 K.
// 623.15 K … 647.096 K: both phases from region 3, Eq. (28), iterated to p_s(T) (see
// region3-density.ts for the route and the last 5e-5 K below Tc).
import { InputError } from '../errors.ts';
import * as constants from './constants.ts';
import type { SaturationState } from './phase-state.ts';
import * as region1 from './region1.ts';
import * as region2 from './region2.ts';
import * as region3 from './region3.ts';
import * as region3Density from './region3-density.ts';
import * as saturationLine from './saturation-line.ts';

// The imports are read once into module constants: a bundler joins modules into one scope,
// but Vitest's module runner (which runs the tests and the benchmark) turns every use of an
// imported binding into a getter call, ~10 ns each on the 2-core CI machine.
const { IF97, T_13, T_MIN } = constants;
const { region1State, region1Volume } = region1;
const { region2State, region2Volume } = region2;
const { region3State } = region3;
const { region3SaturatedDensities, region3SaturatedDensity, SAT3 } = region3Density;
const { saturationPressureUnchecked } = saturationLine;

/**
 * Saturated liquid and vapor at temperature T: `{ T, p, liquid, vapor }`, p = p_s(T) in Pa.
 * @param T temperature, K; 273.15 ≤ T ≤ 647.096
 * @throws InputError field 'temperature' when T is not finite or outside that range
 */
export function saturation(T: number): SaturationState {
  if (!(T >= T_MIN && T <= IF97.Tc)) {
    throw new InputError('temperature', Number.isFinite(T) ? 'out-of-range' : 'not-a-number', T,
      { min: T_MIN, max: IF97.Tc, unit: 'K' });
  }
  return saturationUnchecked(T);
}

/** saturation(T) without the range check, for callers that have checked T. */
export function saturationUnchecked(T: number): SaturationState {
  const p = saturationPressureUnchecked(T);
  if (T <= T_13) return { T, p, liquid: region1State(T, p), vapor: region2State(T, p) };
  region3SaturatedDensities(T, p);
  const rf = SAT3[0] as number;
  const rg = SAT3[1] as number;
  return { T, p, liquid: region3State(rf, T, p), vapor: region3State(rg, T, p) };
}


/**
 * Specific volume of saturated liquid v_f at T, m³/kg: exactly saturation(T).liquid.v, without
 * building either phase's state (a third of region 1's sums, no allocation). For solvers that
 * need v_f alone, such as the heat-up envelope's liquid-full temperature.
 * @param T temperature, K; 273.15 ≤ T ≤ 647.096
 * @throws InputError field 'temperature' when T is not finite or outside that range
 */
export function saturatedLiquidVolume(T: number): number {
  checkTemperature(T);
  const p = saturationPressureUnchecked(T);
  if (T <= T_13) return region1Volume(T, p);
  return 1 / region3SaturatedDensity(T, p, true);
}

/**
 * Specific volume of saturated vapor v_g at T, m³/kg: exactly saturation(T).vapor.v, without
 * building either phase's state.
 * @param T temperature, K; 273.15 ≤ T ≤ 647.096
 * @throws InputError field 'temperature' when T is not finite or outside that range
 */
export function saturatedVaporVolume(T: number): number {
  checkTemperature(T);
  const p = saturationPressureUnchecked(T);
  if (T <= T_13) return region2Volume(T, p);
  return 1 / region3SaturatedDensity(T, p, false);
}

function checkTemperature(T: number): void {
  if (!(T >= T_MIN && T <= IF97.Tc)) {
    throw new InputError('temperature', Number.isFinite(T) ? 'out-of-range' : 'not-a-number', T,
      { min: T_MIN, max: IF97.Tc, unit: 'K' });
  }
}
