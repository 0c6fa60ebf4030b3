// Issue 9: findings apart from standing hazards, the outcome, signal words by their meaning, the
// new rules and the edge states. Each test names its source: a standard's meaning or clause, a
// handbook value, python3-iapws, or "common practice" / "from memory" where that is all there is.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  ACT_NOW_RULES, CAUTION_RULES, RETIRED_RULES, RULE_CATALOGUE, RULE_REASONS, STANDING_RULES, evaluateCheck, findingsOfStoredResult, isStandingRule,
  outcomeOf, outcomeOfStoredCautions, planFill, saturation, saturationPressure, type CheckResult, type CheckResultV1, type Reading, type VesselSpec,
} from '../../../src/core/index.ts';
import { testVessel } from './test-vessel.ts';

const ATM = 101325;
const reading = (over: Partial<Reading> = {}): Reading => ({
  time: '2026-03-14T09:30:00+01:00',
  temperatureK: 394.15,
  pressure: { reference: 'gauge', pressurePa: saturationPressure(394.15) - ATM },
  weight: { kind: 'net', netKg: 1000 },
  ...over,
});
const rules = (list: readonly { rule: string }[]) => list.map((c) => c.rule);
const check = (vesselOver: Partial<VesselSpec> = {}, readingOver: Partial<Reading> = {}) => evaluateCheck(testVessel(vesselOver), reading(readingOver));
const WORDS = ['DANGER', 'WARNING', 'CAUTION', 'NOTICE'] as const;

describe('the rule catalogue', () => {
  it('every rule has one of the four ISO 3864-2 / ANSI Z535.4 signal words, a kind and a reason naming a source or "common practice" / "from memory" or the standard\'s meaning', () => {
    const reasons: Record<string, string> = RULE_REASONS;
    for (const [rule, e] of Object.entries({ ...RULE_CATALOGUE, ...RETIRED_RULES })) {
      expect(WORDS, rule).toContain(e.signal);
      expect(['finding', 'standing', 'method', 'plan'], rule).toContain(e.kind);
      expect(reasons[rule]?.length ?? 0, rule).toBeGreaterThan(20);
    }
    expect(Object.keys(reasons).sort()).toEqual(Object.keys({ ...RULE_CATALOGUE, ...RETIRED_RULES }).sort());
    for (const [rule, e] of Object.entries(RULE_CATALOGUE)) {
      if (e.kind === 'finding' || e.kind === 'standing') expect(reasons[rule], rule).toMatch(/ISO 3864|ANSI Z535|ASME|API|IAPWS|DOE|ISO 13732|Burn Association|Dalton|common practice|from memory|hazards\.ts|issue 9|gas warning|see /);
    }
  });
  it('CAUTION_RULES still gives each rule its word (older readers), and findings are the act-now rules', () => {
    for (const [rule, e] of Object.entries(RULE_CATALOGUE)) expect(CAUTION_RULES[rule as keyof typeof CAUTION_RULES]).toBe(e.signal);
    expect([...ACT_NOW_RULES].sort()).toEqual(Object.entries(RULE_CATALOGUE).filter(([, e]) => e.kind === 'finding').map(([r]) => r).sort());
  });
  it('standing rules are the standing hazards and method notes, the standing note among them; no finding is standing', () => {
    expect(STANDING_RULES).toContain('standing-note');
    expect(STANDING_RULES).toContain('flash-on-release');
    expect(STANDING_RULES).toContain('saturation-check-limits');
    for (const r of ACT_NOW_RULES) expect(isStandingRule(r)).toBe(false);
    expect(isStandingRule('a-rule-no-version-raised')).toBe(false);
  });
  it('no wording overclaims: no caution of any case says "safe", "OK to open" or "approved" (issue 9 §2)', () => {
    const texts: string[] = [];
    for (const [v, r] of scenarios()) texts.push(...evaluateCheck(v, r).cautions.map((c) => c.message));
    texts.push(...planFill(testVessel(), { targetTemperatureK: 394.15, target: { kind: 'quality', quality: 0 }, startTemperatureK: 293.15, liquidFullMarginK: 5 }).cautions.map((c) => c.message));
    for (const t of texts) expect(t).not.toMatch(/\bsafe(ly)?\b|OK to open|approved/i);
  });
});

