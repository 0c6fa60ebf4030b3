// The hold and equilibration found in straight-line records built by hand, so every crossing time is
// a closed form.
import { describe, expect, it } from 'vitest';
import { findEquilibration, findHold } from '../../../src/core/cycle/hold.ts';
import type { Series } from '../../../src/core/cycle/time-series.ts';

const series = (points: [number, number][]): Series => ({ timesS: points.map((p) => p[0]), values: points.map((p) => p[1]) });
const LOWER = 394.15; // 121 °C

describe('hold', () => {
  it('met: the first stretch at temperature lasts the hold time; it starts where the heat-up crosses the limit', () => {
    // Heat-up 384.15 → 395.15 K over 110 s crosses 394.15 K at 100 s; falls at 1100 → 1110 s, crossing at 1101 s.
    const h = findHold(series([[0, 384.15], [110, 395.15], [1100, 395.15], [1110, 385.15]]), LOWER, 900);
    expect(h.status).toBe('met');
    expect(h.startS).toBeCloseTo(100, 9);
    expect(h.endS).toBeCloseTo(1101, 9);
    expect(h.achievedS).toBeCloseTo(1001, 9);
    expect(h.interruption).toBeNull();
  });
  it('short: the readings end at temperature before the hold time', () => {
    const h = findHold(series([[0, 395], [600, 395]]), LOWER, 900);
    expect(h).toMatchObject({ status: 'short', startS: 0, endS: 600, achievedS: 600, endedWithRecord: true });
  });
  it('short: the temperature falls and never comes back', () => {
    const h = findHold(series([[0, 395.15], [500, 395.15], [510, 385.15]]), LOWER, 900);
    expect(h).toMatchObject({ status: 'short', startS: 0, endedWithRecord: false });
    expect(h.endS).toBeCloseTo(501, 9);
  });
  it('interrupted: a dip below the limit during the hold that comes back; the judged interval runs to where the hold would end', () => {
    const h = findHold(series([[0, 395.15], [300, 395.15], [310, 393.15], [320, 395.15], [2000, 395.15]]), LOWER, 900);
    expect(h.status).toBe('interrupted');
    expect(h.achievedS).toBeCloseTo(305, 9);
    expect(h.interruption!.belowFromS).toBeCloseTo(305, 9);
    expect(h.interruption!.belowUntilS).toBeCloseTo(315, 9);
    expect(h.interruption!.lowestK).toBe(393.15);
    expect(h.endS).toBe(900);
    expect(h.longestRunS).toBeCloseTo(1685, 9);
  });
  it('not reached', () => {
    expect(findHold(series([[0, 380], [100, 394.1]]), LOWER, 900)).toMatchObject({ status: 'not-reached', startS: null, endS: null, achievedS: 0 });
  });
});

describe('equilibration', () => {
  it('is the lag from T_sat(p) reaching the limit to the measured temperature reaching it', () => {
    const tsat = series([[0, 384.15], [100, 395.15], [400, 395.15]]); // crosses at 90.909… s
    const t = series([[0, 380.15], [100, 390.15], [200, 395.15], [400, 395.15]]); // crosses at 180 s
    const e = findEquilibration(tsat, t, LOWER);
    expect(e.pressureReachedS).toBeCloseTo(1000 / 11, 9);
    expect(e.temperatureReachedS).toBeCloseTo(180, 9);
    expect(e.equilibrationS).toBeCloseTo(180 - 1000 / 11, 9);
  });
  it('is 0 when the temperature got there first, and null when either never did', () => {
    const early = series([[0, 395.15], [10, 395.15]]);
    const late = series([[0, 390], [10, 395.15]]);
    expect(findEquilibration(late, early, LOWER).equilibrationS).toBe(0);
    expect(findEquilibration(series([[0, 390], [10, 391]]), early, LOWER).equilibrationS).toBeNull();
  });
});
