// Air leakage of a chamber held under vacuum: the absolute pressure read over a timed hold with the
// chamber isolated rises as air leaks in. The rate is the slope of the least-squares line through
// the readings (ordinary least squares of p on t; common practice), in Pa per minute.
//
// Its band (±, Pa/min) is the root-sum-square of two parts:
// - statistical: the 95 % confidence half-width of the slope, t(0.975, n − 2)·s_b, with
//   s_b = √(Σr²/(n − 2) / Σ(t − t̄)²) (the textbook standard error of a least-squares slope). With
//   two readings a line fits exactly and this part cannot be estimated: it is then 0 and the result
//   says so.
// - instrument (when the gauge is given): the gauge's ± limit e (class × span) on every reading,
//   carried through the slope's weights w_i = (t_i − t̄)/Σ(t − t̄)² as independent limits,
//   e·√(Σw_i²) = e/√Σ(t − t̄)² (for two readings Δt apart, √2·e/Δt). A zero offset common to all
//   readings cancels in a slope; treating the errors as independent is the cautious reading.
//
// The sterilising standards' air leakage test (draft BS EN 285 cl. 18, via field-practice.md §4.3)
// reads the chamber pressure at the start and end of a timed hold; the limit of 1.3 mbar/min
// (0.13 kPa/min) is from memory there.

import { InputError, requireInRange } from '../errors.ts';
import { requireFiniteData } from '../check/finite-data.ts';
import type { Caution } from '../check/cautions.ts';
import { VESSEL_LIMITS } from '../check/vessel-spec.ts';
import type { Graded } from '../graded-result.ts';
import { requireEachInRange, requireTimeSeries } from '../cycle/time-series.ts';
import { studentT975 } from './student-t.ts';
import { gradeTest, testCaution } from './test-cautions.ts';

/** Valid ranges, SI. A chamber under vacuum is below the atmosphere; 110 kPa is the highest atmosphere the core accepts. */
export const VACUUM_LEAK_LIMITS = {
  absolutePressurePa: { min: 0, max: 110e3, unit: 'Pa' },
} as const;

/** A pressure gauge's ± limit: class (% of span) × span (EN 837-1 classes are % of span). */
export interface LeakTestGauge {
  spanPa: number;
  accuracyPercentOfSpan: number;
}

export interface VacuumLeakRate {
  /** Slope of the least-squares line, Pa per minute (positive: pressure rising, air leaking in). */
  paPerMinute: number;
  /** ± band, Pa per minute: root-sum-square of the statistical and instrument parts. */
  plusMinusPaPerMinute: number;
  /** 95 % confidence half-width of the slope, Pa/min; 0 when not estimated. */
  statisticalPaPerMinute: number;
  /** The gauge's contribution, Pa/min; 0 when no gauge was given. */
  instrumentPaPerMinute: number;
  /** 'not-estimated' with two readings (a line through two points has no scatter to measure). */
  statisticalBand: 'estimated' | 'not-estimated';
  /** n − 2. */
  degreesOfFreedom: number;
}

/**
 * Leak rate of a vacuum hold by least squares, with its band.
 * @param readings 2 to 200 000 readings: timeS s (strictly increasing), absolutePressurePa 0–110 kPa
 * @param options gauge: span above 0 and up to 100 MPa, class 0–10 % of span, adds the instrument part
 * @throws InputError naming the field: "readings", "reading N time", "reading N pressure (absolute)",
 *   "pressure gauge span", "pressure gauge accuracy"
 */
export function vacuumLeakRate(
  readings: readonly { timeS: number; absolutePressurePa: number }[],
  options: { gauge?: LeakTestGauge } = {},
): VacuumLeakRate {
  requireTimeSeries(readings);
  requireEachInRange(readings, 'absolutePressurePa', 'pressure (absolute)', VACUUM_LEAK_LIMITS.absolutePressurePa);
  let gaugeLimitPa = 0;
  if (options.gauge !== undefined) {
    const S = VESSEL_LIMITS.gaugeSpanPa;
    const span = requireInRange('pressure gauge span', options.gauge?.spanPa, S.min, S.max, S.unit);
    if (span === 0) throw new InputError('pressure gauge span', 'out-of-range', 0, S, 'pressure gauge span: must be above 0 Pa.');
    const a = VESSEL_LIMITS.gaugeAccuracyPercent;
    gaugeLimitPa = (requireInRange('pressure gauge accuracy', options.gauge.accuracyPercentOfSpan, a.min, a.max, a.unit) / 100) * span;
  }
  const n = readings.length;
  // Centred sums: times may be large (a recorder's clock) and the slope is a small difference.
  const tMean = readings.reduce((s, r) => s + r.timeS, 0) / n;
  const pMean = readings.reduce((s, r) => s + r.absolutePressurePa, 0) / n;
  let sxx = 0;
  let sxy = 0;
  for (const r of readings) {
    const dt = r.timeS - tMean;
    sxx += dt * dt;
    sxy += dt * (r.absolutePressurePa - pMean);
  }
  const slopePaPerS = sxy / sxx;
  const dof = n - 2;
  let statisticalPaPerS = 0;
  if (dof > 0) {
    let ssr = 0;
    for (const r of readings) {
      const residual = r.absolutePressurePa - (pMean + slopePaPerS * (r.timeS - tMean));
      ssr += residual * residual;
    }
    statisticalPaPerS = studentT975(dof) * Math.sqrt(ssr / dof / sxx);
  }
  const instrumentPaPerS = gaugeLimitPa / Math.sqrt(sxx);
  return requireFiniteData({
    paPerMinute: 60 * slopePaPerS,
    plusMinusPaPerMinute: 60 * Math.hypot(statisticalPaPerS, instrumentPaPerS),
    statisticalPaPerMinute: 60 * statisticalPaPerS,
    instrumentPaPerMinute: 60 * instrumentPaPerS,
    statisticalBand: dof > 0 ? 'estimated' : 'not-estimated',
    degreesOfFreedom: dof,
  });
}

