// Densities for region 3: the saturated roots of Eq. (28) at p_s(T) and the (T, p) solve.
// (Their use through the public API is tested in saturation.test.ts and state-tp.test.ts.)
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { saturationPressure } from '../../../src/core/index.ts';
import { P3, region3Pressure } from '../../../src/core/steam/region3.ts';
import {
  computeSeedTable, region3DensityFromTP, region3SaturatedDensities, region3SaturatedDensity, region3SaturatedDensitySeeds, SAT3, SEED3,
} from '../../../src/core/steam/region3-density.ts';
import { SEED_TABLE_LIQUID, SEED_TABLE_VAPOR } from '../../../src/core/steam/region3-seed-table.ts';

const Tc = 647.096;

describe('region 3 densities', () => {
  it('saturated roots: on the stable branches (∂p/∂ρ > 0), liquid above ρc, vapor below, up to 1e-4 K below Tc', () => {
    fc.assert(
      fc.property(fc.double({ min: 623.150001, max: Tc - 1e-4, noNaN: true }), (T) => {
        const ps = saturationPressure(T);
        region3SaturatedDensities(T, ps);
        const [rf, rg] = [SAT3[0] as number, SAT3[1] as number];
        expect(rf).toBeGreaterThan(322);
        expect(rg).toBeLessThan(322);
        for (const rho of [rf, rg]) {
          region3Pressure(rho, T);
          expect(Math.abs((P3[0] as number) - ps) / ps).toBeLessThan(1e-9);
          expect(P3[1] as number).toBeGreaterThan(0);
        }
      }),
      { numRuns: 500 },
    );
  });

  it('the same temperature twice gives the same densities (one-entry cache)', () => {
    region3SaturatedDensities(640, saturationPressure(640));
    const first = [SAT3[0], SAT3[1]];
    region3SaturatedDensities(641, saturationPressure(641));
    region3SaturatedDensities(640, saturationPressure(640));
    expect([SAT3[0], SAT3[1]]).toEqual(first);
  });

  it('starting values are within 3e-4 of the roots (stateTV relies on it with a 1e-3 margin)', () => {
    fc.assert(
      fc.property(fc.double({ min: 623.150001, max: Tc, noNaN: true }), (T) => {
        region3SaturatedDensities(T, saturationPressure(T));
        region3SaturatedDensitySeeds(T);
        expect(Math.abs((SEED3[0] as number) / (SAT3[0] as number) - 1)).toBeLessThan(3e-4);
        expect(Math.abs((SEED3[1] as number) / (SAT3[1] as number) - 1)).toBeLessThan(3e-4);
      }),
      { numRuns: 1000 },
    );
  });

  it('(T, p) → ρ at and just above Tc, where the isotherm is flattest, still meets p to 1e-9', () => {
    for (const T of [Tc, Tc + 1e-6, Tc + 0.01, 648, 650]) {
      for (const p of [21e6, 22e6, 22.064e6, 22.1e6, 23e6, 30e6]) {
        const rho = region3DensityFromTP(T, p);
        region3Pressure(rho, T);
        expect(Math.abs((P3[0] as number) - p) / p, `T ${T} p ${p}`).toBeLessThan(1e-9);
      }
    }
  });
});

describe('the stored table of region 3 starting values', () => {
  it('is exactly what computeSeedTable solves (IAPWS R7-97(2012) Eq. (28) at p_s(T), bit for bit)', () => {
    const solved = computeSeedTable();
    expect(Array.from(SEED_TABLE_LIQUID)).toEqual(Array.from(solved.liquid));
    expect(Array.from(SEED_TABLE_VAPOR)).toEqual(Array.from(solved.vapor));
    expect(SEED_TABLE_LIQUID.length).toBe(96);
  });
});

describe('region3SaturatedDensity: one phase alone', () => {
  it('gives exactly the pair\'s liquid and vapor roots from 623.15 K to Tc (fast-check)', () => {
    fc.assert(
      fc.property(fc.oneof(fc.double({ min: 623.1500001, max: Tc, noNaN: true }), fc.double({ min: Tc - 0.02, max: Tc, noNaN: true })), fc.boolean(), (T, liquid) => {
        const ps = saturationPressure(T);
        // Another temperature first, so neither call is answered by the one-entry cache.
        region3SaturatedDensities(630, saturationPressure(630));
        const one = region3SaturatedDensity(T, ps, liquid);
        region3SaturatedDensities(630.5, saturationPressure(630.5));
        region3SaturatedDensities(T, ps);
        expect(one).toBe(liquid ? SAT3[0] : SAT3[1]);
      }),
      { numRuns: 300 },
    );
  });
});
