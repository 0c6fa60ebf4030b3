import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { checkSaturation } from '../../../src/core/check/saturation-consistency.ts';
import { resolveReading, type Reading } from '../../../src/core/check/reading.ts';
import { saturationPressure } from '../../../src/core/steam/index.ts';
import { exactInstruments, testVessel } from './test-vessel.ts';
import type { VesselSpec } from '../../../src/core/check/vessel-spec.ts';

function check(vessel: VesselSpec, reading: Reading) {
  return checkSaturation(vessel, resolveReading(vessel, reading), reading.pressure.reference, true);
}
const at = (T: number, pressure: Reading['pressure'], atmospherePa?: number): Reading => ({
  time: '2026-03-14T09:30:00Z',
  temperatureK: T,
  pressure,
  weight: { kind: 'not-weighed' },
  ...(atmospherePa === undefined ? {} : { atmospherePa }),
});

describe('saturation consistency', () => {
  it('a reading exactly at saturation is consistent for any instrument tolerance, gauge or absolute (fast-check; definition)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 300, max: 640, noNaN: true }),
        fc.double({ min: 0, max: 5, noNaN: true }),
        fc.double({ min: 0, max: 5, noNaN: true }),
        fc.boolean(),
        (T, gaugeClass, tolK, gauge) => {
          const vessel = testVessel({
            instruments: { ...exactInstruments(), pressureGauge: { spanPa: 1e6, accuracyPercentOfSpan: gaugeClass }, temperatureSensor: { kind: 'stated', toleranceK: tolK } },
          });
          const pAbs = saturationPressure(T);
          const reading = at(T, gauge ? { reference: 'gauge', pressurePa: pAbs - 101325 } : { reference: 'absolute', pressurePa: pAbs });
          return check(vessel, reading).verdict.verdict === 'consistent';
        },
      ),
      { numRuns: 300 },
    );
  });

  it('121 °C field kit: RTD class B, 0–4 bar class 1.6 gauge, assumed atmosphere ±3 kPa → RSS ±1.42 K, worst case ±2.36 K (IEC 60751 and EN 837-1 class limits, dp_sat/dT computed with python3-iapws 1.5.2 (IAPWS-IF97))', () => {
    const vessel = testVessel({
      instruments: { ...exactInstruments(), pressureGauge: { spanPa: 4e5, accuracyPercentOfSpan: 1.6 }, temperatureSensor: { kind: 'iec-60751', sensorClass: 'B' } },
    });
    const T = 394.15;
    const c = check(vessel, at(T, { reference: 'gauge', pressurePa: saturationPressure(T) - 101325 }));
    expect(c.temperatureBandK.plusMinus).toBeCloseTo(1.42, 1);
    expect(c.temperatureBandK.worstCase).toBeCloseTo(2.36, 1);
    expect(c.pressureBand.method).toBe('root-sum-square');
    expect(c.saturationSlopePaPerK / 1000).toBeCloseTo(6.46, 2);
  });

  it('15 psig at sea level with 2/3 of the air discharged: p_air 33.8 kPa, chamber 115.3 °C (Dalton\'s law, computed with python3-iapws 1.5.2 (IAPWS-IF97); Perkins 1969 tabulates about 115 °C, from memory)', () => {
    const vessel = testVessel({ instruments: exactInstruments() });
    const c = check(vessel, at(115.3 + 273.15, { reference: 'absolute', pressurePa: 204.7e3 }));
    expect(c.verdict.verdict).toBe('pressure-above-saturation');
    if (c.verdict.verdict !== 'pressure-above-saturation') return;
    expect(c.verdict.noncondensableGas.partialPressurePa / 1000).toBeCloseTo(33.8, 0);
    expect(c.verdict.noncondensableGas.moleFraction).toBeCloseTo(33.8 / 204.7, 2);
    expect(c.verdict.noncondensableGas.temperatureShortfallK).toBeCloseTo(121.0 - 115.3, 0);
  });

  it('Dalton: p_abs − p_sat(T) is the gas partial pressure and y = that / p_abs (fast-check; definition)', () => {
    const vessel = testVessel({ instruments: exactInstruments() });
    fc.assert(
      fc.property(fc.double({ min: 350, max: 450, noNaN: true }), fc.double({ min: 0.01, max: 0.5, noNaN: true }), (T, y) => {
        const pSteam = saturationPressure(T);
        const p = pSteam / (1 - y);
        const c = check(vessel, at(T, { reference: 'absolute', pressurePa: p }));
        return c.verdict.verdict === 'pressure-above-saturation' && Math.abs(c.verdict.noncondensableGas.moleFraction - y) < 1e-9;
      }),
    );
  });

  it('pressure below saturation beyond the band is flagged, with superheat possible only without liquid (with liquid at equilibrium the vapor cannot be superheated; from memory)', () => {
    const vessel = testVessel({ instruments: exactInstruments() });
    const r = resolveReading(vessel, at(394.15, { reference: 'absolute', pressurePa: 150e3 }));
    const withLiquid = checkSaturation(vessel, r, 'absolute', true);
    const dry = checkSaturation(vessel, r, 'absolute', false);
    expect(withLiquid.verdict).toEqual({ verdict: 'pressure-below-saturation', superheatPossible: false });
    expect(dry.verdict).toEqual({ verdict: 'pressure-below-saturation', superheatPossible: true });
  });

  it('the deviation both ways: T_sat(101.325 kPa) = 99.974 °C (computed with python3-iapws 1.5.2 (IAPWS-IF97), _TSat_P(0.101325))', () => {
    const vessel = testVessel({ instruments: exactInstruments() });
    const c = check(vessel, at(373.15, { reference: 'absolute', pressurePa: 101325 }));
    expect(c.saturationTemperatureK - 273.15).toBeCloseTo(99.974, 3);
    expect(c.temperatureDeviationK).toBeCloseTo(0.026, 3);
    expect(c.saturationPressurePa / 1000).toBeCloseTo(101.418, 3);
  });
});