/** Highest accepted leak rate by default, Pa/min: 1.3 mbar/min = 0.13 kPa/min (from memory, field-practice.md §4.3). */
export const VACUUM_LEAK_DEFAULT_MAX_PA_PER_MINUTE = 130;

export interface VacuumLeakEvaluation extends Graded {
  test: 'vacuum-leak';
  readingCount: number;
  firstTimeS: number;
  lastTimeS: number;
  gauge: LeakTestGauge | null;
  rate: VacuumLeakRate;
  limits: { maximumPaPerMinute: number };
}

/** Pa/min as the stored wording shows it: kPa/min and mbar/min. */
function rateText(paPerMinute: number): string {
  const fixed = (x: number, d: number) => x.toFixed(d).replace(/^-/, '\u2212');
  return `${fixed(paPerMinute / 1000, 3)} kPa/min (${fixed(paPerMinute / 100, 2)} mbar/min)`;
}

/**
 * The air leakage test: the leak rate against the highest accepted rate (default 130 Pa/min,
 * 0–10 000 Pa/min). Throws InputError as vacuumLeakRate, and on "highest accepted leak rate".
 */
export function evaluateVacuumLeak(
  readings: readonly { timeS: number; absolutePressurePa: number }[],
  options: { gauge?: LeakTestGauge; maximumPaPerMinute?: number } = {},
): VacuumLeakEvaluation {
  const maximumPaPerMinute = requireInRange('highest accepted leak rate', options.maximumPaPerMinute ?? VACUUM_LEAK_DEFAULT_MAX_PA_PER_MINUTE, 0, 10_000, 'Pa/min');
  const rate = vacuumLeakRate(readings, options.gauge === undefined ? {} : { gauge: options.gauge });
  const r = rate.paPerMinute;
  const band = rate.plusMinusPaPerMinute;
  const findings: Caution[] = [];
  if (r > maximumPaPerMinute) {
    findings.push(testCaution('vacuum-leak-above-limit',
      `Leak rate ${rateText(r)} is above the highest accepted ${rateText(maximumPaPerMinute)}: air leaks into the chamber (door seal, valves, pipe joints). Air let in during a cycle is what the air-removal stage has to clear.`));
  } else if (r + band > maximumPaPerMinute) {
    findings.push(testCaution('vacuum-leak-band-reaches-limit',
      `Leak rate ${rateText(r)} is within the highest accepted ${rateText(maximumPaPerMinute)}, but its band (±${rateText(band)}) reaches past it: more readings or a finer gauge would settle it.`));
  }
  if (r + band < 0) {
    findings.push(testCaution('vacuum-pressure-falling',
      `The pressure fell during the hold (${rateText(r)}): the chamber was still being evacuated, or it was cooling and condensing. A leak rate needs the chamber isolated and settled first.`));
  }
  if (rate.statisticalBand === 'not-estimated') {
    findings.push(testCaution('vacuum-leak-band-not-estimated',
      options.gauge === undefined
        ? 'Two readings fit a line exactly, so the scatter of the readings is not estimated, and no gauge accuracy was given: the rate has no band.'
        : 'Two readings fit a line exactly, so the scatter of the readings is not estimated: the band is the gauge\'s accuracy alone.'));
  }
  return requireFiniteData({
    test: 'vacuum-leak' as const,
    readingCount: readings.length,
    firstTimeS: readings[0]!.timeS,
    lastTimeS: readings[readings.length - 1]!.timeS,
    gauge: options.gauge === undefined ? null : { ...options.gauge },
    rate,
    limits: { maximumPaPerMinute },
    ...gradeTest(findings),
  });
}
