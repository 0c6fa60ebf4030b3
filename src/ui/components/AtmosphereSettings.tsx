// Site atmosphere: 1 standard atmosphere, a barometer reading, or the site elevation.
import { LENGTH_UNITS, PRESSURE_UNITS, type LengthUnit, type PressureUnit } from '../../core/basics.ts';
import { Choice } from './Choice.tsx';
import { NumberField } from './NumberField.tsx';
import { AtmosphereLine } from './AtmosphereLine.tsx';
import { updateSettings, useSettings } from '../state/app-state.ts';
import { siteAtmosphere } from '../state/atmosphere.ts';
import { unitsInForce, type SiteAtmosphere } from '../state/settings-model.ts';

const MODES = [
  { id: 'standard', label: '1 atm' },
  { id: 'barometer', label: 'Barometer' },
  { id: 'elevation', label: 'Elevation' },
] as const;

export function AtmosphereSettings() {
  const settings = useSettings();
  const a = settings.atmosphere;
  const lengthUnit = unitsInForce(settings).length;
  const atm = siteAtmosphere(a);
  const setMode = (mode: SiteAtmosphere['mode']) => {
    const next: SiteAtmosphere =
      mode === 'standard' ? { mode } : mode === 'barometer' ? { mode, text: '', unit: 'kPa' } : { mode, text: '', unit: lengthUnit };
    void updateSettings({ atmosphere: next });
  };
  return (
    <section class="panel" aria-labelledby="set-atm">
      <h2 id="set-atm">Site atmosphere</h2>
      <p class="hint">The starting value for new vessels (each vessel keeps its own), and offered by Convert. A barometer reading taken today also applies to every check until you change it.</p>
      <Choice name="set-atm-mode" legend="Take atmospheric pressure from" value={a.mode} options={MODES} onChange={setMode} />
      {a.mode === 'barometer' ? (
        <NumberField id="set-baro" label="Barometer reading (absolute)" value={a.text}
          onInput={(text) => void updateSettings({ atmosphere: { ...a, text } })}
          unit={a.unit} units={PRESSURE_UNITS}
          onUnit={(unit) => void updateSettings({ atmosphere: { ...a, unit: unit as PressureUnit } })}
          error={atm.ok ? undefined : atm.error} />
      ) : null}
      {a.mode === 'elevation' ? (
        <NumberField id="set-elev" label="Site elevation above sea level" value={a.text}
          onInput={(text) => void updateSettings({ atmosphere: { ...a, text } })}
          unit={a.unit ?? 'm'} units={LENGTH_UNITS}
          onUnit={(unit) => void updateSettings({ atmosphere: { ...a, unit: unit as LengthUnit } })}
          hint="US Standard Atmosphere 1976; weather moves the real value by a few kPa."
          error={atm.ok ? undefined : atm.error} />
      ) : null}
      {atm.ok ? <AtmosphereLine atm={atm} link={false} /> : null}
    </section>
  );
}
