// The database schema and its upgrade ladder. Each rung runs only IDB requests on the upgrade
// transaction (no crypto, no timers, no fetch): anything else would let the transaction commit
// half-way. Work that needs WebCrypto (hashing records migrated into the chain) is flagged here and
// finished after open by sealMigratedChecks() in db.ts.
import { unwrap, type DBSchema, type IDBPDatabase, type IDBPTransaction, type StoreNames } from 'idb';
import { canonicalJson } from './integrity.ts';
import { findingMaskOfText, keyFiguresOf, type KeyFigures } from './facts.ts';
import { addToLog, MONTH_PART_TARGET, type KindRow, type LogBlock, type MonthBucket, type MonthRow, type NewLogEntry } from './log-layout.ts';
import { isCheckRecord, type CheckRecord, type DeviceKey, type IsoDateTime, type JsonValue, type KnownDeviceKey, type LogRecord, type VesselRecord } from './records.ts';
import type { CalibrationEntry, FittingRecord, InstrumentRecord } from './instrument-records.ts';
import { idBucketFromV8, isIdBucket, type IdBucket, type V8IdBucket } from './log-ids.ts';
import { registerFromVessel } from './instrument-upgrade.ts';
import { formatIsoWithOffset } from './time.ts';

export const DB_NAME = 'tankside';
/**
 * Schema history:
 * - v1: vessels (by-tag), checks (by-vessel-time on [vesselId, time]), settings.
 * - v2: drafts store. Check times carry an offset, so the ISO string does not sort by instant
 *   ("…T22:05+01:00" is before "…T21:30Z"): every check gets `timeMs`, by-vessel-time is rebuilt
 *   on [vesselId, timeMs, id] and by-time on [timeMs, id] is added (id breaks ties for paging).
 * - v3: record integrity. Checks gain deviceId, seq, prevHash, hash, corrects, reason, the
 *   unique by-device-seq index and by-corrects. Existing checks join this device's chain in time order with empty
 *   hashes and a seal-pending flag; hashing happens after open.
 * - v4: the log in few, large values (log-layout.ts says why and how): logBlocks, logMonths
 *   (index by-month) and logIds replace the one-record-per-check `checks` store, whose records
 *   move over unchanged (as their canonical JSON text) before it is deleted.
 * - v5: the month rows' signal-word mask holds the check's findings (its outcome) instead of every
 *   caution's words; the rows are derived data, rebuilt from the stored texts; no record changes.
 * - v6: month buckets split by size: logMonthParts (key [vesselId, monthMs, startMs, startId],
 *   index by-month) replaces logMonths, each month's rows moved over in parts of at most
 *   MONTH_PART_TARGET, so a save rewrites one part instead of a whole month.
 * - v7 (KINDS_RUNG): records of other kinds than checks (record-kinds.ts) join the chain: logKinds
 *   (key [kind, vesselKey, timeMs, id], index by-kind-time) lists them per kind, vessel and time.
 *   A database from before holds none (older versions skipped them on import), so the rung only
 *   makes the store.
 * - v8 (INSTRUMENT_REGISTER_RUNG): the instrument register: instruments (by-tag), calibrations
 *   (by-instrument on [instrumentId, timeMs, id]) and fittings (by-vessel on [vesselId, fromMs, id],
 *   by-instrument). Every vessel's typed gauge and thermometer become entries fitted to it
 *   (instrument-upgrade.ts); vessel records and checks stay as they were.
 * - v9 (ID_BUCKETS_RUNG): each logIds value becomes flat arrays (log-ids.ts: the ids ascending,
 *   their devices and seqs, the corrections apart) instead of one member per id, so a pulled batch's
 *   merge, which touches every bucket, no longer re-reads and rewrites an object per stored id.
 *   The same ids, places and corrections; nothing else changes.
 * - v10 (KEY_FIGURES_RUNG): every month row gains its check's key figures (temperature, absolute
 *   pressure, quality, liquid mass; facts.ts keyFiguresOf), read from the stored texts, so the
 *   whole match sorts by them. Derived data: no record, block or hash changes.
 */
/** The rung that adds records of other kinds; one constant, so the number can move at a merge. */
export const KINDS_RUNG = 7;
/** The register's rung: one constant, so the number can move at a merge. */
export const INSTRUMENT_REGISTER_RUNG = 8;
/** The id buckets' flat arrays (log-ids.ts); one constant, so the number can move at a merge. */
export const ID_BUCKETS_RUNG = 9;
/** The rung that gives every month row its check's key figures; one constant, so the number can move at a merge. */
export const KEY_FIGURES_RUNG = 10;
export const DB_VERSION = KEY_FIGURES_RUNG;

