// Every rung of the upgrade ladder, opened over data that the older schema wrote. The old schemas
// are written out here by hand with raw IndexedDB, as those versions created them, so the test does
// not borrow the code under test to make its starting point.
import 'fake-indexeddb/auto';
import { IDBFactory } from 'fake-indexeddb';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { appendCheck, checksForVessel, closeStore, correctionsOf, getCheck, getSetting, getVessel, listChecks, loadDraft, openStore, saveDraft, GENESIS_HASH, type StoreEvent } from '../../src/store/index.ts';
import Papa from 'papaparse';
import { exportCsv, tallyChecks, verifyStoredChains } from '../../src/store/transfer.ts';
import { appendRecord, countStoredChecks, listRecords, outcomeOfMask, queryChecks } from '../../src/store/index.ts';
import { getDb } from '../../src/store/connection.ts';
import { listVessels } from '../../src/store/index.ts';
import { calibrationsOf, fittedInstruments, fittingsOfVessel, listInstruments } from '../../src/store/transfer.ts';
import { DB_NAME, DB_VERSION, ID_BUCKETS_RUNG, INSTRUMENT_REGISTER_RUNG, KEY_FIGURES_RUNG, SETTING_DEVICE_ID, SETTING_SEAL_PENDING } from '../../src/store/schema.ts';
import { idEntriesOf, isIdBucket } from '../../src/store/log-ids.ts';
import { canonicalJson, computeCheckHash } from '../../src/store/integrity.ts';
import { storedChecks } from './log-access.ts';
import { failWritesOverQuota, sampleCheck } from './fixtures.ts';

const VESSEL_ID = '6f0c8a52-3c1d-4e8a-9b2f-0d7e5a1c4b93';
const SPEC = { volumeM3: 1.8, tareKg: 950 };

function vesselV1() {
  return {
    id: VESSEL_ID, tag: 'CR-3', tagKey: 'cr-3', description: 'condensate receiver', spec: SPEC,
    retired: false, retiredAt: null, createdAt: '2026-11-01T08:00:00+01:00', updatedAt: '2026-11-01T08:00:00+01:00',
  };
}

/** A v1 check: no timeMs, no chain fields. Times carry different offsets on purpose. */
function checkV1(id: string, time: string) {
  const { vesselId: _v, takenAt: _t, corrects: _c, reason: _r, ...rest } = sampleCheck(VESSEL_ID);
  return { id, time, vesselId: VESSEL_ID, vessel: { tag: 'CR-3', spec: SPEC }, ...rest, note: `v1 ${time}` };
}

// Instants: 21:05Z, 21:30Z, 20:00Z. As strings the first sorts last-but-one; by instant it is second.
const V1_CHECKS = [
  checkV1('00000000-0000-4000-8000-000000000001', '2026-12-01T22:05:00+01:00'),
  checkV1('00000000-0000-4000-8000-000000000002', '2026-12-01T21:30:00Z'),
  checkV1('00000000-0000-4000-8000-000000000003', '2026-12-01T15:00:00-05:00'),
];
const NEWEST_FIRST = ['00000000-0000-4000-8000-000000000002', '00000000-0000-4000-8000-000000000001', '00000000-0000-4000-8000-000000000003'];

function rawOpen(version: number, upgrade: (db: IDBDatabase) => void): Promise<IDBDatabase> {
  return new Promise((resolve, reject) => {
    const request = indexedDB.open(DB_NAME, version);
    request.onupgradeneeded = () => {
      upgradeTxOf = () => request.transaction!;
      upgrade(request.result);
    };
    request.onsuccess = () => resolve(request.result);
    request.onerror = () => reject(request.error);
  });
}

function rawWrite(db: IDBDatabase, writes: [store: string, value: unknown, key?: IDBValidKey][]): Promise<void> {
  return new Promise((resolve, reject) => {
    const tx = db.transaction([...new Set(writes.map((w) => w[0]))], 'readwrite');
    for (const [store, value, key] of writes) tx.objectStore(store).put(value, key);
    tx.oncomplete = () => resolve();
    tx.onerror = () => reject(tx.error);
  });
}

/** Schema v1 exactly as it shipped. */
function createV1(db: IDBDatabase): void {
  db.createObjectStore('vessels', { keyPath: 'id' }).createIndex('by-tag', 'tagKey');
  db.createObjectStore('checks', { keyPath: 'id' }).createIndex('by-vessel-time', ['vesselId', 'time']);
  db.createObjectStore('settings');
}

/** Schema v2 exactly as it shipped (a fresh v2 install). */
function createV2(db: IDBDatabase): void {
  db.createObjectStore('vessels', { keyPath: 'id' }).createIndex('by-tag', 'tagKey');
  const checks = db.createObjectStore('checks', { keyPath: 'id' });
  checks.createIndex('by-vessel-time', ['vesselId', 'timeMs', 'id']);
  checks.createIndex('by-time', ['timeMs', 'id']);
  db.createObjectStore('settings');
  db.createObjectStore('drafts');
}

function describeSchema(db: IDBDatabase) {
  const tx = db.transaction([...db.objectStoreNames]);
  return Object.fromEntries(
    [...db.objectStoreNames].map((name) => {
      const store = tx.objectStore(name);
      return [name, [...store.indexNames].map((i) => `${i}:${JSON.stringify(store.index(i).keyPath)}${store.index(i).unique ? ':unique' : ''}`)];
    }),
  );
}

/** Schema v3 exactly as it shipped (a fresh v3 install). */
function createV3(db: IDBDatabase): void {
  createV2(db);
  const checks = upgradeTxOf(db).objectStore('checks');
  checks.createIndex('by-device-seq', ['deviceId', 'seq'], { unique: true });
  checks.createIndex('by-corrects', 'corrects');
}

