// The app's own settings (stored through the store's settings functions as one record).
import { formatEditable, localeDecimalSeparator, readNumber } from './format.ts';
import { isLengthUnit, lengthFromM, lengthToM, pressureFromPa, pressureToPa, type DecimalSeparator } from '../../core/basics.ts';
import type { LengthUnit, MassUnit, PressureUnit, TemperatureUnit, VolumeUnit } from '../../core/basics.ts';

export type UnitSystem = 'SI' | 'US' | 'custom';

export interface UnitPrefs {
  pressure: PressureUnit;
  temperature: TemperatureUnit;
  mass: MassUnit;
  volume: VolumeUnit;
  /** Vessel dimensions, liquid level and site elevation. Absent in settings saved before it existed (then m). */
  length: LengthUnit;
}

/** Where the site's atmospheric pressure comes from: a barometer reading, the elevation, or 1 atm. */
export type SiteAtmosphere =
  | { mode: 'standard' }
  | { mode: 'barometer'; text: string; unit: PressureUnit }
  | { mode: 'elevation'; text: string; unit?: LengthUnit }; // unit absent in older records: metres

export interface AppSettings {
  technician: string;
  unitSystem: UnitSystem;
  units: UnitPrefs;
  atmosphere: SiteAtmosphere;
  /** How numbers are typed and shown: decimal point or decimal comma. */
  decimalSeparator: DecimalSeparator;
  /** ISO 8601 time of the last export the person made, if any. */
  lastBackup?: string;
}

export const UNIT_PRESETS: Readonly<Record<'SI' | 'US', UnitPrefs>> = {
  SI: { pressure: 'kPa', temperature: 'degC', mass: 'kg', volume: 'L', length: 'm' },
  US: { pressure: 'psi', temperature: 'degF', mass: 'lb', volume: 'gal(US)', length: 'ft' },
};

export const DEFAULT_SETTINGS: AppSettings = {
  technician: '',
  unitSystem: 'SI',
  units: UNIT_PRESETS.SI,
  atmosphere: { mode: 'standard' },
  decimalSeparator: typeof Intl === 'undefined' ? '.' : localeDecimalSeparator(),
};

/** The unit set in force for a settings record. */
export function unitsInForce(s: AppSettings): UnitPrefs {
  if (s.unitSystem !== 'custom') return UNIT_PRESETS[s.unitSystem];
  // Per-quantity choices saved before length existed carry no length unit: metres, as those versions used.
  return { ...s.units, length: isLengthUnit(s.units.length) ? s.units.length : 'm' };
}

/** Settings' site atmosphere as the vessel editor's starting values. */
export function atmosphereDefaults(s: AppSettings, u: UnitPrefs): { elevationM?: string; pressureText?: string } {
  const a = s.atmosphere;
  if (a.mode === 'elevation') {
    // The editor shows the elevation in the preferred length unit.
    try {
      return { elevationM: formatEditable(lengthFromM(lengthToM(readNumber(a.text, 'site elevation'), a.unit ?? 'm'), u.length)) };
    } catch {
      return { elevationM: '' };
    }
  }
  if (a.mode === 'barometer') {
    try {
      return { pressureText: formatEditable(pressureFromPa(pressureToPa(readNumber(a.text, 'barometer reading'), a.unit), u.pressure)) };
    } catch {
      return {};
    }
  }
  return { pressureText: formatEditable(pressureFromPa(101_325, u.pressure)) };
}
