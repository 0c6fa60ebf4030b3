// The instrument register in fake-indexeddb: instruments, append-only calibrations, fittings and
// swaps, and bad input refused with the field named and nothing saved changed. Tags and figures are
// invented test data.
import { describe, expect, it } from 'vitest';
import { INSTRUMENT_KINDS, type InstrumentSpec } from '../../src/core/instrument/index.ts';
import { INSTRUMENT_KIND_IDS, StoreError, addVessel, fittedAt } from '../../src/store/index.ts';
import {
  addCalibration, addInstrument, calibrationsOf, fitInstrument, fittedInstruments,
  fittingsOfInstrument, fittingsOfVessel, getInstrument, instrumentHistory, listInstruments, listRegister, retireInstrument, updateInstrument,
} from '../../src/store/transfer.ts';
import { SPEC, useFreshDatabase } from './fixtures.ts';

useFreshDatabase();

const GAUGE: InstrumentSpec = { tag: 'PI-101', kind: 'pressure-gauge', range: { low: 0, high: 1e6 }, tolerance: { kind: 'percent-of-span', percentOfSpan: 1 } };
const RTD: InstrumentSpec = { tag: 'TE-101', kind: 'rtd', range: { low: 273.15, high: 473.15 }, tolerance: { kind: 'iec-60751', sensorClass: 'A' } };
const day = (iso: string) => new Date(`${iso}T09:00:00Z`);

async function expectStoreError(p: Promise<unknown>, field: string, code = 'invalid-record') {
  const e = await p.then(() => null, (x: unknown) => x);
  expect(e).toBeInstanceOf(StoreError);
  expect((e as StoreError).code).toBe(code);
  if (code === 'invalid-record') expect((e as StoreError).field).toBe(field);
}

