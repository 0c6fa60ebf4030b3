import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { KILOGRAMS_PER_MASS_UNIT, MASS_UNITS, isMassUnit, massFromKg, massToKg, type MassUnit } from '../../../src/core/units/mass.ts';
import { roundsToPrinted } from './nist.ts';
import { expectInputError } from './expect-input-error.ts';

describe('mass against NIST SP 811 (2008) Appendix B.8', () => {
  it('1 lb (avoirdupois) = 0.453 592 37 kg exactly (B.8 "pound (avoirdupois)", footnote 22), printed 4.535 924 E−01', () => {
    expect(massToKg(1, 'lb')).toBe(0.45359237);
    expect(roundsToPrinted(massToKg(1, 'lb'), '4.535 924', -1)).toBe(true);
  });

  it('1 g = 10⁻³ kg (SI prefix)', () => {
    expect(massToKg(1, 'g')).toBe(0.001);
    expect(massToKg(1234, 'g')).toBe(1.234);
    expect(massFromKg(1.234, 'g')).toBe(1234);
  });

  it('common practice: 1 kg = 2.204 62 lb; 100 lb = 45.359 237 kg', () => {
    expect(massFromKg(1, 'lb')).toBeCloseTo(2.20462, 5);
    expect(massToKg(100, 'lb')).toBeCloseTo(45.359237, 12);
  });
});

describe('mass: round trips (fast-check)', () => {
  it('unit → kg → unit within 1e-12 relative, sign kept', () => {
    fc.assert(fc.property(
      fc.double({ min: -1e7, max: 1e7, noNaN: true }).filter((v) => v === 0 || Math.abs(v) >= 1e-12),
      fc.constantFrom(...MASS_UNITS.map((u) => u.id)),
      (v, u) => {
        const kg = massToKg(v, u);
        expect(Math.sign(kg)).toBe(Math.sign(v));
        expect(Math.abs(massFromKg(kg, u) - v)).toBeLessThanOrEqual(1e-12 * Math.abs(v));
      }));
  });
});

describe('mass: refused input and pickers', () => {
  it('NaN/±Infinity are InputErrors naming the field; unknown ids are RangeErrors', () => {
    expectInputError(() => massToKg(NaN, 'kg', 'tare weight'), 'tare weight', 'not-a-number');
    expectInputError(() => massFromKg(Infinity, 'lb'), 'mass', 'not-a-number');
    expect(() => massToKg(1, 'oz' as MassUnit)).toThrow(RangeError);
  });

  it('list every unit once', () => {
    expect(MASS_UNITS.map((u) => u.id).sort()).toEqual(Object.keys(KILOGRAMS_PER_MASS_UNIT).sort());
    expect(isMassUnit('lb')).toBe(true);
    expect(isMassUnit('lbs')).toBe(false);
  });
});
