// The long walks over the log (log-layout.ts describes the layout): a device's run of blocks, the
// next page of blocks, every row of a window, every record of the log in time order. Used only by
// the long jobs (import, verification, CSV, totals), so this module loads with them, not at start-up.
import type { IDBPDatabase } from 'idb';
import {
  BLOCK_PAGE,
  blockFor,
  compareRows,
  firstSeqsOf,
  monthOf,
  type LogBlock,
  type LogQuery,
  type LogTx,
  type MonthBucket,
  type MonthRow,
} from './log-layout.ts';
import type { CheckRecord } from './records.ts';
import type { TanksideDB } from './schema.ts';

/** The blocks of one device whose firstSeq lies in [fromSeq, toSeq], ascending. */
export async function deviceBlocks(tx: LogTx<IDBTransactionMode>, deviceId: string, fromSeq: number, toSeq: number): Promise<LogBlock[]> {
  const firstSeqs = await firstSeqsOf(tx, deviceId);
  const start = blockFor(firstSeqs, fromSeq) ?? -Infinity;
  return tx.objectStore('logBlocks').getAll(IDBKeyRange.bound([deviceId, start], [deviceId, toSeq]));
}

/** The next page of blocks after `after` (exclusive), in its own read-only transaction. */
export function blocksAfter(db: IDBPDatabase<TanksideDB>, after: LogBlock | null, count = BLOCK_PAGE): Promise<LogBlock[]> {
  const range = after === null ? undefined : IDBKeyRange.lowerBound([after.deviceId, after.firstSeq], true);
  return db.getAll('logBlocks', range, count);
}

/**
 * Every row of the listing's window (vesselId, fromMs, toMs, match), newest month first, handed
 * to `visit` with its vessel a month at a time; `onMonth` follows each month. Reads month buckets
 * only. Stops early (returns false) when `signal` aborts.
 */
export async function visitRows(
  tx: LogTx<IDBTransactionMode>,
  q: Pick<LogQuery, 'vesselId' | 'fromMs' | 'toMs' | 'match'>,
  visit: (row: MonthRow, vesselId: string) => void,
  options: { signal?: AbortSignal | undefined; onMonth?: (() => void) | undefined } = {},
): Promise<boolean> {
  if (q.fromMs > q.toMs) return true;
  const lowMonth = Number.isFinite(q.fromMs) ? monthOf(q.fromMs) : -Infinity;
  const highMonth = Number.isFinite(q.toMs) ? monthOf(q.toMs) : Infinity;
  const store = tx.objectStore('logMonths');
  const each = (buckets: MonthBucket[]) => {
    for (const b of buckets) {
      for (const r of b.rows) {
        if (r[0] < q.fromMs || r[0] > q.toMs || (q.match !== undefined && !q.match(r))) continue;
        visit(r, b.vesselId);
      }
    }
    options.onMonth?.();
  };
  if (q.vesselId !== null) {
    let cursor = await store.openCursor(IDBKeyRange.bound([q.vesselId, lowMonth], [q.vesselId, highMonth]), 'prev');
    while (cursor) {
      if (options.signal?.aborted) return false;
      each([cursor.value]);
      cursor = await cursor.continue();
    }
    return true;
  }
  const index = store.index('by-month');
  let cursor = await index.openKeyCursor(IDBKeyRange.bound(lowMonth, highMonth), 'prevunique');
  while (cursor) {
    if (options.signal?.aborted) return false;
    each(await index.getAll(cursor.key));
    cursor = await cursor.continue();
  }
  return true;
}

/**
 * Every stored record of the whole log from `fromMs` to `toMs`, oldest first by (timeMs, id), in
 * groups of a few hundred, read a month at a time: each month's rows from its buckets, then for
 * each device the run of blocks its rows of that month fall in, read in one request, and each
 * record parsed once. The months of a device's chain follow its seq order closely, so each block
 * is read about once in all.
 */
export async function* monthsOfRecords(
  tx: LogTx<IDBTransactionMode>,
  fromMs = -Infinity,
  toMs = Infinity,
): AsyncGenerator<CheckRecord[], void, undefined> {
  if (fromMs > toMs) return;
  const index = tx.objectStore('logMonths').index('by-month');
  const lowMonth = Number.isFinite(fromMs) ? monthOf(fromMs) : -Infinity;
  const highMonth = Number.isFinite(toMs) ? monthOf(toMs) : Infinity;
  const months: number[] = [];
  for (let c = await index.openKeyCursor(IDBKeyRange.bound(lowMonth, highMonth), 'nextunique'); c; c = await c.continue()) months.push(c.key);
  for (const month of months) {
    const rows: MonthRow[] = [];
    for (const b of await index.getAll(month)) for (const r of b.rows) if (r[0] >= fromMs && r[0] <= toMs) rows.push(r);
    rows.sort(compareRows);
    const span = new Map<string, [number, number]>();
    for (const r of rows) {
      const s = span.get(r[2]);
      if (!s) span.set(r[2], [r[3], r[3]]);
      else {
        if (r[3] < s[0]) s[0] = r[3];
        if (r[3] > s[1]) s[1] = r[3];
      }
    }
    const texts = new Map<string, Map<number, string>>();
    await Promise.all([...span].map(async ([deviceId, [lo, hi]]) => {
      const bySeq = new Map<number, string>();
      for (const b of await deviceBlocks(tx, deviceId, lo, hi)) b.seqs.forEach((seq, i) => bySeq.set(seq, b.texts[i]!));
      texts.set(deviceId, bySeq);
    }));
    // Parsed a few hundred at a time: records the caller has finished with die young, which costs
    // the collector far less than a month of them alive at once.
    for (let start = 0; start < rows.length; start += RECORDS_PER_YIELD) {
      const records: CheckRecord[] = [];
      for (const r of rows.slice(start, start + RECORDS_PER_YIELD)) {
        const text = texts.get(r[2])?.get(r[3]);
        if (text !== undefined) records.push(JSON.parse(text) as CheckRecord);
      }
      yield records;
    }
  }
}

/** Records handed out at a time by monthsOfRecords. */
const RECORDS_PER_YIELD = 500;
