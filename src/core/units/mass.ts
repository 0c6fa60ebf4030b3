// Mass: kilogram inside the core; gram and pound at the edges (load-cell indicators show either).
import { factorFor, requireFinite, type UnitInfo } from './unit-info.ts';

export type MassUnit = 'kg' | 'g' | 'lb';

/**
 * Kilograms per unit. Source: NIST SP 811 (2008), App. B.8 "pound (avoirdupois) (lb)": printed
 * 4.535 924 E−01, exact value 0.453 592 37 kg (footnote 22; the 1959 international pound).
 */
export const KILOGRAMS_PER_MASS_UNIT = {
  kg: 1,
  g: 1e-3, // SI prefix, exact
  lb: 0.45359237, // exact
} as const satisfies Record<MassUnit, number>;

/** Mass units for pickers. */
export const MASS_UNITS: readonly UnitInfo<MassUnit>[] = [
  { id: 'kg', label: 'kg', name: 'kilogram', decimals: 2 },
  { id: 'lb', label: 'lb', name: 'pound (avoirdupois)', decimals: 2 },
  { id: 'g', label: 'g', name: 'gram', decimals: 0 },
];

/** True when `unit` is one of the mass unit ids. */
export function isMassUnit(unit: unknown): unit is MassUnit {
  return typeof unit === 'string' && Object.hasOwn(KILOGRAMS_PER_MASS_UNIT, unit);
}

/**
 * A mass in `unit` as kilograms. The sign is kept (a net weight below tare is a finding, not a typing error).
 * @throws InputError 'not-a-number' for NaN/±Infinity. @throws RangeError for an unknown unit id.
 */
export function massToKg(value: number, unit: MassUnit, field = 'mass'): number {
  const factor = factorFor(KILOGRAMS_PER_MASS_UNIT, unit, 'mass');
  // Dividing by 1000 rounds correctly where multiplying by the inexact 0.001 may not.
  return unit === 'g' ? requireFinite(field, value) / 1000 : requireFinite(field, value) * factor;
}

/**
 * A mass in kilograms expressed in `unit`.
 * @throws InputError 'not-a-number' for NaN/±Infinity. @throws RangeError for an unknown unit id.
 */
export function massFromKg(kg: number, unit: MassUnit, field = 'mass'): number {
  const factor = factorFor(KILOGRAMS_PER_MASS_UNIT, unit, 'mass');
  return unit === 'g' ? requireFinite(field, kg) * 1000 : requireFinite(field, kg) / factor;
}
