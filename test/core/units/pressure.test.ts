import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { InputError } from '../../../src/core/errors.ts';
import {
  PASCALS_PER_PRESSURE_UNIT,
  PRESSURE_UNITS,
  isPressureUnit,
  pressureFromPa,
  pressureToPa,
  type PressureUnit,
} from '../../../src/core/units/pressure.ts';
import { relativeError, roundsToPrinted } from './nist.ts';
import { expectInputError } from './expect-input-error.ts';

const ALL = PRESSURE_UNITS.map((u) => u.id);

describe('pressure factors against NIST SP 811 (2008) Appendix B.8 / B.9 "Pressure or stress"', () => {
  // Factors NIST prints in bold (exact): the conversion must give them exactly.
  it.each([
    ['bar', 1e5, 'B.8 bar 1.0 E+05 (exact)'],
    ['mbar', 1e2, 'B.8 millibar 1.0 E+02 (exact)'],
    ['atm', 101325, 'B.8 atmosphere, standard 1.013 25 E+05 (exact)'],
    ['kgf/cm2', 98066.5, 'B.8 kilogram-force per square centimeter 9.806 65 E+04 (exact)'],
    ['kPa', 1e3, 'SI prefix kilo'],
    ['MPa', 1e6, 'SI prefix mega'],
    ['hPa', 1e2, 'SI prefix hecto'],
    ['Pa', 1, 'SI unit'],
  ] as const)('1 %s = %d Pa exactly — %s', (unit, pa, _source) => {
    expect(pressureToPa(1, unit)).toBe(pa);
    expect(pressureFromPa(pa, unit)).toBe(1);
  });

  // Factors NIST prints rounded: ours must round to exactly the printed digits.
  it.each([
    ['psi', '6.894 757', 3, 'B.8 pound-force per square inch'],
    ['mmHg', '1.333 224', 2, 'B.8 millimeter of mercury, conventional (footnote 12)'],
    ['torr', '1.333 224', 2, 'B.8 torr'],
    ['inHg', '3.386 389', 3, 'B.8 inch of mercury, conventional (footnote 12)'],
    ['inHg@32F', '3.386 38', 3, 'B.8 inch of mercury (32 °F)'],
    ['inHg@60F', '3.376 85', 3, 'B.8 inch of mercury (60 °F)'],
    ['inH2O', '2.490 889', 2, 'B.8 inch of water, conventional'],
    ['inH2O@39.2F', '2.490 82', 2, 'B.8 inch of water (39.2 °F)'],
    ['inH2O@60F', '2.4884', 2, 'B.8 inch of water (60 °F)'],
  ] as const)('1 %s rounds to %s E+0%d Pa — %s', (unit, printed, exponent, _source) => {
    expect(roundsToPrinted(pressureToPa(1, unit), printed, exponent)).toBe(true);
  });

  it('psi is lbf/in² from the exact pound-force 4.448 221 615 260 5 N (B.8 footnote 23) and inch 0.0254 m (B.8, exact)', () => {
    expect(relativeError(pressureToPa(1, 'psi'), 4.4482216152605 / (0.0254 * 0.0254))).toBeLessThan(2e-16);
    // and the pound-force itself is the exact pound (footnote 22) times standard gravity (exact)
    expect(relativeError(0.45359237 * 9.80665, 4.4482216152605)).toBeLessThan(2e-16);
  });

  it('conventional mercury and water columns: 13 595.1 kg/m³ and 1000 kg/m³ under g_n = 9.806 65 m/s² (B.8 footnote 12)', () => {
    expect(relativeError(pressureToPa(1, 'mmHg'), 13595.1 * 9.80665 * 0.001)).toBeLessThan(2e-16);
    expect(relativeError(pressureToPa(1, 'inHg'), 13595.1 * 9.80665 * 0.0254)).toBeLessThan(2e-16);
    expect(relativeError(pressureToPa(1, 'inH2O'), 1000 * 9.80665 * 0.0254)).toBeLessThan(2e-16);
    expect(relativeError(pressureToPa(25.4, 'mmHg'), pressureToPa(1, 'inHg'))).toBeLessThan(4e-16);
  });

  it('torr is 1/760 of the standard atmosphere exactly, and differs from the conventional mmHg by 1.42 × 10⁻⁷', () => {
    // Definition of the torr (1/760 atm); NIST B.8 prints both as 1.333 224 E+02, which hides the difference.
    expect(relativeError(pressureToPa(760, 'torr'), 101325)).toBeLessThan(2e-16);
    const ratio = pressureToPa(1, 'mmHg') / pressureToPa(1, 'torr');
    expect(ratio - 1).toBeGreaterThan(1.42e-7);
    expect(ratio - 1).toBeLessThan(1.43e-7);
  });

  it('inHg at 60 °F is smaller than at 32 °F (mercury is less dense when warm), and inH2O at 60 °F smaller than at 39.2 °F', () => {
    expect(pressureToPa(1, 'inHg@60F')).toBeLessThan(pressureToPa(1, 'inHg@32F'));
    expect(pressureToPa(1, 'inH2O@60F')).toBeLessThan(pressureToPa(1, 'inH2O@39.2F'));
  });
});

