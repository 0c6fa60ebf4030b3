// Turning a number into text for the screen. The UI calls this at its edge; the core itself never
// formats. It never shows "NaN" or "Infinity": a value that is not a finite number shows as a dash,
// so a broken result can never pass for a reading.
import type { DecimalSeparator } from './parse-decimal.ts';

/** What formatNumber shows for NaN and ±Infinity (an em dash). */
export const NO_NUMBER_TEXT = '\u2014';

/** Separates thousands when grouping is on: the narrow no-break space, which reads the same in every locale. */
export const GROUP_SEPARATOR = '\u202F';

interface CommonFormatOptions {
  /** '.' (default) or ','. */
  readonly decimalSeparator?: DecimalSeparator;
  /** Group thousands with a narrow no-break space when the integer part has 5 or more digits. Default false. */
  readonly grouping?: boolean;
}

/** Either a fixed number of decimals or a number of significant digits, never both. */
export type FormatNumberOptions =
  | (CommonFormatOptions & { readonly decimals: number; readonly significant?: undefined })
  | (CommonFormatOptions & { readonly significant: number; readonly decimals?: undefined });

/**
 * A number as text for display, e.g. formatNumber(1234.5, { decimals: 2, decimalSeparator: ',' }) → "1234,50".
 * Negative numbers use the minus sign "−" (U+2212); a value that rounds to zero shows without a sign.
 * parseDecimal reads every output back (with the same decimalSeparator).
 * @param value any number; NaN and ±Infinity give NO_NUMBER_TEXT ("—").
 * @param options.decimals 0 to 100 digits after the separator, or options.significant 1 to 100 significant digits.
 * @throws RangeError when decimals/significant is not an integer in range (a programming error).
 */
export function formatNumber(value: number, options: FormatNumberOptions): string {
  if (typeof value !== 'number' || !Number.isFinite(value)) return NO_NUMBER_TEXT;
  let text: string;
  if (options.significant !== undefined) {
    const significant = requireCount('significant', options.significant, 1);
    text = toSignificant(value, significant);
  } else {
    const decimals = requireCount('decimals', options.decimals, 0);
    text = value.toFixed(decimals);
  }
  // toFixed keeps the sign of a value that rounds to zero ("-0.00"); a bare zero has no sign.
  let negative = text.startsWith('-');
  if (negative) text = text.slice(1);
  if (/^[0.]+$/.test(text)) negative = false;

  const point = text.indexOf('.');
  let integer = point < 0 ? text : text.slice(0, point);
  const fraction = point < 0 ? '' : text.slice(point + 1);
  // Guarded: toFixed switches to exponent notation at 1e21, and that text must not be split into groups.
  if (options.grouping === true && integer.length >= 5 && /^\d+$/.test(integer)) {
    integer = integer.replace(/\B(?=(\d{3})+$)/g, GROUP_SEPARATOR);
  }
  const separator = options.decimalSeparator ?? '.';
  return (negative ? '\u2212' : '') + integer + (fraction === '' ? '' : separator + fraction);
}

function requireCount(name: string, count: number, min: number): number {
  if (!Number.isInteger(count) || count < min || count > 100) {
    throw new RangeError(`formatNumber: ${name} must be an integer from ${min} to 100, not ${String(count)}.`);
  }
  return count;
}

/** Rounds to `significant` digits and writes the result without exponent notation. */
function toSignificant(value: number, significant: number): string {
  if (value === 0) return (0).toFixed(significant - 1);
  const rounded = Number(value.toPrecision(significant));
  // The decimal exponent from the exponential form avoids Math.log10's rounding near powers of ten.
  const exponent = Number(rounded.toExponential().split('e')[1]);
  const decimals = Math.min(100, Math.max(0, significant - 1 - exponent));
  return rounded.toFixed(decimals);
}
