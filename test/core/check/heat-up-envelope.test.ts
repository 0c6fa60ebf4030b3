import { describe, expect, it } from 'vitest';
import { allVaporTemperatureK, FIXED_SATURATED_VOLUMES_M3_PER_KG as FIXED, heatUpEnvelope, liquidFullTemperatureK } from '../../../src/core/check/heat-up-envelope.ts';
import { IF97, saturatedLiquidVolume, saturatedVaporVolume, saturation, saturationPressure } from '../../../src/core/steam/index.ts';

/** Cold fill: a fraction of V filled with saturated liquid at 20 °C, vapor mass neglected (as in the python3-iapws reference figures below). */
function coldFillSpecificVolume(fraction: number): number {
  return saturation(293.15).liquid.v / fraction;
}

describe('heat-up envelope', () => {
  it('its stored v_f and v_g at 623.15 K, Tc, 277.14 K and the triple point are the doubles the steam functions compute there, and near IF97 values (IAPWS R7-97(2012): v_c = 1/322 m³/kg; v_f(623.15 K) ≈ 0.00174, v_g(623.15 K) ≈ 0.00880, v_g(273.16 K) ≈ 206.0 m³/kg, from memory of the steam tables)', () => {
    expect(Object.is(FIXED.liquidAt623K, saturatedLiquidVolume(623.15))).toBe(true);
    expect(Object.is(FIXED.liquidAtCriticalPoint, saturatedLiquidVolume(IF97.Tc))).toBe(true);
    expect(Object.is(FIXED.liquidAtDensityMaximum, saturatedLiquidVolume(277.14))).toBe(true);
    expect(Object.is(FIXED.vaporAt623K, saturatedVaporVolume(623.15))).toBe(true);
    expect(Object.is(FIXED.vaporAtCriticalPoint, saturatedVaporVolume(IF97.Tc))).toBe(true);
    expect(Object.is(FIXED.vaporAtTriplePoint, saturatedVaporVolume(IF97.Tt))).toBe(true);
    expect(FIXED.liquidAtCriticalPoint * 322).toBeCloseTo(1, 2);
    expect(FIXED.liquidAt623K).toBeCloseTo(0.00174, 5);
    expect(FIXED.vaporAt623K).toBeCloseTo(0.0088, 4);
    expect(FIXED.vaporAtTriplePoint).toBeCloseTo(206.0, 0);
  });
  it('a vessel 95 % full of water at 20 °C goes liquid-full at about 113 °C, far below 120 °C (computed with python3-iapws 1.5.2 (IAPWS-IF97): 113.50 °C)', () => {
    const T = liquidFullTemperatureK(coldFillSpecificVolume(0.95));
    expect(T).not.toBeNull();
    expect(T! - 273.15).toBeCloseTo(113.5, 1);
    expect(T! - 273.15).toBeLessThan(120);
  });
  it('cold fills of 80 / 85 / 90 / 98 % go liquid-full at 250.2 / 213.5 / 169.1 / 69.2 °C (python3-iapws 1.5.2 /usr/bin/python3, IAPWS97(T, x=0).v)', () => {
    const cases = [[0.8, 250.24], [0.85, 213.48], [0.9, 169.13], [0.98, 69.21]] as const;
    for (const [fraction, celsius] of cases) {
      expect(liquidFullTemperatureK(coldFillSpecificVolume(fraction))! - 273.15).toBeCloseTo(celsius, 1);
    }
  });
  it('v_f(T_liquid-full) = v and v_g(T_all-vapor) = v (definition)', () => {
    const lf = liquidFullTemperatureK(0.0012)!;
    expect(saturation(lf).liquid.v).toBeCloseTo(0.0012, 12);
    const av = allVaporTemperatureK(0.8)!;
    expect(saturation(av).vapor.v).toBeCloseTo(0.8, 9);
  });
  it('a fill below the critical specific volume never dries out; above it never goes liquid-full (IF97 critical density 322 kg/m³)', () => {
    expect(allVaporTemperatureK(0.002)).toBeNull();
    expect(liquidFullTemperatureK(0.005)).toBeNull();
  });
  it('dry saturated steam at 121 °C is all vapor at 121 °C', () => {
    expect(allVaporTemperatureK(saturation(394.15).vapor.v)! - 273.15).toBeCloseTo(121, 6);
  });
  it('relief set and MAWP temperatures are T_sat(gauge + atmosphere); the earliest event is named (definition)', () => {
    const atm = 101325;
    const relief = saturationPressure(394.15) - atm;
    const e = heatUpEnvelope({ volumeM3: 1, massKg: 1 / coldFillSpecificVolume(0.95), startTemperatureK: 293.15, reliefSetGaugePa: relief, mawpGaugePa: 1e6, atmospherePa: atm });
    expect(e.reliefSetTemperatureK! - 273.15).toBeCloseTo(121, 6);
    expect(e.first.event).toBe('liquid-full');
    if (e.first.event !== 'none') expect(e.first.alreadyReached).toBe(false);
    const light = heatUpEnvelope({ volumeM3: 1, massKg: 100, startTemperatureK: 293.15, reliefSetGaugePa: relief, mawpGaugePa: 1e6, atmospherePa: atm });
    expect(light.first.event).toBe('relief-set-pressure');
    expect(light.liquidFullTemperatureK).toBeNull();
  });
  it('a MAWP above the critical pressure has no saturation temperature (null, not NaN)', () => {
    const e = heatUpEnvelope({ volumeM3: 1, massKg: 100, startTemperatureK: 293.15, reliefSetGaugePa: 1e6, mawpGaugePa: 30e6, atmospherePa: 101325 });
    expect(e.mawpTemperatureK).toBeNull();
  });
});
