// How the check log sits in IndexedDB (schema v4, rows' facts as of v5, id buckets as of v9); this
// file and log-walks.ts are the only code that reads or writes it (log-ids.ts shapes the id buckets).
//
// Why not one IndexedDB record per check: in Chromium every stored value and every index entry
// costs about the same whatever its size, and a log of 100,000 checks made one value plus four
// index entries per check: about 180 µs of browser CPU to write each check and 33–43 µs to read
// one back, so an import of 100,000 took over 20 s and an export over 8 s. The same checks held
// 100 to a value cost about 9 µs each to write and 6 µs to read (bench/idb-layout.bench-run.ts
// prints all of these). So the log is kept in three stores of few, larger values:
//
// - logBlocks, key [deviceId, firstSeq]: each device's chain, in runs of about BLOCK_TARGET
//   checks. A block holds the seqs it has (ascending) and, for each, the record's canonical JSON
//   text (integrity.ts): the exact text that is hashed, exported and parsed back. Rule: a check
//   with seq s of device d lives in the block of d with the greatest firstSeq ≤ s. Blocks never
//   move or split, so the rule holds as long as a new block is only started below every block of
//   its device, or above every seq the device's last block holds.
// - logMonthParts, key [vesselId, monthMs, startMs, startId], index by-month: for each vessel and
//   UTC calendar month, the parts of its month bucket: runs of at most MONTH_PART_MAX rows, a row
//   per check ascending by (timeMs, id): where it is, and the facts the review filters and totals
//   need (MonthRow), so listing, paging, filtering and counting walk these small values and open a
//   block only for the rows a page shows. A row lives in the part of its month with the greatest
//   start at or below it; a month's first part starts at (monthMs, ''), below every row of the
//   month. A save rewrites one part, never a whole month: a vessel checked tens of thousands of
//   times in a month (schema v5; until v4 one value held the month) no longer makes each save
//   rewrite megabytes.
// - logIds, key: the last two hex digits of a check id: where each id is stored, and the ids of
//   the checks that correct it. A v4 UUID is random there, so 256 values share the log evenly.
//   Records of other kinds (cycles, periodic tests) are listed here too, so an id is unique
//   across every record of the log. Since schema v9 each value is a few flat arrays (log-ids.ts
//   says why: a pull's batch reads and writes every bucket).
// - logKinds (schema v7), key [kind, vesselKey, timeMs, id], index by-kind-time [kind, timeMs, id]:
//   one small row per record of another kind (KindRow), for listing a kind per vessel and time.
//   One value per record, not buckets: such records come a few a day, not thousands a month.
//   The month buckets hold checks only, so the review's totals and filters stay about checks.
//
// A write touches a handful of values, whatever number of checks it adds; it runs only IndexedDB
// requests inside its transaction, as every transaction here must.
import type { IDBPDatabase, IDBPTransaction, StoreNames } from 'idb';
import { factsOfRecord, keyFiguresOf, type StoredVerdict } from './facts.ts';
import { DuplicateId, emptyIdBucket, idEntryOf, withIds, type IdBucket, type IdEntry } from './log-ids.ts';
import { isCheckRecord, type CheckCursor, type CheckRecord, type KindRecord, type LogRecord } from './records.ts';
import type { TanksideDB } from './schema.ts';

/** Checks per block when a block is started; inserts below a device's head may pass it. */
export const BLOCK_TARGET = 100;

/** A run of one device's chain. */
export interface LogBlock {
  deviceId: string;
  firstSeq: number;
  /** Ascending; seqs[i] is the seq of texts[i]. */
  seqs: number[];
  /** canonicalJson of each full record (hash included). */
  texts: string[];
  /**
   * The signature of each record's chain head (signing.ts), '' where it has none; absent in a
   * block no signed record was ever added to (all its records unsigned).
   */
  sigs?: string[];
}

