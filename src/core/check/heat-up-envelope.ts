// What happens to this fill if the closed vessel is heated: the mean specific volume v = V/m is
// fixed, so the contents go liquid-full where v_f(T) = v (if v < v_c) or all vapor where
// v_g(T) = v (if v > v_c); meanwhile p_sat(T) climbs to the relief set pressure and the MAWP.
// Hydraulic expansion of blocked-in liquid is a relief case in API Std 521 (§4.4.12 in the 6th ed.);
// judging a fill by its liquid-full temperature rather than a fixed percentage follows from the mass
// and volume balance above (our own rule).

import { IF97, saturatedLiquidVolume, saturatedVaporVolume, saturationTemperature } from '../steam/index.ts';
import { bisectionResult, type BisectionStart } from './bisection.ts';

/** Minimum of v_f(T) in IF97, K (277.14 K, found with python-iapws 1.5.2 on a 0.01 K grid): v_f rises monotonically above it. */
const T_MAX_DENSITY_K = 277.14;

/** IF97's lowest temperature, K (IAPWS R7-97(2012): 273.15 K), reported for a fill that is liquid-full (or all vapor) at any temperature. */
const T_MIN_K = 273.15;

/** Boundary of IF97 regions 1 and 3 on the saturation line, K (IAPWS R7-97(2012), 623.15 K). */
const T_13_K = 623.15;

export type EnvelopeEvent = 'liquid-full' | 'all-vapor' | 'relief-set-pressure' | 'mawp';

export interface HeatUpEnvelope {
  /** v = V/m, m³/kg. */
  meanSpecificVolumeM3PerKg: number;
  /** T where v_f(T) = v, K; 273.15 (IF97's lowest) if liquid-full at any temperature; null if never (v ≥ v_c). */
  liquidFullTemperatureK: number | null;
  /** T where v_g(T) = v, K; 273.15 (IF97's lowest) if all vapor at any temperature; null if never (v ≤ v_c). */
  allVaporTemperatureK: number | null;
  /** T_sat(relief set pressure + atmosphere), K; null above the critical pressure. */
  reliefSetTemperatureK: number | null;
  /** T_sat(MAWP + atmosphere), K; null above the critical pressure. */
  mawpTemperatureK: number | null;
  /** The event at the lowest temperature (ties: liquid-full, relief, MAWP, all vapor), and whether the start temperature is already at or past it. */
  first: { event: EnvelopeEvent; temperatureK: number; alreadyReached: boolean } | { event: 'none' };
}

/**
 * Solves g(T) = 0 for a g that rises with T on [lo, hi] (sign change assumed): the result of 60
 * bisection steps, from fewer evaluations (bisection.ts), starting from two temperatures where g
 * is known (`known`: the stored volumes below). g here is a specific-volume difference: below
 * 623.15 K v_f and v_g come out of IF97's regions 1 and 2 within a few ulp (1e-13 of v is about
 * 500 ulp); in region 3 they are Newton roots of Eq. (28) converged to 1e-12 in p, whose scatter
 * in v grows towards Tc as the isotherm flattens. Measured (the largest departure from a local
 * quadratic over 401 points, 40 places at each distance from Tc): 9e-14 of v at 24 K below Tc,
 * 2.2e-13 at 10 K, 1.5e-12 at 1 K, 2e-11 at 0.1 K, 1.8e-10 at 0.01 K, about 1.5e-12 K/(Tc − T)
 * throughout, liquid and vapour alike; the bound taken is 1e-11 K/(Tc − T), four to seven times
 * that. Within 0.01 K of Tc, where the two roots merge, every step is evaluated.
 */
function bisect(g: (T: number) => number, lo: number, hi: number, scaleM3PerKg: number, known: BisectionStart): number {
  const noise = (T: number) => (T <= T_13_K ? 1e-13 * scaleM3PerKg : T < IF97.Tc - 0.01 ? (1e-11 / (IF97.Tc - T)) * scaleM3PerKg : Infinity);
  return bisectionResult(g, lo, hi, 60, -Infinity, noise, 1e-12, known);
}

/**
 * v_f and v_g at the fixed temperatures the envelope compares against, m³/kg: what
 * saturatedLiquidVolume / saturatedVaporVolume (IAPWS R7-97(2012): region 1 or 2 at p_s(T) from
 * Eq. (30); region 3, Eq. (28), from 623.15 K) return there, written out as the shortest decimals
 * that read back as the same doubles. Solving them in the first check cost a region 3 solve at
 * Tc, the dearest evaluation of a check, while the code was still cold; test/core/check/heat-up-envelope.test.ts
 * recomputes each and requires the same double.
 */
