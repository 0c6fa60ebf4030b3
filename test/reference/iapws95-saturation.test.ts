// IAPWS-95 (IAPWS R6-95(2018), the scientific formulation IF97 was fitted to) as a second,
// independent reference on the saturation line, 273.16 … 623 K, from Debian's python3-iapws
// IAPWS95(T, x=0/1) (phase-equilibrium solve), committed in fixtures/iapws95-saturation.json by
// generate-if97-fixture.py.
//
// IF97 is not IAPWS-95: the tolerances are the measured IF97 − IAPWS-95 differences with a
// margin, not our accuracy. Measured with python3-iapws 1.5.2 (IAPWS97 against IAPWS95) at 22
// temperatures 0.01 … 350 °C:
// p_s ≤ 1.75e-4 relative, v_f ≤ 3.0e-5, v_g ≤ 1.65e-4, h_f ≤ 0.24 kJ/kg, h_g ≤ 0.08 kJ/kg.
// This fixture's denser grid (70 temperatures) measured p_s 1.76e-4, v_f 3.3e-5, h_f 0.24 kJ/kg,
// u_f 0.24 kJ/kg, s_f 0.43 J/(kg·K) — and, between the 300 and 350 °C rows of that coarser grid (near 335 °C),
// larger vapor differences: v_g 4.2e-4, h_g 0.25 kJ/kg, u_g 0.19 kJ/kg, s_g 0.38 J/(kg·K).
// Tolerances below are those maxima × ~1.4.
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { saturation, saturationPressure } from '../../src/core/index.ts';

const doc = JSON.parse(readFileSync(fileURLToPath(new URL('./fixtures/iapws95-saturation.json', import.meta.url)), 'utf8')) as {
  states: [number, number, number, number, number, number, number, number, number, number][];
};

const TOL = {
  p: 2.5e-4, // relative
  vf: 5e-5, // relative
  vg: 6e-4, // relative
  h: 350, // J/kg, both phases
  u: 350, // J/kg, both phases
  s: 0.6, // J/(kg·K), both phases
};

describe('IAPWS-95 saturation (python3-iapws IAPWS95) against IF97, 273.16 … 623 K', () => {
  it(`${doc.states.length} temperatures within the measured IF97 − IAPWS-95 differences`, () => {
    expect(doc.states.length).toBeGreaterThanOrEqual(50);
    for (const [T, p, vf, vg, hf, hg, uf, ug, sf, sg] of doc.states) {
      const s = saturation(T);
      const at = `T = ${T} K`;
      expect(Math.abs(saturationPressure(T) - p) / p, at).toBeLessThan(TOL.p);
      expect(Math.abs(s.liquid.v - vf) / vf, at).toBeLessThan(TOL.vf);
      expect(Math.abs(s.vapor.v - vg) / vg, at).toBeLessThan(TOL.vg);
      expect(Math.abs(s.liquid.h - hf), at).toBeLessThan(TOL.h);
      expect(Math.abs(s.vapor.h - hg), at).toBeLessThan(TOL.h);
      expect(Math.abs(s.liquid.u - uf), at).toBeLessThan(TOL.u);
      expect(Math.abs(s.vapor.u - ug), at).toBeLessThan(TOL.u);
      expect(Math.abs(s.liquid.s - sf), at).toBeLessThan(TOL.s);
      expect(Math.abs(s.vapor.s - sg), at).toBeLessThan(TOL.s);
    }
  });
});
