import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { saturationPressure } from '../../../src/core/index.ts';
import { DRIFT_MIN_CHECKS, DRIFT_REPORTED_CONFIDENCE, INSTRUMENT_RULES, driftFromLog, type LogDrift, type LogDriftEstimate, type SaturatedCheck } from '../../../src/core/instrument/index.ts';
import { expectInputError } from '../units/expect-input-error.ts';
import { DAY_MS, GAUGE_LIMIT_PA, LOG_START_MS, MONTH_MS, buildLog, rawLog } from './generated-log.ts';

const made = (d: LogDrift): LogDriftEstimate => {
  if (d.estimate !== 'made') throw new Error(`no estimate: ${d.checksUsed} checks used`);
  return d;
};
const DUE_MS = LOG_START_MS + 12 * MONTH_MS;
/** The binomial tolerance on a rate measured over `runs` trials: three standard deviations (about 1 in 370 by chance). */
const threeSigma = (p: number, runs: number) => 3 * Math.sqrt((p * (1 - p)) / runs);

describe('drift from the log: the statistical verification (generated logs, fast-check with the project seed)', () => {
  // 1,000 logs of 20 to 80 checks each, drawn once and used with and without a bias.
  const raws = fc.sample(rawLog(20, 80), 1000);
  const due = (checks: SaturatedCheck[]) => Math.max(DUE_MS, checks[checks.length - 1]!.timeMs + 30 * DAY_MS);

  it('a bias of 5 kPa is found, and lies within its 95 % interval, in 95 % of 1,000 runs (± 3 binomial standard deviations: 92.9–97.1 %)', () => {
    let foundWithin = 0;
    let found = 0;
    for (const raw of raws) {
      const { checks } = buildLog(raw, { biasPa: 5000, driftPaPerMonth: 0 });
      const d = made(driftFromLog(checks, { nextCalibrationDueMs: due(checks) }));
      const isFound = d.findings.some((f) => f.rule === 'instrument-pair-offset');
      found += isFound ? 1 : 0;
      if (isFound && Math.abs(d.offsetPa.value - 5000) <= d.offsetPa.plusMinus) foundWithin++;
    }
    const rate = foundWithin / raws.length;
    expect(DRIFT_REPORTED_CONFIDENCE).toBe(0.95);
    expect(Math.abs(rate - 0.95)).toBeLessThanOrEqual(threeSigma(0.95, raws.length));
    expect(found / raws.length).toBeGreaterThanOrEqual(0.98);
  });

  it('no bias and no drift: a false finding (offset or trend) in at most 5 % of the same 1,000 runs', () => {
    let falseFindings = 0;
    for (const raw of raws) {
      const { checks } = buildLog(raw, { biasPa: 0, driftPaPerMonth: 0 });
      if (driftFromLog(checks, { nextCalibrationDueMs: due(checks) }).findings.length > 0) falseFindings++;
    }
    expect(falseFindings / raws.length).toBeLessThanOrEqual(0.05);
  });

  it('a drift of 1 kPa a month from calibration is found, in each of 200 runs, before it exceeds the gauge band (±6.4 kPa)', () => {
    // The app would look again after every check; so does this test, from the sixth check on.
    const monthsToFind: number[] = [];
    for (const raw of fc.sample(rawLog(240, 240), 200)) {
      const { checks, trueOffsetPaAt } = buildLog(raw, { biasPa: 0, driftPaPerMonth: 1000 });
      let foundAt: number | null = null;
      for (let k = DRIFT_MIN_CHECKS; k <= checks.length && foundAt === null; k++) {
        const d = driftFromLog(checks.slice(0, k), { nextCalibrationDueMs: DUE_MS });
        if (d.findings.length > 0) foundAt = checks[k - 1]!.timeMs;
      }
      expect(foundAt).not.toBeNull();
      expect(trueOffsetPaAt(foundAt!)).toBeLessThan(GAUGE_LIMIT_PA);
      monthsToFind.push((foundAt! - LOG_START_MS) / MONTH_MS);
    }
    // The generated 240 checks span about 13 months, so "found" was not simply the end of the log.
    expect(Math.max(...monthsToFind)).toBeLessThan(6.4);
  });
});

