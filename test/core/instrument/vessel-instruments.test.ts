// A check's vessel once the register knows its instruments: the band takes each instrument's limit
// at the check's time, the copy names the instruments and calibrations, and an overdue instrument is
// a finding. The vessel, tags and figures are invented test data.
import { describe, expect, it } from 'vitest';
import { evaluateCheck, saturationPressure, type Reading, type VesselSpec } from '../../../src/core/index.ts';
import { DEFAULT_INSTRUMENT_SETTINGS, MS_PER_DAY, MS_PER_YEAR, vesselWithInstruments, withInstrumentFindings, type FittedInstrument } from '../../../src/core/instrument/index.ts';
import { expectInputError } from '../units/expect-input-error.ts';

const VESSEL: VesselSpec = {
  tag: 'TEST-AC-1', description: 'invented test autoclave', designTemperatureK: 473.15, vacuumRated: true, siteAtmospherePa: 101_325,
  ambientTemperatureK: 293.15, tareKg: 850, mawpGaugePa: 300e3, reliefSetGaugePa: 280e3,
  geometry: { shape: 'horizontal-cylinder', innerDiameterM: 0.9, straightLengthM: 1.5, head: { kind: 'torispherical' } },
  instruments: {
    pressureGauge: { spanPa: 400e3, accuracyPercentOfSpan: 1, driftPercentOfSpan: 0.5 }, temperatureSensor: { kind: 'iec-60751', sensorClass: 'A' },
    temperatureDriftToleranceK: 0.2, weightToleranceKg: 2, volumeTolerancePercent: 2, barometerTolerancePa: 0,
  },
};
const T0 = Date.parse('2026-06-01T08:00:00Z');
const reading = (timeMs: number): Reading => ({
  time: new Date(timeMs).toISOString(), temperatureK: 394.15,
  pressure: { reference: 'absolute', pressurePa: saturationPressure(394.15) }, weight: { kind: 'not-weighed' },
});
// The entries the register upgrade makes of VESSEL (src/store/instrument-upgrade.ts).
const gauge = (calibrations: FittedInstrument['calibrations'] = []): FittedInstrument => ({
  instrumentId: 'g', spec: { tag: 'TEST-AC-1 PI', kind: 'pressure-gauge', range: { low: 0, high: 400e3 }, tolerance: { kind: 'percent-of-span', percentOfSpan: 1 } }, calibrations,
});
const rtd = (calibrations: FittedInstrument['calibrations'] = []): FittedInstrument => ({
  instrumentId: 't', spec: { tag: 'TEST-AC-1 TI', kind: 'rtd', range: { low: 273.15, high: 473.15 }, tolerance: { kind: 'iec-60751', sensorClass: 'A' } }, calibrations,
});

