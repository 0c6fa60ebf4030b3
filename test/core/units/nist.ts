// Helpers for checking a factor against a value as NIST SP 811 prints it: a mantissa with its
// significant digits and a power of ten. A factor matches when it rounds to the printed digits.

/** True when `value` rounds to `printed` × 10^exponent at the printed number of significant digits. */
export function roundsToPrinted(value: number, printed: string, exponent: number): boolean {
  const digits = printed.replace(/[^0-9]/g, '').length;
  const mantissa = Number(printed.replace(/\s/g, ''));
  const target = mantissa * 10 ** exponent;
  const halfLastDigit = 0.5 * 10 ** (exponent - (digits - 1));
  return Math.abs(value - target) <= halfLastDigit * (1 + 1e-9);
}

/** |a − b| / |b|. */
export function relativeError(a: number, b: number): number {
  return Math.abs(a - b) / Math.abs(b);
}
