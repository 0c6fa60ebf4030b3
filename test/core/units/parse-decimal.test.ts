import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { InputError } from '../../../src/core/errors.ts';
import { parseDecimal, type DecimalSeparator } from '../../../src/core/units/parse-decimal.ts';
import { expectInputError } from './expect-input-error.ts';

const FIELD = 'gauge pressure';
const NBSP = '\u00A0';
const NARROW_NBSP = '\u202F';
const THIN = '\u2009';
const MINUS = '\u2212';

describe('parseDecimal: accepted as typed (no locale hint)', () => {
  it.each([
    ['1.5', 1.5],
    ['1,5', 1.5],
    ['1 234,5', 1234.5],
    ['1,234.5', 1234.5],
    ['1.234,5', 1234.5],
    [`1${NBSP}234,5`, 1234.5],
    [`1${NARROW_NBSP}234.5`, 1234.5],
    [`1${THIN}234${THIN}567`, 1234567],
    ['1 234,567', 1234.567],
    ['1.234.567', 1234567],
    ['1,234,567', 1234567],
    ['1,234,567.89', 1234567.89],
    ['1.234.567,89', 1234567.89],
    ['-1,5', -1.5],
    ['+2.25', 2.25],
    [`${MINUS}3,5`, -3.5],
    ['  42  ', 42],
    [`${NBSP}7${NBSP}`, 7],
    ['0', 0],
    ['.5', 0.5],
    [',5', 0.5],
    ['-,25', -0.25],
    ['0,125', 0.125],
    ['0.125', 0.125],
    ['1234,567', 1234.567],
    ['12,3456', 12.3456],
    ['1,23', 1.23],
    ['007', 7],
    ['100', 100],
    ['1000000', 1000000],
    ['-101325', -101325],
  ])('"%s" → %d', (text, expected) => {
    expect(parseDecimal(text, FIELD)).toBe(expected);
  });

  it('never returns −0 ("-0" and "-0,00" are 0)', () => {
    expect(Object.is(parseDecimal('-0', FIELD), 0)).toBe(true);
    expect(Object.is(parseDecimal('-0,00', FIELD), 0)).toBe(true);
  });
});

describe('parseDecimal: the ambiguous single separator "1,234" / "1.234"', () => {
  it.each(['1,234', '1.234', '-1,234', '999.000', '12,500', '+100.000'])('"%s" without a hint is refused, giving both readings', (text) => {
    const error = expectInputError(() => parseDecimal(text, FIELD), FIELD, 'not-a-number');
    const digits = text.replace(/[^0-9.,]/g, '');
    const [before = '', after = ''] = digits.split(/[.,]/);
    expect(error.message).toContain(String(Number(`${before}.${after}`)));
    expect(error.message).toContain(`${before}${after}`);
  });

  it('with decimalSeparator "," the locale reading is taken: "1,234" = 1.234, "1.234" = 1234', () => {
    const hint = { decimalSeparator: ',' } as const;
    expect(parseDecimal('1,234', FIELD, hint)).toBe(1.234);
    expect(parseDecimal('1.234', FIELD, hint)).toBe(1234);
    expect(parseDecimal('-12,500', FIELD, hint)).toBe(-12.5);
  });

  it('with decimalSeparator "." the locale reading is taken: "1.234" = 1.234, "1,234" = 1234', () => {
    const hint = { decimalSeparator: '.' } as const;
    expect(parseDecimal('1.234', FIELD, hint)).toBe(1.234);
    expect(parseDecimal('1,234', FIELD, hint)).toBe(1234);
  });

  it('shapes that are not ambiguous read the same with either hint', () => {
    for (const decimalSeparator of ['.', ','] as const) {
      expect(parseDecimal('1,5', FIELD, { decimalSeparator })).toBe(1.5);
      expect(parseDecimal('1.5', FIELD, { decimalSeparator })).toBe(1.5);
      expect(parseDecimal('0,125', FIELD, { decimalSeparator })).toBe(0.125);
      expect(parseDecimal('1234.567', FIELD, { decimalSeparator })).toBe(1234.567);
      expect(parseDecimal('1 234,567', FIELD, { decimalSeparator })).toBe(1234.567);
      expect(parseDecimal('1 234 567', FIELD, { decimalSeparator })).toBe(1234567);
    }
  });

  it('the hinted decimal separator is never read as a thousands separator', () => {
    for (const [text, decimalSeparator] of [
      ['1,234,567', ','], ['1,234.5', ','], ['1.234.567', '.'], ['1.234,5', '.'],
    ] as const) {
      const error = expectInputError(() => parseDecimal(text, FIELD, { decimalSeparator }), FIELD, 'not-a-number');
      expect(error.message).toContain('decimal separator in use');
    }
  });
});

