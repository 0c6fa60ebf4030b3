// Every value of the IAPWS-IF97 computer-program verification tables for regions 1 to 4 and the
// B23 check values. Source: IAPWS R7-97(2012), Revised Release on the IAPWS Industrial
// Formulation 1997 for the Thermodynamic Properties of Water and Steam: Table 5 (region 1),
// Table 15 (region 2), Table 33 (region 3), Table 35 (p_s(T)), Table 36 (T_s(p)), and the B23
// check values in Section 4. Values as printed (9 significant digits), units of the release:
// T K, p MPa, ρ kg/m³, v m³/kg, h u kJ/kg, s cp kJ/(kg·K), w m/s.
//
// Tolerance: relative 1e-8. A printed mantissa 0.ddddddddd carries at most half a unit in its
// 9th digit of rounding, i.e. ≤ 5e-9 relative; 1e-8 leaves a factor 2 for that and nothing else.
import { describe, expect, it } from 'vitest';
import { saturationPressure, saturationTemperature, stateTP } from '../../src/core/index.ts';
import { b23Pressure, b23Temperature } from '../../src/core/steam/b23.ts';
import { region1State } from '../../src/core/steam/region1.ts';
import { region2State } from '../../src/core/steam/region2.ts';
import { region3State } from '../../src/core/steam/region3.ts';

const REL = 1e-8;

function expectRel(actual: number, published: string, scale = 1): void {
  const expected = Number(published) * scale;
  expect(Math.abs(actual - expected) / Math.abs(expected), `${actual} vs ${expected}`).toBeLessThanOrEqual(REL);
}

type Row = readonly [T: number, pMPa: number, values: readonly [string, string, string, string, string, string]];

// IAPWS R7-97(2012) Table 5: region 1, Eq. (7); columns v, h, u, s, cp, w.
const TABLE_5: readonly Row[] = [
  [300, 3, ['0.100215168e-2', '0.115331273e3', '0.112324818e3', '0.392294792', '0.417301218e1', '0.150773921e4']],
  [300, 80, ['0.971180894e-3', '0.184142828e3', '0.106448356e3', '0.368563852', '0.401008987e1', '0.163469054e4']],
  [500, 3, ['0.120241800e-2', '0.975542239e3', '0.971934985e3', '0.258041912e1', '0.465580682e1', '0.124071337e4']],
];

// IAPWS R7-97(2012) Table 15: region 2, Eq. (15); columns v, h, u, s, cp, w.
const TABLE_15: readonly Row[] = [
  [300, 0.0035, ['0.394913866e2', '0.254991145e4', '0.241169160e4', '0.852238967e1', '0.191300162e1', '0.427920172e3']],
  [700, 0.0035, ['0.923015898e2', '0.333568375e4', '0.301262819e4', '0.101749996e2', '0.208141274e1', '0.644289068e3']],
  [700, 30, ['0.542946619e-2', '0.263149474e4', '0.246861076e4', '0.517540298e1', '0.103505092e2', '0.480386523e3']],
];

// IAPWS R7-97(2012) Table 33: region 3, Eq. (28), inputs (ρ, T); columns p, h, u, s, cp, w.
const TABLE_33: readonly (readonly [rho: number, T: number, values: Row[2]])[] = [
  [500, 650, ['0.255837018e2', '0.186343019e4', '0.181226279e4', '0.405427273e1', '0.138935717e2', '0.502005554e3']],
  [200, 650, ['0.222930643e2', '0.237512401e4', '0.226365868e4', '0.485438792e1', '0.446579342e2', '0.383444594e3']],
  [500, 750, ['0.783095639e2', '0.225868845e4', '0.210206932e4', '0.446971906e1', '0.634165359e1', '0.760696041e3']],
];

function checkPT(state: { v: number; h: number; u: number; s: number; cp: number; w: number }, values: Row[2]): void {
  expectRel(state.v, values[0]);
  expectRel(state.h, values[1], 1e3);
  expectRel(state.u, values[2], 1e3);
  expectRel(state.s, values[3], 1e3);
  expectRel(state.cp, values[4], 1e3);
  expectRel(state.w, values[5]);
}

describe('IAPWS R7-97(2012) Table 5, region 1', () => {
  for (const [T, p, values] of TABLE_5) {
    it(`T = ${T} K, p = ${p} MPa (region 1 equation and stateTP)`, () => {
      checkPT(region1State(T, p * 1e6), values);
      const s = stateTP(T, p * 1e6);
      expect(s.region).toBe(1);
      checkPT(s, values);
    });
  }
});

describe('IAPWS R7-97(2012) Table 15, region 2', () => {
  for (const [T, p, values] of TABLE_15) {
    it(`T = ${T} K, p = ${p} MPa (region 2 equation and stateTP)`, () => {
      checkPT(region2State(T, p * 1e6), values);
      const s = stateTP(T, p * 1e6);
      expect(s.region).toBe(2);
      checkPT(s, values);
    });
  }
});

describe('IAPWS R7-97(2012) Table 33, region 3', () => {
  for (const [rho, T, values] of TABLE_33) {
    it(`ρ = ${rho} kg/m³, T = ${T} K: Eq. (28) directly`, () => {
      const s = region3State(rho, T);
      expectRel(s.p, values[0], 1e6);
      expectRel(s.h, values[1], 1e3);
      expectRel(s.u, values[2], 1e3);
      expectRel(s.s, values[3], 1e3);
      expectRel(s.cp, values[4], 1e3);
      expectRel(s.w, values[5]);
    });
    it(`ρ = ${rho} kg/m³, T = ${T} K: stateTP at the published p solves back to ρ`, () => {
      const s = stateTP(T, Number(values[0]) * 1e6);
      expect(s.region).toBe(3);
      // The published p has 9 digits, so ρ comes back to 1e-8 times (p/ρ)/(∂p/∂ρ) ≤ ~10 here.
      expect(Math.abs(1 / s.v - rho) / rho).toBeLessThan(1e-7);
      expectRel(s.h, values[1], 1e3);
    });
  }
});

describe('IAPWS R7-97(2012) Table 35, saturation pressure Eq. (30)', () => {
  const rows = [[300, '0.353658941e-2'], [500, '0.263889776e1'], [600, '0.123443146e2']] as const;
  for (const [T, p] of rows) it(`p_s(${T} K)`, () => expectRel(saturationPressure(T), p, 1e6));
});

describe('IAPWS R7-97(2012) Table 36, saturation temperature Eq. (31)', () => {
  const rows = [[0.1, '0.372755919e3'], [1, '0.453035632e3'], [10, '0.584149488e3']] as const;
  for (const [p, T] of rows) it(`T_s(${p} MPa)`, () => expectRel(saturationTemperature(p * 1e6), T));
});

describe('IAPWS R7-97(2012) Section 4, B23 check values', () => {
  it('p_B23(623.15 K) = 0.165291643e2 MPa, Eq. (5)', () => expectRel(b23Pressure(623.15), '0.165291643e2', 1e6));
  it('T_B23(16.5291643 MPa) = 0.623150000e3 K, Eq. (6)', () => expectRel(b23Temperature(16.5291643e6), '0.623150000e3'));
});
