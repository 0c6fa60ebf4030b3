// The vessel editor's inputs in four sections — shape, limits, instruments, site — with the common
// defaults filled in and the tolerances folded, so the usual vessel fits on two phone screens. Each
// length field has its own unit; pressures, temperatures and weights are in the units of the
// vessel's gauge, thermometer and scale, chosen once in Instruments. The inner volume and the outline
// follow the dimensions as they are typed; the site shows its elevation and pressure each with the other.
import { LENGTH_UNITS, MASS_UNITS, PRESSURE_UNITS, TEMPERATURE_UNITS, VOLUME_UNITS } from '../../core/basics.ts';
import type { LengthUnit, MassUnit, PressureUnit, TemperatureUnit, VolumeUnit } from '../../core/basics.ts';
import { TextField } from './TextField.tsx';
import { NumberField } from './NumberField.tsx';
import { SelectField } from './SelectField.tsx';
import { ShapeSketch } from './ShapeSketch.tsx';
import { HEADS, HEATINGS, SENSORS, SERVICES, SHAPES, TARE_KNOWN, lengthUnitChange, lengthUnitOf, type FormField, type LengthField, type VesselForm } from '../state/vessel-form.ts';
import { shapePreview, siteCounterpart } from '../state/vessel-preview.ts';
import type { UnitPrefs } from '../state/settings-model.ts';
import { unitLabel } from '../state/unit-labels.ts';

interface Props {
  form: VesselForm;
  set: (change: Partial<VesselForm>) => void;
  errors: Partial<Record<FormField, string>>;
  prefs: UnitPrefs;
}

const ACCURACY_FIELDS: readonly FormField[] = ['gaugeAccuracyPercent', 'gaugeIndicatorPercent', 'gaugeDriftPercent', 'sensorIndicatorTol', 'sensorDriftTol', 'tareTol', 'volumeTolPercent'];

const SITE_FIELDS: readonly FormField[] = ['atmosphere', 'barometerTol', 'elevationM', 'ambientTemperature'];

const ATM = [{ id: 'elevation', label: 'Its elevation' }, { id: 'pressure', label: 'Its atmospheric pressure' }] as const;

