// Convert: one pressure in every unit (gauge and absolute at the site atmosphere), and
// temperature ↔ saturation pressure.
import { useState } from 'preact/hooks';
import { PRESSURE_UNITS, type PressureUnit } from '../../core/index.ts';
import { NumberField } from '../components/NumberField.tsx';
import { Choice } from '../components/Choice.tsx';
import { AtmosphereLine } from '../components/AtmosphereLine.tsx';
import { SaturationConverter } from '../components/SaturationConverter.tsx';
import { useSettings } from '../state/app-state.ts';
import { siteAtmosphere } from '../state/atmosphere.ts';
import { pressureInAllUnits, type PressureKind } from '../state/convert.ts';
import { unitsInForce } from '../state/settings-model.ts';
import { formatEditable } from '../state/format.ts';
import { StandingNote } from '../components/StandingNote.tsx';

const KINDS = [{ id: 'gauge', label: 'Gauge' }, { id: 'absolute', label: 'Absolute' }] as const;

export function ConvertScreen() {
  const settings = useSettings();
  const [text, setText] = useState('');
  const [unit, setUnit] = useState<PressureUnit>(unitsInForce(settings).pressure);
  const [kind, setKind] = useState<PressureKind>('gauge');
  const atm = siteAtmosphere(settings.atmosphere);
  const atmPa = atm.ok ? atm.pressurePa : 101_325;
  const table = pressureInAllUnits(text, unit, kind, atmPa);
  return (
    <div>
      <section class="panel" aria-labelledby="conv-p">
        <h2 id="conv-p">Pressure in every unit</h2>
        <AtmosphereLine atm={atm} />
        <NumberField id="conv-pressure" label="Pressure" value={text} onInput={setText}
          unit={unit} units={PRESSURE_UNITS} onUnit={(u) => setUnit(u as PressureUnit)}
          error={table.ok === false ? table.error : undefined} />
        <Choice name="conv-kind" legend="The value above is" value={kind} options={KINDS} onChange={setKind} />
        <div aria-live="polite">
          {table.ok === true ? (
            <div class="table-wrap">
              <table>
                <caption class="visually-hidden">The pressure in every unit</caption>
                <thead><tr><th scope="col">Unit</th><th scope="col">Absolute</th><th scope="col">Gauge</th></tr></thead>
                <tbody>
                  {table.rows.map((r) => (
                    <tr key={r.unit}><th scope="row">{r.label}</th><td>{formatEditable(r.absolute)}</td><td>{formatEditable(r.gauge)}</td></tr>
                  ))}
                </tbody>
              </table>
            </div>
          ) : null}
        </div>
      </section>
      <SaturationConverter atmospherePa={atmPa} />
      <StandingNote />
    </div>
  );
}
