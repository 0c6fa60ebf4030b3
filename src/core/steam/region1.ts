// Region 1 (compressed and saturated liquid, 273.15 K ≤ T ≤ 623.15 K, p_s(T) ≤ p ≤ 100 MPa):
// the dimensionless Gibbs free energy γ(π, τ) of IAPWS R7-97(2012), Eq. (7), and the
// properties of Table 3 derived from it.
import { IF97 } from './constants.ts';
import type { PhaseState } from './phase-state.ts';
import { buildPowerPlan, runPowerPlan } from './power-plan.ts';

/**
 * IAPWS R7-97(2012), Table 2: region 1 coefficients n_i and exponents I_i, J_i of Eq. (7),
 * dimensionless. Reducing quantities: p* = 16.53 MPa, T* = 1386 K.
 */
const I = [0, 0, 0, 0, 0, 0, 0, 0, 1, 1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 3, 3, 3, 4, 4, 4, 5, 8, 8, 21,
  23, 29, 30, 31, 32] as const;
const J = [-2, -1, 0, 1, 2, 3, 4, 5, -9, -7, -1, 0, 1, 3, -3, 0, 1, 3, 17, -4, 0, 6, -5, -2, 10,
  -8, -11, -6, -29, -31, -38, -39, -40, -41] as const;
const n = [
  0.14632971213167, -0.84548187169114, -0.37563603672040e1, 0.33855169168385e1,
  -0.95791963387872, 0.15772038513228, -0.16616417199501e-1, 0.81214629983568e-3,
  0.28319080123804e-3, -0.60706301565874e-3, -0.18990068218419e-1, -0.32529748770505e-1,
  -0.21841717175414e-1, -0.52838357969930e-4, -0.47184321073267e-3, -0.30001780793026e-3,
  0.47661393906987e-4, -0.44141845330846e-5, -0.72694996297594e-15, -0.31679644845054e-4,
  -0.28270797985312e-5, -0.85205128120103e-9, -0.22425281908000e-5, -0.65171222895601e-6,
  -0.14341729937924e-12, -0.40516996860117e-6, -0.12734301741641e-8, -0.17424871230634e-9,
  -0.68762131295531e-18, 0.14478307828521e-19, 0.26335781662795e-22, -0.11947622640071e-22,
  0.18228094581404e-23, -0.93537087292458e-25,
] as const;

const P_STAR = 16.53e6; // Pa
const T_STAR = 1386; // K
const TERMS = n.length;

// Per-term weights, so each term is one product t_i = n_i·a^I·b^J and every derivative is a
// weighted sum of the same t_i (a = 7.1 − π and b = τ − 1.222 are never 0 inside region 1).
const N_ = Float64Array.from(n);
const W_I = Float64Array.from(I);
const W_II = Float64Array.from(I, (i) => i * (i - 1));
const W_J = Float64Array.from(J);
const W_JJ = Float64Array.from(J, (j) => j * (j - 1));
const W_IJ = Float64Array.from(I, (i, k) => i * (J[k] as number));
// Powers a^I in A_POW; b^J for J ≥ 0 and (1/b)^−J for J < 0 side by side in B_BUF.
const A_PLAN = buildPowerPlan(I);
const B_PLAN = buildPowerPlan(J.filter((j) => j >= 0));
const BN_PLAN = buildPowerPlan(J.filter((j) => j < 0).map((j) => -j));
const A_POW = new Float64Array(A_PLAN.size);
const B_BUF = new Float64Array(BN_PLAN.size + B_PLAN.size);
const BN_POW = B_BUF.subarray(0, BN_PLAN.size);
const BP_POW = B_BUF.subarray(BN_PLAN.size);
const IDX_I = Int32Array.from(I);
const IDX_J = Int32Array.from(J, (j) => (j < 0 ? -j : BN_PLAN.size + j));

/** Scratch output of region1Gibbs: [γ, γ_π, γ_ππ, γ_τ, γ_ττ, γ_πτ, π, τ]. */
export const G1 = new Float64Array(8);

/** Fills G1 with γ and its derivatives at (T K, p Pa). No range checks, no allocation. */
export function region1Gibbs(T: number, p: number): void {
  const pi = p / P_STAR;
  const tau = T_STAR / T;
  const a = 7.1 - pi;
  const b = tau - 1.222;
  const ib = 1 / b;
  runPowerPlan(A_PLAN, a, A_POW);
  runPowerPlan(B_PLAN, b, BP_POW);
  runPowerPlan(BN_PLAN, ib, BN_POW);
  let g = 0, gp = 0, gpp = 0, gt = 0, gtt = 0, gpt = 0;
  for (let k = 0; k < TERMS; k++) {
    const t = (N_[k] as number) * (A_POW[IDX_I[k] as number] as number) * (B_BUF[IDX_J[k] as number] as number);
    g += t;
    gp += (W_I[k] as number) * t;
    gpp += (W_II[k] as number) * t;
    gt += (W_J[k] as number) * t;
    gtt += (W_JJ[k] as number) * t;
    gpt += (W_IJ[k] as number) * t;
  }
  const ia = 1 / a;
  G1[0] = g;
  G1[1] = -gp * ia;
  G1[2] = gpp * ia * ia;
  G1[3] = gt * ib;
  G1[4] = gtt * ib * ib;
  G1[5] = -gpt * ia * ib;
  G1[6] = pi;
  G1[7] = tau;
}

/** Specific volume (m³/kg) of region 1 at (T K, p Pa), Table 3; no range checks. */
export function region1Volume(T: number, p: number): number {
  region1Gibbs(T, p);
  return (IF97.R * T * (G1[1] as number)) / P_STAR;
}

/** (∂v/∂p)_T of region 1 from the last region1Gibbs call at temperature T, m³/(kg·Pa). */
export function region1VolumeSlope(T: number): number {
  return (IF97.R * T * (G1[2] as number)) / (P_STAR * P_STAR);
}

/** Region 1 state at (T K, p Pa), IAPWS R7-97(2012) Table 3. The caller has checked the range. */
export function region1State(T: number, p: number): PhaseState {
  region1Gibbs(T, p);
  const g = G1[0] as number, gp = G1[1] as number, gpp = G1[2] as number;
  const gt = G1[3] as number, gtt = G1[4] as number, gpt = G1[5] as number;
  const pi = G1[6] as number, tau = G1[7] as number;
  const R = IF97.R;
  const RT = R * T;
  const tau2gtt = tau * tau * gtt;
  const e = gp - tau * gpt;
  return {
    T,
    p,
    v: (RT * gp) / P_STAR,
    h: RT * tau * gt,
    u: RT * (tau * gt - pi * gp),
    s: R * (tau * gt - g),
    cp: -R * tau2gtt,
    cv: R * (-tau2gtt + (e * e) / gpp),
    w: Math.sqrt((RT * gp * gp) / ((e * e) / tau2gtt - gpp)),
    region: 1,
  };
}