/**
 * One check in a month bucket: where it sorts and is stored, and the facts filters and totals use
 * (facts.ts): its saturation verdict (null: none), the signal words among its findings as a
 * SIGNAL_ORDER bit mask (its outcome is the most severe; 0 is outcome none; since schema v5, before
 * which it held every caution's words), and the technician.
 */
export type MonthRow = [
  timeMs: number, id: string, deviceId: string, seq: number, verdict: StoredVerdict | null, signals: number, technician: string,
  // Since schema v10 (KEY_FIGURES_RUNG), the check's key figures (facts.ts KeyFigures), so the
  // whole match sorts by them too; a row without them (a hand-edited store) sorts as having none.
  temperatureK?: number | null, absolutePressurePa?: number | null, quality?: number | null, liquidMassKg?: number | null,
];

/** The month row of a check: where it is, and the facts and key figures the review reads without opening its block. */
export function monthRowOf(r: CheckRecord): MonthRow {
  const f = factsOfRecord(r);
  return [r.timeMs, r.id, r.deviceId, r.seq, f.verdict, f.signals, f.technician, ...keyFiguresOf(r)];
}

/** A run of one vessel's checks in one UTC calendar month (a part of its month bucket). */
export interface MonthBucket {
  vesselId: string;
  /** Date.UTC of the month's first day. */
  monthMs: number;
  /** Where the part starts: no row of it sorts below (startMs, startId); the month's first part starts at (monthMs, ''). */
  startMs: number;
  startId: string;
  /** Ascending by (timeMs, id). */
  rows: MonthRow[];
}

/** Rows a month part is given when it is started (an in-order save starts a new part past it). */
export const MONTH_PART_TARGET = 500;
/** A part written with more rows than this (rows inserted below the newest) is split into parts of MONTH_PART_TARGET. */
export const MONTH_PART_MAX = 1000;

/** Every part of one vessel's months from `lowMonth` to `highMonth` (either may be infinite), inclusive. */
export function monthPartRange(vesselId: string, lowMonth: number, highMonth: number): IDBKeyRange {
  return IDBKeyRange.bound([vesselId, lowMonth], [vesselId, highMonth, Infinity]);
}

export type { IdBucket, IdEntry } from './log-ids.ts';

/**
 * Where a record of another kind is listed (logKinds): its kind, its vessel ('' for none), its
 * instant and id (the sort), and where its text is stored.
 */
export interface KindRow {
  kind: string;
  vesselKey: string;
  timeMs: number;
  id: string;
  deviceId: string;
  seq: number;
}

/** The logKinds row of a record of another kind. */
export function kindRowOf(r: KindRecord): KindRow {
  return { kind: r.kind, vesselKey: r.vesselId ?? '', timeMs: r.timeMs, id: r.id, deviceId: r.deviceId, seq: r.seq };
}

export const LOG_STORES = ['logBlocks', 'logMonthParts', 'logIds', 'logKinds'] as const;
/** Any transaction whose scope includes the log stores. */
export type LogTx<Mode extends IDBTransactionMode> = IDBPTransaction<TanksideDB, StoreNames<TanksideDB>[], Mode>;

/** Where a check is in logBlocks. */
export interface CheckRef {
  deviceId: string;
  seq: number;
}

/** A record to add, with its canonical text and (when signed) its chain-head signature. */
export interface NewLogEntry {
  record: LogRecord;
  text: string;
  signature?: string | undefined;
}

/** The month bucket of an instant. */
export function monthOf(timeMs: number): number {
  const d = new Date(Number.isFinite(timeMs) ? timeMs : 0);
  return Date.UTC(d.getUTCFullYear(), d.getUTCMonth(), 1);
}

/** The logIds key of a check id. */
export function idBucketOf(id: string): string {
  return id.slice(-2).toLowerCase();
}

