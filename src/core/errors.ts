// Typed input errors shared by the whole core. The core never returns a silent NaN: anything
// outside a formulation's range, or anything a person typed that is not a number, becomes one
// of these, naming the field (or quantity), the value and the valid range.

/** Why a value was refused. */
export type InputProblem =
  | 'empty'          // nothing was typed
  | 'not-a-number'   // text that does not parse as one number ("1.2.3", "abc", "NaN", "Infinity")
  | 'out-of-range'   // a number outside the valid range
  | 'inconsistent';  // a number that contradicts another field (tare at or above gross, relief above MAWP, ...)

/** A refused input or an argument outside a formulation's validity range. */
export class InputError extends Error {
  override readonly name = 'InputError';
  /** True when the thrower wrote its own message (an edge that restates the range keeps it as it is). */
  readonly hasCustomMessage: boolean;
  constructor(
    /** The field or quantity, in words a person recognises (e.g. "temperature", "tare weight"). */
    readonly field: string,
    readonly problem: InputProblem,
    /** The offending value as given (a number, or the raw text). */
    readonly value: number | string,
    /** The valid range in SI units, where there is one. */
    readonly range?: { readonly min: number; readonly max: number; readonly unit: string },
    message?: string,
  ) {
    super(message ?? describeInputError(field, problem, value, range));
    this.hasCustomMessage = message !== undefined;
  }
}

function describeInputError(
  field: string,
  problem: InputProblem,
  value: number | string,
  range?: { min: number; max: number; unit: string },
): string {
  const span = range ? ` Valid range: ${range.min} to ${range.max} ${range.unit}.` : '';
  switch (problem) {
    case 'empty':
      return `${field}: no value entered.${span}`;
    case 'not-a-number':
      return `${field}: "${String(value)}" is not a number.${span}`;
    case 'out-of-range':
      return `${field}: ${String(value)}${range ? ' ' + range.unit : ''} is outside the valid range.${span}`;
    case 'inconsistent':
      return `${field}: ${String(value)} is not consistent with the other inputs.${span}`;
  }
}

/** Throws an out-of-range InputError unless min ≤ value ≤ max (and value is finite). */
export function requireInRange(field: string, value: number, min: number, max: number, unit: string): number {
  if (!Number.isFinite(value)) throw new InputError(field, 'not-a-number', value, { min, max, unit });
  if (value < min || value > max) throw new InputError(field, 'out-of-range', value, { min, max, unit });
  return value;
}
