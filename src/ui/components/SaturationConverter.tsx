// Temperature ↔ saturation pressure, both directions, in the preferred units.
import { useState } from 'preact/hooks';
import { PRESSURE_UNITS, TEMPERATURE_UNITS, type PressureUnit, type TemperatureUnit } from '../../core/basics.ts';
import { NumberField } from './NumberField.tsx';
import { Choice } from './Choice.tsx';
import { useSettings } from '../state/app-state.ts';
import { unitsInForce } from '../state/settings-model.ts';
import { saturationFromPressure, saturationFromTemperature, type PressureKind, type SaturationAnswer } from '../state/convert.ts';
import { formatToBand } from '../state/format.ts';

const KINDS = [{ id: 'gauge', label: 'Gauge' }, { id: 'absolute', label: 'Absolute' }] as const;

export function SaturationConverter({ atmospherePa }: { atmospherePa: number }) {
  const prefs = unitsInForce(useSettings());
  const [tText, setTText] = useState('');
  const [tUnit, setTUnit] = useState<TemperatureUnit>(prefs.temperature);
  const [pText, setPText] = useState('');
  const [pUnit, setPUnit] = useState<PressureUnit>(prefs.pressure);
  const [kind, setKind] = useState<PressureKind>('gauge');
  const fromT = saturationFromTemperature(tText, tUnit, pUnit, atmospherePa);
  const fromP = saturationFromPressure(pText, pUnit, kind, tUnit, atmospherePa);
  const tLabel = TEMPERATURE_UNITS.find((u) => u.id === tUnit)?.label ?? tUnit;
  const pLabel = PRESSURE_UNITS.find((u) => u.id === pUnit)?.label ?? pUnit;
  return (
    <section class="panel" aria-labelledby="conv-sat">
      <h2 id="conv-sat">Saturation (IAPWS-IF97)</h2>
      <NumberField id="sat-t" label="Temperature" value={tText} onInput={setTText}
        unit={tUnit} units={TEMPERATURE_UNITS} onUnit={(u) => setTUnit(u as TemperatureUnit)}
        error={fromT.ok === false ? fromT.error : undefined} />
      <Answer a={fromT} text={(a) => `Saturation pressure ${formatToBand(a.absolute, a.pressureBand)} ${pLabel} absolute, ${formatToBand(a.gauge, a.pressureBand)} ${pLabel} gauge`} />
      <NumberField id="sat-p" label="Pressure" value={pText} onInput={setPText}
        unit={pUnit} units={PRESSURE_UNITS} onUnit={(u) => setPUnit(u as PressureUnit)}
        error={fromP.ok === false ? fromP.error : undefined} />
      <Choice name="sat-kind" legend="The pressure above is" value={kind} options={KINDS} onChange={setKind} />
      <Answer a={fromP} text={(a) => `Saturation temperature ${formatToBand(a.temperature, a.temperatureBand)} ${tLabel}`} />
    </section>
  );
}

function Answer({ a, text }: { a: SaturationAnswer; text: (a: Extract<SaturationAnswer, { ok: true }>) => string }) {
  return <p aria-live="polite" class="field"><strong>{a.ok === true ? text(a) : ''}</strong></p>;
}