/** A spread of vessels and readings that raise most rules. */
function scenarios(): [VesselSpec, Reading][] {
  const steamVessel = testVessel({ heating: 'steam-jacket', service: 'steriliser' });
  return [
    [testVessel(), reading()],
    [testVessel(), reading({ temperatureK: 388.45, pressure: { reference: 'absolute', pressurePa: 204.7e3 } })],
    [testVessel(), reading({ weight: { kind: 'net', netKg: 3800 } })],
    [testVessel(), reading({ weight: { kind: 'net', netKg: 3620 } })],
    [testVessel(), reading({ temperatureK: 460, pressure: { reference: 'gauge', pressurePa: 1.05e6 }, weight: { kind: 'net', netKg: 200 } })],
    [testVessel(), reading({ temperatureK: 323.15, pressure: { reference: 'gauge', pressurePa: -80e3 } })],
    [steamVessel, reading()],
    [testVessel({ ambientTemperatureK: 263.15 }), reading()],
    [testVessel(), reading({ atmospherePa: 84e3, pressure: { reference: 'gauge', pressurePa: saturationPressure(394.15) - 84e3 } })],
  ];
}

describe('outcome: the worst signal word among the findings', () => {
  it('a check where gauge and thermometer agree and nothing is wrong with the vessel reads outcome none (issue 9 aim)', () => {
    const r = check();
    expect(r.findings).toEqual([]);
    expect(r.outcome).toBe('none');
    // The standing hazards and the method's notes are all still there, folded apart.
    expect(rules(r.standing)).toEqual(expect.arrayContaining(['flash-on-release', 'scald', 'do-not-open-under-pressure', 'saturation-check-limits', 'bulk-quality-not-dryness', 'standing-note']));
    expect(r.standing.at(-1)?.rule).toBe('standing-note');
  });
  it('a disagreeing check reads its signal word: gas suspected is WARNING (Dalton\'s law, common practice)', () => {
    const r = check({}, { temperatureK: 388.45, pressure: { reference: 'absolute', pressurePa: 204.7e3 } });
    expect(rules(r.findings)).toContain('noncondensable-gas');
    expect(r.outcome).toBe('WARNING');
  });
  it('cautions stay the union, most severe first, the standing note last', () => {
    const r = check({}, { temperatureK: 388.45, pressure: { reference: 'absolute', pressurePa: 204.7e3 } });
    expect(r.cautions.length).toBe(r.findings.length + r.standing.length);
    expect(r.cautions.at(-1)?.rule).toBe('standing-note');
    const order = r.cautions.slice(0, -1).map((c) => WORDS.indexOf(c.signal));
    expect(order).toEqual([...order].sort((a, b) => a - b));
  });
  it('property: outcome equals the worst finding, findings hold no standing rule, standing holds no finding, over random readings (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 273.15, max: 640, noNaN: true }),
        fc.double({ min: 0.6, max: 1.6, noNaN: true }),
        fc.oneof(fc.constant(null), fc.double({ min: 0.5, max: 4200, noNaN: true })),
        fc.constantFrom<Partial<VesselSpec>>({}, { vacuumRated: true }, { heating: 'steam-coil', service: 'flash-tank' }, { ambientTemperatureK: 260 }, { ambientTemperatureK: 320 }),
        (T, factor, net, over) => {
          const p = Math.min(21e6, Math.max(700, saturationPressure(T) * factor));
          const r = evaluateCheck(testVessel({ mawpGaugePa: 30e6, reliefSetGaugePa: 25e6, designTemperatureK: 700, ...over }), reading({
            temperatureK: T, pressure: { reference: 'absolute', pressurePa: p }, weight: net === null ? { kind: 'not-weighed' } : { kind: 'net', netKg: net },
          }));
          const worst = r.findings.reduce((w, f) => Math.min(w, WORDS.indexOf(f.signal)), 4);
          expect(r.outcome).toBe(worst === 4 ? 'none' : WORDS[worst]);
          expect(outcomeOf(r.findings)).toBe(r.outcome);
          for (const f of r.findings) expect(isStandingRule(f.rule)).toBe(false);
          for (const s of r.standing) expect(isStandingRule(s.rule)).toBe(true);
          expect(outcomeOfStoredCautions(r.cautions)).toBe(r.outcome);
        },
      ),
      { numRuns: 200 },
    );
  });
});

