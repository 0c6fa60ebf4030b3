// Region 2 (vapor, 273.15 K ≤ T ≤ 1073.15 K, 0 < p ≤ p_s(T) below 623.15 K, p ≤ p_B23(T) up to
// 863.15 K, p ≤ 100 MPa above): the dimensionless Gibbs free energy γ = γ° + γʳ of
// IAPWS R7-97(2012), Eqs. (15)-(17), and the properties of Table 12.
import { IF97 } from './constants.ts';
import type { PhaseState } from './phase-state.ts';

/**
 * IAPWS R7-97(2012), Table 10: ideal-gas part γ° of region 2, Eq. (16): coefficients n°_i and
 * exponents J°_i, dimensionless. Reducing quantities: p* = 1 MPa, T* = 540 K.
 */
const J0 = [0, 1, -5, -4, -3, -2, -1, 2, 3] as const;
const n0 = [
  -0.96927686500217e1, 0.10086655968018e2, -0.56087911283020e-2, 0.71452738081455e-1,
  -0.40710498223928, 0.14240819171444e1, -0.43839511319450e1, -0.28408632460772,
  0.21268463753307e-1,
] as const;

/**
 * IAPWS R7-97(2012), Table 11: residual part γʳ of region 2, Eq. (17): coefficients n_i and
 * exponents I_i, J_i, dimensionless. Reducing quantities: p* = 1 MPa, T* = 540 K.
 */
const I = [1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 3, 3, 3, 3, 3, 4, 4, 4, 5, 6, 6, 6, 7, 7, 7, 8, 8, 9, 10,
  10, 10, 16, 16, 18, 20, 20, 20, 21, 22, 23, 24, 24, 24] as const;
const J = [0, 1, 2, 3, 6, 1, 2, 4, 7, 36, 0, 1, 3, 6, 35, 1, 2, 3, 7, 3, 16, 35, 0, 11, 25, 8, 36,
  13, 4, 10, 14, 29, 50, 57, 20, 35, 48, 21, 53, 39, 26, 40, 58] as const;
const n = [
  -0.17731742473213e-2, -0.17834862292358e-1, -0.45996013696365e-1, -0.57581259083432e-1,
  -0.50325278727930e-1, -0.33032641670203e-4, -0.18948987516315e-3, -0.39392777243355e-2,
  -0.43797295650573e-1, -0.26674547914087e-4, 0.20481737692309e-7, 0.43870667284435e-6,
  -0.32277677238570e-4, -0.15033924542148e-2, -0.40668253562649e-1, -0.78847309559367e-9,
  0.12790717852285e-7, 0.48225372718507e-6, 0.22922076337661e-5, -0.16714766451061e-10,
  -0.21171472321355e-2, -0.23895741934104e2, -0.59059564324270e-17, -0.12621808899101e-5,
  -0.38946842435739e-1, 0.11256211360459e-10, -0.82311340897998e1, 0.19809712802088e-7,
  0.10406965210174e-18, -0.10234747095929e-12, -0.10018179379511e-8, -0.80882908646985e-10,
  0.10693031879409, -0.33662250574171, 0.89185845355421e-24, 0.30629316876232e-12,
  -0.42002467698208e-5, -0.59056029685639e-25, 0.37826947613457e-5, -0.12768608934681e-14,
  0.73087610595061e-28, 0.55414715350778e-16, -0.94369707241210e-6,
] as const;

/** The Table 10 and 11 coefficients, for tests that re-evaluate Eq. (15) term by term. */
export const REGION2_TABLE = { J0, n0, I, J, n } as const;

// Module-local copies of the constants the hot paths read: a bundler inlines imported
// constants, but Vitest's module runner (which runs the benchmark and the tests) turns every
// read of an imported binding into a getter call, ~10 ns each on the 2-core CI machine.
const R = IF97.R; // J/(kg·K)

const P_STAR = 1e6; // Pa
const T_STAR = 540; // K
const TERMS = n.length;