/** Keys in the settings store that belong to the store itself; putSetting refuses them. */
export const RESERVED_SETTING_PREFIX = 'store:';
export const SETTING_DEVICE_ID = 'store:deviceId';
export const SETTING_SEAL_PENDING = 'store:sealPending';
export const SETTING_PERSISTENCE = 'store:persistence';
/** When this install's log was last exported as a backup, and last consolidated (BackupState). */
export const SETTING_LAST_BACKUP = 'store:lastBackup';
/** This install's signing key pair (records.ts DeviceKey). */
export const SETTING_SIGNING_KEY = 'store:signingKey';
/** Followed by a device id: that device's public key, learnt from a backup it signed (KnownDeviceKey). */
export const SETTING_DEVICE_KEY_PREFIX = 'store:deviceKey:';
/** Plant sync's settings (sync-log.ts SyncState): server, account, checkpoints, last outcome. */
export const SETTING_SYNC = 'store:sync';

/** A saved draft: whatever the screen wants back after a reload, with when it was saved. */
export interface DraftRecord {
  value: JsonValue;
  savedAt: IsoDateTime;
}

export interface TanksideDB extends DBSchema {
  vessels: {
    key: string;
    value: VesselRecord;
    indexes: { 'by-tag': string };
  };
  logBlocks: { key: [string, number]; value: LogBlock };
  logMonthParts: { key: [string, number, number, string]; value: MonthBucket; indexes: { 'by-month': number } };
  logIds: { key: string; value: IdBucket };
  logKinds: { key: [string, string, number, string]; value: KindRow; indexes: { 'by-kind-time': [string, number, string] } };
  settings: { key: string; value: JsonValue | DeviceKey | KnownDeviceKey };
  drafts: { key: string; value: DraftRecord };
  instruments: { key: string; value: InstrumentRecord; indexes: { 'by-tag': string } };
  calibrations: { key: string; value: CalibrationEntry; indexes: { 'by-instrument': [string, number, string] } };
  fittings: { key: string; value: FittingRecord; indexes: { 'by-vessel': [string, number, string]; 'by-instrument': string } };
}

type UpgradeTx = IDBPTransaction<TanksideDB, StoreNames<TanksideDB>[], 'versionchange'>;

/**
 * One rung of the ladder. It only issues IDB requests and calls `next` once its last request has
 * finished, so the following rung never sees half-migrated records (requests from two rungs would
 * otherwise interleave on the one upgrade transaction).
 */
type Rung = (db: IDBPDatabase<TanksideDB>, tx: UpgradeTx, next: () => void) => void;

