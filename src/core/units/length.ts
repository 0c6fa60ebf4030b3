// Length: metre inside the core; millimetre, centimetre, foot and inch at the edges (vessel
// dimensions, liquid level, site elevation).
import { factorFor, requireFinite, type UnitInfo } from './unit-info.ts';

export type LengthUnit = 'm' | 'mm' | 'cm' | 'ft' | 'in';

/**
 * Metres per unit. Source: NIST SP 811 (2008), App. B.8: "foot (ft)" 3.048 E−01 and "inch (in)"
 * 2.54 E−02, both printed bold (exact; the 1959 international yard). mm and cm are SI prefixes.
 */
export const METRES_PER_LENGTH_UNIT = {
  m: 1,
  mm: 1e-3, // SI prefix, exact
  cm: 1e-2, // SI prefix, exact
  ft: 0.3048, // exact
  in: 0.0254, // exact
} as const satisfies Record<LengthUnit, number>;

/** Divisors for the SI prefixes: dividing by 1000 or 100 rounds correctly where multiplying by 0.001 may not. */
const PER_METRE_DIVISOR: Partial<Record<LengthUnit, number>> = { mm: 1000, cm: 100 };

/** Length units for pickers. */
export const LENGTH_UNITS: readonly UnitInfo<LengthUnit>[] = [
  { id: 'm', label: 'm', name: 'metre', decimals: 3 },
  { id: 'mm', label: 'mm', name: 'millimetre', decimals: 0 },
  { id: 'cm', label: 'cm', name: 'centimetre', decimals: 1 },
  { id: 'ft', label: 'ft', name: 'foot', decimals: 2 },
  { id: 'in', label: 'in', name: 'inch', decimals: 1 },
];

/** True when `unit` is one of the length unit ids. */
export function isLengthUnit(unit: unknown): unit is LengthUnit {
  return typeof unit === 'string' && Object.hasOwn(METRES_PER_LENGTH_UNIT, unit);
}

/**
 * A length in `unit` as metres. The sign is kept (an elevation can be below sea level).
 * @throws InputError 'not-a-number' for NaN/±Infinity. @throws RangeError for an unknown unit id.
 */
export function lengthToM(value: number, unit: LengthUnit, field = 'length'): number {
  const factor = factorFor(METRES_PER_LENGTH_UNIT, unit, 'length');
  const divisor = PER_METRE_DIVISOR[unit];
  return divisor === undefined ? requireFinite(field, value) * factor : requireFinite(field, value) / divisor;
}

/**
 * A length in metres expressed in `unit`.
 * @throws InputError 'not-a-number' for NaN/±Infinity. @throws RangeError for an unknown unit id.
 */
export function lengthFromM(metres: number, unit: LengthUnit, field = 'length'): number {
  const factor = factorFor(METRES_PER_LENGTH_UNIT, unit, 'length');
  const divisor = PER_METRE_DIVISOR[unit];
  return divisor === undefined ? requireFinite(field, metres) / factor : requireFinite(field, metres) * divisor;
}
