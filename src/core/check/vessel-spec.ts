// What the inventory stores about one vessel, in SI, and the rules a stored vessel must satisfy.
// The store persists VesselSpec as-is, so it is plain data: no classes, no functions.

import { InputError, requireInRange } from '../errors.ts';
import { validateGeometry, type VesselGeometry } from './vessel-geometry.ts';
import { isMassUnit, type MassUnit } from '../units/mass.ts';
import { isPressureUnit, type PressureUnit } from '../units/pressure.ts';
import { isTemperatureUnit, type TemperatureUnit } from '../units/temperature.ts';
import type { InstrumentUse } from '../instrument/instrument-use.ts';
import { isLengthUnit, type LengthUnit } from '../units/length.ts';
import { isVolumeUnit, type VolumeUnit } from '../units/volume.ts';
import { ELEVATION_RANGE_M } from '../units/atmosphere.ts';

/** The units the vessel's own instruments show: its gauge's dial, its thermometer, its scale. */
export interface ReadingUnits {
  pressure: PressureUnit;
  temperature: TemperatureUnit;
  mass: MassUnit;
}

/** Temperature sensor tolerance: an IEC 60751 platinum RTD class, or a stated ± limit. */
export type TemperatureSensorTolerance =
  | { kind: 'iec-60751'; sensorClass: 'AA' | 'A' | 'B' }
  | { kind: 'stated'; toleranceK: number };

/**
 * How the tare is known. Weighed on the same scale the way the gross is: its error is another
 * reading's, independent of the gross (combined root-sum-square, √2 × the weight tolerance). A
 * nameplate or historic tare is systematic: its own ± limit, combined with one weight reading.
 */
export type TareTolerance = { kind: 'weighed-like-gross' } | { kind: 'stated'; toleranceKg: number };

/** Instrument accuracies, each a ± limit (the edge of a rectangular distribution). */
export interface InstrumentAccuracy {
  /**
   * Pressure gauge or transmitter: span (full scale minus zero), Pa, and accuracy class, % of span;
   * optionally a separate indicator (display, recorder) and the drift allowed since calibration,
   * both % of span (0 when absent).
   */
  pressureGauge: { spanPa: number; accuracyPercentOfSpan: number; indicatorPercentOfSpan?: number; driftPercentOfSpan?: number };
  temperatureSensor: TemperatureSensorTolerance;
  /** ± limit of the thermometer's indicator or transmitter, K, beside the element's class; 0 when absent. */
  temperatureIndicatorToleranceK?: number;
  /** ± drift allowed since the thermometer's calibration, K; 0 when absent. */
  temperatureDriftToleranceK?: number;
  /** ± limit of one weight reading, kg: at least the scale or load-cell resolution; include piping restraint. */
  weightToleranceKg: number;
  /** How the tare is known; absent: weighed like the gross. */
  tare?: TareTolerance;
  /** ± limit of the internal volume, % of volume (dimensions, internals, straight flanges). */
  volumeTolerancePercent: number;
  /** ± limit of a measured atmospheric (barometer) reading, Pa. */
  barometerTolerancePa: number;
}

