import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { LENGTH_UNITS, METRES_PER_LENGTH_UNIT, isLengthUnit, lengthFromM, lengthToM, type LengthUnit } from '../../../src/core/units/length.ts';
import { roundsToPrinted } from './nist.ts';
import { expectInputError } from './expect-input-error.ts';

describe('length against NIST SP 811 (2008) Appendix B.8', () => {
  it('1 ft = 0.3048 m exactly (B.8 "foot (ft)", printed bold 3.048 E−01)', () => {
    expect(lengthToM(1, 'ft')).toBe(0.3048);
    expect(roundsToPrinted(lengthToM(1, 'ft'), '3.048', -1)).toBe(true);
  });

  it('1 in = 0.0254 m exactly (B.8 "inch (in)", printed bold 2.54 E−02); 12 in = 1 ft (definition)', () => {
    expect(lengthToM(1, 'in')).toBe(0.0254);
    expect(roundsToPrinted(lengthToM(1, 'in'), '2.54', -2)).toBe(true);
    expect(lengthToM(12, 'in')).toBeCloseTo(lengthToM(1, 'ft'), 15);
  });

  it('mm and cm are SI prefixes (NIST SP 811 (2008) Table 5): 1234 mm = 1.234 m, 12.5 cm = 0.125 m, exactly', () => {
    expect(lengthToM(1234, 'mm')).toBe(1.234);
    expect(lengthFromM(1.234, 'mm')).toBe(1234);
    expect(lengthToM(12.5, 'cm')).toBe(0.125);
    expect(lengthFromM(0.125, 'cm')).toBe(12.5);
  });

  it('common practice: 1 m = 3.280 84 ft = 39.370 1 in; 1000 ft = 304.8 m', () => {
    expect(lengthFromM(1, 'ft')).toBeCloseTo(3.28084, 5);
    expect(lengthFromM(1, 'in')).toBeCloseTo(39.3701, 4);
    expect(lengthToM(1000, 'ft')).toBeCloseTo(304.8, 10);
  });
});

describe('length: round trips (fast-check)', () => {
  it('unit → m → unit within 1e-12 relative, sign kept (elevations can be negative)', () => {
    fc.assert(fc.property(
      fc.double({ min: -1e6, max: 1e6, noNaN: true }).filter((v) => v === 0 || Math.abs(v) >= 1e-12),
      fc.constantFrom(...LENGTH_UNITS.map((u) => u.id)),
      (v, u) => {
        const m = lengthToM(v, u);
        expect(Math.sign(m)).toBe(Math.sign(v));
        expect(Math.abs(lengthFromM(m, u) - v)).toBeLessThanOrEqual(1e-12 * Math.abs(v));
      }));
  });
});

describe('length: refused input and pickers', () => {
  it('NaN/±Infinity are InputErrors naming the field; unknown ids are RangeErrors', () => {
    expectInputError(() => lengthToM(NaN, 'ft', 'inner diameter'), 'inner diameter', 'not-a-number');
    expectInputError(() => lengthFromM(-Infinity, 'mm'), 'length', 'not-a-number');
    expect(() => lengthToM(1, 'yd' as LengthUnit)).toThrow(RangeError);
  });

  it('list every unit once', () => {
    expect(LENGTH_UNITS.map((u) => u.id).sort()).toEqual(Object.keys(METRES_PER_LENGTH_UNIT).sort());
    expect(isLengthUnit('ft')).toBe(true);
    expect(isLengthUnit('feet')).toBe(false);
  });
});
