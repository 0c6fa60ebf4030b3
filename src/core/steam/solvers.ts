// One-dimensional root finding shared by the steam engine.

/** Writes f(x) into out[0] and f'(x) into out[1]. */
export type ValueAndSlope = (x: number, out: Float64Array) => void;

const SCRATCH = new Float64Array(2);

/**
 * Safeguarded Newton iteration on a bracket [lo, hi] with f(lo)·f(hi) ≤ 0: a Newton step when
 * it stays inside the bracket and shrinks it fast enough, bisection otherwise, so it converges
 * for any continuous f (the Newton-with-bisection scheme of Numerical Recipes' `rtsafe`).
 * Stops when |f| ≤ fTol (then takes that last Newton step if it is small and inside the bracket) or
 * the step is below xTol·|x|; returns x, always inside the bracket and finite.
 */
export function solveBracketed(
  fn: ValueAndSlope,
  lo: number,
  fLo: number,
  hi: number,
  fHi: number,
  x0: number,
  fTol: number,
  xTol: number,
): number {
  if (fLo === 0) return lo;
  if (fHi === 0) return hi;
  // Orient so that f(xl) < 0 < f(xh).
  let xl = fLo < 0 ? lo : hi;
  let xh = fLo < 0 ? hi : lo;
  let x = x0 > Math.min(lo, hi) && x0 < Math.max(lo, hi) ? x0 : 0.5 * (lo + hi);
  let dxOld = Math.abs(hi - lo);
  let dx = dxOld;
  fn(x, SCRATCH);
  let f = SCRATCH[0] as number;
  let df = SCRATCH[1] as number;
  for (let k = 0; k < 200; k++) {
    if (Math.abs(f) <= fTol) {
      // Finish with the Newton step this evaluation already paid for, if it is small and stays
      // inside the bracket (a vanishing slope would make it neither).
      const step = f / df;
      const polished = x - step;
      const inside = polished > Math.min(xl, xh) && polished < Math.max(xl, xh);
      return inside && Math.abs(step) <= 1e-6 * Math.abs(x) ? polished : x;
    }
    if (f < 0) xl = x;
    else xh = x;
    const newtonLeaves = ((x - xh) * df - f) * ((x - xl) * df - f) > 0;
    if (newtonLeaves || !(Math.abs(2 * f) <= Math.abs(dxOld * df))) {
      dxOld = dx;
      dx = 0.5 * (xh - xl);
      x = xl + dx;
    } else {
      dxOld = dx;
      dx = f / df;
      x -= dx;
    }
    if (Math.abs(dx) <= xTol * Math.abs(x)) return x;
    fn(x, SCRATCH);
    f = SCRATCH[0] as number;
    df = SCRATCH[1] as number;
  }
  return x;
}
