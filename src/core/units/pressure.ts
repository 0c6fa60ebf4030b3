// Pressure: pascal inside the core; the trade's units at the edges. Every value here is a plain
// pressure difference scale; whether a number is gauge or absolute is a separate, explicit step
// (atmosphere.ts), never folded into a unit.
import { factorFor, requireFinite, type UnitInfo } from './unit-info.ts';

export type PressureUnit =
  | 'Pa' | 'kPa' | 'MPa' | 'hPa' | 'bar' | 'mbar' | 'psi' | 'kgf/cm2' | 'atm'
  | 'mmHg' | 'torr'
  | 'inHg' | 'inHg@32F' | 'inHg@60F'
  | 'inH2O' | 'inH2O@39.2F' | 'inH2O@60F';

/**
 * Pascals per unit. Source: NIST SP 811 (2008), Appendix B.8 (factors listed alphabetically; the same
 * factors by kind in B.9, "Pressure or stress (force divided by area)"), unit Pa.
 * "exact" marks factors NIST prints in bold, or that follow exactly from exact definitions (stated).
 * Where NIST prints a rounded factor and the exact one follows from definitions, the full value is used.
 *
 * Manometer units (footnote 12 of App. B): the conventional units rest on a conventional density
 * (mercury 13 595.1 kg/m³, water 1000 kg/m³) and standard gravity g_n = 9.806 65 m/s² (exact);
 * the units at a stated column temperature are NIST's printed factors, which are not exact and to
 * which NIST says more digits would add nothing. A person must always see which one is meant.
 */
export const PASCALS_PER_PRESSURE_UNIT = {
  Pa: 1,
  kPa: 1e3, // SI prefix, exact
  MPa: 1e6, // SI prefix, exact
  hPa: 1e2, // SI prefix, exact; the same size as mbar (weather reports use hPa)
  bar: 1e5, // B.8 "bar (bar)" 1.0 E+05, exact
  mbar: 1e2, // B.8 "millibar (mbar)" 1.0 E+02, exact
  // B.8 "pound-force per square inch (psi)" prints 6.894 757 E+03. Exact value: lbf / in² with
  // lbf = 0.453 592 37 kg × 9.806 65 m/s² = 4.448 221 615 260 5 N (B.8 footnote 23) and in = 0.0254 m,
  // both exact: 6 894.757 293 168 361 336 7… Pa.
  psi: 6894.757293168361,
  // B.8 "kilogram-force per square centimeter (kgf/cm²)" 9.806 65 E+04, exact: kgf = 9.806 65 N exactly
  // (B.8 "kilogram-force"), over 10⁻⁴ m². The same unit as the technical atmosphere (B.9 "at", footnote 8).
  'kgf/cm2': 98066.5,
  atm: 101325, // B.8 "atmosphere, standard (atm)" 1.013 25 E+05, exact
  // Conventional mmHg: 13 595.1 kg/m³ × g_n × 1 mm = 133.322 387 415 Pa exactly (B.8 "millimeter of
  // mercury, conventional (mmHg)" prints 1.333 224 E+02, footnote 12).
  mmHg: 133.322387415,
  // Torr is NOT the mmHg: 1 Torr = 1/760 atm = 101 325/760 Pa exactly = 133.322 368 421… Pa (B.8 "torr
  // (Torr)" prints 1.333 224 E+02 for both). The two differ by 1.4 × 10⁻⁷ relative: 760 Torr is
  // exactly 1 atm, 760 mmHg is 1.000 000 14 atm.
  torr: 101325 / 760,
  // Conventional inHg: 13 595.1 kg/m³ × g_n × 0.0254 m = 3 386.388 640 341 Pa exactly (B.8 "inch of
  // mercury, conventional (inHg)" prints 3.386 389 E+03).
  inHg: 3386.388640341,
  'inHg@32F': 3386.38, // B.8 "inch of mercury (32 °F)" 3.386 38 E+03, as printed (mercury at 0 °C)
  'inHg@60F': 3376.85, // B.8 "inch of mercury (60 °F)" 3.376 85 E+03, as printed (older US practice)
  // Conventional inH2O: 1000 kg/m³ × g_n × 0.0254 m = 249.088 91 Pa exactly (B.8 "inch of water,
  // conventional (inH2O)" prints 2.490 889 E+02).
  inH2O: 249.08891,
  'inH2O@39.2F': 249.082, // B.8 "inch of water (39.2 °F)" 2.490 82 E+02, as printed (water at its densest, 4 °C)
  'inH2O@60F': 248.84, // B.8 "inch of water (60 °F)" 2.4884 E+02, as printed
} as const satisfies Record<PressureUnit, number>;

