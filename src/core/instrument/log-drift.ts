// Drift found in the log: over one vessel's checks with one gauge and one thermometer that showed
// saturated steam, the offset d = p − p_sat(T) of each check, its mean with an interval, and its
// trend over time with an interval. A gauge that reads high, a thermometer that reads low, gas in
// the steam and a wrong atmosphere under a gauge reading all move d the same way: these pairs alone
// cannot tell them apart, and the findings say so. Method and limits: src/core/README.md, "Drift
// from the log".

import { InputError, requireInRange } from '../errors.ts';
import { READING_LIMITS } from '../check/reading.ts';
import { saturationSlopePaPerK } from '../check/saturation-consistency.ts';
import { saturationPressure } from '../steam/index.ts';
import { intervalHalfWidth, median, robustSpread, serialTrend } from '../statistics/index.ts';
import type { Caution } from '../check/cautions.ts';
import { driftFindings, type InstrumentPair } from './instrument-findings.ts';
import { TIME_LIMITS_MS, requireTime } from './instrument-spec.ts';

/** One check that showed saturated steam (two-phase contents, liquid present): SI, time in ms since the epoch. */
export interface SaturatedCheck {
  timeMs: number;
  temperatureK: number;
  absolutePressurePa: number;
  /** The check's own band on p − p_sat(T), Pa (CheckResult.saturation.pressureBand.plusMinus). */
  pressureBandPa?: number;
}

/** Fewer checks than this (after outliers are set aside) give no estimate: our choice, so the outlier screen and ρ have something to work on. */
export const DRIFT_MIN_CHECKS = 6;
/** The intervals reported: 95 %. */
export const DRIFT_REPORTED_CONFIDENCE = 0.95;
/**
 * The intervals a finding needs to clear: 99 %. Two tests are made (offset, trend) and the
 * correlation correction is itself estimated; at 99 % each, a log with no offset and no drift raises
 * a finding well under 5 % of the time (measured in test/core/instrument/log-drift.test.ts).
 */
export const DRIFT_DECISION_CONFIDENCE = 0.99;
/** A check whose offset is more than this many robust standard deviations from the median is set aside (a normal reading: 1 in 1.7 million). */
export const DRIFT_OUTLIER_LIMIT = 5;

/** What the estimate is measured against, and the tags the findings name. */
export interface DriftContext extends InstrumentPair {
  /** The earlier of the two instruments' next calibration due dates, ms; without it no projection is made. */
  nextCalibrationDueMs?: number;
  /** The band to project against, Pa; absent: the median of the checks' own bands; neither: no projection. */
  pressureBandPa?: number;
}

/** A ± interval around an estimate. */
export interface Interval {
  value: number;
  /** Half-width at DRIFT_REPORTED_CONFIDENCE. */
  plusMinus: number;
  /** Half-width at DRIFT_DECISION_CONFIDENCE. */
  decisionPlusMinus: number;
  /** The decision interval excludes zero. */
  significant: boolean;
}

export type LogDrift =
  | { estimate: 'too-few-checks'; checksGiven: number; checksUsed: number; outliersSetAside: number; minimumChecks: number; findings: [] }
  | LogDriftEstimate;

