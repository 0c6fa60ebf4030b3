// The check entry as typed: text exactly as entered plus the unit chosen for each field.
import type { MassUnit, PressureUnit, TemperatureUnit } from '../../core/index.ts';
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