/** One vessel as the inventory stores it. Pressures marked Gauge are relative to the atmosphere. */
export interface VesselSpec {
  /** Plant tag, non-empty. */
  tag: string;
  description: string;
  geometry: VesselGeometry;
  /** Empty, dry weight on the vessel's scale, kg. */
  tareKg: number;
  /** Maximum allowable working pressure, gauge, Pa. */
  mawpGaugePa: number;
  /** Design (maximum) temperature, K. */
  designTemperatureK: number;
  /** Relief (safety) valve set pressure, gauge, Pa; at most the MAWP. */
  reliefSetGaugePa: number;
  /** Rated for full vacuum (external pressure). */
  vacuumRated: boolean;
  /** Site atmospheric (station) pressure, Pa; the UI resolves an elevation to this. */
  siteAtmospherePa: number;
  /** Surroundings the vessel cools (or warms) to when idle, K. */
  ambientTemperatureK: number;
  instruments: InstrumentAccuracy;
  /** ± limit of the relief valve's set pressure, % of set; absent: 3 % (common practice). */
  reliefSetTolerancePercent?: number;
  /** A vacuum breaker is fitted (a vessel not rated for vacuum is then protected while it works); absent: none. */
  vacuumBreaker?: boolean;
  /** What the vessel is used for; some hazards belong to one service. Absent: not stated. */
  service?: VesselService;
  /** How the vessel is heated; absent: not stated. */
  heating?: VesselHeating;
  /**
   * The units its instruments read in, so a check starts in them; the engine computes in SI and
   * does not use them. Absent on vessels saved before they existed.
   */
  readingUnits?: ReadingUnits;
  /**
   * The units the vessel's dimensions were typed in, so the editor opens them as they were typed;
   * the engine does not use them. Absent on vessels saved before they existed (then the person's).
   */
  entryUnits?: EntryUnits;
  /**
   * The site as it was given, when it was given as an elevation: geometric metres above mean sea
   * level (siteAtmospherePa is the US Standard Atmosphere 1976 pressure there). Absent when the site
   * was given as a pressure. The engine does not use it.
   */
  siteElevationM?: number;
  /**
   * On a check's copy of the vessel: the register instruments whose limits replaced the typed
   * gauge and thermometer figures above (vesselWithInstruments). Absent on a vessel record, and on
   * checks saved before the register or on vessels without one.
   */
  instrumentsUsed?: InstrumentUse[];
}

/** Each dimension's unit as typed in the vessel editor (each absent: the person's length or volume unit). */
export interface EntryUnits {
  diameter?: LengthUnit;
  straightLength?: LengthUnit;
  crownRadius?: LengthUnit;
  knuckleRadius?: LengthUnit;
  elevation?: LengthUnit;
  volume?: VolumeUnit;
}

/** Vessel services the hazards know (the brief's list of closed vessels). */
export const VESSEL_SERVICES = ['steriliser', 'flash-tank', 'condensate-receiver', 'process-vessel', 'not-stated'] as const;
export type VesselService = (typeof VESSEL_SERVICES)[number];
/** Ways a vessel is heated. */
export const VESSEL_HEATINGS = ['steam-jacket', 'steam-coil', 'direct-steam', 'electric', 'unheated', 'not-stated'] as const;
export type VesselHeating = (typeof VESSEL_HEATINGS)[number];

/** The relief valve set-pressure tolerance a vessel without its own is given, % of set (±3 %, common practice). */
export const DEFAULT_RELIEF_SET_TOLERANCE_PERCENT = 3;

/** Whether the vessel takes steam into a jacket, a coil or its contents (hot surfaces, water hammer). */
export function isSteamHeated(vessel: VesselSpec): boolean {
  return vessel.heating === 'steam-jacket' || vessel.heating === 'steam-coil' || vessel.heating === 'direct-steam';
}

/** Valid ranges, SI. Atmosphere: every inhabited elevation up to the 108.38 kPa record high (1083.8 hPa, Agata, 31 Dec 1968: WMO Weather and Climate Extremes Archive, https://wmo.asu.edu/content/world-highest-sea-level-air-pressure-below-700m). */
export const VESSEL_LIMITS = {
  tareKg: { min: 0, max: 1e6, unit: 'kg' },
  mawpGaugePa: { min: 0, max: 100e6, unit: 'Pa' },
  designTemperatureK: { min: 273.15, max: 1073.15, unit: 'K' },
  siteAtmospherePa: { min: 30e3, max: 110e3, unit: 'Pa' },
  ambientTemperatureK: { min: 223.15, max: 333.15, unit: 'K' },
  gaugeSpanPa: { min: 0, max: 100e6, unit: 'Pa' },
  gaugeAccuracyPercent: { min: 0, max: 10, unit: '% of span' },
  temperatureToleranceK: { min: 0, max: 50, unit: 'K' },
  weightToleranceKg: { min: 0, max: 1e5, unit: 'kg' },
  volumeTolerancePercent: { min: 0, max: 50, unit: '%' },
  barometerTolerancePa: { min: 0, max: 10e3, unit: 'Pa' },
  gaugeIndicatorPercent: { min: 0, max: 10, unit: '% of span' },
  gaugeDriftPercent: { min: 0, max: 10, unit: '% of span' },
  temperatureIndicatorToleranceK: { min: 0, max: 50, unit: 'K' },
  temperatureDriftToleranceK: { min: 0, max: 50, unit: 'K' },
  tareToleranceKg: { min: 0, max: 1e5, unit: 'kg' },
  reliefSetTolerancePercent: { min: 0, max: 10, unit: '% of set' },
} as const;

