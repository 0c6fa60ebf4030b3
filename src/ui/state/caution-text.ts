// A caution's wording in the person's units. The engine words each caution with SI quantities
// (its stored text uses °C, K, kPa and kg); on screen a US-customary user reads psi, °F and lb like
// the figures beside it. Temperature differences convert without the offset.
import {
  MASS_UNITS, PRESSURE_UNITS, TEMPERATURE_UNITS, massFromKg, pressureFromPa, temperatureDifferenceFromK, temperatureFromK,
  type Caution, type CautionQuantity,
} from '../../core/index.ts';
import { formatFixed } from './format.ts';
import type { UnitPrefs } from './settings-model.ts';

const label = (list: readonly { id: string; label: string }[], id: string) => list.find((x) => x.id === id)?.label ?? id;

function shown(q: CautionQuantity, u: UnitPrefs): string {
  switch (q.kind) {
    case 'temperature':
      return `${formatFixed(temperatureFromK(q.K, u.temperature), q.decimals ?? 1)} ${label(TEMPERATURE_UNITS, u.temperature)}`;
    case 'temperature-difference':
      return `${formatFixed(temperatureDifferenceFromK(q.K, u.temperature), q.decimals ?? 1)} ${u.temperature === 'degC' ? 'K' : label(TEMPERATURE_UNITS, u.temperature)}`;
    case 'pressure': {
      const decimals = PRESSURE_UNITS.find((x) => x.id === u.pressure)?.decimals ?? 1;
      return `${formatFixed(pressureFromPa(q.Pa, u.pressure), decimals)} ${label(PRESSURE_UNITS, u.pressure)}`;
    }
    case 'mass':
      return `${formatFixed(massFromKg(q.kg, u.mass), q.decimals ?? 1)} ${label(MASS_UNITS, u.mass)}`;
  }
}

/** The caution with its message in `u`; a caution without parts (older records) keeps its text. */
export function inPreferredUnits(c: Caution, u: UnitPrefs): Caution {
  if (!c.parts) return c;
  return { ...c, message: c.parts.map((p) => (typeof p === 'string' ? p : shown(p, u))).join('') };
}
