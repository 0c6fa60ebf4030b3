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

export function expectClose(actual: ArrayLike<number>, expected: number[], label: string): void {
  expected.forEach((e, k) => {
    const a = actual[k] as number;
    expect(Math.abs(a - e), `${label} [${k}] ${a} vs ${e}`).toBeLessThanOrEqual(1e-11 * Math.abs(e) + 1e-13);
  });
}