/** Compares rows by (timeMs, id), as IndexedDB orders [number, string] keys. */
export function compareRows(a: MonthRow, b: MonthRow): number {
  return a[0] - b[0] || (a[1] < b[1] ? -1 : a[1] > b[1] ? 1 : 0);
}

/** Index of `seq` in ascending `seqs`, or −1. */
export function seqIndex(seqs: readonly number[], seq: number): number {
  let lo = 0;
  let hi = seqs.length - 1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    const v = seqs[mid]!;
    if (v === seq) return mid;
    if (v < seq) lo = mid + 1;
    else hi = mid - 1;
  }
  return -1;
}

/** Every block key range of one device. */
function deviceRange(deviceId: string): IDBKeyRange {
  return IDBKeyRange.bound([deviceId, -Infinity], [deviceId, Infinity]);
}

/** The firstSeq of the block that holds (or would hold) `seq`, from a device's ascending firstSeqs; undefined below them all. */
export function blockFor(firstSeqs: readonly number[], seq: number): number | undefined {
  let lo = 0;
  let hi = firstSeqs.length - 1;
  let found: number | undefined;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    if (firstSeqs[mid]! <= seq) {
      found = firstSeqs[mid];
      lo = mid + 1;
    } else hi = mid - 1;
  }
  return found;
}

export async function firstSeqsOf(tx: LogTx<IDBTransactionMode>, deviceId: string): Promise<number[]> {
  const keys = await tx.objectStore('logBlocks').getAllKeys(deviceRange(deviceId));
  return keys.map((k) => k[1]);
}

/**
 * The stored records at `refs`, in the same order (undefined where none is stored). Reads each
 * block once however many of its checks are asked for, and parses only the texts asked for.
 */
export async function readRecords(tx: LogTx<IDBTransactionMode>, refs: readonly CheckRef[]): Promise<(LogRecord | undefined)[]> {
  const seqsOf = new Map<string, Set<number>>();
  for (const r of refs) {
    let set = seqsOf.get(r.deviceId);
    if (!set) seqsOf.set(r.deviceId, (set = new Set()));
    set.add(r.seq);
  }
  const blocksOf = new Map<string, LogBlock[]>();
  await Promise.all([...seqsOf].map(async ([deviceId, seqs]) => blocksOf.set(deviceId, await blocksHolding(tx, deviceId, [...seqs]))));
  return refs.map((r) => {
    for (const block of blocksOf.get(r.deviceId)!) {
      const at = seqIndex(block.seqs, r.seq);
      if (at >= 0) return JSON.parse(block.texts[at]!) as LogRecord;
    }
    return undefined;
  });
}

/**
 * The blocks of one device that hold `seqs`. A few seqs (a review page spread over many devices
 * has one or two per device) are found with one request each, a cursor stepping back from the
 * seq to its block, which reads the block at once; more, with the device's block keys first and
 * one request per block, so no block is read twice. In Chromium a request costs about the same
 * whatever it returns, and the first page of a 50-device log asks for 50 blocks
 * (bench/review-scale.bench-run.ts; src/store/README.md).
 */
async function blocksHolding(tx: LogTx<IDBTransactionMode>, deviceId: string, seqs: readonly number[]): Promise<LogBlock[]> {
  const store = tx.objectStore('logBlocks');
  if (seqs.length <= FEW_SEQS) {
    const found = await Promise.all(seqs.map(async (seq) => (await store.openCursor(IDBKeyRange.bound([deviceId, -Infinity], [deviceId, seq]), 'prev'))?.value));
    return found.filter((b): b is LogBlock => b !== undefined);
  }
  const firstSeqs = await firstSeqsOf(tx, deviceId);
  const wanted = new Set<number>();
  for (const seq of seqs) {
    const first = blockFor(firstSeqs, seq);
    if (first !== undefined) wanted.add(first);
  }
  const found = await Promise.all([...wanted].map((first) => store.get([deviceId, first])));
  return found.filter((b): b is LogBlock => b !== undefined);
}

