// Across the periodic tests: every rule is raised by some case, each with its catalogued signal
// word; no wording says "sterile" or "safe"; the standing note is last; standing cautions never set
// the outcome.
import { describe, expect, it } from 'vitest';
import {
  evaluateAirRemovalTest, evaluateExpansionSuperheat, evaluateFlaskDryness, evaluateNoncondensableGas, evaluateThrottlingDryness,
  evaluateVacuumLeak, PERIODIC_TEST_CAUTION_RULES, PERIODIC_TEST_STANDING_RULES, saturationTemperature,
} from '../../../src/core/index.ts';

const ATM = 101325;
const flask = { supplyPressurePa: 300e3, emptyFlaskMassKg: 0.9, massBeforeKg: 1.55, temperatureBeforeK: 288.15, temperatureAfterK: 353.15, flaskHeatCapacityJPerK: 80 };
const results = [
  evaluateThrottlingDryness({ linePressurePa: 1e6, calorimeterPressurePa: ATM, calorimeterTemperatureK: 383.15 }),
  evaluateExpansionSuperheat({ kind: 'measured', expansionTemperatureK: 403.15, downstreamPressurePa: ATM }),
  evaluateExpansionSuperheat({ kind: 'measured', expansionTemperatureK: saturationTemperature(ATM) - 0.2, downstreamPressurePa: ATM }),
  evaluateExpansionSuperheat({ kind: 'predicted', linePressurePa: 300e3, dryness: 0.99, downstreamPressurePa: 205e3 }),
  evaluateNoncondensableGas({ gasVolumeM3: 5e-6, condensateVolumeM3: 100e-6 }),
  evaluateVacuumLeak([{ timeS: 0, absolutePressurePa: 4000 }, { timeS: 600, absolutePressurePa: 6000 }]),
  evaluateVacuumLeak([{ timeS: 0, absolutePressurePa: 4000 }, { timeS: 600, absolutePressurePa: 5200 }], { gauge: { spanPa: 100e3, accuracyPercentOfSpan: 0.6 } }),
  evaluateVacuumLeak([0, 60, 120, 180].map((t) => ({ timeS: t, absolutePressurePa: 6000 - t }))),
  evaluateFlaskDryness({ ...flask, massAfterKg: 1.65 }, { metalLoads: true }),
  evaluateFlaskDryness({ ...flask, massAfterKg: 1.62 }, { metalLoads: false }),
  evaluateAirRemovalTest({ result: 'fail', note: '', testPackBatch: 'LOT-1' }),
];

describe('periodic-test cautions', () => {
  it('between them the cases raise every rule of the catalogue', () => {
    const seen = new Set(results.flatMap((r) => r.cautions.map((c) => c.rule)));
    expect([...seen].sort()).toEqual(Object.keys(PERIODIC_TEST_CAUTION_RULES).sort());
  });
  it('signal words as catalogued; no "sterile" or "safe"; the standing note last; the outcome from findings only', () => {
    const order = ['DANGER', 'WARNING', 'CAUTION', 'NOTICE'];
    for (const r of results) {
      for (const c of r.cautions) {
        expect(c.signal).toBe(PERIODIC_TEST_CAUTION_RULES[c.rule as keyof typeof PERIODIC_TEST_CAUTION_RULES]);
        expect(c.message).not.toMatch(/\bsterile|safe/i);
      }
      expect(r.cautions[r.cautions.length - 1]!.rule).toBe('periodic-test-standing-note');
      expect(r.standing.every((s) => PERIODIC_TEST_STANDING_RULES.includes(s.rule as never))).toBe(true);
      expect(r.findings.some((f) => PERIODIC_TEST_STANDING_RULES.includes(f.rule as never))).toBe(false);
      const worst = r.findings.map((f) => f.signal).sort((a, b) => order.indexOf(a) - order.indexOf(b))[0] ?? 'none';
      expect(r.outcome).toBe(worst);
    }
  });
});
