import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { bisectionResult } from '../../../src/core/check/bisection.ts';
import { allVaporTemperatureK, liquidFullTemperatureK } from '../../../src/core/check/heat-up-envelope.ts';
import { levelSolver, liquidLevelFromVolume, liquidVolumeFromLevel, vesselLevelSpanM, vesselVolume, type CylinderGeometry, type HeadSpec } from '../../../src/core/check/vessel-geometry.ts';
import { saturation } from '../../../src/core/steam/index.ts';

/** The plain bisection bisectionResult promises to reproduce. */
function plain(f: (x: number) => number, lo: number, hi: number, maxSteps: number, stopWidth: number): number {
  for (let i = 0; i < maxSteps && hi - lo > stopWidth; i++) {
    const mid = 0.5 * (lo + hi);
    if (f(mid) < 0) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

describe('bisectionResult lands exactly where plain bisection lands', () => {
  it('over random rising functions, roots inside, at and outside the interval (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -5, max: 5, noNaN: true }),
        fc.double({ min: 0.01, max: 50, noNaN: true }),
        fc.double({ min: -10, max: 10, noNaN: true }),
        fc.constantFrom(1, 3),
        fc.constantFrom(40, 60, 80),
        (lo, width, root, power, steps) => {
          const hi = lo + width;
          // Odd powers rise everywhere, flat at the root for power 3 (a hard case for the secant).
          const f = (x: number) => (power === 1 ? x - root : (x - root) * (x - root) * (x - root));
          const stop = steps === 80 ? 1e-12 * width : 0;
          expect(bisectionResult(f, lo, hi, steps, stop, () => 1e-14 * (1 + Math.abs(lo) + width) ** power, 1e-12 * width)).toBe(plain(f, lo, hi, steps, stop));
        },
      ),
      { numRuns: 300 },
    );
  });
  it('from any start: an estimate with a slope, good, poor or wrong, or two known points (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -5, max: 5, noNaN: true }),
        fc.double({ min: 0.01, max: 50, noNaN: true }),
        fc.double({ min: -10, max: 10, noNaN: true }),
        fc.constantFrom(1, 3),
        fc.double({ min: -1, max: 1, noNaN: true }),
        fc.oneof(fc.double({ min: -10, max: 10, noNaN: true }), fc.constantFrom(0, 1e-300, Infinity)),
        fc.boolean(),
        (lo, width, root, power, offset, slope, known) => {
          const hi = lo + width;
          const f = (x: number) => (power === 1 ? x - root : (x - root) * (x - root) * (x - root));
          const start = known
            ? { below: Math.max(lo, root - Math.abs(offset)), fBelow: f(Math.max(lo, root - Math.abs(offset))), above: Math.min(hi, root + Math.abs(offset)), fAbove: f(Math.min(hi, root + Math.abs(offset))) }
            : { x: root + offset * width, slope };
          expect(bisectionResult(f, lo, hi, 60, 0, () => 1e-14 * (1 + Math.abs(lo) + width) ** power, 1e-12 * width, start)).toBe(plain(f, lo, hi, 60, 0));
        },
      ),
      { numRuns: 400 },
    );
  });
  it('from a close start, in a handful of evaluations (a straight line: the estimate, one step past the root, one back)', () => {
    let n = 0;
    const f = (x: number) => {
      n++;
      return 2 * x - 1.3;
    };
    const got = bisectionResult(f, 0, 2, 80, 2e-12, () => 1e-13, 1e-14, { x: 0.6, slope: 2 });
    expect(got).toBe(plain((x) => 2 * x - 1.3, 0, 2, 80, 2e-12));
    expect(n).toBeLessThanOrEqual(6);
  });
  it('with far fewer evaluations than plain bisection (60 steps on [277.14, 647.096] K)', () => {
    let n = 0;
    const f = (T: number) => {
      n++;
      return Math.exp((T - 600) / 50) - 1;
    };
    const got = bisectionResult(f, 277.14, 647.096, 60, 0, () => 1e-13, 1e-12);
    expect(got).toBe(plain((T) => Math.exp((T - 600) / 50) - 1, 277.14, 647.096, 60, 0));
    expect(n).toBeLessThan(24);
  });
});

