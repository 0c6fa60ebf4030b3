// The shapes of a cycle evaluation, in their own module so the evaluation, its cautions and the
// chart share them without importing each other both ways.

import type { FORMULATION_ID } from '../steam/index.ts';
import type { Graded } from '../graded-result.ts';
import type { CycleType, CycleTypeInput } from './cycle-type.ts';
import type { CycleHold, Equilibration } from './hold.ts';
import type { PressureMeasurement, SaturationColumns } from './saturation-pairs.ts';

/** One reading of a cycle: seconds from any origin, temperature K, absolute pressure Pa. */
export interface CycleReading {
  timeS: number;
  temperatureK: number;
  absolutePressurePa: number;
}

/** What the evaluation takes besides the vessel. */
export interface CycleRecordInput {
  cycleType: CycleTypeInput;
  readings: readonly CycleReading[];
  /** How the pressures were measured: 'absolute' (an absolute transducer) or 'gauge', converted to absolute at the edge. */
  pressureMeasured: 'absolute' | 'gauge';
  /** For gauge pressures: the atmosphere the edge used, Pa, and whether a barometer gave it. Default: the vessel's site value. */
  atmosphere?: { pressurePa: number; source: 'measured' | 'site' };
}

/** The saturation agreement of the readings inside the hold. */
export interface HoldSaturation {
  /** Readings inside the judged interval. */
  readings: number;
  /** Of those, how many differ from T_sat(p) by more than the saturation limit. */
  outsideLimit: number;
  /** The reading with the largest |T − T_sat(p)|: when, and T − T_sat(p) in K (signed). */
  largestDeviation: { timeS: number; deviationK: number } | null;
  /** How many the single check would call pressure above / below saturation (outside the instrument band). */
  pressureAboveSaturation: number;
  pressureBelowSaturation: number;
  /** Largest pressure-above-saturation beyond the band: the coldest T − T_sat(p), K (≤ 0), or null. */
  coldestAboveBandK: number | null;
  /** Largest pressure-below-saturation beyond the band: the hottest T − T_sat(p), K (≥ 0), or null. */
  hottestBelowBandK: number | null;
  /** Widest instrument band among them, ± K. */
  widestInstrumentBandK: number | null;
}

export interface CycleEvaluation extends Graded {
  formulationId: typeof FORMULATION_ID;
  cycleType: CycleType;
  /** The temperature band, K. */
  band: { lowerK: number; upperK: number };
  measurement: PressureMeasurement;
  readingCount: number;
  firstTimeS: number;
  lastTimeS: number;
  equilibration: Equilibration;
  hold: CycleHold;
  /** Time within the band over the whole record, s. */
  timeInBandS: number;
  /** Time within the band over the judged interval, s. */
  timeInBandDuringHoldS: number;
  /** Lowest and highest temperature over the judged interval, K; null when not reached. */
  holdTemperature: { minK: number; maxK: number } | null;
  /** Largest departure from the band over the judged interval; null when it stayed inside. */
  largestExcursion: { direction: 'above' | 'below'; byK: number; timeS: number } | null;
  /** Highest rise above the band's upper limit over the judged interval (even when a dip below was larger); null if none. */
  bandExceeded: { byK: number; timeS: number } | null;
  /** Largest interval between readings over the judged interval, s; null when not reached. */
  largestReadingIntervalDuringHoldS: number | null;
  holdSaturation: HoldSaturation | null;
  /** Lowest and highest temperature of the whole record, K. */
  temperatureRange: { minK: number; maxK: number };
  /** Every reading's saturation agreement, as columns in the order of the readings. */
  saturationByReading: SaturationColumns;
  lethality: { referenceTemperatureK: number; zK: number; wholeRecordMinutes: number; holdMinutes: number };
}

/** The figures of an evaluation, before its cautions. */
export type CycleFigures = Omit<CycleEvaluation, keyof Graded>;
