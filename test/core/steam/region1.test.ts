// Region 1, Eq. (7) of IAPWS R7-97(2012): the optimised γ(π, τ) against a plain term-by-term sum of
// Table 2 (catches a wrong power in a ladder where the verification tables' three points would not).
// Published values: test/reference/if97-tables.test.ts (Table 5).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { G1, REGION1_TABLE, region1Gibbs, region1PressureDerivatives } from '../../../src/core/steam/region1.ts';
import { expectClose, plainSums } from './plain-sums.ts';

describe('region 1 basic equation, term by term', () => {
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
  it('region1PressureDerivatives gives the same γ_π, γ_ππ as the full evaluation', () => {
    fc.assert(
      fc.property(fc.double({ min: 273.15, max: 623.15, noNaN: true }), fc.double({ min: 1e3, max: 100e6, noNaN: true }), (T, p) => {
        region1Gibbs(T, p);
        const full = [G1[1] as number, G1[2] as number];
        region1PressureDerivatives(T, p);
        expect([G1[1], G1[2]]).toEqual(full);
      }),
      { numRuns: 200 },
    );
  });
});