/**
 * Throws InputError naming the first field that is empty, not a number, out of range, or
 * inconsistent with another (relief set pressure above MAWP; geometry that does not close).
 */
export function validateVessel(spec: VesselSpec): void {
  const L = VESSEL_LIMITS;
  if (typeof spec.tag !== 'string' || spec.tag.trim() === '') throw new InputError('tag', 'empty', String(spec.tag ?? ''));
  validateGeometry(spec.geometry);
  inRange('tare weight', spec.tareKg, L.tareKg);
  if (!Number.isFinite(spec.mawpGaugePa)) throw new InputError('MAWP', 'not-a-number', spec.mawpGaugePa, L.mawpGaugePa);
  if (spec.mawpGaugePa <= 0 || spec.mawpGaugePa > L.mawpGaugePa.max) {
    throw new InputError('MAWP', 'out-of-range', spec.mawpGaugePa, L.mawpGaugePa,
      `MAWP: ${spec.mawpGaugePa} Pa (gauge) is outside the valid range; it must be above 0 and at most ${L.mawpGaugePa.max} Pa.`);
  }
  inRange('design temperature', spec.designTemperatureK, L.designTemperatureK);
  const relief = spec.reliefSetGaugePa;
  const reliefRange = { min: 0, max: spec.mawpGaugePa, unit: 'Pa' };
  if (!Number.isFinite(relief)) throw new InputError('relief set pressure', 'not-a-number', relief, reliefRange);
  if (relief <= 0) {
    throw new InputError('relief set pressure', 'out-of-range', relief, reliefRange,
      `relief set pressure: ${relief} Pa (gauge) must be above 0 and at most the MAWP (${spec.mawpGaugePa} Pa).`);
  }
  if (relief > spec.mawpGaugePa) {
    // ASME BPVC Section VIII Div. 1 UG-134(a): a single device may not be set above MAWP (2019 and
    // earlier editions; from the 2021 edition these rules are in Section XIII, from memory).
    throw new InputError('relief set pressure', 'inconsistent', relief, reliefRange,
      `relief set pressure: ${relief} Pa (gauge) is above the MAWP (${spec.mawpGaugePa} Pa); it must be at most the MAWP.`);
  }
  if (typeof spec.vacuumRated !== 'boolean') throw new InputError('vacuum rating', 'empty', String(spec.vacuumRated));
  inRange('site atmospheric pressure', spec.siteAtmospherePa, L.siteAtmospherePa);
  inRange('ambient temperature', spec.ambientTemperatureK, L.ambientTemperatureK);
  const ins = spec.instruments;
  inRange('pressure gauge span', ins.pressureGauge.spanPa, L.gaugeSpanPa);
  if (ins.pressureGauge.spanPa === 0) {
    throw new InputError('pressure gauge span', 'out-of-range', 0, L.gaugeSpanPa, 'pressure gauge span: must be above 0 Pa.');
  }
  inRange('pressure gauge accuracy', ins.pressureGauge.accuracyPercentOfSpan, L.gaugeAccuracyPercent);
  const sensor = ins.temperatureSensor;
  if (sensor.kind === 'stated') inRange('temperature sensor tolerance', sensor.toleranceK, L.temperatureToleranceK);
  else if (sensor.kind !== 'iec-60751' || !['AA', 'A', 'B'].includes(sensor.sensorClass)) {
    throw new InputError('temperature sensor class', 'out-of-range', String((sensor as { sensorClass?: unknown }).sensorClass), undefined,
      'temperature sensor class: must be IEC 60751 class AA, A or B, or a stated tolerance in K.');
  }
  inRange('weight tolerance', ins.weightToleranceKg, L.weightToleranceKg);
  inRange('volume tolerance', ins.volumeTolerancePercent, L.volumeTolerancePercent);
  inRange('barometer tolerance', ins.barometerTolerancePa, L.barometerTolerancePa);
  const u = spec.readingUnits;
  if (u !== undefined && (typeof u !== 'object' || u === null || !isPressureUnit(u.pressure) || !isTemperatureUnit(u.temperature) || !isMassUnit(u.mass))) {
    throw new InputError('instrument units', 'out-of-range', JSON.stringify(u), undefined,
      'instrument units: the gauge, thermometer and scale units must each be one of the app\'s units.');
  }
  const e = spec.entryUnits;
  if (e !== undefined) {
    const lengths = [e?.diameter, e?.straightLength, e?.crownRadius, e?.knuckleRadius, e?.elevation];
    if (typeof e !== 'object' || e === null || lengths.some((x) => x !== undefined && !isLengthUnit(x)) || (e.volume !== undefined && !isVolumeUnit(e.volume))) {
      throw new InputError('dimension units', 'out-of-range', JSON.stringify(e), undefined,
        'dimension units: each length and the volume must be typed in one of the app\'s units.');
    }
  }
  optionalInRange('site elevation', spec.siteElevationM, { ...ELEVATION_RANGE_M, unit: 'm' });
  // Fields added after the first release are optional, so vessels stored before them still validate.
  optionalInRange('pressure gauge indicator', ins.pressureGauge.indicatorPercentOfSpan, L.gaugeIndicatorPercent);
  optionalInRange('pressure gauge drift', ins.pressureGauge.driftPercentOfSpan, L.gaugeDriftPercent);
  optionalInRange('thermometer indicator tolerance', ins.temperatureIndicatorToleranceK, L.temperatureIndicatorToleranceK);
  optionalInRange('thermometer drift', ins.temperatureDriftToleranceK, L.temperatureDriftToleranceK);
  const tare = ins.tare;
  if (tare !== undefined) {
    if (tare?.kind === 'stated') inRange('tare tolerance', tare.toleranceKg, L.tareToleranceKg);
    else if (tare?.kind !== 'weighed-like-gross') {
      throw new InputError('tare tolerance', 'out-of-range', String((tare as { kind?: unknown } | null)?.kind), undefined,
        'tare tolerance: say whether the tare was weighed like the gross or give its own ± limit in kg.');
    }
  }
  optionalInRange('relief set pressure tolerance', spec.reliefSetTolerancePercent, L.reliefSetTolerancePercent);
  if (spec.vacuumBreaker !== undefined && typeof spec.vacuumBreaker !== 'boolean') throw new InputError('vacuum breaker', 'empty', String(spec.vacuumBreaker));
  if (spec.service !== undefined && !(VESSEL_SERVICES as readonly unknown[]).includes(spec.service)) {
    throw new InputError('service', 'out-of-range', String(spec.service), undefined, `service: must be one of ${VESSEL_SERVICES.join(', ')}.`);
  }
  if (spec.heating !== undefined && !(VESSEL_HEATINGS as readonly unknown[]).includes(spec.heating)) {
    throw new InputError('heating', 'out-of-range', String(spec.heating), undefined, `heating: must be one of ${VESSEL_HEATINGS.join(', ')}.`);
  }
}

function optionalInRange(field: string, value: number | undefined, r: { min: number; max: number; unit: string }): void {
  if (value !== undefined) inRange(field, value, r);
}

function inRange(field: string, value: number, r: { min: number; max: number; unit: string }): void {
  requireInRange(field, value, r.min, r.max, r.unit);
}
