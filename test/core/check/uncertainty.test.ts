import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { combineBand, inventoryBands, netMassToleranceKg, temperatureToleranceK } from '../../../src/core/check/uncertainty.ts';
import { saturation } from '../../../src/core/steam/index.ts';
import { testVessel } from './test-vessel.ts';

describe('instrument tolerances', () => {
  it('IEC 60751 at 121 °C: AA ±0.31, A ±0.39, B ±0.91 K (IEC 60751 class formulas at t = 121 °C, rounded; exact 0.3057 / 0.392 / 0.905)', () => {
    const at121 = (sensorClass: 'AA' | 'A' | 'B') => temperatureToleranceK({ kind: 'iec-60751', sensorClass }, 394.15);
    expect(at121('AA')).toBeCloseTo(0.1 + 0.0017 * 121, 12);
    expect(at121('A')).toBeCloseTo(0.15 + 0.002 * 121, 12);
    expect(at121('B')).toBeCloseTo(0.3 + 0.005 * 121, 12);
    for (const [c, rounded] of [['AA', 0.31], ['A', 0.39], ['B', 0.91]] as const) expect(Math.abs(at121(c) - rounded)).toBeLessThan(0.006);
  });
  it('a stated tolerance is used as given', () => {
    expect(temperatureToleranceK({ kind: 'stated', toleranceK: 0.7 }, 400)).toBe(0.7);
  });
  it('RSS is at most the worst case and at least the largest part (fast-check; algebra)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1e6, noNaN: true }), fc.double({ min: 0, max: 1e6, noNaN: true }), fc.double({ min: 0, max: 1e6, noNaN: true }), (a, b, c) => {
        const band = combineBand({ a, b, c });
        return band.plusMinus <= band.worstCase * (1 + 1e-12) && band.plusMinus >= Math.max(a, b, c) * (1 - 1e-12);
      }),
    );
  });
  it('a gross weight carries two weight readings (gross and tare, RSS); a net weight one', () => {
    const v = testVessel();
    expect(netMassToleranceKg(v, 'net')).toBe(2);
    expect(netMassToleranceKg(v, 'gross')).toBeCloseTo(2 * Math.SQRT2, 12);
  });
});

describe('quality and liquid-mass bands', () => {
  const V = 3.845;
  const T = 423.15;
  it('3.845 m³ at 150 °C, 2000 kg: ±1 % of V moves x by ±0.00005 (computed with python3-iapws 1.5.2 (IAPWS-IF97))', () => {
    const b = inventoryBands({ temperatureK: T, massKg: 2000, volumeM3: V, massToleranceKg: 0, temperatureToleranceK: 0, volumeToleranceM3: 0.01 * V });
    expect(b.quality.plusMinus).toBeCloseTo(0.00005, 5);
  });
  it('3.845 m³ at 150 °C, 50 kg: dx/dm = −0.0039 per kg (computed with python3-iapws 1.5.2 (IAPWS-IF97))', () => {
    const b = inventoryBands({ temperatureK: T, massKg: 50, volumeM3: V, massToleranceKg: 1, temperatureToleranceK: 0, volumeToleranceM3: 0 });
    expect(b.quality.plusMinus).toBeCloseTo(0.0039, 4);
  });
  it('1 kg of mass error is about 1 L of liquid: dV_liq/dm = v_g·v_f/(v_g − v_f) (differentiating the mass and volume balances)', () => {
    const b = inventoryBands({ temperatureK: T, massKg: 2000, volumeM3: V, massToleranceKg: 1, temperatureToleranceK: 0, volumeToleranceM3: 0 });
    const s = saturation(T);
    expect(b.liquidMassKg.plusMinus * s.liquid.v).toBeCloseTo((s.vapor.v * s.liquid.v) / (s.vapor.v - s.liquid.v), 9);
  });
  it('the temperature part matches a finite difference of x recomputed here from saturation values (definition)', () => {
    const m = 500;
    const x = (t: number) => { const s = saturation(t); return (V / m - s.liquid.v) / (s.vapor.v - s.liquid.v); };
    const slope = (x(T + 0.5) - x(T - 0.5)) / 1;
    const b = inventoryBands({ temperatureK: T, massKg: m, volumeM3: V, massToleranceKg: 0, temperatureToleranceK: 0.4, volumeToleranceM3: 0 });
    expect(b.quality.contributions.temperature).toBeCloseTo(Math.abs(slope) * 0.4, 6);
    expect(b.quality.plusMinus).toBeCloseTo(b.quality.contributions.temperature, 12);
  });
  it('zero tolerances give zero bands', () => {
    const b = inventoryBands({ temperatureK: T, massKg: 100, volumeM3: V, massToleranceKg: 0, temperatureToleranceK: 0, volumeToleranceM3: 0 });
    expect(b.quality.plusMinus).toBe(0);
    expect(b.liquidMassKg.plusMinus).toBe(0);
  });
});
