// Chain verification over the stored log, a page at a time (a large log never sits in memory).
import { getDb } from './connection.ts';
import { ChainVerifier, throwIfAborted, type ChainStatus } from './integrity.ts';
import type { CheckRecord, LongWorkOptions } from './records.ts';

const PAGE = 1000;

/**
 * Verifies every device's chain in the store, walking the by-device-seq index in pages.
 * Reports per device: ok, or the first broken record and why.
 * @throws StoreError('cancelled') if options.signal aborts
 */
export async function verifyStoredChains(options: LongWorkOptions = {}): Promise<ChainStatus[]> {
  const db = await getDb();
  const total = await db.count('checks');
  const verifier = new ChainVerifier();
  let done = 0;
  let after: IDBValidKey | null = null;
  for (;;) {
    throwIfAborted(options.signal);
    const range: IDBKeyRange | undefined = after === null ? undefined : IDBKeyRange.lowerBound(after, true);
    const batch: CheckRecord[] = await db.getAllFromIndex('checks', 'by-device-seq', range, PAGE);
    if (batch.length === 0) break;
    for (const r of batch) {
      throwIfAborted(options.signal);
      await verifier.push(r);
    }
    done += batch.length;
    options.onProgress?.(done, total);
    const last: CheckRecord = batch[batch.length - 1]!;
    after = [last.deviceId, last.seq];
  }
  return verifier.results();
}
