// Region 3 (near-critical and supercritical, 623.15 K ≤ T ≤ T_B23(p), p_B23(T) ≤ p ≤ 100 MPa):
// the dimensionless Helmholtz free energy φ(δ, τ) of IAPWS R7-97(2012), Eq. (28), and the
// properties of Table 31. Eq. (28) takes density and temperature; the solvers (region3-density.ts)
// turn (T, p) into a density.
import { IF97 } from './constants.ts';
import type { PhaseState } from './phase-state.ts';

/**
 * IAPWS R7-97(2012), Table 30: region 3 coefficients n_i and exponents I_i, J_i of Eq. (28),
 * dimensionless; n1 multiplies ln δ, n2 … n40 the terms δ^I τ^J (I, J for i = 2 … 40 below).
 * Reducing quantities: ρ* = ρc = 322 kg/m³, T* = Tc = 647.096 K.
 */
const n1 = 0.10658070028513e1;
const I = [0, 0, 0, 0, 0, 0, 0, 1, 1, 1, 1, 2, 2, 2, 2, 2, 2, 3, 3, 3, 3, 3, 4, 4, 4, 4, 5, 5, 5, 6,
  6, 6, 7, 8, 9, 9, 10, 10, 11] as const;
const J = [0, 1, 2, 7, 10, 12, 23, 2, 6, 15, 17, 0, 2, 6, 7, 22, 26, 0, 2, 4, 16, 26, 0, 2, 4, 26,
  1, 3, 26, 0, 2, 26, 2, 26, 2, 26, 0, 1, 26] as const;
const n = [
  -0.15732845290239e2, 0.20944396974307e2, -0.76867707878716e1, 0.26185947787954e1,
  -0.28080781148620e1, 0.12053369696517e1, -0.84566812812502e-2, -0.12654315477714e1,
  -0.11524407806681e1, 0.88521043984318, -0.64207765181607, 0.38493460186671,
  -0.85214708824206, 0.48972281541877e1, -0.30502617256965e1, 0.39420536879154e-1,
  0.12558408424308, -0.27999329698710, 0.13899799569460e1, -0.20189915023570e1,
  -0.82147637173963e-2, -0.47596035734923, 0.43984074473500e-1, -0.44476435428739,
  0.90572070719733, 0.70522450087967, 0.10770512626332, -0.32913623258954,
  -0.50871062041158, -0.22175400873096e-1, 0.94260751665092e-1, 0.16436278447961,
  -0.13503372241348e-1, -0.14834345352472e-1, 0.57922953628084e-3, 0.32308904703711e-2,
  0.80964802996215e-4, -0.16557679795037e-3, -0.44923899061815e-4,
] as const;

/** The Table 30 coefficients, for tests that re-evaluate Eq. (28) term by term. */
export const REGION3_TABLE = { n1, I, J, n } as const;

// Module-local copies of the constants the hot paths read: a bundler inlines imported
// constants, but Vitest's module runner (which runs the benchmark and the tests) turns every
// read of an imported binding into a getter call, ~10 ns each on the 2-core CI machine.
const R = IF97.R; // J/(kg·K)
const TC = IF97.Tc; // K
const RHOC = IF97.rhoc; // kg/m³

const TERMS = n.length;
/** Highest I in Table 30; every I from 0 to 11 occurs, and the table is sorted by I. */
const I_MAX = 11;

const N_ = Float64Array.from(n);
const IDX_J = Int32Array.from(J);
const W_J = Float64Array.from(J);
const W_JJ = Float64Array.from(J, (j) => j * (j - 1));
/** Terms GROUP_START[i] … GROUP_START[i + 1] − 1 of Table 30 have exponent I = i. */
const GROUP_START = Int32Array.from({ length: I_MAX + 2 }, (_, i) => {
  const k = I.findIndex((x) => x >= i);
  return k < 0 ? TERMS : k;
});
const T_POW = new Float64Array(27);

// Eq. (28) as a polynomial in δ whose coefficients depend on τ alone:
//   Σ n·δ^I·τ^J = Σ_i δ^i·A_i(τ),  A_i = Σ_{I=i} n·τ^J,
// with B_i = Σ_{I=i} n·J·τ^J and C_i = Σ_{I=i} n·J(J−1)·τ^J for the τ derivatives. The A, B, C
// (scaled by i and i(i−1) for the δ derivatives) are kept for the last temperature: every
// density solve runs at one T, so each further step costs a few Horner sums in δ instead of the
// whole 39-term table.
const CA = new Float64Array(I_MAX + 1);
const CIA = new Float64Array(I_MAX + 1);
const CIIA = new Float64Array(I_MAX + 1);
const CB = new Float64Array(I_MAX + 1);
const CIB = new Float64Array(I_MAX + 1);
const CC = new Float64Array(I_MAX + 1);
let sumsT = Number.NaN;
let sumsTau = 0;

