// Reading and showing numbers at the UI's edge, with the person's decimal separator. The parsing
// and formatting rules are the core's; this module only supplies the separator setting.
import { formatNumber as coreFormat, parseDecimal, type DecimalSeparator } from '../../core/basics.ts';

let separator: DecimalSeparator = '.';

/** The separator of the device's locale, the default until the person picks one. */
export function localeDecimalSeparator(): DecimalSeparator {
  const part = new Intl.NumberFormat().formatToParts(1.5).find((p) => p.type === 'decimal');
  return part?.value === ',' ? ',' : '.';
}

export function setDecimalSeparator(s: DecimalSeparator): void {
  separator = s;
}

/** What a person typed → one finite number; InputError naming `field` otherwise. */
export function readNumber(text: string, field: string): number {
  return parseDecimal(text, field, { decimalSeparator: separator });
}

/** A number to `significant` digits for display; a non-finite value shows as a dash. */
export function formatNumber(value: number, significant = 4): string {
  return coreFormat(value, { significant, decimalSeparator: separator });
}

/** A number with a fixed number of decimals. */
export function formatFixed(value: number, decimals: number): string {
  return coreFormat(value, { decimals, decimalSeparator: separator });
}

/**
 * Decimals that show a ± band to one or two significant digits: two when its leading digit is 1
 * or 2, one otherwise. Uncertainties to at most two significant digits is JCGM 100:2008 (GUM)
 * 7.2.6 (from memory); one digit from a leading 3 up is common practice. 0 for a zero or
 * non-finite band (the value is then shown to its own place by the caller).
 */
export function decimalsForBand(band: number): number {
  const b = Math.abs(band);
  if (!Number.isFinite(b) || b === 0) return 0;
  // The exponential form gives the leading digit and the power of ten without log10's rounding.
  const [mantissa, exponent] = b.toExponential(1).split('e') as [string, string];
  const significant = Number(mantissa) < 3 ? 2 : 1;
  return Math.min(12, Math.max(0, significant - 1 - Number(exponent)));
}

/**
 * A value with its ± band, e.g. "412.3 ± 1.2": the band to one or two significant digits and the
 * value to the same last decimal place, so no digit is shown that the band makes meaningless.
 */
export function formatWithBand(value: number, band: number, significant = 4): string {
  const b = Math.abs(band);
  if (!Number.isFinite(b) || b === 0) return `${formatNumber(value, significant)} ± 0`;
  const decimals = decimalsForBand(b);
  return `${formatFixed(value, decimals)} ± ${formatFixed(b, decimals)}`;
}

/** A value rounded to the place its ± band resolves, without the band ("412.3"). */
export function formatToBand(value: number, band: number, significant = 4): string {
  const b = Math.abs(band);
  if (!Number.isFinite(b) || b === 0) return formatNumber(value, significant);
  return formatFixed(value, decimalsForBand(b));
}

/**
 * A stored ISO 8601 time with its zone, e.g. "2026-12-01 14:05 UTC+01:00" ("UTC" for a zero
 * offset): the wall clock the technician's device had, and which zone that clock was in.
 */
export function shortTime(iso: string): string {
  const zone = /(Z|[+-]\d{2}:\d{2})$/.exec(iso)?.[1];
  const offset = zone === undefined ? '' : zone === 'Z' || zone === '+00:00' || zone === '-00:00' ? ' UTC' : ` UTC${zone.replace('-', '\u2212')}`;
  return `${iso.slice(0, 10)} ${iso.slice(11, 16)}${offset}`;
}

/** A number to put back into an input: up to 6 significant digits, no trailing zeros. */
export function formatEditable(value: number): string {
  const text = formatNumber(value, 6);
  const point = separator === ',' ? ',' : '.';
  if (!text.includes(point)) return text;
  return text.replace(/0+$/, '').replace(new RegExp(`\\${point}$`), '');
}