describe('records saved before findings existed', () => {
  // A version 1 result as release 0.1.0 stored it (its cautions, as the log keeps them).
  const v1Cautions = [
    { signal: 'WARNING', message: 'Liquid released to atmosphere flashes …', rule: 'flash-on-release' },
    { signal: 'WARNING', message: 'Cooled to 20.0 °C …', rule: 'vacuum-on-cooling' },
    { signal: 'CAUTION', message: 'Contents at 121.0 °C …', rule: 'scald' },
    { signal: 'NOTICE', message: 'Pressure and temperature agree …', rule: 'saturation-check-limits' },
    { signal: 'NOTICE', message: 'Gauge pressure was converted …', rule: 'atmosphere-assumed' },
    { signal: 'NOTICE', message: 'Quality here is …', rule: 'bulk-quality-not-dryness' },
    { signal: 'NOTICE', message: 'Advisory figures only …', rule: 'standing-note' },
  ] as const;
  it('an agreeing v1 check (every caution a standing hazard or a note) derives outcome none, though its worst word was WARNING', () => {
    expect(outcomeOfStoredCautions(v1Cautions)).toBe('none');
  });
  it('a v1 DANGER at MAWP keeps the word it was saved with: records are never re-judged', () => {
    const stored: { signal: string; message: string; rule: string }[] = [...v1Cautions, { signal: 'DANGER', message: 'Gauge pressure … is at the MAWP', rule: 'pressure-at-mawp' }];
    expect(outcomeOfStoredCautions(stored)).toBe('DANGER');
    const retired: { signal: string; message: string; rule: string }[] = [{ signal: 'CAUTION', message: 'Within the weight …', rule: 'quality-band-reaches-liquid-full' }];
    expect(outcomeOfStoredCautions(retired)).toBe('CAUTION');
  });
  it('findingsOfStoredResult reads a v1 result (derived) and a v2 result (as saved) alike', () => {
    const v2 = check({}, { temperatureK: 388.45, pressure: { reference: 'absolute', pressurePa: 204.7e3 } });
    const { findings, standing, outcome, ...rest } = v2;
    void findings; void standing; void outcome;
    const v1 = { ...rest, resultVersion: undefined } as unknown as CheckResultV1; // built from a v2 result for the test only
    const fromV1 = findingsOfStoredResult(v1);
    const fromV2 = findingsOfStoredResult(v2 as CheckResult);
    expect(fromV1.outcome).toBe('WARNING');
    expect(fromV2.outcome).toBe('WARNING');
    expect(rules(fromV1.findings)).toEqual(rules(fromV2.findings));
  });
});