export interface LogDriftEstimate {
  estimate: 'made';
  checksGiven: number;
  checksUsed: number;
  /** Checks set aside as outliers (DRIFT_OUTLIER_LIMIT), not used. */
  outliersSetAside: number;
  firstMs: number;
  lastMs: number;
  /** Mean of p − p_sat(T) over the checks used, Pa. */
  offsetPa: Interval;
  /** The same as a temperature, T − T_sat(p) ≈ −offset/(dp_sat/dT) at the mean temperature, K (the sign of CheckResult's temperatureDeviationK). */
  temperatureOffsetK: { value: number; plusMinus: number };
  /** The fitted line at the last check, Pa: the offset now if the trend is real. */
  offsetAtLastCheckPa: number;
  /** Trend of the offset, Pa/s; null when the checks are all at one time. */
  trendPaPerS: Interval | null;
  /** The line carried to the next calibration due date; null without a due date, a band or a trend. */
  projection: {
    bandPa: number;
    bandSource: 'given' | 'checks';
    dueMs: number;
    offsetAtDuePa: number;
    /** When the line leaves ±band going outward (the last check's time if it is outside already), or null if it does not. */
    leavesBandMs: number | null;
    /** The trend is significant and the line leaves the band by the due date (or by the last check, when the due date has passed). */
    leavesBeforeDue: boolean;
  } | null;
  meanTemperatureK: number;
  saturationSlopePaPerK: number;
  /** Scatter and correlation of the offsets about the line. */
  residualStandardDeviationPa: number;
  lag1Autocorrelation: number;
  /** Variance inflation for serial correlation (1 … 4) and which estimate gave it (statistics/serial-trend.ts). */
  inflation: number;
  inflationFrom: 'readings' | 'runs';
  effectiveCount: number;
  /** What the figures say: the steady offset (rule instrument-pair-offset) and the trend towards the band (instrument-pair-drift), offset first; empty when neither. */
  findings: Caution[];
}

/**
 * Estimates the offset between one gauge and one thermometer from checks of saturated contents.
 * The caller chooses them: checks whose inventory was two-phase, or, for a vessel that is not
 * weighed, the checks taken in saturated service (a steriliser's holding phase); never by the
 * saturation verdict, which would cut off the very offsets this looks for. Pass the checks since
 * the later of the two instruments' last calibrations (an adjustment resets the offset). Order does
 * not matter; equal times are allowed.
 * Throws InputError naming the field: check time (a date), check temperature (273.16–647.096 K),
 * check absolute pressure (611.657 Pa–22.064 MPa), check pressure band and pressure band (0–22.064 MPa),
 * next calibration due date (a date).
 */
export function driftFromLog(checks: readonly SaturatedCheck[], context: DriftContext = {}): LogDrift {
  validate(checks, context);
  const sorted = [...checks].sort((a, b) => a.timeMs - b.timeMs);
  const all = sorted.map((c) => ({ check: c, offsetPa: c.absolutePressurePa - saturationPressure(c.temperatureK) }));
  const { median: centre, standardDeviation } = all.length > 0 ? robustSpread(all.map((a) => a.offsetPa)) : { median: 0, standardDeviation: 0 };
  const limit = DRIFT_OUTLIER_LIMIT * standardDeviation;
  const used = standardDeviation > 0 ? all.filter((a) => Math.abs(a.offsetPa - centre) <= limit) : all;
  const outliersSetAside = all.length - used.length;
  if (used.length < DRIFT_MIN_CHECKS) {
    return { estimate: 'too-few-checks', checksGiven: checks.length, checksUsed: used.length, outliersSetAside, minimumChecks: DRIFT_MIN_CHECKS, findings: [] };
  }
  const firstMs = used[0]!.check.timeMs;
  const lastMs = used[used.length - 1]!.check.timeMs;
  // Seconds from the first check: squares of epoch milliseconds (~1e24) would cost digits.
  const seconds = used.map((u) => (u.check.timeMs - firstMs) / 1000);
  const trend = serialTrend(seconds, used.map((u) => u.offsetPa));
  const interval = (value: number, standardError: number): Interval => {
    const decisionPlusMinus = intervalHalfWidth(standardError, trend.degreesOfFreedom, DRIFT_DECISION_CONFIDENCE);
    return {
      value,
      plusMinus: intervalHalfWidth(standardError, trend.degreesOfFreedom, DRIFT_REPORTED_CONFIDENCE),
      decisionPlusMinus,
      significant: Math.abs(value) > decisionPlusMinus,
    };
  };
  const offsetPa = interval(trend.mean, trend.meanStandardError);
  const trendPaPerS = trend.slope === null ? null : interval(trend.slope.value, trend.slope.standardError);
  const lineAt = (ms: number) => trend.mean + (trend.slope?.value ?? 0) * ((ms - firstMs) / 1000 - trend.meanX);
  const meanTemperatureK = used.reduce((a, u) => a + u.check.temperatureK, 0) / used.length;
  const slopePaPerK = saturationSlopePaPerK(meanTemperatureK);

  const bands = used.flatMap((u) => (u.check.pressureBandPa === undefined ? [] : [u.check.pressureBandPa]));
  const bandPa = context.pressureBandPa ?? (bands.length > 0 ? median(bands) : null);
  let projection: LogDriftEstimate['projection'] = null;
  if (bandPa !== null && context.nextCalibrationDueMs !== undefined && trendPaPerS !== null) {
    const dueMs = context.nextCalibrationDueMs;
    const leavesBandMs = leavesBand(lineAt(lastMs), trendPaPerS.value, bandPa, lastMs);
    projection = {
      bandPa,
      bandSource: context.pressureBandPa === undefined ? 'checks' : 'given',
      dueMs,
      offsetAtDuePa: lineAt(dueMs),
      leavesBandMs,
      leavesBeforeDue: trendPaPerS.significant && leavesBandMs !== null && leavesBandMs <= Math.max(dueMs, lastMs),
    };
  }
  const estimate: Omit<LogDriftEstimate, 'findings'> = {
    estimate: 'made',
    checksGiven: checks.length,
    checksUsed: used.length,
    outliersSetAside,
    firstMs,
    lastMs,
    offsetPa,
    temperatureOffsetK: { value: -offsetPa.value / slopePaPerK, plusMinus: offsetPa.plusMinus / slopePaPerK },
    offsetAtLastCheckPa: lineAt(lastMs),
    trendPaPerS,
    projection,
    meanTemperatureK,
    saturationSlopePaPerK: slopePaPerK,
    residualStandardDeviationPa: trend.residualStandardDeviation,
    lag1Autocorrelation: trend.lag1Autocorrelation,
    inflation: trend.inflation,
    inflationFrom: trend.inflationFrom,
    effectiveCount: trend.effectiveCount,
  };
  return { ...estimate, findings: driftFindings(estimate, context) };
}