export function VesselFields({ form: f, set, errors: e, prefs }: Props) {
  const pu = unitLabel(f.pressureUnit), tu = unitLabel(f.temperatureUnit), mu = unitLabel(f.massUnit);
  const du = f.temperatureUnit === 'degC' ? 'K' : tu;
  const num = (field: FormField, label: string, hint?: string) => (
    <NumberField id={`v-${field}`} label={label} value={f[field]} onInput={(text) => set({ [field]: text })} error={e[field]} hint={hint} />
  );
  const length = (field: LengthField, label: string, hint?: string) => (
    <NumberField id={`v-${field}`} label={label} value={f[field]} onInput={(text) => set({ [field]: text })} error={e[field]} hint={hint}
      unit={lengthUnitOf(f, field)} units={LENGTH_UNITS} onUnit={(u) => set(lengthUnitChange(field, u as LengthUnit))} />
  );
  const preview = shapePreview(f, prefs);
  const counterpart = siteCounterpart(f);
  const siteErrors = SITE_FIELDS.some((k) => e[k] !== undefined);
  return (
    <>
      <fieldset class="editor-section">
        <legend>Shape</legend>
        <div class="pair">
          <TextField id="v-tag" label="Tag" value={f.tag} onInput={(tag) => set({ tag })} error={e.tag} />
          <TextField id="v-desc" label="Description" value={f.description} onInput={(description) => set({ description })} error={e.description} />
        </div>
        <div class="pair">
          <SelectField id="v-shape" label="Shape" value={f.shape} options={SHAPES} onChange={(shape) => set({ shape })} />
          {f.shape === 'stated-volume' ? null : <SelectField id="v-head" label="Heads (both ends)" value={f.head} options={HEADS} onChange={(head) => set({ head })} />}
        </div>
        {f.shape === 'stated-volume' ? (
          <NumberField id="v-volume" label="Internal volume" value={f.volume} onInput={(volume) => set({ volume })}
            unit={f.volumeUnit} units={VOLUME_UNITS} onUnit={(u) => set({ volumeUnit: u as VolumeUnit })} error={e.volume} />
        ) : (
          <>
            {length('diameterM', 'Inner diameter')}
            {length('straightLengthM', 'Straight length (tangent to tangent)')}
            {f.head === 'torispherical' ? (
              <details class="result-folded" open={e.crownRadius !== undefined || e.knuckleRadius !== undefined}>
                <summary>Crown and knuckle radii ({f.crownRadius.trim() || f.knuckleRadius.trim()
                  ? `${f.crownRadius.trim() || 'standard'} ${lengthUnitOf(f, 'crownRadius')}, ${f.knuckleRadius.trim() || 'standard'} ${lengthUnitOf(f, 'knuckleRadius')}`
                  : 'blank: standard F&D'})</summary>
                {length('crownRadius', 'Crown radius')}
                {length('knuckleRadius', 'Knuckle radius')}
              </details>
            ) : null}
          </>
        )}
        <div class="shape-preview" aria-live="polite">
          <p data-volume>Inner volume: <strong>{preview.volumeText}</strong></p>
          {preview.outline ? <ShapeSketch outline={preview.outline} caption={`Outline to the dimensions typed: ${preview.volumeText}`} /> : null}
        </div>
      </fieldset>
      <fieldset class="editor-section">
        <legend>Limits (from the nameplate)</legend>
        <div class="pair">
          {num('mawp', `MAWP (gauge, ${pu})`)}
          {num('relief', `Relief set (gauge, ${pu})`)}
        </div>
        {num('designTemperature', `Design temperature (${tu})`)}
        <details class="result-folded" open={e.reliefTolPercent !== undefined}>
          <summary>Vacuum, relief tolerance, service, heating ({limitsSummary(f)})</summary>
          <div class="field">
            <label class="row">
              <input type="checkbox" class="check" id="v-vacuum" checked={f.vacuumRated === 'yes'} onChange={(ev) => set({ vacuumRated: ev.currentTarget.checked ? 'yes' : 'no' })} />
              Rated for full vacuum
            </label>
          </div>
          {num('reliefTolPercent', 'Relief set pressure tolerance ± (% of set; blank: 3 %)')}
          <div class="field">
            <label class="row">
              <input type="checkbox" class="check" id="v-vacuumBreaker" checked={f.vacuumBreaker === 'yes'} onChange={(ev) => set({ vacuumBreaker: ev.currentTarget.checked ? 'yes' : 'no' })} />
              Vacuum breaker fitted
            </label>
          </div>
          <SelectField id="v-service" label="Service" value={f.service} options={SERVICES} onChange={(service) => set({ service })} />
          <SelectField id="v-heating" label="Heated by" value={f.heating} options={HEATINGS} onChange={(heating) => set({ heating })} />
        </details>
      </fieldset>
      <fieldset class="editor-section">
        <legend>Instruments</legend>
        <div class="pair">
          <SelectField id="v-pressure-unit" label="Gauge reads in" value={f.pressureUnit} options={PRESSURE_UNITS} onChange={(u) => set({ pressureUnit: u as PressureUnit })} />
          {num('gaugeSpan', `Gauge span (${pu})`)}
        </div>
        <div class="pair">
          <SelectField id="v-temperature-unit" label="Thermometer reads in" value={f.temperatureUnit} options={TEMPERATURE_UNITS} onChange={(u) => set({ temperatureUnit: u as TemperatureUnit })} />
          <SelectField id="v-sensor" label="Sensor" value={f.sensor} options={SENSORS} onChange={(sensor) => set({ sensor })} />
        </div>
        {f.sensor === 'stated' ? num('sensorTol', `Sensor tolerance ± (${du})`) : null}
        <div class="pair">
          <SelectField id="v-mass-unit" label="Scale reads in" value={f.massUnit} options={MASS_UNITS} onChange={(u) => set({ massUnit: u as MassUnit })} />
          {num('tare', `Tare, empty (${mu})`)}
        </div>
        {num('weightTol', `Scale reading tolerance ± (${mu})`)}
        <details class="result-folded" open={ACCURACY_FIELDS.some((k) => e[k] !== undefined)}>
          <summary>Accuracy, drift, tare and volume tolerances (usual values filled in)</summary>
          {num('gaugeAccuracyPercent', 'Gauge accuracy ± (% of span)')}
          <div class="pair">
            {num('gaugeIndicatorPercent', 'Gauge indicator ± (% of span; blank: none)')}
            {num('gaugeDriftPercent', 'Gauge drift since calibration ± (% of span; blank: none)')}
          </div>
          <div class="pair">
            {num('sensorIndicatorTol', `Thermometer indicator ± (${du}; blank: none)`)}
            {num('sensorDriftTol', `Thermometer drift since calibration ± (${du}; blank: none)`)}
          </div>
          <SelectField id="v-tareKnown" label="Tare known from" value={f.tareKnown} options={TARE_KNOWN} onChange={(tareKnown) => set({ tareKnown })} />
          {f.tareKnown === 'stated' ? num('tareTol', `Tare tolerance ± (${mu})`) : null}
          {num('volumeTolPercent', 'Volume tolerance ± (%)')}
        </details>
      </fieldset>
      <details class="result-folded editor-fold" open={siteErrors}>
        <summary data-site-summary>{siteSummary(f, pu, tu)}</summary>
        <fieldset class="editor-section">
        <legend class="visually-hidden">Site</legend>
        <SelectField id="v-atm" label="Give the site as" value={f.atmosphereMode} options={ATM} onChange={(atmosphereMode) => set({ atmosphereMode })} />
        {f.atmosphereMode === 'elevation'
          ? length('elevationM', 'Elevation above sea level')
          : <div class="pair">{num('atmosphere', `Atmosphere (absolute, ${pu})`)}{num('barometerTol', `Its tolerance ± (${pu})`)}</div>}
        {counterpart ? <p class="hint" data-site-counterpart>{counterpart}</p> : null}
        {num('ambientTemperature', `Ambient temperature around the vessel (${tu})`)}
        </fieldset>
      </details>
    </>
  );
}

/** The folded site's line: where the vessel stands and what it cools to, as the fields now say. */
function siteSummary(f: VesselForm, pu: string, tu: string): string {
  const where = f.atmosphereMode === 'elevation'
    ? (f.elevationM.trim() ? `${f.elevationM} ${lengthUnitOf(f, 'elevationM')} above sea level` : 'elevation not given')
    : (f.atmosphere.trim() ? `${f.atmosphere} ${pu} absolute` : 'atmosphere not given');
  return `Site: ${where}, ambient ${f.ambientTemperature.trim() || '?'} ${tu} (change)`;
}

/** The folded limits' line: the choices as they stand. */
function limitsSummary(f: VesselForm): string {
  return [f.vacuumRated === 'yes' ? 'full vacuum' : 'no vacuum rating', f.vacuumBreaker === 'yes' ? 'breaker fitted' : null]
    .filter(Boolean).join(', ');
}
