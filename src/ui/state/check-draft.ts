// The check entry as typed: text exactly as entered plus the unit chosen for each field. An empty
// field always takes the vessel's own unit (its gauge's, thermometer's, scale's), so a unit picked
// for one reading never carries over to the next check or the next launch; a field with text keeps
// the unit it was typed in, marked when it differs from the vessel's.
import type { MassUnit, PressureUnit, ReadingUnits, TemperatureUnit } from '../../core/index.ts';
import type { UnitPrefs } from './settings-model.ts';

export interface TypedValue<U extends string> { text: string; unit: U }

export interface CheckDraft {
  vesselId: string;
  temperature: TypedValue<TemperatureUnit>;
  pressure: TypedValue<PressureUnit> & { kind: 'gauge' | 'absolute' };
  gross: TypedValue<MassUnit>;
  technician: string;
  note: string;
}

export const CHECK_DRAFT_KEY = 'check';

export function emptyCheckDraft(units: UnitPrefs, technician: string): CheckDraft {
  return {
    vesselId: '',
    temperature: { text: '', unit: units.temperature },
    pressure: { text: '', unit: units.pressure, kind: 'gauge' },
    gross: { text: '', unit: units.mass },
    technician,
    note: '',
  };
}

/** The units a vessel's instruments read in; the person's preferred units for a vessel saved without them. */
export function vesselUnits(spec: { readingUnits?: ReadingUnits | undefined } | undefined, prefs: UnitPrefs): ReadingUnits {
  return spec?.readingUnits ?? { pressure: prefs.pressure, temperature: prefs.temperature, mass: prefs.mass };
}

/** The draft with every empty field in the vessel's unit; a field with text keeps its unit. Same object when nothing changes. */
export function inVesselUnits(d: CheckDraft, units: ReadingUnits): CheckDraft {
  const t = d.temperature.text.trim() === '' && d.temperature.unit !== units.temperature;
  const p = d.pressure.text.trim() === '' && d.pressure.unit !== units.pressure;
  const m = d.gross.text.trim() === '' && d.gross.unit !== units.mass;
  if (!t && !p && !m) return d;
  return {
    ...d,
    temperature: t ? { ...d.temperature, unit: units.temperature } : d.temperature,
    pressure: p ? { ...d.pressure, unit: units.pressure } : d.pressure,
    gross: m ? { ...d.gross, unit: units.mass } : d.gross,
  };
}
