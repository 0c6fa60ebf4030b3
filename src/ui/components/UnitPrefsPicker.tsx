// One unit picker per quantity, for "per quantity" preferred units.
import { LENGTH_UNITS, MASS_UNITS, PRESSURE_UNITS, TEMPERATURE_UNITS, VOLUME_UNITS } from '../../core/basics.ts';
import { updateSettings, useSettings } from '../state/app-state.ts';
import { unitsInForce, type UnitPrefs } from '../state/settings-model.ts';

const QUANTITIES = [
  { key: 'pressure', label: 'Pressure', units: PRESSURE_UNITS },
  { key: 'temperature', label: 'Temperature', units: TEMPERATURE_UNITS },
  { key: 'mass', label: 'Mass', units: MASS_UNITS },
  { key: 'volume', label: 'Volume', units: VOLUME_UNITS },
  { key: 'length', label: 'Length (dimensions, level, elevation)', units: LENGTH_UNITS },
] as const;

export function UnitPrefsPicker() {
  const s = useSettings();
  const units = unitsInForce(s);
  return (
    <div>
      {QUANTITIES.map((q) => (
        <div class="field" key={q.key}>
          <label for={`pref-${q.key}`}>{q.label}</label>
          <select id={`pref-${q.key}`} value={units[q.key]}
            onChange={(e) => void updateSettings({ units: { ...units, [q.key]: e.currentTarget.value } as UnitPrefs })}>
            {q.units.map((u) => <option key={u.id} value={u.id}>{u.label}</option>)}
          </select>
        </div>
      ))}
    </div>
  );
}
