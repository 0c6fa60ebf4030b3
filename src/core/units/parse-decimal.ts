// Reading a number the way a person types it on a phone: decimal point or decimal comma, thousands
// separators, spaces, a leading sign. Anything that is not exactly one number is refused with an
// InputError naming the field; the parser never guesses between readings that differ.
//
// The rules, in order:
//  1. Leading and trailing spaces are ignored. Inside the number, a space (also no-break, thin,
//     narrow no-break, figure or hair space) may only separate groups of three digits: "1 234 567,5".
//  2. One leading sign is allowed: "+", "-" or the minus sign "−" (U+2212), with no space after it.
//  3. Only digits, ".", "," and those spaces are accepted. No letters (so no "NaN", "Infinity",
//     "1e5", units or apostrophes), no second sign, no empty parts ("1,,5", "1.", "1 ,5").
//  4. When both "." and "," appear, the last one is the decimal separator and must appear once;
//     the other is the thousands separator: "1,234.5" and "1.234,5" are both 1234.5.
//  5. When one of them appears more than once, it is the thousands separator: "1.234.567" is 1234567.
//  6. Thousands groups are checked: the first group has 1 to 3 digits and does not start with 0,
//     every later group has exactly 3. So "1.2.3", "1,2,3" and "12 34" are refused, not guessed at.
//  7. Only one kind of thousands separator per number: "1 234.567,8" is refused.
//  8. A single "." or "," followed by anything but exactly three digits is the decimal separator:
//     "1,5", "1.25", "1234,567", "0,125", ",5".
//  9. The one ambiguous shape is a single separator with exactly three digits after it and a valid
//     first group before it: "1,234" or "1.234" (1.234 in much of Europe, 1234 in the US and UK).
//     - With the `decimalSeparator` hint (the separator of the person's locale or setting), the
//       locale's reading is taken: with ',' "1,234" is 1.234 and "1.234" is 1234; with '.', the reverse.
//     - Without a hint it is refused, and the message gives both readings. A factor of 1000 in a
//       pressure or a weight is not a rounding error.
// 10. With a hint, the hinted character is never read as a thousands separator: with ',' the texts
//     "1,234,567" and "1,234.5" are refused, because someone typing them is not following the
//     setting and one of the readings would be wrong by a factor of 1000.
import { InputError } from '../errors.ts';

export type DecimalSeparator = '.' | ',';

export interface ParseDecimalOptions {
  /** The decimal separator of the person's locale or setting; decides the one ambiguous shape (rule 9). */
  readonly decimalSeparator?: DecimalSeparator;
}

/** Space characters accepted as thousands separators (rule 1). */
const SPACE = /[ \u00A0\u2007\u2008\u2009\u200A\u202F]/;
const SIGNS: Readonly<Record<string, 1 | -1>> = { '+': 1, '-': -1, '\u2212': -1 };

type Separator = '.' | ',' | ' ';

/**
 * Parses what a person typed into one finite number, by the rules at the top of this file.
 * @param text the raw text of the field.
 * @param field the field's name in words, used in the error ("gauge pressure", "tare weight").
 * @param options.decimalSeparator the locale's decimal separator; decides "1,234" / "1.234".
 * @returns a finite number (never NaN, never −0).
 * @throws InputError 'empty' for nothing but spaces; 'not-a-number' for everything else refused.
 */