describe('signal words by their meaning (ISO 3864-2 / ANSI Z535.4: DANGER will, WARNING could cause death or serious injury; CAUTION minor or moderate; NOTICE no injury)', () => {
  it('at MAWP with relief set at MAWP, within the gauge band below it: WARNING (normal relieving; accumulation allowed, ASME BPVC VIII-1 UG-125(c), from memory)', () => {
    const r = check({ reliefSetGaugePa: 1.0e6 }, { temperatureK: 453, pressure: { reference: 'gauge', pressurePa: 0.995e6 }, weight: { kind: 'net', netKg: 200 } });
    expect(r.findings.find((c) => c.rule === 'pressure-at-mawp')?.signal).toBe('WARNING');
  });
  it('above MAWP stays DANGER (outside the rating, ASME BPVC VIII-1 MAWP definition)', () => {
    const r = check({}, { temperatureK: 460, pressure: { reference: 'gauge', pressurePa: 1.05e6 }, weight: { kind: 'net', netKg: 200 } });
    expect(r.findings.find((c) => c.rule === 'pressure-above-mawp')?.signal).toBe('DANGER');
    expect(r.outcome).toBe('DANGER');
  });
  it('scald at 60 °C and above: WARNING (full-thickness burns within seconds, American Burn Association); none below', () => {
    expect(check({}, { temperatureK: 333.15, pressure: { reference: 'absolute', pressurePa: saturationPressure(333.15) } }).standing.find((c) => c.rule === 'scald')?.signal).toBe('WARNING');
    expect(rules(check({}, { temperatureK: 333.0, pressure: { reference: 'absolute', pressurePa: saturationPressure(333.0) } }).standing)).not.toContain('scald');
  });
  it('hot surface for jacketed and steam-heated vessels only: WARNING (ISO 13732-1 contact burns, from memory)', () => {
    for (const heating of ['steam-jacket', 'steam-coil', 'direct-steam'] as const) expect(rules(check({ heating }).standing)).toContain('hot-surface');
    for (const heating of ['electric', 'unheated', 'not-stated', undefined] as const) expect(rules(check(heating ? { heating } : {}).standing)).not.toContain('hot-surface');
  });
  it('vacuum on cooling: WARNING unprotected, NOTICE when rated for vacuum or with a vacuum breaker (both standing)', () => {
    expect(check().standing.find((c) => c.rule === 'vacuum-on-cooling')?.signal).toBe('WARNING');
    expect(check({ vacuumRated: true }).standing.find((c) => c.rule === 'vacuum-on-cooling-protected')?.signal).toBe('NOTICE');
    const breaker = check({ vacuumBreaker: true });
    expect(breaker.standing.find((c) => c.rule === 'vacuum-on-cooling-protected')?.message).toMatch(/vacuum breaker/);
    expect(rules(breaker.standing)).not.toContain('vacuum-on-cooling');
    expect(breaker.hazards.cooled.collapseRisk).toBe(false);
  });
  it('the plan rules describe a plan: WARNING (a plan not yet charged could, not will, cause harm)', () => {
    for (const rule of ['plan-exceeds-two-phase-charge', 'plan-does-not-fit', 'plan-target-above-mawp', 'plan-target-above-relief-set'] as const) {
      expect(RULE_CATALOGUE[rule].signal).toBe('WARNING');
      expect(RULE_CATALOGUE[rule].kind).toBe('plan');
    }
  });
});

describe('relief set pressure with the valve\'s set-pressure tolerance (default ±3 %, common practice)', () => {
  // Test vessel: relief set 0.9 MPa, gauge span 1.6 MPa class 1.0: gauge band ±16 kPa; ±3 % of set is ±27 kPa; together ±31.4 kPa.
  const at = (p: number, over: Partial<VesselSpec> = {}) =>
    check(over, { temperatureK: 456, pressure: { reference: 'gauge', pressurePa: p }, weight: { kind: 'net', netKg: 200 } });
  it('above set by less than the combined band: at the relief set pressure, not above it', () => {
    const r = at(0.925e6);
    expect(rules(r.findings)).toContain('pressure-at-relief-set');
    expect(rules(r.findings)).not.toContain('pressure-above-relief-set');
  });
  it('above set by more than the combined band: above it, WARNING, and the wording never says the device "has not relieved"', () => {
    const r = at(0.935e6);
    const c = r.findings.find((f) => f.rule === 'pressure-above-relief-set');
    expect(c?.signal).toBe('WARNING');
    expect(c?.message).not.toMatch(/has not relieved/);
    expect(c?.message).toMatch(/should be discharging/);
  });
  it('a vessel stating a 10 % tolerance widens the band (±(16² + 90²)^½ kPa = ±91.4 kPa)', () => {
    expect(rules(at(0.98e6, { reliefSetTolerancePercent: 10 }).findings)).toContain('pressure-at-relief-set');
  });
});

