import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { evaluateCheck } from '../../../src/core/check/evaluate-check.ts';
import type { Reading } from '../../../src/core/check/reading.ts';
import { STANDING_NOTE } from '../../../src/core/check/cautions.ts';
import { InputError } from '../../../src/core/errors.ts';
import { saturation, saturationPressure } from '../../../src/core/steam/index.ts';
import { testVessel } from './test-vessel.ts';

const reading = (over: Partial<Reading> = {}): Reading => ({
  time: '2026-03-14T09:30:00+01:00',
  temperatureK: 394.15,
  pressure: { reference: 'gauge', pressurePa: saturationPressure(394.15) - 101325 },
  weight: { kind: 'net', netKg: 1000 },
  ...over,
});
const rules = (r: ReturnType<typeof evaluateCheck>) => r.cautions.map((c) => c.rule);

describe('evaluateCheck', () => {
  it('a steady 121 °C check: consistent, two-phase, bands, envelope, hazards, standing note last', () => {
    const r = evaluateCheck(testVessel(), reading());
    expect(r.formulationId).toMatch(/IAPWS-IF97/);
    expect(r.saturation.verdict.verdict).toBe('consistent');
    expect(r.inventory.regime).toBe('two-phase');
    expect(r.inventoryBands).not.toBeNull();
    expect(r.envelope?.first.event).toBeDefined();
    expect(r.hazards.flash?.flashFraction).toBeCloseTo(0.0395, 3);
    expect(r.hazards.cooled.collapseRisk).toBe(true);
    expect(r.cautions.at(-1)).toEqual(STANDING_NOTE);
    expect(rules(r)).toEqual(expect.arrayContaining(['flash-on-release', 'vacuum-on-cooling', 'scald', 'bulk-quality-not-dryness', 'saturation-check-limits']));
  });
  it('a vessel filled 95 % with water at 20 °C is flagged to go liquid-full far below 120 °C (computed with python3-iapws 1.5.2 (IAPWS-IF97): 113.5 °C)', () => {
    const v = testVessel();
    const V = 3.845;
    const m = (0.95 * V) / saturation(293.15).liquid.v;
    const r = evaluateCheck(v, reading({ temperatureK: 293.15, pressure: { reference: 'absolute', pressurePa: saturationPressure(293.15) }, weight: { kind: 'net', netKg: m } }));
    expect(r.envelope?.first.event).toBe('liquid-full');
    expect(r.envelope!.liquidFullTemperatureK! - 273.15).toBeLessThan(115);
    expect(rules(r)).toContain('liquid-full-on-heating');
  });
  it('a liquid-full reading is a DANGER with the hydraulic pressure against the MAWP', () => {
    const r = evaluateCheck(testVessel(), reading({ weight: { kind: 'net', netKg: 3800 } }));
    expect(r.inventory.regime).toBe('liquid-full');
    expect(r.cautions[0]).toMatchObject({ signal: 'DANGER', rule: 'liquid-full-now' });
    // A liquid-full vessel above saturation is hydraulic pressure, not air.
    const high = evaluateCheck(testVessel(), reading({ pressure: { reference: 'gauge', pressurePa: 0.8e6 }, weight: { kind: 'net', netKg: 3800 } }));
    expect(high.saturation.verdict.verdict).toBe('pressure-above-saturation');
    expect(rules(high)).not.toContain('noncondensable-gas');
  });
  it('air in the vessel raises the non-condensable gas WARNING with Dalton\'s estimate (Dalton\'s law, common practice)', () => {
    const r = evaluateCheck(testVessel(), reading({ temperatureK: 115.3 + 273.15, pressure: { reference: 'absolute', pressurePa: 204.7e3 } }));
    expect(r.saturation.verdict.verdict).toBe('pressure-above-saturation');
    expect(rules(r)).toContain('noncondensable-gas');
  });
  it('gauge above MAWP is a DANGER; above the relief set pressure a WARNING', () => {
    const hot = evaluateCheck(testVessel(), reading({ temperatureK: 460, pressure: { reference: 'gauge', pressurePa: 1.05e6 }, weight: { kind: 'net', netKg: 200 } }));
    expect(rules(hot)).toContain('pressure-above-mawp');
    const warm = evaluateCheck(testVessel(), reading({ temperatureK: 456, pressure: { reference: 'gauge', pressurePa: 0.95e6 }, weight: { kind: 'net', netKg: 200 } }));
    expect(rules(warm)).toContain('pressure-above-relief-set');
  });
  it('not weighed: the saturation check still runs, no inventory', () => {
    const r = evaluateCheck(testVessel(), reading({ weight: { kind: 'not-weighed' } }));
    expect(r.inventory).toEqual({ regime: 'not-weighed' });
    expect(r.envelope).toBeNull();
    expect(r.inventoryBands).toBeNull();
  });
  it('bad input throws InputError naming the field, never a result', () => {
    expect(() => evaluateCheck(testVessel({ reliefSetGaugePa: 2e6 }), reading())).toThrow(InputError);
    expect(() => evaluateCheck(testVessel(), reading({ weight: { kind: 'gross', grossKg: 100 } }))).toThrow(/gross weight/);
    expect(() => evaluateCheck(testVessel(), reading({ temperatureK: 200 }))).toThrow(/temperature/);
  });
  it('over random cylinder vessels, quality and masses match a recomputation here from saturation values (mass and volume balances; fast-check)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom('vertical-cylinder' as const, 'horizontal-cylinder' as const),
        fc.constantFrom({ kind: 'flat' as const }, { kind: 'semi-ellipsoidal-2-1' as const }, { kind: 'hemispherical' as const }, { kind: 'torispherical' as const }),
        fc.double({ min: 0.3, max: 3, noNaN: true }),
        fc.double({ min: 0.1, max: 8, noNaN: true }),
        fc.double({ min: 290, max: 600, noNaN: true }),
        fc.double({ min: 0.0005, max: 0.9995, noNaN: true }),
        (shape, head, D, Lc, T, x) => {
          const vessel = testVessel({ geometry: { shape, innerDiameterM: D, straightLengthM: Lc, head } });
          const s = saturation(T);
          const R = D / 2;
          // Independent volume: cylinder + two heads from the closed forms of solid geometry.
          const headV = head.kind === 'flat' ? 0 : head.kind === 'hemispherical' ? (Math.PI * D ** 3) / 12
            : head.kind === 'semi-ellipsoidal-2-1' ? (Math.PI * D ** 3) / 24 : null;
          const r = evaluateCheck(vessel, reading({ temperatureK: T, pressure: { reference: 'absolute', pressurePa: s.p }, weight: { kind: 'net', netKg: 1 } }));
          const V = r.internalVolumeM3;
          if (headV !== null) expect(V / (Math.PI * R * R * Lc + 2 * headV)).toBeCloseTo(1, 10);
          const m = V / (s.liquid.v + x * (s.vapor.v - s.liquid.v));
          const e = evaluateCheck(vessel, reading({ temperatureK: T, pressure: { reference: 'absolute', pressurePa: s.p }, weight: { kind: 'net', netKg: m } }));
          expect(e.inventory.regime).toBe('two-phase');
          if (e.inventory.regime !== 'two-phase') return;
          const mg = ((V / m - s.liquid.v) / (s.vapor.v - s.liquid.v)) * m;
          expect(e.inventory.vaporMassKg / mg).toBeCloseTo(1, 8);
          expect(e.inventory.liquidMassKg + e.inventory.vaporMassKg).toBeCloseTo(m, 8);
          expect(e.inventory.liquidLevel!.levelFraction).toBeGreaterThanOrEqual(0);
          expect(e.inventory.liquidLevel!.levelFraction).toBeLessThanOrEqual(1);
        },
      ),
      { numRuns: 150 },
    );
  });
  it('results are plain serialisable data without NaN over random valid readings (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 273.16, max: 640, noNaN: true }),
        fc.double({ min: 0.5, max: 2, noNaN: true }),
        fc.oneof(fc.constant(null), fc.double({ min: 0.01, max: 4000, noNaN: true })),
        (T, pressureFactor, net) => {
          const pAbs = Math.min(22e6, Math.max(700, saturationPressure(T) * pressureFactor));
          const r = evaluateCheck(testVessel(), reading({
            temperatureK: T,
            pressure: { reference: 'absolute', pressurePa: pAbs },
            weight: net === null ? { kind: 'not-weighed' } : { kind: 'net', netKg: net },
          }));
          const text = JSON.stringify(r);
          expect(text).not.toMatch(/NaN|Infinity|null,"?undefined/);
          expect(JSON.parse(text)).toEqual(r);
          expect(r.cautions.at(-1)?.rule).toBe('standing-note');
        },
      ),
      { numRuns: 150 },
    );
  });
});

