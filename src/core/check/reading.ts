// One check's readings, in SI, and their resolution against the vessel: gauge → absolute with the
// measured or site atmosphere, gross → net with the tare.

import { InputError, requireInRange } from '../errors.ts';
import { SATURATION_PRESSURE_MIN } from '../steam/index.ts';
import { VESSEL_LIMITS, type VesselSpec } from './vessel-spec.ts';

/** What the technician read on one vessel at one time. */
export interface Reading {
  /** ISO 8601 date-time with a UTC offset or Z, e.g. 2026-03-14T09:30:00+01:00. */
  time: string;
  /** Measured temperature, K. */
  temperatureK: number;
  /** Measured pressure, Pa, gauge (relative to the atmosphere) or absolute. */
  pressure: { reference: 'gauge' | 'absolute'; pressurePa: number };
  /** A barometer reading taken with this check, Pa; overrides the vessel's site atmosphere. */
  atmospherePa?: number;
  /** Scale reading: gross (tare is subtracted), net contents, or not weighed. */
  weight: { kind: 'gross'; grossKg: number } | { kind: 'net'; netKg: number } | { kind: 'not-weighed' };
}

/** A reading resolved against its vessel, SI. */
export interface ResolvedReading {
  time: string;
  temperatureK: number;
  absolutePressurePa: number;
  gaugePressurePa: number;
  atmospherePa: number;
  atmosphereSource: 'measured' | 'site';
  /** Net contents, kg, or null when not weighed. */
  netMassKg: number | null;
}

/**
 * IF97 bounds the check relies on (IAPWS R7-97(2012): regions 1 and 4 start at 273.15 K, so a
 * typed 0.00 °C is inside them; the triple point is 273.16 K, 611.657 Pa; critical point
 * 647.096 K, 22.064 MPa).
 */
export const READING_LIMITS = {
  temperatureK: { min: 273.15, max: 647.096, unit: 'K' },
  /** From p_s(273.15 K) = 611.213 Pa, the lowest pressure on IF97's saturation line, to the critical pressure. */
  absolutePressurePa: { min: SATURATION_PRESSURE_MIN, max: 22.064e6, unit: 'Pa' },
  weightKg: { min: 0, max: 1e7, unit: 'kg' },
} as const;

const ISO_8601_WITH_OFFSET = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:\d{2})$/;

/**
 * Validates a reading against its (already valid) vessel and resolves it. Throws InputError naming
 * the field: time (ISO 8601 with offset), temperature (273.15–647.096 K), atmospheric pressure
 * (30–110 kPa), pressure (absolute 611.213 Pa–22.064 MPa; a gauge vacuum may not exceed the
 * atmosphere), gross weight (above the tare), net weight (above 0).
 */
export function resolveReading(vessel: VesselSpec, reading: Reading): ResolvedReading {
  if (typeof reading.time !== 'string' || !ISO_8601_WITH_OFFSET.test(reading.time) || !Number.isFinite(Date.parse(reading.time))) {
    throw new InputError('time', reading.time ? 'out-of-range' : 'empty', String(reading.time ?? ''), undefined,
      `time: "${String(reading.time ?? '')}" is not an ISO 8601 date-time with a UTC offset (e.g. 2026-03-14T09:30:00+01:00).`);
  }
  const T = READING_LIMITS.temperatureK;
  requireInRange('temperature', reading.temperatureK, T.min, T.max, T.unit);

  let atmospherePa = vessel.siteAtmospherePa;
  let atmosphereSource: ResolvedReading['atmosphereSource'] = 'site';
  if (reading.atmospherePa !== undefined) {
    const A = VESSEL_LIMITS.siteAtmospherePa;
    atmospherePa = requireInRange('atmospheric pressure', reading.atmospherePa, A.min, A.max, A.unit);
    atmosphereSource = 'measured';
  }

  const P = READING_LIMITS.absolutePressurePa;
  const given = reading.pressure?.pressurePa;
  let absolutePressurePa: number;
  if (reading.pressure?.reference === 'gauge') {
    const range = { min: P.min - atmospherePa, max: P.max - atmospherePa, unit: 'Pa' };
    if (!Number.isFinite(given)) throw new InputError('pressure (gauge)', 'not-a-number', given, range);
    if (given <= -atmospherePa) {
      throw new InputError('pressure (gauge)', 'out-of-range', given, range,
        `pressure (gauge): a vacuum of ${-given} Pa is beyond the atmosphere (${atmospherePa} Pa); the absolute pressure would be at or below zero. Valid range: ${range.min} to ${range.max} Pa gauge.`);
    }
    if (given < range.min || given > range.max) throw new InputError('pressure (gauge)', 'out-of-range', given, range);
    absolutePressurePa = given + atmospherePa;
  } else if (reading.pressure?.reference === 'absolute') {
    if (!Number.isFinite(given)) throw new InputError('pressure (absolute)', 'not-a-number', given, P);
    if (given <= 0) {
      throw new InputError('pressure (absolute)', 'out-of-range', given, P,
        `pressure (absolute): ${given} Pa is at or below zero. Valid range: ${P.min} to ${P.max} Pa.`);
    }
    absolutePressurePa = requireInRange('pressure (absolute)', given, P.min, P.max, P.unit);
  } else {
    throw new InputError('pressure reference', 'empty', String(reading.pressure?.reference ?? ''), undefined,
      'pressure reference: say whether the pressure is gauge or absolute.');
  }

  const W = READING_LIMITS.weightKg;
  let netMassKg: number | null = null;
  const weight = reading.weight;
  if (weight?.kind === 'gross') {
    requireInRange('gross weight', weight.grossKg, W.min, W.max, W.unit);
    if (weight.grossKg <= vessel.tareKg) {
      throw new InputError('gross weight', 'inconsistent', weight.grossKg, { min: vessel.tareKg, max: W.max, unit: 'kg' },
        `gross weight: ${weight.grossKg} kg is at or below the tare (${vessel.tareKg} kg); the vessel would hold no water. It must be above the tare.`);
    }
    netMassKg = weight.grossKg - vessel.tareKg;
  } else if (weight?.kind === 'net') {
    requireInRange('net weight', weight.netKg, W.min, W.max, W.unit);
    if (weight.netKg <= 0) {
      throw new InputError('net weight', 'out-of-range', weight.netKg, W, `net weight: must be above 0 kg (valid range: above 0 to ${W.max} kg).`);
    }
    netMassKg = weight.netKg;
  } else if (weight?.kind !== 'not-weighed') {
    throw new InputError('weight', 'empty', String((weight as { kind?: unknown } | undefined)?.kind ?? ''), undefined,
      'weight: give a gross weight, a net weight, or mark the check as not weighed.');
  }

  return {
    time: reading.time,
    temperatureK: reading.temperatureK,
    absolutePressurePa,
    gaugePressurePa: absolutePressurePa - atmospherePa,
    atmospherePa,
    atmosphereSource,
    netMassKg,
  };
}
