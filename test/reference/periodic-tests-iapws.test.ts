// The supply-steam tests against Debian's python3-iapws (run live with /usr/bin/python3, script
// periodic-tests-iapws.py beside this file): the throttling calorimeter's dryness fraction and the
// temperature and superheat after free expansion over a grid of line pressures 0.1–2 MPa, and the
// vacuum-flask dryness value with T_s and L from the same library.
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { expansionSuperheat, flaskDryness, InputError, saturationTemperature, throttlingDryness } from '../../src/core/index.ts';

const SCRIPT = fileURLToPath(new URL('./periodic-tests-iapws.py', import.meta.url));

function python<T>(cases: object[]): T[] {
  const r = spawnSync('/usr/bin/python3', [SCRIPT], { input: JSON.stringify(cases), encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`python3-iapws failed: ${r.stderr}`);
  return JSON.parse(r.stdout) as T[];
}

// Line pressures 0.1–2 MPa absolute; downstream pressures below each (atmosphere, and two vacuum levels).
const LINE_PA = [0.1e6, 0.15e6, 0.2e6, 0.3e6, 0.4e6, 0.5e6, 0.7e6, 1.0e6, 1.5e6, 2.0e6];
const DOWNSTREAM_PA = [20e3, 50e3, 101325];

describe('throttling calorimeter dryness against python3-iapws 1.5.2', () => {
  const cases = LINE_PA.flatMap((p1Pa) => DOWNSTREAM_PA.filter((p2) => p2 < p1Pa).flatMap((p2Pa) =>
    [0.5, 2, 10, 30, 60].map((rise) => ({ kind: 'throttling', p1Pa, p2Pa, T2: saturationTemperature(p2Pa) + rise }))));
  const answers = python<{ dryness: number }>(cases);
  it('covers the grid with both usable readings and readings that imply superheated line steam', () => {
    expect(cases.length).toBeGreaterThan(100);
    expect(answers.filter((a) => a.dryness <= 1).length).toBeGreaterThan(40);
    expect(answers.filter((a) => a.dryness > 1).length).toBeGreaterThan(10);
  });
  it('agrees to 1e-9 in x wherever x ≤ 1, and refuses (naming the calorimeter temperature) where the library gives x > 1', () => {
    cases.forEach((c, i) => {
      const want = answers[i]!.dryness;
      const reading = { linePressurePa: c.p1Pa, calorimeterPressurePa: c.p2Pa, calorimeterTemperatureK: c.T2 };
      if (want <= 1) {
        expect(Math.abs(throttlingDryness(reading).dryness - want)).toBeLessThan(1e-9);
      } else {
        expect(() => throttlingDryness(reading)).toThrow(InputError);
        try { throttlingDryness(reading); } catch (e) { expect((e as InputError).field).toBe('calorimeter temperature'); }
      }
    });
  });
});

describe('temperature and superheat after free expansion against python3-iapws 1.5.2', () => {
  const cases = LINE_PA.flatMap((p1Pa) => DOWNSTREAM_PA.filter((p2) => p2 < p1Pa).flatMap((p2Pa) =>
    [0.85, 0.9, 0.95, 0.98, 1].map((x) => ({ kind: 'expansion', p1Pa, p2Pa, x }))));
  const answers = python<{ temperatureK: number; superheatK: number }>(cases);
  it('covers superheated and still-wet expansions', () => {
    expect(answers.filter((a) => a.superheatK > 0).length).toBeGreaterThan(40);
    expect(answers.filter((a) => a.superheatK === 0).length).toBeGreaterThan(10);
  });
  it('agrees to 1e-7 K in temperature and superheat', () => {
    cases.forEach((c, i) => {
      const got = expansionSuperheat({ linePressurePa: c.p1Pa, dryness: c.x, downstreamPressurePa: c.p2Pa });
      const want = answers[i]!;
      expect(Math.abs(got.temperatureK - want.temperatureK)).toBeLessThan(1e-7);
      expect(Math.abs(got.superheatK - want.superheatK)).toBeLessThan(1e-7);
    });
  });
});

describe('vacuum-flask dryness value with T_s and L from python3-iapws 1.5.2', () => {
  // Invented flask readings spread over supply pressures and fills; the formula is the method's (from memory).
  const cases = [150e3, 250e3, 300e3, 400e3, 600e3].flatMap((supplyPressurePa, i) => [0.04, 0.06, 0.08].map((condensate, j) => ({
    kind: 'flask', supplyPressurePa, emptyFlaskMassKg: 0.8 + 0.05 * i, massBeforeKg: 0.8 + 0.05 * i + 0.65,
    massAfterKg: 0.8 + 0.05 * i + 0.65 + condensate, temperatureBeforeK: 283.15 + 2 * j, temperatureAfterK: 345.15 + 3 * j,
    flaskHeatCapacityJPerK: 60 + 20 * j,
  })));
  const answers = python<{ drynessValue: number; steamTemperatureK: number; latentHeatJPerKg: number }>(cases);
  it('agrees to 1e-9 in D, 1e-8 K in T_s and 1e-6 relative in L', () => {
    cases.forEach((c, i) => {
      const got = flaskDryness(c);
      const want = answers[i]!;
      expect(Math.abs(got.drynessValue - want.drynessValue)).toBeLessThan(1e-9);
      expect(Math.abs(got.steamTemperatureK - want.steamTemperatureK)).toBeLessThan(1e-8);
      expect(Math.abs(got.latentHeatJPerKg / want.latentHeatJPerKg - 1)).toBeLessThan(1e-6);
    });
  });
});
