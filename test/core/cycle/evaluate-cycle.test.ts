// The cycle evaluation on records built to have known answers: straight-line heat-up, plateau and
// cool-down with pressures from p_sat(T) (IAPWS-IF97), so crossing times, hold lengths and F-values
// are closed forms. The cycles are invented test data.
import { describe, expect, it } from 'vitest';
import {
  CYCLE_CAUTION_RULES, CYCLE_STANDING_NOTE, cycleChart, evaluateCheck, evaluateCycle, InputError, lethalRate,
  saturationPressure, saturationTemperature, type CycleReading, type CycleRecordInput, type VesselSpec,
} from '../../../src/core/index.ts';
import { testVessel } from '../check/test-vessel.ts';

const C = (t: number) => t + 273.15;
// A steriliser chamber's instruments: an IEC 60751 class A RTD and a 0–400 kPa absolute transducer of 0.6 % of span.
const chamber: VesselSpec = testVessel({
  tag: 'ST-1', description: 'steriliser chamber (test)', mawpGaugePa: 300e3, reliefSetGaugePa: 280e3, designTemperatureK: C(150), vacuumRated: true,
  instruments: { ...testVessel().instruments, pressureGauge: { spanPa: 400e3, accuracyPercentOfSpan: 0.6 } },
});

/** Straight lines through (t, °C) corners, a reading every `step` s, p = p_sat(T) + extra(t). */
function record(corners: [number, number][], step = 5, extraPa: (t: number) => number = () => 0): CycleReading[] {
  const out: CycleReading[] = [];
  const end = corners[corners.length - 1]![0];
  for (let t = corners[0]![0]; t <= end + 1e-9; t += step) {
    let k = 0;
    while (k + 2 < corners.length && corners[k + 1]![0] <= t) k++;
    const [t0, c0] = corners[k]!, [t1, c1] = corners[k + 1]!;
    const T = C(c0 + ((c1 - c0) * (t - t0)) / (t1 - t0));
    out.push({ timeS: t, temperatureK: T, absolutePressurePa: saturationPressure(T) + extraPa(t) });
  }
  return out;
}
const type121 = { sterilisingTemperatureK: C(121), holdTimeS: 900 };
const evaluate = (readings: CycleReading[], more: Partial<CycleRecordInput> = {}, vessel = chamber) =>
  evaluateCycle(vessel, { cycleType: type121, readings, pressureMeasured: 'absolute', ...more });
const rules = (e: { findings: { rule: string }[] }) => e.findings.map((f) => f.rule);

// Heat-up 100 → 122 °C over 220 s (crosses 121 °C at 210 s), 1000 s at 122 °C, cool-down to 100 °C over 220 s.
const GOOD = [[0, 100], [220, 122], [1220, 122], [1440, 100]] as [number, number][];