/** Seqs of one device that readRecords finds a request each (blocksHolding). */
const FEW_SEQS = 2;

/** Where ids are stored, from logIds (absent ids are left out). */
export async function locateIds(tx: LogTx<IDBTransactionMode>, ids: readonly string[]): Promise<Map<string, IdEntry>> {
  const buckets = [...new Set(ids.map(idBucketOf))];
  const found = await Promise.all(buckets.map((b) => tx.objectStore('logIds').get(b)));
  const byBucket = new Map(buckets.map((b, i) => [b, found[i]]));
  const out = new Map<string, IdEntry>();
  for (const id of ids) {
    const bucket = byBucket.get(idBucketOf(id));
    const entry = bucket ? idEntryOf(bucket, id) : undefined;
    if (entry) out.set(id, entry);
  }
  return out;
}

/** The last stored check of a device: its seq and hash; null when it has none. */
export async function chainHead(tx: LogTx<IDBTransactionMode>, deviceId: string): Promise<{ seq: number; hash: string } | null> {
  const cursor = await tx.objectStore('logBlocks').openCursor(deviceRange(deviceId), 'prev');
  const block = cursor?.value;
  if (!block || block.texts.length === 0) return null;
  const last = JSON.parse(block.texts[block.texts.length - 1]!) as LogRecord;
  return { seq: last.seq, hash: last.hash };
}

/** A refusal inside a write: the transaction is aborted and nothing is written. Named as IndexedDB names its own. */
export class LogConflict extends Error {
  override readonly name = 'ConstraintError';
}

/**
 * Adds records to the log inside `tx` (readwrite over the three log stores). Refuses, with
 * LogConflict, an id already stored or a seq already taken on its device: the caller aborts.
 * Issues only IndexedDB requests.
 */