const N0_ = Float64Array.from(n0);
const J0_ = Float64Array.from(J0);
const J0J0 = Float64Array.from(J0, (j) => j * (j - 1));
const IDEAL_TERMS = n0.length;
const T0_POW = new Float64Array(IDEAL_TERMS);
const N_ = Float64Array.from(n);
const IDX_I = Int32Array.from(I);
const IDX_J = Int32Array.from(J);
const W_I = Float64Array.from(I);
const W_II = Float64Array.from(I, (i) => i * (i - 1));
const W_J = Float64Array.from(J);
const W_JJ = Float64Array.from(J, (j) => j * (j - 1));
const W_IJ = Float64Array.from(I, (i, k) => i * (J[k] as number));
const PI_POW = new Float64Array(25);
const B_POW = new Float64Array(59);

/**
 * Exactly the powers Table 11 uses, π^I for I ∈ {1…10, 16, 18, 20…24} and b^J for J ∈ {0…4,
 * 6…8, 10, 11, 13, 14, 16, 20, 21, 25, 26, 29, 35, 36, 39, 40, 48, 50, 53, 57, 58}, as short
 * products (a plain x, x², x³ … loop is one long chain of dependent multiplications).
 */
function region2Powers(p: number, b: number): void {
  const p2 = p * p, p3 = p2 * p, p4 = p2 * p2, p5 = p4 * p, p8 = p4 * p4, p10 = p5 * p5, p20 = p10 * p10;
  PI_POW[0] = 1; PI_POW[1] = p; PI_POW[2] = p2; PI_POW[3] = p3; PI_POW[4] = p4; PI_POW[5] = p5;
  PI_POW[6] = p3 * p3; PI_POW[7] = p4 * p3; PI_POW[8] = p8; PI_POW[9] = p8 * p; PI_POW[10] = p10;
  PI_POW[16] = p8 * p8; PI_POW[18] = p8 * p10; PI_POW[20] = p20; PI_POW[21] = p20 * p;
  PI_POW[22] = p20 * p2; PI_POW[23] = p20 * p3; PI_POW[24] = p20 * p4;
  const b2 = b * b, b3 = b2 * b, b4 = b2 * b2, b6 = b3 * b3, b7 = b4 * b3, b8 = b4 * b4;
  const b10 = b8 * b2, b13 = b10 * b3, b16 = b8 * b8, b20 = b10 * b10, b29 = b16 * b13;
  const b36 = b29 * b7, b40 = b20 * b20, b48 = b40 * b8, b50 = b48 * b2;
  B_POW[0] = 1; B_POW[1] = b; B_POW[2] = b2; B_POW[3] = b3; B_POW[4] = b4; B_POW[6] = b6;
  B_POW[7] = b7; B_POW[8] = b8; B_POW[10] = b10; B_POW[11] = b8 * b3; B_POW[13] = b13;
  B_POW[14] = b7 * b7; B_POW[16] = b16; B_POW[20] = b20; B_POW[21] = b20 * b;
  B_POW[25] = b20 * b4 * b; B_POW[26] = b13 * b13; B_POW[29] = b29; B_POW[35] = b29 * b6;
  B_POW[36] = b36; B_POW[39] = b36 * b3; B_POW[40] = b40; B_POW[48] = b48; B_POW[50] = b50;
  B_POW[53] = b50 * b3; B_POW[57] = b50 * b7; B_POW[58] = b29 * b29;
}

/** Scratch output of region2Residual: [γʳ, γʳ_π, γʳ_ππ, γʳ_τ, γʳ_ττ, γʳ_πτ, π, τ]. */
export const G2 = new Float64Array(8);

/**
 * Fills G2 with the residual part γʳ and its derivatives at (T K, p Pa). No range checks, no
 * allocation. b = τ − 0.5 is > 0 for T < 1080 K, so dividing by it is safe in region 2.
 */
