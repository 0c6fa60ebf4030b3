import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  ATMOSPHERE_RANGE_PA,
  ELEVATION_RANGE_M,
  STANDARD_ATMOSPHERE_PA,
  US_STANDARD_ATMOSPHERE_1976,
  absoluteFromGauge,
  atmosphereFromElevation,
  atmosphereFromGeopotentialAltitude,
  elevationFromAtmosphere,
  gaugeFromAbsolute,
} from '../../../src/core/units/atmosphere.ts';
import { pressureToPa } from '../../../src/core/units/pressure.ts';
import { expectInputError } from './expect-input-error.ts';

describe('standard atmosphere', () => {
  it('is 101 325 Pa exactly (NIST SP 811 (2008) App. B.8, "atmosphere, standard", bold = exact)', () => {
    expect(STANDARD_ATMOSPHERE_PA).toBe(101325);
    expect(atmosphereFromElevation(0)).toBe(101325);
  });
});

describe('US Standard Atmosphere 1976, troposphere', () => {
  it('uses the 1976 constants (as reproduced at crnslab.org/util/atmo.php and fxsolver.com USSA-1976 layer table)', () => {
    expect(US_STANDARD_ATMOSPHERE_1976).toMatchObject({
      p0: 101325, T0: 288.15, lapseRate: 0.0065, g0: 9.80665, molarMass: 0.0289644, gasConstant: 8.31432,
      earthRadius: 6356766, tropopauseGeopotential: 11000,
    });
    const { g0, molarMass, gasConstant, lapseRate } = US_STANDARD_ATMOSPHERE_1976;
    // The exponent g0·M/(R*·L) = 5.255 88 (computed from the US Standard Atmosphere 1976 constants above).
    expect((g0 * molarMass) / (gasConstant * lapseRate)).toBeCloseTo(5.25588, 5);
  });

  it('top of the troposphere: 22 632 Pa at 11 000 geopotential metres (USSA-1976 layer table: 22 632.1 Pa, fxsolver.com; 22 632 Pa, crnslab.org)', () => {
    expect(atmosphereFromGeopotentialAltitude(11000)).toBeCloseTo(22632.1, 0);
  });

  // USSA 1976 Table I (geometric altitude, metric units) prints pressure to 5 significant digits.
  // These table values are from memory (the table itself was not at hand); they are marked so.
  // They are geometric-altitude values: the geopotential formula at the same numbers gives
  // 89 874.6 / 79 495.2 / 54 019.9 Pa, which would fail this check.
  it.each([
    [-500, 107480, 10, '1.0748 E+05'],
    [1000, 89876, 1, '8.9876 E+04'],
    [2000, 79501, 1, '7.9501 E+04'],
    [5000, 54048, 1, '5.4048 E+04'],
    [10000, 26500, 1, '2.6500 E+04'],
    [11000, 22700, 1, '2.2700 E+04'],
  ])('%d m geometric elevation → %d Pa (Table I prints %s; from memory)', (z, printedPa, lastDigitPa) => {
    expect(Math.abs(atmosphereFromElevation(z) - printedPa)).toBeLessThanOrEqual(lastDigitPa / 2);
  });

  it('geometric and geopotential differ by the standard\'s H = r0·Z/(r0 + Z): 1.7 Pa at 1 000 m, 28 Pa at 5 000 m', () => {
    // US Standard Atmosphere 1976 troposphere formula, computed at geopotential altitude: 1 000 m →
    // 89.875 kPa, 2 000 m → 79.495 kPa.
    expect(atmosphereFromGeopotentialAltitude(1000) / 1000).toBeCloseTo(89.875, 3);
    expect(atmosphereFromGeopotentialAltitude(2000) / 1000).toBeCloseTo(79.495, 3);
    expect(atmosphereFromElevation(1000) - atmosphereFromGeopotentialAltitude(1000)).toBeCloseTo(1.7, 1);
    expect(atmosphereFromElevation(5000) - atmosphereFromGeopotentialAltitude(5000)).toBeCloseTo(28.4, 1);
  });

  it('near sea level pressure falls by about 11 to 12 Pa per metre (common practice; 11.3 Pa/m, piglix "barometric formula")', () => {
    const perMetre = (atmosphereFromElevation(0) - atmosphereFromElevation(1000)) / 1000;
    expect(perMetre).toBeGreaterThan(11);
    expect(perMetre).toBeLessThan(12);
  });

  it('falls monotonically with elevation (fast-check)', () => {
    fc.assert(fc.property(
      fc.double({ min: ELEVATION_RANGE_M.min, max: ELEVATION_RANGE_M.max - 1, noNaN: true }),
      fc.double({ min: 0.01, max: 1000, noNaN: true }),
      (z, dz) => {
        const higher = Math.min(z + dz, ELEVATION_RANGE_M.max);
        expect(atmosphereFromElevation(higher)).toBeLessThan(atmosphereFromElevation(z));
      }));
  });

  it('elevationFromAtmosphere inverts atmosphereFromElevation to a millimetre (fast-check)', () => {
    fc.assert(fc.property(fc.double({ min: ELEVATION_RANGE_M.min, max: ELEVATION_RANGE_M.max, noNaN: true }), (z) => {
      expect(Math.abs(elevationFromAtmosphere(atmosphereFromElevation(z)) - z)).toBeLessThan(1e-3);
    }));
  });

  it('refuses elevations outside −500 m … 11 000 m, and NaN, naming the field and the range', () => {
    for (const z of [-501, 11001, 20000]) {
      const error = expectInputError(() => atmosphereFromElevation(z), 'site elevation', 'out-of-range');
      expect(error.range).toEqual({ min: -500, max: 11000, unit: 'm' });
    }
    expectInputError(() => atmosphereFromElevation(NaN), 'site elevation', 'not-a-number');
    expectInputError(() => atmosphereFromGeopotentialAltitude(11000.5), 'geopotential altitude', 'out-of-range');
    expectInputError(() => elevationFromAtmosphere(120000), 'atmospheric pressure', 'out-of-range');
    expectInputError(() => elevationFromAtmosphere(Infinity), 'atmospheric pressure', 'not-a-number');
  });
});