describe('instrument register', () => {
  it('holds the core\'s kinds, no more and no fewer', () => {
    expect([...INSTRUMENT_KIND_IDS]).toEqual([...INSTRUMENT_KINDS]);
  });

  it('adds, reads back, lists by tag, edits and retires an instrument; retired ones stay in the register', async () => {
    const g = await addInstrument({ spec: { ...GAUGE, tag: ' PI-101 ' }, displayUnit: 'kPa', description: 'test gauge' });
    await addInstrument({ spec: RTD, displayUnit: 'degC' });
    expect(g.tag).toBe('PI-101');
    expect(g.spec.tag).toBe('PI-101');
    expect(g.origin).toEqual({ kind: 'entered' });
    expect(await getInstrument(g.id)).toEqual(g);
    expect((await listInstruments()).map((i) => i.tag)).toEqual(['PI-101', 'TE-101']);
    const moved = await updateInstrument(g.id, { spec: { ...GAUGE, kind: 'pressure-transmitter', tolerance: { kind: 'percent-of-span', percentOfSpan: 0.25 } } });
    expect(moved.spec.kind).toBe('pressure-transmitter');
    await expectStoreError(updateInstrument(g.id, { spec: { ...RTD, tag: 'PI-101' } }), 'kind');
    await retireInstrument(g.id);
    expect((await listInstruments()).map((i) => i.tag)).toEqual(['TE-101']);
    expect((await listInstruments({ includeRetired: true })).map((i) => i.tag)).toEqual(['PI-101', 'TE-101']);
  });

  it('calibrations are appended, oldest first, with every field kept', async () => {
    const g = await addInstrument({ spec: GAUGE, displayUnit: 'kPa' });
    await addCalibration({ instrumentId: g.id, calibratedAt: day('2026-06-01'), asFoundError: 4200, asLeftError: 300, who: 'Test Lab', certificate: 'C-2', enteredUnit: 'kPa', nextDueAt: day('2027-06-01') });
    await addCalibration({ instrumentId: g.id, calibratedAt: day('2025-06-01'), asFoundError: -1000, who: 'Test Lab', certificate: 'C-1', enteredUnit: 'kPa' });
    const list = await calibrationsOf(g.id);
    expect(list.map((c) => c.certificate)).toEqual(['C-1', 'C-2']);
    expect(list[0]).toMatchObject({ asFoundError: -1000, asLeftError: null, nextDue: null, nextDueMs: null, timeMs: day('2025-06-01').getTime() });
    expect(list[1]).toMatchObject({ asFoundError: 4200, asLeftError: 300, nextDueMs: day('2027-06-01').getTime(), who: 'Test Lab' });
    expect((await instrumentHistory(g.id))!.calibrations).toEqual(list);
    expect((await listRegister()).map((h) => [h.instrument.tag, h.calibrations.length])).toEqual([['PI-101', 2]]);
  });

  it('a calibration or fitting at a time with milliseconds keeps them in its text, so text and ms agree (the backup and plant sync check it)', async () => {
    const vessel = await addVessel({ tag: 'V-MS', spec: SPEC });
    const g = await addInstrument({ spec: GAUGE, displayUnit: 'kPa' });
    const at = new Date(Date.parse('2026-11-30T08:15:42.137Z'));
    const c = await addCalibration({ instrumentId: g.id, calibratedAt: at, asFoundError: 100, who: 'Test lab', enteredUnit: 'kPa', nextDueAt: new Date(at.getTime() + 1000) });
    const f = await fitInstrument(vessel.id, 'pressure', g.id, { from: at });
    expect([Date.parse(c.time), Date.parse(c.nextDue!), Date.parse(f.from)]).toEqual([c.timeMs, c.nextDueMs, f.fromMs]);
    expect(c.timeMs).toBe(at.getTime());
    const whole = await addCalibration({ instrumentId: g.id, calibratedAt: day('2026-11-01'), asFoundError: 100, who: 'Test lab', enteredUnit: 'kPa' });
    expect(whole.time).not.toContain('.');
  });

  it('bad input names the field and saves nothing', async () => {
    const g = await addInstrument({ spec: GAUGE, displayUnit: 'kPa' });
    const base = { instrumentId: g.id, calibratedAt: day('2026-06-01'), asFoundError: 100, who: 'Test Lab', enteredUnit: 'kPa' };
    await expectStoreError(addCalibration({ ...base, asFoundError: 2e6 }), 'as-found error');
    await expectStoreError(addCalibration({ ...base, asFoundError: Number.NaN }), 'as-found error');
    await expectStoreError(addCalibration({ ...base, who: '  ' }), 'calibrated by');
    await expectStoreError(addCalibration({ ...base, calibratedAt: new Date('nonsense') }), 'calibration date');
    await expectStoreError(addCalibration({ ...base, nextDueAt: day('2026-05-01') }), 'next due date');
    await expectStoreError(addCalibration({ ...base, instrumentId: crypto.randomUUID() }), 'instrument id', 'not-found');
    await expectStoreError(addInstrument({ spec: { ...GAUGE, kind: 'anemometer' as never }, displayUnit: 'kPa' }), 'kind');
    await expectStoreError(addInstrument({ spec: { ...GAUGE, range: { low: 5, high: 5 } }, displayUnit: 'kPa' }), 'range');
    await expectStoreError(addInstrument({ spec: { ...GAUGE, tag: '' }, displayUnit: 'kPa' }), 'tag');
    expect(await calibrationsOf(g.id)).toEqual([]);
    expect(await listInstruments()).toEqual([g]);
  });

  it('a swap keeps both histories: the vessel lists both fittings, each instrument its own calibrations', async () => {
    const vessel = await addVessel({ tag: 'V-1', spec: SPEC });
    const a = await addInstrument({ spec: GAUGE, displayUnit: 'kPa' });
    const b = await addInstrument({ spec: { ...GAUGE, tag: 'PI-102' }, displayUnit: 'kPa' });
    const t = await addInstrument({ spec: RTD, displayUnit: 'degC' });
    await addCalibration({ instrumentId: a.id, calibratedAt: day('2026-01-10'), asFoundError: 500, who: 'Test Lab', enteredUnit: 'kPa' });
    await fitInstrument(vessel.id, 'pressure', a.id, { from: day('2026-01-15') });
    await fitInstrument(vessel.id, 'temperature', t.id, { from: day('2026-01-15') });
    await fitInstrument(vessel.id, 'pressure', b.id, { from: day('2026-08-01'), reason: 'swapped: dial damaged' });
    await addCalibration({ instrumentId: b.id, calibratedAt: day('2026-07-20'), asFoundError: -200, who: 'Test Lab', enteredUnit: 'kPa' });
    const fittings = await fittingsOfVessel(vessel.id);
    // The two fittings of one time may come in either order (entered within the same millisecond); the swap comes after them.
    expect(fittings.slice(0, 2).map((f) => [f.role, f.instrumentId]).sort()).toEqual([['pressure', a.id], ['temperature', t.id]]);
    expect([fittings[2]!.role, fittings[2]!.instrumentId]).toEqual(['pressure', b.id]);
    expect(fittedAt(fittings, day('2026-05-01').getTime()).pressure!.instrumentId).toBe(a.id);
    expect(fittedAt(fittings, day('2026-09-01').getTime()).pressure!.instrumentId).toBe(b.id);
    expect(fittedAt(fittings, day('2025-09-01').getTime())).toEqual({});
    const now = await fittedInstruments(vessel.id, day('2026-09-01').getTime());
    expect(now.pressure!.instrument.id).toBe(b.id);
    expect(now.pressure!.calibrations.map((c) => c.asFoundError)).toEqual([-200]);
    expect(now.temperature!.instrument.id).toBe(t.id);
    expect((await calibrationsOf(a.id)).map((c) => c.asFoundError)).toEqual([500]);
    expect((await fittingsOfInstrument(a.id)).map((f) => f.vesselId)).toEqual([vessel.id]);
    // Taken off: the role is empty from then on, the history stays.
    await fitInstrument(vessel.id, 'pressure', null, { from: day('2026-10-01') });
    expect((await fittedInstruments(vessel.id, day('2026-10-02').getTime())).pressure).toBeUndefined();
    expect(await fittingsOfVessel(vessel.id)).toHaveLength(4);
  });

  it('retiring an instrument takes it off the places it holds now, in the same save; its history and the vessel\'s stay', async () => {
    const vessel = await addVessel({ tag: 'V-4', spec: SPEC });
    const other = await addVessel({ tag: 'V-5', spec: SPEC });
    const g = await addInstrument({ spec: GAUGE, displayUnit: 'kPa' });
    const b = await addInstrument({ spec: { ...GAUGE, tag: 'PI-102' }, displayUnit: 'kPa' });
    await fitInstrument(other.id, 'pressure', g.id, { from: day('2026-01-01') });
    await fitInstrument(other.id, 'pressure', b.id, { from: day('2026-02-01'), reason: 'swapped' });
    await fitInstrument(vessel.id, 'pressure', g.id, { from: day('2026-03-01') });
    const retired = await retireInstrument(g.id);
    expect(retired.retired).toBe(true);
    expect((await fittedInstruments(vessel.id)).pressure).toBeUndefined();
    expect((await fittedInstruments(other.id)).pressure?.instrument.tag).toBe('PI-102');
    expect((await fittingsOfVessel(vessel.id)).map((f) => [f.instrumentId, f.reason])).toEqual([[g.id, ''], [null, 'retired']]);
    expect(await fittingsOfVessel(other.id)).toHaveLength(2);
    expect((await getInstrument(g.id))?.retired).toBe(true);
  });

  it('an instrument of the wrong kind cannot take a role; an unknown vessel is not found', async () => {
    const vessel = await addVessel({ tag: 'V-2', spec: SPEC });
    const t = await addInstrument({ spec: RTD, displayUnit: 'degC' });
    await expectStoreError(fitInstrument(vessel.id, 'pressure', t.id), 'role');
    await expectStoreError(fitInstrument(crypto.randomUUID(), 'temperature', t.id), 'vesselId', 'not-found');
    expect(await fittingsOfVessel(vessel.id)).toEqual([]);
  });

  it('a barometer takes the atmosphere place and a weighing system the weight place, neither the other\'s', async () => {
    const vessel = await addVessel({ tag: 'V-3', spec: SPEC });
    const baro = await addInstrument({ spec: { tag: 'PB-1', kind: 'barometer', range: { low: 80e3, high: 110e3 }, tolerance: { kind: 'stated', plusMinus: 50 } }, displayUnit: 'hPa' });
    const scale = await addInstrument({ spec: { tag: 'WI-1', kind: 'weighing-system', range: { low: 0, high: 5000 }, tolerance: { kind: 'percent-of-span', percentOfSpan: 0.1 } }, displayUnit: 'kg' });
    await expectStoreError(fitInstrument(vessel.id, 'weight', baro.id), 'role');
    await expectStoreError(fitInstrument(vessel.id, 'atmosphere', scale.id), 'role');
    await fitInstrument(vessel.id, 'atmosphere', baro.id);
    await fitInstrument(vessel.id, 'weight', scale.id);
    const fitted = await fittedInstruments(vessel.id);
    expect([fitted.atmosphere?.instrument.tag, fitted.weight?.instrument.tag]).toEqual(['PB-1', 'WI-1']);
  });
});

