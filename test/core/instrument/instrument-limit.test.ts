import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { DEFAULT_INSTRUMENT_SETTINGS, LIMIT_PARTS, MS_PER_DAY, MS_PER_YEAR, instrumentLimit, type CalibrationRecord, type InstrumentSpec } from '../../../src/core/instrument/index.ts';
import { expectInputError } from '../units/expect-input-error.ts';
import { temperatureToleranceK } from '../../../src/core/check/uncertainty.ts';
import { testVessel } from '../check/test-vessel.ts';

const NOW = Date.parse('2026-12-04T09:00:00Z');
// Invented instruments of an invented steriliser chamber (test data).
const gauge: InstrumentSpec = { tag: 'PG-7', kind: 'pressure-gauge', range: { low: 0, high: 1e6 }, tolerance: { kind: 'percent-of-span', percentOfSpan: 1.6 } };
const rtd: InstrumentSpec = { tag: 'TE-7', kind: 'rtd', range: { low: 273.15, high: 473.15 }, tolerance: { kind: 'iec-60751', sensorClass: 'B' }, indicatorTolerance: { kind: 'stated', plusMinus: 0.2 } };
const cal = (daysAgo: number, asFoundError: number, extra: Partial<CalibrationRecord> = {}): CalibrationRecord => ({ timeMs: NOW - daysAgo * MS_PER_DAY, asFoundError, ...extra });