describe('a cycle that holds its band with saturated steam', () => {
  const readings = record(GOOD);
  const e = evaluate(readings);
  it('finds the hold where the heat-up crosses 121 °C and its end where the cool-down does (closed form)', () => {
    expect(e.hold.status).toBe('met');
    expect(e.hold.startS).toBeCloseTo(210, 6);
    expect(e.hold.endS).toBeCloseTo(1230, 6);
    expect(e.timeInBandS).toBeCloseTo(1020, 6);
    expect(e.timeInBandDuringHoldS).toBeCloseTo(1020, 6);
    expect(e.largestExcursion).toBeNull();
    expect(e.holdTemperature!.minK).toBeCloseTo(C(121), 9);
    expect(e.holdTemperature!.maxK).toBeCloseTo(C(122), 9);
  });
  it('every pair agrees with saturation; equilibration 0 (pressure and temperature reach the band together)', () => {
    expect(e.holdSaturation).toMatchObject({ outsideLimit: 0, pressureAboveSaturation: 0, pressureBelowSaturation: 0 });
    expect(Math.abs(e.holdSaturation!.largestDeviation!.deviationK)).toBeLessThan(1e-9);
    expect(e.equilibration.equilibrationS).toBeLessThan(1e-6);
  });
  it('F over the hold is the trapezoid of the lethal rate over the two ramps and the plateau (closed form)', () => {
    const L = (c: number) => lethalRate(C(c), 394.25, 10);
    // Each 1 K ramp inside the hold lasts 10 s, with a reading at its middle (121.5 °C).
    const rampTrapezoid = 0.5 * (L(121) + L(121.5)) * 5 + 0.5 * (L(121.5) + L(122)) * 5;
    const expected = (2 * rampTrapezoid + L(122) * 1000) / 60;
    expect(e.lethality.holdMinutes).toBeCloseTo(expected, 9);
    expect(e.lethality.wholeRecordMinutes).toBeGreaterThan(e.lethality.holdMinutes);
  });
  it('has no findings: outcome none; the standing cautions end with the standing note', () => {
    expect(e.findings).toEqual([]);
    expect(e.outcome).toBe('none');
    expect(e.standing.map((c) => c.rule)).toEqual(['cycle-opening-the-chamber', 'cycle-saturation-agreement-limits', 'cycle-standing-note']);
    expect(e.cautions[e.cautions.length - 1]).toEqual(CYCLE_STANDING_NOTE);
  });
  it('is plain data: a JSON round trip gives it back unchanged', () => {
    expect(JSON.parse(JSON.stringify(e))).toEqual(e);
  });
  it('each pair carries the single check\'s band and verdict for the same reading (one method, not a copy)', () => {
    const s = e.saturationByReading;
    expect(s.deviationK).toHaveLength(readings.length);
    for (const i of [0, 50, 100, 250]) {
      const r = readings[i]!;
      const check = evaluateCheck(chamber, {
        time: '2026-12-04T10:00:00Z', temperatureK: r.temperatureK, pressure: { reference: 'absolute', pressurePa: r.absolutePressurePa }, weight: { kind: 'not-weighed' },
      });
      expect(s.instrumentBandK[i]).toBe(check.saturation.temperatureBandK.plusMinus);
      expect(s.instrumentVerdict[i]).toBe(check.saturation.verdict.verdict);
      expect(s.saturationTemperatureK[i]).toBe(check.saturation.saturationTemperatureK);
      expect(s.deviationK[i]).toBe(check.saturation.temperatureDeviationK);
      expect(s.withinLimit[i]).toBe(true);
    }
  });
  it('the temperature range of the whole record', () => {
    expect(e.temperatureRange.minK).toBeCloseTo(C(100), 9);
    expect(e.temperatureRange.maxK).toBeCloseTo(C(122), 9);
  });
});