describe('a check\'s vessel with register instruments', () => {
  it('with none fitted the vessel is the same object and nothing is added', () => {
    const v = vesselWithInstruments(VESSEL, {}, { nowMs: T0 });
    expect(v.vessel).toBe(VESSEL);
    expect(v.uses).toEqual([]);
    expect(v.findings).toEqual([]);
  });

  it('entries made from the vessel, no calibration on record: the band is exactly what the typed figures gave (arithmetic)', () => {
    const before = evaluateCheck(VESSEL, reading(T0));
    const v = vesselWithInstruments(VESSEL, { pressure: gauge(), temperature: rtd() }, { nowMs: T0 });
    const after = evaluateCheck(v.vessel, reading(T0));
    expect(after.saturation.pressureBand.plusMinus).toBeCloseTo(before.saturation.pressureBand.plusMinus, 9);
    expect(v.uses.map((u) => [u.tag, u.due, u.driftSource, u.calibrationId])).toEqual([
      ['TEST-AC-1 PI', 'no-calibration', 'vessel', null], ['TEST-AC-1 TI', 'no-calibration', 'vessel', null],
    ]);
    expect(v.vessel.instrumentsUsed).toEqual(v.uses);
    expect(v.findings).toEqual([]);
  });

  it('after a calibration the gauge band is class ⊕ as-left ⊕ drift allowance × time since (RSS; arithmetic, common-practice default of 0.5 % of span a year)', () => {
    const half = T0 + MS_PER_YEAR / 2;
    const v = vesselWithInstruments(VESSEL, { pressure: gauge([{ calibrationId: 'c1', timeMs: T0, asFoundError: 2500, asLeftError: 1000 }]) }, { nowMs: half });
    const rate = DEFAULT_INSTRUMENT_SETTINGS['pressure-gauge'].driftAllowance;
    expect(rate).toEqual({ basis: 'percent-of-span', percentOfSpanPerYear: 0.5 });
    const driftPa = 0.005 * 400e3 * 0.5; // 1 kPa in half a year
    const g = v.vessel.instruments.pressureGauge;
    expect((g.accuracyPercentOfSpan / 100) * g.spanPa).toBeCloseTo(4000, 6);
    expect(((g.driftPercentOfSpan ?? 0) / 100) * g.spanPa).toBeCloseTo(Math.hypot(1000, driftPa), 6);
    const u = v.uses[0]!;
    expect(u).toMatchObject({ calibrationId: 'c1', calibratedMs: T0, due: 'in-date', dueMs: T0 + MS_PER_YEAR, driftSource: 'kind-setting', foundOutOfTolerance: false });
    expect(u.limit.plusMinus).toBeCloseTo(Math.hypot(4000, 1000, driftPa), 6);
    const result = evaluateCheck(v.vessel, reading(half));
    expect(result.saturation.pressureBand.contributions.pressureGauge).toBeCloseTo(4000, 6);
    expect(result.saturation.pressureBand.contributions.pressureGaugeDrift).toBeCloseTo(Math.hypot(1000, driftPa), 6);
  });

  it('a calibration dated after the check is not used: the check keeps the band of its own time', () => {
    const later = [{ calibrationId: 'c2', timeMs: T0 + 10 * MS_PER_DAY, asFoundError: 9000 }];
    const v = vesselWithInstruments(VESSEL, { pressure: gauge(later) }, { nowMs: T0 });
    expect(v.uses[0]!.calibrationId).toBeNull();
    expect(v.uses[0]!.due).toBe('no-calibration');
  });

  it('an instrument past its due date gives a finding naming it, and the result\'s outcome takes it', () => {
    const cal = [{ calibrationId: 'c1', timeMs: T0 - 400 * MS_PER_DAY, asFoundError: 0.1, nextDueMs: T0 - 35 * MS_PER_DAY }];
    const v = vesselWithInstruments(VESSEL, { pressure: gauge(), temperature: rtd(cal) }, { nowMs: T0 });
    expect(v.findings.map((f) => [f.rule, f.signal])).toEqual([['calibration-overdue', 'CAUTION']]);
    expect(v.findings[0]!.message).toContain('TEST-AC-1 TI');
    expect(v.findings[0]!.message).toContain(new Date(T0 - 35 * MS_PER_DAY).toISOString().slice(0, 10));
    const plain = evaluateCheck(v.vessel, reading(T0));
    expect(plain.outcome).toBe('none');
    const result = withInstrumentFindings(plain, v.findings);
    expect(result.outcome).toBe('CAUTION');
    expect(result.findings.map((f) => f.rule)).toEqual(['calibration-overdue']);
    expect(result.cautions.at(-1)!.rule).toBe('standing-note');
    expect(result.cautions.filter((c) => c.rule === 'standing-note')).toHaveLength(1);
    expect(withInstrumentFindings(plain, [])).toBe(plain);
  });

  it('a kind in the wrong place and a limit beyond what a check takes are refused, naming the field', () => {
    expectInputError(() => vesselWithInstruments(VESSEL, { pressure: rtd() }, { nowMs: T0 }), 'instrument role', 'inconsistent');
    const far = [{ calibrationId: 'c1', timeMs: T0 - MS_PER_DAY, asFoundError: 60e3, asLeftError: 60e3 }];
    const e = expectInputError(() => vesselWithInstruments(VESSEL, { pressure: gauge(far) }, { nowMs: T0 }), 'instrument limit', 'out-of-range');
    expect(e.message).toContain('TEST-AC-1 PI');
    expectInputError(() => vesselWithInstruments(VESSEL, { pressure: gauge([{ calibrationId: 'x', timeMs: T0 - MS_PER_DAY, asFoundError: Number.NaN }]) }, { nowMs: T0 }), 'as-found error', 'not-a-number');
  });
});

