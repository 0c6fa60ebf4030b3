// The check engine's main figures against Debian's python3-iapws (run live with /usr/bin/python3,
// script check-engine-iapws.py beside this file): quality, liquid mass, p_sat, flash fraction,
// isentropic expansion work, liquid-full temperature and the dry saturated charge, over a spread
// of vessels, temperatures and fills.
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { evaluateCheck, planFill, saturation, type VesselSpec } from '../../src/core/index.ts';
import { testVessel } from '../core/check/test-vessel.ts';

const SCRIPT = fileURLToPath(new URL('./check-engine-iapws.py', import.meta.url));

interface Answer {
  quality: number;
  liquidMassKg: number;
  saturationPressurePa: number;
  flashFraction: number;
  expansionWorkJ: number;
  liquidFullTemperatureK: number | null;
  dryChargeKg: number;
}

function vessel(volumeM3: number): VesselSpec {
  // The check-engine tests' invented vessel, rated high enough that no limit caution interferes.
  return testVessel({
    tag: 'REF-1', description: 'reference comparison vessel', geometry: { shape: 'stated-volume', volumeM3 }, tareKg: 0,
    mawpGaugePa: 20e6, designTemperatureK: 700, reliefSetGaugePa: 18e6, vacuumRated: true,
    instruments: { ...testVessel().instruments, pressureGauge: { spanPa: 25e6, accuracyPercentOfSpan: 1 }, weightToleranceKg: 0.1 },
  });
}

// A fixed spread of cases (seeded, so a failure reproduces).
const cases = fc
  .sample(
    fc.record({
      T: fc.double({ min: 300, max: 620, noNaN: true }),
      V: fc.double({ min: 0.05, max: 20, noNaN: true }),
      x: fc.double({ min: 0.0005, max: 0.95, noNaN: true }),
      atmPa: fc.double({ min: 80e3, max: 105e3, noNaN: true }),
    }),
    { numRuns: 40, seed: 97 },
  )
  .map(({ T, V, x, atmPa }) => {
    const s = saturation(T);
    return { T, V, atmPa, m: V / (s.liquid.v + x * (s.vapor.v - s.liquid.v)) };
  });

function python(): Answer[] {
  const r = spawnSync('/usr/bin/python3', [SCRIPT], { input: JSON.stringify(cases), encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`python3-iapws failed: ${r.stderr}`);
  return JSON.parse(r.stdout) as Answer[];
}

describe('check engine against python3-iapws 1.5.2 (/usr/bin/python3)', () => {
  const answers = python();
  it('computes an answer for every case, with liquid-full temperatures below 623.15 K among them', () => {
    expect(answers).toHaveLength(cases.length);
    expect(answers.filter((a) => a.liquidFullTemperatureK !== null && a.liquidFullTemperatureK <= 623.15).length).toBeGreaterThanOrEqual(5);
  });
  it('quality, liquid mass, p_sat, flash fraction, expansion work, liquid-full temperature', () => {
    cases.forEach((c, i) => {
      const a = answers[i]!;
      const r = evaluateCheck(vessel(c.V), {
        time: '2026-01-01T00:00:00Z',
        temperatureK: c.T,
        pressure: { reference: 'absolute', pressurePa: saturation(c.T).p },
        atmospherePa: c.atmPa,
        weight: { kind: 'net', netKg: c.m },
      });
      expect(r.inventory.regime).toBe('two-phase');
      if (r.inventory.regime !== 'two-phase') return;
      expect(r.inventory.quality / a.quality).toBeCloseTo(1, 7);
      expect(r.inventory.liquidMassKg / a.liquidMassKg).toBeCloseTo(1, 7);
      expect(r.inventory.saturationPressurePa / a.saturationPressurePa).toBeCloseTo(1, 8);
      expect(r.hazards.flash!.flashFraction).toBeCloseTo(a.flashFraction, 7);
      if (a.expansionWorkJ === 0) expect(r.hazards.storedEnergy!.expansionWorkJ).toBe(0);
      else expect(r.hazards.storedEnergy!.expansionWorkJ / a.expansionWorkJ).toBeCloseTo(1, 5);
      if (a.liquidFullTemperatureK === null) expect(r.envelope!.liquidFullTemperatureK).toBeNull();
      else if (a.liquidFullTemperatureK > 623.15) {
        // Region 3: IAPWS97(T, x=0) there is not the Eq. (28) root the steam engine is checked
        // against (test/reference/if97-fixture.test.ts), so only the side of 623.15 K is compared.
        expect(r.envelope!.liquidFullTemperatureK!).toBeGreaterThan(623.15);
      } else expect(r.envelope!.liquidFullTemperatureK!).toBeCloseTo(a.liquidFullTemperatureK, 4);
    });
  });
  it('dry saturated charge V/v_g', () => {
    cases.forEach((c, i) => {
      const p = planFill(vessel(c.V), { targetTemperatureK: c.T, startTemperatureK: 293.15, target: { kind: 'dry-saturated' }, liquidFullMarginK: 0 });
      expect(p.waterMassKg / answers[i]!.dryChargeKg).toBeCloseTo(1, 8);
    });
  });
});
