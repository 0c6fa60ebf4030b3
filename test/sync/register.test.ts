// The instrument register over plant sync, against the CouchDB stand-in: a supervisor's
// instruments, fittings and calibrations reach a technician's device; a calibration entered on the
// technician's device reaches the supervisor; an edit and a swap follow; nothing is sent twice.
// And the server's rules for the register's documents (deploy/design/tankside-plant.json): a
// technician cannot write instruments or fittings, nobody can write under another's name, replace
// a record, or smuggle a field. Tags and figures are invented test data.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fakeUuid } from '../../bench/generated-log.ts';
import { makeDevice, type Device } from './devices.ts';
import { RawSession } from './session.ts';
import { StandIn } from './stand-in.ts';
import { SPEC } from '../store/fixtures.ts';
import type { InstrumentSpec } from '../../src/core/instrument/index.ts';

const PLANT = 'tankside-plant';
const GAUGE: InstrumentSpec = { tag: 'PI-900', kind: 'pressure-gauge', range: { low: 0, high: 1e6 }, tolerance: { kind: 'percent-of-span', percentOfSpan: 1 } };
let server: StandIn;
let s: Device;
let t: Device;
let passwordT: string;

beforeAll(async () => {
  server = await StandIn.start();
  s = await makeDevice(fakeUuid(0x5e900001, 1));
  await s.enrol(server.url, server.addAccount('supervisor', s.id), 'supervisor');
  t = await makeDevice(fakeUuid(0x7e900001, 2));
  passwordT = server.addAccount('device', t.id);
  await t.enrol(server.url, passwordT);
}, 60_000);
afterAll(async () => {
  await server?.stop();
});

describe('the register over plant sync', () => {
  let vesselId: string;
  let gaugeId: string;

  it('a supervisor\'s vessel, its register entries, a new gauge swapped in and its calibration reach a technician', async () => {
    const vessel = await s.store.addVessel({ tag: 'RG-TEST-01', spec: SPEC });
    vesselId = vessel.id;
    const gauge = await s.transfer.addInstrument({ spec: GAUGE, displayUnit: 'kPa' });
    gaugeId = gauge.id;
    await s.transfer.fitInstrument(vessel.id, 'pressure', gauge.id, { reason: 'swapped' });
    await s.transfer.addCalibration({ instrumentId: gauge.id, calibratedAt: new Date(Date.now() - 86_400_000), asFoundError: 1500, asLeftError: 200, who: 'Test lab', enteredUnit: 'kPa' });
    const sent = await s.syncNow();
    expect(sent.registerPublished).toEqual({ instruments: 1, calibrations: 1, fittings: 1 });
    const got = await t.syncNow();
    expect(got.plant.applied.map((a) => a.vesselId)).toEqual([vesselId]);
    expect(got.plant.refused).toEqual([]);
    expect(got.plant.register).toEqual({ added: 3, updated: 0 });
    expect(got.plant.refused).toEqual([]);
    const fitted = await t.transfer.fittedInstruments(vesselId);
    expect(fitted.pressure?.instrument.tag).toBe('PI-900');
    expect(fitted.pressure?.calibrations.map((c) => [c.asFoundError, c.asLeftError, c.who])).toEqual([[1500, 200, 'Test lab']]);
    expect(await t.transfer.fittingsOfVessel(vesselId)).toHaveLength(1);
  });

  it('nothing is sent twice, and what was received is not sent back', async () => {
    expect((await s.syncNow()).registerPublished).toEqual({ instruments: 0, calibrations: 0, fittings: 0 });
    expect((await t.syncNow()).registerPublished).toEqual({ instruments: 0, calibrations: 0, fittings: 0 });
  });

  it('a calibration entered on the technician\'s device reaches the supervisor; the technician sends nothing else', async () => {
    await t.transfer.addCalibration({ instrumentId: gaugeId, calibratedAt: new Date(), asFoundError: -300, who: 'Test Technician', enteredUnit: 'kPa' });
    // An instrument edited on the technician's device is not sent: the plant's definitions are the supervisor's.
    await t.transfer.updateInstrument(gaugeId, { description: 'edited on a technician device' });
    expect((await t.syncNow()).registerPublished).toEqual({ instruments: 0, calibrations: 1, fittings: 0 });
    const got = await s.syncNow();
    expect(got.plant.register.added).toBe(1);
    expect((await s.transfer.calibrationsOf(gaugeId)).map((c) => c.who)).toEqual(['Test lab', 'Test Technician']);
    expect((await s.transfer.getInstrument(gaugeId))?.description).toBe('');
  });

  it('the supervisor\'s later edit and its retirement (off the vessel) follow on the technician\'s device', async () => {
    await new Promise((r) => setTimeout(r, 5)); // a later edit time than the technician's, ms resolution
    await s.transfer.updateInstrument(gaugeId, { spec: { ...GAUGE, tolerance: { kind: 'percent-of-span', percentOfSpan: 0.6 } }, description: 'class 0.6 after repair' });
    await s.transfer.retireInstrument(gaugeId);
    // Only the instrument as it stands is sent (one document for the two edits since the last sync), and the fitting that took it off.
    expect((await s.syncNow()).registerPublished).toEqual({ instruments: 1, calibrations: 0, fittings: 1 });
    const got = await t.syncNow();
    expect(got.plant.register.updated).toBe(1);
    const here = await t.transfer.getInstrument(gaugeId);
    expect([here?.retired, here?.spec.tolerance, here?.description]).toEqual([true, { kind: 'percent-of-span', percentOfSpan: 0.6 }, 'class 0.6 after repair']);
    expect((await t.transfer.fittedInstruments(vesselId)).pressure).toBeUndefined();
  });
});

