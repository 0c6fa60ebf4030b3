// The steam engine's public surface as the rest of the app uses it: names, constants, and the rule that
// every out-of-range input becomes an InputError naming the quantity — never NaN.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import * as core from '../../../src/core/index.ts';
import { SATURATION_PRESSURE_MAX, SATURATION_PRESSURE_MIN } from '../../../src/core/steam/saturation-line.ts';
import { FORMULATION_ID, IF97, InputError, saturation, saturationPressure, saturationTemperature, stateTP, stateTV } from '../../../src/core/index.ts';

describe('steam public surface', () => {
  it('exports the contract names from src/core/index.ts', () => {
    for (const name of ['saturationPressure', 'saturationTemperature', 'saturation', 'stateTP', 'stateTV']) {
      expect(typeof (core as Record<string, unknown>)[name]).toBe('function');
    }
    expect(FORMULATION_ID).toBe('IAPWS-IF97 (R7-97(2012))');
  });

  it('IF97 constants as IAPWS R7-97(2012) Eqs. (1)-(4) give them (R, Tc, pc, ρc) and the triple point', () => {
    expect(IF97).toEqual({ R: 461.526, Tc: 647.096, pc: 22.064e6, rhoc: 322, Tt: 273.16, pt: 611.657 });
  });

  /** Any double outside [min, max], plus NaN and the infinities. */
  const outside = (min: number, max: number) =>
    fc.oneof(
      fc.double({ max: min, noNaN: true }).filter((x) => x < min),
      fc.double({ min: max, noNaN: true }).filter((x) => x > max),
      fc.constantFrom(Number.NaN, Infinity, -Infinity),
    );

  function expectInputError(f: () => unknown, field: string): void {
    let caught: unknown;
    let result: unknown;
    try {
      result = f();
    } catch (e) {
      caught = e;
    }
    expect(result, 'returned instead of throwing').toBeUndefined();
    expect(caught).toBeInstanceOf(InputError);
    expect((caught as InputError).field).toBe(field);
    expect((caught as InputError).message).toContain(field);
  }

  it('every out-of-range input throws InputError naming the quantity (fast-check over all doubles outside the ranges)', () => {
    fc.assert(
      fc.property(outside(273.15, 647.096), (T) => {
        expectInputError(() => saturationPressure(T), 'temperature');
        expectInputError(() => saturation(T), 'temperature');
      }),
      { numRuns: 500 },
    );
    fc.assert(
      fc.property(outside(SATURATION_PRESSURE_MIN, SATURATION_PRESSURE_MAX), (p) => expectInputError(() => saturationTemperature(p), 'pressure')),
      { numRuns: 500 },
    );
    fc.assert(
      fc.property(outside(273.15, 1073.15), fc.double({ min: 1e3, max: 1e7, noNaN: true }), (T, p) => {
        expectInputError(() => stateTP(T, p), 'temperature');
        expectInputError(() => stateTV(T, 1), 'temperature');
      }),
      { numRuns: 500 },
    );
    fc.assert(
      fc.property(fc.double({ min: 273.15, max: 1073.15, noNaN: true }), outside(1e-6, 100e6), (T, p) => {
        expectInputError(() => stateTP(T, p), 'pressure');
      }),
      { numRuns: 500 },
    );
    fc.assert(
      fc.property(fc.double({ min: 273.15, max: 1073.15, noNaN: true }), outside(Number.MIN_VALUE, 1e9), (T, v) => {
        expectInputError(() => stateTV(T, v), 'specific volume');
      }),
      { numRuns: 500 },
    );
  });
});
