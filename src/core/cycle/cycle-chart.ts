// What a picture of a cycle needs, as plain data in SI: the measured temperature and T_sat of the
// measured pressure over time, the instruments' band around T_sat(p), the temperature band, and
// the hold. The drawing and the display units belong to the screen.

import { InputError } from '../errors.ts';
import type { CycleEvaluation, CycleReading } from './cycle-evaluation.ts';

export interface CycleChart {
  /** One point per reading: seconds from the first reading, T K, T_sat(p) K and the instruments' ± band K. */
  points: { elapsedS: number; temperatureK: number; saturationTemperatureK: number; instrumentBandK: number }[];
  /** The cycle type's band, K, and its sterilising temperature. */
  band: { lowerK: number; upperK: number; sterilisingTemperatureK: number };
  /** The measured-against-theoretical temperature limit, ± K around T_sat(p). */
  saturationLimitK: number;
  /**
   * The judged interval (seconds from the first reading) and where the hold time ends counted from its
   * start (it may lie beyond the interval when the hold was short or interrupted); null when not reached.
   */
  hold: { status: CycleEvaluation['hold']['status']; startS: number; endS: number; requiredEndS: number } | null;
  /** Extent of the record: seconds from the first to the last reading. */
  durationS: number;
}

/**
 * The chart data of an evaluated cycle, from the evaluation and the readings it was made from (times
 * as seconds from the first reading). Throws InputError on "readings" if they are not those readings.
 */
export function cycleChart(e: CycleEvaluation, readings: readonly CycleReading[]): CycleChart {
  const s = e.saturationByReading;
  if (!Array.isArray(readings) || readings.length !== e.readingCount || readings[0]?.timeS !== e.firstTimeS) {
    throw new InputError('readings', 'inconsistent', Array.isArray(readings) ? readings.length : String(readings), undefined,
      `readings: not the ${e.readingCount} readings this evaluation was made from.`);
  }
  const t0 = e.firstTimeS;
  const h = e.hold;
  return {
    points: readings.map((r, i) => ({
      elapsedS: r.timeS - t0,
      temperatureK: r.temperatureK,
      saturationTemperatureK: s.saturationTemperatureK[i]!,
      instrumentBandK: s.instrumentBandK[i]!,
    })),
    band: { ...e.band, sterilisingTemperatureK: e.cycleType.sterilisingTemperatureK },
    saturationLimitK: e.cycleType.saturationLimitK,
    hold: h.startS === null || h.endS === null ? null
      : { status: h.status, startS: h.startS - t0, endS: h.endS - t0, requiredEndS: h.startS - t0 + h.requiredS },
    durationS: e.lastTimeS - t0,
  };
}
