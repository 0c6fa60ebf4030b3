// State of water in a closed rigid vessel from temperature and specific volume (v = V/m).
// Below Tc: two-phase (x, p = p_s) when v_f ≤ v ≤ v_g; otherwise the single-phase pressure
// that gives v at T, solved on the basic equations (never interpolated):
//   region 1 liquid:  v(T, p) = v, Newton with bisection on p ∈ [p_s(T), 100 MPa];
//   region 2 vapor:   v(T, p) = v, Newton with bisection on π = p/1 MPa;
//   region 3:         Eq. (28) takes ρ = 1/v directly, so p needs no solving.
// A liquid-full vessel can need a very high pressure: above 100 MPa (IF97's limit) the answer is
// an InputError for 'pressure', which the check engine turns into a DANGER.
import { InputError } from '../errors.ts';
import * as constants from './constants.ts';
import * as b23 from './b23.ts';
import type { PhaseState, VesselState } from './phase-state.ts';
import * as region1 from './region1.ts';
import * as region2 from './region2.ts';
import * as region3 from './region3.ts';
import * as region3Density from './region3-density.ts';
import * as saturationModule from './saturation.ts';
import * as saturationLine from './saturation-line.ts';
import * as solvers from './solvers.ts';

// The imports are read once into module constants: a bundler joins modules into one scope,
// but Vitest's module runner (which runs the tests and the benchmark) turns every use of an
// imported binding into a getter call, ~10 ns each on the 2-core CI machine.
const { IF97, P_MAX, T_13, T_B23_MAX, T_MAX, T_MIN } = constants;
const { b23Pressure } = b23;
const { G1, region1PressureDerivatives, region1State, region1Volume, region1VolumeSlope } = region1;
const { G2, region2PressureDerivatives, region2State, region2Volume } = region2;
const { P3, region3Pressure, region3State } = region3;
const { region3SaturatedDensitySeeds, SEED3 } = region3Density;
const { saturationUnchecked } = saturationModule;
const { saturationPressureUnchecked } = saturationLine;
const { solveBracketed } = solvers;

/** Largest specific volume accepted (m³/kg); keeps p = R·T/v above stateTP's 1e-6 Pa floor. */
export const V_MAX = 1e9;

/**
 * Below this v (m³/kg) stateTV checks the liquid side first: v_f ≤ 1.75e-3 and v_g ≥ 8.8e-3
 * m³/kg up to 623.15 K, so either choice is only a matter of speed.
 */
const LIQUID_SIDE_BELOW = 5e-3;

/** Density above which a region 3 state is certainly above 100 MPa (kg/m³), with 0.1 % margin. */
const RHO_3_MAX = 1.001 / region1Volume(T_13, P_MAX);

// The temperature and target of the current solve (module scope: no closure per call).
let solveT = 0;
let solveV = 0;
let solveC = 0;

const R1_P_STAR = 16.53e6;
function region1Residual(p: number, out: Float64Array): void {
  region1PressureDerivatives(solveT, p);
  const RT = IF97.R * solveT;
  out[0] = (RT * (G1[1] as number)) / R1_P_STAR - solveV;
  out[1] = (RT * (G1[2] as number)) / (R1_P_STAR * R1_P_STAR);
}

/** H(π) = π·c − (1 + π·γʳ_π), c = v / (R·T / 1 MPa): zero where region 2 gives v; H(0) = −1. */
function region2VolumeResidual(pi: number, out: Float64Array): void {
  region2PressureDerivatives(solveT, pi * 1e6);
  const grp = G2[1] as number;
  out[0] = pi * solveC - 1 - pi * grp;
  out[1] = solveC - grp - pi * (G2[2] as number);
}

