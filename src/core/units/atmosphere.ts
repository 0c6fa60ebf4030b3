// The atmosphere a gauge reads against, and the explicit step between gauge and absolute pressure.
//
// A Bourdon gauge reads relative to the air around it, so absolute = gauge + local atmospheric
// pressure. The local atmosphere is always an argument here: a fixed "14.7 psi" overstates the
// absolute pressure by about 17 kPa at 1 500 m, which moves the saturation temperature at 121 °C by
// close to 3 K — the size of a failed sterilisation hold.
import { InputError } from '../errors.ts';
import { requireFinite } from './unit-info.ts';

/** The standard atmosphere, exactly 101 325 Pa (NIST SP 811 (2008) App. B.8, "atmosphere, standard (atm)", exact). */
export const STANDARD_ATMOSPHERE_PA = 101325;

/**
 * Atmospheric pressures a vessel's surroundings can have: above the 11 km top of the elevation model
 * (22.7 kPa) and the highest sea-level pressure on record (108.38 kPa, WMO archive). A value outside
 * this is almost always a unit slip (101.325 typed as Pa, or as psi).
 */
export const ATMOSPHERE_RANGE_PA = { min: 20_000, max: 110_000 } as const;

/**
 * U.S. Standard Atmosphere, 1976 (NOAA/NASA/USAF, Washington DC 1976), lowest layer (troposphere,
 * geopotential altitude 0 to 11 km'), the constants as the document fixes them. The same below 32 km
 * as the ICAO/ISO 2533 standard atmosphere.
 */
export const US_STANDARD_ATMOSPHERE_1976 = {
  /** sea-level pressure, Pa */
  p0: 101325,
  /** sea-level temperature, K */
  T0: 288.15,
  /** temperature lapse rate in the troposphere, K per geopotential metre */
  lapseRate: 0.0065,
  /** standard gravity, m/s² (also the geopotential metre's definition) */
  g0: 9.80665,
  /** mean molar mass of sea-level air, kg/mol */
  molarMass: 0.0289644,
  /** the gas constant as the 1976 standard fixes it, J/(mol·K); not today's CODATA value */
  gasConstant: 8.31432,
  /** effective Earth radius r0 for geometric ↔ geopotential altitude, m (the standard's eq. 19) */
  earthRadius: 6356766,
  /** top of the layer, geopotential m' */
  tropopauseGeopotential: 11000,
} as const;

/** Elevations atmosphereFromElevation accepts, geometric metres above mean sea level. */
export const ELEVATION_RANGE_M = { min: -500, max: 11000 } as const;

const { p0, T0, lapseRate: L, g0, molarMass: M, gasConstant: R, earthRadius: r0 } = US_STANDARD_ATMOSPHERE_1976;
/** g0·M/(R*·L) = 5.255 876… */
const EXPONENT = (g0 * M) / (R * L);

/** Geopotential altitudes atmosphereFromGeopotentialAltitude accepts, m'. */
export const GEOPOTENTIAL_ALTITUDE_RANGE_M = { min: -500, max: 11000 } as const;

/** The troposphere formula itself, in geopotential metres; callers check the range. */
function troposphere(geopotentialM: number): number {
  return p0 * Math.pow(1 - (L * geopotentialM) / T0, EXPONENT);
}

/** The standard's H = r0·Z/(r0 + Z): geopotential from geometric altitude (eq. 19). */
function geopotentialFromGeometric(elevationM: number): number {
  return (r0 * elevationM) / (r0 + elevationM);
}

/**
 * Standard atmospheric pressure at a site elevation, Pa: U.S. Standard Atmosphere 1976, troposphere,
 * p = p0 · (1 − L·H/T0)^(g0·M/(R*·L))  (the standard's eq. 33a, written with L as a positive lapse rate).
 *
 * The input is geometric elevation (what a map, a survey or GPS gives, metres above mean sea level).
 * The formula is written in geopotential altitude H, so the elevation Z is converted first by the
 * standard's H = r0·Z/(r0 + Z). The difference is small (1.7 Pa at 1 000 m) but converting keeps the
 * result on the standard's geometric-altitude table, which is the one a site elevation is looked up in.
 *
 * This is the standard atmosphere, not today's weather: the real pressure at a site moves by about
 * ±3 kPa. Use a measured barometric (station, not sea-level-reduced) pressure where there is one.
 * @param elevationM geometric elevation, −500 m to 11 000 m.
 * @throws InputError 'not-a-number' or 'out-of-range' naming "site elevation".
 */
export function atmosphereFromElevation(elevationM: number): number {
  const field = 'site elevation';
  requireFinite(field, elevationM);
  if (elevationM < ELEVATION_RANGE_M.min || elevationM > ELEVATION_RANGE_M.max) {
    throw new InputError(field, 'out-of-range', elevationM, { ...ELEVATION_RANGE_M, unit: 'm' });
  }
  return troposphere(geopotentialFromGeometric(elevationM));
}

