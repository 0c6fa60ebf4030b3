// Each reading of a cycle as a saturation check: the measured temperature against T_sat of the
// measured pressure, inside the same instrument band as a single check (src/core/check's
// checkSaturation, called as it is, so a cycle and a check can never disagree about one pair), and
// against the sterilising standards' own limit of measured against theoretical temperature.
//
// Agreement can show gross air only (percent level, about 0.3 K of depression per 1 % of air by
// Dalton's law): it cannot see gas at the level of the non-condensable gas test, and it never
// replaces an air-removal test (shared/reference/field-practice.md §4.3, §7.2).

import type { ResolvedReading } from '../check/reading.ts';
import { checkSaturation, type SaturationVerdict } from '../check/saturation-consistency.ts';
import type { VesselSpec } from '../check/vessel-spec.ts';

/** One reading's saturation agreement. */
export interface SaturationPair {
  timeS: number;
  temperatureK: number;
  absolutePressurePa: number;
  /** T_sat(p) of the measured absolute pressure, K. */
  saturationTemperatureK: number;
  /** T − T_sat(p), K: negative when the pressure is above saturation for the temperature (air, or a low-reading thermometer). */
  deviationK: number;
  /** ± band of the instruments in K, root-sum-square, exactly as the single check computes it. */
  instrumentBandK: number;
  /** The single check's verdict on this pair. */
  instrumentVerdict: SaturationVerdict['verdict'];
  /** |T − T_sat(p)| within the cycle type's saturation limit. */
  withinLimit: boolean;
}

/**
 * Every reading's saturation agreement as columns, index i for reading i + 1: a long record is stored
 * in the log, and columns keep it about a third of the size of one object per reading (5 000
 * readings: 0.39 MB of JSON against 1.27 MB).
 */
export interface SaturationColumns {
  saturationTemperatureK: number[];
  deviationK: number[];
  instrumentBandK: number[];
  instrumentVerdict: SaturationVerdict['verdict'][];
  withinLimit: boolean[];
}

/** The pairs as columns. */
export function saturationColumns(pairs: readonly SaturationPair[]): SaturationColumns {
  return {
    saturationTemperatureK: pairs.map((p) => p.saturationTemperatureK),
    deviationK: pairs.map((p) => p.deviationK),
    instrumentBandK: pairs.map((p) => p.instrumentBandK),
    instrumentVerdict: pairs.map((p) => p.instrumentVerdict),
    withinLimit: pairs.map((p) => p.withinLimit),
  };
}

/** How the cycle's pressures were measured, for the instrument band. */
export interface PressureMeasurement {
  /** 'absolute' from an absolute transducer; 'gauge' read relative to the atmosphere and converted at the edge. */
  pressureMeasured: 'absolute' | 'gauge';
  /** The atmosphere used for that conversion, Pa, and whether a barometer gave it ('measured') or the vessel's site value ('site'). */
  atmospherePa: number;
  atmosphereSource: 'measured' | 'site';
}

/**
 * Saturation agreement of each (T, p) pair; vessel already validated, readings already in range
 * (T 273.16–647.096 K, p 611.657 Pa–22.064 MPa absolute).
 */
export function saturationPairs(
  vessel: VesselSpec,
  readings: readonly { timeS: number; temperatureK: number; absolutePressurePa: number }[],
  measurement: PressureMeasurement,
  saturationLimitK: number,
): SaturationPair[] {
  return readings.map((r) => {
    const resolved: ResolvedReading = {
      time: '', // checkSaturation reads no time; the cycle's readings carry seconds from the record's origin
      temperatureK: r.temperatureK,
      absolutePressurePa: r.absolutePressurePa,
      gaugePressurePa: r.absolutePressurePa - measurement.atmospherePa,
      atmospherePa: measurement.atmospherePa,
      atmosphereSource: measurement.atmosphereSource,
      netMassKg: null,
    };
    // Liquid present unknown (null): a chamber may hold only steam, so a pressure below saturation
    // can be superheat there.
    const s = checkSaturation(vessel, resolved, measurement.pressureMeasured, null);
    return {
      timeS: r.timeS,
      temperatureK: r.temperatureK,
      absolutePressurePa: r.absolutePressurePa,
      saturationTemperatureK: s.saturationTemperatureK,
      deviationK: s.temperatureDeviationK,
      instrumentBandK: s.temperatureBandK.plusMinus,
      instrumentVerdict: s.verdict.verdict,
      withinLimit: Math.abs(s.temperatureDeviationK) <= saturationLimitK,
    };
  });
}