export async function addToLog(
  tx: LogTx<'readwrite'>,
  entries: readonly NewLogEntry[],
  /** Called with the number of records each block write carried, as it succeeds. */
  onStored?: (records: number) => void,
): Promise<void> {
  if (entries.length === 0) return;
  const blocksStore = tx.objectStore('logBlocks');
  const monthsStore = tx.objectStore('logMonthParts');
  const idsStore = tx.objectStore('logIds');

  // Everything that will change, read at once.
  const byDevice = new Map<string, NewLogEntry[]>();
  for (const e of entries) {
    let list = byDevice.get(e.record.deviceId);
    if (!list) byDevice.set(e.record.deviceId, (list = []));
    list.push(e);
  }
  const months = new Map<string, { vesselId: string; monthMs: number; rows: MonthRow[] }>();
  const kindRows: KindRow[] = [];
  for (const { record: r } of entries) {
    if (!isCheckRecord(r)) {
      kindRows.push(kindRowOf(r));
      continue;
    }
    const monthMs = monthOf(r.timeMs);
    const key = `${monthMs}\u0000${r.vesselId}`;
    let m = months.get(key);
    if (!m) months.set(key, (m = { vesselId: r.vesselId, monthMs, rows: [] }));
    m.rows.push(monthRowOf(r));
  }
  const idKeys = new Set<string>();
  for (const { record: r } of entries) {
    idKeys.add(idBucketOf(r.id));
    if (isCheckRecord(r) && r.corrects !== null) idKeys.add(idBucketOf(r.corrects));
  }
  const [deviceState, monthBuckets, idBuckets] = await Promise.all([
    Promise.all(
      [...byDevice.keys()].map(async (deviceId) => {
        const firstSeqs = await firstSeqsOf(tx, deviceId);
        const list = byDevice.get(deviceId)!.slice().sort((a, b) => a.record.seq - b.record.seq);
        const targets = new Set<number>();
        for (const e of list) {
          const t = blockFor(firstSeqs, e.record.seq);
          if (t !== undefined) targets.add(t);
        }
        const blocks = await Promise.all([...targets].map((t) => blocksStore.get([deviceId, t])));
        return { deviceId, firstSeqs, list, blocks: new Map(blocks.filter((b) => b !== undefined).map((b) => [b.firstSeq, b])) };
      }),
    ),
    Promise.all([...months.values()].map(async (m) => {
      // The parts the new rows fall in: the one holding the lowest, and every one above it up to the highest.
      m.rows.sort(compareRows);
      const lo = m.rows[0]!;
      const hi = m.rows[m.rows.length - 1]!;
      const holder = await monthsStore.openCursor(IDBKeyRange.bound([m.vesselId, m.monthMs], [m.vesselId, m.monthMs, lo[0], lo[1]]), 'prev');
      const from = holder ? [holder.value.startMs, holder.value.startId] : [m.monthMs, ''];
      return monthsStore.getAll(IDBKeyRange.bound([m.vesselId, m.monthMs, ...from], [m.vesselId, m.monthMs, hi[0], hi[1]]));
    })),
    Promise.all([...idKeys].map(async (k) => [k, (await idsStore.get(k)) ?? emptyIdBucket()] as const)),
  ]);

  // ids: refuse one already stored; note where each new one goes and who corrects whom, each
  // bucket merged once (log-ids.ts).
  const idAdds = new Map<string, { id: string; deviceId: string; seq: number }[]>();
  const idFixes = new Map<string, [string, string][]>();
  for (const { record: r } of entries) {
    const k = idBucketOf(r.id);
    let list = idAdds.get(k);
    if (!list) idAdds.set(k, (list = []));
    list.push({ id: r.id, deviceId: r.deviceId, seq: r.seq });
    if (!isCheckRecord(r) || r.corrects === null) continue;
    const c = idBucketOf(r.corrects);
    let fixes = idFixes.get(c);
    if (!fixes) idFixes.set(c, (fixes = []));
    fixes.push([r.corrects, r.id]);
  }
  const ids = new Map<string, IdBucket>();
  for (const [k, bucket] of idBuckets) {
    try {
      ids.set(k, withIds(bucket, idAdds.get(k) ?? [], idFixes.get(k) ?? []));
    } catch (error) {
      if (error instanceof DuplicateId) throw new LogConflict(error.message);
      throw error;
    }
  }

  // blocks: each record into the block the rule gives it, or a new one.
  const changed = new Map<string, LogBlock>();
  const added = new Map<LogBlock, number>();
  const note = (block: LogBlock, key: string) => {
    changed.set(key, block);
    added.set(block, (added.get(block) ?? 0) + 1);
  };
  for (const { deviceId, firstSeqs, list, blocks } of deviceState) {
    const starts = firstSeqs.slice();
    const below: NewLogEntry[] = [];
    for (const e of list) {
      const seq = e.record.seq;
      let first = blockFor(starts, seq);
      if (first === undefined) {
        below.push(e);
        continue;
      }
      let block = blocks.get(first)!;
      const isLast = first === starts[starts.length - 1];
      const top = block.seqs[block.seqs.length - 1] ?? -Infinity;
      if (isLast && seq > top && block.seqs.length >= BLOCK_TARGET) {
        // A new head block: nothing stored on this device is at or above seq.
        block = { deviceId, firstSeq: seq, seqs: [], texts: [] };
        blocks.set(seq, block);
        starts.push(seq);
        first = seq;
      }
      insertInto(block, seq, e.text, e.signature);
      note(block, `${first}\u0000${deviceId}`);
    }
    // Below every block of the device: new blocks of BLOCK_TARGET, each starting at its lowest seq.
    for (let i = 0; i < below.length; i += BLOCK_TARGET) {
      const run = below.slice(i, i + BLOCK_TARGET);
      const block: LogBlock = { deviceId, firstSeq: run[0]!.record.seq, seqs: [], texts: [] };
      for (const e of run) {
        insertInto(block, e.record.seq, e.text, e.signature);
        note(block, `${block.firstSeq}\u0000${deviceId}`);
      }
    }
  }

  const puts: Promise<unknown>[] = [];
  for (const block of changed.values()) {
    const n = added.get(block)!;
    puts.push(blocksStore.put(block).then(() => onStored?.(n)));
  }
  [...months.values()].forEach((m, i) => {
    for (const part of placeRows(m.vesselId, m.monthMs, monthBuckets[i]!, m.rows)) puts.push(monthsStore.put(part));
  });
  for (const [key, bucket] of ids) puts.push(idsStore.put(bucket, key));
  // Only touched when there is a row to add: the v4 rung moves checks with this function before logKinds exists.
  if (kindRows.length > 0) {
    const kindsStore = tx.objectStore('logKinds');
    for (const row of kindRows) puts.push(kindsStore.add(row));
  }
  await Promise.all(puts);
}