describe('what goes wrong shows as findings', () => {
  it('air left in the chamber: half the air at 15 psig gives about 112 °C (Perkins\' table, from memory; field-practice.md §4.2) — not saturated', () => {
    // 204.7 kPa absolute with the temperature at 112.2 °C: T − T_sat(p) ≈ −8.8 K. The band is set low enough to hold.
    const readings = record([[0, 112.2], [1000, 112.2]], 10).map((r) => ({ ...r, absolutePressurePa: 204.7e3 }));
    const e = evaluate(readings, { cycleType: { sterilisingTemperatureK: C(112), holdTimeS: 900 } });
    expect(e.hold.status).toBe('met');
    expect(saturationTemperature(204.7e3) - 273.15).toBeCloseTo(121, 0);
    expect(e.holdSaturation!.largestDeviation!.deviationK).toBeCloseTo(112.2 - (saturationTemperature(204.7e3) - 273.15), 9);
    expect(rules(e)).toContain('cycle-not-saturated');
    expect(e.outcome).toBe('WARNING');
    expect(e.findings[0]!.message).toMatch(/air or another non-condensable gas/);
  });
  it('a few kPa of air (within the 2 K limit, beyond the instruments) is flagged as pressure above saturation', () => {
    // +8 kPa at 122 °C is about 1.2 K of depression; the band here is about ±0.54 K.
    const e = evaluate(record(GOOD, 5, (t) => (t > 300 && t < 1100 ? 8e3 : 0)));
    expect(rules(e)).toEqual(['cycle-pressure-above-saturation']);
    expect(e.outcome).toBe('CAUTION');
    expect(e.holdSaturation!.coldestAboveBandK!).toBeLessThan(-1);
    expect(e.holdSaturation!.coldestAboveBandK!).toBeGreaterThan(-2);
  });
  it('pressure below saturation: superheat within the limit, and beyond it', () => {
    const within = evaluate(record(GOOD, 5, (t) => (t > 300 && t < 1100 ? -8e3 : 0)));
    expect(rules(within)).toEqual(['cycle-pressure-below-saturation']);
    const beyond = evaluate(record(GOOD, 5, (t) => (t > 300 && t < 1100 ? -20e3 : 0)));
    expect(rules(beyond)).toEqual(['cycle-not-saturated']);
    expect(beyond.findings[0]!.message).toMatch(/superheated steam/);
  });
  it('band exceeded: 125.5 °C against 121–124 °C, by 1.5 K', () => {
    const e = evaluate(record([[0, 100], [255, 125.5], [1255, 125.5], [1510, 100]]));
    expect(e.hold.status).toBe('met');
    expect(e.largestExcursion).toMatchObject({ direction: 'above' });
    expect(e.largestExcursion!.byK).toBeCloseTo(1.5, 9);
    expect(rules(e)).toEqual(['cycle-band-exceeded']);
    expect(e.timeInBandS).toBeCloseTo(2 * 30 + 0, 6);
  });
  it('interrupted: a dip to 120 °C during the hold', () => {
    const e = evaluate(record([[0, 100], [220, 122], [600, 122], [620, 120], [640, 122], [1800, 122], [2020, 100]]));
    expect(e.hold.status).toBe('interrupted');
    expect(e.hold.achievedS).toBeCloseTo(400, 6);
    expect(e.hold.interruption!.lowestK).toBeCloseTo(C(120), 9);
    expect(e.largestExcursion).toMatchObject({ direction: 'below' });
    expect(rules(e)).toEqual(['cycle-hold-interrupted']);
    expect(e.findings[0]!.message).toMatch(/A later stretch at temperature lasted the hold time/);
  });
  it('an interrupted hold that also overshoots the band reports both, though the dip is the larger excursion', () => {
    const e = evaluate(record([[0, 100], [220, 122], [500, 122], [520, 124.5], [540, 122], [600, 122], [620, 118], [640, 122], [1800, 122], [2020, 100]]));
    expect(e.largestExcursion).toMatchObject({ direction: 'below' });
    expect(e.largestExcursion!.byK).toBeCloseTo(3, 9);
    expect(e.bandExceeded!.byK).toBeCloseTo(0.5, 9);
    expect(rules(e)).toEqual(['cycle-hold-interrupted', 'cycle-band-exceeded']);
  });
  it('short: the cycle ends 5 min early; and a record that ends during the hold', () => {
    const early = evaluate(record([[0, 100], [220, 122], [920, 122], [1140, 100]]));
    expect(early.hold).toMatchObject({ status: 'short', endedWithRecord: false });
    expect(early.hold.achievedS).toBeCloseTo(720, 6);
    expect(rules(early)).toEqual(['cycle-hold-short']);
    expect(early.findings[0]!.message).toMatch(/did not return; the hold time is 15 min 00 s/);
    const cut = evaluate(record([[0, 100], [220, 122], [800, 122]]));
    expect(cut.hold).toMatchObject({ status: 'short', endedWithRecord: true });
    expect(cut.findings[0]!.message).toMatch(/when the readings end/);
  });
  it('not reached: 120.5 °C at most', () => {
    const e = evaluate(record([[0, 100], [200, 120.5], [1200, 120.5]]));
    expect(e.hold.status).toBe('not-reached');
    expect(e.holdSaturation).toBeNull();
    expect(e.lethality.holdMinutes).toBe(0);
    expect(rules(e)).toEqual(['cycle-band-not-reached']);
    expect(e.findings[0]!.message).toMatch(/highest reading was 120\.5 °C/);
  });
  it('coarse instruments: a 0–10 bar class 1.6 gauge is about ±2.5 K at 121 °C (field-practice.md §3.5), wider than the 2 K limit', () => {
    const coarse = testVessel({ ...chamber, instruments: { ...chamber.instruments, pressureGauge: { spanPa: 1e6, accuracyPercentOfSpan: 1.6 } } });
    const e = evaluate(record(GOOD), {}, coarse);
    expect(e.holdSaturation!.widestInstrumentBandK!).toBeGreaterThan(2.5);
    expect(rules(e)).toEqual(['cycle-instruments-coarser-than-limit']);
    expect(e.outcome).toBe('NOTICE');
  });
  it('sparse readings: a minute apart against a 3 min hold', () => {
    const e = evaluate(record([[0, 100], [240, 135], [600, 135], [840, 100]], 60), { cycleType: { sterilisingTemperatureK: C(134), holdTimeS: 180 } });
    expect(e.hold.status).toBe('met');
    expect(rules(e)).toContain('cycle-readings-sparse');
  });
  it('gauge pressures with the stored site atmosphere: noticed, and the band includes the atmosphere', () => {
    const site = evaluate(record(GOOD), { pressureMeasured: 'gauge' });
    expect(rules(site)).toEqual(['cycle-atmosphere-assumed']);
    const measured = evaluate(record(GOOD), { pressureMeasured: 'gauge', atmosphere: { pressurePa: 100e3, source: 'measured' } });
    expect(measured.findings).toEqual([]);
    const absolute = evaluate(record(GOOD));
    const band = (x: typeof site) => x.saturationByReading.instrumentBandK[100]!;
    expect(band(site)).toBeGreaterThan(band(measured));
    expect(band(measured)).toBeGreaterThan(band(absolute));
  });
});

