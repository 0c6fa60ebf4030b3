// Convert shows each answer to the place the typed figure resolves: a typed figure stands for
// half a unit either side of its last digit (common practice), carried through the unit factor
// (NIST SP 811 (2008) B.8: 1 psi = 6.894 757 kPa) or the saturation line's slope, and the value
// rounded to that band's one or two significant digits (formatToBand, the app's one rule).
import { describe, expect, it } from 'vitest';
import { pressureInAllUnits, saturationFromPressure, saturationFromTemperature, typedResolution } from '../../src/ui/state/convert.ts';
import { formatToBand } from '../../src/ui/state/format.ts';

describe('Convert: digits the typed value supports', () => {
  it('a typed figure resolves half a unit in its last place', () => {
    expect(typedResolution('121')).toBe(0.5);
    expect(typedResolution('121.25')).toBeCloseTo(0.005, 15);
    expect(typedResolution('\u22120.5')).toBeCloseTo(0.05, 15);
    expect(typedResolution('2e3')).toBe(500);
  });

  it('121 °C gives the saturation pressure to 1 kPa, 121.00 °C to 0.01 kPa (python3-iapws: p_sat(394.15 K) = 0.205039 MPa)', () => {
    const coarse = saturationFromTemperature('121', 'degC', 'kPa', 101_325);
    const fine = saturationFromTemperature('121.00', 'degC', 'kPa', 101_325);
    if (coarse.ok !== true || fine.ok !== true) throw new Error('expected answers');
    // About 6.3 kPa/K on the saturation line at 121 °C: ±0.5 K → ±3.2 kPa (one digit) → whole kPa;
    // ±0.005 K → ±0.032 kPa → two decimals.
    expect(formatToBand(coarse.absolute, coarse.pressureBand)).toBe('205');
    expect(formatToBand(fine.absolute, fine.pressureBand)).toBe('205.04');
  });

  it('500 kPa absolute gives the saturation temperature to 0.01 °C (python3-iapws: T_sat(0.5 MPa) = 424.9862 K, 151.836 °C)', () => {
    const a = saturationFromPressure('500', 'kPa', 'absolute', 'degC', 101_325);
    if (a.ok !== true) throw new Error('expected an answer');
    // ±0.5 kPa over about 12 kPa/K: ±0.04 K → two decimals.
    expect(a.temperatureBand).toBeGreaterThan(0.03);
    expect(a.temperatureBand).toBeLessThan(0.05);
    expect(formatToBand(a.temperature, a.temperatureBand)).toBe('151.84');
  });

  it('400 kPa typed shows 58.02 psi, not 58.0151 (±0.5 kPa = ±0.073 psi)', () => {
    const t = pressureInAllUnits('400', 'kPa', 'absolute', 101_325);
    if (t.ok !== true) throw new Error('expected a table');
    const psi = t.rows.find((r) => r.unit === 'psi')!;
    expect(formatToBand(psi.absolute, psi.band)).toBe('58.02');
    const kPa = t.rows.find((r) => r.unit === 'kPa')!;
    expect(formatToBand(kPa.absolute, kPa.band)).toBe('400.0');
  });
});