// The scale and the barometer. Figures are invented test data; the defaults they meet are the
// kinds' settings (instrument-kind.ts): weighing system 0.1 % of span a year (common practice, our
// choice), barometer 100 Pa a year (from memory). The floor rule (the larger of class and the typed
// figure) is ours: the typed figure holds the installation's share (field-practice.md §3.4, from memory).
describe('a check\'s vessel with a register scale and barometer', () => {
  const weighed = (timeMs: number, netKg = 400): Reading => ({ ...reading(timeMs), weight: { kind: 'net', netKg } });
  const onGauge = (timeMs: number, atmospherePa?: number): Reading => ({
    ...reading(timeMs), pressure: { reference: 'gauge', pressurePa: saturationPressure(394.15) - (atmospherePa ?? 101_325) },
    ...(atmospherePa === undefined ? {} : { atmospherePa }),
  });
  const scale = (percentOfSpan: number, calibrations: FittedInstrument['calibrations'] = []): FittedInstrument => ({
    instrumentId: 'w', spec: { tag: 'TEST-AC-1 WI', kind: 'weighing-system', range: { low: 0, high: 5000 }, tolerance: { kind: 'percent-of-span', percentOfSpan } }, calibrations,
  });
  const barometer = (calibrations: FittedInstrument['calibrations'] = []): FittedInstrument => ({
    instrumentId: 'b', spec: { tag: 'TEST-SITE BARO', kind: 'barometer', range: { low: 80e3, high: 110e3 }, tolerance: { kind: 'stated', plusMinus: 50 } }, calibrations,
  });

  it('a scale whose class is below the typed figure, no calibration on record: the liquid-mass band is what the vessel gave (arithmetic)', () => {
    const before = evaluateCheck(VESSEL, weighed(T0));
    const v = vesselWithInstruments(VESSEL, { weight: scale(0.01) }, { nowMs: T0, reading: weighed(T0) });
    expect(v.vessel.instruments.weightToleranceKg).toBe(2);
    const after = evaluateCheck(v.vessel, weighed(T0));
    expect(after.inventoryBands!.liquidMassKg.plusMinus).toBeCloseTo(before.inventoryBands!.liquidMassKg.plusMinus, 9);
    expect(v.uses.map((u) => [u.role, u.tag, u.due, u.limit.class])).toEqual([['weight', 'TEST-AC-1 WI', 'no-calibration', 2]]);
  });

  it('a scale\'s class, as-found and drift since widen the liquid-mass band: √(max(class, typed)² + calibration² + drift²) (arithmetic)', () => {
    const half = T0 + MS_PER_YEAR / 2;
    const cal = [{ calibrationId: 'w1', timeMs: T0, asFoundError: 8 }];
    expect(DEFAULT_INSTRUMENT_SETTINGS['weighing-system'].driftAllowance).toEqual({ basis: 'percent-of-span', percentOfSpanPerYear: 0.1 });
    const v = vesselWithInstruments(VESSEL, { weight: scale(0.1, cal) }, { nowMs: half, reading: weighed(half) });
    // class 0.1 % of 5,000 kg = 5 kg (above the typed 2 kg); left as found, 8 kg; drift 0.1 % of 5,000 kg a year for half a year = 2.5 kg.
    const expected = Math.hypot(5, 8, 2.5);
    expect(v.vessel.instruments.weightToleranceKg).toBeCloseTo(expected, 9);
    expect(v.uses[0]).toMatchObject({ role: 'weight', calibrationId: 'w1', due: 'in-date', foundOutOfTolerance: true });
    expect(v.uses[0]!.limit.plusMinus).toBeCloseTo(expected, 9);
    const plain = evaluateCheck(VESSEL, weighed(half));
    const result = evaluateCheck(v.vessel, weighed(half));
    // The net mass limit enters linearly (first-order propagation, check/uncertainty.ts): the weight part scales with it.
    expect(result.inventoryBands!.liquidMassKg.contributions.weight / plain.inventoryBands!.liquidMassKg.contributions.weight).toBeCloseTo(expected / 2, 6);
  });

  it('a reading not weighed leaves the scale out: not used, no finding even when overdue', () => {
    const overdue = [{ calibrationId: 'w1', timeMs: T0 - 400 * MS_PER_DAY, asFoundError: 1 }];
    const v = vesselWithInstruments(VESSEL, { weight: scale(0.1, overdue) }, { nowMs: T0, reading: reading(T0) });
    expect(v.vessel).toBe(VESSEL);
    expect(v.findings).toEqual([]);
  });

  it('a scale or barometer past its due date gives a finding naming it when the check uses it', () => {
    const old = (id: string) => [{ calibrationId: id, timeMs: T0 - 400 * MS_PER_DAY, asFoundError: 1 }];
    const r = { ...onGauge(T0, 100_000), weight: { kind: 'net' as const, netKg: 400 } };
    const v = vesselWithInstruments(VESSEL, { weight: scale(0.1, old('w1')), atmosphere: barometer(old('b1')) }, { nowMs: T0, reading: r });
    expect(v.findings.map((f) => f.rule)).toEqual(['calibration-overdue', 'calibration-overdue']);
    expect(v.findings[0]!.message).toContain('TEST-AC-1 WI');
    expect(v.findings[1]!.message).toContain('TEST-SITE BARO');
    expect(v.uses.map((u) => u.role)).toEqual(['weight', 'atmosphere']);
  });

  it('a barometer widens the gauge → absolute conversion\'s band when a gauge reading uses a measured atmosphere (arithmetic; 100 Pa a year from memory)', () => {
    const year = T0 + MS_PER_YEAR;
    expect(DEFAULT_INSTRUMENT_SETTINGS.barometer.driftAllowance).toEqual({ basis: 'absolute', siUnitsPerYear: 100 });
    const cal = [{ calibrationId: 'b1', timeMs: T0, asFoundError: 120, nextDueMs: T0 + 2 * MS_PER_YEAR }];
    const r = onGauge(year, 100_000);
    const v = vesselWithInstruments(VESSEL, { atmosphere: barometer(cal) }, { nowMs: year, reading: r });
    const expected = Math.hypot(50, 120, 100);
    expect(v.vessel.instruments.barometerTolerancePa).toBeCloseTo(expected, 9);
    const result = evaluateCheck(v.vessel, r);
    expect(result.saturation.pressureBand.contributions.atmosphere).toBeCloseTo(expected, 9);
    expect(result.saturation.pressureBand.plusMinus).toBeGreaterThan(evaluateCheck(VESSEL, r).saturation.pressureBand.plusMinus);
  });

  it('an absolute reading, or a gauge reading on the site atmosphere, leaves the barometer out', () => {
    const cal = [{ calibrationId: 'b1', timeMs: T0 - MS_PER_DAY, asFoundError: 120 }];
    expect(vesselWithInstruments(VESSEL, { atmosphere: barometer(cal) }, { nowMs: T0, reading: reading(T0) }).uses).toEqual([]);
    expect(vesselWithInstruments(VESSEL, { atmosphere: barometer(cal) }, { nowMs: T0, reading: onGauge(T0) }).uses).toEqual([]);
    expect(vesselWithInstruments(VESSEL, { atmosphere: barometer(cal) }, { nowMs: T0 }).uses).toEqual([]);
  });

  it('a barometer in the scale\'s place, and a barometer limit beyond 10 kPa, are refused naming the field', () => {
    expectInputError(() => vesselWithInstruments(VESSEL, { weight: barometer() }, { nowMs: T0, reading: weighed(T0) }), 'instrument role', 'inconsistent');
    const far = [{ calibrationId: 'b1', timeMs: T0 - MS_PER_DAY, asFoundError: 20e3 }];
    const e = expectInputError(() => vesselWithInstruments(VESSEL, { atmosphere: barometer(far) }, { nowMs: T0, reading: onGauge(T0, 100_000) }), 'instrument limit', 'out-of-range');
    expect(e.message).toContain('TEST-SITE BARO');
  });
});
