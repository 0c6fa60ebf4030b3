// Convert: one pressure in every unit (gauge and absolute at the atmosphere chosen: today's
// barometer, a vessel's site, or the standard atmosphere only when picked), and temperature ↔
// saturation pressure. The atmosphere in use is shown above the tables, one 48 px tap to change.
import { PRESSURE_UNITS, type PressureUnit } from '../../core/basics.ts';
import { NumberField } from '../components/NumberField.tsx';
import { Choice } from '../components/Choice.tsx';
import { SelectField } from '../components/SelectField.tsx';
import { SaturationConverter } from '../components/SaturationConverter.tsx';
import { useSettings, useVessels } from '../state/app-state.ts';
import { useDraft } from '../state/drafts.ts';
import { siteAtmosphere } from '../state/atmosphere.ts';
import { atmosphereChoices, chosenAtmosphere } from '../state/convert-atmosphere.ts';
import { pressureInAllUnits, type PressureKind } from '../state/convert.ts';
import { unitsInForce } from '../state/settings-model.ts';
import { formatNumber, formatToBand } from '../state/format.ts';
import { StandingNote } from '../components/StandingNote.tsx';

const KINDS = [{ id: 'gauge', label: 'Gauge' }, { id: 'absolute', label: 'Absolute' }] as const;

interface ConvertDraft { text: string; unit: PressureUnit; kind: PressureKind; atmosphere: string }

export function ConvertScreen() {
  const settings = useSettings();
  const vessels = useVessels();
  const draft = useDraft<ConvertDraft>('convert', { text: '', unit: unitsInForce(settings).pressure, kind: 'gauge', atmosphere: '' });
  const d = draft.value;
  const set = (change: Partial<ConvertDraft>) => draft.set({ ...d, ...change });
  const choices = atmosphereChoices(siteAtmosphere(settings.atmosphere), settings.atmosphere.mode, vessels);
  const atm = chosenAtmosphere(choices, d.atmosphere);
  const table = pressureInAllUnits(d.text, d.unit, d.kind, atm.pressurePa);
  return (
    <div>
      <section class="panel" aria-labelledby="conv-atm-h">
        <h2 id="conv-atm-h">Atmosphere</h2>
        <p data-atmosphere={atm.id}><strong>{formatNumber(atm.pressurePa / 1000, 5)} kPa absolute</strong>, {atm.source}.</p>
        <SelectField id="conv-atm" label="Refer gauge pressures to" value={atm.id} options={choices.map((c) => ({ id: c.id, label: `${c.label} (${formatNumber(c.pressurePa / 1000, 4)} kPa)` }))}
          onChange={(atmosphere) => set({ atmosphere })} />
      </section>
      <section class="panel" aria-labelledby="conv-p">
        <h2 id="conv-p">Pressure in every unit</h2>
        <NumberField id="conv-pressure" label="Pressure" value={d.text} onInput={(text) => set({ text })}
          unit={d.unit} units={PRESSURE_UNITS} onUnit={(u) => set({ unit: u as PressureUnit })}
          error={table.ok === false ? table.error : undefined} />
        <Choice name="conv-kind" legend="The value above is" value={d.kind} options={KINDS} onChange={(kind) => set({ kind })} />
        <div aria-live="polite" data-convert-state={table.ok === true ? 'ready' : table.ok === false ? 'error' : 'empty'}>
          {table.ok === true ? (
            <div class="table-wrap">
              <table>
                <caption class="visually-hidden">The pressure in every unit</caption>
                <thead><tr><th scope="col">Unit</th><th scope="col">Absolute</th><th scope="col">Gauge</th></tr></thead>
                <tbody>
                  {table.rows.map((r) => (
                    <tr key={r.unit}><th scope="row">{r.label}</th><td>{formatToBand(r.absolute, r.band)}</td><td>{formatToBand(r.gauge, r.band)}</td></tr>
                  ))}
                </tbody>
              </table>
            </div>
          ) : null}
        </div>
      </section>
      <SaturationConverter atmospherePa={atm.pressurePa} />
      <StandingNote />
    </div>
  );
}