describe('the server\'s rules for the register\'s documents', () => {
  let asT: RawSession;
  const id = fakeUuid(0xca1b0001, 9);
  const calibration = (author: string, patch: Record<string, unknown> = {}) => ({
    _id: `calibration:${id}`, type: 'calibration', recordId: id, revision: 0, author, text: JSON.stringify({ id, instrumentId: fakeUuid(0x1, 1) }), ...patch,
  });
  beforeAll(async () => {
    asT = new RawSession(server.url);
    expect(await asT.signIn(t.id, passwordT)).toBe(200);
  });
  const put = (doc: Record<string, unknown>) => asT.request<{ reason?: string }>('PUT', `${PLANT}/${encodeURIComponent(doc['_id'] as string)}`, doc);

  it('a technician may write a calibration under its own name, once', async () => {
    expect((await put(calibration(t.id))).status).toBe(201);
    const again = await put(calibration(t.id));
    expect(again.status).toBe(403);
    expect(again.body.reason).toBe(`register records are never replaced or deleted: calibration:${id} is stored already`);
  });

  it('a technician may not write an instrument or a fitting', async () => {
    const rid = fakeUuid(0xf1770001, 1);
    for (const type of ['instrument', 'fitting']) {
      const doc = { _id: `${type}:${rid}`, type, recordId: rid, revision: 0, author: t.id, text: JSON.stringify({ id: rid, vesselId: rid }) };
      const r = await put(doc);
      expect(r.status).toBe(403);
      expect(r.body.reason).toBe('only supervisors write instruments and fittings');
    }
  });

  it('under another\'s name, with an _id not made of its members, a field the envelope does not have, or a text for another record', async () => {
    const other = fakeUuid(0xca1b0002, 9);
    const cases: [Record<string, unknown>, string][] = [
      [{ ...calibration(s.id), _id: `calibration:${other}`, recordId: other, text: JSON.stringify({ id: other, instrumentId: 'x' }) }, `author must be this account's name (${t.id})`],
      [{ ...calibration(t.id), _id: `calibration:${other}x`, recordId: `${other}x` }, 'recordId must be a lower-case UUID'],
      [{ ...calibration(t.id), _id: `calibration:${other}`, recordId: other, note: 'smuggled' }, 'unknown field note; allowed: _id, type, recordId, revision, author, text'],
      [{ ...calibration(t.id), _id: `calibration:${other}`, recordId: other }, 'the id in text must equal recordId'],
      [{ ...calibration(t.id), _id: `calibration:${other}`, recordId: other, revision: 5, text: JSON.stringify({ id: other, instrumentId: 'x' }) }, 'revision must be 0 for a calibration'],
    ];
    for (const [doc, reason] of cases) {
      const r = await put(doc);
      expect(r.status, JSON.stringify(doc)).toBe(403);
      expect(r.body.reason).toBe(reason);
    }
  });
});