/** The state at (T, v) needs more than 100 MPa; `estimatePa` is the best lower bound known. */
function pressureTooHigh(T: number, v: number, estimatePa: number): InputError {
  return new InputError('pressure', 'out-of-range', estimatePa, { min: 0, max: P_MAX, unit: 'Pa' },
    `pressure: water at ${T} K with ${v} m³/kg would be above ${P_MAX} Pa, the upper limit of IAPWS-IF97 ` +
      '(a liquid-full vessel).');
}

/** Region 1 liquid at T whose volume is v, knowing v < v(T, pLow). */
function compressedLiquid1(T: number, v: number, pLow: number, vLow: number): PhaseState {
  const vHigh = region1Volume(T, P_MAX);
  if (v < vHigh) {
    const slope = (IF97.R * T * (G1[2] as number)) / (R1_P_STAR * R1_P_STAR);
    const estimate = P_MAX + (v - vHigh) / slope;
    // Within rounding of v at 100 MPa (a liquid's v hardly moves with p) it is 100 MPa.
    if (estimate <= P_MAX * (1 + 1e-9)) return region1State(T, P_MAX);
    throw pressureTooHigh(T, v, estimate);
  }
  solveT = T;
  solveV = v;
  const fLo = vLow - v;
  const fHi = vHigh - v;
  const x0 = pLow + (fLo * (P_MAX - pLow)) / (fLo - fHi);
  const p = solveBracketed(region1Residual, pLow, fLo, P_MAX, fHi, x0, 2e-16 * v, 1e-15);
  return region1State(T, p);
}

/**
 * The same liquid, faster: Newton's method from the tangent at saturation (slopeLow =
 * (∂v/∂p)_T there). A liquid's v(p) is decreasing and convex, so the iterates climb to the root
 * from below; past 100 MPa, or if they ever fail to settle, the bracketed solve above decides.
 */
function compressedLiquid1Fast(T: number, v: number, pLow: number, vLow: number, slopeLow: number): PhaseState {
  const RT = IF97.R * T;
  let p = pLow + (v - vLow) / slopeLow;
  for (let k = 0; k < 12 && p <= P_MAX; k++) {
    region1PressureDerivatives(T, p);
    const f = (RT * (G1[1] as number)) / R1_P_STAR - v;
    if (Math.abs(f) <= 4e-16 * v) return region1State(T, p);
    const step = f / ((RT * (G1[2] as number)) / (R1_P_STAR * R1_P_STAR));
    p -= step;
    // Quadratic convergence: after a step this small the error is far below v's rounding.
    if (Math.abs(step) <= 1e-10 * p) return region1State(T, p);
  }
  return compressedLiquid1(T, v, pLow, vLow);
}

/** Region 2 vapor at T whose volume is v, knowing v ≥ v(T, pHigh). */
function vapor2(T: number, v: number, pHigh: number, vHigh: number): PhaseState {
  solveT = T;
  solveC = (v * 1e6) / (IF97.R * T);
  const piHigh = pHigh * 1e-6;
  // H(πHigh) = πHigh·c·(1 − vHigh/v) ≥ 0 because v ≥ vHigh.
  const fHi = piHigh * solveC * (1 - vHigh / v);
  const pi = solveBracketed(region2VolumeResidual, 0, -1, piHigh, fHi, 1 / solveC, 1e-14, 1e-15);
  return region2State(T, pi * 1e6);
}

/** Region 3 state with density 1/v at T; throws above 100 MPa. */
function direct3(T: number, v: number): PhaseState {
  const rho = 1 / v;
  if (rho > RHO_3_MAX) throw pressureTooHigh(T, v, P_MAX);
  region3Pressure(rho, T);
  const p = P3[0] as number;
  if (!(p <= P_MAX * (1 + 1e-9))) throw pressureTooHigh(T, v, p);
  return region3State(rho, T, Math.min(p, P_MAX), v);
}

