// The three readings of a check, each with its unit picker; pressure also gauge or absolute.
import { MASS_UNITS, PRESSURE_UNITS, TEMPERATURE_UNITS } from '../../core/index.ts';
import type { MassUnit, PressureUnit, TemperatureUnit } from '../../core/index.ts';
import { NumberField } from './NumberField.tsx';
import { Choice } from './Choice.tsx';
import type { CheckDraft } from '../state/check-draft.ts';

const KINDS = [{ id: 'gauge', label: 'Gauge' }, { id: 'absolute', label: 'Absolute' }] as const;

interface Props {
  draft: CheckDraft;
  onChange: (next: CheckDraft) => void;
  errors: Partial<Record<'temperature' | 'pressure' | 'gross', string>>;
}

export function ReadingInputs({ draft, onChange, errors }: Props) {
  const d = draft;
  return (
    <fieldset>
      <legend>Readings</legend>
      <NumberField id="chk-temperature" label="Temperature (thermometer)" value={d.temperature.text}
        onInput={(text) => onChange({ ...d, temperature: { ...d.temperature, text } })}
        unit={d.temperature.unit} units={TEMPERATURE_UNITS}
        onUnit={(unit) => onChange({ ...d, temperature: { ...d.temperature, unit: unit as TemperatureUnit } })}
        error={errors.temperature} />
      <NumberField id="chk-pressure" label="Pressure (gauge reading)" value={d.pressure.text}
        onInput={(text) => onChange({ ...d, pressure: { ...d.pressure, text } })}
        unit={d.pressure.unit} units={PRESSURE_UNITS}
        onUnit={(unit) => onChange({ ...d, pressure: { ...d.pressure, unit: unit as PressureUnit } })}
        error={errors.pressure} />
      <Choice name="chk-kind" legend="The pressure is" value={d.pressure.kind} options={KINDS}
        onChange={(kind) => onChange({ ...d, pressure: { ...d.pressure, kind } })} />
      <NumberField id="chk-gross" label="Gross weight (load cells)" value={d.gross.text}
        onInput={(text) => onChange({ ...d, gross: { ...d.gross, text } })}
        unit={d.gross.unit} units={MASS_UNITS}
        onUnit={(unit) => onChange({ ...d, gross: { ...d.gross, unit: unit as MassUnit } })}
        error={errors.gross} />
    </fieldset>
  );
}