describe('pressure: common practice', () => {
  it('1 atm = 101.325 kPa = 14.696 psi = 1.013 25 bar = 760 Torr ≈ 760 mmHg ≈ 29.92 inHg', () => {
    const atm = pressureToPa(1, 'atm');
    expect(pressureFromPa(atm, 'kPa')).toBe(101.325);
    expect(pressureFromPa(atm, 'psi')).toBeCloseTo(14.696, 3);
    expect(pressureFromPa(atm, 'bar')).toBe(1.01325);
    expect(pressureFromPa(atm, 'torr')).toBeCloseTo(760, 10);
    expect(pressureFromPa(atm, 'mmHg')).toBeCloseTo(760, 3);
    expect(pressureFromPa(atm, 'inHg')).toBeCloseTo(29.92, 2);
    expect(pressureFromPa(atm, 'inHg@32F')).toBeCloseTo(29.92, 2);
  });

  it('1 bar = 14.5038 psi; 1 psi = 6.894 76 kPa; 1 atm = 1.033 23 kgf/cm²; 1 psi = 27.7 inH2O', () => {
    expect(pressureFromPa(pressureToPa(1, 'bar'), 'psi')).toBeCloseTo(14.5038, 4);
    expect(pressureFromPa(pressureToPa(1, 'psi'), 'kPa')).toBeCloseTo(6.89476, 5);
    expect(pressureFromPa(pressureToPa(1, 'atm'), 'kgf/cm2')).toBeCloseTo(1.03323, 5);
    expect(pressureFromPa(pressureToPa(1, 'psi'), 'inH2O')).toBeCloseTo(27.7, 1);
  });

  it('a 15 psi reading is 103.4 kPa and 1.034 bar', () => {
    expect(pressureFromPa(pressureToPa(15, 'psi'), 'kPa')).toBeCloseTo(103.42, 2);
    expect(pressureFromPa(pressureToPa(15, 'psi'), 'bar')).toBeCloseTo(1.0342, 4);
  });
});

describe('pressure: round trips and linearity (fast-check)', () => {
  const unit = fc.constantFrom(...ALL);
  // Field magnitudes: zero, or 1e-12 to 1e9 of either sign (subnormals say nothing about units).
  const value = fc.double({ min: -1e9, max: 1e9, noNaN: true }).filter((v) => v === 0 || Math.abs(v) >= 1e-12);

  it('unit → Pa → unit returns the value within 1e-12 relative', () => {
    fc.assert(fc.property(value, unit, (v, u) => {
      const back = pressureFromPa(pressureToPa(v, u), u);
      expect(Math.abs(back - v)).toBeLessThanOrEqual(1e-12 * Math.abs(v));
    }));
  });

  it('a unit → another unit → back returns the value within 1e-12 relative', () => {
    fc.assert(fc.property(value, unit, unit, (v, a, b) => {
      const inB = pressureFromPa(pressureToPa(v, a), b);
      const back = pressureFromPa(pressureToPa(inB, b), a);
      expect(Math.abs(back - v)).toBeLessThanOrEqual(1e-12 * Math.abs(v));
    }));
  });

  it('the sign is kept (a gauge vacuum stays negative)', () => {
    fc.assert(fc.property(fc.double({ min: 1e-6, max: 1e9, noNaN: true }), unit, (v, u) => {
      expect(pressureToPa(-v, u)).toBeLessThan(0);
      expect(pressureToPa(v, u)).toBeGreaterThan(0);
    }));
  });
});

describe('pressure: refused input', () => {
  it.each([NaN, Infinity, -Infinity])('%s is an InputError naming the field, never NaN out', (bad) => {
    expect(() => pressureToPa(bad, 'kPa')).toThrow(InputError);
    expect(() => pressureFromPa(bad, 'psi', 'gauge pressure')).toThrow(/gauge pressure/);
    expectInputError(() => pressureToPa(bad, 'bar', 'relief set pressure'), 'relief set pressure', 'not-a-number');
  });

  it('an unknown unit id (e.g. from a damaged record) is a RangeError, not a silent NaN', () => {
    expect(() => pressureToPa(1, 'psig' as PressureUnit)).toThrow(RangeError);
    expect(() => pressureFromPa(1, 'toString' as PressureUnit)).toThrow(RangeError);
  });
});

describe('pressure units for pickers', () => {
  it('list every unit of the factor table once, with a label, a name and suggested decimals', () => {
    expect(new Set(ALL).size).toBe(ALL.length);
    expect([...ALL].sort()).toEqual(Object.keys(PASCALS_PER_PRESSURE_UNIT).sort());
    for (const u of PRESSURE_UNITS) {
      expect(u.label.length).toBeGreaterThan(0);
      expect(u.name.length).toBeGreaterThan(0);
      expect(Number.isInteger(u.decimals) && u.decimals >= 0 && u.decimals <= 6).toBe(true);
    }
  });

  it('state the column temperature in the label of every temperature-referenced mercury or water unit', () => {
    const label = (id: PressureUnit) => PRESSURE_UNITS.find((u) => u.id === id)?.label;
    expect(label('inHg@32F')).toContain('32 °F');
    expect(label('inHg@60F')).toContain('60 °F');
    expect(label('inH2O@39.2F')).toContain('39.2 °F');
    expect(label('inH2O@60F')).toContain('60 °F');
  });

  it('isPressureUnit accepts the ids and nothing else', () => {
    for (const id of ALL) expect(isPressureUnit(id)).toBe(true);
    for (const other of ['psig', 'PSI', '', 'constructor', 'hasOwnProperty', 1, null, undefined]) {
      expect(isPressureUnit(other)).toBe(false);
    }
  });
});