/** The upgrade transaction a raw open is running (fake-indexeddb and browsers both expose it on the request). */
let upgradeTxOf: (db: IDBDatabase) => IDBTransaction = () => {
  throw new Error('only inside rawOpen');
};

const CURRENT_SCHEMA = {
  calibrations: ['by-instrument:["instrumentId","timeMs","id"]'],
  drafts: [],
  fittings: ['by-instrument:"instrumentId"', 'by-vessel:["vesselId","fromMs","id"]'],
  instruments: ['by-tag:"tagKey"'],
  logBlocks: [],
  logIds: [],
  logKinds: ['by-kind-time:["kind","timeMs","id"]'],
  logMonthParts: ['by-month:"monthMs"'],
  settings: [],
  vessels: ['by-tag:"tagKey"'],
};

let events: StoreEvent[] = [];
beforeEach(() => {
  (globalThis as { indexedDB: IDBFactory }).indexedDB = new IDBFactory();
  events = [];
});
afterEach(async () => {
  await closeStore();
});

async function expectMigratedV1Checks() {
  const { checks } = await listChecks();
  expect(checks.map((c) => c.id)).toEqual(NEWEST_FIRST);
  const byId = new Map(checks.map((c) => [c.id, c]));
  for (const old of V1_CHECKS) {
    const now = byId.get(old.id)!;
    // Everything v1 stored is still there, unchanged.
    expect(now).toMatchObject(old);
    expect(now.timeMs).toBe(Date.parse(old.time));
    expect(now.corrects).toBeNull();
    expect(now.reason).toBeNull();
    expect(now.hash).toBe(await computeCheckHash(now));
  }
  // One chain in the order the checks were taken: 20:00Z, 21:05Z, 21:30Z.
  const chain = [...checks].reverse();
  expect(chain.map((c) => c.seq)).toEqual([1, 2, 3]);
  expect(chain[0]!.prevHash).toBe(GENESIS_HASH);
  expect(chain[1]!.prevHash).toBe(chain[0]!.hash);
  expect(chain[2]!.prevHash).toBe(chain[1]!.hash);
  expect(new Set(chain.map((c) => c.deviceId)).size).toBe(1);
  const db = await getDb();
  expect(chain[0]!.deviceId).toBe(await db.get('settings', SETTING_DEVICE_ID));
  expect(await db.get('settings', SETTING_SEAL_PENDING)).toBeUndefined();
  expect(await verifyStoredChains()).toMatchObject([{ status: 'ok', count: 3, headSeq: 3 }]);
  // The chain carries on from the migrated head.
  const next = await appendCheck(sampleCheck(VESSEL_ID));
  expect(next).toMatchObject({ seq: 4, prevHash: chain[2]!.hash, deviceId: chain[0]!.deviceId });
}

