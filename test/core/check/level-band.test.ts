// The liquid-level band of evaluateCheck, recomputed here from the saturation values and the
// geometry functions (not by calling the engine's band code), and checked against closed forms of
// solid geometry.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { evaluateCheck } from '../../../src/core/check/evaluate-check.ts';
import { liquidLevelFromVolume, vesselVolume, type CylinderGeometry } from '../../../src/core/check/vessel-geometry.ts';
import type { VesselSpec } from '../../../src/core/check/vessel-spec.ts';
import { IF97, saturation } from '../../../src/core/steam/index.ts';
import { testVessel } from './test-vessel.ts';

function vesselWith(geometry: VesselSpec['geometry'], tolK: number, weightTolKg: number, volumePercent: number): VesselSpec {
  const base = testVessel();
  return testVessel({
    geometry,
    mawpGaugePa: 21e6,
    reliefSetGaugePa: 20e6,
    designTemperatureK: 650,
    instruments: { ...base.instruments, pressureGauge: { spanPa: 25e6, accuracyPercentOfSpan: 0 }, temperatureSensor: { kind: 'stated', toleranceK: tolK }, weightToleranceKg: weightTolKg, volumeTolerancePercent: volumePercent },
  });
}

/** A reading exactly on the saturation line, net weight (one weight reading: its ± limit is the instrument's). */
function readingAt(T: number, netKg: number) {
  return { time: '2026-01-01T00:00:00Z', temperatureK: T, pressure: { reference: 'absolute' as const, pressurePa: saturation(T).p }, weight: { kind: 'net' as const, netKg } };
}

/** Mass and volume balances from saturation values: V_liq = v_f·(m·v_g − V)/(v_g − v_f). */
function liquidVolume(T: number, m: number, V: number): number {
  const s = saturation(T);
  return (s.liquid.v * (m * s.vapor.v - V)) / (s.vapor.v - s.liquid.v);
}

/** Net mass that puts `fill` of the volume as saturated liquid at T. */
function massForFill(T: number, V: number, fill: number): number {
  const s = saturation(T);
  return (fill * V) / s.liquid.v + ((1 - fill) * V) / s.vapor.v;
}

describe('liquid level band: closed forms of solid geometry', () => {
  it('vertical cylinder with flat heads: h = V_liq/(π·D²/4), so each contribution is the liquid-volume change over the cross-section (solid geometry; mass and volume balances)', () => {
    const D = 1.5, L = 3;
    const A = (Math.PI * D * D) / 4;
    const g: CylinderGeometry = { shape: 'vertical-cylinder', innerDiameterM: D, straightLengthM: L, head: { kind: 'flat' } };
    const T = 423.15, tolK = 0.6, tolKg = 3, volPct = 1;
    const V = A * L;
    const m = massForFill(T, V, 0.5);
    const r = evaluateCheck(vesselWith(g, tolK, tolKg, volPct), readingAt(T, m));
    const band = r.inventoryBands!.liquidLevelM!;
    const s = saturation(T);
    const vfg = s.vapor.v - s.liquid.v;
    // Linear in m and V: the liquid volume changes by v_f·v_g/(v_g − v_f) per kg and −v_f/(v_g − v_f) per m³.
    expect(band.contributions.weight).toBeCloseTo(((s.liquid.v * s.vapor.v) / vfg) * tolKg / A, 9);
    expect(band.contributions.volume).toBeCloseTo(((s.liquid.v / vfg) * (volPct / 100) * V) / A, 9);
    const dVliq = (liquidVolume(T + tolK, m, V) - liquidVolume(T - tolK, m, V)) / 2;
    expect(band.contributions.temperature).toBeCloseTo(Math.abs(dVliq) / A, 9);
    const c = band.contributions;
    expect(band.method).toBe('root-sum-square');
    expect(band.plusMinus).toBeCloseTo(Math.hypot(c.weight, c.temperature, c.volume), 12);
    expect(band.worstCase).toBeCloseTo(c.weight + c.temperature + c.volume, 12);
    expect(band.plusMinus).toBeGreaterThan(0);
  });

  it('horizontal cylinder with flat heads: for small limits the band is δV_liq / (2·L·√(h·(D − h))), the liquid surface area (chord of the circle; solid geometry)', () => {
    const D = 1.2, L = 4;
    const g: CylinderGeometry = { shape: 'horizontal-cylinder', innerDiameterM: D, straightLengthM: L, head: { kind: 'flat' } };
    const T = 393.15, tolKg = 0.05;
    for (const fill of [0.2, 0.5, 0.8]) {
      const V = vesselVolume(g);
      const m = massForFill(T, V, fill);
      const r = evaluateCheck(vesselWith(g, 0, tolKg, 0), readingAt(T, m));
      if (r.inventory.regime !== 'two-phase' || !r.inventory.liquidLevel) throw new Error('expected a two-phase level');
      const h = r.inventory.liquidLevel.levelM;
      const s = saturation(T);
      const dVliq = ((s.liquid.v * s.vapor.v) / (s.vapor.v - s.liquid.v)) * tolKg;
      const expected = dVliq / (2 * L * Math.sqrt(h * (D - h)));
      const band = r.inventoryBands!.liquidLevelM!;
      expect(Math.abs(band.contributions.weight / expected - 1)).toBeLessThan(1e-4);
      expect(band.contributions.temperature).toBe(0);
      expect(band.contributions.volume).toBe(0);
    }
  });

  it('a stated volume has no level and no level band', () => {
    const r = evaluateCheck(vesselWith({ shape: 'stated-volume', volumeM3: 2 }, 0.5, 1, 1), readingAt(423.15, massForFill(423.15, 2, 0.4)));
    expect(r.inventoryBands).not.toBeNull();
    expect(r.inventoryBands!.liquidLevelM).toBeNull();
  });
});

