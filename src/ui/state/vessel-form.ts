// The vessel editor's fields exactly as typed, with the units chosen beside them.
import type { LengthUnit, MassUnit, PressureUnit, TemperatureUnit, VolumeUnit } from '../../core/basics.ts';
import { isLengthUnit } from '../../core/basics.ts';
import type { HeadKind, SensorChoice, Shape } from './vessel-spec.ts';
import type { VesselHeating, VesselService } from '../../core/check/vessel-spec.ts';
import type { UnitPrefs } from './settings-model.ts';
import type { IntervalUnit } from './check-interval.ts';

export interface VesselForm {
  tag: string;
  description: string;
  shape: Shape;
  // The field names keep their old "M" so drafts saved by earlier versions still fill them; the text
  // is in `lengthUnit` (metres when a draft predates it, see formLengthUnit).
  diameterM: string;
  straightLengthM: string;
  /** The length unit of a draft saved before each length had its own (then every length was in it). */
  lengthUnit: LengthUnit;
  /** Each length field's own unit: picking mm for the diameter changes nothing else. */
  diameterUnit?: LengthUnit;
  straightLengthUnit?: LengthUnit;
  elevationUnit?: LengthUnit;
  crownRadiusUnit?: LengthUnit;
  knuckleRadiusUnit?: LengthUnit;
  head: HeadKind;
  /** A torispherical head's crown and knuckle radii; both blank: standard F&D proportions. */
  crownRadius: string;
  knuckleRadius: string;
  volume: string;
  volumeUnit: VolumeUnit;
  volumeTolPercent: string;
  tare: string;
  massUnit: MassUnit;
  weightTol: string;
  pressureUnit: PressureUnit;
  mawp: string;
  relief: string;
  vacuumRated: 'yes' | 'no';
  vacuumBreaker: 'yes' | 'no';
  /** ± % of set; blank: the engine's ±3 % (common practice). */
  reliefTolPercent: string;
  service: VesselService;
  heating: VesselHeating;
  gaugeSpan: string;
  gaugeAccuracyPercent: string;
  /** Blank: none (0). */
  gaugeIndicatorPercent: string;
  gaugeDriftPercent: string;
  temperatureUnit: TemperatureUnit;
  designTemperature: string;
  ambientTemperature: string;
  sensor: SensorChoice;
  sensorTol: string;
  /** The thermometer's indicator and drift limits, ± in the temperature unit; blank: none. */
  sensorIndicatorTol: string;
  sensorDriftTol: string;
  /** How the tare is known: weighed like the gross, or a nameplate or historic figure with its own ±. */
  tareKnown: 'weighed-like-gross' | 'stated';
  tareTol: string;
  atmosphereMode: 'elevation' | 'pressure';
  elevationM: string;
  atmosphere: string;
  barometerTol: string;
  /** The check interval as typed, and its unit (absent in a draft saved before issue 14: none). */
  checkEvery?: string;
  checkEveryUnit?: IntervalUnit;
}

/** The typed fields (the per-field length units are not typed text). */
export type FormField = Exclude<keyof VesselForm, 'diameterUnit' | 'straightLengthUnit' | 'elevationUnit' | 'crownRadiusUnit' | 'knuckleRadiusUnit' | 'checkEvery' | 'checkEveryUnit'>;

/** A new vessel's form: common values filled in where the trade has a usual default. */
export function emptyVesselForm(u: UnitPrefs, siteAtmosphere: { elevationM?: string; pressureText?: string }): VesselForm {
  const us = u.temperature === 'degF' || u.temperature === 'degR';
  return {
    tag: '', description: '', shape: 'vertical-cylinder', diameterM: '', straightLengthM: '', lengthUnit: u.length,
    diameterUnit: u.length, straightLengthUnit: u.length, elevationUnit: u.length, crownRadiusUnit: u.length, knuckleRadiusUnit: u.length,
    head: 'semi-ellipsoidal-2-1', crownRadius: '', knuckleRadius: '',
    volume: '', volumeUnit: u.volume, volumeTolPercent: '2',
    tare: '', massUnit: u.mass, weightTol: '',
    pressureUnit: u.pressure, mawp: '', relief: '', vacuumRated: 'no', vacuumBreaker: 'no', reliefTolPercent: '3',
    service: 'not-stated', heating: 'not-stated', gaugeSpan: '', gaugeAccuracyPercent: '1', gaugeIndicatorPercent: '', gaugeDriftPercent: '',
    temperatureUnit: u.temperature, designTemperature: '', ambientTemperature: us ? '68' : '20',
    sensor: 'B', sensorTol: '', sensorIndicatorTol: '', sensorDriftTol: '', tareKnown: 'weighed-like-gross', tareTol: '',
    atmosphereMode: siteAtmosphere.elevationM !== undefined ? 'elevation' : 'pressure',
    elevationM: siteAtmosphere.elevationM ?? '', atmosphere: siteAtmosphere.pressureText ?? '',
    barometerTol: '0',
  };
}

