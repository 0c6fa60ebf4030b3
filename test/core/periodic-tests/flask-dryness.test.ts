// The vacuum-flask dryness value: the energy balance run backwards (readings built from a known D
// give D back), the method's constant c against IAPWS-IF97 liquid water, the limits, and every bad input.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  DRYNESS_VALUE_DEFAULT_MIN, evaluateFlaskDryness, flaskDryness, FLASK_METHOD_WATER_SPECIFIC_HEAT_J_PER_KG_K, InputError, saturation,
  saturationTemperature, stateTP, type FlaskDrynessReading,
} from '../../../src/core/index.ts';

function errorOf(f: () => unknown): InputError {
  try { f(); } catch (e) { if (e instanceof InputError) return e; throw e; }
  throw new Error('no InputError');
}
const c = FLASK_METHOD_WATER_SPECIFIC_HEAT_J_PER_KG_K;

/** Readings for a known D: condensate mass from the balance M_c·(D·L + c·(T_s − T₁)) = (T₁ − T₀)·(c·M_w + A). */
function readingsFor(D: number, p: number, Mw: number, T0: number, T1: number, A: number, flask = 0.9): FlaskDrynessReading {
  const Ts = saturationTemperature(p);
  const s = saturation(Ts);
  const L = s.vapor.h - s.liquid.h;
  const Mc = ((T1 - T0) * (c * Mw + A)) / (D * L + c * (Ts - T1));
  return { supplyPressurePa: p, emptyFlaskMassKg: flask, massBeforeKg: flask + Mw, massAfterKg: flask + Mw + Mc, temperatureBeforeK: T0, temperatureAfterK: T1, flaskHeatCapacityJPerK: A };
}

describe('vacuum-flask dryness value', () => {
  it('readings built from a known dryness value give it back (fast-check)', () => {
    fc.assert(fc.property(
      fc.double({ min: 0.7, max: 1.05, noNaN: true }), fc.double({ min: 120e3, max: 800e3, noNaN: true }),
      fc.double({ min: 0.3, max: 1, noNaN: true }), fc.double({ min: 278, max: 295, noNaN: true }), fc.double({ min: 10, max: 70, noNaN: true }),
      fc.double({ min: 0, max: 300, noNaN: true }),
      (D, p, Mw, T0, rise, A) => {
        // Masses are rounded by floating-point subtraction; 1e-9 in D is far below a balance's reading.
        const got = flaskDryness(readingsFor(D, p, Mw, T0, T0 + rise, A)).drynessValue;
        return Math.abs(got - D) < 1e-9;
      }));
  });
  it('the method\'s c = 4.18 kJ/(kg·K) (from memory) is water\'s c_p between 15 and 85 °C within 0.5 % (IAPWS-IF97 region 1 at 101.325 kPa)', () => {
    for (const t of [15, 30, 50, 70, 85]) expect(Math.abs(stateTP(t + 273.15, 101325).cp / c - 1)).toBeLessThan(0.005);
  });
  it('default limits 0.90, and 0.95 for metal loads (EN 285 via HTM 2010, secondary)', () => {
    expect(DRYNESS_VALUE_DEFAULT_MIN).toEqual({ general: 0.9, metalLoads: 0.95 });
    const r = readingsFor(0.93, 300e3, 0.65, 288.15, 353.15, 80);
    expect(evaluateFlaskDryness(r, { metalLoads: false }).outcome).toBe('none');
    const metal = evaluateFlaskDryness(r, { metalLoads: true });
    expect(metal.limits.minimumDrynessValue).toBe(0.95);
    expect(metal.findings.map((f) => f.rule)).toEqual(['dryness-value-below-limit']);
    expect(metal.findings[0]!.message).toMatch(/0\.930 is below the lowest accepted 0\.95 for metal loads/);
    expect(evaluateFlaskDryness(r, { metalLoads: true, minimumDrynessValue: 0.92 }).outcome).toBe('none');
  });
  it('above 1 is a caution (superheat or a reading off); the wording calls it a test value, not the dryness fraction', () => {
    const e = evaluateFlaskDryness(readingsFor(1.04, 300e3, 0.65, 288.15, 353.15, 80), { metalLoads: false });
    expect(e.findings.map((f) => f.rule)).toEqual(['dryness-value-above-one']);
    expect(e.standing.find((s) => s.rule === 'dryness-value-is-test-value')!.message).toMatch(/approximates the dryness fraction but is not the same quantity/);
  });
  const ok = readingsFor(0.95, 300e3, 0.65, 288.15, 353.15, 80);
  it.each([
    ['supply pressure', { ...ok, supplyPressurePa: 1e3 }],
    ['empty flask mass', { ...ok, emptyFlaskMassKg: -1 }],
    ['mass before', { ...ok, massBeforeKg: ok.emptyFlaskMassKg }],
    ['mass after', { ...ok, massAfterKg: ok.massBeforeKg - 0.01 }],
    ['water temperature before', { ...ok, temperatureBeforeK: 250 }],
    ['water temperature after', { ...ok, temperatureAfterK: ok.temperatureBeforeK - 1 }],
    ['water temperature after', { ...ok, supplyPressurePa: 20e3, temperatureAfterK: 350 }],
    ['flask heat capacity', { ...ok, flaskHeatCapacityJPerK: NaN }],
  ])('bad input: %s', (field, reading) => {
    expect(errorOf(() => flaskDryness(reading)).field).toBe(field);
  });
  it('bad limit names the field', () => {
    expect(errorOf(() => evaluateFlaskDryness(ok, { metalLoads: false, minimumDrynessValue: 2 })).field).toBe('lowest accepted dryness value');
  });
});
