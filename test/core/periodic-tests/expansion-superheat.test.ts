// Superheat on free expansion: still-wet expansions, monotonic in dryness, the test evaluation
// (measured or predicted), and every bad input.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  EXPANSION_SUPERHEAT_DEFAULT_MAX_K, evaluateExpansionSuperheat, expansionSuperheat, InputError, saturationTemperature,
} from '../../../src/core/index.ts';

function errorOf(f: () => unknown): InputError {
  try { f(); } catch (e) { if (e instanceof InputError) return e; throw e; }
  throw new Error('no InputError');
}
const ATM = 101325;

describe('expansion superheat', () => {
  it('steam wet enough stays wet after expansion: T_sat there and no superheat', () => {
    const r = expansionSuperheat({ linePressurePa: 300e3, dryness: 0.9, downstreamPressurePa: ATM });
    expect(r).toEqual({ temperatureK: saturationTemperature(ATM), superheatK: 0 });
  });
  it('superheat does not fall as the dryness rises, and rises once superheated (fast-check)', () => {
    fc.assert(fc.property(fc.double({ min: 150e3, max: 2e6, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (p1, a, b) => {
      const [x1, x2] = a < b ? [a, b] : [b, a];
      const s1 = expansionSuperheat({ linePressurePa: p1, dryness: x1, downstreamPressurePa: ATM }).superheatK;
      const s2 = expansionSuperheat({ linePressurePa: p1, dryness: x2, downstreamPressurePa: ATM }).superheatK;
      return s2 >= s1 && (s1 === 0 || x2 === x1 || s2 > s1);
    }));
  });
  it.each([
    ['line pressure', { linePressurePa: NaN, dryness: 1, downstreamPressurePa: ATM }],
    ['dryness', { linePressurePa: 1e6, dryness: 1.01, downstreamPressurePa: ATM }],
    ['dryness', { linePressurePa: 1e6, dryness: -0.1, downstreamPressurePa: ATM }],
    ['downstream pressure', { linePressurePa: 1e6, dryness: 1, downstreamPressurePa: 2e6 }],
    ['downstream pressure', { linePressurePa: 1e6, dryness: 1, downstreamPressurePa: 0 }],
  ])('bad input: %s', (field, input) => {
    expect(errorOf(() => expansionSuperheat(input)).field).toBe(field);
  });
});

describe('superheat test evaluation', () => {
  it('default highest superheat 25 K on free expansion to atmosphere (EN 285 via HTM 2010, secondary)', () => {
    expect(EXPANSION_SUPERHEAT_DEFAULT_MAX_K).toBe(25);
  });
  it('measured: 130 °C after expansion to 101.325 kPa is 30 K of superheat, above 25 K', () => {
    const e = evaluateExpansionSuperheat({ kind: 'measured', expansionTemperatureK: 403.15, downstreamPressurePa: ATM });
    expect(e.superheatK).toBeCloseTo(403.15 - saturationTemperature(ATM), 9);
    expect(e.findings.map((f) => f.rule)).toEqual(['expansion-superheat-above-limit']);
    expect(e.outcome).toBe('WARNING');
  });
  it('measured below saturation: superheat 0 and a notice', () => {
    const e = evaluateExpansionSuperheat({ kind: 'measured', expansionTemperatureK: saturationTemperature(ATM) - 0.3, downstreamPressurePa: ATM });
    expect(e.superheatK).toBe(0);
    expect(e.findings.map((f) => f.rule)).toEqual(['expansion-below-saturation']);
  });
  it('predicted: dry saturated steam at 3 bar absolute expanded to atmosphere, and to a chamber at 205 kPa (not the atmosphere)', () => {
    const toAir = evaluateExpansionSuperheat({ kind: 'predicted', linePressurePa: 300e3, dryness: 0.99, downstreamPressurePa: ATM });
    expect(toAir.superheatK).toBe(expansionSuperheat({ linePressurePa: 300e3, dryness: 0.99, downstreamPressurePa: ATM }).superheatK);
    expect(toAir.findings).toEqual([]);
    const toChamber = evaluateExpansionSuperheat({ kind: 'predicted', linePressurePa: 300e3, dryness: 0.99, downstreamPressurePa: 205e3 });
    expect(toChamber.findings.map((f) => f.rule)).toEqual(['expansion-not-to-atmosphere']);
  });
  it('bad input names the field', () => {
    expect(errorOf(() => evaluateExpansionSuperheat({ kind: 'measured', expansionTemperatureK: 2000, downstreamPressurePa: ATM })).field).toBe('expansion temperature');
    expect(errorOf(() => evaluateExpansionSuperheat({ kind: 'measured', expansionTemperatureK: 400, downstreamPressurePa: -1 })).field).toBe('downstream pressure');
    expect(errorOf(() => evaluateExpansionSuperheat({ kind: 'guess' } as never)).field).toBe('superheat test');
    expect(errorOf(() => evaluateExpansionSuperheat({ kind: 'measured', expansionTemperatureK: 400, downstreamPressurePa: ATM }, { maximumSuperheatK: -1 })).field)
      .toBe('highest accepted superheat');
  });
});
