// The mean and the straight-line trend of a series measured over time, with standard errors that
// allow for serial correlation. Readings taken close together share slow errors (the weather under
// a gauge read against a stored atmosphere, a thermometer settling in its pocket), so n of them
// carry less information than n independent ones.
//
// The estimates are least squares over every reading. Their variances are those of independent
// readings multiplied by an inflation factor (1 + ρ)/(1 − ρ), the factor for the mean of a
// first-order autoregressive (AR(1)) series with lag-1 autocorrelation ρ (Bretherton et al., J.
// Climate 12 (1999) 1990; from memory); the effective sample size is n divided by it. The factor
// is the larger of two estimates:
// - ρ of the single readings' residuals about the line;
// - ρ of the residuals of run means (RUN_LENGTH consecutive readings averaged), scaled to the
//   readings: when fast scatter (reading noise) sits on a slow wander, the lag-1 correlation of
//   single readings is mostly scatter and looks small while the wander still ties readings days
//   apart; runs of three shrink the scatter and show the wander.
// Each ρ is corrected for its small-sample bias (below) and held to 0 … MAX_LAG1_AUTOCORRELATION,
// so the factor is at most 4: a correlation stronger than that over the log's own span is
// persistence, which is what the caller wants to report, not noise to discount.
// Measured in a one-off simulation while designing (Python, 4,000 logs of 20 to 80 readings per
// case; coverage of the 95 % interval of the mean / power against an offset of 2.4 standard
// deviations at 99 %): independent errors 97.6 / 99.7 %; an Ornstein–Uhlenbeck wander in time
// (3 days) 93.3 / 98.9 %; reading scatter on a 3-day weather wander 94.0 / 98.8 %. Single readings
// alone gave 89.8 % coverage in the last case; runs alone lost power (70–79 %).
// test/core/instrument/log-drift.test.ts measures the generated logs again.
// Degrees of freedom: n ÷ factor − 2 with a line, − 1 without, at least 1.

import { studentTCritical } from './student-t.ts';

/** Largest lag-1 autocorrelation used (inflation at most 4). */
export const MAX_LAG1_AUTOCORRELATION = 0.6;
/** Readings averaged per run for the second estimate. */
export const RUN_LENGTH = 3;

/** Mean and trend of y over x, with standard errors corrected for serial correlation. */
export interface SerialTrend {
  count: number;
  /** Mean of y, and its standard error (y's unit). */
  mean: number;
  meanStandardError: number;
  /** Mean of x (x's unit): the line passes through (meanX, mean). */
  meanX: number;
  /** dy/dx and its standard error, or null when x does not vary or there are under 3 readings. */
  slope: { value: number; standardError: number } | null;
  /** Standard deviation of the readings about the line (about the mean without a slope), y's unit. */
  residualStandardDeviation: number;
  /** Lag-1 autocorrelation of the readings' residuals, as measured (may be negative). */
  lag1Autocorrelation: number;
  /** The variance inflation used, 1 … 4, and which estimate gave it. */
  inflation: number;
  inflationFrom: 'readings' | 'runs';
  /** count ÷ inflation. */
  effectiveCount: number;
  /** For the intervals: effectiveCount − 2 with a slope, − 1 without, at least 1. */
  degreesOfFreedom: number;
}

interface Line {
  mean: number;
  meanX: number;
  slope: number;
  spreads: boolean;
  sxx: number;
  residualVariance: number;
  lag1: number;
}

/** Least-squares line (a flat one when x does not spread or allowSlope is false), with its residuals' variance and lag-1 autocorrelation. */
function fitLine(x: readonly number[], y: readonly number[], allowSlope: boolean): Line {
  const n = y.length;
  const meanX = x.reduce((a, b) => a + b, 0) / n;
  const mean = y.reduce((a, b) => a + b, 0) / n;
  let sxx = 0;
  let sxy = 0;
  for (let i = 0; i < n; i++) {
    const dx = x[i]! - meanX;
    sxx += dx * dx;
    sxy += dx * (y[i]! - mean);
  }
  // A spread of x below rounding of x itself is no spread: all readings at one time.
  const spreads = allowSlope && n >= 3 && Math.sqrt(sxx / n) > 1e-12 * Math.max(Math.abs(meanX), 1);
  const slope = spreads ? sxy / sxx : 0;
  let squares = 0;
  let lagged = 0;
  let previous = 0;
  for (let i = 0; i < n; i++) {
    const r = y[i]! - mean - slope * (x[i]! - meanX);
    squares += r * r;
    if (i > 0) lagged += r * previous;
    previous = r;
  }
  const parameters = spreads ? 2 : 1;
  return {
    mean, meanX, slope, spreads, sxx,
    residualVariance: n > parameters ? squares / (n - parameters) : 0,
    lag1: squares > 0 ? lagged / squares : 0,
  };
}

