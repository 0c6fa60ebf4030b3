// Throttling calorimeter dryness: round trips through the isenthalpic throttle, the refusals with
// their reasons, the evaluation's limit, and every bad input.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  evaluateThrottlingDryness, expansionSuperheat, InputError, saturationTemperature, throttlingDryness, THROTTLING_DRYNESS_DEFAULT_MIN,
} from '../../../src/core/index.ts';

function errorOf(f: () => unknown): InputError {
  try { f(); } catch (e) { if (e instanceof InputError) return e; throw e; }
  throw new Error('no InputError');
}

describe('throttling dryness', () => {
  it('steam built with a known x and throttled comes back to x (fast-check; enthalpy kept by the throttle)', () => {
    fc.assert(fc.property(
      fc.double({ min: 50e3, max: 5e6, noNaN: true }), fc.double({ min: 0.05, max: 0.9, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }),
      (p1, downFraction, u) => {
        const p2 = Math.max(1e3, downFraction * p1);
        // The lowest x that is still superheated after this throttle, then any x from there to 1.
        const xLow = lowestMeasurable(p1, p2);
        const x = xLow + u * (1 - xLow);
        const after = expansionSuperheat({ linePressurePa: p1, dryness: x, downstreamPressurePa: p2 });
        if (after.superheatK < 1e-6) return true; // at the very edge the throttled state is saturated
        const back = throttlingDryness({ linePressurePa: p1, calorimeterPressurePa: p2, calorimeterTemperatureK: after.temperatureK }).dryness;
        return Math.abs(back - x) < 1e-9;
      }), { numRuns: 200 });
  });
  it('refuses a throttled state that is not superheated, saying why', () => {
    const p2 = 101325;
    const e = errorOf(() => throttlingDryness({ linePressurePa: 1e6, calorimeterPressurePa: p2, calorimeterTemperatureK: saturationTemperature(p2) - 0.5 }));
    expect(e.field).toBe('calorimeter temperature');
    expect(e.problem).toBe('inconsistent');
    expect(e.message).toMatch(/not superheated/);
    expect(e.message).toMatch(/cannot give the dryness of steam this wet/);
    expect(e.range!.min).toBeCloseTo(saturationTemperature(p2), 9);
  });
  it('refuses a calorimeter temperature above what dry saturated line steam gives, saying the line may be superheated', () => {
    const dry = expansionSuperheat({ linePressurePa: 1e6, dryness: 1, downstreamPressurePa: 101325 });
    expect(throttlingDryness({ linePressurePa: 1e6, calorimeterPressurePa: 101325, calorimeterTemperatureK: dry.temperatureK - 1e-6 }).dryness).toBeCloseTo(1, 6);
    const e = errorOf(() => throttlingDryness({ linePressurePa: 1e6, calorimeterPressurePa: 101325, calorimeterTemperatureK: dry.temperatureK + 0.5 }));
    expect(e.field).toBe('calorimeter temperature');
    expect(e.message).toMatch(/superheated/);
    expect(e.range!.max).toBeCloseTo(dry.temperatureK, 6);
  });
  it.each([
    ['line pressure', { linePressurePa: 5e3, calorimeterPressurePa: 1e3, calorimeterTemperatureK: 400 }],
    ['line pressure', { linePressurePa: 20e6, calorimeterPressurePa: 1e5, calorimeterTemperatureK: 400 }],
    ['calorimeter pressure', { linePressurePa: 1e6, calorimeterPressurePa: 1e6, calorimeterTemperatureK: 400 }],
    ['calorimeter pressure', { linePressurePa: 1e6, calorimeterPressurePa: 100, calorimeterTemperatureK: 400 }],
    ['calorimeter temperature', { linePressurePa: 1e6, calorimeterPressurePa: 1e5, calorimeterTemperatureK: NaN }],
    ['calorimeter temperature', { linePressurePa: 1e6, calorimeterPressurePa: 1e5, calorimeterTemperatureK: 1200 }],
  ])('bad input: %s', (field, reading) => {
    expect(errorOf(() => throttlingDryness(reading)).field).toBe(field);
  });
});

/** Lowest x whose throttled state is superheated: h_f + x·h_fg = h_g(p2), found through expansionSuperheat by bisection. */
function lowestMeasurable(p1: number, p2: number): number {
  let lo = 0, hi = 1;
  for (let i = 0; i < 60; i++) {
    const mid = 0.5 * (lo + hi);
    if (expansionSuperheat({ linePressurePa: p1, dryness: mid, downstreamPressurePa: p2 }).superheatK > 0) hi = mid;
    else lo = mid;
  }
  return hi;
}

describe('throttling dryness test evaluation', () => {
  const reading = { linePressurePa: 1e6, calorimeterPressurePa: 101325, calorimeterTemperatureK: 383.15 };
  it('default lowest dryness 0.97 (CDC 2008 guideline: dryness fraction ≥ 97 %)', () => {
    expect(THROTTLING_DRYNESS_DEFAULT_MIN).toBe(0.97);
  });
  it('0.960 is below 0.97: a WARNING finding; with a site limit of 0.95 no finding', () => {
    const e = evaluateThrottlingDryness(reading);
    expect(e.dryness).toBeCloseTo(0.9598, 4);
    expect(e.outcome).toBe('WARNING');
    expect(e.findings.map((f) => f.rule)).toEqual(['throttling-dryness-below-limit']);
    expect(e.calorimeterSuperheatK).toBeCloseTo(383.15 - saturationTemperature(101325), 9);
    const relaxed = evaluateThrottlingDryness(reading, { minimumDryness: 0.95 });
    expect(relaxed.outcome).toBe('none');
    expect(relaxed.standing.map((c) => c.rule)).toEqual(['steam-sampling-hot', 'throttling-result-is-dryness-fraction', 'periodic-test-standing-note']);
  });
  it('keeps the dryness fraction apart from the vacuum-flask dryness value in its wording', () => {
    const e = evaluateThrottlingDryness(reading);
    expect(e.standing.find((c) => c.rule === 'throttling-result-is-dryness-fraction')!.message).toMatch(/not the dryness value of the vacuum-flask test/);
  });
  it('bad limit names the field', () => {
    expect(errorOf(() => evaluateThrottlingDryness(reading, { minimumDryness: 1.2 })).field).toBe('lowest accepted dryness');
  });
});