describe('the engine solves that use it give plain bisection\'s doubles', () => {
  const plainLiquidFull = (v: number) => plain((T) => saturation(T).liquid.v - v, 277.14, 647.096, 60, -Infinity);
  const plainAllVapor = (v: number) => plain((T) => v - saturation(T).vapor.v, 273.16, 647.096, 60, -Infinity);
  it('liquid-full and all-vapor temperatures over fills from 1.0003e-3 to 200 m³/kg, the critical volume included (fast-check)', () => {
    const vc = saturation(647.096).liquid.v;
    fc.assert(
      fc.property(fc.oneof(fc.double({ min: Math.log(1.0003e-3), max: Math.log(200), noNaN: true }).map(Math.exp), fc.double({ min: 0.98 * vc, max: 1.02 * vc, noNaN: true })), (v) => {
        const lf = liquidFullTemperatureK(v);
        if (lf !== null && lf !== 273.16) expect(lf).toBe(plainLiquidFull(v));
        const av = allVaporTemperatureK(v);
        if (av !== null && av !== 273.16) expect(av).toBe(plainAllVapor(v));
      }),
      { numRuns: 400 },
    );
  });
  it('liquid levels over random cylinder vessels and fills, bottom and top included (fast-check)', () => {
    const head = fc.constantFrom<HeadSpec>({ kind: 'flat' }, { kind: 'semi-ellipsoidal-2-1' }, { kind: 'hemispherical' }, { kind: 'torispherical' }, { kind: 'torispherical', crownRadiusM: 0.9, knuckleRadiusM: 0.12 });
    fc.assert(
      fc.property(fc.constantFrom('vertical-cylinder' as const, 'horizontal-cylinder' as const), head, fc.double({ min: 0.3, max: 3, noNaN: true }), fc.double({ min: 0.01, max: 6, noNaN: true }), fc.oneof(fc.double({ min: 0, max: 1, noNaN: true }), fc.constantFrom(0, 1e-12, 1 - 1e-12, 1)), (shape, h, D, L, share) => {
        if (shape === 'horizontal-cylinder' && h.kind === 'torispherical') return; // solved by Newton's method instead (vessel-geometry.ts)
        // The custom head closes only while its crown radius (0.9 m) is at least D/2.
        const g: CylinderGeometry = { shape, innerDiameterM: 'crownRadiusM' in h ? Math.min(D, 1.8) : D, straightLengthM: L, head: h };
        const V = vesselVolume(g) * share;
        const span = vesselLevelSpanM(g);
        const expected = plain((x) => liquidVolumeFromLevel(g, x) - V, 0, span, 80, 1e-12 * span);
        expect(liquidLevelFromVolume(g, V)).toBe(expected);
      }),
      { numRuns: 300 },
    );
  });
  it('one solver over a run of nearby fills, each solve starting from the last level (the level band), gives each fill\'s own level (fast-check)', () => {
    const head = fc.constantFrom<HeadSpec>({ kind: 'flat' }, { kind: 'semi-ellipsoidal-2-1' }, { kind: 'hemispherical' }, { kind: 'torispherical' });
    fc.assert(
      fc.property(fc.constantFrom('vertical-cylinder' as const, 'horizontal-cylinder' as const), head, fc.double({ min: 0.3, max: 3, noNaN: true }), fc.double({ min: 0, max: 6, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), fc.array(fc.double({ min: -2e-3, max: 2e-3, noNaN: true }), { minLength: 1, maxLength: 7 }), (shape, h, D, L, share, steps) => {
        if (shape === 'horizontal-cylinder' && h.kind === 'torispherical') return;
        const g: CylinderGeometry = { shape, innerDiameterM: D, straightLengthM: h.kind === 'flat' ? Math.max(L, 0.01) : L, head: h };
        const total = vesselVolume(g);
        const span = vesselLevelSpanM(g);
        const solve = levelSolver(g);
        for (const step of [0, ...steps]) {
          const V = Math.min(1, Math.max(0, share + step)) * total;
          expect(solve(V)).toBe(plain((x) => liquidVolumeFromLevel(g, x) - V, 0, span, 80, 1e-12 * span));
        }
      }),
      { numRuns: 200 },
    );
  });
});