/** Compares a row with a part's start, as IndexedDB orders [number, string] keys. */
function compareToStart(r: MonthRow, p: MonthBucket): number {
  return r[0] - p.startMs || (r[1] < p.startId ? -1 : r[1] > p.startId ? 1 : 0);
}

/**
 * Puts `rows` (ascending) into the month's `parts` (the stored parts they fall in, ascending) and
 * returns every part to write: each row to the part with the greatest start at or below it; past
 * the newest row of a part already MONTH_PART_TARGET long, a new part starting at the row (how
 * saves in time order go); a part left over MONTH_PART_MAX split into parts of MONTH_PART_TARGET.
 */
export function placeRows(vesselId: string, monthMs: number, stored: readonly MonthBucket[], rows: readonly MonthRow[]): MonthBucket[] {
  const parts = stored.length > 0 ? stored.slice() : [{ vesselId, monthMs, startMs: monthMs, startId: '', rows: [] }];
  const changed = new Set<MonthBucket>();
  let at = 0;
  for (const r of rows) {
    while (at + 1 < parts.length && compareToStart(r, parts[at + 1]!) >= 0) at += 1;
    let part = parts[at]!;
    const last = part.rows[part.rows.length - 1];
    if (last !== undefined && compareRows(r, last) > 0) {
      if (part.rows.length >= MONTH_PART_TARGET && at === parts.length - 1) {
        // Nothing loaded sorts above this row, and a stored part above it starts above it too.
        part = { vesselId, monthMs, startMs: r[0], startId: r[1], rows: [] };
        parts.push(part);
        at += 1;
      }
      part.rows.push(r);
    } else {
      let k = part.rows.length;
      while (k > 0 && compareRows(part.rows[k - 1]!, r) > 0) k -= 1;
      part.rows.splice(k, 0, r);
    }
    changed.add(part);
  }
  const out: MonthBucket[] = [];
  for (const part of changed) {
    if (part.rows.length <= MONTH_PART_MAX) {
      out.push(part);
      continue;
    }
    const all = part.rows;
    out.push({ ...part, rows: all.slice(0, MONTH_PART_TARGET) });
    for (let k = MONTH_PART_TARGET; k < all.length; k += MONTH_PART_TARGET) {
      const run = all.slice(k, k + MONTH_PART_TARGET);
      out.push({ vesselId, monthMs, startMs: run[0]![0], startId: run[0]![1], rows: run });
    }
  }
  return out;
}

/**
 * Waits for `work` (requests inside `tx`) and then for the commit. If the work fails, the
 * transaction is aborted and the more telling reason is thrown: a LogConflict as it is, otherwise
 * the transaction's own error when the browser aborted it (a quota abort fails the pending
 * requests first, with a plain AbortError).
 */
