import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { GROUP_SEPARATOR, NO_NUMBER_TEXT, formatNumber } from '../../../src/core/units/format.ts';
import { parseDecimal } from '../../../src/core/units/parse-decimal.ts';

const MINUS = '\u2212';

describe('formatNumber', () => {
  it.each([NaN, Infinity, -Infinity])('shows %s as a dash, never as "NaN" or "Infinity"', (value) => {
    expect(formatNumber(value, { decimals: 2 })).toBe(NO_NUMBER_TEXT);
    expect(formatNumber(value, { significant: 4, decimalSeparator: ',' })).toBe('\u2014');
  });

  it('fixed decimals, with either decimal separator', () => {
    expect(formatNumber(1234.5, { decimals: 2 })).toBe('1234.50');
    expect(formatNumber(1234.5, { decimals: 2, decimalSeparator: ',' })).toBe('1234,50');
    expect(formatNumber(101.325, { decimals: 1 })).toBe('101.3');
    expect(formatNumber(2.5, { decimals: 0 })).toBe('3');
    expect(formatNumber(0, { decimals: 3 })).toBe('0.000');
  });

  it('negative numbers use the minus sign; a value that rounds to zero has no sign', () => {
    expect(formatNumber(-1.5, { decimals: 2 })).toBe(`${MINUS}1.50`);
    expect(formatNumber(-0.001, { decimals: 2 })).toBe('0.00');
    expect(formatNumber(-0, { decimals: 0 })).toBe('0');
    expect(formatNumber(-0.0004, { significant: 2, decimalSeparator: ',' })).toBe(`${MINUS}0,00040`);
  });

  it('significant digits without exponent notation', () => {
    expect(formatNumber(0.00012345, { significant: 3 })).toBe('0.000123');
    expect(formatNumber(123456, { significant: 3 })).toBe('123000');
    expect(formatNumber(99.96, { significant: 3 })).toBe('100');
    expect(formatNumber(1.0434, { significant: 3, decimalSeparator: ',' })).toBe('1,04');
    expect(formatNumber(0, { significant: 3 })).toBe('0.00');
    expect(formatNumber(1e-10, { significant: 2 })).toBe('0.00000000010');
  });

  it('groups thousands with a narrow no-break space only when asked, and only from five integer digits', () => {
    expect(formatNumber(1234567.891, { decimals: 2, grouping: true })).toBe(`1${GROUP_SEPARATOR}234${GROUP_SEPARATOR}567.89`);
    expect(formatNumber(-12345, { decimals: 0, grouping: true, decimalSeparator: ',' })).toBe(`${MINUS}12${GROUP_SEPARATOR}345`);
    expect(formatNumber(1234.5, { decimals: 1, grouping: true })).toBe('1234.5');
    expect(formatNumber(1234567, { decimals: 0 })).toBe('1234567');
  });

  it('refuses a decimals or significant count that is not an integer in range (a programming error)', () => {
    expect(() => formatNumber(1, { decimals: -1 })).toThrow(RangeError);
    expect(() => formatNumber(1, { decimals: 1.5 })).toThrow(RangeError);
    expect(() => formatNumber(1, { decimals: 101 })).toThrow(RangeError);
    expect(() => formatNumber(1, { significant: 0 })).toThrow(RangeError);
  });

  it('parseDecimal reads every output back to the displayed precision (fast-check)', () => {
    fc.assert(fc.property(
      fc.double({ min: -1e12, max: 1e12, noNaN: true }),
      fc.integer({ min: 0, max: 6 }),
      fc.constantFrom('.', ',') as fc.Arbitrary<'.' | ','>,
      fc.boolean(),
      (value, decimals, decimalSeparator, grouping) => {
        const text = formatNumber(value, { decimals, decimalSeparator, grouping });
        expect(text).not.toMatch(/NaN|Infinity|e/);
        const back = parseDecimal(text, 'shown value', { decimalSeparator });
        expect(Math.abs(back - value)).toBeLessThanOrEqual(0.5 * 10 ** -decimals + Math.abs(value) * 1e-15);
      }), { numRuns: 2000 });
  });

  it('significant-digit output also reads back, within half a unit of its last digit (fast-check)', () => {
    fc.assert(fc.property(
      fc.double({ min: -1e12, max: 1e12, noNaN: true }).filter((v) => v === 0 || Math.abs(v) > 1e-30),
      fc.integer({ min: 1, max: 15 }),
      fc.constantFrom('.', ',') as fc.Arbitrary<'.' | ','>,
      (value, significant, decimalSeparator) => {
        const text = formatNumber(value, { significant, decimalSeparator });
        expect(text).not.toMatch(/NaN|Infinity|e/);
        const back = parseDecimal(text, 'shown value', { decimalSeparator });
        const digits = text.replace(/[^0-9]/g, '').replace(/^0+/, '').length;
        expect(digits === significant || value === 0 || Math.abs(back) >= 10 ** (significant - 1)).toBe(true);
        expect(Math.abs(back - value)).toBeLessThanOrEqual(Math.abs(value) * 0.5 * 10 ** (1 - significant) * (1 + 1e-9));
      }), { numRuns: 2000 });
  });

  it('anything that is not a finite number shows the dash (fast-check)', () => {
    fc.assert(fc.property(fc.constantFrom(NaN, Infinity, -Infinity), fc.integer({ min: 0, max: 10 }), (value, decimals) => {
      expect(formatNumber(value, { decimals })).toBe(NO_NUMBER_TEXT);
    }));
  });
});
