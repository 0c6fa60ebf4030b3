// Plain term-by-term evaluation of an IF97 power series with Math.pow, for checking the
// optimised evaluation in src/core/steam/region1.ts, region2.ts and region3.ts.
import { expect } from 'vitest';

/** Sums Σ n·x^I·y^J and its first and second partial derivatives in x and y. */
export function plainSums(I: readonly number[], J: readonly number[], n: readonly number[], x: number, y: number): number[] {
  const out = [0, 0, 0, 0, 0, 0];
  for (let k = 0; k < n.length; k++) {
    const i = I[k] as number, j = J[k] as number, c = n[k] as number;
    out[0]! += c * x ** i * y ** j;
    out[1]! += c * i * x ** (i - 1) * y ** j;
    out[2]! += c * i * (i - 1) * x ** (i - 2) * y ** j;
    out[3]! += c * j * x ** i * y ** (j - 1);
    out[4]! += c * j * (j - 1) * x ** i * y ** (j - 2);
    out[5]! += c * i * j * x ** (i - 1) * y ** (j - 1);
  }
  return out;
}

/** Σ|term| of each of the six sums above: the scale of their rounding error when terms cancel. */
export function plainMagnitudes(I: readonly number[], J: readonly number[], n: readonly number[], x: number, y: number): number[] {
  const out = [0, 0, 0, 0, 0, 0];
  for (let k = 0; k < n.length; k++) {
    const i = I[k] as number, j = J[k] as number, c = Math.abs(n[k] as number);
    const ax = Math.abs(x), ay = Math.abs(y);
    out[0]! += c * ax ** i * ay ** j;
    out[1]! += Math.abs(c * i * ax ** (i - 1) * ay ** j);
    out[2]! += Math.abs(c * i * (i - 1) * ax ** (i - 2) * ay ** j);
    out[3]! += Math.abs(c * j * ax ** i * ay ** (j - 1));
    out[4]! += Math.abs(c * j * (j - 1) * ax ** i * ay ** (j - 2));
    out[5]! += Math.abs(c * i * j * ax ** (i - 1) * ay ** (j - 1));
  }
  return out;
}

/**
 * Both evaluations round; where large terms cancel (region 2 near 100 MPa) the difference scales
 * with Σ|term|, not with the result. A sum of N terms rounds by at most about N·u·Σ|term| (u = 2⁻⁵³;
 * Higham, Accuracy and Stability of Numerical Algorithms, §4.2, from memory): 1e-14·Σ|term| covers
 * two 43-term sums with a small margin, on top of 1e-11 relative.
 */
export function expectClose(actual: ArrayLike<number>, expected: number[], label: string, magnitudes?: number[]): void {
  expected.forEach((e, k) => {
    const a = actual[k] as number;
    const cancellation = magnitudes ? 1e-14 * (magnitudes[k] as number) : 0;
    expect(Math.abs(a - e), `${label} [${k}] ${a} vs ${e}`).toBeLessThanOrEqual(1e-11 * Math.abs(e) + cancellation + 1e-13);
  });
}