/** Fills CA … CC for temperature T (K), unless they already hold it. */
function region3TauSums(T: number): void {
  if (T === sumsT) return;
  const t = TC / T;
  // Exactly the powers Table 30 uses, τ^J for J ∈ {0…4, 6, 7, 10, 12, 15, 16, 17, 22, 23, 26},
  // as short products rather than one long chain of multiplications.
  const t2 = t * t, t3 = t2 * t, t4 = t2 * t2, t6 = t3 * t3, t12 = t6 * t6, t10 = t6 * t4;
  const t16 = t12 * t4, t22 = t12 * t10;
  T_POW[0] = 1; T_POW[1] = t; T_POW[2] = t2; T_POW[3] = t3; T_POW[4] = t4; T_POW[6] = t6;
  T_POW[7] = t4 * t3; T_POW[10] = t10; T_POW[12] = t12; T_POW[15] = t12 * t3; T_POW[16] = t16;
  T_POW[17] = t16 * t; T_POW[22] = t22; T_POW[23] = t22 * t; T_POW[26] = t22 * t4;
  for (let i = 0; i <= I_MAX; i++) {
    let a = 0, b = 0, c = 0;
    const end = GROUP_START[i + 1] as number;
    for (let k = GROUP_START[i] as number; k < end; k++) {
      const term = (N_[k] as number) * (T_POW[IDX_J[k] as number] as number);
      a += term;
      b += (W_J[k] as number) * term;
      c += (W_JJ[k] as number) * term;
    }
    CA[i] = a;
    CIA[i] = i * a;
    CIIA[i] = i * (i - 1) * a;
    CB[i] = b;
    CIB[i] = i * b;
    CC[i] = c;
  }
  sumsT = T;
  sumsTau = t;
}

/** Scratch output of region3Helmholtz: [φ, φ_δ, φ_δδ, φ_τ, φ_ττ, φ_δτ, δ, τ]. */
export const F3 = new Float64Array(8);

/** Fills F3 with φ and its derivatives at (ρ kg/m³, T K). No range checks, no allocation. */
export function region3Helmholtz(rho: number, T: number): void {
  const delta = rho / RHOC;
  region3TauSums(T);
  const tau = sumsTau;
  // Horner in δ; each sum is the δ^i-weighted total of one coefficient set.
  let f = 0, fd = 0, fdd = 0, ft = 0, ftt = 0, fdt = 0;
  for (let i = I_MAX; i >= 0; i--) {
    f = f * delta + (CA[i] as number);
    fd = fd * delta + (CIA[i] as number);
    fdd = fdd * delta + (CIIA[i] as number);
    ft = ft * delta + (CB[i] as number);
    ftt = ftt * delta + (CC[i] as number);
    fdt = fdt * delta + (CIB[i] as number);
  }
  const id = 1 / delta;
  const it = 1 / tau;
  F3[0] = n1 * Math.log(delta) + f;
  F3[1] = (n1 + fd) * id;
  F3[2] = (fdd - n1) * id * id;
  F3[3] = ft * it;
  F3[4] = ftt * it * it;
  F3[5] = fdt * id * it;
  F3[6] = delta;
  F3[7] = tau;
}

/** Scratch output of region3Pressure: [p Pa, (∂p/∂ρ)_T Pa·m³/kg]. */
export const P3 = new Float64Array(2);

/**
 * Fills P3 with Eq. (28)'s pressure and its density slope at (ρ kg/m³, T K), from φ_δ and φ_δδ
 * only (what every density solve iterates on; at a repeated T, two Horner sums of 12 terms).
 * No range checks, no allocation.
 */
export function region3Pressure(rho: number, T: number): void {
  const d = rho / RHOC;
  region3TauSums(T);
  let fd = 0, fdd = 0;
  for (let i = I_MAX; i >= 0; i--) {
    fd = fd * d + (CIA[i] as number);
    fdd = fdd * d + (CIIA[i] as number);
  }
  // δ·φ_δ = n1 + Σ n·I·δ^I·τ^J and δ²·φ_δδ = −n1 + Σ n·I(I−1)·δ^I·τ^J
  const dfd = n1 + fd;
  const RT = R * T;
  P3[0] = rho * RT * dfd;
  P3[1] = RT * (2 * dfd + fdd - n1);
}

/**
 * Region 3 state at (ρ kg/m³, T K), IAPWS R7-97(2012) Table 31. The caller has checked the range.
 * `p` and `v` default to Eq. (28)'s pressure and 1/ρ; a solver passes the values it solved for
 * (they agree with Eq. (28) to its tolerance) so the state reports exactly what was asked.
 */
export function region3State(rho: number, T: number, p?: number, v?: number): PhaseState {
  region3Helmholtz(rho, T);
  const f = F3[0] as number, fd = F3[1] as number, fdd = F3[2] as number;
  const ft = F3[3] as number, ftt = F3[4] as number, fdt = F3[5] as number;
  const d = F3[6] as number, tau = F3[7] as number;
  const RT = R * T;
  const dfd = d * fd;
  const tau2ftt = tau * tau * ftt;
  const e = dfd - d * tau * fdt;
  const k = 2 * dfd + d * d * fdd;
  return {
    T,
    p: p ?? rho * RT * dfd,
    v: v ?? 1 / rho,
    h: RT * (tau * ft + dfd),
    u: RT * tau * ft,
    s: R * (tau * ft - f),
    cp: R * (-tau2ftt + (e * e) / k),
    cv: -R * tau2ftt,
    w: Math.sqrt(RT * (k - (e * e) / tau2ftt)),
    region: 3,
  };
}
