import { describe, expect, it } from 'vitest';
import { idealGasComparison } from '../../../src/core/check/ideal-gas.ts';
import { saturation } from '../../../src/core/steam/index.ts';

describe('ideal-gas comparison', () => {
  it('Z of saturated steam at 100 / 121 / 134 / 150 / 200 °C is 0.9845 / 0.9754 / 0.9680 / 0.9569 / 0.9057 (computed with python3-iapws 1.5.2 (IAPWS-IF97), IAPWS97(T, x=1))', () => {
    for (const [celsius, Z, error] of [[100, 0.9845, 1.6], [121, 0.9754, 2.5], [134, 0.968, 3.3], [150, 0.9569, 4.5], [200, 0.9057, 10.4]] as const) {
      const s = saturation(celsius + 273.15);
      const c = idealGasComparison(s.T, s.p, s.vapor.v);
      expect(c.compressibilityZ).toBeCloseTo(Z, 4);
      expect(c.idealGasErrorPercent).toBeCloseTo(error, 1);
    }
  });
});
