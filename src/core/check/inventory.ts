// What is inside: from net mass, internal volume and temperature, the regime of the contents by
// IF97 (stateTV) and, when two-phase, the split into liquid and vapor (from the mass and volume
// balances m = m_f + m_g, V = m_f·v_f + m_g·v_g).
// Uses the measured T, not T_sat(p): with air present the two disagree and T governs the water.

import { InputError } from '../errors.ts';
import { IF97, saturation, stateTP, stateTV, type VesselState } from '../steam/index.ts';
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
      /** Within the weight, temperature and volume limits the contents could be liquid-full (the quality band reaches 0); set with the bands. */
      liquidFullWithinBand: boolean;
    }
  | {
      regime: 'liquid-full';
      netMassKg: number;
      meanSpecificVolumeM3PerKg: number;
      /** The hydraulic pressure this fill reaches at T (rigid vessel). */
      hydraulic: Hydraulic;
      /**
       * Within the weight, volume and temperature limits the contents could also be two-phase
       * (the band on v = V/m reaches v_f(T)): "liquid-full within the weighing band", not certain.
       */
      withinWeighingBand: boolean;
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

/** Whether the hydraulic pressure of a liquid-full fill is above the MAWP: for every fill within the limits, for some, or for none. */
export type MawpVerdict = 'certain' | 'possible' | 'no';

/**
 * The hydraulic pressure of a liquid-full fill, and its band. A liquid's pressure at fixed
 * volume is steep in v (±0.5 kg on 208 kg moved one example from 0.66 to 9.34 MPa), so the band
 * is the pressure at the two ends of the band on v, not a ± about the nominal.
 */
export type Hydraulic =
  | { withinFormulation: true; absolutePressurePa: number; gaugePressurePa: number; exceedsMawp: MawpVerdict; band: HydraulicBand }
  | { withinFormulation: false; /** The nominal fill is above IF97's limit, Pa. */ aboveAbsolutePressurePa: number; exceedsMawp: Exclude<MawpVerdict, 'no'>; band: HydraulicBand };

export interface HydraulicBand {
  /**
   * Relative half-width of the band on v = V/m: the net mass, volume and (as an equivalent volume
   * change, α·ΔT with α the liquid's thermal expansion) temperature limits, root-sum-square.
   */
  specificVolumeRelative: number;
  /** Pressure at the high-v end, Pa absolute: the lowest the fill can be; p_sat(T) when that end is two-phase; null when even it is beyond IF97's 100 MPa. */
  lowAbsolutePa: number | null;
  /** Pressure at the low-v end, Pa absolute; null beyond IF97's 100 MPa ("beyond the formulation"). */
  highAbsolutePa: number | null;
  /**
   * Net masses that would make the MAWP verdict certain at this temperature and volume: above
   * exceedsMawpAboveKg every fill within the limits is over the MAWP; below withinMawpBelowKg none
   * is. null where no such mass exists within IF97 (a MAWP above its 100 MPa, or at or below
   * p_sat(T), where any liquid-full fill is over it).
   */
  massWindow: { exceedsMawpAboveKg: number | null; withinMawpBelowKg: number | null };
}

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
 * Inventory of a closed vessel. temperatureK 273.15–647.096 K; netMassKg > 0; volumeM3 > 0;
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
  /** ± limit of the temperature, K; 0 if unknown. */
  temperatureToleranceK?: number;
  /** levelSolver(geometry), when the caller shares it with the level band (its solves then start from this level); one of its own otherwise. */
  levelAt?: (volumeM3: number) => number;
}): Inventory {
  const { geometry, volumeM3: V, netMassKg: m, temperatureK: T, atmospherePa } = args;
  const v = V / m;
  const found = contentsState(T, v);
  if (found.kind === 'beyond-100-MPa') {
    const band = hydraulicBand(args, v);
    return {
      regime: 'liquid-full',
      netMassKg: m,
      meanSpecificVolumeM3PerKg: v,
      hydraulic: {
        withinFormulation: false,
        aboveAbsolutePressurePa: IF97_MAX_PRESSURE_PA,
        exceedsMawp: band.lowAbsolutePa === null || band.lowAbsolutePa - atmospherePa > args.mawpGaugePa ? 'certain' : 'possible',
        band,
      },
      withinWeighingBand: band.lowAbsolutePa !== null && band.lowAbsolutePa <= saturationPressureOf(T),
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
            const liquidM3 = Math.min(Math.max(liquidVolumeM3, 0), V);
            const levelM = args.levelAt ? args.levelAt(liquidM3) : liquidLevelFromVolume(geometry, liquidM3);
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
      liquidFullWithinBand: false,
    };
  }
  // A supercritical answer below T_c means a dense single phase; v decides which side it behaves like.
  const liquidLike = s.phase === 'compressed-liquid' || (s.phase === 'supercritical' && v < 1 / IF97.rhoc);
  if (liquidLike) {
    const gauge = s.p - atmospherePa;
    const band = hydraulicBand(args, v);
    const mawp = args.mawpGaugePa;
    const exceedsMawp: MawpVerdict = band.lowAbsolutePa === null || band.lowAbsolutePa - atmospherePa > mawp ? 'certain'
      : band.highAbsolutePa !== null && band.highAbsolutePa - atmospherePa <= mawp ? 'no' : 'possible';
    return {
      regime: 'liquid-full',
      netMassKg: m,
      meanSpecificVolumeM3PerKg: v,
      hydraulic: { withinFormulation: true, absolutePressurePa: s.p, gaugePressurePa: gauge, exceedsMawp, band },
      withinWeighingBand: band.lowAbsolutePa !== null && band.lowAbsolutePa <= saturationPressureOf(T),
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

type InventoryArgs = Parameters<typeof inventoryOf>[0];

function saturationPressureOf(T: number): number {
  return saturation(T).p;
}

/** The pressure at (T, v) if liquid-full, Pa absolute; p_sat(T) if (T, v) is two-phase; null above IF97's 100 MPa. */
function liquidPressureAt(T: number, v: number): number | null {
  const found = contentsState(T, v);
  return found.kind === 'state' ? found.state.p : null;
}

/**
 * The band of a liquid-full fill's hydraulic pressure and the mass window of a certain MAWP verdict
 * (see HydraulicBand). α = (1/v)(∂v/∂T)_p by a central difference at the fill's own pressure (or at
 * 100 MPa beyond IF97), so a temperature limit counts as the volume change it stands for.
 */
function hydraulicBand(args: InventoryArgs, v: number): HydraulicBand {
  const T = args.temperatureK;
  const m = args.netMassKg;
  const V = args.volumeM3;
  const dT = args.temperatureToleranceK ?? 0;
  const p = liquidPressureAt(T, v) ?? IF97_MAX_PRESSURE_PA;
  const h = 0.05;
  const lo = Math.max(273.15, T - h);
  const hi = Math.min(IF97.Tc, T + h);
  // At the fill's own pressure, kept a hair above saturation at the upper temperature so both ends are liquid.
  const pAt = Math.min(Math.max(p, saturationPressureOf(hi) * (1 + 1e-6)), IF97_MAX_PRESSURE_PA);
  const alpha = (stateTP(hi, pAt).v - stateTP(lo, pAt).v) / ((hi - lo) * v);
  const massRel = args.massRelativeTolerance ?? 0;
  const volumeRel = args.volumeRelativeTolerance ?? 0;
  const delta = Math.hypot(massRel, volumeRel, Math.abs(alpha) * dT);
  const lowAbsolutePa = liquidPressureAt(T, v * (1 + delta));
  const highAbsolutePa = liquidPressureAt(T, v * (1 - delta));
  // The mass window: the fill whose band end just reaches the MAWP, at this T and V.
  const pMawp = args.mawpGaugePa + args.atmospherePa;
  const pSat = saturationPressureOf(T);
  const massTol = massRel * m;
  let exceedsMawpAboveKg: number | null = null;
  let withinMawpBelowKg: number | null = null;
  if (pMawp <= IF97_MAX_PRESSURE_PA) {
    const vMawp = pMawp <= pSat ? saturation(T).liquid.v : stateTP(T, pMawp).v;
    // δ depends on m through the mass limit; two passes settle it (the mass limit is absolute).
    const rel = (mass: number) => Math.hypot(massTol / mass, volumeRel, Math.abs(alpha) * dT);
    let above = V / vMawp;
    let below = V / vMawp;
    for (let k = 0; k < 3; k++) {
      above = (V * (1 + rel(above))) / vMawp;
      below = (V * (1 - rel(below))) / vMawp;
    }
    exceedsMawpAboveKg = above;
    withinMawpBelowKg = pMawp <= pSat ? null : below;
  }
  return { specificVolumeRelative: delta, lowAbsolutePa, highAbsolutePa, massWindow: { exceedsMawpAboveKg, withinMawpBelowKg } };
}
