// Region 4, the saturation line: p_s(T) and T_s(p).
// IAPWS R7-97(2012), Eq. (30) saturation-pressure equation and Eq. (31) saturation-temperature
// equation; valid 273.15 K ≤ T ≤ 647.096 K, p_s(273.15 K) ≤ p ≤ 22.064 MPa.
import { InputError } from '../errors.ts';
import * as constants from './constants.ts';

// The imports are read once into module constants: a bundler joins modules into one scope,
// but Vitest's module runner (which runs the tests and the benchmark) turns every use of an
// imported binding into a getter call, ~10 ns each on the 2-core CI machine.
const { IF97, T_MIN } = constants;

/**
 * IAPWS R7-97(2012), Table 34: coefficients n1 … n10 of Eqs. (29)-(31), dimensionless.
 * Reducing quantities: T* = 1 K, p* = 1 MPa.
 */
const N = [
  0.11670521452767e4, -0.72421316703206e6, -0.17073846940092e2, 0.12020824702470e5,
  -0.32325550322333e7, 0.14915108613530e2, -0.48232657361591e4, 0.40511340542057e6,
  -0.23855557567849, 0.65017534844798e3,
] as const;

const [n1, n2, n3, n4, n5, n6, n7, n8, n9, n10] = N;

/** Eq. (30) without range checks; T in K, result in Pa. */
export function saturationPressureUnchecked(T: number): number {
  const theta = T + n9 / (T - n10);
  const A = (theta + n1) * theta + n2;
  const B = (n3 * theta + n4) * theta + n5;
  const C = (n6 * theta + n7) * theta + n8;
  const r = (2 * C) / (-B + Math.sqrt(B * B - 4 * A * C));
  const r2 = r * r;
  return r2 * r2 * 1e6;
}

/** Eq. (31) without range checks; p in Pa, result in K. */
export function saturationTemperatureUnchecked(p: number): number {
  const beta = Math.sqrt(Math.sqrt(p * 1e-6));
  const E = (beta + n3) * beta + n6;
  const F = (n1 * beta + n4) * beta + n7;
  const G = (n2 * beta + n5) * beta + n8;
  const D = (2 * G) / (-F - Math.sqrt(F * F - 4 * E * G));
  const s = n10 + D;
  return (s - Math.sqrt(s * s - 4 * (n9 + n10 * D))) / 2;
}

/** p_s(273.15 K) ≈ 611.213 Pa: the lowest pressure on IF97's saturation line. */
export const SATURATION_PRESSURE_MIN = saturationPressureUnchecked(T_MIN);
/** The top of the line: pc, or p_s(Tc) if Eq. (30) lands a few ulp above it (it does, by 2e-8 Pa). */
export const SATURATION_PRESSURE_MAX = Math.max(IF97.pc, saturationPressureUnchecked(IF97.Tc));

/**
 * Saturation pressure p_s(T) in Pa, IAPWS-IF97 Eq. (30).
 * @param T temperature, K; 273.15 ≤ T ≤ 647.096
 * @throws InputError field 'temperature' when T is not finite or outside that range
 */
export function saturationPressure(T: number): number {
  if (!(T >= T_MIN && T <= IF97.Tc)) throw temperatureError(T);
  return saturationPressureUnchecked(T);
}

/**
 * Saturation temperature T_s(p) in K, IAPWS-IF97 Eq. (31).
 * @param p absolute pressure, Pa; p_s(273.15 K) ≈ 611.213 Pa ≤ p ≤ 22.064e6 Pa
 * @throws InputError field 'pressure' when p is not finite or outside that range
 */
export function saturationTemperature(p: number): number {
  if (!(p >= SATURATION_PRESSURE_MIN && p <= SATURATION_PRESSURE_MAX)) {
    throw new InputError('pressure', Number.isFinite(p) ? 'out-of-range' : 'not-a-number', p,
      { min: SATURATION_PRESSURE_MIN, max: SATURATION_PRESSURE_MAX, unit: 'Pa' });
  }
  // Eq. (31) is Eq. (29) solved for T; at the ends of the line it can land a few ulp outside
  // [273.15 K, Tc]. Clamp so T_s(p) can always be fed back into p_s(T).
  return Math.min(IF97.Tc, Math.max(T_MIN, saturationTemperatureUnchecked(p)));
}

function temperatureError(T: number): InputError {
  return new InputError('temperature', Number.isFinite(T) ? 'out-of-range' : 'not-a-number', T,
    { min: T_MIN, max: IF97.Tc, unit: 'K' });
}
