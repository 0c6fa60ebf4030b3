import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { inventoryOf, type Inventory } from '../../../src/core/check/inventory.ts';
import { vesselVolume, type VesselGeometry } from '../../../src/core/check/vessel-geometry.ts';
import { saturation } from '../../../src/core/steam/index.ts';

function inventory(geometry: VesselGeometry, netMassKg: number, temperatureK: number): Inventory {
  return inventoryOf({
    geometry,
    volumeM3: vesselVolume(geometry),
    netMassKg,
    temperatureK,
    atmospherePa: 101325,
    mawpGaugePa: 1e6,
    measuredAbsolutePressurePa: 2e5,
  });
}
function twoPhase(inv: Inventory) {
  if (inv.regime !== 'two-phase') throw new Error(`expected two-phase, got ${inv.regime}`);
  return inv;
}
const stated = (volumeM3: number): VesselGeometry => ({ shape: 'stated-volume', volumeM3 });
const example: VesselGeometry = { shape: 'horizontal-cylinder', innerDiameterM: 1.2, straightLengthM: 3, head: { kind: 'semi-ellipsoidal-2-1' } };

describe('inventory, textbook rigid tanks', () => {
  it('10 kg of water at 90 °C, 8 kg liquid: V = 4.73 m³, p = 70.183 kPa (Çengel & Boles, Thermodynamics: An Engineering Approach, ch. 3 worked example; from memory, its table values v_f 0.001036, v_g 2.3593 m³/kg corroborated by a Q&A page quoting the 5th edition)', () => {
    // Forward: the book's tank volume with its 10 kg gives back 8 kg of liquid and x = 0.2.
    const inv = twoPhase(inventory(stated(4.73), 10, 363.15));
    expect(inv.liquidMassKg).toBeCloseTo(8, 1);
    expect(inv.quality).toBeCloseTo(0.2, 2);
    expect(inv.saturationPressurePa / 1000).toBeCloseTo(70.18, 1);
  });
  it('22 kg of water at 127 °C, 9 kg liquid: V = 9.449 m³, p = 246.878 kPa (rigid-tank textbook exercise, answer worked on a Q&A page with steam-table v_f 0.00106683, v_g 0.72721 m³/kg)', () => {
    const inv = twoPhase(inventory(stated(9.449), 22, 400.15));
    expect(inv.liquidMassKg).toBeCloseTo(9, 1);
    expect(inv.saturationPressurePa / 1000).toBeCloseTo(246.88, 0);
  });
  it('1.8 m³ at 220 °C, one third liquid by volume: 518.1 kg, x = 0.0269, p = 2320 kPa (Çengel & Boles, ch. 3 end-of-chapter problem, from memory; answer worked on a Q&A page with v_f 0.001190, v_g 0.08609 m³/kg)', () => {
    const inv = twoPhase(inventory(stated(1.8), 518.1, 493.15));
    expect(inv.quality).toBeCloseTo(0.0269, 3);
    expect(inv.vaporSpaceFraction).toBeCloseTo(2 / 3, 2);
    expect(inv.saturationPressurePa / 1000).toBeCloseTo(2320, -1);
  });
  it('50 kg of saturated liquid at 90 °C fills 0.0518 m³ (Çengel & Boles, ch. 3 worked example; from memory)', () => {
    const inv = inventory(stated(0.0518), 50, 363.15);
    // At exactly that volume the tank is at the edge of liquid-full: almost no vapor mass.
    if (inv.regime === 'two-phase') expect(inv.vaporMassKg).toBeLessThan(0.001);
    else expect(inv.regime).toBe('liquid-full');
  });
  it('3.845 m³ at 150 °C: 2000 kg → x = 0.0021, V_liq = 2.176 m³ (56.6 %); 50 kg → x = 0.194, V_liq = 0.044 m³ (computed with python3-iapws 1.5.2 (IAPWS-IF97))', () => {
    const big = twoPhase(inventory(example, 2000, 423.15));
    expect(big.quality).toBeCloseTo(0.0021, 4);
    expect(big.liquidVolumeM3).toBeCloseTo(2.176, 2);
    expect(1 - big.vaporSpaceFraction).toBeCloseTo(0.566, 2);
    const small = twoPhase(inventory(example, 50, 423.15));
    expect(small.quality).toBeCloseTo(0.194, 3);
    expect(small.liquidVolumeM3).toBeCloseTo(0.044, 3);
  });
  it('gives the liquid level from the geometry: half the volume of liquid sits at half the diameter (geometry identity)', () => {
    const T = 423.15;
    const s = saturation(T);
    const V = vesselVolume(example);
    // m such that the liquid fills half: m_f·v_f = V/2 and m_g·v_g = V/2.
    const m = V / 2 / s.liquid.v + V / 2 / s.vapor.v;
    const inv = twoPhase(inventory(example, m, T));
    expect(inv.liquidLevel?.levelFraction).toBeCloseTo(0.5, 6);
    expect(inv.liquidLevel?.levelM).toBeCloseTo(0.6, 6);
  });
  it('a stated volume has no level', () => {
    expect(twoPhase(inventory(stated(1), 10, 400)).liquidLevel).toBeNull();
  });
});