describe('gauge and absolute pressure', () => {
  it('absolute = gauge + the atmosphere given; gauge = absolute − the atmosphere given', () => {
    expect(absoluteFromGauge(0, STANDARD_ATMOSPHERE_PA)).toBe(101325);
    expect(absoluteFromGauge(100000, STANDARD_ATMOSPHERE_PA)).toBe(201325);
    expect(gaugeFromAbsolute(201325, STANDARD_ATMOSPHERE_PA)).toBe(100000);
    expect(gaugeFromAbsolute(50000, STANDARD_ATMOSPHERE_PA)).toBe(-51325);
  });

  it('uses the site atmosphere: 15 psi gauge at 1 500 m is 16.8 kPa less absolute than at sea level (US Standard Atmosphere 1976, computed: about 84.56 kPa at 1 500 m)', () => {
    const gauge = pressureToPa(15, 'psi');
    const seaLevel = absoluteFromGauge(gauge, STANDARD_ATMOSPHERE_PA);
    const site = absoluteFromGauge(gauge, atmosphereFromElevation(1500));
    expect((seaLevel - site) / 1000).toBeCloseTo(16.8, 1);
  });

  it('has no hidden 14.7 psi: the atmosphere is a required argument', () => {
    expect(absoluteFromGauge.length).toBe(2);
    expect(gaugeFromAbsolute.length).toBe(2);
    // @ts-expect-error — calling without the atmosphere does not compile, and at run time it is refused
    expectInputError(() => absoluteFromGauge(100000), 'atmospheric pressure', 'not-a-number');
  });

  it('refuses an atmosphere outside 20 kPa … 110 kPa (a unit slip such as 101.325 given as Pa or 14.7 as kPa)', () => {
    for (const bad of [101.325, 14.7 * 1000, 200000, 0, -101325]) {
      const error = expectInputError(() => absoluteFromGauge(0, bad), 'atmospheric pressure', 'out-of-range');
      expect(error.range).toEqual({ ...ATMOSPHERE_RANGE_PA, unit: 'Pa' });
      expectInputError(() => gaugeFromAbsolute(200000, bad), 'atmospheric pressure', 'out-of-range');
    }
    expectInputError(() => absoluteFromGauge(0, NaN), 'atmospheric pressure', 'not-a-number');
  });

  it('refuses a gauge vacuum at or beyond the whole atmosphere (absolute ≤ 0)', () => {
    expect(absoluteFromGauge(-101324, STANDARD_ATMOSPHERE_PA)).toBe(1);
    for (const gauge of [-101325, -101326, -200000]) {
      const error = expectInputError(() => absoluteFromGauge(gauge, STANDARD_ATMOSPHERE_PA), 'gauge pressure', 'out-of-range');
      expect(error.range?.min).toBe(-101325);
      expect(error.message).toMatch(/vacuum/);
    }
    // at altitude the limit is the local atmosphere, not the standard one
    const site = atmosphereFromElevation(2000);
    expectInputError(() => absoluteFromGauge(-site - 1, site), 'gauge pressure', 'out-of-range');
    expectInputError(() => absoluteFromGauge(NaN, site), 'gauge pressure', 'not-a-number');
  });

  it('refuses an absolute pressure that is not above zero', () => {
    for (const bad of [0, -1]) expectInputError(() => gaugeFromAbsolute(bad, STANDARD_ATMOSPHERE_PA), 'absolute pressure', 'out-of-range');
    expectInputError(() => gaugeFromAbsolute(Infinity, STANDARD_ATMOSPHERE_PA), 'absolute pressure', 'not-a-number');
  });

  it('gauge → absolute → gauge round trips within 1e-12 of the absolute pressure (fast-check)', () => {
    fc.assert(fc.property(
      fc.double({ min: ATMOSPHERE_RANGE_PA.min, max: ATMOSPHERE_RANGE_PA.max, noNaN: true }),
      fc.double({ min: -0.999, max: 1000, noNaN: true }),
      (atm, fraction) => {
        const gauge = fraction * atm;
        const absolute = absoluteFromGauge(gauge, atm);
        expect(absolute).toBeGreaterThan(0);
        expect(Math.abs(gaugeFromAbsolute(absolute, atm) - gauge)).toBeLessThanOrEqual(1e-12 * absolute);
      }));
  });
});
