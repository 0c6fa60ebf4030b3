// Caution wording in the person's units. Conversions: °F = °C × 9/5 + 32 and a difference of 1 K =
// 1.8 °F (common practice); 1 psi = 6894.757293168 Pa (NIST SP 811 (2008) B.8).
import { describe, expect, it } from 'vitest';
import { evaluateCheck, saturationPressure, type VesselSpec } from '../../src/core/index.ts';
import { inPreferredUnits } from '../../src/ui/state/caution-text.ts';
import { resultView } from '../../src/ui/state/result-text.ts';
import { setDecimalSeparator } from '../../src/ui/state/format.ts';
import { UNIT_PRESETS } from '../../src/ui/state/settings-model.ts';

setDecimalSeparator('.');

const vessel: VesselSpec = {
  tag: 'T-2', description: 'test steriliser (invented)', designTemperatureK: 423.15, vacuumRated: false, siteAtmospherePa: 101_325,
  ambientTemperatureK: 293.15, geometry: { shape: 'stated-volume', volumeM3: 0.3 }, tareKg: 300, mawpGaugePa: 300e3, reliefSetGaugePa: 250e3,
  instruments: {
    pressureGauge: { spanPa: 400e3, accuracyPercentOfSpan: 1 }, temperatureSensor: { kind: 'iec-60751', sensorClass: 'A' },
    weightToleranceKg: 0.5, volumeTolerancePercent: 1, barometerTolerancePa: 300,
  },
};

describe('cautions in the preferred units', () => {
  // Air in a steriliser at 121 °C: the gauge reads 26.3 kPa more than saturation would give.
  const T = 394.15;
  const result = evaluateCheck(vessel, {
    time: '2026-12-01T10:00:00+01:00', temperatureK: T, atmospherePa: 101_325,
    pressure: { reference: 'absolute', pressurePa: saturationPressure(T) + 26.3e3 }, weight: { kind: 'not-weighed' },
  });
  const gas = result.cautions.find((c) => c.rule === 'noncondensable-gas')!;

  it('the stored text stays in °C, K and kPa', () => {
    expect(gas.message).toMatch(/^Pressure is 26\.3 kPa above saturation for 121\.0 °C/);
    expect(gas.message).toMatch(/The steam is \d+\.\d K colder/);
  });

  it('US customary: psi, °F, and the temperature shortfall as a °F difference (× 1.8, no offset)', () => {
    const us = inPreferredUnits(gas, UNIT_PRESETS.US).message;
    expect(us).toMatch(/^Pressure is 3\.8\d psi above saturation for 249\.8 °F/);
    const shortfallK = Number(/The steam is (\d+\.\d) K colder/.exec(gas.message)![1]);
    const shortfallF = Number(/The steam is (\d+\.\d) °F colder/.exec(us)![1]);
    expect(Math.abs(shortfallF - 1.8 * shortfallK)).toBeLessThanOrEqual(0.1);
    expect(us).not.toMatch(/kPa|°C|\d K\b/);
  });

  it('the result card shows the converted wording; SI shows the stored wording', () => {
    const usCard = resultView(result, vessel, UNIT_PRESETS.US).cautions.find((c) => c.rule === 'noncondensable-gas')!;
    expect(usCard.message).toMatch(/psi above saturation for 249\.8 °F/);
    const siCard = resultView(result, vessel, UNIT_PRESETS.SI).cautions.find((c) => c.rule === 'noncondensable-gas')!;
    expect(siCard.message).toBe(gas.message);
  });

  it('a caution saved without parts keeps its text', () => {
    const old = { signal: 'WARNING' as const, message: 'Saved earlier: 12.0 kPa.', rule: 'noncondensable-gas' };
    expect(inPreferredUnits(old, UNIT_PRESETS.US)).toEqual(old);
  });
});