const RUNGS: readonly { version: number; run: Rung }[] = [
  {
    version: 1,
    run(db, _tx, next) {
      const vessels = db.createObjectStore('vessels', { keyPath: 'id' });
      vessels.createIndex('by-tag', 'tagKey');
      // The checks store of v1–v3 (today's types no longer name it; v4 moves it), indexed on the raw
      // `time` string, rebuilt in v2.
      const checks = (unwrap(db) as IDBDatabase).createObjectStore('checks', { keyPath: 'id' });
      checks.createIndex('by-vessel-time', ['vesselId', 'time']);
      db.createObjectStore('settings');
      next();
    },
  },
  {
    version: 2,
    run(db, tx, next) {
      db.createObjectStore('drafts');
      const checks = legacyChecks(tx);
      checks.deleteIndex('by-vessel-time');
      checks.createIndex('by-vessel-time', ['vesselId', 'timeMs', 'id']);
      checks.createIndex('by-time', ['timeMs', 'id']);
      // Records get timeMs below; the indexes pick each one up as it is rewritten.
      walk(tx, 'checks', undefined, (record) => {
        const timeMs = Date.parse(String(record['time']));
        // Every v1 time was valid ISO 8601; a damaged one stays findable at the epoch.
        record['timeMs'] = Number.isFinite(timeMs) ? timeMs : 0;
      }, next);
    },
  },
  {
    version: 3,
    run(_db, tx, next) {
      // Plain IDB requests (idb's wrappers return promises; a cursor walk needs onsuccess).
      const raw = unwrap(tx) as IDBTransaction;
      // The device id is made here if this install never had one, so migrated checks carry it.
      const idRequest = raw.objectStore('settings').get(SETTING_DEVICE_ID);
      idRequest.onsuccess = () => {
        let deviceId = idRequest.result as unknown;
        if (typeof deviceId !== 'string') {
          deviceId = crypto.randomUUID();
          raw.objectStore('settings').put(deviceId, SETTING_DEVICE_ID);
        }
        let seq = 0;
        // Oldest first, so the migrated chain follows the order the checks were taken in.
        walk(tx, 'checks', 'by-time', (record) => {
          seq += 1;
          record['deviceId'] = deviceId;
          record['seq'] = seq;
          record['corrects'] = typeof record['corrects'] === 'string' ? record['corrects'] : null;
          record['reason'] = typeof record['reason'] === 'string' ? record['reason'] : null;
          // Empty hashes mark "not sealed yet": hashing needs WebCrypto, which cannot run here.
          record['prevHash'] = '';
          record['hash'] = '';
        }, () => {
          if (seq > 0) raw.objectStore('settings').put(true, SETTING_SEAL_PENDING);
          // Unique, so two saves racing for the same seq cannot both land.
          legacyChecks(tx).createIndex('by-device-seq', ['deviceId', 'seq'], { unique: true });
          // Sparse: null is not a key, so only corrections are in it.
          legacyChecks(tx).createIndex('by-corrects', 'corrects');
          next();
        });
      };
    },
  },
  {
    version: 4,
    run(db, tx, next) {
      db.createObjectStore('logBlocks', { keyPath: ['deviceId', 'firstSeq'] });
      // The log is moved with today's addToLog, which writes month parts (v6) with today's facts
      // (v5): the parts' store is made here, and rungs 5 and 6 find no v4 month buckets to change.
      createMonthParts(db);
      db.createObjectStore('logIds');
      const raw = unwrap(tx) as IDBTransaction;
      const bySeq = raw.objectStore('checks').index('by-device-seq');
      // Pages of the old log in device-then-seq order, each added as the next is read: only
      // IndexedDB requests are awaited, so the upgrade transaction stays active throughout.
      const move = async (): Promise<void> => {
        let range: IDBKeyRange | undefined;
        for (;;) {
          const page = await request<CheckRecord[]>(bySeq.getAll(range, MIGRATE_PAGE));
          if (page.length === 0) break;
          const entries: NewLogEntry[] = page.map((record) => ({ record, text: textOf(record) }));
          await addToLog(tx as never, entries);
          if (page.length < MIGRATE_PAGE) break;
          const last = page[page.length - 1]!;
          range = IDBKeyRange.lowerBound([last.deviceId, last.seq], true);
        }
        (unwrap(db) as IDBDatabase).deleteObjectStore('checks');
      };
      move().then(next, () => {
        // A half-moved log must not commit: abort, and the old version's data stays as it was.
        try {
          raw.abort();
        } catch {
          // Already finished.
        }
      });
    },
  },
  {
    version: 5,
    run(db, tx, next) {
      // The rows' facts are derived from the records: read every block (a page at a time, only
      // IndexedDB requests awaited), work out each check's findings mask from its stored text,
      // then rewrite the month buckets whose rows change. The blocks, and so every record and
      // hash, stay byte for byte as they were.
      const raw = unwrap(tx) as IDBTransaction;
      if (!(unwrap(db) as IDBDatabase).objectStoreNames.contains('logMonths')) {
        // Moved just now by rung 4 into month parts, with today's facts: nothing to rebuild.
        next();
        return;
      }
      rebuildRows(raw, 'logMonths', findingMaskOfText, (row, mask) => {
        if (mask === undefined || mask === row[5]) return false;
        row[5] = mask;
        return true;
      }, next);
    },
  },
  {
    version: 6,
    run(db, tx, next) {
      const raw = unwrap(tx) as IDBTransaction;
      if (!(unwrap(db) as IDBDatabase).objectStoreNames.contains('logMonths')) {
        next();
        return;
      }
      if (!(unwrap(db) as IDBDatabase).objectStoreNames.contains('logMonthParts')) createMonthParts(db);
      const old = raw.objectStore('logMonths');
      const parts = raw.objectStore('logMonthParts');
      // A page of v4 buckets at a time, each split into parts as it is read: only IndexedDB
      // requests are awaited, so the upgrade transaction stays active throughout.
      const move = async (): Promise<void> => {
        let range: IDBKeyRange | undefined;
        for (;;) {
          const page = await request<V4MonthBucket[]>(old.getAll(range, MIGRATE_MONTHS));
          if (page.length === 0) break;
          for (const bucket of page) for (const part of partsOfV4(bucket)) parts.put(part);
          if (page.length < MIGRATE_MONTHS) break;
          const last = page[page.length - 1]!;
          range = IDBKeyRange.lowerBound([last.vesselId, last.monthMs], true);
        }
        (unwrap(db) as IDBDatabase).deleteObjectStore('logMonths');
      };
      move().then(next, () => {
        try {
          raw.abort();
        } catch {
          // Already finished.
        }
      });
    },
  },
  {
    version: KINDS_RUNG,
    run(db, _tx, next) {
      db.createObjectStore('logKinds', { keyPath: ['kind', 'vesselKey', 'timeMs', 'id'] })
        .createIndex('by-kind-time', ['kind', 'timeMs', 'id']);
      next();
    },
  },
  {
    version: INSTRUMENT_REGISTER_RUNG,
    run(db, tx, next) {
      db.createObjectStore('instruments', { keyPath: 'id' }).createIndex('by-tag', 'tagKey');
      db.createObjectStore('calibrations', { keyPath: 'id' }).createIndex('by-instrument', ['instrumentId', 'timeMs', 'id']);
      const fittings = db.createObjectStore('fittings', { keyPath: 'id' });
      fittings.createIndex('by-vessel', ['vesselId', 'fromMs', 'id']);
      fittings.createIndex('by-instrument', 'instrumentId');
      const raw = unwrap(tx) as IDBTransaction;
      const now = formatIsoWithOffset(new Date(), undefined, true);
      // Vessels are few (an inventory, not a log): one cursor, each vessel's entries put as it is read.
      const cursor = raw.objectStore('vessels').openCursor();
      cursor.onsuccess = () => {
        const c = cursor.result;
        if (!c) {
          next();
          return;
        }
        const made = registerFromVessel(c.value as VesselRecord, now, () => crypto.randomUUID());
        for (const i of made.instruments) raw.objectStore('instruments').put(i);
        for (const f of made.fittings) raw.objectStore('fittings').put(f);
        c.continue();
      };
    },
  },
  {
    version: ID_BUCKETS_RUNG,
    run(_db, tx, next) {
      // 256 values at most: one cursor, each bucket rewritten as it is read. A bucket already in
      // the new shape (today's v4 rung moves an old log with today's addToLog) is left as it is.
      const raw = unwrap(tx) as IDBTransaction;
      const cursor = raw.objectStore('logIds').openCursor();
      cursor.onsuccess = () => {
        const c = cursor.result;
        if (!c) {
          next();
          return;
        }
        const value = c.value as unknown;
        if (!isIdBucket(value)) c.update(idBucketFromV8((value ?? {}) as V8IdBucket));
        c.continue();
      };
    },
  },
  {
    version: KEY_FIGURES_RUNG,
    run(_db, tx, next) {
      // As rung 5, each check's figures from its text; a row that has them (written by today's
      // addToLog in rung 4 just now) is left as it is.
      rebuildRows(unwrap(tx) as IDBTransaction, 'logMonthParts', (text) => {
        const r = JSON.parse(text) as LogRecord;
        return isCheckRecord(r) ? keyFiguresOf(r) : undefined;
      }, (row, figures) => {
        if (row.length >= MONTH_ROW_LENGTH) return false;
        row.push(...(figures ?? NO_FIGURES));
        return true;
      }, next);
    },
  },
];

