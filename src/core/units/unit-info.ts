// What a unit picker needs to know about a unit, and the one check every conversion makes.
import { InputError } from '../errors.ts';

/** One entry of a unit picker. */
export interface UnitInfo<Id extends string> {
  /** The identifier the core and the store use. Stable: saved records refer to it. */
  readonly id: Id;
  /** Short display symbol, e.g. "kPa", "inHg (60 °F)". */
  readonly label: string;
  /** The unit's name in words, for screen readers and help text. */
  readonly name: string;
  /** Decimals to show by default for a typical field reading in this unit. */
  readonly decimals: number;
}

/**
 * Refuses NaN and ±Infinity so that no conversion can pass a silent NaN along.
 * @throws InputError 'not-a-number' naming `field`.
 */
export function requireFinite(field: string, value: number): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new InputError(field, 'not-a-number', value);
  }
  return value;
}

/** Looks a unit up in a factor table; an unknown id is a programming or data error, not a typing error. */
export function factorFor<Id extends string>(table: { readonly [K in Id]: number }, unit: Id, kind: string): number {
  const factor = Object.hasOwn(table, unit) ? table[unit] : undefined;
  if (factor === undefined) throw new RangeError(`Unknown ${kind} unit "${String(unit)}".`);
  return factor;
}
