// Saturated water against printed steam tables and against facts of the trade.
import { describe, expect, it } from 'vitest';
import { saturation, saturationPressure, saturationTemperature } from '../../src/core/index.ts';

// From memory: saturated-water temperature table as printed in Çengel & Boles, Thermodynamics:
// An Engineering Approach, Table A-4 (IAPWS-95 based, 5 significant digits). Tolerances: the
// printed rounding plus the IF97 − IAPWS-95 saturation differences measured with python3-iapws 1.5.2
// (IAPWS97 against IAPWS95, 0.01 … 350 °C; see iapws95-saturation.test.ts):
// p 3e-4 relative, v_g 5e-4 relative, h 0.4 kJ/kg.
const TABLE_A4 = [
  // t °C, p_sat kPa, v_g m³/kg, h_f kJ/kg, h_g kJ/kg
  [50, 12.352, 12.026, 209.34, 2591.3],
  [100, 101.42, 1.6720, 419.17, 2675.6],
  [150, 476.16, 0.39248, 632.18, 2745.9],
  [200, 1554.9, 0.12721, 852.26, 2792.0],
  [300, 8587.9, 0.021659, 1344.8, 2749.6],
] as const;

describe('handbook saturation values (from memory: Çengel & Boles, Table A-4)', () => {
  for (const [t, pKPa, vg, hf, hg] of TABLE_A4) {
    it(`${t} °C`, () => {
      const s = saturation(t + 273.15);
      expect(Math.abs(s.p / 1e3 - pKPa) / pKPa).toBeLessThan(3e-4);
      expect(Math.abs(s.vapor.v - vg) / vg).toBeLessThan(5e-4);
      expect(Math.abs(s.liquid.h / 1e3 - hf)).toBeLessThan(0.4);
      expect(Math.abs(s.vapor.h / 1e3 - hg)).toBeLessThan(0.4);
    });
  }
});

describe('facts of the trade (common practice)', () => {
  it('water boils at about 99.97 °C under 1 standard atmosphere, 101.325 kPa', () => {
    expect(saturationTemperature(101325) - 273.15).toBeCloseTo(99.97, 2);
  });
  it('a 121 °C steriliser cycle runs at about 205 kPa absolute (about 15 psi gauge at sea level)', () => {
    const p = saturationPressure(121 + 273.15);
    expect(Math.abs(p - 205e3)).toBeLessThan(1e3);
    // 1 psi = 6894.757 Pa (NIST SP 811, Appendix B)
    expect((p - 101325) / 6894.757).toBeCloseTo(15, 0);
  });
  it('a 134 °C steriliser cycle runs at about 304 kPa absolute', () => {
    expect(Math.abs(saturationPressure(134 + 273.15) - 304e3)).toBeLessThan(1e3);
  });
});
