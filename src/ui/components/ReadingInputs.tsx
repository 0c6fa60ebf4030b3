// The three readings of a check, each with its unit picker; pressure also gauge or absolute. A unit
// that differs from the vessel's instrument is marked beside its field. The callbacks are stable
// (each updates its own part of the draft), so a keystroke re-renders only its own field.
import { MASS_UNITS, PRESSURE_UNITS, TEMPERATURE_UNITS } from '../../core/basics.ts';
import type { MassUnit, PressureUnit, TemperatureUnit } from '../../core/basics.ts';
import type { ReadingUnits } from '../../core/index.ts';
import { useMemo } from 'preact/hooks';
import { NumberField } from './NumberField.tsx';
import { Choice } from './Choice.tsx';
import type { CheckDraft } from '../state/check-draft.ts';
import { unitLabel } from '../state/unit-labels.ts';

const KINDS = [{ id: 'gauge', label: 'Gauge' }, { id: 'absolute', label: 'Absolute' }] as const;

interface Props {
  draft: CheckDraft;
  /** Applies a change to the draft as it is when the change happens. */
  update: (change: (d: CheckDraft) => CheckDraft) => void;
  errors: Partial<Record<'temperature' | 'pressure' | 'gross', string>>;
  /** The units the chosen vessel's instruments read in, if a vessel is chosen. */
  vesselUnits: ReadingUnits | undefined;
}

const note = (unit: string, own: string | undefined, what: string) =>
  own !== undefined && unit !== own ? `Not the vessel's unit: its ${what} reads ${unitLabel(own)}.` : undefined;

export function ReadingInputs({ draft: d, update, errors, vesselUnits: vu }: Props) {
  const on = useMemo(() => ({
    temperature: (text: string) => update((x) => ({ ...x, temperature: { ...x.temperature, text } })),
    temperatureUnit: (unit: string) => update((x) => ({ ...x, temperature: { ...x.temperature, unit: unit as TemperatureUnit } })),
    pressure: (text: string) => update((x) => ({ ...x, pressure: { ...x.pressure, text } })),
    pressureUnit: (unit: string) => update((x) => ({ ...x, pressure: { ...x.pressure, unit: unit as PressureUnit } })),
    kind: (kind: 'gauge' | 'absolute') => update((x) => ({ ...x, pressure: { ...x.pressure, kind } })),
    gross: (text: string) => update((x) => ({ ...x, gross: { ...x.gross, text } })),
    grossUnit: (unit: string) => update((x) => ({ ...x, gross: { ...x.gross, unit: unit as MassUnit } })),
  }), [update]);
  return (
    <fieldset class="readings">
      <legend>Readings</legend>
      <NumberField id="chk-temperature" label="Temperature (thermometer)" value={d.temperature.text} onInput={on.temperature}
        unit={d.temperature.unit} units={TEMPERATURE_UNITS} onUnit={on.temperatureUnit}
        error={errors.temperature} unitNote={note(d.temperature.unit, vu?.temperature, 'thermometer')} />
      <NumberField id="chk-pressure" label="Pressure (gauge reading)" value={d.pressure.text} onInput={on.pressure}
        unit={d.pressure.unit} units={PRESSURE_UNITS} onUnit={on.pressureUnit}
        error={errors.pressure} unitNote={note(d.pressure.unit, vu?.pressure, 'gauge')} />
      <Choice name="chk-kind" legend="The pressure is" value={d.pressure.kind} options={KINDS} onChange={on.kind} />
      <NumberField id="chk-gross" label="Gross weight (load cells, optional)" value={d.gross.text} onInput={on.gross}
        unit={d.gross.unit} units={MASS_UNITS} onUnit={on.grossUnit}
        error={errors.gross} unitNote={note(d.gross.unit, vu?.mass, 'scale')} />
    </fieldset>
  );
}