describe('wording and grading', () => {
  const scenarios = [
    evaluate(record(GOOD)),
    evaluate(record(GOOD, 5, (t) => (t > 300 && t < 1100 ? 8e3 : 0))),
    evaluate(record(GOOD, 5, (t) => (t > 300 && t < 1100 ? -8e3 : 0))),
    evaluate(record(GOOD, 5, (t) => (t > 300 && t < 1100 ? -20e3 : 0))),
    evaluate(record([[0, 100], [255, 125.5], [1255, 125.5], [1510, 100]])),
    evaluate(record([[0, 100], [220, 122], [600, 122], [620, 120], [640, 122], [1800, 122], [2020, 100]])),
    evaluate(record([[0, 100], [220, 122], [920, 122], [1140, 100]])),
    evaluate(record([[0, 100], [200, 120.5], [1200, 120.5]])),
    evaluate(record([[0, 100], [240, 135], [600, 135], [840, 100]], 60), { cycleType: { sterilisingTemperatureK: C(134), holdTimeS: 180 } }),
    evaluate(record(GOOD), { pressureMeasured: 'gauge' }),
    evaluate(record(GOOD), {}, testVessel({ ...chamber, instruments: { ...chamber.instruments, pressureGauge: { spanPa: 1e6, accuracyPercentOfSpan: 1.6 } } })),
  ];
  it('between them the scenarios raise every rule of the catalogue', () => {
    const seen = new Set(scenarios.flatMap((e) => e.cautions.map((c) => c.rule)));
    expect([...seen].sort()).toEqual(Object.keys(CYCLE_CAUTION_RULES).sort());
  });
  it('no wording says "sterile" or "safe"; each caution carries its rule\'s signal word', () => {
    for (const e of scenarios) {
      for (const c of e.cautions) {
        expect(c.message).not.toMatch(/\bsterile|safe/i);
        expect(c.signal).toBe(CYCLE_CAUTION_RULES[c.rule as keyof typeof CYCLE_CAUTION_RULES]);
      }
    }
  });
  it('the outcome is the worst finding; standing cautions never set it; cautions are the union, most severe first, note last', () => {
    const order = ['DANGER', 'WARNING', 'CAUTION', 'NOTICE'];
    for (const e of scenarios) {
      const worst = e.findings.map((f) => f.signal).sort((a, b) => order.indexOf(a) - order.indexOf(b))[0] ?? 'none';
      expect(e.outcome).toBe(worst);
      expect(e.cautions).toHaveLength(e.findings.length + e.standing.length);
      const ranks = e.cautions.slice(0, -1).map((c) => order.indexOf(c.signal));
      expect([...ranks].sort((a, b) => a - b)).toEqual(ranks);
      expect(e.cautions[e.cautions.length - 1]!.rule).toBe('cycle-standing-note');
    }
  });
});

