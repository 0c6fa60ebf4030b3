// The optimised evaluation of the three basic equations (power ladders, weighted sums) against a
// plain term-by-term evaluation with Math.pow of the same IAPWS R7-97(2012) tables: Eq. (7)
// Table 2, Eq. (15) Tables 10 and 11, Eq. (28) Table 30. Catches a wrong power in a ladder even
// where the verification tables' few points would not.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { G1, REGION1_TABLE, region1Gibbs } from '../../../src/core/steam/region1.ts';
import { G2, REGION2_TABLE, region2Residual } from '../../../src/core/steam/region2.ts';
import { F3, REGION3_TABLE, region3Helmholtz } from '../../../src/core/steam/region3.ts';

/** Sums Σ n·x^I·y^J and its first and second partial derivatives in x and y. */
function plainSums(I: readonly number[], J: readonly number[], n: readonly number[], x: number, y: number): number[] {
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

function expectClose(actual: ArrayLike<number>, expected: number[], label: string): void {
  expected.forEach((e, k) => {
    const a = actual[k] as number;
    expect(Math.abs(a - e), `${label} [${k}] ${a} vs ${e}`).toBeLessThanOrEqual(1e-11 * Math.abs(e) + 1e-13);
  });
}

describe('basic equations, term by term', () => {
  it('region 1, Eq. (7): γ and five derivatives', () => {
    fc.assert(
      fc.property(fc.double({ min: 273.15, max: 623.15, noNaN: true }), fc.double({ min: 1e3, max: 100e6, noNaN: true }), (T, p) => {
        const a = 7.1 - p / 16.53e6, b = 1386 / T - 1.222;
        const [g, ga, gaa, gb, gbb, gab] = plainSums(REGION1_TABLE.I, REGION1_TABLE.J, REGION1_TABLE.n, a, b) as [number, number, number, number, number, number];
        region1Gibbs(T, p);
        // d/dπ of (7.1 − π)^I flips the sign of the a-derivatives
        expectClose(G1, [g, -ga, gaa, gb, gbb, -gab], `T=${T} p=${p}`);
      }),
      { numRuns: 300 },
    );
  });

  it('region 2, Eq. (17): γʳ and five derivatives', () => {
    fc.assert(
      fc.property(fc.double({ min: 273.15, max: 1073.15, noNaN: true }), fc.double({ min: 1, max: 100e6, noNaN: true }), (T, p) => {
        const sums = plainSums(REGION2_TABLE.I, REGION2_TABLE.J, REGION2_TABLE.n, p / 1e6, 540 / T - 0.5);
        region2Residual(T, p);
        expectClose(G2, sums, `T=${T} p=${p}`);
      }),
      { numRuns: 300 },
    );
  });

  it('region 3, Eq. (28): φ and five derivatives', () => {
    fc.assert(
      fc.property(fc.double({ min: 623.15, max: 863.15, noNaN: true }), fc.double({ min: 50, max: 800, noNaN: true }), (T, rho) => {
        const d = rho / 322, t = 647.096 / T, n1 = REGION3_TABLE.n1;
        const s = plainSums(REGION3_TABLE.I, REGION3_TABLE.J, REGION3_TABLE.n, d, t);
        region3Helmholtz(rho, T);
        expectClose(F3, [n1 * Math.log(d) + s[0]!, n1 / d + s[1]!, -n1 / (d * d) + s[2]!, s[3]!, s[4]!, s[5]!], `T=${T} rho=${rho}`);
      }),
      { numRuns: 300 },
    );
  });
});
