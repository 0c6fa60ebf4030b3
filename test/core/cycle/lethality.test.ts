// Lethality (F-value) by the trapezoid rule against closed forms, properties, and every bad input.
// F = ∫ 10^((T − T_ref)/z) dt with F₀ constants T_ref = 121.1 °C, z = 10 K (from memory: ISO 17665-1,
// Ph. Eur. 5.1.5).
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { InputError, lethality, lethalRate, LETHALITY_DEFAULTS } from '../../../src/core/index.ts';

const C = (t: number) => t + 273.15;
const constant = (T: number, seconds: number, step = 60) =>
  Array.from({ length: Math.round(seconds / step) + 1 }, (_, i) => ({ timeS: i * step, temperatureK: T }));

function fieldOf(f: () => unknown): string {
  try { f(); } catch (e) { if (e instanceof InputError) return e.field; throw e; }
  throw new Error('no InputError');
}

describe('lethality: closed forms', () => {
  it('F₀ defaults are 121.1 °C = 394.25 K and z = 10 K (from memory: ISO 17665-1, Ph. Eur. 5.1.5)', () => {
    expect(LETHALITY_DEFAULTS).toEqual({ referenceTemperatureK: 394.25, zK: 10 });
  });
  it('15 min at the reference temperature is F₀ = 15 min (the definition)', () => {
    expect(lethality(constant(C(121.1), 900)).minutes).toBeCloseTo(15, 12);
  });
  it('a constant temperature T for t gives t·10^((T − T_ref)/z) (the integral of a constant)', () => {
    // 1 min at 131.1 °C: ten times the rate (a z of 10 K); 15 min at 121 °C: 15·10^(−0.01) = 14.658 min.
    expect(lethality(constant(C(131.1), 60, 6)).minutes).toBeCloseTo(10, 10);
    expect(lethality(constant(C(121), 900)).minutes).toBeCloseTo(15 * 10 ** -0.01, 10);
    expect(lethality(constant(C(134), 180, 5)).minutes).toBeCloseTo(3 * 10 ** 1.29, 9);
  });
  it('a linear ramp matches ∫ 10^((T₀ + b·t − T_ref)/z) dt = z/(b·ln 10)·(L(τ) − L(0)) to the trapezoid error', () => {
    // 100 → 134 °C over 10 min at 1 s readings. For e^(k·t) the trapezoid rule reads high by (h·k)²/12
    // relative (its leading error term), k = b·ln10/z: here 1.42e-5.
    const tau = 600, b = 34 / tau;
    const readings = Array.from({ length: tau + 1 }, (_, i) => ({ timeS: i, temperatureK: C(100) + b * i }));
    const rate = (t: number) => lethalRate(C(100) + b * t, 394.25, 10);
    const exact = ((10 / (b * Math.LN10)) * (rate(tau) - rate(0))) / 60;
    const k = (b * Math.LN10) / 10;
    expect(lethality(readings).minutes / exact - 1).toBeCloseTo((k * k) / 12, 8);
  });
  it('the trapezoid rule averages the rate, not the temperature: two readings 110 and 130 °C over 60 s', () => {
    const got = lethality([{ timeS: 0, temperatureK: C(110) }, { timeS: 60, temperatureK: C(130) }]).minutes;
    expect(got).toBeCloseTo(0.5 * (10 ** -1.11 + 10 ** 0.89), 12);
  });
  it('the reference and z can be changed (z = 20 K: 20 K above the reference is ten times the rate)', () => {
    expect(lethality(constant(C(141.1), 60), { zK: 20 }).minutes).toBeCloseTo(10, 10);
    expect(lethality(constant(C(115), 600), { referenceTemperatureK: C(115) }).minutes).toBeCloseTo(10, 10);
  });
  it('readings from any time origin (a recorder clock) give the same F', () => {
    const a = lethality(constant(C(121), 300)).minutes;
    const b = lethality(constant(C(121), 300).map((r) => ({ ...r, timeS: r.timeS + 1.7e9 - 1e9 }))).minutes;
    expect(b).toBeCloseTo(a, 9);
  });
});

describe('lethality: properties (fast-check)', () => {
  const series = fc.array(fc.record({ dt: fc.double({ min: 0.5, max: 120, noNaN: true }), T: fc.double({ min: 373, max: 410, noNaN: true }) }), { minLength: 2, maxLength: 40 })
    .map((xs) => { let t = 0; return xs.map(({ dt, T }) => ({ timeS: (t += dt), temperatureK: T })); });
  it('F grows with time: a further reading adds to it', () => {
    fc.assert(fc.property(series, fc.double({ min: 0.5, max: 300, noNaN: true }), fc.double({ min: 373, max: 410, noNaN: true }), (r, dt, T) => {
      const longer = [...r, { timeS: r[r.length - 1]!.timeS + dt, temperatureK: T }];
      return lethality(longer).minutes > lethality(r).minutes;
    }));
  });
  it('F grows with temperature: raising any reading raises F', () => {
    fc.assert(fc.property(series, fc.nat(), fc.double({ min: 0.01, max: 5, noNaN: true }), (r, k, rise) => {
      const i = k % r.length;
      const warmer = r.map((x, j) => (j === i ? { ...x, temperatureK: x.temperatureK + rise } : x));
      return lethality(warmer).minutes > lethality(r).minutes;
    }));
  });
});

describe('lethality: bad input names the field', () => {
  const ok = constant(C(121), 120);
  it.each([
    ['readings', () => lethality(undefined as never)],
    ['readings', () => lethality([ok[0]!])],
    ['reading 2 time', () => lethality([ok[0]!, { timeS: NaN, temperatureK: 394 }])],
    ['reading 2 time', () => lethality([ok[0]!, { timeS: 0, temperatureK: 394 }])],
    ['reading 3 time', () => lethality([...ok.slice(0, 2), { timeS: 10, temperatureK: 394 }])],
    ['reading 1 time', () => lethality([{ timeS: 2e9, temperatureK: 394 }, { timeS: 2e9 + 1, temperatureK: 394 }])],
    ['reading 2 temperature', () => lethality([ok[0]!, { timeS: 60, temperatureK: 200 }])],
    ['reading 1 temperature', () => lethality([{ timeS: 0, temperatureK: Infinity }, ok[1]!])],
    ['F-value reference temperature', () => lethality(ok, { referenceTemperatureK: 700 })],
    ['z-value', () => lethality(ok, { zK: 0 })],
    ['z-value', () => lethality(ok, { zK: NaN })],
    // z = 1 K with readings 350 K above the reference: 10^350 is beyond the number range.
    ['z-value', () => lethality([{ timeS: 0, temperatureK: 640 }, { timeS: 1, temperatureK: 640 }], { referenceTemperatureK: 290, zK: 1 })],
  ])('%s', (field, f) => {
    expect(fieldOf(f)).toBe(field);
  });
  it('more than 200 000 readings are refused, and the message gives the range', () => {
    const many = Array.from({ length: 200_001 }, (_, i) => ({ timeS: i, temperatureK: 394 }));
    expect(() => lethality(many)).toThrow(/readings: 200001 given; between 2 and 200000/);
  });
  it('a message states the valid range', () => {
    expect(() => lethality(ok, { zK: 0 })).toThrow(/z-value: 0 K is outside the valid range. Valid range: 1 to 100 K/);
  });
});
