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
import { lengthUnitOf, type FormField, type LengthField, type VesselForm } from './vessel-form.ts';
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
  'crown radius': 'crownRadius', 'knuckle radius': 'knuckleRadius', 'relief set pressure tolerance': 'reliefTolPercent',
  'pressure gauge indicator': 'gaugeIndicatorPercent', 'pressure gauge drift': 'gaugeDriftPercent',
  'thermometer indicator tolerance': 'sensorIndicatorTol', 'thermometer drift': 'sensorDriftTol', 'tare tolerance': 'tareTol',
  'site elevation': 'elevationM',
};

/** The spec keys the editor owns; any other key of a stored spec (added by a later version or by plant sync) is kept as it was. */
const EDITOR_KEYS = [
  'tag', 'description', 'geometry', 'tareKg', 'mawpGaugePa', 'designTemperatureK', 'reliefSetGaugePa', 'vacuumRated',
  'siteAtmospherePa', 'ambientTemperatureK', 'instruments', 'reliefSetTolerancePercent', 'vacuumBreaker', 'service',
  'heating', 'readingUnits', 'entryUnits', 'siteElevationM',
] as const satisfies readonly (keyof VesselSpec)[];

/** The unit a vessel-form field is typed in, for restating the engine's SI range. */
function formFieldUnit(f: VesselForm, field: FormField): FieldUnit | undefined {
  switch (field) {
    case 'tare': case 'weightTol': case 'tareTol': return { kind: 'mass', unit: f.massUnit };
    case 'mawp': case 'relief': case 'atmosphere': case 'gaugeSpan': case 'barometerTol': return { kind: 'pressure', unit: f.pressureUnit };
    case 'designTemperature': case 'ambientTemperature': return { kind: 'temperature', unit: f.temperatureUnit };
    case 'diameterM': case 'straightLengthM': case 'elevationM': case 'crownRadius': case 'knuckleRadius': return { kind: 'length', unit: lengthUnitOf(f, field) };
    default: return undefined;
  }
}

/**
 * Builds the SI VesselSpec from the form, or names every field that cannot be read. `stored` is the
 * vessel being edited: keys of it the editor does not show are kept as they were. `opened` is the
 * form as the editor first showed that vessel (formFromSpec): a figure whose text and units are
 * still as shown keeps its stored value exactly, so opening and saving a vessel changes nothing
 * the six digits on screen would otherwise round (a psi gauge's 300 kPa MAWP stays 300 000 Pa).
 */