describe('evaluateCheck, contents too light for the formulation', () => {
  it('refuses a net weight of micrograms naming the weight field', () => {
    expect(() => evaluateCheck(testVessel(), reading({ weight: { kind: 'net', netKg: 1e-12 } }))).toThrow(/net weight/);
  });
});

describe('every check rule is raised by its scenario', () => {
  const scenarios: [string, Parameters<typeof testVessel>[0], Partial<Reading>][] = [
    ['pressure-below-saturation', {}, { pressure: { reference: 'absolute', pressurePa: 120e3 } }],
    ['superheated-pressure-mismatch', {}, { temperatureK: 423.15, pressure: { reference: 'absolute', pressurePa: 300e3 }, weight: { kind: 'net', netKg: 1 } }],
    ['liquid-full-within-band', {}, { weight: { kind: 'net', netKg: 3610 } }],
    ['above-design-temperature', { designTemperatureK: 373.15 }, {}],
    ['pressure-near-relief-set', {}, { temperatureK: 451, pressure: { reference: 'gauge', pressurePa: 0.85e6 }, weight: { kind: 'net', netKg: 200 } }],
    ['atmosphere-assumed', {}, {}],
  ];
  for (const [rule, vesselOver, readingOver] of scenarios) {
    it(rule, () => {
      const r = evaluateCheck(testVessel(vesselOver), reading(readingOver));
      expect(r.cautions.map((c) => c.rule)).toContain(rule);
    });
  }
  it('a measured barometer removes the atmosphere-assumed notice', () => {
    const r = evaluateCheck(testVessel(), reading({ atmospherePa: 101325 }));
    expect(r.cautions.map((c) => c.rule)).not.toContain('atmosphere-assumed');
  });
});