describe('instrument limit: the parts', () => {
  it('an EN 837-1 class is percent of span: 0–10 bar class 1.6 → ±0.16 bar (field-practice.md §3.1 worked example)', () => {
    const l = instrumentLimit(gauge, [], { nowMs: NOW });
    expect(l.band.contributions.class).toBeCloseTo(16e3, 9);
    expect(l.unit).toBe('Pa');
  });
  it('an IEC 60751 class B RTD at 121 °C: ±(0.30 + 0.005·121) = ±0.905 K (IEC 60751 class formula, field-practice.md §3.2), its indicator beside it', () => {
    const l = instrumentLimit(rtd, [], { nowMs: NOW, readingValue: 394.15 });
    expect(l.band.contributions.class).toBeCloseTo(0.905, 12);
    expect(l.band.contributions.indicator).toBe(0.2);
    expect(l.unit).toBe('K');
  });
  it('no calibration on record: class and indicator only, nothing to grow from', () => {
    const l = instrumentLimit(rtd, [], { nowMs: NOW, readingValue: 394.15 });
    expect(l.band.contributions.calibration).toBe(0);
    expect(l.band.contributions.drift).toBe(0);
    expect(l.calibrationBasis).toBe('none');
    expect(l.sinceCalibrationMs).toBeNull();
    expect(l.foundOutOfTolerance).toBe(false);
  });
  it('the calibration part is |as-left| when adjusted, |as-found| when left as found', () => {
    expect(instrumentLimit(gauge, [cal(10, -9000, { asLeftError: 1200 })], { nowMs: NOW }).band.contributions.calibration).toBe(1200);
    const l = instrumentLimit(gauge, [cal(10, -9000)], { nowMs: NOW });
    expect(l.band.contributions.calibration).toBe(9000);
    expect(l.calibrationBasis).toBe('as-found');
  });
  it('drift grows linearly with time since calibration: the default 0.5 % of span per year gives 2.5 kPa after half a year on a 1 MPa span (DEFAULT_INSTRUMENT_SETTINGS, common practice)', () => {
    expect(DEFAULT_INSTRUMENT_SETTINGS['pressure-gauge'].driftAllowance).toEqual({ basis: 'percent-of-span', percentOfSpanPerYear: 0.5 });
    const l = instrumentLimit(gauge, [{ timeMs: NOW - MS_PER_YEAR / 2, asFoundError: 0 }], { nowMs: NOW });
    expect(l.band.contributions.drift).toBeCloseTo(2500, 9);
    expect(l.driftSource).toBe('kind-setting');
    expect(instrumentLimit(gauge, [{ timeMs: NOW, asFoundError: 0 }], { nowMs: NOW }).band.contributions.drift).toBe(0);
  });
  it("the instrument's own allowance overrides its kind's", () => {
    const l = instrumentLimit({ ...rtd, driftAllowance: { basis: 'absolute', siUnitsPerYear: 0.4 } }, [{ timeMs: NOW - MS_PER_YEAR, asFoundError: 0 }], { nowMs: NOW, readingValue: 400 });
    expect(l.band.contributions.drift).toBeCloseTo(0.4, 12);
    expect(l.driftSource).toBe('instrument-setting');
  });
  it('a faster drift seen over the last interval raises the rate: found 12 kPa off a year after being left at +2 kPa → 10 kPa a year', () => {
    const history = [{ timeMs: NOW - 1.5 * MS_PER_YEAR, asFoundError: 30_000, asLeftError: 2000 }, { timeMs: NOW - 0.5 * MS_PER_YEAR, asFoundError: 12_000, asLeftError: 0 }];
    const l = instrumentLimit(gauge, history, { nowMs: NOW });
    expect(l.driftPerYear).toBeCloseTo(10_000, 6);
    expect(l.driftSource).toBe('last-interval');
    expect(l.band.contributions.drift).toBeCloseTo(5000, 6);
    expect(l.foundOutOfTolerance).toBe(false);
  });
  it('the latest calibration counts, whatever the order of the list', () => {
    const a = instrumentLimit(gauge, [cal(100, 500), cal(400, 9000)], { nowMs: NOW });
    const b = instrumentLimit(gauge, [cal(400, 9000), cal(100, 500)], { nowMs: NOW });
    expect(a).toEqual(b);
    expect(a.lastCalibrationMs).toBe(NOW - 100 * MS_PER_DAY);
  });
  it('found out of tolerance: as-found beyond the RSS of class and indicator at the point it was found', () => {
    expect(instrumentLimit(gauge, [cal(10, 16_001)], { nowMs: NOW }).foundOutOfTolerance).toBe(true);
    expect(instrumentLimit(gauge, [cal(10, -15_999)], { nowMs: NOW }).foundOutOfTolerance).toBe(false);
    // at 300 °C class B allows 1.8 K; at 0 °C 0.3 K: the same 1 K error is out only at the low point
    const hot = instrumentLimit(rtd, [cal(10, 1, { referenceValue: 573.15 })], { nowMs: NOW, readingValue: 394.15 });
    const cold = instrumentLimit(rtd, [cal(10, 1, { referenceValue: 273.15 })], { nowMs: NOW, readingValue: 394.15 });
    expect([hot.foundOutOfTolerance, cold.foundOutOfTolerance]).toEqual([false, true]);
  });
  it('the band is the RSS of the four parts, the worst case their sum (combineBand; fast-check)', () => {
    fc.assert(fc.property(fc.double({ min: 0, max: 10, noNaN: true }), fc.integer({ min: 0, max: 3000 }), fc.double({ min: -1e5, max: 1e5, noNaN: true }), (klass, days, err) => {
      const l = instrumentLimit({ ...gauge, tolerance: { kind: 'percent-of-span', percentOfSpan: klass } }, [cal(days, err)], { nowMs: NOW });
      const parts = LIMIT_PARTS.map((k) => l.band.contributions[k]);
      return Math.abs(l.band.plusMinus - Math.hypot(...parts)) <= 1e-9 * (1 + l.band.plusMinus) &&
        Math.abs(l.band.worstCase - parts.reduce((a, b) => a + b, 0)) <= 1e-9 * (1 + l.band.worstCase) && parts.every((p) => p >= 0 && Number.isFinite(p));
    }));
  });
});

describe("instrument limit: today's vessel instruments", () => {
  it('with no calibration on record, the limit is the figure the check engine uses now (class × span; the IEC 60751 class at T; a stated ±)', () => {
    const { pressureGauge } = testVessel().instruments;
    const asGauge: InstrumentSpec = { tag: 'G', kind: 'pressure-gauge', range: { low: 0, high: pressureGauge.spanPa }, tolerance: { kind: 'percent-of-span', percentOfSpan: pressureGauge.accuracyPercentOfSpan } };
    expect(instrumentLimit(asGauge, [], { nowMs: NOW }).band.plusMinus).toBeCloseTo((pressureGauge.accuracyPercentOfSpan / 100) * pressureGauge.spanPa, 9);
    for (const sensorClass of ['AA', 'A', 'B'] as const) {
      const asRtd: InstrumentSpec = { tag: 'T', kind: 'rtd', range: { low: 273.15, high: 673.15 }, tolerance: { kind: 'iec-60751', sensorClass } };
      expect(instrumentLimit(asRtd, [], { nowMs: NOW, readingValue: 407.15 }).band.plusMinus).toBe(temperatureToleranceK({ kind: 'iec-60751', sensorClass }, 407.15));
    }
    const stated: InstrumentSpec = { tag: 'T', kind: 'thermometer', range: { low: 273.15, high: 673.15 }, tolerance: { kind: 'stated', plusMinus: 0.7 } };
    expect(instrumentLimit(stated, [], { nowMs: NOW }).band.plusMinus).toBe(0.7);
  });
});

