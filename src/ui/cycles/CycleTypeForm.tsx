// The cycle type as the site sets it: sterilising temperature, hold time, the band around it, the
// measured-against-theoretical limit and the F-value constants. Defaults are the common 121 °C /
// 15 min type (common practice); every site enters its own validated values.
import { TEMPERATURE_UNITS, type TemperatureUnit } from '../../core/units/index.ts';
import { NumberField } from '../components/NumberField.tsx';
import type { CycleTypeFields } from './cycle-input.ts';

interface Props { fields: CycleTypeFields; onChange: (f: CycleTypeFields) => void }

export function CycleTypeForm({ fields: f, onChange }: Props) {
  const set = (k: keyof CycleTypeFields) => (text: string) => onChange({ ...f, [k]: text });
  return (
    <details class="panel cycle-type" open>
      <summary>Cycle type (your site's values)</summary>
      <NumberField id="ct-temperature" label="Sterilising temperature" value={f.temperatureText} onInput={set('temperatureText')}
        unit={f.temperatureUnit} units={TEMPERATURE_UNITS} onUnit={(u) => onChange({ ...f, temperatureUnit: u as TemperatureUnit })} />
      <NumberField id="ct-hold" label="Hold time, min" value={f.holdMinutesText} onInput={set('holdMinutesText')} />
      <NumberField id="ct-above" label="Band above, K" value={f.bandAboveText} onInput={set('bandAboveText')} />
      <NumberField id="ct-below" label="Band below, K" value={f.bandBelowText} onInput={set('bandBelowText')} />
      <NumberField id="ct-saturation" label="Measured against T_sat(p), largest difference, K" value={f.saturationLimitText} onInput={set('saturationLimitText')} />
      <NumberField id="ct-reference" label={`F-value reference temperature (${TEMPERATURE_UNITS.find((u) => u.id === f.temperatureUnit)?.label ?? ''})`} value={f.referenceText} onInput={set('referenceText')} />
      <NumberField id="ct-z" label="z-value, K" value={f.zText} onInput={set('zText')} />
    </details>
  );
}