/**
 * Standard atmospheric pressure at a geopotential altitude, Pa (the same formula without the
 * geometric-to-geopotential step; the standard's layer table is in geopotential metres).
 * @param geopotentialM geopotential altitude, −500 m' to 11 000 m' (the top of the troposphere).
 * @throws InputError 'not-a-number' or 'out-of-range' naming "geopotential altitude".
 */
export function atmosphereFromGeopotentialAltitude(geopotentialM: number): number {
  const field = 'geopotential altitude';
  requireFinite(field, geopotentialM);
  if (geopotentialM < GEOPOTENTIAL_ALTITUDE_RANGE_M.min || geopotentialM > GEOPOTENTIAL_ALTITUDE_RANGE_M.max) {
    throw new InputError(field, 'out-of-range', geopotentialM, { ...GEOPOTENTIAL_ALTITUDE_RANGE_M, unit: 'm' });
  }
  return troposphere(geopotentialM);
}

/**
 * The geometric elevation, m, at which the 1976 standard atmosphere has pressure `atmospherePa`
 * (the inverse of atmosphereFromElevation).
 * @param atmospherePa between the standard pressures at 11 000 m and −500 m (about 22.7 kPa to 107.5 kPa).
 * @throws InputError 'not-a-number' or 'out-of-range' naming "atmospheric pressure".
 */
export function elevationFromAtmosphere(atmospherePa: number): number {
  const field = 'atmospheric pressure';
  requireFinite(field, atmospherePa);
  const min = troposphere(geopotentialFromGeometric(ELEVATION_RANGE_M.max));
  const max = troposphere(geopotentialFromGeometric(ELEVATION_RANGE_M.min));
  if (atmospherePa < min || atmospherePa > max) {
    throw new InputError(field, 'out-of-range', atmospherePa, { min, max, unit: 'Pa' });
  }
  const geopotentialM = (T0 / L) * (1 - Math.pow(atmospherePa / p0, 1 / EXPONENT));
  return (r0 * geopotentialM) / (r0 - geopotentialM);
}

/**
 * Absolute pressure from a gauge reading and the local atmospheric pressure, Pa.
 * @param gaugePa finite; negative for a vacuum, but not below −atmospherePa.
 * @param atmospherePa the local (station) atmospheric pressure, 20 000 to 110 000 Pa. No default on purpose.
 * @throws InputError naming "atmospheric pressure" when it is outside its range, or "gauge pressure"
 *   when the reading is not finite or is a vacuum at or beyond the whole atmosphere (absolute ≤ 0).
 */
export function absoluteFromGauge(gaugePa: number, atmospherePa: number): number {
  requireAtmosphere(atmospherePa);
  requireFinite('gauge pressure', gaugePa);
  const absolutePa = gaugePa + atmospherePa;
  if (!(absolutePa > 0)) {
    throw new InputError('gauge pressure', 'out-of-range', gaugePa,
      { min: -atmospherePa, max: Number.POSITIVE_INFINITY, unit: 'Pa' },
      `gauge pressure: ${gaugePa} Pa is a vacuum at or beyond the whole atmosphere (${atmospherePa} Pa); ` +
        `a gauge cannot read below −${atmospherePa} Pa.`);
  }
  return absolutePa;
}

/**
 * Gauge pressure from an absolute pressure and the local atmospheric pressure, Pa (negative below the atmosphere).
 * @param absolutePa finite, > 0.
 * @param atmospherePa the local (station) atmospheric pressure, 20 000 to 110 000 Pa. No default on purpose.
 * @throws InputError naming "atmospheric pressure" or "absolute pressure" when out of range.
 */
export function gaugeFromAbsolute(absolutePa: number, atmospherePa: number): number {
  requireAtmosphere(atmospherePa);
  requireFinite('absolute pressure', absolutePa);
  if (!(absolutePa > 0)) {
    throw new InputError('absolute pressure', 'out-of-range', absolutePa,
      { min: 0, max: Number.POSITIVE_INFINITY, unit: 'Pa' },
      `absolute pressure: ${absolutePa} Pa is not above zero; an absolute pressure is always positive.`);
  }
  return absolutePa - atmospherePa;
}

function requireAtmosphere(atmospherePa: number): void {
  const field = 'atmospheric pressure';
  requireFinite(field, atmospherePa);
  if (atmospherePa < ATMOSPHERE_RANGE_PA.min || atmospherePa > ATMOSPHERE_RANGE_PA.max) {
    throw new InputError(field, 'out-of-range', atmospherePa, { ...ATMOSPHERE_RANGE_PA, unit: 'Pa' });
  }
}
