// Boundary between regions 2 and 3 (B23): IAPWS R7-97(2012), Eq. (5) p(T) and Eq. (6) T(p),
// valid 623.15 K ≤ T ≤ 863.15 K, 16.5292 MPa ≤ p ≤ 100 MPa.

/**
 * IAPWS R7-97(2012), Table 1: coefficients n1 … n5 of Eqs. (5) and (6), dimensionless.
 * Reducing quantities: T* = 1 K, p* = 1 MPa.
 */
const N = [0.34805185628969e3, -0.11671859879975e1, 0.10192970039326e-2, 0.57254459862746e3,
  0.1391883977870e2] as const;

const [n1, n2, n3, n4, n5] = N;

/** B23 pressure p(T) in Pa, Eq. (5); T in K (623.15 … 863.15 K; not range-checked). */
export function b23Pressure(T: number): number {
  return ((n3 * T + n2) * T + n1) * 1e6;
}

/** B23 temperature T(p) in K, Eq. (6); p in Pa (16.5292 … 100 MPa; not range-checked). */
export function b23Temperature(p: number): number {
  return n4 + Math.sqrt((p * 1e-6 - n5) / n3);
}
