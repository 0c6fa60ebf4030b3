// The vessel editor's text fields ↔ the check engine's VesselSpec (SI). Parsing and unit
// conversion go through the core, and the engine's own validateVessel has the last word; every
// refused field gets its own message.
import { errorText, type FieldUnit } from './error-text.ts';
import {
  InputError, massFromKg, massToKg, pressureFromPa, pressureToPa, temperatureDifferenceFromK,
  temperatureDifferenceToK, temperatureFromK, temperatureToK, volumeFromM3, volumeToM3, atmosphereFromElevation, lengthFromM, lengthToM,
} from '../../core/index.ts';
import type { HeadSpec, VesselGeometry } from '../../core/check/vessel-geometry.ts';
import { validateVessel, type VesselSpec } from '../../core/check/vessel-spec.ts';
import { formatEditable, readNumber } from './format.ts';
import type { UnitPrefs } from './settings-model.ts';
import { lengthUnitOf, type FormField, type VesselForm } from './vessel-form.ts';
import { messageOf } from './atmosphere.ts';

export type { VesselSpec } from '../../core/check/vessel-spec.ts';
export type Shape = VesselGeometry['shape'];
export type HeadKind = HeadSpec['kind'];
export type SensorChoice = 'AA' | 'A' | 'B' | 'stated';

export type SpecResult = { ok: true; spec: VesselSpec } | { ok: false; errors: Partial<Record<FormField, string>> };

/** The engine's field names (InputError.field) → the editor's inputs. */
const ENGINE_FIELDS: Record<string, FormField> = {
  tag: 'tag', 'tare weight': 'tare', MAWP: 'mawp', 'design temperature': 'designTemperature',
  'relief set pressure': 'relief', 'site atmospheric pressure': 'atmosphere', 'ambient temperature': 'ambientTemperature',
  'pressure gauge span': 'gaugeSpan', 'pressure gauge accuracy': 'gaugeAccuracyPercent', 'temperature sensor tolerance': 'sensorTol',
  'weight tolerance': 'weightTol', 'volume tolerance': 'volumeTolPercent', 'barometer tolerance': 'barometerTol',
  'inner diameter': 'diameterM', 'straight length': 'straightLengthM', volume: 'volume', 'internal volume': 'volume',
};

/** The unit a vessel-form field is typed in, for restating the engine's SI range. */
function formFieldUnit(f: VesselForm, field: FormField): FieldUnit | undefined {
  switch (field) {
    case 'tare': case 'weightTol': return { kind: 'mass', unit: f.massUnit };
    case 'mawp': case 'relief': case 'atmosphere': case 'gaugeSpan': case 'barometerTol': return { kind: 'pressure', unit: f.pressureUnit };
    case 'designTemperature': case 'ambientTemperature': return { kind: 'temperature', unit: f.temperatureUnit };
    case 'diameterM': case 'straightLengthM': case 'elevationM': return { kind: 'length', unit: lengthUnitOf(f, field) };
    default: return undefined;
  }
}

