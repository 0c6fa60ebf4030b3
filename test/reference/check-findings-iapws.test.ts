// Issue 9's edge states against Debian's python3-iapws (run live with /usr/bin/python3, script
// check-findings-iapws.py beside this file): a liquid-full fill's hydraulic pressure, and its
// pressure after the sealed vessel cools to ambient: p_sat(ambient) when it goes two-phase, with no
// gas carried down (a liquid-full vessel has no gas space).
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { evaluateCheck, saturation, saturationPressure } from '../../src/core/index.ts';
import { testVessel } from '../core/check/test-vessel.ts';

const SCRIPT = fileURLToPath(new URL('./check-findings-iapws.py', import.meta.url));
const V = 2;

interface Answer { hydraulicPa: number | null; twoPhaseAtAmbient: boolean; cooledPa: number | null }

// A fixed spread of liquid-full fills (seeded, so a failure reproduces): v just below v_f(T), and an ambient from 10 to 40 °C.
const cases = fc
  .sample(
    fc.record({ T: fc.double({ min: 330, max: 600, noNaN: true }), squeeze: fc.double({ min: 2e-5, max: 3e-3, noNaN: true }), ambientK: fc.double({ min: 283.15, max: 313.15, noNaN: true }) }),
    { numRuns: 30, seed: 909 },
  )
  .map(({ T, squeeze, ambientK }) => ({ T, ambientK, v: saturation(T).liquid.v * (1 - squeeze) }));

function python(): Answer[] {
  const r = spawnSync('/usr/bin/python3', [SCRIPT], { input: JSON.stringify(cases), encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`python3-iapws failed: ${r.stderr}`);
  return JSON.parse(r.stdout) as Answer[];
}

describe('liquid-full edge states against python3-iapws 1.5.2 (/usr/bin/python3)', () => {
  const answers = python();
  const results = cases.map((c) => {
    const vessel = testVessel({
      geometry: { shape: 'stated-volume', volumeM3: V }, mawpGaugePa: 90e6, reliefSetGaugePa: 80e6, designTemperatureK: 700, ambientTemperatureK: c.ambientK,
      instruments: { ...testVessel().instruments, pressureGauge: { spanPa: 100e6, accuracyPercentOfSpan: 1 } },
    });
    return evaluateCheck(vessel, { time: '2026-03-14T09:30:00Z', temperatureK: c.T, pressure: { reference: 'absolute', pressurePa: Math.max(saturationPressure(c.T), 1e5) }, weight: { kind: 'net', netKg: V / c.v } });
  });
  it('every case is liquid-full, most go two-phase on cooling, and some are within IF97\'s 100 MPa', () => {
    expect(answers).toHaveLength(cases.length);
    for (const r of results) expect(r.inventory.regime).toBe('liquid-full');
    expect(answers.filter((a) => a.twoPhaseAtAmbient).length).toBeGreaterThan(20);
    expect(answers.filter((a) => a.hydraulicPa !== null).length).toBeGreaterThan(10);
  });
  it('the hydraulic pressure at the reading agrees to 1e-6 (within IF97)', () => {
    results.forEach((r, i) => {
      const a = answers[i]!;
      if (r.inventory.regime !== 'liquid-full') return;
      const h = r.inventory.hydraulic;
      expect(h.withinFormulation).toBe(a.hydraulicPa !== null);
      if (h.withinFormulation && a.hydraulicPa !== null) expect(h.absolutePressurePa / a.hydraulicPa).toBeCloseTo(1, 6);
    });
  });
  it('cooled to ambient the pressure is p_sat(ambient) when the fill goes two-phase (to 1e-7), with no gas in it', () => {
    results.forEach((r, i) => {
      const a = answers[i]!;
      const c = r.hazards.cooled;
      expect(c.noncondensablePartialPressurePa).toBe(0);
      expect(c.contents === 'two-phase').toBe(a.twoPhaseAtAmbient);
      if (a.twoPhaseAtAmbient) expect(c.absolutePressurePa! / a.cooledPa!).toBeCloseTo(1, 7);
    });
  });
});