describe('parseDecimal: refused', () => {
  it.each(['', '   ', `${NBSP}${THIN}`])('"%s" is empty', (text) => {
    expectInputError(() => parseDecimal(text, FIELD), FIELD, 'empty');
  });

  it.each([
    'NaN', 'Infinity', '-Infinity', 'abc', '1e5', '1E-3', '0x10', '1,5 kPa', '12psi', '1_000', "1'234",
    '1.2.3', '1,2,3', '12 34', '1234 567', '1 234 5', '1 23', '0 123', '01,234,567',
    '1..5', '1,,5', '1.,5', '1. 5', '1 ,5', '1.', '1,', '.', ',', '+', '-', '--1', '+-1', '1-', '1+1', '- 5',
    '1 234.567,8', '1.234,567.8', '1,2.3', '1.234 567', '1,5,', '\t1\t2', '1\n2',
    '\u0661\u0662\u0663', '１２３', '½', '5²',
    '1' + '0'.repeat(400),
  ])('"%s" is not a number', (text) => {
    const error = expectInputError(() => parseDecimal(text, FIELD), FIELD, 'not-a-number');
    expect(error.value).toBe(text);
  });

  it('quotes the offending character whole, even outside the basic plane', () => {
    const error = expectInputError(() => parseDecimal('5\u{1F525}', FIELD), FIELD, 'not-a-number');
    expect(error.message).toContain('"\u{1F525}"');
  });

  it('a value that is not a string is refused, not coerced', () => {
    expectInputError(() => parseDecimal(undefined as unknown as string, FIELD), FIELD, 'not-a-number');
    expectInputError(() => parseDecimal(12 as unknown as string, FIELD), FIELD, 'not-a-number');
  });
});

// ---- properties ----

type Style = 'plain-dot' | 'plain-comma' | 'grouped-comma-dot' | 'grouped-dot-comma' | 'grouped-space-dot' | 'grouped-space-comma';
const STYLES: readonly Style[] = ['plain-dot', 'plain-comma', 'grouped-comma-dot', 'grouped-dot-comma', 'grouped-space-dot', 'grouped-space-comma'];

function group(integer: string, separator: string): string {
  return integer.replace(/\B(?=(\d{3})+$)/g, separator);
}

/** Writes a number the way a person in one convention would type it. */
function typed(sign: string, integer: string, fraction: string, style: Style, space: string): { text: string; decimal: DecimalSeparator } {
  const decimal: DecimalSeparator = style.endsWith('comma') ? ',' : '.';
  const grouping = style === 'grouped-comma-dot' ? ',' : style === 'grouped-dot-comma' ? '.' : style.startsWith('grouped-space') ? space : '';
  const int = grouping === '' ? integer : group(integer, grouping);
  return { text: sign + int + (fraction === '' ? '' : decimal + fraction), decimal };
}

const typedNumber = fc.record({
  sign: fc.constantFrom('', '+', '-', MINUS),
  integer: fc.bigInt({ min: 0n, max: 10n ** 15n }).map(String),
  fraction: fc.stringMatching(/^\d{0,7}$/),
  style: fc.constantFrom(...STYLES),
  space: fc.constantFrom(' ', NBSP, NARROW_NBSP, THIN),
  padding: fc.constantFrom('', ' ', NBSP),
});

function expectedValue(sign: string, integer: string, fraction: string): number {
  const magnitude = Number(`${integer}.${fraction === '' ? '0' : fraction}`);
  const value = sign === '-' || sign === MINUS ? -magnitude : magnitude;
  return value === 0 ? 0 : value;
}

describe('parseDecimal: properties (fast-check)', () => {
  it('a number typed in any convention reads back equal when the convention\'s decimal separator is the hint', () => {
    fc.assert(fc.property(typedNumber, ({ sign, integer, fraction, style, space, padding }) => {
      const { text, decimal } = typed(sign, integer, fraction, style, space);
      expect(parseDecimal(padding + text + padding, FIELD, { decimalSeparator: decimal })).toBe(expectedValue(sign, integer, fraction));
    }), { numRuns: 2000 });
  });

  it('without a hint it reads back equal, except exactly the ambiguous shape, which is refused', () => {
    const ambiguous = /^[+\-\u2212]?[1-9]\d{0,2}[.,]\d{3}$/;
    fc.assert(fc.property(typedNumber, ({ sign, integer, fraction, style, space }) => {
      const { text } = typed(sign, integer, fraction, style, space);
      if (ambiguous.test(text)) {
        expect(() => parseDecimal(text, FIELD)).toThrow(InputError);
      } else {
        expect(parseDecimal(text, FIELD)).toBe(expectedValue(sign, integer, fraction));
      }
    }), { numRuns: 2000 });
  });

  it('any text at all gives a finite number or an InputError naming the field — never NaN, never another error', () => {
    const anyText = fc.oneof(
      fc.string({ unit: 'binary', maxLength: 20 }),
      fc.string({ unit: fc.constantFrom('1', '2', '0', '.', ',', ' ', '-', '+', NBSP, 'e', 'x'), maxLength: 14 }),
    );
    fc.assert(fc.property(anyText, fc.constantFrom(undefined, '.', ',') as fc.Arbitrary<DecimalSeparator | undefined>, (text, decimalSeparator) => {
      let result: number | undefined;
      try {
        result = parseDecimal(text, FIELD, decimalSeparator === undefined ? {} : { decimalSeparator });
      } catch (e) {
        expect(e).toBeInstanceOf(InputError);
        expect((e as InputError).field).toBe(FIELD);
        return;
      }
      expect(Number.isFinite(result)).toBe(true);
    }), { numRuns: 3000 });
  });

  it('text with a letter in it is always refused', () => {
    const letter = fc.constantFrom(...'abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ');
    fc.assert(fc.property(fc.stringMatching(/^[\d.,\s+-]{0,6}$/), letter, fc.stringMatching(/^[\d.,\s]{0,6}$/), (before, l, after) => {
      expect(() => parseDecimal(before + l + after, FIELD)).toThrow(InputError);
    }));
  });
});