describe('instrument limit: bad input names the field', () => {
  it.each([
    [{ ...gauge, tag: ' ' }, 'instrument tag', 'empty'],
    [{ ...gauge, kind: 'manometer' }, 'instrument kind', 'out-of-range'],
    [{ ...gauge, range: { low: 0, high: Number.NaN } }, 'range high', 'not-a-number'],
    [{ ...gauge, range: { low: 5e5, high: 1e5 } }, 'range high', 'inconsistent'],
    [{ ...gauge, range: { low: -2e5, high: 1e6 } }, 'range low', 'out-of-range'],
    [{ ...gauge, tolerance: { kind: 'percent-of-span', percentOfSpan: 12 } }, 'accuracy class', 'out-of-range'],
    [{ ...gauge, tolerance: { kind: 'iec-60751', sensorClass: 'B' } }, 'accuracy class', 'out-of-range'],
    [{ ...gauge, tolerance: { kind: 'stated', plusMinus: 2e6 } }, 'accuracy class', 'out-of-range'],
    [{ ...gauge, tolerance: undefined }, 'accuracy class', 'empty'],
    [{ ...gauge, indicatorTolerance: { kind: 'iec-60751', sensorClass: 'A' } }, 'indicator tolerance', 'out-of-range'],
    [{ ...gauge, driftAllowance: { basis: 'percent-of-span', percentOfSpanPerYear: -1 } }, 'drift allowance', 'out-of-range'],
    [{ ...gauge, driftAllowance: { basis: 'yearly' } }, 'drift allowance', 'empty'],
    [{ ...gauge, calibrationIntervalMs: 0 }, 'calibration interval', 'out-of-range'],
  ] as const)('%#: %s', (bad, field, problem) => {
    expectInputError(() => instrumentLimit(bad as unknown as InstrumentSpec, [], { nowMs: NOW }), field, problem);
  });
  it('calibration fields, with which calibration', () => {
    const e = expectInputError(() => instrumentLimit(gauge, [cal(5, 0), cal(-1, 0)], { nowMs: NOW }), 'calibration date', 'inconsistent');
    expect(e.message).toContain('calibration 2 of 2 (PG-7)');
    expectInputError(() => instrumentLimit(gauge, [cal(5, 2e6)], { nowMs: NOW }), 'as-found error', 'out-of-range');
    expectInputError(() => instrumentLimit(gauge, [cal(5, 0, { asLeftError: Number.NaN })], { nowMs: NOW }), 'as-left error', 'not-a-number');
    expectInputError(() => instrumentLimit(gauge, [cal(5, 0, { nextDueMs: NOW - 6 * MS_PER_DAY })], { nowMs: NOW }), 'next due date', 'out-of-range');
    expectInputError(() => instrumentLimit(rtd, [cal(5, 0, { referenceValue: -4 })], { nowMs: NOW, readingValue: 400 }), 'reference value', 'out-of-range');
  });
  it('the date now, the reading an IEC class needs, and settings', () => {
    expectInputError(() => instrumentLimit(gauge, [], { nowMs: Number.NaN }), 'date now', 'not-a-number');
    expectInputError(() => instrumentLimit(rtd, [], { nowMs: NOW }), 'reading', 'empty');
    expectInputError(() => instrumentLimit(rtd, [], { nowMs: NOW, readingValue: 100 }), 'reading', 'out-of-range');
    const settings = { ...DEFAULT_INSTRUMENT_SETTINGS, 'pressure-gauge': { calibrationIntervalMs: -1, driftAllowance: { basis: 'absolute' as const, siUnitsPerYear: 1 } } };
    expectInputError(() => instrumentLimit(gauge, [], { nowMs: NOW, settings }), 'calibration interval', 'out-of-range');
  });
});