/**
 * Rows rebuilt from the stored texts, on the upgrade transaction (only IndexedDB requests awaited):
 * every block a page at a time gives `derive(text)` for each record it holds; then `update` sees
 * each row of `storeName` with what its record gave (undefined: no such record) and says whether
 * it changed it; changed buckets are put back. The blocks, and so every record and hash, stay byte
 * for byte. Calls `next` when done; on a failure aborts, so the older database stays as it was.
 */
function rebuildRows<T>(
  raw: IDBTransaction, storeName: 'logMonths' | 'logMonthParts', derive: (text: string) => T | undefined,
  update: (row: MonthRow, derived: T | undefined) => boolean, next: () => void,
): void {
  const blocks = raw.objectStore('logBlocks');
  const buckets = raw.objectStore(storeName);
  const rebuild = async (): Promise<void> => {
    const derived = new Map<string, T | undefined>();
    let range: IDBKeyRange | undefined;
    for (;;) {
      const page = await request<LogBlock[]>(blocks.getAll(range, REBUILD_PAGE));
      for (const b of page) b.texts.forEach((text, i) => derived.set(`${b.deviceId}\u0000${b.seqs[i]}`, derive(text)));
      if (page.length < REBUILD_PAGE) break;
      const last = page[page.length - 1]!;
      range = IDBKeyRange.lowerBound([last.deviceId, last.firstSeq], true);
    }
    const writes: Promise<unknown>[] = [];
    for (const bucket of await request<{ rows: MonthRow[] }[]>(buckets.getAll())) {
      let changed = false;
      for (const row of bucket.rows) if (update(row, derived.get(`${row[2]}\u0000${row[3]}`))) changed = true;
      if (changed) writes.push(request(buckets.put(bucket)));
    }
    await Promise.all(writes);
  };
  rebuild().then(next, () => {
    try {
      raw.abort();
    } catch {
      // Already finished.
    }
  });
}