export function parseDecimal(text: string, field: string, options: ParseDecimalOptions = {}): number {
  if (typeof text !== 'string') throw new InputError(field, 'not-a-number', String(text));
  const hint = options.decimalSeparator;
  const trimmed = text.trim();
  if (trimmed === '') throw new InputError(field, 'empty', text);
  // Messages quote what was typed, cut short if someone pasted a paragraph.
  const shown = trimmed.length > 40 ? `${trimmed.slice(0, 37)}…` : trimmed;

  function refuse(why: string): never {
    throw new InputError(field, 'not-a-number', text, undefined, `${field}: "${shown}" is not a number: ${why}.`);
  }

  let sign = 1;
  let body = trimmed;
  const signChar = body[0] ?? '';
  if (Object.hasOwn(SIGNS, signChar)) {
    sign = SIGNS[signChar] ?? 1;
    body = body.slice(1);
  }
  if (body === '') refuse('there are no digits');

  // Split into digit runs and the single separators between them.
  const digits: string[] = [];
  const seps: Separator[] = [];
  let run = '';
  // By code point, so that an emoji or other astral character is quoted whole in the message.
  const chars = Array.from(body);
  for (let i = 0; i < chars.length; i++) {
    const ch = chars[i] ?? '';
    if (ch >= '0' && ch <= '9') {
      run += ch;
      continue;
    }
    let sep: Separator;
    if (ch === '.' || ch === ',') sep = ch;
    else if (SPACE.test(ch)) sep = ' ';
    else return refuse(`"${ch}" is not part of a number (only digits, one decimal separator, thousands separators and a leading sign)`);
    if (run === '' && !(i === 0 && sep !== ' ')) {
      refuse(i === 0 ? 'it starts with a space after the sign' : 'two separators in a row');
    }
    digits.push(run);
    seps.push(sep);
    run = '';
  }
  if (run === '') refuse('it ends in a separator');
  digits.push(run);

  const dots = seps.filter((s) => s === '.').length;
  const commas = seps.filter((s) => s === ',').length;
  const spaces = seps.filter((s) => s === ' ').length;

  // Decide which separator (if any) is the decimal one, by rules 4, 5, 8 and 9.
  let decimal: '.' | ',' | null = null;
  if (dots > 0 && commas > 0) {
    const last = seps.filter((s) => s !== ' ').at(-1) as '.' | ',';
    decimal = last;
  } else if (dots + commas > 1) {
    decimal = null;
  } else if (dots + commas === 1) {
    const only: '.' | ',' = dots === 1 ? '.' : ',';
    const at = seps.indexOf(only);
    const before = digits[at] ?? '';
    const after = digits[at + 1] ?? '';
    const couldBeGrouping = spaces === 0 && after.length === 3 && isFirstGroup(before) && seps.length === 1;
    if (!couldBeGrouping) decimal = only;
    else if (hint === undefined) {
      const minus = sign < 0 ? '\u2212' : '';
      const asDecimal = minus + String(Number(`${before}.${after}`));
      const asGrouping = `${minus}${before}${after}`;
      throw new InputError(field, 'not-a-number', text, undefined,
        `${field}: "${shown}" could mean ${asDecimal} or ${asGrouping}. ` +
          `Type "${asGrouping}" for the whole number, or "${minus}${before}${only}${after}0" for the decimal.`);
    } else decimal = hint === only ? only : null;
  }

  // The decimal separator, if any, must be the last separator and appear once.
  let integerRuns = digits;
  let integerSeps = seps;
  let fraction = '';
  if (decimal !== null) {
    const lastIndex = seps.length - 1;
    if (seps[lastIndex] !== decimal || seps.filter((s) => s === decimal).length !== 1) {
      refuse(`"${decimal}" is read as the decimal separator, so it can appear only once, after the thousands`);
    }
    integerRuns = digits.slice(0, -1);
    integerSeps = seps.slice(0, -1);
    fraction = digits.at(-1) ?? '';
  }

  // What remains between the integer digits are thousands separators: one kind, valid groups (rules 6, 7, 10).
  if (integerSeps.length > 0) {
    const kinds = new Set(integerSeps);
    if (kinds.size > 1) refuse('it mixes two kinds of thousands separator');
    const grouping = integerSeps[0] as Separator;
    if (hint !== undefined && grouping === hint) {
      refuse(`"${hint}" is the decimal separator in use, so it cannot separate thousands`);
    }
    const [first = '', ...rest] = integerRuns;
    if (!isFirstGroup(first) || rest.some((g) => g.length !== 3)) {
      refuse('the thousands separators are not between groups of three digits');
    }
  }

  const integer = integerRuns.join('') || '0';
  const value = sign * Number(fraction === '' ? integer : `${integer}.${fraction}`);
  if (!Number.isFinite(value)) refuse('it is too large');
  return value === 0 ? 0 : value;
}

/** A thousands-grouped number's first group: 1 to 3 digits, no leading zero. */
function isFirstGroup(run: string): boolean {
  return run.length >= 1 && run.length <= 3 && run[0] !== '0';
}

