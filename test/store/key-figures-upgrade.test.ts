// The key figures' rung (v8 → current): a v8 database written out by hand with raw IndexedDB, as
// v8 created it (month rows of seven facts), opened with the current code. The rows gain each
// check's key figures from its stored text; every block, and so every record and hash, stays byte
// for byte; the whole match then sorts by the figures. Test data are invented.
import 'fake-indexeddb/auto';
import { IDBFactory } from 'fake-indexeddb';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { addVessel, appendCheck, closeStore, listChecks, openStore, GENESIS_HASH } from '../../src/store/index.ts';
import { sortChecks } from '../../src/store/desk.ts';
import { exportCsv, verifyStoredChains } from '../../src/store/transfer.ts';
import { getDb } from '../../src/store/connection.ts';
import { DB_NAME, DB_VERSION, KEY_FIGURES_RUNG, SETTING_DEVICE_ID } from '../../src/store/schema.ts';
import { canonicalJson, computeCheckHash } from '../../src/store/integrity.ts';
import { keyFiguresOf } from '../../src/store/facts.ts';
import { loose, sampleCheck } from './fixtures.ts';

const VESSEL_ID = '3d5e7f90-1a2b-4c3d-8e4f-5a6b7c8d9e0f';
const DEVICE = '9e8d7c6b-5a49-4382-9716-0f1e2d3c4b5a';

beforeEach(() => {
  (globalThis as { indexedDB: IDBFactory }).indexedDB = new IDBFactory();
});
afterEach(async () => {
  await closeStore();
});

/** Schema v8 exactly as it shipped (a fresh v8 install). */
function createV8(db: IDBDatabase): void {
  db.createObjectStore('vessels', { keyPath: 'id' }).createIndex('by-tag', 'tagKey');
  db.createObjectStore('settings');
  db.createObjectStore('drafts');
  db.createObjectStore('logBlocks', { keyPath: ['deviceId', 'firstSeq'] });
  db.createObjectStore('logMonthParts', { keyPath: ['vesselId', 'monthMs', 'startMs', 'startId'] }).createIndex('by-month', 'monthMs');
  db.createObjectStore('logIds');
  db.createObjectStore('logKinds', { keyPath: ['kind', 'vesselKey', 'timeMs', 'id'] }).createIndex('by-kind-time', ['kind', 'timeMs', 'id']);
  db.createObjectStore('instruments', { keyPath: 'id' }).createIndex('by-tag', 'tagKey');
  db.createObjectStore('calibrations', { keyPath: 'id' }).createIndex('by-instrument', ['instrumentId', 'timeMs', 'id']);
  const fittings = db.createObjectStore('fittings', { keyPath: 'id' });
  fittings.createIndex('by-vessel', ['vesselId', 'fromMs', 'id']);
  fittings.createIndex('by-instrument', 'instrumentId');
}

/** 130 chained records of one device (two blocks): checks with varied figures, one of them damaged-looking (no result), and a cycle record. */
async function chain(): Promise<Record<string, unknown>[]> {
  const records: Record<string, unknown>[] = [];
  let prevHash = GENESIS_HASH;
  for (let i = 0; i < 130; i += 1) {
    const timeMs = Date.UTC(2026, i % 2 ? 4 : 5, 1) + i * 3_600_000;
    const base = {
      id: `7a8b9c0d-0000-4000-8000-${String(i).padStart(12, '0')}`, deviceId: DEVICE, seq: i + 1,
      time: new Date(timeMs).toISOString().slice(0, 19) + 'Z', timeMs, vesselId: VESSEL_ID, prevHash,
    };
    let content: Record<string, unknown>;
    if (i === 64) {
      content = { ...base, kind: 'cycle', technician: 'T', note: '', values: { invented: true }, cautions: [], appVersion: '0.1.0', formulationId: 'IAPWS-IF97 (R7-97(2012))' };
    } else {
      const { takenAt: _t, corrects: _c, reason: _r, vesselId: _v, ...rest } = sampleCheck(VESSEL_ID, {
        reading: loose.reading({ temperatureK: 380 + ((i * 29) % 60), pressure: { pressurePa: 1e5 + i * 500, reference: 'gauge' } }),
        result: loose.result(i === 9 ? {} : {
          reading: { absolutePressurePa: 2e5 + ((i * 31) % 60) * 1e3 },
          inventory: i % 4 ? { regime: 'two-phase', quality: ((i * 37) % 60) / 1000, liquidMassKg: 800 + ((i * 41) % 60) } : { regime: 'liquid-full' },
        }),
      });
      content = { ...rest, ...base, vessel: { tag: 'JV-7', spec: { volumeM3: 1 } }, corrects: null, reason: null };
    }
    const hash = await computeCheckHash(content as never);
    records.push({ ...content, hash });
    prevHash = hash;
  }
  return records;
}

