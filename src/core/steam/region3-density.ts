// Densities for region 3, whose basic equation, Eq. (28), gives p(ρ, T): the saturated liquid
// and vapor densities at p_s(T) for 623.15 K < T ≤ Tc, and the density at a given (T, p).
//
// Route (documented because libraries differ near Tc): both saturated phases are roots of
// Eq. (28) at p = p_s(T) from Eq. (30), found by Newton's method until |p − p_s| ≤ 1e-12·p_s
// or the last step is below 1e-9·ρ. Starting values come from a table of such roots built on
// first use (seeded once by the IAPWS SR1-86(1992) auxiliary equations for saturated
// densities, an IAPWS-95 fit that sits a little outside IF97's dome near Tc, where Newton's
// method on the outer branches converges without overshooting). The SR5-05 backward equations
// are not used. Within about 5e-5 K of Tc, Eq. (28) has only one root at p_s(T) (IF97's
// region 3 and Eq. (30) meet the critical point only to within their tolerances); there both
// phases are that one root, so v_f = v_g.
import * as constants from './constants.ts';
import * as region3 from './region3.ts';
import * as saturationLine from './saturation-line.ts';
import * as seedTable from './region3-seed-table.ts';
import * as solvers from './solvers.ts';

// The imports are read once into module constants: a bundler joins modules into one scope,
// but Vitest's module runner (which runs the tests and the benchmark) turns every use of an
// imported binding into a getter call, ~10 ns each on the 2-core CI machine.
const { IF97 } = constants;
const { P3, region3Pressure } = region3;
const { saturationPressureUnchecked } = saturationLine;
const { solveBracketed } = solvers;

/**
 * IAPWS SR1-86(1992), Revised Supplementary Release on Saturation Properties of Ordinary Water
 * Substance, Eq. (2) saturated-liquid density b1 … b6 (exponents 1/3, 2/3, 5/3, 16/3, 43/3,
 * 110/3 of θ = 1 − T/Tc) and Eq. (3) saturated-vapor density c1 … c6 (exponents 2/6, 4/6, 8/6,
 * 18/6, 37/6, 71/6), dimensionless, ρ/ρc. Used only as starting values.
 */
const B = [1.99274064, 1.09965342, -0.510839303, -1.75493479, -45.5170352, -6.74694450e5] as const;
const C = [-2.0315024, -2.6830294, -5.38626492, -17.2991605, -44.7586581, -63.9201063] as const;

/** Starting value for the saturated-liquid density (kg/m³), SR1-86 Eq. (2). */
function liquidDensityGuess(T: number): number {
  const t = Math.cbrt(Math.max(0, 1 - T / IF97.Tc));
  const t2 = t * t, t4 = t2 * t2, t5 = t4 * t, t16 = t4 * t4 * t4 * t4, t43 = t16 * t16 * t5 * t5 * t;
  const t110 = t43 * t43 * t16 * t4 * t4;
  return IF97.rhoc * (1 + B[0] * t + B[1] * t2 + B[2] * t5 + B[3] * t16 + B[4] * t43 + B[5] * t110);
}

/** Starting value for the saturated-vapor density (kg/m³), SR1-86 Eq. (3). */
function vaporDensityGuess(T: number): number {
  const t = Math.sqrt(Math.cbrt(Math.max(0, 1 - T / IF97.Tc))); // θ^(1/6)
  const t2 = t * t, t4 = t2 * t2, t8 = t4 * t4, t18 = t8 * t8 * t2, t37 = t18 * t18 * t;
  const t71 = t37 * t18 * t8 * t8;
  return IF97.rhoc * Math.exp(C[0] * t2 + C[1] * t4 + C[2] * t8 + C[3] * t18 + C[4] * t37 + C[5] * t71);
}

// Eq. (28)'s own rounding noise in p is ~1e-13 relative on the liquid branch (its terms cancel),
// so ask for 1e-12: far inside the 1e-9 the engine promises, and always reachable.
const P_REL_TOL = 1e-12;

/**
 * Root of Eq. (28) at p = ps on the liquid (outward = larger ρ) or vapor branch, by Newton's
 * method from the outside. Where the slope is not positive (inside the unstable part of the
 * isotherm) it steps outward instead, so it can only settle on the outermost root.
 */
