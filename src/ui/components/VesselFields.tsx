// The vessel editor's inputs, in four groups: identity and shape, weight, pressure, temperature
// and atmosphere. Units picked once per group apply to every field of that quantity.
import { LENGTH_UNITS, MASS_UNITS, PRESSURE_UNITS, TEMPERATURE_UNITS, VOLUME_UNITS } from '../../core/basics.ts';
import type { LengthUnit, MassUnit, PressureUnit, TemperatureUnit, VolumeUnit } from '../../core/basics.ts';
import { TextField } from './TextField.tsx';
import { NumberField } from './NumberField.tsx';
import { Choice } from './Choice.tsx';
import { SelectField } from './SelectField.tsx';
import { HEADS, SENSORS, SHAPES, formLengthUnit, type FormField, type VesselForm } from '../state/vessel-form.ts';

interface Props {
  form: VesselForm;
  set: (change: Partial<VesselForm>) => void;
  errors: Partial<Record<FormField, string>>;
}

const VACUUM = [{ id: 'yes', label: 'Full vacuum' }, { id: 'no', label: 'Not rated' }] as const;
const ATM = [{ id: 'elevation', label: 'Elevation' }, { id: 'pressure', label: 'Pressure' }] as const;

export function VesselFields({ form: f, set, errors: e }: Props) {
  const pu = PRESSURE_UNITS.find((u) => u.id === f.pressureUnit)?.label ?? f.pressureUnit;
  const lu = formLengthUnit(f);
  const ll = LENGTH_UNITS.find((u) => u.id === lu)?.label ?? lu;
  const tu = TEMPERATURE_UNITS.find((u) => u.id === f.temperatureUnit)?.label ?? f.temperatureUnit;
  const num = (field: FormField, label: string, hint?: string) => (
    <NumberField id={`v-${field}`} label={label} value={f[field]} onInput={(text) => set({ [field]: text })} error={e[field]} hint={hint} />
  );
  return (
    <>
      <fieldset>
        <legend>Identity and shape</legend>
        <TextField id="v-tag" label="Tag (as written on the vessel)" value={f.tag} onInput={(tag) => set({ tag })} error={e.tag} />
        <TextField id="v-desc" label="Description" value={f.description} onInput={(description) => set({ description })} error={e.description} />
        <SelectField id="v-shape" label="Shape" value={f.shape} options={SHAPES} onChange={(shape) => set({ shape })} />
        {f.shape === 'stated-volume' ? (
          <NumberField id="v-volume" label="Internal volume" value={f.volume} onInput={(volume) => set({ volume })}
            unit={f.volumeUnit} units={VOLUME_UNITS} onUnit={(u) => set({ volumeUnit: u as VolumeUnit })} error={e.volume} />
        ) : (
          <>
            <NumberField id="v-diameterM" label="Inner diameter" value={f.diameterM} onInput={(diameterM) => set({ diameterM })}
              unit={lu} units={LENGTH_UNITS} onUnit={(u) => set({ lengthUnit: u as LengthUnit })} error={e.diameterM} />
            {num('straightLengthM', `Straight length between tangent lines (${ll})`)}
            <SelectField id="v-head" label="Heads (both ends)" value={f.head} options={HEADS} onChange={(head) => set({ head })} />
          </>
        )}
        {num('volumeTolPercent', 'Volume tolerance ± (%)')}
      </fieldset>
      <fieldset>
        <legend>Weight</legend>
        <NumberField id="v-tare" label="Tare (empty weight on the scale)" value={f.tare} onInput={(tare) => set({ tare })}
          unit={f.massUnit} units={MASS_UNITS} onUnit={(u) => set({ massUnit: u as MassUnit })} error={e.tare} />
        {num('weightTol', `Weight reading tolerance ± (${f.massUnit})`)}
      </fieldset>
      <fieldset>
        <legend>Pressure</legend>
        <NumberField id="v-mawp" label="MAWP (gauge)" value={f.mawp} onInput={(mawp) => set({ mawp })}
          unit={f.pressureUnit} units={PRESSURE_UNITS} onUnit={(u) => set({ pressureUnit: u as PressureUnit })} error={e.mawp} />
        {num('relief', `Relief set pressure (gauge, ${pu})`)}
        {num('gaugeSpan', `Pressure gauge span (${pu})`)}
        {num('gaugeAccuracyPercent', 'Pressure gauge accuracy ± (% of span)')}
        <Choice name="v-vacuum" legend="Vacuum rating" value={f.vacuumRated} options={VACUUM} onChange={(vacuumRated) => set({ vacuumRated })} />
      </fieldset>
      <fieldset>
        <legend>Temperature</legend>
        <NumberField id="v-design" label="Design temperature" value={f.designTemperature} onInput={(designTemperature) => set({ designTemperature })}
          unit={f.temperatureUnit} units={TEMPERATURE_UNITS} onUnit={(u) => set({ temperatureUnit: u as TemperatureUnit })} error={e.designTemperature} />
        {num('ambientTemperature', `Ambient temperature around the vessel (${tu})`)}
        <SelectField id="v-sensor" label="Temperature sensor" value={f.sensor} options={SENSORS} onChange={(sensor) => set({ sensor })} />
        {f.sensor === 'stated' ? num('sensorTol', `Sensor tolerance ± (${tu} difference)`) : null}
      </fieldset>
      <fieldset>
        <legend>Site atmosphere</legend>
        <Choice name="v-atm" legend="Give the site's atmospheric pressure as" value={f.atmosphereMode} options={ATM}
          onChange={(atmosphereMode) => set({ atmosphereMode })} />
        {f.atmosphereMode === 'elevation'
          ? num('elevationM', `Elevation above sea level (${ll})`, 'US Standard Atmosphere 1976.')
          : <>{num('atmosphere', `Atmospheric pressure (absolute, ${pu})`)}{num('barometerTol', `Barometer tolerance ± (${pu})`)}</>}
      </fieldset>
    </>
  );
}