/** When a line at offsetPa (at nowMs) moving at ratePaPerS passes ±band outward: nowMs if outside already, null if it never does. */
function leavesBand(offsetPa: number, ratePaPerS: number, bandPa: number, nowMs: number): number | null {
  if (ratePaPerS === 0) return Math.abs(offsetPa) > bandPa ? nowMs : null;
  const edge = Math.sign(ratePaPerS) * bandPa;
  const outward = (edge - offsetPa) * Math.sign(ratePaPerS);
  if (outward <= 0) return nowMs;
  return nowMs + ((edge - offsetPa) / ratePaPerS) * 1000;
}

function validate(checks: readonly SaturatedCheck[], context: DriftContext): void {
  if (!Array.isArray(checks)) throw new InputError('checks', 'empty', String(checks));
  const T = READING_LIMITS.temperatureK;
  const P = READING_LIMITS.absolutePressurePa;
  const D = TIME_LIMITS_MS;
  checks.forEach((c, i) => {
    const where = `check ${i + 1} of ${checks.length}`;
    const within = (field: string, value: number, min: number, max: number, unit: string) => {
      if (!Number.isFinite(value) || value < min || value > max) {
        throw new InputError(field, Number.isFinite(value) ? 'out-of-range' : 'not-a-number', value, { min, max, unit },
          `${field}, ${where}: ${String(value)} ${unit} is outside the valid range ${min} to ${max} ${unit}.`);
      }
    };
    requireTime('check time', c?.timeMs, D.min, D.max, `, ${where}`);
    within('check temperature', c.temperatureK, T.min, T.max, T.unit);
    within('check absolute pressure', c.absolutePressurePa, P.min, P.max, P.unit);
    if (c.pressureBandPa !== undefined) within('check pressure band', c.pressureBandPa, 0, P.max, P.unit);
  });
  if (context.pressureBandPa !== undefined) requireInRange('pressure band', context.pressureBandPa, 0, P.max, P.unit);
  if (context.nextCalibrationDueMs !== undefined) requireTime('next calibration due date', context.nextCalibrationDueMs, D.min, D.max, '');
}