/**
 * ρ corrected for its small-sample bias, held to 0 … MAX_LAG1_AUTOCORRELATION. The lag-1 estimate
 * from the residuals of m points is low by about (c0 + c1·ρ)/m: (1 + 4ρ)/m about a mean, (2 + 6ρ)/m
 * about a fitted line (measured here by simulating AR(1) series, m = 10 … 100, ρ = 0 … 0.8;
 * re-measured in test/core/statistics/serial-trend.test.ts). Uncorrected, 20 points with ρ = 0.6
 * look like ρ = 0.33.
 */
export function correctedLag1Autocorrelation(measured: number, points: number, aboutLine: boolean): number {
  const [c0, c1] = aboutLine ? [2, 6] : [1, 4];
  const rho = (measured + c0 / points) / Math.max(1 - c1 / points, 0.5);
  return Math.min(Math.max(rho, 0), MAX_LAG1_AUTOCORRELATION);
}

const inflationOf = (rho: number) => (1 + rho) / (1 - rho);

/** Means of `runs` consecutive runs of near-equal size (they differ by at most one reading). */
function runMeans(x: readonly number[], y: readonly number[], runs: number): { x: number[]; y: number[] } {
  const n = y.length;
  const rx: number[] = [];
  const ry: number[] = [];
  for (let r = 0; r < runs; r++) {
    const from = Math.floor((r * n) / runs);
    const to = Math.floor(((r + 1) * n) / runs);
    let sx = 0;
    let sy = 0;
    for (let i = from; i < to; i++) {
      sx += x[i]!;
      sy += y[i]!;
    }
    rx.push(sx / (to - from));
    ry.push(sy / (to - from));
  }
  return { x: rx, y: ry };
}

/**
 * Fits y = mean + slope·(x − meanX) by least squares, with standard errors corrected for serial
 * correlation (above). x and y: equal-length arrays of finite numbers, at least 2 values, in x
 * order (ties allowed). Returns finite numbers only.
 */
export function serialTrend(x: readonly number[], y: readonly number[]): SerialTrend {
  const n = y.length;
  const line = fitLine(x, y, true);
  let inflation = inflationOf(correctedLag1Autocorrelation(line.lag1, n, line.spreads));
  let inflationFrom: SerialTrend['inflationFrom'] = 'readings';
  const runs = Math.floor(n / RUN_LENGTH);
  if (runs >= 3 && line.residualVariance > 0) {
    const grouped = runMeans(x, y, runs);
    const runLine = fitLine(grouped.x, grouped.y, line.spreads);
    // The runs' estimate of the mean's variance, as a multiple of the independent-readings value.
    const fromRuns = ((runLine.residualVariance * inflationOf(correctedLag1Autocorrelation(runLine.lag1, runs, runLine.spreads))) / runs) / (line.residualVariance / n);
    if (fromRuns > inflation) {
      inflation = Math.min(fromRuns, inflationOf(MAX_LAG1_AUTOCORRELATION));
      inflationFrom = 'runs';
    }
  }
  const parameters = line.spreads ? 2 : 1;
  const effectiveCount = n / inflation;
  return {
    count: n,
    mean: line.mean,
    meanStandardError: Math.sqrt((line.residualVariance * inflation) / n),
    meanX: line.meanX,
    slope: line.spreads ? { value: line.slope, standardError: Math.sqrt((line.residualVariance * inflation) / line.sxx) } : null,
    residualStandardDeviation: Math.sqrt(line.residualVariance),
    lag1Autocorrelation: line.lag1,
    inflation,
    inflationFrom,
    effectiveCount,
    degreesOfFreedom: Math.max(effectiveCount - parameters, 1),
  };
}

/** Half-width of a two-sided interval: t(confidence, ν)·standard error. confidence 0 < c < 1, ν ≥ 1. */
export function intervalHalfWidth(standardError: number, degreesOfFreedom: number, confidence: number): number {
  return standardError === 0 ? 0 : studentTCritical(confidence, degreesOfFreedom) * standardError;
}
