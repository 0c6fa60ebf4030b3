// Region 3, Eq. (28) of IAPWS R7-97(2012): the optimised φ(δ, τ) against a plain term-by-term sum of
// Table 30. Published values: test/reference/if97-tables.test.ts (Table 33).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { F3, P3, REGION3_TABLE, region3Helmholtz, region3Pressure, region3State } from '../../../src/core/steam/region3.ts';
import { expectClose, plainSums } from './plain-sums.ts';

describe('region 3 basic equation, term by term', () => {
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
  it('region3Pressure: p as in Table 31 (p = ρ·R·T·δ·φ_δ) and its slope as a central difference', () => {
    fc.assert(
      fc.property(fc.double({ min: 623.15, max: 863.15, noNaN: true }), fc.double({ min: 50, max: 800, noNaN: true }), (T, rho) => {
        const p = region3State(rho, T).p;
        region3Pressure(rho, T);
        expect(Math.abs((P3[0] as number) - p)).toBeLessThanOrEqual(1e-12 * Math.abs(p));
        const slope = P3[1] as number;
        const h = rho * 1e-5;
        region3Pressure(rho + h, T);
        const up = P3[0] as number;
        region3Pressure(rho - h, T);
        const fd = (up - (P3[0] as number)) / (2 * h);
        expect(Math.abs(fd - slope)).toBeLessThanOrEqual(1e-6 * Math.abs(slope) + 1e-3);
      }),
      { numRuns: 200 },
    );
  });
});
