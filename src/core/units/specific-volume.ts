// Specific volume (volume per mass, the IF97 "v"): m³/kg inside the core.
import { factorFor, requireFinite, type UnitInfo } from './unit-info.ts';

export type SpecificVolumeUnit = 'm3/kg' | 'L/kg' | 'ft3/lb';

/**
 * Cubic metres per kilogram per unit. Source: NIST SP 811 (2008), App. B.8 "cubic foot per pound
 * (ft³/lb)" prints 6.242 796 E−02 m³/kg; the exact value follows from ft = 0.3048 m and
 * lb = 0.453 592 37 kg (both exact): 0.028 316 846 592 / 0.453 592 37 = 0.062 427 960 576 144 6… m³/kg.
 */
export const CUBIC_METRES_PER_KG_PER_UNIT = {
  'm3/kg': 1,
  'L/kg': 1e-3, // 1 L = 10⁻³ m³ exactly (B.8 "liter")
  'ft3/lb': 0.028316846592 / 0.45359237,
} as const satisfies Record<SpecificVolumeUnit, number>;

/** Specific-volume units for pickers. */
export const SPECIFIC_VOLUME_UNITS: readonly UnitInfo<SpecificVolumeUnit>[] = [
  { id: 'm3/kg', label: 'm³/kg', name: 'cubic metre per kilogram', decimals: 5 },
  { id: 'L/kg', label: 'L/kg', name: 'litre per kilogram', decimals: 3 },
  { id: 'ft3/lb', label: 'ft³/lb', name: 'cubic foot per pound', decimals: 4 },
];

/** True when `unit` is one of the specific-volume unit ids. */
export function isSpecificVolumeUnit(unit: unknown): unit is SpecificVolumeUnit {
  return typeof unit === 'string' && Object.hasOwn(CUBIC_METRES_PER_KG_PER_UNIT, unit);
}

/**
 * A specific volume in `unit` as m³/kg.
 * @throws InputError 'not-a-number' for NaN/±Infinity. @throws RangeError for an unknown unit id.
 */
export function specificVolumeToM3PerKg(value: number, unit: SpecificVolumeUnit, field = 'specific volume'): number {
  const factor = factorFor(CUBIC_METRES_PER_KG_PER_UNIT, unit, 'specific volume');
  return unit === 'L/kg' ? requireFinite(field, value) / 1000 : requireFinite(field, value) * factor;
}

/**
 * A specific volume in m³/kg expressed in `unit`.
 * @throws InputError 'not-a-number' for NaN/±Infinity. @throws RangeError for an unknown unit id.
 */
export function specificVolumeFromM3PerKg(m3PerKg: number, unit: SpecificVolumeUnit, field = 'specific volume'): number {
  const factor = factorFor(CUBIC_METRES_PER_KG_PER_UNIT, unit, 'specific volume');
  return unit === 'L/kg' ? requireFinite(field, m3PerKg) * 1000 : requireFinite(field, m3PerKg) / factor;
}
