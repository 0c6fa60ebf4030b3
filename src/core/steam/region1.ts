// Region 1 (compressed and saturated liquid, 273.15 K ≤ T ≤ 623.15 K, p_s(T) ≤ p ≤ 100 MPa):
// the dimensionless Gibbs free energy γ(π, τ) of IAPWS R7-97(2012), Eq. (7), and the
// properties of Table 3 derived from it.
import { IF97 } from './constants.ts';
import type { PhaseState } from './phase-state.ts';

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

/** The Table 2 coefficients, for tests that re-evaluate Eq. (7) term by term. */
export const REGION1_TABLE = { I, J, n } as const;

// Module-local copies of the constants the hot paths read: a bundler inlines imported
// constants, but Vitest's module runner (which runs the benchmark and the tests) turns every
// read of an imported binding into a getter call, ~10 ns each on the 2-core CI machine.
const R = IF97.R; // J/(kg·K)

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
// Powers a^I in A_POW[I]; b^J in B_POW[41 + J] (J = −41 … 17), filled by region1Powers.
const A_POW = new Float64Array(33);
const B_POW = new Float64Array(59);
const IDX_I = Int32Array.from(I);
const IDX_J = Int32Array.from(J, (j) => 41 + j);

/**
 * Exactly the powers Table 2 uses, I ∈ {0…5, 8, 21, 23, 29…32}, J ∈ {−41 … −38, −31, −29, −11,
 * −9 … 6, 10, 17}, as short products (a plain x, x², x³ … loop is one long chain of dependent
 * multiplications and costs more than the rest of the equation).
 */
function region1Powers(a: number, b: number): void {
  const a2 = a * a, a3 = a2 * a, a4 = a2 * a2, a5 = a4 * a, a8 = a4 * a4, a16 = a8 * a8;
  const a21 = a16 * a5, a29 = a21 * a8;
  A_POW[0] = 1; A_POW[1] = a; A_POW[2] = a2; A_POW[3] = a3; A_POW[4] = a4; A_POW[5] = a5;
  A_POW[8] = a8; A_POW[21] = a21; A_POW[23] = a21 * a2; A_POW[29] = a29; A_POW[30] = a29 * a;
  A_POW[31] = a29 * a2; A_POW[32] = a16 * a16;
  const b2 = b * b, b3 = b2 * b, b4 = b2 * b2, b5 = b4 * b, b6 = b3 * b3;
  B_POW[41] = 1; B_POW[42] = b; B_POW[43] = b2; B_POW[44] = b3; B_POW[45] = b4; B_POW[46] = b5;
  B_POW[47] = b6; B_POW[51] = b6 * b4; B_POW[58] = b6 * b6 * b5;
  const c = 1 / b;
  const c2 = c * c, c3 = c2 * c, c4 = c2 * c2, c5 = c4 * c, c6 = c3 * c3, c7 = c4 * c3, c8 = c4 * c4;
  const c9 = c8 * c, c11 = c8 * c3, c29 = c11 * c11 * c7, c38 = c29 * c9;
  B_POW[40] = c; B_POW[39] = c2; B_POW[38] = c3; B_POW[37] = c4; B_POW[36] = c5; B_POW[35] = c6;
  B_POW[34] = c7; B_POW[33] = c8; B_POW[32] = c9; B_POW[30] = c11; B_POW[12] = c29;
  B_POW[10] = c29 * c2; B_POW[3] = c38; B_POW[2] = c38 * c; B_POW[1] = c38 * c2; B_POW[0] = c38 * c3;
}

/** Scratch output of region1Gibbs: [γ, γ_π, γ_ππ, γ_τ, γ_ττ, γ_πτ, π, τ]. */
export const G1 = new Float64Array(8);

/** Fills G1 with γ and its derivatives at (T K, p Pa). No range checks, no allocation. */
export function region1Gibbs(T: number, p: number): void {
  const pi = p / P_STAR;
  const tau = T_STAR / T;
  const a = 7.1 - pi;
  const b = tau - 1.222;
  const ib = 1 / b;
  region1Powers(a, b);
  let g = 0, gp = 0, gpp = 0, gt = 0, gtt = 0, gpt = 0;
  for (let k = 0; k < TERMS; k++) {
    const t = (N_[k] as number) * (A_POW[IDX_I[k] as number] as number) * (B_POW[IDX_J[k] as number] as number);
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

/**
 * Fills only G1[1] = γ_π and G1[2] = γ_ππ (and G1[6], G1[7]) at (T K, p Pa): all a solve for v
 * at fixed T needs, at a third of region1Gibbs' sums. No range checks, no allocation.
 */
export function region1PressureDerivatives(T: number, p: number): void {
  const pi = p / P_STAR;
  const tau = T_STAR / T;
  const a = 7.1 - pi;
  region1Powers(a, tau - 1.222);
  let gp = 0, gpp = 0;
  for (let k = 0; k < TERMS; k++) {
    const t = (N_[k] as number) * (A_POW[IDX_I[k] as number] as number) * (B_POW[IDX_J[k] as number] as number);
    gp += (W_I[k] as number) * t;
    gpp += (W_II[k] as number) * t;
  }
  const ia = 1 / a;
  G1[1] = -gp * ia;
  G1[2] = gpp * ia * ia;
  G1[6] = pi;
  G1[7] = tau;
}

/** Specific volume (m³/kg) of region 1 at (T K, p Pa), Table 3; no range checks. */
export function region1Volume(T: number, p: number): number {
  region1PressureDerivatives(T, p);
  return (R * T * (G1[1] as number)) / P_STAR;
}

/** (∂v/∂p)_T of region 1 from the last region1Volume call at temperature T, m³/(kg·Pa). */
export function region1VolumeSlope(T: number): number {
  return (R * T * (G1[2] as number)) / (P_STAR * P_STAR);
}

/** Region 1 state at (T K, p Pa), IAPWS R7-97(2012) Table 3. The caller has checked the range. */
export function region1State(T: number, p: number): PhaseState {
  region1Gibbs(T, p);
  const g = G1[0] as number, gp = G1[1] as number, gpp = G1[2] as number;
  const gt = G1[3] as number, gtt = G1[4] as number, gpt = G1[5] as number;
  const pi = G1[6] as number, tau = G1[7] as number;
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