describe('chart data', () => {
  it('one point per reading from 0 s, T and T_sat(p) with the band, and the hold interval', () => {
    const readings = record(GOOD).map((r) => ({ ...r, timeS: r.timeS + 5000 }));
    const e = evaluate(readings);
    const chart = cycleChart(e, readings);
    expect(chart.points).toHaveLength(readings.length);
    expect(chart.points[0]!.elapsedS).toBe(0);
    expect(chart.durationS).toBe(1440);
    expect(chart.band).toEqual({ lowerK: C(121), upperK: C(124), sterilisingTemperatureK: C(121) });
    expect(chart.hold!.startS).toBeCloseTo(210, 6);
    expect(chart.hold!.endS).toBeCloseTo(1230, 6);
    expect(chart.hold!.requiredEndS).toBeCloseTo(1110, 6);
    expect(chart.points[100]!.saturationTemperatureK).toBe(e.saturationByReading.saturationTemperatureK[100]);
    expect(chart.points[100]!.temperatureK).toBe(readings[100]!.temperatureK);
    expect(JSON.parse(JSON.stringify(chart))).toEqual(chart);
  });
  it('has no hold when the band was not reached', () => {
    const readings = record([[0, 100], [200, 110]]);
    expect(cycleChart(evaluate(readings), readings).hold).toBeNull();
  });
  it('refuses readings that are not the evaluation\'s', () => {
    const readings = record(GOOD);
    expect(() => cycleChart(evaluate(readings), readings.slice(1))).toThrow(/readings: not the 289 readings/);
  });
});

describe('bad input names the field and changes nothing', () => {
  const ok = record(GOOD, 60);
  function fieldOf(f: () => unknown): string {
    try { f(); } catch (e) { if (e instanceof InputError) return e.field; throw e; }
    throw new Error('no InputError');
  }
  it.each([
    ['MAWP', () => evaluateCycle({ ...chamber, mawpGaugePa: -1 }, { cycleType: type121, readings: ok, pressureMeasured: 'absolute' })],
    ['cycle', () => evaluateCycle(chamber, null as never)],
    ['hold time', () => evaluate(ok, { cycleType: { ...type121, holdTimeS: -5 } })],
    ['pressure measured', () => evaluate(ok, { pressureMeasured: 'psig' as never })],
    ['atmospheric pressure', () => evaluate(ok, { pressureMeasured: 'gauge', atmosphere: { pressurePa: 101.3, source: 'measured' } })],
    ['atmosphere source', () => evaluate(ok, { atmosphere: { pressurePa: 101e3, source: 'guessed' as never } })],
    ['readings', () => evaluate([])],
    ['reading 3 time', () => evaluate(ok.map((r, i) => (i === 2 ? { ...r, timeS: 0 } : r)))],
    ['reading 4 temperature', () => evaluate(ok.map((r, i) => (i === 3 ? { ...r, temperatureK: 121 } : r)))],
    ['reading 5 pressure (absolute)', () => evaluate(ok.map((r, i) => (i === 4 ? { ...r, absolutePressurePa: 0 } : r)))],
  ])('%s', (field, f) => {
    expect(fieldOf(f)).toBe(field);
  });
  it('the readings given are not changed by an evaluation', () => {
    const copy = structuredClone(ok);
    evaluate(ok);
    expect(ok).toEqual(copy);
  });
});