/** A month row's length with its key figures (log-layout.ts MonthRow). */
const MONTH_ROW_LENGTH = 11;
/** The figures of a row whose check is not stored (a hand-edited store): none. */
const NO_FIGURES: KeyFigures = [null, null, null, null];

/** A month bucket as v4 and v5 kept it: one value for the whole month. */
interface V4MonthBucket {
  vesselId: string;
  monthMs: number;
  rows: MonthRow[];
}

/** Month buckets of v5 moved per step of the v6 rung. */
const MIGRATE_MONTHS = 200;

function createMonthParts(db: IDBPDatabase<TanksideDB>): void {
  db.createObjectStore('logMonthParts', { keyPath: ['vesselId', 'monthMs', 'startMs', 'startId'] }).createIndex('by-month', 'monthMs');
}

/** A v5 month bucket as v6 parts: runs of MONTH_PART_TARGET rows (sorted again, should a hand edit have left them out of order). */
function partsOfV4(b: V4MonthBucket): MonthBucket[] {
  const rows = [...b.rows].sort((x, y) => x[0] - y[0] || (x[1] < y[1] ? -1 : x[1] > y[1] ? 1 : 0));
  const out: MonthBucket[] = [];
  for (let k = 0; k < rows.length; k += MONTH_PART_TARGET) {
    const run = rows.slice(k, k + MONTH_PART_TARGET);
    // The month's first part starts below every row of the month; each later one at its first row.
    const [startMs, startId] = k === 0 ? [b.monthMs, ''] : [run[0]![0], run[0]![1]];
    out.push({ vesselId: b.vesselId, monthMs: b.monthMs, startMs, startId, rows: run });
  }
  return out;
}

/** Blocks read per step of the v5 rung. */
const REBUILD_PAGE = 50;

/** Old checks moved per step of the v4 rung. */
const MIGRATE_PAGE = 1000;

/** The v1–v3 `checks` store, which today's types no longer name. */
function legacyChecks(tx: UpgradeTx): IDBObjectStore {
  return (unwrap(tx) as IDBTransaction).objectStore('checks');
}

/** A record's stored text: its canonical JSON, or (for a value canonical JSON refuses) plain JSON, which verification then reports. */
function textOf(record: CheckRecord): string {
  try {
    return canonicalJson(record);
  } catch {
    return JSON.stringify(record);
  }
}

function request<T>(r: IDBRequest): Promise<T> {
  return new Promise((resolve, reject) => {
    r.onsuccess = () => resolve(r.result as T);
    r.onerror = () => reject(r.error);
  });
}

/** Runs every rung above oldVersion, in order, on the upgrade transaction. */
export function upgradeSchema(db: IDBPDatabase<TanksideDB>, oldVersion: number, tx: UpgradeTx): void {
  const pending = RUNGS.filter((rung) => rung.version > oldVersion && rung.version <= DB_VERSION);
  const step = (i: number): void => {
    const rung = pending[i];
    if (rung) rung.run(db, tx, () => step(i + 1));
  };
  step(0);
}

/** Rewrites every record of a store through the upgrade transaction, then calls `done`. */
function walk(
  tx: UpgradeTx,
  storeName: 'checks',
  indexName: string | undefined,
  change: (record: Record<string, unknown>) => void,
  done: () => void,
): void {
  const store = (unwrap(tx) as IDBTransaction).objectStore(storeName);
  const request = indexName ? store.index(indexName).openCursor() : store.openCursor();
  request.onsuccess = () => {
    const cursor = request.result;
    if (!cursor) {
      done();
      return;
    }
    const record = cursor.value as Record<string, unknown>;
    change(record);
    cursor.update(record);
    cursor.continue();
  };
}