export function specFromForm(f: VesselForm, stored?: VesselSpec, opened?: VesselForm): SpecResult {
  const errors: Partial<Record<FormField, string>> = {};
  const read = (field: FormField, words: string, convert: (n: number) => number = (n) => n): number => {
    try { return convert(readNumber(f[field], words)); } catch (e) { errors[field] = errorText(e, formFieldUnit(f, field), f[field]); return NaN; }
  };
  // A blank optional field is absent from the spec (the engine's default applies).
  const optional = (field: FormField, words: string, convert: (n: number) => number = (n) => n): number | undefined =>
    String(f[field] ?? '').trim() === '' ? undefined : read(field, words, convert);
  const len = (field: LengthField) => (n: number) => lengthToM(n, lengthUnitOf(f, field));
  const crownRadiusM = f.head === 'torispherical' ? optional('crownRadius', 'crown radius', len('crownRadius')) : undefined;
  const knuckleRadiusM = f.head === 'torispherical' ? optional('knuckleRadius', 'knuckle radius', len('knuckleRadius')) : undefined;
  const head: HeadSpec = f.head === 'torispherical'
    ? { kind: 'torispherical', ...(crownRadiusM === undefined ? {} : { crownRadiusM }), ...(knuckleRadiusM === undefined ? {} : { knuckleRadiusM }) }
    : { kind: f.head };
  const geometry: VesselGeometry = f.shape === 'stated-volume'
    ? { shape: 'stated-volume', volumeM3: read('volume', 'internal volume', (v) => volumeToM3(v, f.volumeUnit)) }
    : { shape: f.shape, innerDiameterM: read('diameterM', 'inner diameter', len('diameterM')), straightLengthM: read('straightLengthM', 'straight length', len('straightLengthM')), head };
  const pa = (n: number) => pressureToPa(n, f.pressureUnit);
  const dT = (n: number) => temperatureDifferenceToK(n, f.temperatureUnit);
  const elevationM = f.atmosphereMode === 'elevation' ? read('elevationM', 'site elevation', len('elevationM')) : undefined;
  const gaugeIndicator = optional('gaugeIndicatorPercent', 'pressure gauge indicator');
  const gaugeDrift = optional('gaugeDriftPercent', 'pressure gauge drift');
  const sensorIndicator = optional('sensorIndicatorTol', 'thermometer indicator tolerance', dT);
  const sensorDrift = optional('sensorDriftTol', 'thermometer drift', dT);
  const reliefTol = optional('reliefTolPercent', 'relief set pressure tolerance');
  const spec: VesselSpec = {
    ...withoutEditorKeys(stored),
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
      pressureGauge: {
        spanPa: read('gaugeSpan', 'pressure gauge span', pa), accuracyPercentOfSpan: read('gaugeAccuracyPercent', 'pressure gauge accuracy'),
        ...(gaugeIndicator === undefined ? {} : { indicatorPercentOfSpan: gaugeIndicator }),
        ...(gaugeDrift === undefined ? {} : { driftPercentOfSpan: gaugeDrift }),
      },
      temperatureSensor: f.sensor === 'stated'
        ? { kind: 'stated', toleranceK: read('sensorTol', 'temperature sensor tolerance', dT) }
        : { kind: 'iec-60751', sensorClass: f.sensor },
      ...(sensorIndicator === undefined ? {} : { temperatureIndicatorToleranceK: sensorIndicator }),
      ...(sensorDrift === undefined ? {} : { temperatureDriftToleranceK: sensorDrift }),
      weightToleranceKg: read('weightTol', 'weight tolerance', (n) => massToKg(n, f.massUnit)),
      tare: f.tareKnown === 'stated'
        ? { kind: 'stated', toleranceKg: read('tareTol', 'tare tolerance', (n) => massToKg(n, f.massUnit)) }
        : { kind: 'weighed-like-gross' },
      volumeTolerancePercent: read('volumeTolPercent', 'volume tolerance'),
      barometerTolerancePa: f.atmosphereMode === 'elevation' ? 0 : read('barometerTol', 'barometer tolerance', pa),
    },
    ...(reliefTol === undefined ? {} : { reliefSetTolerancePercent: reliefTol }),
    vacuumBreaker: f.vacuumBreaker === 'yes',
    service: f.service ?? 'not-stated',
    heating: f.heating ?? 'not-stated',
    // The vessel's instruments read in the units its form was filled in; its dimensions open in the units they were typed in.
    readingUnits: { pressure: f.pressureUnit, temperature: f.temperatureUnit, mass: f.massUnit },
    entryUnits: {
      diameter: lengthUnitOf(f, 'diameterM'), straightLength: lengthUnitOf(f, 'straightLengthM'),
      crownRadius: lengthUnitOf(f, 'crownRadius'), knuckleRadius: lengthUnitOf(f, 'knuckleRadius'),
      elevation: lengthUnitOf(f, 'elevationM'), volume: f.volumeUnit,
    },
    ...(elevationM === undefined ? {} : { siteElevationM: elevationM }),
  };
  if (Object.keys(errors).length) return { ok: false, errors };
  try {
    validateVessel(spec);
  } catch (e) {
    const field = e instanceof InputError ? ENGINE_FIELDS[e.field] ?? 'tag' : 'tag';
    return { ok: false, errors: { [field]: errorText(e, formFieldUnit(f, field), f[field]) } };
  }
  const shown = stored && opened ? specFromForm(opened, stored) : undefined;
  return { ok: true, spec: shown?.ok ? keepUnchanged(spec, shown.spec, stored) : spec };
}

/** `built` with every number that equals what the opened form gave (`shown`) replaced by the stored one. */
function keepUnchanged<T>(built: T, shown: unknown, stored: unknown): T {
  if (typeof built === 'number') return (Object.is(built, shown) && typeof stored === 'number' ? stored : built) as T;
  const isRecord = (x: unknown): x is Record<string, unknown> => typeof x === 'object' && x !== null && !Array.isArray(x);
  if (!isRecord(built) || !isRecord(shown) || !isRecord(stored)) return built;
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(built)) out[k] = keepUnchanged(v, shown[k], stored[k]);
  return out as T;
}