describe('the new rules', () => {
  it('a DANGER against opening while the gauge reads above zero, standing; never "safe to open" (quick-opening closures, from memory)', () => {
    const r = check();
    const c = r.standing.find((s) => s.rule === 'do-not-open-under-pressure');
    expect(c?.signal).toBe('DANGER');
    expect(c?.message).toMatch(/above atmosphere/);
    expect(r.outcome).toBe('none');
    // Within the gauge's band of zero it still warns that pressure may remain.
    const cool = check({}, { temperatureK: 353.15, pressure: { reference: 'gauge', pressurePa: 2e3 }, weight: { kind: 'net', netKg: 1000 } });
    expect(cool.standing.find((s) => s.rule === 'do-not-open-under-pressure')?.message).toBeDefined();
    // Far below zero (a vacuum) there is no pressure to release.
    expect(rules(check({ vacuumRated: true }, { temperatureK: 323.15, pressure: { reference: 'gauge', pressurePa: -80e3 } }).standing)).not.toContain('do-not-open-under-pressure');
  });
  it('pressure left after cooling when gas is present (Dalton\'s law, common practice): cooled gauge above zero', () => {
    // 40 kPa of air at 121 °C carried to 20 °C at constant volume: 40·293.15/394.15 = 29.8 kPa plus p_sat(20 °C) 2.34 kPa.
    const r = check({}, { pressure: { reference: 'absolute', pressurePa: saturationPressure(394.15) + 140e3 } });
    const c = r.standing.find((s) => s.rule === 'pressure-after-cooling');
    expect(c?.signal).toBe('WARNING');
    expect(r.hazards.cooled.gaugePressurePa!).toBeGreaterThan(0);
  });
  it('liquid-full reading whose gauge disagrees with the computed hydraulic pressure: CAUTION (analogue of the superheated mismatch)', () => {
    const r = check({ instruments: { ...testVessel().instruments, volumeTolerancePercent: 0.1 } }, { weight: { kind: 'net', netKg: 3700 } });
    expect(r.inventory.regime).toBe('liquid-full');
    expect(rules(r.findings)).toContain('hydraulic-pressure-mismatch');
    expect(r.findings.find((c) => c.rule === 'hydraulic-pressure-mismatch')?.signal).toBe('CAUTION');
  });
  it('water hammer for steam-heated vessels, flash tanks and condensate receivers (common practice)', () => {
    expect(rules(check({ heating: 'steam-coil' }).standing)).toContain('water-hammer');
    expect(rules(check({ service: 'condensate-receiver' }).standing)).toContain('water-hammer');
    expect(rules(check().standing)).not.toContain('water-hammer');
  });
  it('sudden vacuum on a cold-water quench of a steam-filled vessel not rated for vacuum (common practice)', () => {
    expect(rules(check().standing)).toContain('quench-vacuum');
    expect(rules(check({ vacuumRated: true }).standing)).not.toContain('quench-vacuum');
    // Below the atmospheric boiling point there is no steam to condense suddenly.
    expect(rules(check({}, { temperatureK: 353.15, pressure: { reference: 'absolute', pressurePa: saturationPressure(353.15) } }).standing)).not.toContain('quench-vacuum');
  });
  it('freezing when the ambient is below 0 °C (common practice)', () => {
    const r = check({ ambientTemperatureK: 263.15 });
    expect(r.standing.find((c) => c.rule === 'freezing')?.signal).toBe('WARNING');
    expect(r.hazards.cooled.freezes).toBe(true);
    expect(r.hazards.cooled.temperatureK).toBe(273.15);
  });
  it('boil-over of sealed liquids on opening a steriliser early, from 80 °C (door interlock figure from memory)', () => {
    expect(rules(check({ service: 'steriliser' }).standing)).toContain('boil-over-on-opening');
    expect(rules(check({ service: 'steriliser' }, { temperatureK: 343.15, pressure: { reference: 'absolute', pressurePa: saturationPressure(343.15) } }).standing)).not.toContain('boil-over-on-opening');
    expect(rules(check().standing)).not.toContain('boil-over-on-opening');
  });
});