describe('upgrade ladder', () => {
  it('a fresh install gets the whole current schema', async () => {
    await openStore();
    const db = await getDb();
    expect(db.version).toBe(DB_VERSION);
    expect(DB_VERSION).toBe(KEY_FIGURES_RUNG);
    expect(KEY_FIGURES_RUNG).toBeGreaterThan(ID_BUCKETS_RUNG);
    expect(describeSchema(db as unknown as IDBDatabase)).toEqual(CURRENT_SCHEMA);
  });

  it('v1 → current: keeps vessels, checks and settings; adds timeMs, drafts, the hash chain and the block layout', async () => {
    const old = await rawOpen(1, createV1);
    await rawWrite(old, [
      ['vessels', vesselV1()],
      ...V1_CHECKS.map((c): [string, unknown] => ['checks', c]),
      ['settings', 'R. Okafor', 'technicianName'],
    ]);
    old.close();

    await openStore({ onEvent: (e) => events.push(e) });
    const db = await getDb();
    expect(db.version).toBe(DB_VERSION);
    expect(describeSchema(db as unknown as IDBDatabase)).toEqual(CURRENT_SCHEMA);
    expect(await getVessel(VESSEL_ID)).toEqual(vesselV1());
    expect(await getSetting('technicianName')).toBe('R. Okafor');
    expect(await loadDraft('new-check')).toBeUndefined();
    await saveDraft('new-check', { temperature: '151' });
    expect((await checksForVessel(VESSEL_ID)).checks.map((c) => c.id)).toEqual(NEWEST_FIRST);
    await expectMigratedV1Checks();
    expect(events).toEqual([]);
  });

  it('v2 → current: keeps drafts and checks; chains the checks in time order', async () => {
    const old = await rawOpen(2, createV2);
    const v2Checks = V1_CHECKS.map((c) => ({ ...c, timeMs: Date.parse(c.time) }));
    await rawWrite(old, [
      ['vessels', vesselV1()],
      ...v2Checks.map((c): [string, unknown] => ['checks', c]),
      ['drafts', { value: { temperature: '15' }, savedAt: '2026-12-01T22:00:00.000+01:00' }, 'new-check'],
    ]);
    old.close();

    await openStore();
    const db = await getDb();
    expect(describeSchema(db as unknown as IDBDatabase)).toEqual(CURRENT_SCHEMA);
    expect(await loadDraft('new-check')).toEqual({ value: { temperature: '15' }, savedAt: '2026-12-01T22:00:00.000+01:00' });
    await expectMigratedV1Checks();
  });

  it('v1 with no checks: no seal pending, chain starts at seq 1', async () => {
    const old = await rawOpen(1, createV1);
    await rawWrite(old, [['vessels', vesselV1()]]);
    old.close();
    await openStore();
    const db = await getDb();
    expect(await db.get('settings', SETTING_SEAL_PENDING)).toBeUndefined();
    expect(await appendCheck(sampleCheck(VESSEL_ID))).toMatchObject({ seq: 1, prevHash: GENESIS_HASH });
  });

  it('if sealing the migrated checks fails (disk full), they stay pending and the next save seals them first', async () => {
    const old = await rawOpen(1, createV1);
    await rawWrite(old, [['vessels', vesselV1()], ...V1_CHECKS.map((c): [string, unknown] => ['checks', c])]);
    old.close();
    // The sealing write: a block whose texts all carry a hash (the v4 rung's own writes still have empty ones).
    const restore = failWritesOverQuota((value) => {
      const texts = (value as { texts?: unknown }).texts;
      return Array.isArray(texts) && texts.length > 0 && texts.every((t) => typeof t === 'string' && !t.includes(',"hash":"",'));
    });
    try {
      await openStore();
    } finally {
      restore();
    }
    const db = await getDb();
    expect(await db.get('settings', SETTING_SEAL_PENDING)).toBe(true);
    const pending = await storedChecks();
    expect(pending.map((c) => c.hash)).toEqual(['', '', '']);
    expect(await verifyStoredChains()).toMatchObject([{ status: 'broken', problem: 'unsealed', at: { seq: 1 } }]);
    const next = await appendCheck(sampleCheck(VESSEL_ID));
    expect(next.seq).toBe(4);
    expect(await db.get('settings', SETTING_SEAL_PENDING)).toBeUndefined();
    expect(await verifyStoredChains()).toMatchObject([{ status: 'ok', count: 4, headSeq: 4, headHash: next.hash }]);
  });

  it('v3 → current: every check moves to the block layout unchanged, byte for byte; lists, lookups and chains as before', async () => {
    const old = await rawOpen(3, createV3);
    const D1 = 'd1000000-0000-4000-8000-000000000001';
    const D2 = 'd2000000-0000-4000-8000-000000000002';
    // 1,050 checks of one device (past one migration step of 1,000 and many blocks), 2 of another, one a correction.
    const t0 = Date.parse('2026-10-30T23:00:00Z'); // the log crosses a month
    const v3Checks: Record<string, unknown>[] = [];
    const chainOf = async (device: string, n: number, offsetMs: number) => {
      let prevHash = GENESIS_HASH;
      for (let seq = 1; seq <= n; seq += 1) {
        const timeMs = t0 + offsetMs + seq * 60_000;
        const { vesselId: _v, takenAt: _t, corrects: _c, reason: _r, ...rest } = sampleCheck(VESSEL_ID);
        const corrects = device === D2 && seq === 2 ? v3Checks[0]!['id'] as string : null;
        const unsigned = {
          ...rest, id: `${device.slice(0, 8)}-0000-4000-8000-${String(seq).padStart(12, '0')}`, deviceId: device, seq,
          time: new Date(timeMs).toISOString().replace('.000Z', 'Z'), timeMs, vesselId: VESSEL_ID, vessel: { tag: 'CR-3', spec: SPEC },
          note: `v3 ${seq}`, corrects, reason: corrects ? 'wrong gauge' : null, prevHash,
        };
        const hash = await computeCheckHash(unsigned as never);
        v3Checks.push({ ...unsigned, hash });
        prevHash = hash;
      }
    };
    await chainOf(D1, 1050, 0);
    await chainOf(D2, 2, 30_000);
    await rawWrite(old, [
      ['vessels', vesselV1()],
      ['settings', D1, SETTING_DEVICE_ID],
      ...v3Checks.map((c): [string, unknown] => ['checks', c]),
    ]);
    old.close();

    await openStore({ onEvent: (e) => events.push(e) });
    const db = await getDb();
    expect(db.version).toBe(DB_VERSION);
    expect(describeSchema(db as unknown as IDBDatabase)).toEqual(CURRENT_SCHEMA);
    // Each record as v3 held it, and its stored text is its canonical JSON.
    const stored = await storedChecks();
    expect(stored).toHaveLength(1052);
    const byId = new Map(stored.map((c) => [c.id, c]));
    for (const c of v3Checks) expect(byId.get(c['id'] as string)).toEqual(c);
    const blocks = await db.getAll('logBlocks');
    for (const b of blocks) for (const t of b.texts) expect(t).toBe(canonicalJson(JSON.parse(t)));
    expect(await getCheck(v3Checks[500]!['id'] as string)).toEqual(v3Checks[500]);
    expect((await correctionsOf(v3Checks[0]!['id'] as string)).map((c) => c.id)).toEqual([v3Checks[1051]!['id']]);
    const newestFirst = [...v3Checks].sort((a, b) => (b['timeMs'] as number) - (a['timeMs'] as number) || ((b['id'] as string) < (a['id'] as string) ? -1 : 1));
    expect((await listChecks({ limit: 5 })).checks).toEqual(newestFirst.slice(0, 5));
    expect((await checksForVessel(VESSEL_ID, { limit: 3, order: 'oldest' })).checks).toEqual(newestFirst.slice(-3).reverse());
    expect(await verifyStoredChains()).toMatchObject([
      { deviceId: D1, status: 'ok', count: 1050, headSeq: 1050 },
      { deviceId: D2, status: 'ok', count: 2, headSeq: 2 },
    ]);
    const next = await appendCheck(sampleCheck(VESSEL_ID));
    expect(next).toMatchObject({ deviceId: D1, seq: 1051, prevHash: v3Checks[1049]!['hash'] });
    expect(events).toEqual([]);
  });

  it('v4 → v6: each month bucket is split into parts of 500 rows (the v5 rebuild of its rows on the way); listing, counts, lookups and chains as before', async () => {
    // 1,203 chained checks of one device: 1,200 on one vessel in January 2026 (one v4 month bucket
    // of 1,200 rows), 3 on another in February; blocks of 100 and id buckets as v4 wrote them.
    const D = '4a6b8c0d-1e2f-4a3b-8c4d-5e6f7a8b9c0d';
    const V2 = '7e1d2c3b-4a59-4687-9a6b-5c4d3e2f1a0b';
    const records: Record<string, unknown>[] = [];
    let prevHash = GENESIS_HASH;
    for (let i = 0; i < 1203; i += 1) {
      const jan = i < 1200;
      const timeMs = jan ? Date.UTC(2026, 0, 1) + i * 600_000 : Date.UTC(2026, 1, 3) + i * 1000;
      const time = new Date(timeMs).toISOString().slice(0, 19) + 'Z';
      const { takenAt: _t, corrects: _c, reason: _r, vesselId: _v, ...rest } = sampleCheck(VESSEL_ID);
      const content = {
        ...rest, id: `5b7c9d1e-0000-4000-8000-${String(i).padStart(12, '0')}`, deviceId: D, seq: i + 1, time, timeMs,
        vesselId: jan ? VESSEL_ID : V2, vessel: { tag: jan ? 'CR-3' : 'FT-9', spec: SPEC }, corrects: null, reason: null, prevHash,
      };
      const hash = await computeCheckHash(content as never);
      records.push({ ...content, hash });
      prevHash = hash;
    }
    const old = await rawOpen(4, (db) => {
      db.createObjectStore('vessels', { keyPath: 'id' }).createIndex('by-tag', 'tagKey');
      db.createObjectStore('settings');
      db.createObjectStore('drafts');
      db.createObjectStore('logBlocks', { keyPath: ['deviceId', 'firstSeq'] });
      db.createObjectStore('logMonths', { keyPath: ['vesselId', 'monthMs'] }).createIndex('by-month', 'monthMs');
      db.createObjectStore('logIds');
      const tx = upgradeTxOf(db);
      tx.objectStore('vessels').put(vesselV1());
      tx.objectStore('vessels').put({ ...vesselV1(), id: V2, tag: 'FT-9', tagKey: 'ft-9' });
      tx.objectStore('settings').put(D, SETTING_DEVICE_ID);
      for (let b = 0; b < records.length; b += 100) {
        const run = records.slice(b, b + 100);
        tx.objectStore('logBlocks').put({ deviceId: D, firstSeq: b + 1, seqs: run.map((r) => r['seq']), texts: run.map((r) => canonicalJson(r)) });
      }
      const rowOf = (r: Record<string, unknown>) => [r['timeMs'], r['id'], D, r['seq'], null, 0, r['technician']];
      tx.objectStore('logMonths').put({ vesselId: VESSEL_ID, monthMs: Date.UTC(2026, 0, 1), rows: records.slice(0, 1200).map(rowOf) });
      tx.objectStore('logMonths').put({ vesselId: V2, monthMs: Date.UTC(2026, 1, 1), rows: records.slice(1200).map(rowOf) });
      const ids: Record<string, Record<string, { at: [string, number] }>> = {};
      for (const r of records) (ids[(r['id'] as string).slice(-2)] ??= {})[r['id'] as string] = { at: [D, r['seq'] as number] };
      for (const [k, bucket] of Object.entries(ids)) tx.objectStore('logIds').put(bucket, k);
    });
    old.close();
    await openStore();
    const db = await getDb();
    expect(db.version).toBe(DB_VERSION);
    expect([...db.objectStoreNames]).not.toContain('logMonths');
    const parts = await db.getAll('logMonthParts');
    expect(parts.map((p) => [p.vesselId, p.rows.length])).toEqual([[VESSEL_ID, 500], [VESSEL_ID, 500], [VESSEL_ID, 200], [V2, 3]]);
    expect([parts[0]!.startMs, parts[0]!.startId]).toEqual([Date.UTC(2026, 0, 1), '']);
    expect([parts[1]!.startMs, parts[1]!.startId]).toEqual([records[500]!['timeMs'], records[500]!['id']]);
    // Every check listed once, newest first, across the parts; one vessel's too; counts and lookups.
    const seen: string[] = [];
    for (let page = await listChecks({ limit: 1000 }); ; page = await listChecks({ limit: 1000, before: page.next! })) {
      seen.push(...page.checks.map((c) => c.id));
      if (!page.next) break;
    }
    expect(seen).toEqual([...records].reverse().map((r) => r['id']));
    expect((await checksForVessel(V2)).checks.map((c) => c.seq)).toEqual([1203, 1202, 1201]);
    expect(await getCheck(records[777]!['id'] as string)).toEqual(records[777]);
    expect(await verifyStoredChains()).toMatchObject([{ deviceId: D, status: 'ok', count: 1203 }]);
    // The next save goes into the last part of its month, or a new one: never the whole month again.
    await appendCheck(sampleCheck(VESSEL_ID, { takenAt: new Date(Date.UTC(2026, 0, 30)) }));
    expect((await db.getAll('logMonthParts')).map((p) => p.rows.length)).toEqual([500, 500, 201, 3]);
  });

  it('v6 → v7: the records-of-other-kinds list is added; the v6 log stays byte for byte, and a cycle record carries its chain on', async () => {
    // Two chained checks of one device as v6 wrote them: a block, a month part, id buckets.
    const D = '4a6b8c0d-1e2f-4a3b-8c4d-5e6f7a8b9c0d';
    const records: Record<string, unknown>[] = [];
    let prevHash = GENESIS_HASH;
    for (let i = 0; i < 2; i += 1) {
      const timeMs = Date.UTC(2026, 11, 1, 8 + i);
      const { takenAt: _t, corrects: _c, reason: _r, vesselId: _v, ...rest } = sampleCheck(VESSEL_ID);
      const content = {
        ...rest, id: `6c8d0e2f-0000-4000-8000-${String(i).padStart(12, '0')}`, deviceId: D, seq: i + 1,
        time: new Date(timeMs).toISOString().slice(0, 19) + 'Z', timeMs, vesselId: VESSEL_ID, vessel: { tag: 'CR-3', spec: SPEC },
        corrects: null, reason: null, prevHash,
      };
      const hash = await computeCheckHash(content as never);
      records.push({ ...content, hash });
      prevHash = hash;
    }
    const block = { deviceId: D, firstSeq: 1, seqs: [1, 2], texts: records.map((r) => canonicalJson(r)) };
    const old = await rawOpen(6, (db) => {
      createV6(db);
      const tx = upgradeTxOf(db);
      tx.objectStore('vessels').put(vesselV1());
      tx.objectStore('settings').put(D, SETTING_DEVICE_ID);
      tx.objectStore('logBlocks').put(block);
      const monthMs = Date.UTC(2026, 11, 1);
      tx.objectStore('logMonthParts').put({
        vesselId: VESSEL_ID, monthMs, startMs: monthMs, startId: '',
        rows: records.map((r) => [r['timeMs'], r['id'], D, r['seq'], null, 0, r['technician']]),
      });
      const ids: Record<string, Record<string, { at: [string, number] }>> = {};
      for (const r of records) (ids[(r['id'] as string).slice(-2)] ??= {})[r['id'] as string] = { at: [D, r['seq'] as number] };
      for (const [k, bucket] of Object.entries(ids)) tx.objectStore('logIds').put(bucket, k);
    });
    old.close();
    await openStore({ onEvent: (e) => events.push(e) });
    const db = await getDb();
    expect(db.version).toBe(DB_VERSION);
    expect(describeSchema(db as unknown as IDBDatabase)).toEqual(CURRENT_SCHEMA);
    expect(await db.getAll('logBlocks')).toEqual([block]);
    expect((await listChecks()).checks.map((c) => c.id)).toEqual([records[1]!['id'], records[0]!['id']]);
    const cycle = await appendRecord('cycle', {
      vesselId: VESSEL_ID, technician: 'T', values: { invented: true }, cautions: [], appVersion: '0.1.0', formulationId: 'IAPWS-IF97 (R7-97(2012))',
    });
    expect(cycle).toMatchObject({ deviceId: D, seq: 3, prevHash: records[1]!['hash'] });
    expect((await listRecords({ kind: 'cycle', vesselId: VESSEL_ID })).records).toEqual([cycle]);
    expect(await countStoredChecks()).toBe(2);
    expect(await verifyStoredChains()).toMatchObject([{ deviceId: D, status: 'ok', count: 3, headSeq: 3 }]);
    expect(events).toEqual([]);
  });

  it('a current database reopens untouched', async () => {
    await openStore();
    await closeStore();
    const old = await rawOpen(DB_VERSION, () => {
      throw new Error('no upgrade expected');
    });
    old.close();
    await openStore();
    expect((await getDb()).version).toBe(DB_VERSION);
  });

  it('v4 → v5: month rows hold each check\'s findings (its outcome), rebuilt from the stored texts; every record stays byte for byte; v4 logs list, filter, export and verify', async () => {
    const old = await rawOpen(4, createV4);
    const DEVICE = 'd4000000-0000-4000-8000-000000000004';
    // Checks as release 0.1.0 saved them (its cautions and rule ids, invented readings): an agreeing
    // check whose worst word is WARNING only through standing hazards, one with air, one at MAWP.
    const standing = [
      { signal: 'WARNING', message: 'Liquid released to atmosphere flashes: 3.9 % turns to steam.', rule: 'flash-on-release' },
      { signal: 'WARNING', message: 'Cooled to 20.0 °C the vessel falls to −99.0 kPa gauge.', rule: 'vacuum-on-cooling' },
      { signal: 'CAUTION', message: 'Contents at 121.0 °C: contact scalds within seconds.', rule: 'scald' },
      { signal: 'NOTICE', message: 'Quality here is the bulk vapor mass fraction.', rule: 'bulk-quality-not-dryness' },
      { signal: 'NOTICE', message: 'Advisory figures only.', rule: 'standing-note' },
    ];
    const kinds = [
      { verdict: 'consistent', extra: [{ signal: 'NOTICE', message: 'Pressure and temperature agree within ±0.9 K.', rule: 'saturation-check-limits' }], outcome: 'none' },
      { verdict: 'pressure-above-saturation', extra: [{ signal: 'WARNING', message: 'Pressure is 40.0 kPa above saturation.', rule: 'noncondensable-gas' }], outcome: 'WARNING' },
      { verdict: 'consistent', extra: [{ signal: 'DANGER', message: 'Gauge pressure 995.0 kPa is at the MAWP.', rule: 'pressure-at-mawp' }], outcome: 'DANGER' },
    ] as const;
    const t0 = Date.parse('2026-10-31T22:00:00Z'); // crosses a month
    const records: Record<string, unknown>[] = [];
    let prevHash = GENESIS_HASH;
    for (let seq = 1; seq <= 150; seq += 1) {
      const k = kinds[seq % 3]!;
      const { vesselId: _v, takenAt: _t, corrects: _c, reason: _r, ...rest } = sampleCheck(VESSEL_ID);
      const unsigned = {
        ...rest, id: `d4000000-0000-4000-8000-${String(seq).padStart(12, '0')}`, deviceId: DEVICE, seq,
        time: new Date(t0 + seq * 600_000).toISOString().replace('.000Z', 'Z'), timeMs: t0 + seq * 600_000,
        vesselId: VESSEL_ID, vessel: { tag: 'CR-3', spec: SPEC }, note: `v4 ${seq}`, corrects: null, reason: null, prevHash,
        result: { saturation: { verdict: { verdict: k.verdict } } },
        cautions: [...k.extra, ...standing],
      };
      const hash = await computeCheckHash(unsigned as never);
      records.push({ ...unsigned, hash });
      prevHash = hash;
    }
    // The v4 layout by hand: blocks of 100, month rows with every caution's words, the id buckets.
    const texts = records.map((r) => canonicalJson(r));
    const blocks = [0, 100].map((start) => ({ deviceId: DEVICE, firstSeq: start + 1, seqs: records.slice(start, start + 100).map((r) => r['seq']), texts: texts.slice(start, start + 100) }));
    const monthOf = (ms: number) => { const d = new Date(ms); return Date.UTC(d.getUTCFullYear(), d.getUTCMonth(), 1); };
    const everyWord = (r: Record<string, unknown>) => (r['cautions'] as { signal: string; rule: string }[]).reduce((m, c) => c.rule === 'standing-note' ? m : m | (1 << ['DANGER', 'WARNING', 'CAUTION', 'NOTICE'].indexOf(c.signal)), 0);
    const months = new Map<number, unknown[][]>();
    for (const r of records) {
      const m = monthOf(r['timeMs'] as number);
      if (!months.has(m)) months.set(m, []);
      months.get(m)!.push([r['timeMs'], r['id'], DEVICE, r['seq'], (r['result'] as { saturation: { verdict: { verdict: string } } }).saturation.verdict.verdict, everyWord(r), r['technician']]);
    }
    const ids: Record<string, Record<string, { at: [string, number] }>> = {};
    for (const r of records) ((ids[(r['id'] as string).slice(-2)] ??= {})[r['id'] as string] = { at: [DEVICE, r['seq'] as number] });
    await rawWrite(old, [
      ['vessels', vesselV1()],
      ['settings', DEVICE, SETTING_DEVICE_ID],
      ...blocks.map((b): [string, unknown] => ['logBlocks', b]),
      ...[...months].map(([monthMs, rows]): [string, unknown] => ['logMonths', { vesselId: VESSEL_ID, monthMs, rows }]),
      ...Object.entries(ids).map(([key, bucket]): [string, unknown, IDBValidKey] => ['logIds', bucket, key]),
    ]);
    // Before: every row's mask says WARNING at least (flash on release), so the old totals could not tell the checks apart.
    for (const rows of months.values()) for (const row of rows) expect((row[5] as number) & 0b10).toBe(0b10);
    old.close();

    await openStore({ onEvent: (e) => events.push(e) });
    const db = await getDb();
    expect(db.version).toBe(DB_VERSION);
    expect(describeSchema(db as unknown as IDBDatabase)).toEqual(CURRENT_SCHEMA);
    // Records byte for byte: the blocks hold exactly the texts v4 held.
    expect(await db.getAll('logBlocks')).toEqual(blocks);
    // The rows now hold the findings: agreeing checks none, air WARNING, at MAWP DANGER (the word it was saved with).
    const want = new Map(records.map((r, i) => [r['id'], kinds[(i + 1) % 3]!.outcome]));
    for (const bucket of await db.getAll('logMonthParts')) {
      for (const row of bucket.rows) expect(outcomeOfMask(row[5])).toBe(want.get(row[1]));
    }
    // List, filter and count by outcome; export; verify.
    const totals = await tallyChecks();
    expect(totals?.byOutcome).toEqual({ DANGER: 50, WARNING: 50, CAUTION: 0, NOTICE: 0, none: 50 });
    const none = await queryChecks({ outcome: 'none', limit: 1000 });
    expect(none.checks).toHaveLength(50);
    for (const c of none.checks) expect(c.cautions.some((x) => x.rule === 'saturation-check-limits')).toBe(true);
    expect((await queryChecks({ outcome: 'DANGER', limit: 1000 })).checks.every((c) => c.cautions[0]!.rule === 'pressure-at-mawp')).toBe(true);
    const csv = Papa.parse<Record<string, string>>(await exportCsv(), { header: true, skipEmptyLines: true }).data;
    expect(csv).toHaveLength(150);
    const byId = new Map(csv.map((row) => [row['check id'], row]));
    for (const r of records) expect(byId.get(r['id'] as string)!['outcome (worst signal word among the findings; none when none)']).toBe(want.get(r['id']));
    expect(await verifyStoredChains()).toMatchObject([{ deviceId: DEVICE, status: 'ok', count: 150, headSeq: 150 }]);
    expect(events).toEqual([]);
  });
});