/** Region 2 above 623.15 K: the vapor beyond B23, or region 3 below it. */
function vaporOrDense(T: number, v: number): PhaseState {
  if (T > T_B23_MAX) {
    const vHigh = region2Volume(T, P_MAX);
    if (v < vHigh) throw pressureTooHigh(T, v, P_MAX);
    return vapor2(T, v, P_MAX, vHigh);
  }
  const pB = b23Pressure(T);
  const vB = region2Volume(T, pB);
  return v >= vB ? vapor2(T, v, pB, vB) : direct3(T, v);
}

/**
 * State of water in a closed rigid vessel at temperature T with specific volume v (V/m).
 * Two-phase when v_f ≤ v ≤ v_g below Tc; otherwise compressed liquid, superheated vapor or
 * (T ≥ 647.096 K) supercritical, with the pressure solved so the state has exactly this v.
 * @param T temperature, K; 273.15 ≤ T ≤ 1073.15
 * @param v specific volume, m³/kg; 0 < v ≤ 1e9
 * @throws InputError 'temperature' or 'specific volume' outside those ranges; 'pressure'
 *   (out-of-range) when the state would need more than 100 MPa (a liquid-full vessel)
 */
export function stateTV(T: number, v: number): VesselState {
  if (!(T >= T_MIN && T <= T_MAX)) {
    throw new InputError('temperature', Number.isFinite(T) ? 'out-of-range' : 'not-a-number', T,
      { min: T_MIN, max: T_MAX, unit: 'K' });
  }
  if (!(v > 0 && v <= V_MAX)) {
    throw new InputError('specific volume', Number.isFinite(v) ? 'out-of-range' : 'not-a-number', v,
      { min: 0, max: V_MAX, unit: 'm³/kg' });
  }
  if (T >= IF97.Tc) return single('supercritical', vaporOrDense(T, v));
  // Single-phase states are classified before the full saturation state is built: one side of
  // the dome is enough to know v is outside it.
  if (T <= T_13) {
    const ps = saturationPressureUnchecked(T);
    if (v < LIQUID_SIDE_BELOW) {
      const vf = region1Volume(T, ps);
      if (v < vf) return single('compressed-liquid', compressedLiquid1Fast(T, v, ps, vf, region1VolumeSlope(T)));
    } else {
      const vg = region2Volume(T, ps);
      if (v > vg) return single('superheated-vapor', vapor2(T, v, ps, vg));
    }
  } else {
    // Seeds are within 3e-4 of v_f, v_g; a 1e-3 margin makes the shortcut safe.
    region3SaturatedDensitySeeds(T);
    if (v * (SEED3[0] as number) < 1 - 1e-3) return single('compressed-liquid', direct3(T, v));
    if (v * (SEED3[1] as number) > 1 + 1e-3) return single('superheated-vapor', vaporOrDense(T, v));
  }
  const sat = saturationUnchecked(T);
  const f = sat.liquid;
  const g = sat.vapor;
  if (v < f.v) {
    return single('compressed-liquid', T <= T_13 ? compressedLiquid1(T, v, sat.p, f.v) : direct3(T, v));
  }
  if (v > g.v) {
    return single('superheated-vapor', T <= T_13 ? vapor2(T, v, sat.p, g.v) : vaporOrDense(T, v));
  }
  const span = g.v - f.v;
  // span is 0 only within ~5e-5 K of Tc, where v_f = v_g = v.
  const x = span > 0 ? Math.min(1, Math.max(0, (v - f.v) / span)) : 0;
  return {
    phase: 'two-phase',
    T,
    p: sat.p,
    v,
    x,
    h: f.h + x * (g.h - f.h),
    u: f.u + x * (g.u - f.u),
    s: f.s + x * (g.s - f.s),
    liquid: f,
    vapor: g,
  };
}

function single(phase: 'compressed-liquid' | 'superheated-vapor' | 'supercritical', state: PhaseState): VesselState {
  return {
    phase,
    T: state.T,
    p: state.p,
    v: state.v,
    h: state.h,
    u: state.u,
    s: state.s,
    cp: state.cp,
    cv: state.cv,
    w: state.w,
    region: state.region,
  };
}
