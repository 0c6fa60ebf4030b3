// Temperature: kelvin inside the core; degrees Celsius, Fahrenheit and Rankine at the edges.
//
// A temperature and a temperature difference convert differently (an offset against none), so they
// have separate functions: a tolerance of "2 °F" is 1.111 K, not 256 K.
import { InputError } from '../errors.ts';
import { requireFinite, type UnitInfo } from './unit-info.ts';

export type TemperatureUnit = 'K' | 'degC' | 'degF' | 'degR';

/**
 * The defining numbers of the scales. NIST SP 811 (2008), Appendix B.8/B.9, temperature rows, all exact:
 * T/K = t/°C + 273.15;  t/°C = (t/°F − 32)/1.8;  T/K = (T/°R)/1.8.
 */
export const TEMPERATURE_SCALE = {
  /** kelvin at 0 °C */
  celsiusZeroK: 273.15,
  /** °F (and °R) per kelvin (and per °C) of difference */
  fahrenheitPerKelvin: 1.8,
  /** °F at 0 °C */
  fahrenheitAtCelsiusZero: 32,
} as const;

/** Temperature units for pickers, in the order a picker shows them. */
export const TEMPERATURE_UNITS: readonly UnitInfo<TemperatureUnit>[] = [
  { id: 'degC', label: '°C', name: 'degree Celsius', decimals: 1 },
  { id: 'degF', label: '°F', name: 'degree Fahrenheit', decimals: 1 },
  { id: 'K', label: 'K', name: 'kelvin', decimals: 2 },
  { id: 'degR', label: '°R', name: 'degree Rankine', decimals: 1 },
];

const IDS: readonly string[] = TEMPERATURE_UNITS.map((u) => u.id);

/** True when `unit` is one of the temperature unit ids (for data read back from storage). */
export function isTemperatureUnit(unit: unknown): unit is TemperatureUnit {
  return typeof unit === 'string' && IDS.includes(unit);
}

const { celsiusZeroK: C0, fahrenheitPerKelvin: F_PER_K, fahrenheitAtCelsiusZero: F0 } = TEMPERATURE_SCALE;

/**
 * A temperature in `unit` as kelvin.
 * @param value finite, at or above absolute zero (0 K, −273.15 °C, −459.67 °F, 0 °R).
 * @param field the field an error names (default "temperature").
 * @throws InputError 'not-a-number' for NaN/±Infinity, 'out-of-range' below absolute zero.
 * @throws RangeError for an unknown unit id.
 */
export function temperatureToK(value: number, unit: TemperatureUnit, field = 'temperature'): number {
  requireFinite(field, value);
  let kelvin: number;
  switch (unit) {
    case 'K': kelvin = value; break;
    case 'degC': kelvin = value + C0; break;
    // Through °C, as NIST states the °F row, so that 32 °F and 212 °F land exactly on 273.15 K and 373.15 K.
    case 'degF': kelvin = (value - F0) / F_PER_K + C0; break;
    case 'degR': kelvin = value / F_PER_K; break;
    default: throw new RangeError(`Unknown temperature unit "${String(unit)}".`);
  }
  // −459.67 °F lands a rounding step below 0 K; a nanokelvin of slack keeps absolute zero itself valid.
  if (kelvin < -1e-9) {
    throw new InputError(field, 'out-of-range', value, { min: 0, max: Number.POSITIVE_INFINITY, unit: 'K' },
      `${field}: ${value} ${labelOf(unit)} is below absolute zero (0 K = ${absoluteZeroIn(unit)} ${labelOf(unit)}).`);
  }
  return kelvin < 0 ? 0 : kelvin;
}

/**
 * A temperature in kelvin expressed in `unit`.
 * @param temperatureK finite, ≥ 0 K.
 * @throws InputError 'not-a-number' for NaN/±Infinity, 'out-of-range' below 0 K.
 * @throws RangeError for an unknown unit id.
 */
export function temperatureFromK(temperatureK: number, unit: TemperatureUnit, field = 'temperature'): number {
  requireFinite(field, temperatureK);
  if (temperatureK < 0) {
    throw new InputError(field, 'out-of-range', temperatureK, { min: 0, max: Number.POSITIVE_INFINITY, unit: 'K' },
      `${field}: ${temperatureK} K is below absolute zero.`);
  }
  switch (unit) {
    case 'K': return temperatureK;
    case 'degC': return temperatureK - C0;
    case 'degF': return (temperatureK - C0) * F_PER_K + F0;
    case 'degR': return temperatureK * F_PER_K;
    default: throw new RangeError(`Unknown temperature unit "${String(unit)}".`);
  }
}

/**
 * A temperature difference (tolerance, rise, superheat) in `unit` as kelvin: no offset, any sign.
 * @throws InputError 'not-a-number' for NaN/±Infinity. @throws RangeError for an unknown unit id.
 */
export function temperatureDifferenceToK(difference: number, unit: TemperatureUnit, field = 'temperature difference'): number {
  requireFinite(field, difference);
  switch (unit) {
    case 'K': case 'degC': return difference;
    case 'degF': case 'degR': return difference / F_PER_K;
    default: throw new RangeError(`Unknown temperature unit "${String(unit)}".`);
  }
}

/**
 * A temperature difference in kelvin expressed in `unit`: no offset, any sign.
 * @throws InputError 'not-a-number' for NaN/±Infinity. @throws RangeError for an unknown unit id.
 */
export function temperatureDifferenceFromK(differenceK: number, unit: TemperatureUnit, field = 'temperature difference'): number {
  requireFinite(field, differenceK);
  switch (unit) {
    case 'K': case 'degC': return differenceK;
    case 'degF': case 'degR': return differenceK * F_PER_K;
    default: throw new RangeError(`Unknown temperature unit "${String(unit)}".`);
  }
}

function labelOf(unit: TemperatureUnit): string {
  return TEMPERATURE_UNITS.find((u) => u.id === unit)?.label ?? unit;
}

function absoluteZeroIn(unit: TemperatureUnit): string {
  switch (unit) {
    case 'degC': return '−273.15';
    case 'degF': return '−459.67';
    default: return '0';
  }
}