describe('inventory regimes', () => {
  it('too much water is liquid-full with the hydraulic pressure and the MAWP comparison', () => {
    const inv = inventory(stated(1), 950, 393.15);
    expect(inv.regime).toBe('liquid-full');
    if (inv.regime !== 'liquid-full') return;
    expect(inv.hydraulic.exceedsMawp).toBe('certain');
    if (inv.hydraulic.withinFormulation) expect(inv.hydraulic.absolutePressurePa).toBeGreaterThan(1e6);
  });
  it('a little vapor is superheated with the pressure this mass would have', () => {
    const inv = inventory(stated(1), 0.5, 423.15); // v = 2 m³/kg > v_g(150 °C) = 0.3925
    expect(inv.regime).toBe('superheated');
    if (inv.regime !== 'superheated') return;
    // Nearly ideal at this density: p ≈ R·T/v (Z tends to 1 as the density falls; common practice).
    expect(inv.absolutePressurePa / ((461.526 * 423.15) / 2)).toBeCloseTo(1, 1);
    expect(inv.differenceFromReadingPa).toBeCloseTo(inv.absolutePressurePa - 2e5, 6);
  });
});

describe('inventory invariants (fast-check)', () => {
  const cases = fc.record({
    T: fc.double({ min: 280, max: 600, noNaN: true }),
    V: fc.double({ min: 0.01, max: 50, noNaN: true }),
    x: fc.double({ min: 0.001, max: 0.999, noNaN: true }),
  });
  it('quality and masses recomputed here from saturation values (mass and volume balances): x = (v − v_f)/(v_g − v_f), m_f + m_g = m, V = m_f·v_f + m_g·v_g', () => {
    fc.assert(
      fc.property(cases, ({ T, V, x }) => {
        const s = saturation(T);
        const vf = s.liquid.v;
        const vg = s.vapor.v;
        const m = V / (vf + x * (vg - vf));
        const inv = twoPhase(inventory(stated(V), m, T));
        const xHere = (V / m - vf) / (vg - vf);
        expect(inv.quality).toBeCloseTo(xHere, 9);
        expect(inv.vaporMassKg + inv.liquidMassKg).toBeCloseTo(m, 9);
        expect((inv.liquidMassKg * vf + inv.vaporMassKg * vg) / V).toBeCloseTo(1, 9);
        expect(inv.liquidVolumeM3).toBeCloseTo(((m * vg - V) * vf) / (vg - vf), 9);
      }),
      { numRuns: 300 },
    );
  });
  it('at fixed T and V, quality falls as mass rises (definition)', () => {
    fc.assert(
      fc.property(cases, fc.double({ min: 1.001, max: 3, noNaN: true }), ({ T, V, x }, factor) => {
        const s = saturation(T);
        const m = V / (s.liquid.v + x * (s.vapor.v - s.liquid.v));
        const a = inventory(stated(V), m, T);
        const b = inventory(stated(V), m * factor, T);
        const qa = twoPhase(a).quality;
        return b.regime === 'liquid-full' || (b.regime === 'two-phase' && b.quality < qa);
      }),
      { numRuns: 300 },
    );
  });
});