export async function settle(tx: { abort(): void; done: Promise<void> }, work: Promise<unknown>): Promise<void> {
  try {
    await work;
  } catch (error) {
    try {
      tx.abort();
    } catch {
      // Already aborted by the browser.
    }
    const reason: unknown = await tx.done.then(() => null, (e: unknown) => e);
    if (error instanceof LogConflict || reason === null || (reason as { name?: unknown }).name === 'AbortError') throw error;
    throw reason;
  }
  await tx.done;
}

function insertInto(block: LogBlock, seq: number, text: string, signature = ''): void {
  const seqs = block.seqs;
  // A block gets its signature list with its first signed record; the records before it had none.
  if (signature !== '' && !block.sigs) block.sigs = block.texts.map(() => '');
  const sigs = block.sigs;
  if (seqs.length === 0 || seq > seqs[seqs.length - 1]!) {
    seqs.push(seq);
    block.texts.push(text);
    sigs?.push(signature);
    return;
  }
  if (seqIndex(seqs, seq) >= 0) throw new LogConflict(`seq ${seq} of device ${block.deviceId} is already taken`);
  let at = seqs.length;
  while (at > 0 && seqs[at - 1]! > seq) at -= 1;
  seqs.splice(at, 0, seq);
  block.texts.splice(at, 0, text);
  sigs?.splice(at, 0, signature);
}

/** Blocks per read when walking the whole log. */
export const BLOCK_PAGE = 20;

/**
 * The whole log's blocks in key order (device, then seq), BLOCK_PAGE at a time, each page asked
 * for as the previous one arrives, all inside `tx` (one snapshot).
 */
export async function* blockPages(tx: LogTx<IDBTransactionMode>): AsyncGenerator<LogBlock[], void, undefined> {
  const store = tx.objectStore('logBlocks');
  let next = store.getAll(undefined, BLOCK_PAGE);
  for (;;) {
    const page = await next;
    if (page.length === 0) return;
    if (page.length === BLOCK_PAGE) {
      const last = page[page.length - 1]!;
      next = store.getAll(IDBKeyRange.lowerBound([last.deviceId, last.firstSeq], true), BLOCK_PAGE);
      next.catch(() => {}); // observed on the next turn, or abandoned if the consumer stops
    } else {
      next = Promise.resolve([]);
    }
    yield page;
  }
}

/** How many checks the log holds (counts rows of every month bucket; a vessel's alone when given). */
export async function countChecks(tx: LogTx<IDBTransactionMode>, vesselId?: string): Promise<number> {
  const store = tx.objectStore('logMonthParts');
  const buckets = await store.getAll(vesselId === undefined ? undefined : monthPartRange(vesselId, -Infinity, Infinity));
  let n = 0;
  for (const b of buckets) n += b.rows.length;
  return n;
}

/**
 * The newest row of each vessel's month buckets (undefined for a vessel with none): one cursor step
 * from the top of each vessel's parts, so the cost is one part per vessel, not the log.
 */
export async function latestRows(tx: LogTx<IDBTransactionMode>, vesselIds: readonly string[]): Promise<(MonthRow | undefined)[]> {
  const store = tx.objectStore('logMonthParts');
  return Promise.all(vesselIds.map(async (id) => {
    let cursor = await store.openCursor(monthPartRange(id, -Infinity, Infinity), 'prev');
    // A part is never written empty; the loop only guards a hand-edited store.
    while (cursor && cursor.value.rows.length === 0) cursor = await cursor.continue();
    const rows = cursor?.value.rows;
    return rows?.[rows.length - 1];
  }));
}

/**
 * Every row in the window that `match` passes (all when absent), each with its vessel, from one
 * snapshot of the month buckets: one vessel's parts, or every part in the months of the window.
 */