describe('drift from the log: figures and their arithmetic', () => {
  const at = (i: number, offsetPa: number, T = 394.15): SaturatedCheck => ({
    timeMs: LOG_START_MS + i * DAY_MS, temperatureK: T, absolutePressurePa: saturationPressure(T) + offsetPa,
  });

  it('a constant offset: the mean is it, the interval 0, the trend 0, a finding above saturation (arithmetic)', () => {
    const d = made(driftFromLog(Array.from({ length: 10 }, (_, i) => at(i, 3000))));
    expect(d.offsetPa.value).toBeCloseTo(3000, 6);
    expect(d.offsetPa.plusMinus).toBeLessThan(1e-6);
    expect(d.trendPaPerS!.value).toBeCloseTo(0, 9);
    expect(d.findings.map((f) => f.rule)).toEqual(['instrument-pair-offset']);
    expect(d.findings[0]!.message).toMatch(/reads 3\.0 kPa ± 0\.0 kPa above saturation/);
  });
  it('the temperature equivalent is −offset / (dp_sat/dT) at the mean temperature, the sign of T − T_sat(p) (definition)', () => {
    const d = made(driftFromLog(Array.from({ length: 8 }, (_, i) => at(i, 6460 + (i % 2 ? 100 : -100)))));
    expect(d.temperatureOffsetK.value).toBeCloseTo(-d.offsetPa.value / d.saturationSlopePaPerK, 12);
    // 6.46 kPa/K at 121 °C (field-practice.md §3.5, computed with IF97): about −1 K
    expect(d.temperatureOffsetK.value).toBeCloseTo(-1, 2);
  });
  it('a straight drift: the trend and the line at the last check (least squares on exact data)', () => {
    const perDay = 1000 / 30;
    const d = made(driftFromLog(Array.from({ length: 30 }, (_, i) => at(i, i * perDay)), { nextCalibrationDueMs: LOG_START_MS + 100 * DAY_MS, pressureBandPa: 2000 }));
    expect(d.trendPaPerS!.value * 86400).toBeCloseTo(perDay, 6);
    expect(d.offsetAtLastCheckPa).toBeCloseTo(29 * perDay, 4);
    expect(d.projection!.offsetAtDuePa).toBeCloseTo(100 * perDay, 3);
    expect(d.projection!.leavesBandMs! / DAY_MS - LOG_START_MS / DAY_MS).toBeCloseTo(60, 4);
    expect(d.projection!.leavesBeforeDue).toBe(true);
    expect(d.projection!.bandSource).toBe('given');
    expect(d.findings.map((f) => f.rule)).toContain('instrument-pair-drift');
  });
  it('the band comes from the checks (their median) when none is given', () => {
    const checks = Array.from({ length: 9 }, (_, i) => ({ ...at(i, 0), pressureBandPa: 1000 * (i + 1) }));
    const d = made(driftFromLog(checks, { nextCalibrationDueMs: LOG_START_MS + 100 * DAY_MS }));
    expect(d.projection!.bandPa).toBe(5000);
    expect(d.projection!.bandSource).toBe('checks');
  });
  it('no due date or no band: no projection', () => {
    const checks = Array.from({ length: 9 }, (_, i) => at(i, i));
    expect(made(driftFromLog(checks)).projection).toBeNull();
    expect(made(driftFromLog(checks, { nextCalibrationDueMs: DUE_MS })).projection).toBeNull();
  });
  it('order does not matter', () => {
    const checks = Array.from({ length: 12 }, (_, i) => at(i, 500 * Math.sin(i) + 200 * i));
    const a = driftFromLog(checks, { nextCalibrationDueMs: DUE_MS, pressureBandPa: 9000 });
    const b = driftFromLog([...checks].reverse(), { nextCalibrationDueMs: DUE_MS, pressureBandPa: 9000 });
    expect(b).toEqual(a);
  });
});