/** Schema v4 exactly as it shipped (a fresh v4 install). */
function createV4(db: IDBDatabase): void {
  db.createObjectStore('vessels', { keyPath: 'id' }).createIndex('by-tag', 'tagKey');
  db.createObjectStore('settings');
  db.createObjectStore('drafts');
  db.createObjectStore('logBlocks', { keyPath: ['deviceId', 'firstSeq'] });
  db.createObjectStore('logMonths', { keyPath: ['vesselId', 'monthMs'] }).createIndex('by-month', 'monthMs');
  db.createObjectStore('logIds');
}

/** Schema v6 exactly as it shipped (a fresh v6 install: the log in blocks and month parts). */
function createV6(db: IDBDatabase): void {
  db.createObjectStore('vessels', { keyPath: 'id' }).createIndex('by-tag', 'tagKey');
  db.createObjectStore('settings');
  db.createObjectStore('drafts');
  db.createObjectStore('logBlocks', { keyPath: ['deviceId', 'firstSeq'] });
  db.createObjectStore('logMonthParts', { keyPath: ['vesselId', 'monthMs', 'startMs', 'startId'] }).createIndex('by-month', 'monthMs');
  db.createObjectStore('logIds');
}

describe('the instrument register rung (v6 → current)', () => {
  // Invented test vessels: an RTD with an indicator and a gauge with one, a stated thermometer, and
  // a loose record of the kind very old tests stored (no instruments: it gets no entries).
  const instruments = (extra: object) => ({ weightToleranceKg: 2, volumeTolerancePercent: 2, barometerTolerancePa: 0, ...extra });
  const vessel = (id: string, tag: string, spec: object) => ({
    id, tag, tagKey: tag.toLowerCase(), description: 'test vessel', spec, retired: false, retiredAt: null,
    createdAt: '2026-03-02T08:00:00+01:00', updatedAt: '2026-03-02T08:00:00+01:00',
  });
  const A = vessel('0a0a0a0a-0000-4000-8000-00000000000a', 'ST-9', {
    tag: 'ST-9', designTemperatureK: 413.15, readingUnits: { pressure: 'bar', temperature: 'degC', mass: 'kg' },
    instruments: instruments({
      pressureGauge: { spanPa: 400e3, accuracyPercentOfSpan: 1, indicatorPercentOfSpan: 0.5, driftPercentOfSpan: 0.25 },
      temperatureSensor: { kind: 'iec-60751', sensorClass: 'A' }, temperatureIndicatorToleranceK: 0.2, temperatureDriftToleranceK: 0.1,
    }),
  });
  const B = vessel('0b0b0b0b-0000-4000-8000-00000000000b', 'CR-4', {
    tag: 'CR-4', designTemperatureK: 343.15,
    instruments: instruments({ pressureGauge: { spanPa: 600e3, accuracyPercentOfSpan: 1.6 }, temperatureSensor: { kind: 'stated', toleranceK: 1 } }),
  });
  const C = vessel('0c0c0c0c-0000-4000-8000-00000000000c', 'OLD-1', SPEC);

  it(`every vessel's typed gauge and thermometer become register entries fitted to it, nothing lost (rung ${INSTRUMENT_REGISTER_RUNG})`, async () => {
    const old = await rawOpen(6, createV6);
    await rawWrite(old, [['vessels', A], ['vessels', B], ['vessels', C], ['settings', 'kept', 'app-settings']]);
    old.close();
    await openStore();
    const db = await getDb();
    expect(db.version).toBe(DB_VERSION);
    expect(describeSchema(db as unknown as IDBDatabase)).toEqual(CURRENT_SCHEMA);
    // The vessel records are exactly as they were.
    expect(await listVessels({ includeRetired: true })).toEqual([B, C, A].sort((x, y) => x.tagKey.localeCompare(y.tagKey)));
    expect(await getSetting('app-settings')).toBe('kept');
    const tags = (await listInstruments()).map((i) => i.tag);
    expect(tags).toEqual(['CR-4 PI', 'CR-4 TI', 'ST-9 PI', 'ST-9 TI']);
    const a = await fittedInstruments(A.id);
    expect(a.pressure!.instrument).toMatchObject({
      displayUnit: 'bar',
      spec: { tag: 'ST-9 PI', kind: 'pressure-gauge', range: { low: 0, high: 400e3 }, tolerance: { kind: 'percent-of-span', percentOfSpan: 1 }, indicatorTolerance: { kind: 'percent-of-span', percentOfSpan: 0.5 } },
      origin: { kind: 'from-vessel', vesselId: A.id, vesselTag: 'ST-9' },
    });
    expect(a.temperature!.instrument).toMatchObject({
      displayUnit: 'degC',
      spec: { kind: 'rtd', range: { low: 273.15, high: 413.15 }, tolerance: { kind: 'iec-60751', sensorClass: 'A' }, indicatorTolerance: { kind: 'stated', plusMinus: 0.2 } },
    });
    expect(a.pressure!.calibrations).toEqual([]);
    const b = await fittedInstruments(B.id);
    expect(b.pressure!.instrument.displayUnit).toBe('kPa');
    expect(b.pressure!.instrument.spec.indicatorTolerance).toBeUndefined();
    // A thermometer's range reaches at least 100 °C, so its stated ± fits its span.
    expect(b.temperature!.instrument.spec).toMatchObject({ kind: 'thermometer', range: { low: 273.15, high: 373.15 }, tolerance: { kind: 'stated', plusMinus: 1 } });
    expect(await fittingsOfVessel(C.id)).toEqual([]);
    const fittings = await fittingsOfVessel(A.id);
    expect(fittings.map((f) => [f.role, f.fromMs]).sort()).toEqual([['pressure', Date.parse(A.createdAt)], ['temperature', Date.parse(A.createdAt)]]);
    expect(await calibrationsOf(a.pressure!.instrument.id)).toEqual([]);
  });

  it('a v6 log comes through the rung unchanged and takes new checks', async () => {
    const old = await rawOpen(6, createV6);
    await rawWrite(old, [['vessels', A]]);
    old.close();
    await openStore();
    const saved = await appendCheck(sampleCheck(A.id));
    expect((await listChecks()).checks.map((c) => c.id)).toEqual([saved.id]);
    expect(await verifyStoredChains()).toMatchObject([{ status: 'ok', count: 1 }]);
  });
});

