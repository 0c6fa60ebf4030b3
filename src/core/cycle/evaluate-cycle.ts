// From a sterilising cycle's readings (time, temperature, absolute pressure) and its cycle type to
// what the readings show: equilibration, the hold, time in band, the largest excursion, the
// saturation agreement of every pair, the F-value, and an outcome with cautions like a check's.
// Pure, SI, plain serialisable data out (no NaN, no Infinity), ready for the log.
//
// It reports what the readings show at the measuring point. Whether a load may be released is for
// the site's validated procedure, the standards it follows and licensed practice; no wording here
// claims more than the readings.

import { InputError, requireInRange } from '../errors.ts';
import { requireFiniteData } from '../check/finite-data.ts';
import { READING_LIMITS } from '../check/reading.ts';
import { validateVessel, VESSEL_LIMITS, type VesselSpec } from '../check/vessel-spec.ts';
import { FORMULATION_ID } from '../steam/index.ts';
import { cycleCautions } from './cycle-cautions.ts';
import type { CycleEvaluation, CycleFigures, CycleRecordInput, HoldSaturation } from './cycle-evaluation.ts';
import { resolveCycleType } from './cycle-type.ts';
import { findEquilibration, findHold, type CycleHold } from './hold.ts';
import { lethalityMinutesOf } from './lethality.ts';
import { saturationColumns, saturationPairs, type PressureMeasurement, type SaturationPair } from './saturation-pairs.ts';
import {
  extremesWithin, largestIntervalWithin, requireEachInRange, requireTimeSeries, sliceSeries, timeWithin, type Series,
} from './time-series.ts';

/** Interval the band and saturation are judged over: [hold.startS, hold.endS], or null when not reached. */
function judgedInterval(hold: CycleHold): { fromS: number; toS: number } | null {
  return hold.startS === null || hold.endS === null ? null : { fromS: hold.startS, toS: hold.endS };
}

/**
 * Evaluates one cycle on one vessel (SI: K, Pa, s). Validates everything first and throws
 * InputError naming the field: any vessel field (see validateVessel); the cycle type's fields (see
 * resolveCycleType); "pressure measured" ('absolute' or 'gauge'); "atmospheric pressure"
 * (30–110 kPa); "readings" (2–200 000); "reading N time" (finite, increasing); "reading N
 * temperature" (273.16–647.096 K); "reading N pressure (absolute)" (611.657 Pa–22.064 MPa).
 */
export function evaluateCycle(vessel: VesselSpec, input: CycleRecordInput): CycleEvaluation {
  validateVessel(vessel);
  if (input === null || typeof input !== 'object') {
    throw new InputError('cycle', 'empty', String(input), undefined, 'cycle: no cycle record was given.');
  }
  const cycleType = resolveCycleType(input.cycleType);
  if (input.pressureMeasured !== 'absolute' && input.pressureMeasured !== 'gauge') {
    throw new InputError('pressure measured', 'out-of-range', String(input.pressureMeasured), undefined,
      'pressure measured: must be "absolute" or "gauge".');
  }
  const A = VESSEL_LIMITS.siteAtmospherePa;
  const atmospherePa = requireInRange('atmospheric pressure', input.atmosphere?.pressurePa ?? vessel.siteAtmospherePa, A.min, A.max, A.unit);
  const atmosphereSource = input.atmosphere?.source ?? 'site';
  if (atmosphereSource !== 'measured' && atmosphereSource !== 'site') {
    throw new InputError('atmosphere source', 'out-of-range', String(atmosphereSource), undefined, 'atmosphere source: must be "measured" or "site".');
  }
  const readings = input.readings;
  requireTimeSeries(readings);
  requireEachInRange(readings, 'temperatureK', 'temperature', READING_LIMITS.temperatureK);
  requireEachInRange(readings, 'absolutePressurePa', 'pressure (absolute)', READING_LIMITS.absolutePressurePa);
  const measurement: PressureMeasurement = { pressureMeasured: input.pressureMeasured, atmospherePa, atmosphereSource };

  const band = { lowerK: cycleType.sterilisingTemperatureK - cycleType.bandBelowK, upperK: cycleType.sterilisingTemperatureK + cycleType.bandAboveK };
  const timesS = readings.map((r) => r.timeS);
  const temperature: Series = { timesS, values: readings.map((r) => r.temperatureK) };
  const pairs = saturationPairs(vessel, readings, measurement, cycleType.saturationLimitK);
  const saturationTemperature: Series = { timesS, values: pairs.map((p) => p.saturationTemperatureK) };
  const firstTimeS = timesS[0]!;
  const lastTimeS = timesS[timesS.length - 1]!;

  const hold = findHold(temperature, band.lowerK, cycleType.holdTimeS);
  const { referenceTemperatureK, zK } = cycleType.lethality;
  const judged = judgedInterval(hold);
  const { holdMinutes, ...duringHold } = judged
    ? figuresDuringHold(temperature, pairs, band, judged, cycleType.lethality)
    : { timeInBandDuringHoldS: 0, holdTemperature: null, largestExcursion: null, bandExceeded: null, largestReadingIntervalDuringHoldS: null, holdSaturation: null, holdMinutes: 0 };
  const figures: CycleFigures = {
    formulationId: FORMULATION_ID,
    cycleType,
    band,
    measurement,
    readingCount: readings.length,
    firstTimeS,
    lastTimeS,
    equilibration: findEquilibration(saturationTemperature, temperature, band.lowerK),
    hold,
    timeInBandS: timeWithin(temperature, band.lowerK, band.upperK, firstTimeS, lastTimeS),
    ...duringHold,
    temperatureRange: {
      minK: temperature.values.reduce((m, v) => Math.min(m, v), Infinity),
      maxK: temperature.values.reduce((m, v) => Math.max(m, v), -Infinity),
    },
    saturationByReading: saturationColumns(pairs),
    lethality: { referenceTemperatureK, zK, wholeRecordMinutes: lethalityMinutesOf(readings, referenceTemperatureK, zK), holdMinutes },
  };
  return requireFiniteData({ ...figures, ...cycleCautions(figures) });
}

