// Convert screen logic: one pressure in every unit (gauge and absolute at the site atmosphere),
// and temperature ↔ saturation pressure. All arithmetic goes through the core. Each answer carries
// the ± band that the typed figure's own resolution gives it (half a unit in its last typed place,
// the interval a rounded figure stands for: common practice), carried through the conversion (and
// the saturation line's slope), so the screen shows no digit the typed value cannot support.
import { errorText } from './error-text.ts';
import { readNumber } from './format.ts';
import {
  PRESSURE_UNITS,
  absoluteFromGauge,
  gaugeFromAbsolute,
  pressureFromPa,
  pressureToPa,
  saturationPressure,
  saturationSlopePaPerK,
  saturationTemperature,
  temperatureDifferenceFromK,
  temperatureDifferenceToK,
  temperatureFromK,
  temperatureToK,
} from '../../core/index.ts';
import type { PressureUnit, TemperatureUnit } from '../../core/index.ts';
import { messageOf } from './atmosphere.ts';

export type PressureKind = 'gauge' | 'absolute';

/** One unit's row; `band` is the ± the typed figure's resolution gives both columns, in that unit. */
export interface PressureRow { unit: PressureUnit; label: string; absolute: number; gauge: number; band: number }

/** Half a unit in the last place typed: "121" → 0.5, "0,35" → 0.005; the number's own unit. */
export function typedResolution(text: string): number {
  const t = text.trim().replace(/^[+\u2212-]/, '');
  const mantissa = t.split(/[eE]/)[0] ?? t;
  const exponent = Number(t.split(/[eE]/)[1] ?? 0) || 0;
  const point = mantissa.search(/[.,]/);
  const decimals = point < 0 ? 0 : mantissa.length - point - 1;
  return 0.5 * 10 ** (exponent - decimals);
}

export type PressureTable = { ok: true; rows: PressureRow[] } | { ok: false; error: string } | { ok: 'empty' };

/** The entered pressure in every unit, gauge and absolute. */
export function pressureInAllUnits(text: string, unit: PressureUnit, kind: PressureKind, atmospherePa: number): PressureTable {
  if (text.trim() === '') return { ok: 'empty' };
  try {
    const entered = pressureToPa(readNumber(text, 'pressure'), unit);
    const absolutePa = kind === 'absolute' ? entered : absoluteFromGauge(entered, atmospherePa);
    const gaugePa = gaugeFromAbsolute(absolutePa, atmospherePa);
    const bandPa = pressureToPa(typedResolution(text), unit);
    const rows = PRESSURE_UNITS.map((u) => ({
      unit: u.id as PressureUnit,
      label: u.label,
      absolute: pressureFromPa(absolutePa, u.id as PressureUnit),
      gauge: pressureFromPa(gaugePa, u.id as PressureUnit),
      band: pressureFromPa(bandPa, u.id as PressureUnit),
    }));
    return { ok: true, rows };
  } catch (e) {
    return { ok: false, error: messageOf(e) };
  }
}

export type SaturationAnswer =
  | { ok: 'empty' }
  | { ok: false; error: string }
  | { ok: true; temperature: number; absolute: number; gauge: number; temperatureBand: number; pressureBand: number };

/** Saturation pressure (absolute and gauge, in `pUnit`) for a typed temperature. */
export function saturationFromTemperature(
  text: string, tUnit: TemperatureUnit, pUnit: PressureUnit, atmospherePa: number,
): SaturationAnswer {
  if (text.trim() === '') return { ok: 'empty' };
  try {
    const T = temperatureToK(readNumber(text, 'temperature'), tUnit);
    const bandK = temperatureDifferenceToK(typedResolution(text), tUnit);
    return saturationAnswer(T, saturationPressure(T), bandK, bandK * saturationSlopePaPerK(T), tUnit, pUnit, atmospherePa);
  } catch (e) {
    return { ok: false, error: errorText(e, { kind: 'temperature', unit: tUnit }, text) };
  }
}

/** Saturation temperature (in `tUnit`) for a typed pressure, gauge or absolute. */
export function saturationFromPressure(
  text: string, pUnit: PressureUnit, kind: PressureKind, tUnit: TemperatureUnit, atmospherePa: number,
): SaturationAnswer {
  if (text.trim() === '') return { ok: 'empty' };
  try {
    const entered = pressureToPa(readNumber(text, 'pressure'), pUnit);
    const p = kind === 'absolute' ? entered : absoluteFromGauge(entered, atmospherePa);
    const T = saturationTemperature(p);
    const bandPa = pressureToPa(typedResolution(text), pUnit);
    return saturationAnswer(T, p, bandPa / saturationSlopePaPerK(T), bandPa, tUnit, pUnit, atmospherePa);
  } catch (e) {
    return { ok: false, error: errorText(e, { kind: 'pressure', unit: pUnit }, text) };
  }
}

/** One saturation state (T K, p Pa absolute, with their bands K and Pa) shown in the person's units, gauge and absolute. */
function saturationAnswer(T: number, p: number, bandK: number, bandPa: number, tUnit: TemperatureUnit, pUnit: PressureUnit, atmospherePa: number): SaturationAnswer {
  return {
    ok: true,
    temperature: temperatureFromK(T, tUnit),
    absolute: pressureFromPa(p, pUnit),
    gauge: pressureFromPa(gaugeFromAbsolute(p, atmospherePa), pUnit),
    temperatureBand: temperatureDifferenceFromK(bandK, tUnit),
    pressureBand: pressureFromPa(bandPa, pUnit),
  };
}