describe('a new vessel joins the register', () => {
  it('its typed gauge and thermometer become entries fitted to it, in the same save (invented test vessel)', async () => {
    const spec = {
      ...SPEC, tag: 'NEW-1', designTemperatureK: 453.15,
      instruments: { pressureGauge: { spanPa: 1e6, accuracyPercentOfSpan: 1 }, temperatureSensor: { kind: 'iec-60751', sensorClass: 'B' } },
    } as unknown as typeof SPEC;
    const v = await addVessel({ tag: 'NEW-1', spec });
    const fitted = await fittedInstruments(v.id);
    expect(fitted.pressure!.instrument.spec).toMatchObject({ tag: 'NEW-1 PI', kind: 'pressure-gauge', range: { low: 0, high: 1e6 } });
    expect(fitted.temperature!.instrument.spec).toMatchObject({ tag: 'NEW-1 TI', kind: 'rtd', tolerance: { kind: 'iec-60751', sensorClass: 'B' } });
  });
});

describe('a check records the instruments it used', () => {
  it('the vessel spec the check was evaluated with is its snapshot; without one, the stored vessel\'s', async () => {
    const { appendCheck } = await import('../../src/store/index.ts');
    const { sampleCheck } = await import('./fixtures.ts');
    const v = await addVessel({ tag: 'V-3', spec: SPEC });
    const used = { ...SPEC, instrumentsUsed: [{ role: 'pressure', instrumentId: 'i', tag: 'PI-1', kind: 'pressure-gauge', calibrationId: 'c', calibratedMs: 1, due: 'in-date', dueMs: 2, limit: { class: 1, indicator: 0, calibration: 0, drift: 0, plusMinus: 1 }, driftSource: 'kind-setting', foundOutOfTolerance: false }] } as typeof SPEC;
    const a = await appendCheck({ ...sampleCheck(v.id), vesselSpec: used });
    const b = await appendCheck(sampleCheck(v.id));
    expect(a.vessel.spec).toEqual(used);
    expect(b.vessel.spec).toEqual(SPEC);
  });
});
