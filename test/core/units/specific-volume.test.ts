import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  CUBIC_METRES_PER_KG_PER_UNIT,
  SPECIFIC_VOLUME_UNITS,
  isSpecificVolumeUnit,
  specificVolumeFromM3PerKg,
  specificVolumeToM3PerKg,
  type SpecificVolumeUnit,
} from '../../../src/core/units/specific-volume.ts';
import { relativeError, roundsToPrinted } from './nist.ts';
import { expectInputError } from './expect-input-error.ts';

describe('specific volume against NIST SP 811 (2008) Appendix B.8', () => {
  it('1 ft³/lb rounds to the printed 6.242 796 E−02 m³/kg (B.8 "cubic foot per pound") and is (0.3048)³/0.453 592 37 exactly', () => {
    expect(roundsToPrinted(specificVolumeToM3PerKg(1, 'ft3/lb'), '6.242 796', -2)).toBe(true);
    expect(relativeError(specificVolumeToM3PerKg(1, 'ft3/lb'), 0.3048 ** 3 / 0.45359237)).toBeLessThan(4e-16);
  });

  it('1 L/kg = 10⁻³ m³/kg (B.8 "liter", exact)', () => {
    expect(specificVolumeToM3PerKg(1, 'L/kg')).toBe(0.001);
    expect(relativeError(specificVolumeToM3PerKg(1.043, 'L/kg'), 0.001043)).toBeLessThan(3e-16);
    expect(relativeError(specificVolumeFromM3PerKg(0.001043, 'L/kg'), 1.043)).toBeLessThan(3e-16);
  });

  it('common practice: 1 m³/kg = 16.0185 ft³/lb', () => {
    expect(specificVolumeFromM3PerKg(1, 'ft3/lb')).toBeCloseTo(16.0185, 4);
  });
});

describe('specific volume: round trips (fast-check)', () => {
  it('unit → m³/kg → unit within 1e-12 relative', () => {
    fc.assert(fc.property(
      fc.double({ min: 1e-6, max: 1e4, noNaN: true }),
      fc.constantFrom(...SPECIFIC_VOLUME_UNITS.map((u) => u.id)),
      (v, u) => {
        expect(relativeError(specificVolumeFromM3PerKg(specificVolumeToM3PerKg(v, u), u), v)).toBeLessThanOrEqual(1e-12);
      }));
  });
});

describe('specific volume: refused input and pickers', () => {
  it('NaN/±Infinity are InputErrors naming the field; unknown ids are RangeErrors', () => {
    expectInputError(() => specificVolumeToM3PerKg(NaN, 'm3/kg'), 'specific volume', 'not-a-number');
    expectInputError(() => specificVolumeFromM3PerKg(Infinity, 'L/kg', 'v'), 'v', 'not-a-number');
    expect(() => specificVolumeToM3PerKg(1, 'cm3/g' as SpecificVolumeUnit)).toThrow(RangeError);
  });

  it('list every unit once', () => {
    expect(SPECIFIC_VOLUME_UNITS.map((u) => u.id).sort()).toEqual(Object.keys(CUBIC_METRES_PER_KG_PER_UNIT).sort());
    expect(isSpecificVolumeUnit('ft3/lb')).toBe(true);
    expect(isSpecificVolumeUnit('m3')).toBe(false);
  });
});