describe('edge states', () => {
  it('liquid-full hydraulic pressure has a band from the limits, a mass window and a certain / possible / no verdict (issue 9: ±0.5 kg on 208 kg spans MPa)', () => {
    // 0.22 m³ at 121 °C with ±0.5 kg on a net weight: liquid-full at V/v_f = 207.5 kg.
    const V = 0.22;
    const vf = saturation(394.15).liquid.v;
    const small = testVessel({ geometry: { shape: 'stated-volume', volumeM3: V }, mawpGaugePa: 4e6, reliefSetGaugePa: 3.6e6, instruments: { ...testVessel().instruments, weightToleranceKg: 0.5, volumeTolerancePercent: 0 } });
    const r = evaluateCheck(small, reading({ weight: { kind: 'net', netKg: V / vf + 0.9 } }));
    expect(r.inventory.regime).toBe('liquid-full');
    if (r.inventory.regime !== 'liquid-full' || !r.inventory.hydraulic.withinFormulation) throw new Error('expected a hydraulic pressure within IF97');
    const h = r.inventory.hydraulic;
    expect(h.band.lowAbsolutePa!).toBeLessThan(h.absolutePressurePa);
    expect(h.band.highAbsolutePa!).toBeGreaterThan(h.absolutePressurePa);
    expect(h.band.highAbsolutePa! - h.band.lowAbsolutePa!).toBeGreaterThan(1e6);
    expect(['certain', 'possible', 'no']).toContain(h.exceedsMawp);
    const w = h.band.massWindow;
    expect(w.withinMawpBelowKg!).toBeLessThan(w.exceedsMawpAboveKg!);
    // A fill at the window's upper edge exceeds the MAWP for certain; one below its lower edge not at all.
    const over = evaluateCheck(small, reading({ weight: { kind: 'net', netKg: w.exceedsMawpAboveKg! + 0.01 } }));
    if (over.inventory.regime === 'liquid-full') expect(over.inventory.hydraulic.exceedsMawp).toBe('certain');
    const under = evaluateCheck(small, reading({ weight: { kind: 'net', netKg: Math.max(w.withinMawpBelowKg! - 0.01, V / vf + 0.6) } }));
    if (under.inventory.regime === 'liquid-full' && w.withinMawpBelowKg! - 0.01 > V / vf + 0.6) expect(under.inventory.hydraulic.exceedsMawp).toBe('no');
  });
  it('knife edge at liquid-full: 1 ppm either side of v_f reads the same state, "liquid-full within the weighing band", WARNING (issue 9 §3)', () => {
    const V = 3.845;
    const vf = saturation(394.15).liquid.v;
    const v = testVessel({ geometry: { shape: 'stated-volume', volumeM3: V }, instruments: { ...testVessel().instruments, volumeTolerancePercent: 0.1 } });
    for (const f of [1 - 1e-6, 1 + 1e-6]) {
      const r = evaluateCheck(v, reading({ weight: { kind: 'net', netKg: (V / vf) * f } }));
      expect(rules(r.findings)).toContain('liquid-full-within-band');
      expect(rules(r.findings)).not.toContain('liquid-full-now');
      expect(r.outcome).toBe('WARNING');
    }
    // Well past the band it is certain: DANGER.
    expect(rules(evaluateCheck(v, reading({ weight: { kind: 'net', netKg: (V / vf) * 1.01 } })).findings)).toContain('liquid-full-now');
  });
  it('quality bands keep inside 0…1 and say when they are undetermined: near the critical point, and a weight tolerance above the contents (issue 9 §3)', () => {
    const near = evaluateCheck(testVessel({ mawpGaugePa: 30e6, reliefSetGaugePa: 25e6, designTemperatureK: 700 }), reading({
      temperatureK: 647.09, pressure: { reference: 'absolute', pressurePa: saturationPressure(647.09) }, weight: { kind: 'net', netKg: 3.845 * 322 },
    }));
    const qn = near.inventoryBands!.quality;
    expect(qn.plusMinus).toBeGreaterThan(1);
    expect([qn.low, qn.high]).toEqual([0, 1]);
    expect(qn.undetermined?.reason).toBe('near-critical-point');
    expect(rules(near.standing)).toContain('quality-undetermined');
    // 5 kg in 3.845 m³ at 121 °C is two-phase (v_g = 0.892 m³/kg); a ±6 kg scale cannot tell it from empty.
    const light = evaluateCheck(testVessel({ instruments: { ...testVessel().instruments, weightToleranceKg: 6 } }), reading({ weight: { kind: 'net', netKg: 5 } }));
    expect(light.inventoryBands!.quality.undetermined?.reason).toBe('weight-tolerance-exceeds-contents');
  });
  it('property: no quality band leaves 0…1, and liquid mass bands stay within 0…net mass (fast-check)', () => {
    fc.assert(
      fc.property(fc.double({ min: 273.15, max: 647.09, noNaN: true }), fc.double({ min: 0.01, max: 4000, noNaN: true }), fc.double({ min: 0, max: 50, noNaN: true }), (T, net, tol) => {
        const r = evaluateCheck(testVessel({ mawpGaugePa: 30e6, reliefSetGaugePa: 25e6, designTemperatureK: 700, instruments: { ...testVessel().instruments, weightToleranceKg: tol } }),
          reading({ temperatureK: T, pressure: { reference: 'absolute', pressurePa: saturationPressure(T) }, weight: { kind: 'net', netKg: net } }));
        const b = r.inventoryBands;
        if (!b) return;
        expect(b.quality.low).toBeGreaterThanOrEqual(0);
        expect(b.quality.high).toBeLessThanOrEqual(1);
        expect(b.quality.low).toBeLessThanOrEqual(b.quality.high);
        expect(b.liquidMassKg.low).toBeGreaterThanOrEqual(0);
        expect(b.liquidMassKg.high).toBeLessThanOrEqual(net);
      }),
      { numRuns: 200 },
    );
  });
  it('gas inferred in a liquid-full vessel never enters the cooled state, and no cap value is a figure', () => {
    const full = check({}, { pressure: { reference: 'gauge', pressurePa: 0.8e6 }, weight: { kind: 'net', netKg: 3700 } });
    expect(full.hazards.cooled.noncondensablePartialPressurePa).toBe(0);
    const beyond = check({ ambientTemperatureK: 333.15 }, { temperatureK: 294.15, pressure: { reference: 'absolute', pressurePa: 3e3 }, weight: { kind: 'net', netKg: 3845 / 0.95 } });
    expect(beyond.hazards.cooled.aboveFormulationLimit).toBe(true);
    expect(beyond.hazards.cooled.absolutePressurePa).toBeNull();
  });
  it('how much gas the check can hide: airDetectionLimit = band / p_abs (Dalton), in the wording; 1.5 % to 10.5 % over realistic kits (issue 9)', () => {
    const r = check();
    expect(r.saturation.airDetectionLimit).toBeCloseTo(r.saturation.pressureBand.plusMinus / r.saturation.absolutePressurePa, 15);
    const note = r.standing.find((c) => c.rule === 'saturation-check-limits')!;
    expect(note.message).toContain(`${(100 * r.saturation.airDetectionLimit).toFixed(1)} % air`);
    expect(note.message).not.toMatch(/a few percent/);
    // A fine kit (class AA, 0.25 % gauge, barometer given) hides less than a coarse one (class B, 1.6 % of a wide span, site atmosphere).
    const fine = check({ instruments: { ...testVessel().instruments, temperatureSensor: { kind: 'iec-60751', sensorClass: 'AA' }, pressureGauge: { spanPa: 0.4e6, accuracyPercentOfSpan: 0.25 } } }, { atmospherePa: ATM });
    const coarse = check({ instruments: { ...testVessel().instruments, temperatureSensor: { kind: 'iec-60751', sensorClass: 'B' }, pressureGauge: { spanPa: 1.6e6, accuracyPercentOfSpan: 1.6 } } });
    expect(fine.saturation.airDetectionLimit).toBeLessThan(0.02);
    expect(coarse.saturation.airDetectionLimit).toBeGreaterThan(0.08);
  });
  it('the elevation the stored atmosphere implies (US Standard Atmosphere 1976: 101 325 Pa at 0 m, 83 520 Pa near 1 600 m)', () => {
    expect(check().atmosphere.siteElevationM!).toBeCloseTo(0, 6);
    const high = check({ siteAtmospherePa: 83_520 });
    expect(high.atmosphere.siteElevationM!).toBeGreaterThan(1590);
    expect(high.atmosphere.siteElevationM!).toBeLessThan(1610);
    expect(high.standing.find((c) => c.rule === 'atmosphere-assumed')?.message).toMatch(/about 1[56]\d\d m elevation/);
  });
  it('a sea-level value kept for a 1,600 m site: with a barometer reading it is a finding, CAUTION, beyond the ±3 kPa weather band', () => {
    const p = 83.5e3;
    const r = check({}, { atmospherePa: p, pressure: { reference: 'gauge', pressurePa: saturationPressure(394.15) - p } });
    expect(r.atmosphere.differencePa).toBeCloseTo(p - ATM, 6);
    expect(r.findings.find((c) => c.rule === 'site-atmosphere-differs')?.signal).toBe('CAUTION');
    expect(rules(check({}, { atmospherePa: 99.5e3, pressure: { reference: 'gauge', pressurePa: saturationPressure(394.15) - 99.5e3 } }).findings)).not.toContain('site-atmosphere-differs');
  });
  it('tare tolerance: √2 × the scale\'s limit only when the tare was weighed like the gross; a stated tare brings its own (root-sum-square, JCGM 100:2008 §5.1 for independent limits)', () => {
    const gross = { weight: { kind: 'gross' as const, grossKg: 2500 } };
    const weighed = check({}, gross);
    const stated = check({ instruments: { ...testVessel().instruments, tare: { kind: 'stated', toleranceKg: 10 } } }, gross);
    // 2 kg scale: √2·2 = 2.83 kg against √(2² + 10²) = 10.2 kg.
    const w = weighed.inventoryBands!.quality.contributions.weight;
    const s = stated.inventoryBands!.quality.contributions.weight;
    expect(s / w).toBeCloseTo(Math.hypot(2, 10) / (Math.SQRT2 * 2), 9);
  });
  it('thermometer and gauge: indicator and drift limits join the band, each part shown (root-sum-square)', () => {
    const base = check({}, { atmospherePa: ATM });
    const withMore = check({ instruments: { ...testVessel().instruments, temperatureIndicatorToleranceK: 0.2, temperatureDriftToleranceK: 0.3, pressureGauge: { spanPa: 1.6e6, accuracyPercentOfSpan: 1, indicatorPercentOfSpan: 0.5, driftPercentOfSpan: 0.25 } } }, { atmospherePa: ATM });
    const c = withMore.saturation.pressureBand.contributions;
    expect(c.pressureGaugeIndicator).toBeCloseTo(8000, 6);
    expect(c.pressureGaugeDrift).toBeCloseTo(4000, 6);
    expect(c.temperatureIndicator / c.temperatureSensor).toBeCloseTo(0.2 / (0.15 + 0.002 * 121), 9);
    expect(c.temperatureDrift / c.temperatureIndicator).toBeCloseTo(1.5, 9);
    const parts = Object.values(c);
    expect(withMore.saturation.pressureBand.plusMinus).toBeCloseTo(Math.hypot(...parts), 6);
    expect(withMore.saturation.pressureBand.plusMinus).toBeGreaterThan(base.saturation.pressureBand.plusMinus);
    // With none given the band is exactly what it was (the parts added are 0).
    expect(Object.values(base.saturation.pressureBand.contributions).slice(3)).toEqual([0, 0, 0, 0]);
  });
  it('cooled state also warms: a full vessel at 4 °C warming to 20 °C reaches MPa (issue 9: 4.1 MPa), a WARNING finding', () => {
    const V = 3.845;
    const m = V / saturation(277.15).liquid.v * (1 - 1e-7);
    const r = check({ ambientTemperatureK: 293.15, geometry: { shape: 'stated-volume', volumeM3: V } }, {
      temperatureK: 277.15, pressure: { reference: 'absolute', pressurePa: saturationPressure(277.15) }, weight: { kind: 'net', netKg: m },
    });
    expect(r.hazards.cooled.direction).toBe('warming');
    expect(r.hazards.cooled.contents).toBe('liquid-full');
    expect(r.hazards.cooled.gaugePressurePa!).toBeGreaterThan(3e6);
    expect(r.findings.find((c) => c.rule === 'liquid-full-on-warming')?.signal).toBe('WARNING');
  });
  it('0.00 °C typed (273.15 K, inside IF97: regions 1 and 4 start there, IAPWS R7-97(2012)) is accepted', () => {
    const r = check({}, { temperatureK: 273.15, pressure: { reference: 'absolute', pressurePa: saturationPressure(273.15) }, weight: { kind: 'net', netKg: 2000 } });
    expect(r.saturation.saturationPressurePa).toBeCloseTo(611.213, 2);
    expect(() => check({}, { temperatureK: 273.14 })).toThrow(/temperature/);
  });
});
