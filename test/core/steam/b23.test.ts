// B23, the boundary between regions 2 and 3 (IAPWS R7-97(2012) Eqs. (5), (6)).
// Published check values are in test/reference/if97-tables.test.ts.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { b23Pressure, b23Temperature } from '../../../src/core/steam/b23.ts';
import { saturationPressure } from '../../../src/core/index.ts';

describe('B23', () => {
  // Eq. (6) is Eq. (5) solved for T, but its n4, n5 are printed to 14 digits, so the inverse is
  // exact only to ~1e-11 relative: 1e-8 K is that with a margin.
  it('T → p → T round trip over 623.15 … 863.15 K', () => {
    fc.assert(
      fc.property(fc.double({ min: 623.15, max: 863.15, noNaN: true }), (T) => {
        expect(Math.abs(b23Temperature(b23Pressure(T)) - T)).toBeLessThan(1e-8);
      }),
      { numRuns: 1000 },
    );
  });

  it('ends: meets the saturation line at 623.15 K and reaches 100 MPa at 863.15 K (B23 endpoints computed with python3-iapws 1.5.2, _P23_T)', () => {
    expect(Math.abs(b23Pressure(623.15) - saturationPressure(623.15)) / 16.53e6).toBeLessThan(1e-8);
    expect(Math.abs(b23Pressure(863.15) - 100e6) / 100e6).toBeLessThan(1e-6);
  });
});