export function region2Residual(T: number, p: number): void {
  const pi = p / P_STAR;
  const tau = T_STAR / T;
  const b = tau - 0.5;
  region2Powers(pi, b);
  let g = 0, gp = 0, gpp = 0, gt = 0, gtt = 0, gpt = 0;
  for (let k = 0; k < TERMS; k++) {
    const t = (N_[k] as number) * (PI_POW[IDX_I[k] as number] as number) * (B_POW[IDX_J[k] as number] as number);
    g += t;
    gp += (W_I[k] as number) * t;
    gpp += (W_II[k] as number) * t;
    gt += (W_J[k] as number) * t;
    gtt += (W_JJ[k] as number) * t;
    gpt += (W_IJ[k] as number) * t;
  }
  const ipi = 1 / pi;
  const ib = 1 / b;
  G2[0] = g;
  G2[1] = gp * ipi;
  G2[2] = gpp * ipi * ipi;
  G2[3] = gt * ib;
  G2[4] = gtt * ib * ib;
  G2[5] = gpt * ipi * ib;
  G2[6] = pi;
  G2[7] = tau;
}

/**
 * Fills only G2[1] = γʳ_π and G2[2] = γʳ_ππ (and G2[6], G2[7]) at (T K, p Pa): all a solve for
 * v at fixed T needs, at a third of region2Residual's sums. No range checks, no allocation.
 */
export function region2PressureDerivatives(T: number, p: number): void {
  const pi = p / P_STAR;
  const tau = T_STAR / T;
  region2Powers(pi, tau - 0.5);
  let gp = 0, gpp = 0;
  for (let k = 0; k < TERMS; k++) {
    const t = (N_[k] as number) * (PI_POW[IDX_I[k] as number] as number) * (B_POW[IDX_J[k] as number] as number);
    gp += (W_I[k] as number) * t;
    gpp += (W_II[k] as number) * t;
  }
  const ipi = 1 / pi;
  G2[1] = gp * ipi;
  G2[2] = gpp * ipi * ipi;
  G2[6] = pi;
  G2[7] = tau;
}

/** Specific volume (m³/kg) of region 2 at (T K, p Pa), Table 12; no range checks. */
export function region2Volume(T: number, p: number): number {
  region2PressureDerivatives(T, p);
  return (R * T * (1 / (G2[6] as number) + (G2[1] as number))) / P_STAR;
}

/** Region 2 state at (T K, p Pa), IAPWS R7-97(2012) Table 12. The caller has checked the range. */
export function region2State(T: number, p: number): PhaseState {
  region2Residual(T, p);
  const gr = G2[0] as number, grp = G2[1] as number, grpp = G2[2] as number;
  const grt = G2[3] as number, grtt = G2[4] as number, grpt = G2[5] as number;
  const pi = G2[6] as number, tau = G2[7] as number;
  // Ideal-gas part, Eq. (16): γ° = ln π + Σ n°_i τ^J°_i.
  let g0 = Math.log(pi), g0t = 0, g0tt = 0;
  const itau = 1 / tau;
  const it2 = itau * itau;
  const it3 = it2 * itau;
  // τ^J° for J° = 0, 1, −5, −4, −3, −2, −1, 2, 3 (the order of Table 10).
  T0_POW[0] = 1;
  T0_POW[1] = tau;
  T0_POW[2] = it3 * it2;
  T0_POW[3] = it2 * it2;
  T0_POW[4] = it3;
  T0_POW[5] = it2;
  T0_POW[6] = itau;
  T0_POW[7] = tau * tau;
  T0_POW[8] = tau * tau * tau;
  for (let k = 0; k < IDEAL_TERMS; k++) {
    const t = (N0_[k] as number) * (T0_POW[k] as number);
    g0 += t;
    g0t += (J0_[k] as number) * t;
    g0tt += (J0J0[k] as number) * t;
  }
  g0t *= itau;
  g0tt *= itau * itau;
  const RT = R * T;
  const gt = g0t + grt;
  const tau2gtt = tau * tau * (g0tt + grtt);
  const pgrp = pi * grp;
  const e = 1 + pgrp - tau * pi * grpt;
  const d = 1 - pi * pi * grpp;
  return {
    T,
    p,
    v: (RT * (1 / pi + grp)) / P_STAR,
    h: RT * tau * gt,
    u: RT * (tau * gt - 1 - pgrp),
    s: R * (tau * gt - (g0 + gr)),
    cp: -R * tau2gtt,
    cv: R * (-tau2gtt - (e * e) / d),
    w: Math.sqrt((RT * (1 + 2 * pgrp + pgrp * pgrp)) / (d + (e * e) / tau2gtt)),
    region: 2,
  };
}
