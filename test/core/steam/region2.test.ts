// Region 2, Eq. (17) of IAPWS R7-97(2012): the optimised γʳ(π, τ) against a plain term-by-term sum of
// Table 11. Published values: test/reference/if97-tables.test.ts (Table 15).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { G2, REGION2_TABLE, region2PressureDerivatives, region2Residual } from '../../../src/core/steam/region2.ts';
import { expectClose, plainMagnitudes, plainSums } from './plain-sums.ts';

describe('region 2 basic equation, term by term', () => {
  it('region 2, Eq. (17): γʳ and five derivatives', () => {
    fc.assert(
      fc.property(fc.double({ min: 273.15, max: 1073.15, noNaN: true }), fc.double({ min: 1, max: 100e6, noNaN: true }), (T, p) => {
        const sums = plainSums(REGION2_TABLE.I, REGION2_TABLE.J, REGION2_TABLE.n, p / 1e6, 540 / T - 0.5);
        region2Residual(T, p);
        expectClose(G2, sums, `T=${T} p=${p}`, plainMagnitudes(REGION2_TABLE.I, REGION2_TABLE.J, REGION2_TABLE.n, p / 1e6, 540 / T - 0.5));
      }),
      // 782.87 K, 99.99 MPa: the terms cancel to 0.0515 and a fixed 1e-13 floor once failed there.
      { numRuns: 300, examples: [[782.8697539758671, 99993668.86224736]] },
    );
  });
  it('region2PressureDerivatives gives the same γʳ_π, γʳ_ππ as the full evaluation', () => {
    fc.assert(
      fc.property(fc.double({ min: 273.15, max: 1073.15, noNaN: true }), fc.double({ min: 1, max: 100e6, noNaN: true }), (T, p) => {
        region2Residual(T, p);
        const full = [G2[1] as number, G2[2] as number];
        region2PressureDerivatives(T, p);
        expect([G2[1], G2[2]]).toEqual(full);
      }),
      { numRuns: 200 },
    );
  });
});