export const FIXED_SATURATED_VOLUMES_M3_PER_KG = {
  liquidAt623K: 0.0017400705518876086,
  liquidAtCriticalPoint: 0.0031038655297079033,
  liquidAtDensityMaximum: 0.0010000743344778164,
  vaporAt623K: 0.008800931931576298,
  vaporAtCriticalPoint: 0.0031038655297079033,
  vaporAtTriplePoint: 205.9974594853836,
} as const;
const FIXED = FIXED_SATURATED_VOLUMES_M3_PER_KG;

/** Liquid-full temperature for mean specific volume v, K, or null if the fill never goes liquid-full. v in m³/kg, > 0. */
export function liquidFullTemperatureK(v: number): number | null {
  // v_f rises from 277.14 K to Tc, so a v below v_f(623.15 K) is below v_c: the region 3 solve at
  // Tc (and its table of starting values) is needed only for fills near the critical volume.
  if (v >= FIXED.liquidAt623K && v >= FIXED.liquidAtCriticalPoint) return null;
  if (v <= FIXED.liquidAtDensityMaximum) return T_MIN_K;
  // g at 277.14 K, 623.15 K and Tc is stored: the root lies between two of them.
  const known = v > FIXED.liquidAt623K
    ? { below: T_13_K, fBelow: FIXED.liquidAt623K - v, above: IF97.Tc, fAbove: FIXED.liquidAtCriticalPoint - v }
    : { below: T_MAX_DENSITY_K, fBelow: FIXED.liquidAtDensityMaximum - v, above: T_13_K, fAbove: FIXED.liquidAt623K - v };
  return bisect((T) => saturatedLiquidVolume(T) - v, T_MAX_DENSITY_K, IF97.Tc, v, known);
}

/** All-vapor temperature for mean specific volume v, K, or null if the fill never dries out. v in m³/kg, > 0. */
export function allVaporTemperatureK(v: number): number | null {
  // v_g falls from the triple point to Tc: a v above v_g(623.15 K) is above v_c; and v_f rises to
  // the same v_c, so a v below v_f(623.15 K) (every fill more than about half liquid when cold) is
  // below it: only fills between those two need the region 3 solve at Tc.
  if (v < FIXED.liquidAt623K) return null;
  if (v <= FIXED.vaporAt623K && v <= FIXED.vaporAtCriticalPoint) return null;
  if (v >= FIXED.vaporAtTriplePoint) return T_MIN_K;
  const known = v > FIXED.vaporAt623K
    ? { below: IF97.Tt, fBelow: v - FIXED.vaporAtTriplePoint, above: T_13_K, fAbove: v - FIXED.vaporAt623K }
    : { below: T_13_K, fBelow: v - FIXED.vaporAt623K, above: IF97.Tc, fAbove: v - FIXED.vaporAtCriticalPoint };
  return bisect((T) => v - saturatedVaporVolume(T), IF97.Tt, IF97.Tc, v, known);
}

/** T_sat at an absolute pressure, K, or null above the critical pressure. p in Pa, ≥ 611.213 Pa (p_s at 273.15 K). */
export function saturationTemperatureOrNull(absolutePressurePa: number): number | null {
  return absolutePressurePa > IF97.pc ? null : saturationTemperature(absolutePressurePa);
}

/**
 * The heat-up envelope of a fill. volumeM3 > 0, massKg > 0, startTemperatureK 273.15–647.096 K,
 * gauge pressures and atmosphere in Pa (gauge + atmosphere ≥ 611.213 Pa).
 */
export function heatUpEnvelope(args: {
  volumeM3: number;
  massKg: number;
  startTemperatureK: number;
  reliefSetGaugePa: number;
  mawpGaugePa: number;
  atmospherePa: number;
}): HeatUpEnvelope {
  const v = args.volumeM3 / args.massKg;
  const lf = liquidFullTemperatureK(v);
  const av = allVaporTemperatureK(v);
  const relief = saturationTemperatureOrNull(args.reliefSetGaugePa + args.atmospherePa);
  const mawp = saturationTemperatureOrNull(args.mawpGaugePa + args.atmospherePa);
  const events: [EnvelopeEvent, number | null][] = [
    ['liquid-full', lf],
    ['relief-set-pressure', relief],
    ['mawp', mawp],
    ['all-vapor', av],
  ];
  let first: HeatUpEnvelope['first'] = { event: 'none' };
  for (const [event, t] of events) {
    if (t === null) continue;
    if (first.event === 'none' || t < first.temperatureK) {
      first = { event, temperatureK: t, alreadyReached: t <= args.startTemperatureK };
    }
  }
  return {
    meanSpecificVolumeM3PerKg: v,
    liquidFullTemperatureK: lf,
    allVaporTemperatureK: av,
    reliefSetTemperatureK: relief,
    mawpTemperatureK: mawp,
    first,
  };
}