describe('drift from the log: few points, equal times, outliers, never NaN', () => {
  const at = (i: number, offsetPa: number): SaturatedCheck => ({ timeMs: LOG_START_MS + i * DAY_MS, temperatureK: 407.15, absolutePressurePa: saturationPressure(407.15) + offsetPa });

  it(`fewer than ${DRIFT_MIN_CHECKS} checks: no estimate and no finding, with the counts`, () => {
    expect(driftFromLog([])).toEqual({ estimate: 'too-few-checks', checksGiven: 0, checksUsed: 0, outliersSetAside: 0, minimumChecks: DRIFT_MIN_CHECKS, findings: [] });
    const d = driftFromLog(Array.from({ length: DRIFT_MIN_CHECKS - 1 }, (_, i) => at(i, 9000)));
    expect(d.estimate).toBe('too-few-checks');
    expect(d.findings).toEqual([]);
  });
  it('all checks at one time: a mean and its interval, no trend and no projection', () => {
    const checks = Array.from({ length: 8 }, (_, i) => ({ ...at(0, 4000 + 300 * (i % 3)), timeMs: LOG_START_MS }));
    const d = made(driftFromLog(checks, { nextCalibrationDueMs: DUE_MS, pressureBandPa: 9000 }));
    expect(d.trendPaPerS).toBeNull();
    expect(d.projection).toBeNull();
    expect(d.offsetPa.value).toBeGreaterThan(4000);
  });
  it('an outlier (a check with air in it) is set aside and counted; the rest decide', () => {
    const checks = Array.from({ length: 20 }, (_, i) => at(i, 200 * Math.sin(i * 1.7)));
    checks[7] = at(7, 60_000);
    const d = made(driftFromLog(checks));
    expect(d.outliersSetAside).toBe(1);
    expect(d.checksUsed).toBe(19);
    expect(Math.abs(d.offsetPa.value)).toBeLessThan(200);
    expect(d.findings).toEqual([]);
  });
  it('any valid log gives finite figures, finite findings and no NaN anywhere (fast-check)', () => {
    const check = fc.record({
      timeMs: fc.integer({ min: LOG_START_MS, max: LOG_START_MS + 400 * DAY_MS }),
      temperatureK: fc.double({ min: 273.16, max: 647.096, noNaN: true }),
      offsetFraction: fc.double({ min: -0.05, max: 0.05, noNaN: true }),
      pressureBandPa: fc.option(fc.double({ min: 0, max: 1e6, noNaN: true }), { nil: undefined }),
    });
    fc.assert(fc.property(fc.array(check, { maxLength: 40 }), fc.option(fc.integer({ min: LOG_START_MS, max: LOG_START_MS + 800 * DAY_MS }), { nil: undefined }), (raw, dueMs) => {
      const checks = raw.map((c) => {
        const p = Math.min(Math.max(saturationPressure(c.temperatureK) * (1 + c.offsetFraction), 611.657), 22.064e6);
        return { timeMs: c.timeMs, temperatureK: c.temperatureK, absolutePressurePa: p, ...(c.pressureBandPa === undefined ? {} : { pressureBandPa: c.pressureBandPa }) };
      });
      const d = driftFromLog(checks, dueMs === undefined ? {} : { nextCalibrationDueMs: dueMs });
      return flatten(d).every(Number.isFinite) &&
        d.findings.every((f) => INSTRUMENT_RULES[f.rule as keyof typeof INSTRUMENT_RULES] === f.signal && !/NaN|Infinity/.test(f.message));
    }), { numRuns: 300 });
  });
});

describe('drift from the log: bad input names the field', () => {
  const good: SaturatedCheck = { timeMs: LOG_START_MS, temperatureK: 394.15, absolutePressurePa: 205e3 };
  it.each([
    [{ ...good, timeMs: Number.NaN }, 'check time', 'not-a-number'],
    [{ ...good, timeMs: 9e15 }, 'check time', 'out-of-range'],
    [{ ...good, temperatureK: 273 }, 'check temperature', 'out-of-range'],
    [{ ...good, temperatureK: 700 }, 'check temperature', 'out-of-range'],
    [{ ...good, absolutePressurePa: 500 }, 'check absolute pressure', 'out-of-range'],
    [{ ...good, absolutePressurePa: Number.POSITIVE_INFINITY }, 'check absolute pressure', 'not-a-number'],
    [{ ...good, pressureBandPa: -1 }, 'check pressure band', 'out-of-range'],
  ] as const)('%o → %s (%s)', (bad, field, problem) => {
    const e = expectInputError(() => driftFromLog([good, bad as SaturatedCheck]), field, problem);
    expect(e.message).toContain('check 2 of 2');
    expect(e.range).toBeDefined();
  });
  it('pressure band and next calibration due date', () => {
    expectInputError(() => driftFromLog([good], { pressureBandPa: -5 }), 'pressure band', 'out-of-range');
    expectInputError(() => driftFromLog([good], { nextCalibrationDueMs: Number.NaN }), 'next calibration due date', 'not-a-number');
  });
  it('nothing is changed in what was passed in', () => {
    const checks = [good, { ...good, timeMs: good.timeMs - DAY_MS }];
    const copy = structuredClone(checks);
    driftFromLog(checks);
    expect(checks).toEqual(copy);
  });
});

/** Every number in a nested result, for the no-NaN property. */
function flatten(value: unknown, out: number[] = []): number[] {
  if (typeof value === 'number') out.push(value);
  else if (value !== null && typeof value === 'object') for (const v of Object.values(value)) flatten(v, out);
  return out;
}
