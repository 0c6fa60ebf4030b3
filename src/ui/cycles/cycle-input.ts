// Between what the person types for a cycle (the cycle type in their units, readings as text in
// the vessel's units) and what the core takes (SI). Every refusal names the field and its range;
// nothing is guessed: a reading that cannot be read refuses the evaluation with its number.
import {
  COMMON_CYCLE_TYPES, evaluateCycle, type CycleEvaluation, type CycleReading, type CycleRecordInput, type CycleTypeInput,
} from '../../core/cycle/index.ts';
import type { VesselSpec } from '../../core/check/vessel-spec.ts';
import { pressureToPa, temperatureFromK, temperatureToK, type PressureUnit, type TemperatureUnit } from '../../core/units/index.ts';
import { errorText } from '../state/error-text.ts';
import { formatEditable, readNumber } from '../state/format.ts';

/** The cycle type as typed: the sterilising temperature in the chosen unit, times in minutes, bands and limits in K. */
export interface CycleTypeFields {
  temperatureText: string;
  temperatureUnit: TemperatureUnit;
  holdMinutesText: string;
  bandAboveText: string;
  bandBelowText: string;
  saturationLimitText: string;
  referenceText: string;
  zText: string;
}

/** How the readings' numbers are to be read. */
export interface ReadingUnits {
  temperature: TemperatureUnit;
  pressure: PressureUnit;
  reference: 'gauge' | 'absolute';
}

/** One reading as typed or read from a file: seconds from the cycle's start, and the two numbers as text. */
export interface TypedReading {
  timeS: number;
  temperature: string;
  pressure: string;
}

/** The first common cycle type (121 °C, 15 min; common practice, every site sets its own) in the given unit. */
export function defaultCycleFields(unit: TemperatureUnit): CycleTypeFields {
  const t = COMMON_CYCLE_TYPES[0].cycleType;
  return {
    temperatureText: formatEditable(temperatureFromK(t.sterilisingTemperatureK, unit)),
    temperatureUnit: unit,
    holdMinutesText: formatEditable(t.holdTimeS / 60),
    bandAboveText: formatEditable(t.bandAboveK),
    bandBelowText: formatEditable(t.bandBelowK),
    saturationLimitText: formatEditable(t.saturationLimitK),
    referenceText: formatEditable(temperatureFromK(t.lethality.referenceTemperatureK, unit)),
    zText: formatEditable(t.lethality.zK),
  };
}

/** The cycle type in SI. @throws InputError or a parse error naming the field */
export function cycleTypeOf(f: CycleTypeFields): CycleTypeInput {
  return {
    sterilisingTemperatureK: temperatureToK(readNumber(f.temperatureText, 'sterilising temperature'), f.temperatureUnit, 'sterilising temperature'),
    holdTimeS: readNumber(f.holdMinutesText, 'hold time') * 60,
    bandAboveK: readNumber(f.bandAboveText, 'band above the sterilising temperature'),
    bandBelowK: readNumber(f.bandBelowText, 'band below the sterilising temperature'),
    saturationLimitK: readNumber(f.saturationLimitText, 'saturation limit'),
    lethality: {
      referenceTemperatureK: temperatureToK(readNumber(f.referenceText, 'F-value reference temperature'), f.temperatureUnit, 'F-value reference temperature'),
      zK: readNumber(f.zText, 'z-value'),
    },
  };
}

/** The readings in SI (absolute pressure: gauge readings plus the vessel's site atmosphere). @throws naming "reading N …" */
export function readingsOf(typed: readonly TypedReading[], units: ReadingUnits, siteAtmospherePa: number): CycleReading[] {
  return typed.map((r, i) => {
    const n = i + 1;
    const temperatureK = temperatureToK(readNumber(r.temperature, `reading ${n} temperature`), units.temperature, `reading ${n} temperature`);
    const pa = pressureToPa(readNumber(r.pressure, `reading ${n} pressure`), units.pressure, `reading ${n} pressure`);
    return { timeS: r.timeS, temperatureK, absolutePressurePa: units.reference === 'gauge' ? pa + siteAtmospherePa : pa };
  });
}

/** What evaluating a cycle gave: the evaluation with the input it was made from, or why it could not be made. */
export type CycleOutcome =
  | { kind: 'result'; input: CycleRecordInput; evaluation: CycleEvaluation }
  | { kind: 'error'; message: string };

/** Evaluates the typed cycle on a vessel with the core; a refusal comes back in words naming the field. */
export function evaluateTypedCycle(spec: VesselSpec, fields: CycleTypeFields, typed: readonly TypedReading[], units: ReadingUnits): CycleOutcome {
  try {
    const input: CycleRecordInput = {
      cycleType: cycleTypeOf(fields),
      readings: readingsOf(typed, units, spec.siteAtmospherePa),
      pressureMeasured: units.reference,
    };
    return { kind: 'result', input, evaluation: evaluateCycle(spec, input) };
  } catch (e) {
    return { kind: 'error', message: errorText(e) };
  }
}
