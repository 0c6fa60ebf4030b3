// The straight-line reading of a record between its readings: crossings, time within limits,
// extremes and intervals, against hand-worked closed forms of straight lines.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  extremesWithin, largestIntervalWithin, runsAtOrAbove, sliceSeries, timeWithin, valueAt, type Series,
} from '../../../src/core/cycle/time-series.ts';

const series = (points: [number, number][]): Series => ({ timesS: points.map((p) => p[0]), values: points.map((p) => p[1]) });

describe('time series', () => {
  const ramp = series([[0, 100], [100, 120], [200, 120], [300, 100]]);
  it('valueAt interpolates on the straight line (closed form)', () => {
    expect(valueAt(ramp, 25)).toBeCloseTo(105, 12);
    expect(valueAt(ramp, 150)).toBe(120);
    expect(valueAt(ramp, 275)).toBeCloseTo(105, 12);
    expect(valueAt(ramp, -5)).toBe(100);
    expect(valueAt(ramp, 400)).toBe(100);
  });
  it('runs at or above a level start and end where the lines cross it', () => {
    expect(runsAtOrAbove(ramp, 110)).toEqual([{ startS: 50, endS: 250, endedWithRecord: false }]);
    expect(runsAtOrAbove(ramp, 130)).toEqual([]);
    expect(runsAtOrAbove(series([[0, 5], [10, 5]]), 5)).toEqual([{ startS: 0, endS: 10, endedWithRecord: true }]);
    const dip = series([[0, 10], [10, 10], [20, 0], [30, 10], [40, 10]]);
    expect(runsAtOrAbove(dip, 5)).toEqual([
      { startS: 0, endS: 15, endedWithRecord: false },
      { startS: 25, endS: 40, endedWithRecord: true },
    ]);
  });
  it('time within [lo, hi] on straight lines (closed form: the fraction of each segment inside)', () => {
    // 100 → 120 in 100 s: 105…115 is 50 s; the plateau at 120 counts only if hi ≥ 120.
    expect(timeWithin(ramp, 105, 115, 0, 100)).toBeCloseTo(50, 10);
    expect(timeWithin(ramp, 110, 120, 0, 300)).toBeCloseTo(50 + 100 + 50, 10);
    expect(timeWithin(ramp, 110, 119, 0, 300)).toBeCloseTo(45 + 45, 10);
    expect(timeWithin(ramp, 110, 120, 60, 240)).toBeCloseTo(180, 10);
    expect(timeWithin(ramp, 121, 130, 0, 300)).toBe(0);
  });
  it('time within the whole range is the whole duration (fast-check)', () => {
    fc.assert(fc.property(fc.array(fc.double({ min: -50, max: 50, noNaN: true }), { minLength: 2, maxLength: 30 }), (vs) => {
      const s: Series = { timesS: vs.map((_, i) => 3 * i), values: vs };
      const total = 3 * (vs.length - 1);
      return Math.abs(timeWithin(s, -50, 50, 0, total) - total) < 1e-9 * total;
    }));
  });
  it('slices carry the interpolated ends; extremes and the largest interval look only inside', () => {
    expect(sliceSeries(ramp, 50, 250)).toEqual([
      { timeS: 50, value: 110 }, { timeS: 100, value: 120 }, { timeS: 200, value: 120 }, { timeS: 250, value: 110 },
    ]);
    const e = extremesWithin(ramp, 50, 250);
    expect(e.min).toEqual({ timeS: 50, value: 110 });
    expect(e.max).toEqual({ timeS: 100, value: 120 });
    const uneven = series([[0, 1], [10, 1], [70, 1], [80, 1]]);
    expect(largestIntervalWithin(uneven, 0, 10)).toBe(10);
    expect(largestIntervalWithin(uneven, 5, 15)).toBe(60);
    expect(largestIntervalWithin(uneven, 75, 80)).toBe(10);
  });
});
