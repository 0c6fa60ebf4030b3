// Generated logs for the drift tests: invented checks on an invented steriliser chamber (test
// data, not demo data). Each check is held at 121 °C or 134 °C (+0 … +2 K above the set point), taken ¼ to 3
// days after the last; the saturation pressure comes from the project's IF97 engine. The offset
// p − p_sat(T_read) of a check is
//   bias + drift·t + gauge noise (iid, 1 kPa) + weather under the gauge (AR(1), 1.5 kPa, ρ = e^(−gap/3 days))
//   − dp_sat/dT × thermometer noise (iid, 0.15 K),
// our own invented scatter (of the order field-practice.md §3 gives for field kit); the weather
// term makes successive checks correlated, which is what the effective sample size is for.
// Each check carries the chamber's own check band: a 0–4 bar EN 837-1 class 1.6 gauge (±6.4 kPa,
// class × span, field-practice.md §3.1), ±3 kPa of stored site atmosphere and an IEC 60751 class B
// RTD through dp_sat/dT, by root-sum-square as the check engine does (±9.2 kPa at 121 °C,
// field-practice.md §3.5).
// Random numbers: fast-check draws unbiased 32-bit integers (so the project's fixed seed fixes
// every log) and Box–Muller turns pairs of them into normal deviates (../statistics/normal-deviates.ts).
import fc from 'fast-check';
import { SITE_ATMOSPHERE_TOLERANCE_PA, saturationPressure, temperatureToleranceK } from '../../../src/core/index.ts';
import { saturationSlopePaPerK } from '../../../src/core/check/saturation-consistency.ts';
import type { SaturatedCheck } from '../../../src/core/instrument/index.ts';
import { normal, uniform } from '../statistics/normal-deviates.ts';

export const DAY_MS = 86_400_000;
export const MONTH_MS = (365.25 / 12) * DAY_MS;
/** The chamber's last calibration (both instruments), when every generated log starts: invented. */
export const LOG_START_MS = Date.parse('2026-01-05T08:00:00Z');

export interface LogShape {
  /** Constant offset of p − p_sat(T), Pa. */
  biasPa: number;
  /** Growth of the offset, Pa per month from LOG_START_MS. */
  driftPaPerMonth: number;
}

/** The chamber gauge's own limit, Pa: class 1.6 × 0–4 bar (EN 837-1, field-practice.md §3.1). */
export const GAUGE_LIMIT_PA = 0.016 * 400e3;

/** The chamber's check band at a temperature read, Pa (see the header). */
export function chamberBandPa(temperatureK: number): number {
  const rtd = temperatureToleranceK({ kind: 'iec-60751', sensorClass: 'B' }, temperatureK);
  return Math.hypot(GAUGE_LIMIT_PA, SITE_ATMOSPHERE_TOLERANCE_PA, saturationSlopePaPerK(temperatureK) * rtd);
}

/** What fast-check draws for one log: uniform 32-bit integers, nine per check. */
export function rawLog(minCount: number, maxCount: number): fc.Arbitrary<number[][]> {
  const word = fc.noBias(fc.integer({ min: 0, max: 0xffffffff }));
  return fc.noBias(fc.array(fc.tuple(word, word, word, word, word, word, word, word, word), { minLength: maxCount, maxLength: maxCount }))
    .chain((rows) => fc.noBias(fc.integer({ min: minCount, max: maxCount })).map((n) => rows.slice(0, n)));
}

/** A log of checks from the drawn integers and the shape's bias and drift. */
export function buildLog(raw: number[][], shape: LogShape): { checks: SaturatedCheck[]; trueOffsetPaAt: (ms: number) => number } {
  let t = LOG_START_MS;
  let weatherPa = 0;
  const checks = raw.map(([w0, w1, w2, w3, w4, w5, w6, w7, w8], i) => {
    const gapMs = (0.25 + 2.75 * uniform(w0!)) * DAY_MS;
    t += gapMs;
    const setPointK = uniform(w1!) < 0.5 ? 394.15 : 407.15;
    const trueK = setPointK + 2 * uniform(w2!);
    const rho = Math.exp(-gapMs / (3 * DAY_MS));
    const fresh = normal(w3!, w4!);
    weatherPa = i === 0 ? 1500 * fresh : rho * weatherPa + Math.sqrt(1 - rho * rho) * 1500 * fresh;
    const gaugeNoisePa = 1000 * normal(w5!, w6!);
    const thermometerNoiseK = 0.15 * normal(w7!, w8!);
    const readK = trueK + thermometerNoiseK;
    const offset = shape.biasPa + (shape.driftPaPerMonth * (t - LOG_START_MS)) / MONTH_MS;
    return {
      timeMs: t,
      temperatureK: readK,
      absolutePressurePa: saturationPressure(trueK) + offset + gaugeNoisePa + weatherPa,
      pressureBandPa: chamberBandPa(readK),
    };
  });
  return { checks, trueOffsetPaAt: (ms) => shape.biasPa + (shape.driftPaPerMonth * (ms - LOG_START_MS)) / MONTH_MS };
}
