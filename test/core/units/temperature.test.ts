import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  TEMPERATURE_UNITS,
  isTemperatureUnit,
  temperatureDifferenceFromK,
  temperatureDifferenceToK,
  temperatureFromK,
  temperatureToK,
  type TemperatureUnit,
} from '../../../src/core/units/temperature.ts';
import { expectInputError } from './expect-input-error.ts';

const ALL = TEMPERATURE_UNITS.map((u) => u.id);

describe('temperature against NIST SP 811 (2008) Appendix B.8 temperature rows (exact formulas)', () => {
  // T/K = t/°C + 273.15
  it('°C: 0 °C = 273.15 K, 100 °C = 373.15 K, −273.15 °C = 0 K', () => {
    expect(temperatureToK(0, 'degC')).toBe(273.15);
    expect(temperatureToK(100, 'degC')).toBe(373.15);
    expect(temperatureToK(-273.15, 'degC')).toBe(0);
    expect(temperatureFromK(273.15, 'degC')).toBe(0);
  });

  // t/°C = (t/°F − 32)/1.8
  it('°F: 32 °F = 273.15 K and 212 °F = 373.15 K exactly, −40 °F = −40 °C, −459.67 °F = 0 K', () => {
    expect(temperatureToK(32, 'degF')).toBe(273.15);
    expect(temperatureToK(212, 'degF')).toBe(373.15);
    expect(temperatureFromK(temperatureToK(-40, 'degF'), 'degC')).toBeCloseTo(-40, 12);
    expect(temperatureToK(-459.67, 'degF')).toBeCloseTo(0, 12);
    expect(temperatureFromK(373.15, 'degF')).toBeCloseTo(212, 12);
  });

  // T/K = (T/°R)/1.8
  it('°R: 0 °R = 0 K, 491.67 °R = 273.15 K, 1.8 °R = 1 K', () => {
    expect(temperatureToK(0, 'degR')).toBe(0);
    expect(temperatureToK(491.67, 'degR')).toBeCloseTo(273.15, 12);
    expect(temperatureToK(1.8, 'degR')).toBe(1);
    expect(temperatureFromK(273.15, 'degR')).toBeCloseTo(491.67, 12);
  });

  it('a difference of 1 K is 1 °C and 1.8 °F or °R, with no offset (NIST SP 811 (2008) Appendix B.8)', () => {
    expect(temperatureDifferenceToK(1.8, 'degF')).toBe(1);
    expect(temperatureDifferenceToK(1, 'degC')).toBe(1);
    expect(temperatureDifferenceFromK(1, 'degF')).toBe(1.8);
    expect(temperatureDifferenceFromK(2, 'degR')).toBe(3.6);
    expect(temperatureDifferenceToK(-9, 'degF')).toBe(-5);
  });
});

describe('temperature: common practice', () => {
  it('sterilising temperatures: 121 °C = 249.8 °F = 394.15 K; 134 °C = 273.2 °F', () => {
    expect(temperatureFromK(temperatureToK(121, 'degC'), 'degF')).toBeCloseTo(249.8, 10);
    expect(temperatureToK(121, 'degC')).toBeCloseTo(394.15, 12);
    expect(temperatureFromK(temperatureToK(134, 'degC'), 'degF')).toBeCloseTo(273.2, 10);
  });
});

describe('temperature: round trips (fast-check)', () => {
  const unit = fc.constantFrom(...ALL);
  it('unit → K → unit returns the value within 1e-12 relative (and 1e-12 K near zero)', () => {
    fc.assert(fc.property(fc.double({ min: 0, max: 5000, noNaN: true }), unit, (kelvin, u) => {
      const inUnit = temperatureFromK(kelvin, u);
      const back = temperatureToK(inUnit, u);
      expect(Math.abs(back - kelvin)).toBeLessThanOrEqual(1e-12 * Math.max(kelvin, 1000));
    }));
  });

  it('differences: unit → K → unit returns the value within 1e-12 relative', () => {
    fc.assert(fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }).filter((d) => d === 0 || Math.abs(d) >= 1e-12), unit, (d, u) => {
      const back = temperatureDifferenceFromK(temperatureDifferenceToK(d, u), u);
      expect(Math.abs(back - d)).toBeLessThanOrEqual(1e-12 * Math.abs(d));
    }));
  });

  it('order is kept: a warmer reading is warmer in kelvin, in every unit', () => {
    fc.assert(fc.property(fc.double({ min: 0, max: 2000, noNaN: true }), fc.double({ min: 1e-6, max: 100, noNaN: true }), unit,
      (t, step, u) => {
        expect(temperatureToK(temperatureFromK(t, u) + step, u)).toBeGreaterThan(t);
      }));
  });
});

describe('temperature: refused input', () => {
  it.each([
    [-273.16, 'degC'],
    [-460, 'degF'],
    [-0.01, 'K'],
    [-1, 'degR'],
  ] as const)('%d %s is below absolute zero: out-of-range InputError', (value, unit) => {
    const error = expectInputError(() => temperatureToK(value, unit, 'thermometer reading'), 'thermometer reading', 'out-of-range');
    expect(error.message).toMatch(/absolute zero/);
    expect(error.range).toEqual({ min: 0, max: Infinity, unit: 'K' });
  });

  it('NaN and ±Infinity are refused in every direction, never passed on', () => {
    for (const bad of [NaN, Infinity, -Infinity]) {
      expectInputError(() => temperatureToK(bad, 'degC'), 'temperature', 'not-a-number');
      expectInputError(() => temperatureFromK(bad, 'degF'), 'temperature', 'not-a-number');
      expectInputError(() => temperatureDifferenceToK(bad, 'degF', 'tolerance'), 'tolerance', 'not-a-number');
      expectInputError(() => temperatureDifferenceFromK(bad, 'K'), 'temperature difference', 'not-a-number');
    }
    expectInputError(() => temperatureFromK(-1, 'degC'), 'temperature', 'out-of-range');
  });

  it('an unknown unit id is a RangeError', () => {
    expect(() => temperatureToK(20, 'C' as TemperatureUnit)).toThrow(RangeError);
    expect(() => temperatureFromK(20, 'F' as TemperatureUnit)).toThrow(RangeError);
    expect(() => temperatureDifferenceToK(20, 'F' as TemperatureUnit)).toThrow(RangeError);
  });
});

describe('temperature units for pickers', () => {
  it('are the four scales, once each, with °-labels and suggested decimals', () => {
    expect([...ALL].sort()).toEqual(['K', 'degC', 'degF', 'degR']);
    expect(TEMPERATURE_UNITS.map((u) => u.label).sort()).toEqual(['K', '°C', '°F', '°R']);
    for (const u of TEMPERATURE_UNITS) expect(Number.isInteger(u.decimals)).toBe(true);
    for (const id of ALL) expect(isTemperatureUnit(id)).toBe(true);
    expect(isTemperatureUnit('°C')).toBe(false);
    expect(isTemperatureUnit('includes')).toBe(false);
  });
});
