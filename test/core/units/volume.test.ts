import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  CUBIC_METRES_PER_VOLUME_UNIT,
  VOLUME_UNITS,
  isVolumeUnit,
  volumeFromM3,
  volumeToM3,
  type VolumeUnit,
} from '../../../src/core/units/volume.ts';
import { relativeError, roundsToPrinted } from './nist.ts';
import { expectInputError } from './expect-input-error.ts';

describe('volume against NIST SP 811 (2008) Appendix B.8 / B.9 "Volume (includes capacity)"', () => {
  it('1 L = 10⁻³ m³ exactly (B.8 "liter", 1.0 E−03, footnote 19)', () => {
    expect(volumeToM3(1, 'L')).toBe(0.001);
    expect(volumeToM3(250, 'L')).toBe(0.25);
    expect(volumeFromM3(0.25, 'L')).toBe(250);
  });

  it('1 US gal = 231 in³ = 3.785 411 784 L exactly; B.8 "gallon (U.S.)" prints 3.785 412 E−03 m³', () => {
    expect(relativeError(volumeToM3(1, 'gal(US)'), 231 * 0.0254 ** 3)).toBeLessThan(4e-16);
    expect(roundsToPrinted(volumeToM3(1, 'gal(US)'), '3.785 412', -3)).toBe(true);
  });

  it('1 imperial gal = 4.546 09 L exactly (B.8 "gallon [Canadian and U.K. (Imperial)]" 4.546 09 E−03)', () => {
    expect(volumeToM3(1, 'gal(UK)')).toBe(0.00454609);
    expect(roundsToPrinted(volumeToM3(1, 'gal(UK)'), '4.546 09', -3)).toBe(true);
  });

  it('1 ft³ = (0.3048 m)³ = 0.028 316 846 592 m³ exactly (B.8 foot 3.048 E−01 exact; "cubic foot" prints 2.831 685 E−02)', () => {
    expect(relativeError(volumeToM3(1, 'ft3'), 0.3048 ** 3)).toBeLessThan(4e-16);
    expect(roundsToPrinted(volumeToM3(1, 'ft3'), '2.831 685', -2)).toBe(true);
  });

  it('common practice: 1 ft³ = 7.480 52 US gal = 28.3168 L; 1 imperial gal = 1.200 95 US gal; 1 m³ = 264.172 US gal', () => {
    expect(volumeFromM3(volumeToM3(1, 'ft3'), 'gal(US)')).toBeCloseTo(7.48052, 5);
    expect(volumeFromM3(volumeToM3(1, 'ft3'), 'L')).toBeCloseTo(28.3168, 4);
    expect(volumeFromM3(volumeToM3(1, 'gal(UK)'), 'gal(US)')).toBeCloseTo(1.20095, 5);
    expect(volumeFromM3(1, 'gal(US)')).toBeCloseTo(264.172, 3);
  });
});

describe('volume: round trips (fast-check)', () => {
  it('unit → m³ → unit within 1e-12 relative', () => {
    fc.assert(fc.property(
      fc.double({ min: -1e7, max: 1e7, noNaN: true }).filter((v) => v === 0 || Math.abs(v) >= 1e-12),
      fc.constantFrom(...VOLUME_UNITS.map((u) => u.id)),
      (v, u) => {
        expect(Math.abs(volumeFromM3(volumeToM3(v, u), u) - v)).toBeLessThanOrEqual(1e-12 * Math.abs(v));
      }));
  });
});

describe('volume: refused input and pickers', () => {
  it('NaN/±Infinity are InputErrors naming the field; unknown ids are RangeErrors', () => {
    expectInputError(() => volumeToM3(NaN, 'L', 'vessel volume'), 'vessel volume', 'not-a-number');
    expectInputError(() => volumeFromM3(-Infinity, 'ft3'), 'volume', 'not-a-number');
    expect(() => volumeToM3(1, 'gal' as VolumeUnit)).toThrow(RangeError);
  });

  it('list every unit once; US and imperial gallons are told apart in the label', () => {
    expect(VOLUME_UNITS.map((u) => u.id).sort()).toEqual(Object.keys(CUBIC_METRES_PER_VOLUME_UNIT).sort());
    const labels = VOLUME_UNITS.map((u) => u.label);
    expect(new Set(labels).size).toBe(labels.length);
    expect(labels).toContain('US gal');
    expect(labels).toContain('imp gal');
    expect(isVolumeUnit('gal(US)')).toBe(true);
    expect(isVolumeUnit('gal')).toBe(false);
  });
});