/** Schema v8 exactly as it shipped (a fresh v8 install: v6, the kinds' list, the register). */
function createV8(db: IDBDatabase): void {
  createV6(db);
  db.createObjectStore('logKinds', { keyPath: ['kind', 'vesselKey', 'timeMs', 'id'] }).createIndex('by-kind-time', ['kind', 'timeMs', 'id']);
  db.createObjectStore('instruments', { keyPath: 'id' }).createIndex('by-tag', 'tagKey');
  db.createObjectStore('calibrations', { keyPath: 'id' }).createIndex('by-instrument', ['instrumentId', 'timeMs', 'id']);
  const fittings = db.createObjectStore('fittings', { keyPath: 'id' });
  fittings.createIndex('by-vessel', ['vesselId', 'fromMs', 'id']);
  fittings.createIndex('by-instrument', 'instrumentId');
}

describe(`the id buckets' rung (v8 → current, rung ${ID_BUCKETS_RUNG})`, () => {
  it('every id keeps its place and its corrections; lookups, corrections, chains and new saves as before', async () => {
    const DEVICE = 'd8000000-0000-4000-8000-00000000d8d8';
    const MISSING = 'd8000000-0000-4000-8000-0000000000ff'; // corrected by seq 3, never stored here
    const t0 = Date.UTC(2026, 10, 2, 8);
    const records: Record<string, unknown>[] = [];
    let prevHash = GENESIS_HASH;
    // 300 checks over three blocks; seq 2 corrects seq 1, seq 3 corrects a check not stored here.
    for (let seq = 1; seq <= 300; seq += 1) {
      const { vesselId: _v, takenAt: _t, corrects: _c, reason: _r, ...rest } = sampleCheck(VESSEL_ID);
      const corrects = seq === 2 ? records[0]!['id'] : seq === 3 ? MISSING : null;
      const unsigned = {
        ...rest, id: `d8000000-0000-4000-8000-${String(seq).padStart(12, '0')}`, deviceId: DEVICE, seq,
        time: new Date(t0 + seq * 60_000).toISOString().replace('.000Z', 'Z'), timeMs: t0 + seq * 60_000,
        vesselId: VESSEL_ID, vessel: { tag: 'CR-3', spec: SPEC }, note: `v8 ${seq}`, corrects, reason: corrects === null ? null : 'typed the wrong gauge', prevHash,
      };
      const hash = await computeCheckHash(unsigned as never);
      records.push({ ...unsigned, hash });
      prevHash = hash;
    }
    const texts = records.map((r) => canonicalJson(r));
    const blocks = [0, 100, 200].map((start) => ({ deviceId: DEVICE, firstSeq: start + 1, seqs: records.slice(start, start + 100).map((r) => r['seq']), texts: texts.slice(start, start + 100) }));
    const rows = records.map((r) => [r['timeMs'], r['id'], DEVICE, r['seq'], null, 0b1000, r['technician']]);
    // The v8 id buckets: one member per id, { at, by }.
    const ids: Record<string, Record<string, { at?: [string, number]; by?: string[] }>> = {};
    for (const r of records) ((ids[(r['id'] as string).slice(-2)] ??= {})[r['id'] as string] = { at: [DEVICE, r['seq'] as number] });
    ids[(records[0]!['id'] as string).slice(-2)]![records[0]!['id'] as string]!.by = [records[1]!['id'] as string];
    (ids['ff'] ??= {})[MISSING] = { by: [records[2]!['id'] as string] };
    const old = await rawOpen(8, createV8);
    await rawWrite(old, [
      ['vessels', vesselV1()],
      ['settings', DEVICE, SETTING_DEVICE_ID],
      ...blocks.map((b): [string, unknown] => ['logBlocks', b]),
      ['logMonthParts', { vesselId: VESSEL_ID, monthMs: Date.UTC(2026, 10, 1), startMs: Date.UTC(2026, 10, 1), startId: '', rows }],
      ...Object.entries(ids).map(([key, bucket]): [string, unknown, IDBValidKey] => ['logIds', bucket, key]),
    ]);
    old.close();

    await openStore({ onEvent: (e) => events.push(e) });
    const db = await getDb();
    expect(db.version).toBe(DB_VERSION);
    expect(describeSchema(db as unknown as IDBDatabase)).toEqual(CURRENT_SCHEMA);
    // The same keys, each value in the new shape saying exactly what the old one said.
    expect((await db.getAllKeys('logIds')).sort()).toEqual(Object.keys(ids).sort());
    for (const [key, bucket] of Object.entries(ids)) {
      const now = await db.get('logIds', key);
      expect(isIdBucket(now)).toBe(true);
      expect(idEntriesOf(now!)).toEqual(new Map(Object.entries(bucket)));
    }
    // Blocks and rows untouched; lookups and corrections as before.
    expect(await db.getAll('logBlocks')).toEqual(blocks);
    for (const r of [records[0]!, records[150]!, records[299]!]) expect(canonicalJson((await getCheck(r['id'] as string))!)).toBe(canonicalJson(r));
    expect((await correctionsOf(records[0]!['id'] as string)).map((c) => c.id)).toEqual([records[1]!['id']]);
    expect((await correctionsOf(MISSING)).map((c) => c.id)).toEqual([records[2]!['id']]);
    expect(await verifyStoredChains()).toMatchObject([{ deviceId: DEVICE, status: 'ok', count: 300, headSeq: 300 }]);
    // The chain carries on, and the new check is found through the new buckets.
    const next = await appendCheck(sampleCheck(VESSEL_ID, { corrects: records[0]!['id'] as string, reason: 'second look' }));
    expect(next).toMatchObject({ seq: 301, prevHash: records[299]!['hash'] });
    expect((await getCheck(next.id))?.id).toBe(next.id);
    expect((await correctionsOf(records[0]!['id'] as string)).map((c) => c.id)).toEqual([records[1]!['id'], next.id]);
    expect(await countStoredChecks()).toBe(301);
    expect(events).toEqual([]);
  });
});
