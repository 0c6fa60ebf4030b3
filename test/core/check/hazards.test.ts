import { describe, expect, it } from 'vitest';
import { cooledState, expansionWorkPerKgJ, flashOnRelease, pressureMargin } from '../../../src/core/check/hazards.ts';
import { saturation } from '../../../src/core/steam/index.ts';

const ATM = 101325;

describe('flash on release to atmosphere', () => {
  it('saturated liquid at 121 °C flashes about 4 % (common practice), 3.95 % and 62× its volume (computed with python3-iapws 1.5.2 (IAPWS-IF97): 3.946 %, 62.2×)', () => {
    const s = saturation(394.15);
    const f = flashOnRelease(s.liquid.h, s.liquid.v, ATM, 100);
    expect(f.flashFraction).toBeGreaterThan(0.035);
    expect(f.flashFraction).toBeLessThan(0.045);
    expect(f.flashFraction).toBeCloseTo(0.03946, 4);
    expect(f.volumeRatio).toBeCloseTo(62.2, 0);
    expect(f.totalFlashSteamVolumeM3).toBeCloseTo(100 * f.flashSteamVolumePerKgM3, 12);
  });
  it('134 / 150 / 200 °C flash 6.40 / 9.45 / 19.2 % (computed with python3-iapws 1.5.2 (IAPWS-IF97))', () => {
    for (const [celsius, percent] of [[134, 6.40], [150, 9.45], [200, 19.2]] as const) {
      const s = saturation(celsius + 273.15);
      expect(100 * flashOnRelease(s.liquid.h, s.liquid.v, ATM, null).flashFraction).toBeCloseTo(percent, 1);
    }
  });
  it('liquid below the atmospheric boiling point does not flash', () => {
    const s = saturation(353.15);
    expect(flashOnRelease(s.liquid.h, s.liquid.v, ATM, 10).flashFraction).toBe(0);
  });
});

describe('stored energy indicator', () => {
  it('isentropic expansion to 1 atm: saturated liquid 8.4 / 15.4 / 41 MJ/m³ at 121 / 134 / 170.4 °C (computed with python3-iapws 1.5.2 (IAPWS-IF97), IAPWS97(P=0.101325, s=s_f): 8.398 / 15.44 / 41.35)', () => {
    for (const [celsius, mjPerM3] of [[121, 8.398], [134, 15.44], [170.4, 41.35]] as const) {
      const f = saturation(celsius + 273.15).liquid;
      const perM3 = expansionWorkPerKgJ(f.u, f.s, f.p, ATM) / f.v / 1e6;
      expect(perM3 / mjPerM3).toBeCloseTo(1, 2);
    }
  });
  it('saturated vapor: 0.12 / 0.28 / 1.29 MJ/m³ (python3-iapws 1.5.2, IAPWS97(P=0.101325, s=s_g))', () => {
    for (const [celsius, mjPerM3] of [[121, 0.1218], [134, 0.2751], [170.4, 1.2858]] as const) {
      const g = saturation(celsius + 273.15).vapor;
      expect(expansionWorkPerKgJ(g.u, g.s, g.p, ATM) / g.v / 1e6 / mjPerM3).toBeCloseTo(1, 2);
    }
  });
  it('nothing at or below atmospheric pressure', () => {
    const f = saturation(353.15).liquid;
    expect(expansionWorkPerKgJ(f.u, f.s, f.p, ATM)).toBe(0);
  });
});

describe('margins and cooling', () => {
  it('margin = limit − gauge, fraction = gauge / limit', () => {
    expect(pressureMargin(0.8e6, 1e6)).toEqual({ marginPa: 0.2e6, fractionOfLimit: 0.8 });
  });
  it('steam cooled to 20 °C falls to p_sat(20 °C) = 2.339 kPa abs and a vessel not rated for vacuum is flagged (python3-iapws 1.5.2 _PSat_T(293.15); vacuum collapse on cooling: https://technewsources.com/tank-trailer-vacuum-collapse/)', () => {
    const c = cooledState({ ambientTemperatureK: 293.15, meanSpecificVolumeM3PerKg: 0.5, noncondensablePartialPressurePa: 0, temperatureK: 394.15, atmospherePa: ATM, vacuumRated: false, vacuumBreaker: false, liquidFullNow: false });
    expect(c.absolutePressurePa! / 1000).toBeCloseTo(2.339, 3);
    expect(c.collapseRisk).toBe(true);
    const rated = cooledState({ ambientTemperatureK: 293.15, meanSpecificVolumeM3PerKg: null, noncondensablePartialPressurePa: 0, temperatureK: 394.15, atmospherePa: ATM, vacuumRated: true, vacuumBreaker: false, liquidFullNow: false });
    expect(rated.belowAtmosphere).toBe(true);
    expect(rated.collapseRisk).toBe(false);
  });
  it('air carried down at constant volume: p_gas × T_cold/T_hot (ideal gas, Gay-Lussac)', () => {
    const c = cooledState({ ambientTemperatureK: 293.15, meanSpecificVolumeM3PerKg: null, noncondensablePartialPressurePa: 50e3, temperatureK: 393.15, atmospherePa: ATM, vacuumRated: false, vacuumBreaker: false, liquidFullNow: false });
    expect(c.noncondensablePartialPressurePa).toBeCloseTo((50e3 * 293.15) / 393.15, 6);
  });
  it('ambient below freezing: figures at 273.15 K, where IF97 water ends (p_s = 611.213 Pa, IAPWS R7-97(2012) Eq. (30)), and it says the water freezes', () => {
    const c = cooledState({ ambientTemperatureK: 253.15, meanSpecificVolumeM3PerKg: null, noncondensablePartialPressurePa: 0, liquidFullNow: false, temperatureK: 393.15, atmospherePa: ATM, vacuumRated: false, vacuumBreaker: false });
    expect(c.temperatureK).toBe(273.15);
    expect(c.absolutePressurePa).toBeCloseTo(611.213, 0);
    expect(c.freezes).toBe(true);
    expect(c.direction).toBe('cooling');
  });
});

describe('cooling an overfilled vessel', () => {
  it('liquid-full even cold beyond 100 MPa is flagged, not given a made-up pressure', () => {
    const c = cooledState({ ambientTemperatureK: 293.15, meanSpecificVolumeM3PerKg: 0.0009, noncondensablePartialPressurePa: 0, temperatureK: 393.15, atmospherePa: ATM, vacuumRated: false, vacuumBreaker: false, liquidFullNow: false });
    expect(c.aboveFormulationLimit).toBe(true);
    expect(c.belowAtmosphere).toBe(false);
  });
});