/** Builds the SI VesselSpec from the form, or names every field that cannot be read. */
export function specFromForm(f: VesselForm): SpecResult {
  const errors: Partial<Record<FormField, string>> = {};
  const read = (field: FormField, words: string, convert: (n: number) => number = (n) => n): number => {
    try { return convert(readNumber(f[field], words)); } catch (e) { errors[field] = errorText(e, formFieldUnit(f, field), f[field]); return NaN; }
  };
  const len = (field: 'diameterM' | 'straightLengthM' | 'elevationM') => (n: number) => lengthToM(n, lengthUnitOf(f, field));
  const geometry: VesselGeometry = f.shape === 'stated-volume'
    ? { shape: 'stated-volume', volumeM3: read('volume', 'internal volume', (v) => volumeToM3(v, f.volumeUnit)) }
    : { shape: f.shape, innerDiameterM: read('diameterM', 'inner diameter', len('diameterM')), straightLengthM: read('straightLengthM', 'straight length', len('straightLengthM')), head: { kind: f.head } };
  const pa = (n: number) => pressureToPa(n, f.pressureUnit);
  const spec: VesselSpec = {
    tag: f.tag.trim(),
    description: f.description.trim(),
    geometry,
    tareKg: read('tare', 'tare weight', (n) => massToKg(n, f.massUnit)),
    mawpGaugePa: read('mawp', 'MAWP', pa),
    designTemperatureK: read('designTemperature', 'design temperature', (n) => temperatureToK(n, f.temperatureUnit)),
    reliefSetGaugePa: read('relief', 'relief set pressure', pa),
    vacuumRated: f.vacuumRated === 'yes',
    siteAtmospherePa: f.atmosphereMode === 'elevation'
      ? read('elevationM', 'site elevation', (n) => atmosphereFromElevation(len('elevationM')(n)))
      : read('atmosphere', 'site atmospheric pressure', pa),
    ambientTemperatureK: read('ambientTemperature', 'ambient temperature', (n) => temperatureToK(n, f.temperatureUnit)),
    instruments: {
      pressureGauge: { spanPa: read('gaugeSpan', 'pressure gauge span', pa), accuracyPercentOfSpan: read('gaugeAccuracyPercent', 'pressure gauge accuracy') },
      temperatureSensor: f.sensor === 'stated'
        ? { kind: 'stated', toleranceK: read('sensorTol', 'temperature sensor tolerance', (n) => temperatureDifferenceToK(n, f.temperatureUnit)) }
        : { kind: 'iec-60751', sensorClass: f.sensor },
      weightToleranceKg: read('weightTol', 'weight tolerance', (n) => massToKg(n, f.massUnit)),
      volumeTolerancePercent: read('volumeTolPercent', 'volume tolerance'),
      barometerTolerancePa: f.atmosphereMode === 'elevation' ? 0 : read('barometerTol', 'barometer tolerance', pa),
    },
    // The vessel's instruments read in the units its form was filled in.
    readingUnits: { pressure: f.pressureUnit, temperature: f.temperatureUnit, mass: f.massUnit },
  };
  if (Object.keys(errors).length) return { ok: false, errors };
  try {
    validateVessel(spec);
  } catch (e) {
    const field = e instanceof InputError ? ENGINE_FIELDS[e.field] ?? 'tag' : 'tag';
    return { ok: false, errors: { [field]: errorText(e, formFieldUnit(f, field), f[field]) } };
  }
  return { ok: true, spec };
}

/** The form for a stored vessel, values shown in the preferred units. */
export function formFromSpec(stored: object, u: UnitPrefs): VesselForm {
  const s = stored as VesselSpec;
  const g = s.geometry;
  const own = s.readingUnits;
  // The vessel's own instrument units when it has them, else the person's.
  const pu = own?.pressure ?? u.pressure, tu = own?.temperature ?? u.temperature, mu = own?.mass ?? u.mass;
  const n = (x: number) => formatEditable(x);
  const p = (x: number) => n(pressureFromPa(x, pu));
  const ins = s.instruments;
  const sensor = ins.temperatureSensor;
  return {
    tag: s.tag, description: s.description,
    shape: g.shape,
    diameterM: g.shape === 'stated-volume' ? '' : n(lengthFromM(g.innerDiameterM, u.length)),
    straightLengthM: g.shape === 'stated-volume' ? '' : n(lengthFromM(g.straightLengthM, u.length)),
    lengthUnit: u.length, diameterUnit: u.length, straightLengthUnit: u.length, elevationUnit: u.length,
    head: g.shape === 'stated-volume' ? 'semi-ellipsoidal-2-1' : g.head.kind,
    volume: g.shape === 'stated-volume' ? n(volumeFromM3(g.volumeM3, u.volume)) : '',
    volumeUnit: u.volume, volumeTolPercent: n(ins.volumeTolerancePercent),
    tare: n(massFromKg(s.tareKg, mu)), massUnit: mu, weightTol: n(massFromKg(ins.weightToleranceKg, mu)),
    pressureUnit: pu, mawp: p(s.mawpGaugePa), relief: p(s.reliefSetGaugePa),
    vacuumRated: s.vacuumRated ? 'yes' : 'no',
    gaugeSpan: p(ins.pressureGauge.spanPa), gaugeAccuracyPercent: n(ins.pressureGauge.accuracyPercentOfSpan),
    temperatureUnit: tu,
    designTemperature: n(temperatureFromK(s.designTemperatureK, tu)),
    ambientTemperature: n(temperatureFromK(s.ambientTemperatureK, tu)),
    sensor: sensor.kind === 'stated' ? 'stated' : sensor.sensorClass,
    sensorTol: sensor.kind === 'stated' ? n(temperatureDifferenceFromK(sensor.toleranceK, tu)) : '',
    atmosphereMode: 'pressure', elevationM: '', atmosphere: p(s.siteAtmospherePa),
    barometerTol: p(ins.barometerTolerancePa),
  };
}