function rawOpenV8(fill: (tx: IDBTransaction) => void): Promise<IDBDatabase> {
  return new Promise((resolve, reject) => {
    const request = indexedDB.open(DB_NAME, 8);
    request.onupgradeneeded = () => {
      createV8(request.result);
      fill(request.transaction!);
    };
    request.onsuccess = () => resolve(request.result);
    request.onerror = () => reject(request.error);
  });
}

describe(`the key figures' rung (v8 → ${KEY_FIGURES_RUNG})`, () => {
  it('gives every month row its check\'s figures from the stored text; blocks byte for byte; the whole match sorts by them', async () => {
    const records = await chain();
    const checks = records.filter((r) => r['kind'] === undefined);
    const blocks = [0, 100].map((first) => {
      const run = records.slice(first, first + 100);
      return { deviceId: DEVICE, firstSeq: first + 1, seqs: run.map((r) => r['seq']), texts: run.map((r) => canonicalJson(r)) };
    });
    const old = await rawOpenV8((tx) => {
      tx.objectStore('vessels').put({
        id: VESSEL_ID, tag: 'JV-7', tagKey: 'jv-7', description: 'jacketed vessel (invented)', spec: { volumeM3: 1 },
        retired: false, retiredAt: null, createdAt: '2026-04-01T08:00:00Z', updatedAt: '2026-04-01T08:00:00Z',
      });
      tx.objectStore('settings').put(DEVICE, SETTING_DEVICE_ID);
      for (const b of blocks) tx.objectStore('logBlocks').put(b);
      // v8's rows: seven facts, no figures; May and June of the one vessel.
      for (const month of [4, 5]) {
        const monthMs = Date.UTC(2026, month, 1);
        const rows = checks.filter((r) => new Date(r['timeMs'] as number).getUTCMonth() === month)
          .map((r) => [r['timeMs'], r['id'], DEVICE, r['seq'], 'consistent', 4, r['technician']])
          .sort((a, b) => (a[0] as number) - (b[0] as number));
        tx.objectStore('logMonthParts').put({ vesselId: VESSEL_ID, monthMs, startMs: monthMs, startId: '', rows });
      }
      const cycle = records[64]!;
      tx.objectStore('logKinds').put({ kind: 'cycle', vesselKey: VESSEL_ID, timeMs: cycle['timeMs'], id: cycle['id'], deviceId: DEVICE, seq: cycle['seq'] });
      const ids: Record<string, Record<string, { at: [string, number] }>> = {};
      for (const r of records) (ids[(r['id'] as string).slice(-2)] ??= {})[r['id'] as string] = { at: [DEVICE, r['seq'] as number] };
      for (const [k, bucket] of Object.entries(ids)) tx.objectStore('logIds').put(bucket, k);
    });
    old.close();
    await openStore();
    const db = await getDb();
    expect(db.version).toBe(DB_VERSION);
    expect(await db.getAll('logBlocks')).toEqual(blocks);
    const byId = new Map(checks.map((r) => [r['id'] as string, r]));
    const rows = (await db.getAll('logMonthParts')).flatMap((p) => p.rows);
    expect(rows).toHaveLength(checks.length);
    for (const row of rows) {
      const r = byId.get(row[1])!;
      // The facts v8 kept stay as they were; the figures are those of the record.
      expect(row.slice(0, 7)).toEqual([r['timeMs'], r['id'], DEVICE, r['seq'], 'consistent', 4, r['technician']]);
      expect(row.slice(7)).toEqual(keyFiguresOf(r as never));
    }
    // The check without a result keeps its temperature and has no other figure.
    expect(rows.find((row) => row[1] === checks[9]!['id'])!.slice(7)).toEqual([380 + ((9 * 29) % 60), null, null, null]);

    const newest = (a: Record<string, unknown>, b: Record<string, unknown>) => (b['timeMs'] as number) - (a['timeMs'] as number);
    const t = (r: Record<string, unknown>) => (r['reading'] as { temperatureK: number }).temperatureK;
    const byTemperature = await (await sortChecks({}, { by: 'temperature', descending: true })).page(0, 1000);
    expect(byTemperature.map((r) => r.id)).toEqual([...checks].sort((a, b) => t(b) - t(a) || newest(a, b)).map((r) => r['id']));
    expect((await listChecks({ limit: 1000 })).checks).toHaveLength(checks.length);
    expect(await verifyStoredChains()).toMatchObject([{ deviceId: DEVICE, status: 'ok', count: 130 }]);
    expect((await exportCsv()).split('\r\n').length).toBe(checks.length + 2);
  });

  it('a database with no log comes through and takes new checks with figures', async () => {
    const old = await rawOpenV8(() => {});
    old.close();
    await openStore();
    const db = await getDb();
    expect(db.version).toBe(DB_VERSION);
    expect(await db.getAll('logMonthParts')).toEqual([]);
    const vessel = await addVessel({ tag: 'JV-8', spec: loose.spec({ volumeM3: 1 }) });
    const saved = await appendCheck(sampleCheck(vessel.id));
    expect((await db.getAll('logMonthParts')).flatMap((p) => p.rows).map((r) => r.slice(7))).toEqual([keyFiguresOf(saved)]);
  });
});