/** The form's length unit; a draft saved before the field existed was typed in metres. */
export function formLengthUnit(f: VesselForm): LengthUnit {
  return isLengthUnit(f.lengthUnit) ? f.lengthUnit : 'm';
}

export type LengthField = 'diameterM' | 'straightLengthM' | 'elevationM' | 'crownRadius' | 'knuckleRadius';
type LengthUnitKey = 'diameterUnit' | 'straightLengthUnit' | 'elevationUnit' | 'crownRadiusUnit' | 'knuckleRadiusUnit';
const UNIT_OF: Record<LengthField, LengthUnitKey> = {
  diameterM: 'diameterUnit', straightLengthM: 'straightLengthUnit', elevationM: 'elevationUnit',
  crownRadius: 'crownRadiusUnit', knuckleRadius: 'knuckleRadiusUnit',
};

/** The unit one length field is typed in: its own, else the form's older shared one. */
export function lengthUnitOf(f: VesselForm, field: LengthField): LengthUnit {
  const own = f[UNIT_OF[field]];
  return isLengthUnit(own) ? own : formLengthUnit(f);
}

/** The change that sets one length field's unit (and only that one). */
export function lengthUnitChange(field: LengthField, unit: LengthUnit): Partial<VesselForm> {
  return { [UNIT_OF[field]]: unit };
}

export const SHAPES: readonly { id: Shape; label: string }[] = [
  { id: 'vertical-cylinder', label: 'Vertical cylinder' },
  { id: 'horizontal-cylinder', label: 'Horizontal cylinder' },
  { id: 'stated-volume', label: 'Volume only (no level)' },
];

export const HEADS: readonly { id: HeadKind; label: string }[] = [
  { id: 'semi-ellipsoidal-2-1', label: '2:1 semi-ellipsoidal' },
  { id: 'torispherical', label: 'Torispherical (standard F&D)' },
  { id: 'hemispherical', label: 'Hemispherical' },
  { id: 'flat', label: 'Flat' },
];

export const SENSORS: readonly { id: SensorChoice; label: string }[] = [
  { id: 'AA', label: 'RTD, IEC 60751 class AA' },
  { id: 'A', label: 'RTD, IEC 60751 class A' },
  { id: 'B', label: 'RTD, IEC 60751 class B' },
  { id: 'stated', label: 'Stated tolerance' },
];

export const SERVICES: readonly { id: VesselService; label: string }[] = [
  { id: 'not-stated', label: 'Not stated' },
  { id: 'steriliser', label: 'Steriliser or autoclave chamber' },
  { id: 'flash-tank', label: 'Flash tank' },
  { id: 'condensate-receiver', label: 'Condensate receiver' },
  { id: 'process-vessel', label: 'Process vessel' },
];

export const HEATINGS: readonly { id: VesselHeating; label: string }[] = [
  { id: 'not-stated', label: 'Not stated' },
  { id: 'steam-jacket', label: 'Steam jacket' },
  { id: 'steam-coil', label: 'Steam coil' },
  { id: 'direct-steam', label: 'Steam into the contents' },
  { id: 'electric', label: 'Electric' },
  { id: 'unheated', label: 'Not heated' },
];

export const TARE_KNOWN: readonly { id: VesselForm['tareKnown']; label: string }[] = [
  { id: 'weighed-like-gross', label: 'Weighed on this scale, like the gross' },
  { id: 'stated', label: 'From the nameplate or records (its own ±)' },
];