describe('liquid level band over random vessels (fast-check)', () => {
  const head = fc.constantFrom(
    { kind: 'flat' } as const, { kind: 'semi-ellipsoidal-2-1' } as const, { kind: 'hemispherical' } as const, { kind: 'torispherical' } as const,
  );
  const cases = fc.record({
    shape: fc.constantFrom('vertical-cylinder' as const, 'horizontal-cylinder' as const),
    head,
    D: fc.double({ min: 0.3, max: 3, noNaN: true }),
    lengthRatio: fc.double({ min: 0.5, max: 4, noNaN: true }),
    T: fc.double({ min: 300, max: 620, noNaN: true }),
    fill: fc.double({ min: 0.02, max: 0.95, noNaN: true }),
    tolK: fc.oneof(fc.constant(0), fc.double({ min: 0.01, max: 2, noNaN: true })),
    weightShare: fc.oneof(fc.constant(0), fc.double({ min: 1e-4, max: 0.03, noNaN: true })),
    volumePercent: fc.oneof(fc.constant(0), fc.double({ min: 0.01, max: 3, noNaN: true })),
  });

  it('each contribution is the half-difference of the geometry level at the liquid volume with that input at ∓ its limit (recomputed from saturation values and liquidLevelFromVolume); RSS and worst case combine them', () => {
    fc.assert(
      fc.property(cases, (c) => {
        const g: CylinderGeometry = { shape: c.shape, innerDiameterM: c.D, straightLengthM: c.lengthRatio * c.D, head: c.head };
        const V = vesselVolume(g);
        const m = massForFill(c.T, V, c.fill);
        const tolKg = c.weightShare * m;
        const r = evaluateCheck(vesselWith(g, c.tolK, tolKg, c.volumePercent), readingAt(c.T, m));
        if (r.inventory.regime !== 'two-phase') return true; // a random fill can land exactly liquid-full only at the limits
        const band = r.inventoryBands!.liquidLevelM!;
        const lvl = (T: number, mass: number, vol: number) => liquidLevelFromVolume(g, Math.min(Math.max(liquidVolume(T, mass, vol), 0), V));
        const dV = (c.volumePercent / 100) * V;
        const tHi = Math.min(IF97.Tc - 1e-6, c.T + c.tolK);
        const tLo = Math.max(IF97.Tt, c.T - c.tolK);
        const expected = {
          weight: tolKg === 0 ? 0 : Math.abs(lvl(c.T, m + tolKg, V) - lvl(c.T, m - tolKg, V)) / 2,
          temperature: c.tolK === 0 ? 0 : (Math.abs(lvl(tHi, m, V) - lvl(tLo, m, V)) * c.tolK) / (tHi - tLo),
          volume: dV === 0 ? 0 : Math.abs(lvl(c.T, m, V + dV) - lvl(c.T, m, V - dV)) / 2,
        };
        for (const k of ['weight', 'temperature', 'volume'] as const) {
          expect(Math.abs(band.contributions[k] - expected[k])).toBeLessThanOrEqual(1e-9 * Math.max(expected[k], 1e-3));
        }
        expect(band.plusMinus).toBeCloseTo(Math.hypot(expected.weight, expected.temperature, expected.volume), 9);
        expect(band.worstCase).toBeGreaterThanOrEqual(band.plusMinus * (1 - 1e-12));
        // The level at the nominal inputs is the same function of the same liquid volume.
        expect(r.inventory.liquidLevel!.levelM).toBeCloseTo(lvl(c.T, m, V), 9);
        return true;
      }),
      { numRuns: 150 },
    );
  });

  it('with zero limits the level band is zero; with larger limits it does not shrink (monotone in the limits, fast-check)', () => {
    fc.assert(
      fc.property(cases, fc.double({ min: 1.1, max: 3, noNaN: true }), (c, k) => {
        const g: CylinderGeometry = { shape: c.shape, innerDiameterM: c.D, straightLengthM: c.lengthRatio * c.D, head: c.head };
        const V = vesselVolume(g);
        const m = massForFill(c.T, V, c.fill);
        const zero = evaluateCheck(vesselWith(g, 0, 0, 0), readingAt(c.T, m));
        if (zero.inventory.regime !== 'two-phase') return true;
        expect(zero.inventoryBands!.liquidLevelM!.plusMinus).toBe(0);
        const small = evaluateCheck(vesselWith(g, 0, c.weightShare * m, 0), readingAt(c.T, m)).inventoryBands!.liquidLevelM!;
        const large = evaluateCheck(vesselWith(g, 0, k * c.weightShare * m, 0), readingAt(c.T, m)).inventoryBands!.liquidLevelM!;
        expect(large.plusMinus).toBeGreaterThanOrEqual(small.plusMinus * (1 - 1e-9));
        return true;
      }),
      { numRuns: 60 },
    );
  });
});