type DuringHold = Pick<CycleEvaluation,
  'timeInBandDuringHoldS' | 'holdTemperature' | 'largestExcursion' | 'bandExceeded' | 'largestReadingIntervalDuringHoldS' | 'holdSaturation'> & { holdMinutes: number };

/** The figures of the judged interval [fromS, toS]. */
function figuresDuringHold(
  temperature: Series,
  pairs: SaturationPair[],
  band: { lowerK: number; upperK: number },
  { fromS, toS }: { fromS: number; toS: number },
  F: { referenceTemperatureK: number; zK: number },
): DuringHold {
  const ext = extremesWithin(temperature, fromS, toS);
  const above = ext.max.value - band.upperK;
  const below = band.lowerK - ext.min.value;
  const largestExcursion = above <= 0 && below <= 0 ? null
    : above >= below ? { direction: 'above' as const, byK: above, timeS: ext.max.timeS }
    : { direction: 'below' as const, byK: below, timeS: ext.min.timeS };
  const points = sliceSeries(temperature, fromS, toS).map((q) => ({ timeS: q.timeS, temperatureK: q.value }));
  return {
    timeInBandDuringHoldS: timeWithin(temperature, band.lowerK, band.upperK, fromS, toS),
    holdTemperature: { minK: ext.min.value, maxK: ext.max.value },
    largestExcursion,
    bandExceeded: above > 0 ? { byK: above, timeS: ext.max.timeS } : null,
    largestReadingIntervalDuringHoldS: largestIntervalWithin(temperature, fromS, toS),
    holdSaturation: holdSaturation(pairs.filter((p) => p.timeS >= fromS && p.timeS <= toS)),
    holdMinutes: lethalityMinutesOf(points, F.referenceTemperatureK, F.zK),
  };
}

function holdSaturation(inHold: SaturationPair[]): HoldSaturation {
  let largest: SaturationPair | null = null;
  let coldestAboveBandK: number | null = null;
  let hottestBelowBandK: number | null = null;
  let widest: number | null = null;
  let above = 0;
  let below = 0;
  for (const p of inHold) {
    if (largest === null || Math.abs(p.deviationK) > Math.abs(largest.deviationK)) largest = p;
    if (p.instrumentVerdict === 'pressure-above-saturation') {
      above++;
      coldestAboveBandK = Math.min(coldestAboveBandK ?? 0, p.deviationK);
    } else if (p.instrumentVerdict === 'pressure-below-saturation') {
      below++;
      hottestBelowBandK = Math.max(hottestBelowBandK ?? 0, p.deviationK);
    }
    widest = Math.max(widest ?? 0, p.instrumentBandK);
  }
  return {
    readings: inHold.length,
    outsideLimit: inHold.filter((p) => !p.withinLimit).length,
    largestDeviation: largest && { timeS: largest.timeS, deviationK: largest.deviationK },
    pressureAboveSaturation: above,
    pressureBelowSaturation: below,
    coldestAboveBandK,
    hottestBelowBandK,
    widestInstrumentBandK: widest,
  };
}
