// Convert screen logic: one pressure in every unit (gauge and absolute at the site atmosphere),
// and temperature ↔ saturation pressure. All arithmetic goes through the core.
import { errorText } from './error-text.ts';
import { readNumber } from './format.ts';
import {
  PRESSURE_UNITS,
  absoluteFromGauge,
  gaugeFromAbsolute,
  pressureFromPa,
  pressureToPa,
  saturationPressure,
  saturationTemperature,
  temperatureFromK,
  temperatureToK,
} from '../../core/index.ts';
import type { PressureUnit, TemperatureUnit } from '../../core/index.ts';
import { messageOf } from './atmosphere.ts';

export type PressureKind = 'gauge' | 'absolute';

export interface PressureRow { unit: PressureUnit; label: string; absolute: number; gauge: number }

export type PressureTable = { ok: true; rows: PressureRow[] } | { ok: false; error: string } | { ok: 'empty' };

/** The entered pressure in every unit, gauge and absolute. */
export function pressureInAllUnits(text: string, unit: PressureUnit, kind: PressureKind, atmospherePa: number): PressureTable {
  if (text.trim() === '') return { ok: 'empty' };
  try {
    const entered = pressureToPa(readNumber(text, 'pressure'), unit);
    const absolutePa = kind === 'absolute' ? entered : absoluteFromGauge(entered, atmospherePa);
    const gaugePa = gaugeFromAbsolute(absolutePa, atmospherePa);
    const rows = PRESSURE_UNITS.map((u) => ({
      unit: u.id as PressureUnit,
      label: u.label,
      absolute: pressureFromPa(absolutePa, u.id as PressureUnit),
      gauge: pressureFromPa(gaugePa, u.id as PressureUnit),
    }));
    return { ok: true, rows };
  } catch (e) {
    return { ok: false, error: messageOf(e) };
  }
}

export type SaturationAnswer =
  | { ok: 'empty' }
  | { ok: false; error: string }
  | { ok: true; temperature: number; absolute: number; gauge: number };

/** Saturation pressure (absolute and gauge, in `pUnit`) for a typed temperature. */
export function saturationFromTemperature(
  text: string, tUnit: TemperatureUnit, pUnit: PressureUnit, atmospherePa: number,
): SaturationAnswer {
  if (text.trim() === '') return { ok: 'empty' };
  try {
    const T = temperatureToK(readNumber(text, 'temperature'), tUnit);
    return saturationAnswer(T, saturationPressure(T), tUnit, pUnit, atmospherePa);
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
    return saturationAnswer(saturationTemperature(p), p, tUnit, pUnit, atmospherePa);
  } catch (e) {
    return { ok: false, error: errorText(e, { kind: 'pressure', unit: pUnit }, text) };
  }
}

/** One saturation state (T K, p Pa absolute) shown in the person's units, gauge and absolute. */
function saturationAnswer(T: number, p: number, tUnit: TemperatureUnit, pUnit: PressureUnit, atmospherePa: number): SaturationAnswer {
  return {
    ok: true,
    temperature: temperatureFromK(T, tUnit),
    absolute: pressureFromPa(p, pUnit),
    gauge: pressureFromPa(gaugeFromAbsolute(p, atmospherePa), pUnit),
  };
}
