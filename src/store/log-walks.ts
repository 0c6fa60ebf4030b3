// The long walks over the log (log-layout.ts describes the layout): a device's run of blocks, the
// next page of blocks, every row of a window. Used only by the long jobs (import, verification,
// totals), so this module loads with them, not at start-up.
import type { IDBPDatabase } from 'idb';
import { chainFieldsOfText, type ChainLink } from './integrity.ts';
import {
  BLOCK_PAGE,
  blockFor,
  firstSeqsOf,
  monthOf,
  monthPartRange,
  seqIndex,
  type LogBlock,
  type LogQuery,
  type LogTx,
  type MonthBucket,
  type MonthRow,
} from './log-layout.ts';
import type { TanksideDB } from './schema.ts';

/** The blocks of one device whose firstSeq lies in [fromSeq, toSeq], ascending. */
export async function deviceBlocks(tx: LogTx<IDBTransactionMode>, deviceId: string, fromSeq: number, toSeq: number): Promise<LogBlock[]> {
  const firstSeqs = await firstSeqsOf(tx, deviceId);
  const start = blockFor(firstSeqs, fromSeq) ?? -Infinity;
  return tx.objectStore('logBlocks').getAll(IDBKeyRange.bound([deviceId, start], [deviceId, toSeq]));
}

/**
 * One record's chain head as stored (id, seq, hash and its signature, '' for none), read from its
 * block in a read-only transaction of its own; undefined if no record has that seq.
 */
export async function storedHeadAt(db: IDBPDatabase<TanksideDB>, deviceId: string, seq: number): Promise<{ id: string; seq: number; hash: string; signature: string } | undefined> {
  const tx = db.transaction('logBlocks');
  const keys = await tx.store.getAllKeys(IDBKeyRange.bound([deviceId, -Infinity], [deviceId, seq]));
  const last = keys[keys.length - 1];
  if (!last) return undefined;
  const block = await tx.store.get(last);
  const at = block ? seqIndex(block.seqs, seq) : -1;
  if (!block || at < 0) return undefined;
  const text = block.texts[at]!;
  const link = chainFieldsOfText(text, seq)?.link ?? (JSON.parse(text) as ChainLink);
  return { id: link.id, seq, hash: link.hash, signature: block.sigs?.[at] ?? '' };
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
  const store = tx.objectStore('logMonthParts');
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
    let cursor = await store.openCursor(monthPartRange(q.vesselId, lowMonth, highMonth), 'prev');
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
