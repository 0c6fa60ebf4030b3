// Region 4 (Eqs. (30), (31) of IAPWS R7-97(2012)): round trips, ends of the line, typed errors.
// Published check values are in test/reference/if97-tables.test.ts (Tables 35, 36).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InputError, saturationPressure, saturationTemperature } from '../../../src/core/index.ts';

function expectInputError(f: () => unknown, field: string): void {
  let caught: unknown;
  try {
    f();
  } catch (e) {
    caught = e;
  }
  expect(caught).toBeInstanceOf(InputError);
  expect((caught as InputError).field).toBe(field);
}

describe('saturation line', () => {
  it('T → p_s → T round trip, 273.15 … 647.096 K (Eq. (31) inverts Eq. (30) exactly in exact arithmetic)', () => {
    fc.assert(
      fc.property(fc.double({ min: 273.15, max: 647.096, noNaN: true }), (T) => {
        const back = saturationTemperature(saturationPressure(T));
        expect(Math.abs(back - T)).toBeLessThan(1e-9);
      }),
      { numRuns: 2000 },
    );
  });

  it('p → T_s → p round trip, 611.213 Pa … 22.064 MPa, relative 1e-11', () => {
    fc.assert(
      fc.property(fc.double({ min: Math.log(611.2127), max: Math.log(22.064e6), noNaN: true }), (lnP) => {
        const p = Math.exp(lnP);
        const back = saturationPressure(saturationTemperature(p));
        expect(Math.abs(back - p) / p).toBeLessThan(1e-11);
      }),
      { numRuns: 2000 },
    );
  });

  it('ends of the line: p_s(273.15 K) = 611.212677 Pa and p_s(Tc) = 22.064 MPa (IAPWS R7-97(2012) Eq. (30), computed with python3-iapws 1.5.2 _PSat_T)', () => {
    expect(saturationPressure(273.15)).toBeCloseTo(611.212677, 5);
    expect(Math.abs(saturationPressure(647.096) - 22.064e6) / 22.064e6).toBeLessThan(1e-8);
    expect(saturationTemperature(22.064e6)).toBeLessThanOrEqual(647.096);
    expect(saturationTemperature(saturationPressure(273.15))).toBeGreaterThanOrEqual(273.15);
  });

  it('p_s rises with T (Eq. (30) is monotonic over its range)', () => {
    let last = 0;
    for (let T = 273.15; T <= 647.096; T += 0.25) {
      const p = saturationPressure(T);
      expect(p).toBeGreaterThan(last);
      last = p;
    }
  });

  it('out-of-range and non-numbers throw InputError naming the quantity, never NaN', () => {
    for (const T of [273.14, 200, 647.1, 1000, Number.NaN, Number.POSITIVE_INFINITY, -Infinity]) {
      expectInputError(() => saturationPressure(T), 'temperature');
    }
    for (const p of [611, 0, -1, 22.065e6, 1e9, Number.NaN, Number.POSITIVE_INFINITY]) {
      expectInputError(() => saturationTemperature(p), 'pressure');
    }
    try {
      saturationPressure(700);
    } catch (e) {
      expect((e as InputError).problem).toBe('out-of-range');
      expect((e as InputError).range).toEqual({ min: 273.15, max: 647.096, unit: 'K' });
    }
  });
});
