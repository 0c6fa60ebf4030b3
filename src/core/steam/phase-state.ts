// Shapes of the steam engine's results. All SI: T K, p Pa, v m³/kg, h u J/kg, s cp cv J/(kg·K), w m/s.

/** The IF97 region whose basic equation produced a single-phase state (region 5 is not implemented). */
export type SteamRegion = 1 | 2 | 3;

/** One single-phase state. T K, p Pa, v m³/kg, h u J/kg, s cp cv J/(kg·K), w m/s. */
export interface PhaseState {
  T: number;
  p: number;
  v: number;
  h: number;
  u: number;
  s: number;
  cp: number;
  cv: number;
  w: number;
  region: SteamRegion;
}

/** Saturated liquid and vapor at one temperature (T K, p = p_sat Pa). */
export interface SaturationState {
  T: number;
  p: number;
  liquid: PhaseState;
  vapor: PhaseState;
}

/**
 * State of water in a closed rigid vessel, found from (T, v).
 * 'supercritical' is used for every T at or above the critical temperature 647.096 K.
 */
export type VesselState =
  | {
      phase: 'two-phase';
      T: number;
      p: number;
      v: number;
      /** Vapor mass fraction, 0 ≤ x ≤ 1. */
      x: number;
      h: number;
      u: number;
      s: number;
      liquid: PhaseState;
      vapor: PhaseState;
    }
  | ({ phase: 'compressed-liquid' | 'superheated-vapor' | 'supercritical' } & PhaseState);