/** Pressure units for pickers, in the order a picker shows them. */
export const PRESSURE_UNITS: readonly UnitInfo<PressureUnit>[] = [
  { id: 'kPa', label: 'kPa', name: 'kilopascal', decimals: 1 },
  { id: 'bar', label: 'bar', name: 'bar', decimals: 3 },
  { id: 'psi', label: 'psi', name: 'pound-force per square inch', decimals: 2 },
  { id: 'MPa', label: 'MPa', name: 'megapascal', decimals: 4 },
  { id: 'Pa', label: 'Pa', name: 'pascal', decimals: 0 },
  { id: 'hPa', label: 'hPa', name: 'hectopascal', decimals: 1 },
  { id: 'mbar', label: 'mbar', name: 'millibar', decimals: 1 },
  { id: 'kgf/cm2', label: 'kgf/cm²', name: 'kilogram-force per square centimetre', decimals: 3 },
  { id: 'atm', label: 'atm', name: 'standard atmosphere', decimals: 4 },
  { id: 'mmHg', label: 'mmHg', name: 'millimetre of mercury (conventional)', decimals: 1 },
  { id: 'torr', label: 'Torr', name: 'torr (1/760 atm)', decimals: 1 },
  { id: 'inHg', label: 'inHg', name: 'inch of mercury (conventional)', decimals: 2 },
  { id: 'inHg@32F', label: 'inHg (32 °F)', name: 'inch of mercury at 32 °F', decimals: 2 },
  { id: 'inHg@60F', label: 'inHg (60 °F)', name: 'inch of mercury at 60 °F', decimals: 2 },
  { id: 'inH2O', label: 'inH₂O', name: 'inch of water (conventional)', decimals: 1 },
  { id: 'inH2O@39.2F', label: 'inH₂O (39.2 °F)', name: 'inch of water at 39.2 °F', decimals: 1 },
  { id: 'inH2O@60F', label: 'inH₂O (60 °F)', name: 'inch of water at 60 °F', decimals: 1 },
];

/** True when `unit` is one of the pressure unit ids (for data read back from storage). */
export function isPressureUnit(unit: unknown): unit is PressureUnit {
  return typeof unit === 'string' && Object.hasOwn(PASCALS_PER_PRESSURE_UNIT, unit);
}

/**
 * A pressure (or pressure difference, gauge or absolute alike) in `unit` as pascals.
 * @param value any finite number; the sign is kept (a gauge vacuum is negative).
 * @param field the field an error names (default "pressure").
 * @throws InputError 'not-a-number' for NaN/±Infinity. @throws RangeError for an unknown unit id.
 */
export function pressureToPa(value: number, unit: PressureUnit, field = 'pressure'): number {
  const factor = factorFor(PASCALS_PER_PRESSURE_UNIT, unit, 'pressure');
  return requireFinite(field, value) * factor;
}

/**
 * A pressure in pascals expressed in `unit`.
 * @param pa any finite number of pascals.
 * @throws InputError 'not-a-number' for NaN/±Infinity. @throws RangeError for an unknown unit id.
 */
export function pressureFromPa(pa: number, unit: PressureUnit, field = 'pressure'): number {
  const factor = factorFor(PASCALS_PER_PRESSURE_UNIT, unit, 'pressure');
  return requireFinite(field, pa) / factor;
}