function outerRoot(T: number, ps: number, rho0: number, liquid: boolean): number {
  const outward = liquid ? 1.002 : 1 / 1.002;
  let rho = rho0;
  for (let k = 0; k < 200; k++) {
    region3Pressure(rho, T);
    const f = (P3[0] as number) - ps;
    const slope = P3[1] as number;
    if (Math.abs(f) <= P_REL_TOL * ps) {
      // Converged: finish with the Newton step this evaluation already paid for (near Tc, where
      // the isotherm is flat, it still moves ρ noticeably), unless a vanishing slope makes it big.
      const step = f / slope;
      return slope > 0 && Math.abs(step) <= 1e-6 * rho ? rho - step : rho;
    }
    if (!(slope > 0)) {
      rho *= outward;
      continue;
    }
    const step = f / slope;
    // Newton converges quadratically here (at worst linearly, with the step a third of the
    // error, at a triple root): once a step is below 1e-9·ρ, the step itself finishes the job
    // and a confirming evaluation would change nothing that matters.
    if (Math.abs(step) <= 1e-9 * rho) return rho - step;
    // Near Tc the slope can be tiny; never jump more than 5 % in one step.
    let next = rho - step;
    if (next > rho * 1.05) next = rho * 1.05;
    else if (next < rho / 1.05) next = rho / 1.05;
    rho = next;
  }
  return rho;
}

// Starting values along the line: the saturated densities solved at 96 nodes evenly spaced in
// √(Tc − T) (the dome's natural variable near the critical point), interpolated by cubic
// Catmull-Rom segments (linear in the two intervals next to Tc). The nodes are solved by
// computeSeedTable below (each node starting from its neighbour and the first from the SR1-86
// guesses) and kept, as solved, in region3-seed-table.ts: solving them on first use cost a fresh
// process about 3-5 ms, most of the first check of a fill whose liquid-full temperature lies in
// region 3 (test/core/steam/region3-density.test.ts solves them again and holds the two equal bit
// for bit). They only seed Newton's method (within 3e-5 of the root, 1.5e-4 in the last 0.01 K,
// so usually two evaluations per phase finish); every returned density is a converged root of
// Eq. (28).
const SEED_NODES = 96;
const SEED_S_MAX = Math.sqrt(IF97.Tc - 623.15);
const { SEED_TABLE_LIQUID: SEED_LIQUID, SEED_TABLE_VAPOR: SEED_VAPOR } = seedTable;

/** Solves the starting-value nodes (the generator of region3-seed-table.ts), ρ in kg/m³, node k at T = Tc − (k·√(Tc − 623.15 K)/95)². */
export function computeSeedTable(): { liquid: Float64Array; vapor: Float64Array } {
  const liquid = new Float64Array(SEED_NODES);
  const vapor = new Float64Array(SEED_NODES);
  for (let k = SEED_NODES - 1; k >= 0; k--) {
    const sk = (SEED_S_MAX * k) / (SEED_NODES - 1);
    const T = IF97.Tc - sk * sk;
    const ps = saturationPressureUnchecked(T);
    const last = k === SEED_NODES - 1;
    liquid[k] = outerRoot(T, ps, last ? liquidDensityGuess(T) : (liquid[k + 1] as number), true);
    vapor[k] = outerRoot(T, ps, last ? vaporDensityGuess(T) : (vapor[k + 1] as number), false);
  }
  return { liquid, vapor };
}

/** Scratch output of region3SaturatedDensitySeeds: [ρ_f, ρ_g] starting values in kg/m³. */
export const SEED3 = new Float64Array(2);

/**
 * Fills SEED3 with interpolated saturated densities for 623.15 K ≤ T ≤ Tc (not range-checked):
 * within 3e-4 relative of the roots of Eq. (28) (checked by the tests), so a state more than
 * 0.1 % outside [v_f, v_g] can be classified without solving.
 */
export function region3SaturatedDensitySeeds(T: number): void {
  const x = (Math.sqrt(Math.max(0, IF97.Tc - T)) / SEED_S_MAX) * (SEED_NODES - 1);
  const i = Math.min(SEED_NODES - 2, Math.floor(x));
  const w = x - i;
  if (i < 2) {
    // The node at Tc sits where the two roots have merged (a kink in ρ(√(Tc − T))); a cubic
    // through it would overshoot, so the last two intervals are linear.
    SEED3[0] = (1 - w) * (SEED_LIQUID[i] as number) + w * (SEED_LIQUID[i + 1] as number);
    SEED3[1] = (1 - w) * (SEED_VAPOR[i] as number) + w * (SEED_VAPOR[i + 1] as number);
    return;
  }
  SEED3[0] = catmullRom(SEED_LIQUID, i, w);
  SEED3[1] = catmullRom(SEED_VAPOR, i, w);
}

/** Catmull-Rom cubic between nodes i and i + 1 (1 ≤ i; past the last node, a straight line). */
function catmullRom(y: Float64Array, i: number, w: number): number {
  const y0 = y[i - 1] as number;
  const y1 = y[i] as number;
  const y2 = y[i + 1] as number;
  const y3 = i + 2 < SEED_NODES ? (y[i + 2] as number) : 2 * y2 - y1;
  return y1 + 0.5 * w * (y2 - y0 + w * (2 * y0 - 5 * y1 + 4 * y2 - y3 + w * (3 * (y1 - y2) + y3 - y0)));
}

// One-entry cache: the check engine asks for the same temperature repeatedly.
let cachedT = Number.NaN;
let cachedLiquid = 0;
let cachedVapor = 0;

