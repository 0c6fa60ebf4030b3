// Reading and showing numbers at the UI's edge, with the person's decimal separator. The parsing
// and formatting rules are the core's; this module only supplies the separator setting.
import { formatNumber as coreFormat, parseDecimal, type DecimalSeparator } from '../../core/index.ts';

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
 * A value with its ± band, e.g. "412.3 ± 1.2": the band to two significant digits and the value
 * to the same last decimal place, so no digit is shown that the band makes meaningless.
 */
export function formatWithBand(value: number, band: number, significant = 4): string {
  const b = Math.abs(band);
  if (!Number.isFinite(b) || b === 0) return `${formatNumber(value, significant)} ± 0`;
  const decimals = Math.min(12, Math.max(0, 1 - Math.floor(Math.log10(b))));
  return `${formatFixed(value, decimals)} ± ${formatFixed(b, decimals)}`;
}

/** A stored ISO 8601 time shown briefly, e.g. "2026-12-01 14:05". */
export function shortTime(iso: string): string {
  return iso.slice(0, 16).replace('T', ' ');
}

/** A number to put back into an input: up to 6 significant digits, no trailing zeros. */
export function formatEditable(value: number): string {
  const text = formatNumber(value, 6);
  const point = separator === ',' ? ',' : '.';
  if (!text.includes(point)) return text;
  return text.replace(/0+$/, '').replace(new RegExp(`\\${point}$`), '');
}
