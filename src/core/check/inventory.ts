// What is inside: from net mass, internal volume and temperature, the regime of the contents by
// IF97 (stateTV) and, when two-phase, the split into liquid and vapor (from the mass and volume
// balances m = m_f + m_g, V = m_f·v_f + m_g·v_g).
// Uses the measured T, not T_sat(p): with air present the two disagree and T governs the water.

import { InputError } from '../errors.ts';
import { IF97, stateTV, type VesselState } from '../steam/index.ts';
import { liquidLevelFromVolume, vesselLevelSpanM, type VesselGeometry } from './vessel-geometry.ts';

/** IF97's upper pressure limit for the liquid, Pa (IAPWS R7-97(2012), region 1). */
export const IF97_MAX_PRESSURE_PA = 100e6;

export type Inventory =
  | {
      regime: 'two-phase';
      netMassKg: number;
      /** v = V/m, m³/kg. */
      meanSpecificVolumeM3PerKg: number;
      /** p_sat(T), Pa: the pressure of the water alone. */
      saturationPressurePa: number;
      /** Bulk mixture quality x = m_vapor/m (not the dryness of supply steam). */
      quality: number;
      vaporMassKg: number;
      liquidMassKg: number;
      liquidVolumeM3: number;
      /** Vapor volume / internal volume. */
      vaporSpaceFraction: number;
      /** Quiescent liquid level from the geometry; null for a stated volume. */
      liquidLevel: { levelM: number; levelFraction: number } | null;
      /** Specific volumes of saturated liquid and vapor at T, m³/kg. */
      liquidSpecificVolumeM3PerKg: number;
      vaporSpecificVolumeM3PerKg: number;
    }
  | {
      regime: 'liquid-full';
      netMassKg: number;
      meanSpecificVolumeM3PerKg: number;
      /** The hydraulic pressure this fill reaches at T (rigid vessel). */
      hydraulic:
        | { withinFormulation: true; absolutePressurePa: number; gaugePressurePa: number; exceedsMawp: boolean }
        | { withinFormulation: false; /** Above IF97's limit, Pa. */ aboveAbsolutePressurePa: number; exceedsMawp: true };
    }
  | {
      regime: 'superheated';
      netMassKg: number;
      meanSpecificVolumeM3PerKg: number;
      /** Pressure this mass of vapor has at T in this volume, Pa. */
      absolutePressurePa: number;
      gaugePressurePa: number;
      /** That pressure minus the measured absolute pressure, Pa. */
      differenceFromReadingPa: number;
      /**
       * ± on that difference, Pa: the pressure instruments' band combined (RSS) with the effect of
       * the mass and volume limits on this pressure (p ∝ m/V for a dilute vapor, to first order).
       */
      differenceBandPa: number;
    };

/** The regime of v at T, with compressed liquid above IF97's 100 MPa reported rather than thrown. */
export type ContentsState = { kind: 'state'; state: VesselState } | { kind: 'beyond-100-MPa' };

/** stateTV that turns the steam engine's "compressed liquid above 100 MPa" InputError into a result. */
export function contentsState(temperatureK: number, specificVolumeM3PerKg: number): ContentsState {
  try {
    return { kind: 'state', state: stateTV(temperatureK, specificVolumeM3PerKg) };
  } catch (e) {
    if (e instanceof InputError && e.field === 'pressure' && e.problem === 'out-of-range' && specificVolumeM3PerKg < 1 / IF97.rhoc) {
      return { kind: 'beyond-100-MPa' };
    }
    throw e;
  }
}

/**
 * Inventory of a closed vessel. temperatureK 273.16–647.096 K; netMassKg > 0; volumeM3 > 0;
 * mawpGaugePa and atmospherePa in Pa; measuredAbsolutePressurePa in Pa. Throws InputError only
 * if v = V/m is outside the steam engine's range.
 */
export function inventoryOf(args: {
  geometry: VesselGeometry;
  volumeM3: number;
  netMassKg: number;
  temperatureK: number;
  atmospherePa: number;
  mawpGaugePa: number;
  measuredAbsolutePressurePa: number;
  /** ± on the measured absolute pressure, Pa (instrument band); 0 if unknown. */
  measuredPressureBandPa?: number;
  /** ± relative limits of the net mass and of the volume (fractions); 0 if unknown. */
  massRelativeTolerance?: number;
  volumeRelativeTolerance?: number;
}): Inventory {
  const { geometry, volumeM3: V, netMassKg: m, temperatureK: T, atmospherePa } = args;
  const v = V / m;
  const found = contentsState(T, v);
  if (found.kind === 'beyond-100-MPa') {
    return {
      regime: 'liquid-full',
      netMassKg: m,
      meanSpecificVolumeM3PerKg: v,
      hydraulic: { withinFormulation: false, aboveAbsolutePressurePa: IF97_MAX_PRESSURE_PA, exceedsMawp: true },
    };
  }
  const s = found.state;
  if (s.phase === 'two-phase') {
    const vaporMassKg = s.x * m;
    const liquidMassKg = m - vaporMassKg;
    const liquidVolumeM3 = liquidMassKg * s.liquid.v;
    const liquidLevel =
      geometry.shape === 'stated-volume'
        ? null
        : (() => {
            const levelM = liquidLevelFromVolume(geometry, Math.min(Math.max(liquidVolumeM3, 0), V));
            return { levelM, levelFraction: levelM / vesselLevelSpanM(geometry) };
          })();
    return {
      regime: 'two-phase',
      netMassKg: m,
      meanSpecificVolumeM3PerKg: v,
      saturationPressurePa: s.p,
      quality: s.x,
      vaporMassKg,
      liquidMassKg,
      liquidVolumeM3,
      vaporSpaceFraction: (vaporMassKg * s.vapor.v) / V,
      liquidLevel,
      liquidSpecificVolumeM3PerKg: s.liquid.v,
      vaporSpecificVolumeM3PerKg: s.vapor.v,
    };
  }
  // A supercritical answer below T_c means a dense single phase; v decides which side it behaves like.
  const liquidLike = s.phase === 'compressed-liquid' || (s.phase === 'supercritical' && v < 1 / IF97.rhoc);
  if (liquidLike) {
    const gauge = s.p - atmospherePa;
    return {
      regime: 'liquid-full',
      netMassKg: m,
      meanSpecificVolumeM3PerKg: v,
      hydraulic: { withinFormulation: true, absolutePressurePa: s.p, gaugePressurePa: gauge, exceedsMawp: gauge > args.mawpGaugePa },
    };
  }
  return {
    regime: 'superheated',
    netMassKg: m,
    meanSpecificVolumeM3PerKg: v,
    absolutePressurePa: s.p,
    gaugePressurePa: s.p - atmospherePa,
    differenceFromReadingPa: s.p - args.measuredAbsolutePressurePa,
    differenceBandPa: Math.hypot(
      args.measuredPressureBandPa ?? 0,
      s.p * (args.massRelativeTolerance ?? 0),
      s.p * (args.volumeRelativeTolerance ?? 0),
    ),
  };
}
