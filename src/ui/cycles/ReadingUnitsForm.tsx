// The units the readings are in: the vessel's instrument units to start with, changeable (a
// recorder may write another unit than the chamber's gauge shows).
import { PRESSURE_UNITS, TEMPERATURE_UNITS, type PressureUnit, type TemperatureUnit } from '../../core/units/index.ts';
import { Choice } from '../components/Choice.tsx';
import { SelectField } from '../components/SelectField.tsx';
import type { ReadingUnits } from './cycle-input.ts';

export function ReadingUnitsForm({ units, onChange }: { units: ReadingUnits; onChange: (u: ReadingUnits) => void }) {
  return (
    <div class="reading-units">
      <SelectField id="ru-temperature" label="Temperature readings in" value={units.temperature} options={TEMPERATURE_UNITS}
        onChange={(t) => onChange({ ...units, temperature: t as TemperatureUnit })} />
      <SelectField id="ru-pressure" label="Pressure readings in" value={units.pressure} options={PRESSURE_UNITS}
        onChange={(p) => onChange({ ...units, pressure: p as PressureUnit })} />
      <Choice name="ru-reference" legend="Pressure readings are" value={units.reference}
        options={[{ id: 'gauge', label: 'gauge' }, { id: 'absolute', label: 'absolute' }]} onChange={(r) => onChange({ ...units, reference: r })} />
    </div>
  );
}