/** The form for a stored vessel, values shown in the preferred units. */
export function formFromSpec(stored: object, u: UnitPrefs): VesselForm {
  const s = stored as VesselSpec;
  const g = s.geometry;
  const own = s.readingUnits;
  // The vessel's own instrument units when it has them, else the person's.
  const pu = own?.pressure ?? u.pressure, tu = own?.temperature ?? u.temperature, mu = own?.mass ?? u.mass;
  const n = (x: number) => formatEditable(x);
  const opt = (x: number | undefined, show: (x: number) => string = n) => (x === undefined ? '' : show(x));
  const p = (x: number) => n(pressureFromPa(x, pu));
  const dT = (x: number) => n(temperatureDifferenceFromK(x, tu));
  const ins = s.instruments;
  const sensor = ins.temperatureSensor;
  const e = s.entryUnits ?? {};
  const du = e.diameter ?? u.length, lu = e.straightLength ?? u.length, cu = e.crownRadius ?? u.length, ku = e.knuckleRadius ?? u.length;
  const eu = e.elevation ?? u.length, vu = e.volume ?? u.volume;
  const head = g.shape === 'stated-volume' ? undefined : g.head;
  const tori = head?.kind === 'torispherical' ? head : undefined;
  return {
    tag: s.tag, description: s.description,
    shape: g.shape,
    diameterM: g.shape === 'stated-volume' ? '' : n(lengthFromM(g.innerDiameterM, du)),
    straightLengthM: g.shape === 'stated-volume' ? '' : n(lengthFromM(g.straightLengthM, lu)),
    lengthUnit: u.length, diameterUnit: du, straightLengthUnit: lu, elevationUnit: eu, crownRadiusUnit: cu, knuckleRadiusUnit: ku,
    head: head?.kind ?? 'semi-ellipsoidal-2-1',
    crownRadius: opt(tori?.crownRadiusM, (x) => n(lengthFromM(x, cu))),
    knuckleRadius: opt(tori?.knuckleRadiusM, (x) => n(lengthFromM(x, ku))),
    volume: g.shape === 'stated-volume' ? n(volumeFromM3(g.volumeM3, vu)) : '',
    volumeUnit: vu, volumeTolPercent: n(ins.volumeTolerancePercent),
    tare: n(massFromKg(s.tareKg, mu)), massUnit: mu, weightTol: n(massFromKg(ins.weightToleranceKg, mu)),
    tareKnown: ins.tare?.kind === 'stated' ? 'stated' : 'weighed-like-gross',
    tareTol: ins.tare?.kind === 'stated' ? n(massFromKg(ins.tare.toleranceKg, mu)) : '',
    pressureUnit: pu, mawp: p(s.mawpGaugePa), relief: p(s.reliefSetGaugePa),
    reliefTolPercent: opt(s.reliefSetTolerancePercent),
    vacuumRated: s.vacuumRated ? 'yes' : 'no',
    vacuumBreaker: s.vacuumBreaker ? 'yes' : 'no',
    service: s.service ?? 'not-stated', heating: s.heating ?? 'not-stated',
    gaugeSpan: p(ins.pressureGauge.spanPa), gaugeAccuracyPercent: n(ins.pressureGauge.accuracyPercentOfSpan),
    gaugeIndicatorPercent: opt(ins.pressureGauge.indicatorPercentOfSpan), gaugeDriftPercent: opt(ins.pressureGauge.driftPercentOfSpan),
    temperatureUnit: tu,
    designTemperature: n(temperatureFromK(s.designTemperatureK, tu)),
    ambientTemperature: n(temperatureFromK(s.ambientTemperatureK, tu)),
    sensor: sensor.kind === 'stated' ? 'stated' : sensor.sensorClass,
    sensorTol: sensor.kind === 'stated' ? dT(sensor.toleranceK) : '',
    sensorIndicatorTol: opt(ins.temperatureIndicatorToleranceK, dT), sensorDriftTol: opt(ins.temperatureDriftToleranceK, dT),
    atmosphereMode: s.siteElevationM !== undefined ? 'elevation' : 'pressure',
    elevationM: opt(s.siteElevationM, (x) => n(lengthFromM(x, eu))),
    atmosphere: p(s.siteAtmospherePa),
    barometerTol: p(ins.barometerTolerancePa),
  };
}

/** A stored spec less the keys the editor writes itself. */
function withoutEditorKeys(stored: VesselSpec | undefined): Partial<VesselSpec> {
  if (!stored) return {};
  const rest: Partial<VesselSpec> = { ...stored };
  for (const k of EDITOR_KEYS) delete rest[k];
  return rest;
}
