// Lethality of a moist-heat exposure as an F-value: the time at the reference temperature that
// kills as many of a reference organism as the recorded exposure, with a z-value (the temperature
// rise that makes killing ten times faster):
//
//   F = ∫ 10^((T(t) − T_ref)/z) dt,   in minutes,
//
// integrated by the trapezoid rule over the readings (the rate 10^((T − T_ref)/z) is averaged over
// each interval, not the temperature). F₀ is the case T_ref = 121.1 °C (394.25 K), z = 10 K. The
// formula and the F₀ constants are from memory (the F₀ concept of ISO 17665-1 and of the European
// Pharmacopoeia, 5.1.5); they are checked in the tests against closed forms only. F says how much
// heat the readings show at the measuring point; it is not a statement about any load.
//
// Valid for temperatures 273.16–647.096 K (the range of every other reading in the core), a
// reference temperature in the same range and z from 1 to 100 K; 10^((T − T_ref)/z) is then finite
// except for extreme pairs (z near 1 K and T hundreds of kelvin above T_ref), which are refused.

import { InputError, requireInRange } from '../errors.ts';
import { requireEachInRange, requireTimeSeries } from './time-series.ts';

/** F₀: reference temperature 121.1 °C and z = 10 K (from memory: ISO 17665-1, Ph. Eur. 5.1.5). */
export const LETHALITY_DEFAULTS = { referenceTemperatureK: 394.25, zK: 10 } as const;

/** Valid ranges, SI. */
export const LETHALITY_LIMITS = {
  temperatureK: { min: 273.16, max: 647.096, unit: 'K' },
  referenceTemperatureK: { min: 273.16, max: 647.096, unit: 'K' },
  zK: { min: 1, max: 100, unit: 'K' },
} as const;

/** Lethal rate 10^((T − T_ref)/z) at one temperature: minutes at T_ref per minute at T. T, T_ref, z in K. */
export function lethalRate(temperatureK: number, referenceTemperatureK: number, zK: number): number {
  return 10 ** ((temperatureK - referenceTemperatureK) / zK);
}

/**
 * Trapezoid sum of the lethal rate over already valid points (times s strictly increasing,
 * temperatures K), minutes. Throws InputError on "z-value" if the sum is not a finite number.
 */
export function lethalityMinutesOf(points: readonly { timeS: number; temperatureK: number }[], referenceTemperatureK: number, zK: number): number {
  let sumRateSeconds = 0;
  let previous = points[0];
  let previousRate = previous === undefined ? 0 : lethalRate(previous.temperatureK, referenceTemperatureK, zK);
  for (let i = 1; i < points.length; i++) {
    const p = points[i]!;
    const rate = lethalRate(p.temperatureK, referenceTemperatureK, zK);
    sumRateSeconds += 0.5 * (previousRate + rate) * (p.timeS - previous!.timeS);
    previous = p;
    previousRate = rate;
  }
  const minutes = sumRateSeconds / 60;
  if (!Number.isFinite(minutes)) {
    throw new InputError('z-value', 'out-of-range', zK, LETHALITY_LIMITS.zK,
      `z-value: with z = ${zK} K and readings up to ${points.reduce((m, q) => Math.max(m, q.temperatureK), -Infinity)} K against a reference of ${referenceTemperatureK} K the F-value exceeds the number range; a larger z-value or a higher reference temperature is needed.`);
  }
  return minutes;
}

/**
 * F-value of a temperature record, minutes, by the trapezoid rule.
 * @param readings 2 to 200 000 readings: timeS s (strictly increasing), temperatureK 273.16–647.096 K
 * @param options referenceTemperatureK 273.16–647.096 K (default 394.25 K = 121.1 °C); zK 1–100 K (default 10 K)
 * @throws InputError naming the field: "readings", "reading N time", "reading N temperature",
 *   "F-value reference temperature", "z-value"
 */
export function lethality(
  readings: readonly { timeS: number; temperatureK: number }[],
  options: { referenceTemperatureK?: number; zK?: number } = {},
): { minutes: number } {
  const L = LETHALITY_LIMITS;
  const Tref = requireInRange('F-value reference temperature', options.referenceTemperatureK ?? LETHALITY_DEFAULTS.referenceTemperatureK,
    L.referenceTemperatureK.min, L.referenceTemperatureK.max, L.referenceTemperatureK.unit);
  const z = requireInRange('z-value', options.zK ?? LETHALITY_DEFAULTS.zK, L.zK.min, L.zK.max, L.zK.unit);
  requireTimeSeries(readings);
  requireEachInRange(readings, 'temperatureK', 'temperature', L.temperatureK);
  return { minutes: lethalityMinutesOf(readings, Tref, z) };
}
