// What happens to this fill if the closed vessel is heated: the mean specific volume v = V/m is
// fixed, so the contents go liquid-full where v_f(T) = v (if v < v_c) or all vapor where
// v_g(T) = v (if v > v_c); meanwhile p_sat(T) climbs to the relief set pressure and the MAWP.
// Hydraulic expansion of blocked-in liquid is a relief case in API Std 521 (§4.4.12 in the 6th ed.);
// judging a fill by its liquid-full temperature rather than a fixed percentage follows from the mass
// and volume balance above (our own rule).

import { IF97, saturation, saturationTemperature } from '../steam/index.ts';

/** Minimum of v_f(T) in IF97, K (277.14 K, found with python-iapws 1.5.2 on a 0.01 K grid): v_f rises monotonically above it. */
const T_MAX_DENSITY_K = 277.14;

export type EnvelopeEvent = 'liquid-full' | 'all-vapor' | 'relief-set-pressure' | 'mawp';

export interface HeatUpEnvelope {
  /** v = V/m, m³/kg. */
  meanSpecificVolumeM3PerKg: number;
  /** T where v_f(T) = v, K; 273.16 if liquid-full at any temperature; null if never (v ≥ v_c). */
  liquidFullTemperatureK: number | null;
  /** T where v_g(T) = v, K; 273.16 if all vapor at any temperature; null if never (v ≤ v_c). */
  allVaporTemperatureK: number | null;
  /** T_sat(relief set pressure + atmosphere), K; null above the critical pressure. */
  reliefSetTemperatureK: number | null;
  /** T_sat(MAWP + atmosphere), K; null above the critical pressure. */
  mawpTemperatureK: number | null;
  /** The event at the lowest temperature (ties: liquid-full, relief, MAWP, all vapor), and whether the start temperature is already at or past it. */
  first: { event: EnvelopeEvent; temperatureK: number; alreadyReached: boolean } | { event: 'none' };
}

/** Solves g(T) = 0 for a g that rises with T on [lo, hi] (sign change assumed), 60 bisection steps. */
function bisect(g: (T: number) => number, lo: number, hi: number): number {
  for (let i = 0; i < 60; i++) {
    const mid = 0.5 * (lo + hi);
    if (g(mid) < 0) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/** Liquid-full temperature for mean specific volume v, K, or null if the fill never goes liquid-full. v in m³/kg, > 0. */
export function liquidFullTemperatureK(v: number): number | null {
  const vc = saturation(IF97.Tc).liquid.v;
  if (v >= vc) return null;
  if (v <= saturation(T_MAX_DENSITY_K).liquid.v) return IF97.Tt;
  return bisect((T) => saturation(T).liquid.v - v, T_MAX_DENSITY_K, IF97.Tc);
}

/** All-vapor temperature for mean specific volume v, K, or null if the fill never dries out. v in m³/kg, > 0. */
export function allVaporTemperatureK(v: number): number | null {
  const vc = saturation(IF97.Tc).vapor.v;
  if (v <= vc) return null;
  if (v >= saturation(IF97.Tt).vapor.v) return IF97.Tt;
  return bisect((T) => v - saturation(T).vapor.v, IF97.Tt, IF97.Tc);
}

/** T_sat at an absolute pressure, K, or null above the critical pressure. p in Pa, ≥ 611.657 Pa. */
export function saturationTemperatureOrNull(absolutePressurePa: number): number | null {
  return absolutePressurePa > IF97.pc ? null : saturationTemperature(absolutePressurePa);
}

/**
 * The heat-up envelope of a fill. volumeM3 > 0, massKg > 0, startTemperatureK 273.16–647.096 K,
 * gauge pressures and atmosphere in Pa (gauge + atmosphere ≥ 611.657 Pa).
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
