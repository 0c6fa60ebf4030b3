// Single-phase state from temperature and pressure, regions 1, 2 and 3 of IAPWS-IF97.
// Region choice (IAPWS R7-97(2012), Fig. 1 and Section 4): T ≤ 623.15 K: region 1 for
// p ≥ p_s(T), else region 2; 623.15 K < T ≤ 863.15 K: region 3 for p > p_B23(T), else region 2;
// above 863.15 K: region 2.
import { InputError } from '../errors.ts';
import * as constants from './constants.ts';
import * as b23 from './b23.ts';
import type { PhaseState, SteamRegion } from './phase-state.ts';
import * as region1 from './region1.ts';
import * as region2 from './region2.ts';
import * as region3 from './region3.ts';
import * as region3Density from './region3-density.ts';
import * as saturationLine from './saturation-line.ts';

// The imports are read once into module constants: a bundler joins modules into one scope,
// but Vitest's module runner (which runs the tests and the benchmark) turns every use of an
// imported binding into a getter call, ~10 ns each on the 2-core CI machine.
const { P_MAX, P_MIN, T_13, T_B23_MAX, T_MAX, T_MIN } = constants;
const { b23Pressure } = b23;
const { region1State } = region1;
const { region2State } = region2;
const { region3State } = region3;
const { region3DensityFromTP } = region3Density;
const { saturationPressureUnchecked } = saturationLine;

// p_s at whole kelvins 273 … 624 K. p_s(T) rises with T, so p_s(⌊T⌋) ≤ p_s(T) ≤ p_s(⌊T⌋ + 1)
// decides the region without Eq. (30) except within that 1 K band (it only picks the region;
// every property still comes from the basic equations).
const PS_WHOLE_K_FROM = 273;
const PS_WHOLE_K = Float64Array.from({ length: 352 }, (_, k) => saturationPressureUnchecked(PS_WHOLE_K_FROM + k));

/** Which IF97 region holds (T K, p Pa); inputs must already be in range. */
export function regionOf(T: number, p: number): SteamRegion {
  if (T <= T_13) {
    const k = Math.floor(T) - PS_WHOLE_K_FROM;
    if (p >= (PS_WHOLE_K[k + 1] as number)) return 1;
    if (p < (PS_WHOLE_K[k] as number)) return 2;
    return p >= saturationPressureUnchecked(T) ? 1 : 2;
  }
  if (T <= T_B23_MAX && p > b23Pressure(T)) return 3;
  return 2;
}

/**
 * Single-phase state at temperature T and pressure p (regions 1, 2, 3; on the saturation line
 * below 623.15 K, p = p_s(T) gives the liquid).
 * @param T temperature, K; 273.15 ≤ T ≤ 1073.15
 * @param p absolute pressure, Pa; 1e-6 ≤ p ≤ 100e6
 * @throws InputError field 'temperature' or 'pressure' when not finite or outside those ranges
 */
export function stateTP(T: number, p: number): PhaseState {
  if (!(T >= T_MIN && T <= T_MAX)) {
    throw new InputError('temperature', Number.isFinite(T) ? 'out-of-range' : 'not-a-number', T,
      { min: T_MIN, max: T_MAX, unit: 'K' });
  }
  if (!(p >= P_MIN && p <= P_MAX)) {
    throw new InputError('pressure', Number.isFinite(p) ? 'out-of-range' : 'not-a-number', p,
      { min: P_MIN, max: P_MAX, unit: 'Pa' });
  }
  switch (regionOf(T, p)) {
    case 1:
      return region1State(T, p);
    case 2:
      return region2State(T, p);
    case 3:
      return region3State(region3DensityFromTP(T, p), T, p);
  }
}