export async function matchingRows(
  tx: LogTx<IDBTransactionMode>, q: { vesselId: string | null; fromMs: number; toMs: number; match?: ((row: MonthRow) => boolean) | undefined },
): Promise<{ rows: MonthRow[]; vesselIds: string[] }> {
  const store = tx.objectStore('logMonthParts');
  const lowMonth = Number.isFinite(q.fromMs) ? monthOf(q.fromMs) : -Infinity;
  const highMonth = Number.isFinite(q.toMs) ? monthOf(q.toMs) : Infinity;
  const parts = q.vesselId !== null
    ? await store.getAll(monthPartRange(q.vesselId, lowMonth, highMonth))
    : await store.index('by-month').getAll(IDBKeyRange.bound(lowMonth, highMonth));
  const rows: MonthRow[] = [];
  const vesselIds: string[] = [];
  for (const part of parts) {
    for (const r of part.rows) {
      if (r[0] < q.fromMs || r[0] > q.toMs || (q.match !== undefined && !q.match(r))) continue;
      rows.push(r);
      vesselIds.push(part.vesselId);
    }
  }
  return { rows, vesselIds };
}

/** Which checks a listing covers. Times in ms; both ends inclusive. */
export interface LogQuery {
  vesselId: string | null;
  fromMs: number;
  toMs: number;
  /** Exclusive: the `next` of the previous page. */
  before?: CheckCursor | undefined;
  after?: CheckCursor | undefined;
  order: 'newest' | 'oldest';
  limit: number;
  /** Only rows passing this count (the facts filter); all when absent. */
  match?: ((row: MonthRow) => boolean) | undefined;
}

/**
 * The rows of one page of a listing and whether more follow. Walks month buckets from the newest
 * (or oldest) month inward, a month at a time, and stops once the page is full: a page costs the
 * months it touches, not the log.
 */
export async function pageRows(tx: LogTx<IDBTransactionMode>, q: LogQuery): Promise<{ rows: MonthRow[]; more: boolean }> {
  const newest = q.order === 'newest';
  const inWindow = (r: MonthRow): boolean => {
    if (r[0] < q.fromMs || r[0] > q.toMs) return false;
    if (q.before && !(r[0] < q.before.timeMs || (r[0] === q.before.timeMs && r[1] < q.before.id))) return false;
    if (q.after && !(r[0] > q.after.timeMs || (r[0] === q.after.timeMs && r[1] > q.after.id))) return false;
    return q.match === undefined || q.match(r);
  };
  let lowMs = q.fromMs;
  let highMs = q.toMs;
  if (q.before) highMs = Math.min(highMs, q.before.timeMs);
  if (q.after) lowMs = Math.max(lowMs, q.after.timeMs);
  if (lowMs > highMs) return { rows: [], more: false };
  const lowMonth = Number.isFinite(lowMs) ? monthOf(lowMs) : -Infinity;
  const highMonth = Number.isFinite(highMs) ? monthOf(highMs) : Infinity;
  const direction = newest ? 'prev' : 'next';
  const taken: MonthRow[] = [];
  const store = tx.objectStore('logMonthParts');
  const take = (buckets: MonthBucket[]): void => {
    const rows: MonthRow[] = [];
    for (const b of buckets) for (const r of b.rows) if (inWindow(r)) rows.push(r);
    rows.sort(compareRows);
    if (newest) rows.reverse();
    for (const r of rows) taken.push(r);
  };
  if (q.vesselId !== null) {
    let cursor = await store.openCursor(monthPartRange(q.vesselId, lowMonth, highMonth), direction);
    while (cursor && taken.length <= q.limit) {
      take([cursor.value]);
      cursor = await cursor.continue();
    }
    return { rows: taken.slice(0, q.limit), more: taken.length > q.limit || cursor !== null };
  }
  const index = store.index('by-month');
  let cursor = await index.openKeyCursor(IDBKeyRange.bound(lowMonth, highMonth), newest ? 'prevunique' : 'nextunique');
  while (cursor && taken.length <= q.limit) {
    take(await index.getAll(cursor.key));
    cursor = await cursor.continue();
  }
  return { rows: taken.slice(0, q.limit), more: taken.length > q.limit || cursor !== null };
}

