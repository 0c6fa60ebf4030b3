// Volume: cubic metre inside the core; litre, gallons and cubic feet at the edges.
import { factorFor, requireFinite, type UnitInfo } from './unit-info.ts';

export type VolumeUnit = 'm3' | 'L' | 'gal(US)' | 'gal(UK)' | 'ft3';

/**
 * Cubic metres per unit. Source: NIST SP 811 (2008), App. B.8 (volume rows; B.9 "Volume (includes capacity)").
 */
export const CUBIC_METRES_PER_VOLUME_UNIT = {
  m3: 1,
  L: 1e-3, // B.8 "liter (L)" 1.0 E−03, exact (footnote 19: the liter is the cubic decimeter)
  // B.8 "gallon (U.S.) (gal)" prints 3.785 412 E−03. Exact: 231 in³ × (0.0254 m/in)³ = 3.785 411 784 L.
  'gal(US)': 3.785411784e-3,
  // B.8 "gallon [Canadian and U.K. (Imperial)] (gal)" 4.546 09 E−03, exact (defined as 4.546 09 L).
  'gal(UK)': 4.54609e-3,
  // B.8 "cubic foot (ft³)" prints 2.831 685 E−02. Exact: (0.3048 m)³ = 0.028 316 846 592 m³.
  ft3: 0.028316846592,
} as const satisfies Record<VolumeUnit, number>;

/** Volume units for pickers. */
export const VOLUME_UNITS: readonly UnitInfo<VolumeUnit>[] = [
  { id: 'L', label: 'L', name: 'litre', decimals: 1 },
  { id: 'm3', label: 'm³', name: 'cubic metre', decimals: 4 },
  { id: 'gal(US)', label: 'US gal', name: 'US gallon', decimals: 2 },
  { id: 'gal(UK)', label: 'imp gal', name: 'imperial gallon', decimals: 2 },
  { id: 'ft3', label: 'ft³', name: 'cubic foot', decimals: 3 },
];

/** True when `unit` is one of the volume unit ids. */
export function isVolumeUnit(unit: unknown): unit is VolumeUnit {
  return typeof unit === 'string' && Object.hasOwn(CUBIC_METRES_PER_VOLUME_UNIT, unit);
}

/**
 * A volume in `unit` as cubic metres. The sign is kept; range checks belong to the quantity, not the unit.
 * @throws InputError 'not-a-number' for NaN/±Infinity. @throws RangeError for an unknown unit id.
 */
export function volumeToM3(value: number, unit: VolumeUnit, field = 'volume'): number {
  const factor = factorFor(CUBIC_METRES_PER_VOLUME_UNIT, unit, 'volume');
  // Dividing by 1000 rounds correctly where multiplying by the inexact 0.001 may not.
  return unit === 'L' ? requireFinite(field, value) / 1000 : requireFinite(field, value) * factor;
}

/**
 * A volume in cubic metres expressed in `unit`.
 * @throws InputError 'not-a-number' for NaN/±Infinity. @throws RangeError for an unknown unit id.
 */
export function volumeFromM3(m3: number, unit: VolumeUnit, field = 'volume'): number {
  const factor = factorFor(CUBIC_METRES_PER_VOLUME_UNIT, unit, 'volume');
  return unit === 'L' ? requireFinite(field, m3) * 1000 : requireFinite(field, m3) / factor;
}
