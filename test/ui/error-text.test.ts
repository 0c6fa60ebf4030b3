import { describe, expect, it } from 'vitest';
import { InputError, evaluateCheck } from '../../src/core/index.ts';
import { errorText } from '../../src/ui/state/error-text.ts';
import { setDecimalSeparator } from '../../src/ui/state/format.ts';

setDecimalSeparator('.');

describe('errorText restates an SI range in the unit the person typed in', () => {
  it('temperature in °F (°F = K × 9/5 − 459.67, common practice)', () => {
    const e = new InputError('temperature', 'out-of-range', 700, { min: 273.16, max: 647.096, unit: 'K' });
    const text = errorText(e, { kind: 'temperature', unit: 'degF' });
    expect(text).toMatch(/^temperature: 800\.33\d* °F is outside the valid range, 32\.018\d* to 705\.10\d* °F\.$/);
    expect(text).not.toMatch(/\bK\b/);
  });

  it('pressure in psi (1 psi = 6894.757293168 Pa, NIST SP 811 (2008) B.8)', () => {
    const e = new InputError('MAWP', 'out-of-range', 200e6, { min: 0, max: 100e6, unit: 'Pa' });
    expect(errorText(e, { kind: 'pressure', unit: 'psi' })).toMatch(/^MAWP: 29007\.5\d* psi is outside the valid range, 0 to 14503\.8 psi\.$/);
  });

  it('length in ft (1 ft = 0.3048 m exactly, NIST SP 811 (2008) B.8)', () => {
    const e = new InputError('inner diameter', 'out-of-range', 0.03048, { min: 0.05, max: 20, unit: 'm' });
    expect(errorText(e, { kind: 'length', unit: 'ft' })).toMatch(/^inner diameter: 0\.1\d* ft is outside the valid range, 0\.164042\d* to 65\.6168\d* ft\.$/);
  });

  it('keeps the core words when the unit kinds do not match or it is not an InputError', () => {
    const kelvin = new InputError('temperature', 'out-of-range', 700, { min: 273.16, max: 647.096, unit: 'K' });
    expect(errorText(kelvin, { kind: 'pressure', unit: 'psi' })).toBe(kelvin.message);
    expect(errorText(new Error('plain'), { kind: 'mass', unit: 'lb' })).toBe('plain');
  });

  it('restates a message the core wrote with SI figures too: a gauge vacuum beyond the atmosphere, in psi, quoting the typed text', () => {
    const custom = new InputError('pressure (gauge)', 'out-of-range', -2e5, { min: -100713.343, max: 21962675, unit: 'Pa' }, 'pressure (gauge): a vacuum of 200000 Pa is beyond the atmosphere.');
    // −100 713.343 Pa / 6894.757 Pa per psi = −14.6072 psi (NIST SP 811 (2008) B.8).
    expect(errorText(custom, { kind: 'pressure', unit: 'psi' }, '-29')).toBe(
      'pressure (gauge): "-29" psi is a vacuum beyond the atmosphere; the absolute pressure would be at or below zero. Valid range: \u221214.6072 to 3185.42 psi gauge.');
  });

  it('a gross weight at or below the tare, in lb (0.453 592 37 kg exactly, NIST SP 811 (2008) B.8)', () => {
    const e = new InputError('gross weight', 'inconsistent', 300, { min: 453.59237, max: 1e7, unit: 'kg' }, 'gross weight: 300 kg is at or below the tare (453.59237 kg).');
    expect(errorText(e, { kind: 'mass', unit: 'lb' }, '661,4')).toBe(
      'gross weight: "661,4" lb is at or below the tare (1000 lb); the vessel would hold no water. Enter a weight above the tare.');
  });

  it('an engine refusal of a reading typed in °C comes back in °C', () => {
    let caught: unknown;
    try {
      evaluateCheck(
        {
          tag: 'T-1', description: 'test vessel (invented)', geometry: { shape: 'stated-volume', volumeM3: 1 }, tareKg: 100,
          mawpGaugePa: 1e6, designTemperatureK: 473.15, reliefSetGaugePa: 9e5, vacuumRated: true, siteAtmospherePa: 101325,
          ambientTemperatureK: 293.15,
          instruments: { pressureGauge: { spanPa: 1e6, accuracyPercentOfSpan: 1 }, temperatureSensor: { kind: 'iec-60751', sensorClass: 'A' },
            weightToleranceKg: 1, volumeTolerancePercent: 1, barometerTolerancePa: 300 },
        },
        { time: '2026-12-01T10:00:00+01:00', temperatureK: 700, pressure: { reference: 'absolute', pressurePa: 2e5 }, weight: { kind: 'not-weighed' } },
      );
    } catch (e) { caught = e; }
    expect(caught).toBeInstanceOf(InputError);
    expect(errorText(caught, { kind: 'temperature', unit: 'degC' })).toMatch(/^temperature: 426\.85 °C is outside the valid range, 0 to 373\.946 °C\.$/);
  });
});
