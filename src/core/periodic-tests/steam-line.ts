// The steam of a supply line and after throttling, for the supply-steam tests: saturated states at
// a pressure and superheated vapour after a throttle, from IAPWS-IF97 (IAPWS R7-97(2012), regions 1,
// 2 and 4). A throttle does no work and, insulated, exchanges no heat, so the enthalpy after it
// equals the enthalpy before (the steady-flow energy equation; common practice).
//
// Line pressures are limited to 10 kPa–10 MPa absolute: the range of steriliser and process steam
// supplies, and below 16.5 MPa every state here lies in regions 1, 2 and 4 (region 3 never enters).

import { InputError, requireInRange } from '../errors.ts';
import { saturation, saturationTemperature, stateTP } from '../steam/index.ts';
import { solveBracketed } from '../steam/solvers.ts';

/** Top of IAPWS-IF97 region 2 (R7-97(2012), Section 5), K. */
const T_MAX_REGION2 = 1073.15;

/** Valid ranges, SI. */
export const STEAM_LINE_LIMITS = {
  linePressurePa: { min: 10e3, max: 10e6, unit: 'Pa' },
  /** Lowest pressure after a throttle or expansion, Pa (absolute). */
  throttledPressurePa: { min: 1e3, max: 10e6, unit: 'Pa' },
  /** IF97's region 2 reaches 1073.15 K. */
  throttledTemperatureK: { min: 273.16, max: T_MAX_REGION2, unit: 'K' },
} as const;

/** Saturation at pressure p Pa: T_s K, h_f and h_g J/kg. p must be valid. */
export function saturatedAtPressure(pressurePa: number): { temperatureK: number; liquidEnthalpyJPerKg: number; vaporEnthalpyJPerKg: number } {
  const T = saturationTemperature(pressurePa);
  const s = saturation(T);
  return { temperatureK: T, liquidEnthalpyJPerKg: s.liquid.h, vaporEnthalpyJPerKg: s.vapor.h };
}

/** Throws InputError on `field` unless p is a valid line pressure, Pa absolute. */
export function requireLinePressure(field: string, pressurePa: number): number {
  const L = STEAM_LINE_LIMITS.linePressurePa;
  return requireInRange(field, pressurePa, L.min, L.max, L.unit);
}

/** Throws InputError on `field` unless 1 kPa ≤ p < the line pressure (a throttle lowers the pressure). */
export function requireThrottledPressure(field: string, pressurePa: number, linePressurePa: number, lineField: string): number {
  const L = STEAM_LINE_LIMITS.throttledPressurePa;
  const range = { min: L.min, max: linePressurePa, unit: 'Pa' };
  requireInRange(field, pressurePa, L.min, L.max, L.unit);
  if (pressurePa >= linePressurePa) {
    throw new InputError(field, 'inconsistent', pressurePa, range,
      `${field}: ${pressurePa} Pa is not below the ${lineField} (${linePressurePa} Pa); steam throttled or expanded from the line ends at a lower pressure.`);
  }
  return pressurePa;
}

/** Enthalpy of superheated vapour at T K above T_s(p) and p Pa (region 2), J/kg; null if (T, p) is not superheated vapour. */
export function superheatedEnthalpyJPerKg(temperatureK: number, pressurePa: number): number | null {
  if (!(temperatureK > saturationTemperature(pressurePa))) return null;
  const s = stateTP(temperatureK, pressurePa);
  return s.region === 2 ? s.h : null;
}

/**
 * The temperature, K, at which vapour at p Pa has enthalpy h J/kg, for h above h_g(p): region 2,
 * where h rises with T (c_p > 0), solved by bracketed Newton on [T_s(p), 1073.15 K] to 1e-12 relative
 * in h. Throws InputError on `field` when h is beyond what IF97 region 2 covers at p.
 */
export function temperatureFromEnthalpy(pressurePa: number, enthalpyJPerKg: number, field: string): number {
  const sat = saturatedAtPressure(pressurePa);
  const hTop = stateTP(T_MAX_REGION2, pressurePa).h;
  if (enthalpyJPerKg > hTop) {
    throw new InputError(field, 'out-of-range', enthalpyJPerKg, { min: sat.vaporEnthalpyJPerKg, max: hTop, unit: 'J/kg' },
      `${field}: the steam would be above ${T_MAX_REGION2} K after throttling, beyond IAPWS-IF97.`);
  }
  const lo = sat.temperatureK;
  return solveBracketed((T, out) => {
    // At T_s itself stateTP gives the liquid; the vapour end of the bracket is h_g.
    const s = T > lo ? stateTP(T, pressurePa) : null;
    if (s === null || s.region !== 2) {
      out[0] = sat.vaporEnthalpyJPerKg - enthalpyJPerKg;
      out[1] = stateTP(lo + 1e-6, pressurePa).cp;
      return;
    }
    out[0] = s.h - enthalpyJPerKg;
    out[1] = s.cp;
  }, lo, sat.vaporEnthalpyJPerKg - enthalpyJPerKg, T_MAX_REGION2, hTop - enthalpyJPerKg, lo + 10, 1e-12 * enthalpyJPerKg, 1e-13);
}
