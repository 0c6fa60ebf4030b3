// stateTV(T, v): the closed rigid vessel. Two-phase inside the dome, solved single-phase
// pressure outside it, typed errors beyond IF97 (including a liquid-full vessel above 100 MPa).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InputError, saturation, saturationPressure, stateTP, stateTV } from '../../../src/core/index.ts';
import type { VesselState } from '../../../src/core/index.ts';
import { b23Pressure } from '../../../src/core/steam/b23.ts';
import { region1Volume } from '../../../src/core/steam/region1.ts';

const Tc = 647.096;

function caught(f: () => unknown): InputError {
  try {
    f();
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  throw new Error('expected an InputError');
}

function expectFinite(s: VesselState): void {
  for (const k of ['T', 'p', 'v', 'h', 'u', 's'] as const) expect(Number.isFinite(s[k]), k).toBe(true);
  if (s.phase === 'two-phase') expect(Number.isFinite(s.x)).toBe(true);
  else for (const k of ['cp', 'cv', 'w'] as const) expect(Number.isFinite(s[k]), k).toBe(true);
}

describe('stateTV', () => {
  it('phases at a few points: liquid-full, two-phase, superheated, supercritical', () => {
    expect(stateTV(300, 0.001).phase).toBe('compressed-liquid');
    expect(stateTV(373.15, 1).phase).toBe('two-phase');
    expect(stateTV(373.15, 2).phase).toBe('superheated-vapor');
    expect(stateTV(640, 0.0018).phase).toBe('compressed-liquid');
    expect(stateTV(640, 0.004).phase).toBe('two-phase');
    expect(stateTV(640, 0.02).phase).toBe('superheated-vapor');
    expect(stateTV(700, 0.003).phase).toBe('supercritical');
    expect(stateTV(1000, 1).phase).toBe('supercritical');
  });

  it('two-phase: 0 ≤ x ≤ 1, p = p_s(T), and the mass balance v = (1 − x)·v_f + x·v_g', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 273.15, max: Tc - 1e-3, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (T, f) => {
          const sat = saturation(T);
          // log-uniform between v_f and v_g, so both wet and dry states are drawn
          const v = Math.min(sat.vapor.v, sat.liquid.v * Math.exp(f * Math.log(sat.vapor.v / sat.liquid.v)));
          const s = stateTV(T, v);
          expect(s.phase).toBe('two-phase');
          if (s.phase !== 'two-phase') return;
          expect(s.x).toBeGreaterThanOrEqual(0);
          expect(s.x).toBeLessThanOrEqual(1);
          expect(s.p).toBe(saturationPressure(T));
          const balance = (1 - s.x) * s.liquid.v + s.x * s.vapor.v;
          expect(Math.abs(balance - v) / v).toBeLessThan(1e-12);
          expect(s.h).toBeGreaterThanOrEqual(s.liquid.h - 1e-6);
          expect(s.h).toBeLessThanOrEqual(s.vapor.h + 1e-6);
        },
      ),
      { numRuns: 1000 },
    );
  });

  it('ends of the dome: v = v_f gives x = 0, v = v_g gives x = 1', () => {
    for (const T of [280, 373.15, 500, 623.15, 630, 645]) {
      const sat = saturation(T);
      const f = stateTV(T, sat.liquid.v);
      const g = stateTV(T, sat.vapor.v);
      expect(f.phase === 'two-phase' && f.x).toBe(0);
      expect(g.phase === 'two-phase' && g.x).toBe(1);
    }
  });

  // Single-phase round trip: stateTV(T, stateTP(T, p).v) must give p back. A liquid is nearly
  // incompressible, so p is only as well defined as v allows: |Δp| ≤ 1e-9·p plus the pressure
  // change of a 1e-13 relative change in v, |∂p/∂v|·1e-13·v = (cv·w²/(cp·v))·1e-13 (from
  // κ_T = (cp/cv)/(ρ·w²)).
  function expectSameState(T: number, p: number, phase: VesselState['phase']): void {
    const a = stateTP(T, p);
    const b = stateTV(T, a.v);
    expect(b.phase).toBe(phase);
    if (b.phase === 'two-phase') return;
    const tol = 1e-9 * p + (1e-13 * a.cv * a.w * a.w) / (a.cp * a.v);
    expect(Math.abs(b.p - p), `T ${T} K, p ${p} Pa: got ${b.p}`).toBeLessThanOrEqual(tol);
    expect(Math.abs(b.v - a.v) / a.v).toBeLessThan(1e-12);
    expect(Math.abs(b.h - a.h)).toBeLessThan(1e-6 * Math.abs(a.h) + 1e-3);
  }

  it('round trip, compressed liquid (regions 1 and 3): p back from v', () => {
    fc.assert(
      fc.property(fc.double({ min: 273.15, max: Tc - 0.5, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (T, f) => {
        const lo = saturationPressure(T) * 1.001;
        expectSameState(T, lo + f * (100e6 - lo), 'compressed-liquid');
      }),
      { numRuns: 1000 },
    );
  });

  it('round trip, superheated vapor (regions 2 and 3 below Tc): p back from v', () => {
    fc.assert(
      fc.property(fc.double({ min: 273.15, max: Tc - 0.5, noNaN: true }), fc.double({ min: -12, max: -0.001, noNaN: true }), (T, lnF) => {
        const ps = saturationPressure(T);
        let p = ps * Math.exp(lnF);
        // keep 1 % away from B23, where regions 2 and 3 differ by their permitted inconsistency
        if (T > 623.15) {
          const pB = b23Pressure(T);
          if (Math.abs(p / pB - 1) < 0.01) p = pB * 0.99;
        }
        expectSameState(T, p, 'superheated-vapor');
      }),
      { numRuns: 1000 },
    );
  });

  it('round trip, supercritical (T > Tc, regions 2 and 3): p back from v', () => {
    fc.assert(
      fc.property(fc.double({ min: Tc + 1e-6, max: 1073.15, noNaN: true }), fc.double({ min: Math.log(1e3), max: Math.log(99.9e6), noNaN: true }), (T, lnP) => {
        let p = Math.exp(lnP);
        if (T < 863.15) {
          const pB = b23Pressure(T);
          if (Math.abs(p / pB - 1) < 0.01) p = pB * 0.99;
        }
        expectSameState(T, p, 'supercritical');
      }),
      { numRuns: 1000 },
    );
  });

  it('liquid-full beyond 100 MPa throws InputError "pressure" out-of-range (the check engine reports DANGER)', () => {
    fc.assert(
      fc.property(fc.double({ min: 273.15, max: 1073.15, noNaN: true }), fc.double({ min: 0.2, max: 0.999, noNaN: true }), (T, f) => {
        // v below v(T, 100 MPa): region 1 below 623.15 K, else a bound that is denser than any
        // region 2/3 state at 100 MPa for that T
        const v100 = T <= 623.15 ? region1Volume(T, 100e6) : stateTP(T, 100e6).v;
        const e = caught(() => stateTV(T, f * v100));
        expect(e.field).toBe('pressure');
        expect(e.problem).toBe('out-of-range');
        expect(e.range?.max).toBe(100e6);
      }),
      { numRuns: 500 },
    );
    const e = caught(() => stateTV(293.15, 0.00095)); // v(293.15 K, 100 MPa) ≈ 0.000958 m³/kg
    expect(e.message).toContain('100000000 Pa');
  });

  it('never NaN: any T in range and any v > 0 gives finite properties or an InputError', () => {
    fc.assert(
      fc.property(fc.double({ min: 273.15, max: 1073.15, noNaN: true }), fc.double({ min: Math.log(1e-6), max: Math.log(1e9), noNaN: true }), (T, lnV) => {
        const v = Math.min(1e9, Math.exp(lnV));
        let s: VesselState;
        try {
          s = stateTV(T, v);
        } catch (e) {
          expect(e).toBeInstanceOf(InputError);
          expect((e as InputError).field).toBe('pressure');
          return;
        }
        expectFinite(s);
        expect(s.p).toBeGreaterThan(0);
        expect(s.p).toBeLessThanOrEqual(100e6);
      }),
      { numRuns: 3000 },
    );
  });

  it('near Tc (within 1e-3 K) every v still gives a finite state or an InputError', () => {
    for (const T of [Tc - 1e-3, Tc - 1e-5, Tc - 1e-8, Tc, Tc + 1e-8]) {
      for (const v of [0.0015, 0.0030, 1 / 322, 0.0032, 0.005, 0.1]) expectFinite(stateTV(T, v));
    }
  });

  it('out-of-range T or v throws InputError naming the quantity', () => {
    for (const T of [273.1, 1073.2, Number.NaN, Infinity, -Infinity]) expect(caught(() => stateTV(T, 1)).field).toBe('temperature');
    for (const v of [0, -1, 1.1e9, Number.NaN, Infinity]) expect(caught(() => stateTV(300, v)).field).toBe('specific volume');
  });
});