describe('evaluateCheck over arbitrary inputs (fast-check)', () => {
  it('returns plain finite data or throws InputError, never anything else', () => {
    const head = fc.oneof(
      fc.constant({ kind: 'flat' as const }),
      fc.constant({ kind: 'semi-ellipsoidal-2-1' as const }),
      fc.constant({ kind: 'hemispherical' as const }),
      fc.record({ kind: fc.constant('torispherical' as const), crownRadiusM: fc.double({ min: 0.1, max: 5, noNaN: true }), knuckleRadiusM: fc.double({ min: 0.01, max: 1, noNaN: true }) }),
    );
    const geometry = fc.oneof(
      fc.record({ shape: fc.constant('stated-volume' as const), volumeM3: fc.double({ min: 1e-3, max: 100, noNaN: true }) }),
      fc.record({
        shape: fc.constantFrom('vertical-cylinder' as const, 'horizontal-cylinder' as const),
        innerDiameterM: fc.double({ min: 0.1, max: 4, noNaN: true }),
        straightLengthM: fc.double({ min: 0, max: 10, noNaN: true }),
        head,
      }),
    );
    fc.assert(
      fc.property(
        geometry,
        fc.double({ min: 273.16, max: 647.096, noNaN: true }),
        fc.double({ min: -2e5, max: 3e7, noNaN: true }),
        fc.boolean(),
        fc.oneof(fc.constant(undefined), fc.double({ min: 20e3, max: 120e3, noNaN: true })),
        fc.oneof(
          fc.constant({ kind: 'not-weighed' as const }),
          fc.record({ kind: fc.constant('net' as const), netKg: fc.double({ min: -1, max: 2e5, noNaN: true }) }),
          fc.record({ kind: fc.constant('gross' as const), grossKg: fc.double({ min: 0, max: 2e5, noNaN: true }) }),
        ),
        (g, T, p, gauge, atm, weight) => {
          try {
            const r = evaluateCheck(testVessel({ geometry: g }), {
              time: '2026-03-14T09:30:00Z',
              temperatureK: T,
              pressure: { reference: gauge ? 'gauge' : 'absolute', pressurePa: p },
              ...(atm === undefined ? {} : { atmospherePa: atm }),
              weight,
            });
            expect(JSON.parse(JSON.stringify(r))).toEqual(r);
          } catch (e) {
            if (!(e instanceof InputError)) throw e;
            expect(e.field.length).toBeGreaterThan(0);
          }
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe('limits judged with the gauge band (test vessel: MAWP 1000 kPa, relief set 900 kPa, gauge 1 % of a 1600 kPa span = ±16 kPa; common practice)', () => {
  const at = (gaugePa: number, temperatureK = 456) =>
    evaluateCheck(testVessel(), reading({ temperatureK, pressure: { reference: 'gauge', pressurePa: gaugePa }, weight: { kind: 'net', netKg: 200 } }));
  it('a reading exactly at MAWP, or within the gauge band below it, is a WARNING: normal relieving, accumulation above MAWP allowed while relieving (ASME BPVC Section VIII Div. 1 UG-125(c), from memory)', () => {
    for (const p of [1.0e6, 0.99e6, 0.985e6]) {
      const r = at(p);
      expect(r.findings.find((c) => c.rule === 'pressure-at-mawp')?.signal).toBe('WARNING');
    }
    expect(rules(at(0.98e6))).not.toContain('pressure-at-mawp');
  });
  it('a reading exactly at the relief set pressure, or within the gauge band below it, is a WARNING', () => {
    for (const p of [0.9e6, 0.89e6]) {
      expect(at(p).cautions.find((c) => c.rule === 'pressure-at-relief-set')?.signal).toBe('WARNING');
    }
    const near = at(0.85e6);
    expect(rules(near)).toContain('pressure-near-relief-set');
    expect(near.cautions.find((c) => c.rule === 'pressure-near-relief-set')?.message).toMatch(/94 % of the relief set pressure/);
  });
  it('a vacuum now on a vessel not rated for it is a WARNING; a rated vessel or a reading within the gauge band is not flagged', () => {
    const cool = (gaugePa: number, vacuumRated: boolean) =>
      evaluateCheck(testVessel({ vacuumRated }), reading({ temperatureK: 363.15, pressure: { reference: 'gauge', pressurePa: gaugePa }, weight: { kind: 'net', netKg: 200 } }));
    expect(cool(-31e3, false).cautions.find((c) => c.rule === 'vacuum-now')?.signal).toBe('WARNING');
    expect(rules(cool(-31e3, true))).not.toContain('vacuum-now');
    expect(rules(cool(-10e3, false))).not.toContain('vacuum-now');
  });
});