/** Scratch output of region3SaturatedDensities: [ρ_f, ρ_g] in kg/m³. */
export const SAT3 = new Float64Array(2);

/**
 * Fills SAT3 with the saturated liquid and vapor densities from Eq. (28) at p_s(T), for
 * 623.15 K < T ≤ 647.096 K (not range-checked). ρ_f ≥ ρ_g always.
 */
export function region3SaturatedDensities(T: number, ps: number): void {
  if (T === cachedT) {
    SAT3[0] = cachedLiquid;
    SAT3[1] = cachedVapor;
    return;
  }
  region3SaturatedDensitySeeds(T);
  let rf = outerRoot(T, ps, SEED3[0] as number, true);
  let rg = outerRoot(T, ps, SEED3[1] as number, false);
  if (rf < rg) {
    // Only possible where the two branches have merged into one root; both searches found it.
    const mid = 0.5 * (rf + rg);
    rf = mid;
    rg = mid;
  }
  cachedT = T;
  cachedLiquid = rf;
  cachedVapor = rg;
  SAT3[0] = rf;
  SAT3[1] = rg;
}

/**
 * One saturated density from Eq. (28) at p_s(T), kg/m³: exactly what region3SaturatedDensities
 * gives for that phase (SAT3[0] for the liquid, SAT3[1] for the vapor), solving only that phase's
 * root, for 623.15 K < T ≤ 647.096 K (not range-checked). Within 0.01 K of Tc, where the two roots
 * can merge and the pair decides, it solves both.
 */
export function region3SaturatedDensity(T: number, ps: number, liquid: boolean): number {
  if (T === cachedT) return liquid ? cachedLiquid : cachedVapor;
  if (T >= IF97.Tc - 0.01) {
    region3SaturatedDensities(T, ps);
    return (liquid ? SAT3[0] : SAT3[1]) as number;
  }
  region3SaturatedDensitySeeds(T);
  return outerRoot(T, ps, (liquid ? SEED3[0] : SEED3[1]) as number, liquid);
}

// The (T, p) of the current solve, read by pressureResidual (module scope: no closure per call).
let solveT = 0;
let solvePressure = 0;
function pressureResidual(rho: number, out: Float64Array): void {
  region3Pressure(rho, solveT);
  out[0] = (P3[0] as number) - solvePressure;
  out[1] = P3[1] as number;
}

/**
 * Density (kg/m³) at which Eq. (28) gives pressure p at temperature T, on the branch a
 * single-phase region 3 state at (T, p) belongs to: liquid for p ≥ p_s(T) below Tc, vapor for
 * p < p_s(T), the one branch at and above Tc. Converges to |Δp| ≤ 1e-12·p.
 * @param T K, 623.15 < T ≤ 863.15 (not range-checked)
 * @param p Pa, inside region 3 at T (not range-checked)
 */
export function region3DensityFromTP(T: number, p: number): number {
  solveT = T;
  solvePressure = p;
  const fTol = P_REL_TOL * p;
  let lo: number;
  let hi: number;
  let fLo: number;
  let fHi: number;
  if (T < IF97.Tc) {
    const ps = saturationPressureUnchecked(T);
    region3SaturatedDensities(T, ps);
    if (p >= ps) {
      // Liquid branch: from ρ_f outward until Eq. (28) passes p.
      lo = SAT3[0] as number;
      fLo = ps - p;
      hi = lo;
      fHi = fLo;
      while (fHi < 0) {
        hi *= 1.1;
        region3Pressure(hi, T);
        fHi = (P3[0] as number) - p;
      }
    } else {
      hi = SAT3[1] as number;
      fHi = ps - p;
      lo = hi;
      fLo = fHi;
      while (fLo > 0) {
        lo /= 1.1;
        region3Pressure(lo, T);
        fLo = (P3[0] as number) - p;
      }
    }
  } else {
    // At and above Tc the isotherm rises monotonically; bracket outward from ρc.
    region3Pressure(IF97.rhoc, T);
    const fc = (P3[0] as number) - p;
    if (fc === 0) return IF97.rhoc;
    lo = IF97.rhoc;
    hi = IF97.rhoc;
    fLo = fc;
    fHi = fc;
    if (fc < 0) {
      while (fHi < 0) {
        lo = hi;
        fLo = fHi;
        hi *= 1.1;
        region3Pressure(hi, T);
        fHi = (P3[0] as number) - p;
      }
    } else {
      while (fLo > 0) {
        hi = lo;
        fHi = fLo;
        lo /= 1.1;
        region3Pressure(lo, T);
        fLo = (P3[0] as number) - p;
      }
    }
  }
  // Start from the secant through the bracket; Newton does the rest.
  const x0 = lo - (fLo * (hi - lo)) / (fHi - fLo);
  return solveBracketed(pressureResidual, lo, fLo, hi, fHi, x0, fTol, 1e-14);
}
