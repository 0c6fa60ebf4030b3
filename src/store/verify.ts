// Chain verification over the stored log, a page at a time (a large log never sits in memory).
import { getDb } from './connection.ts';
import { ChainVerifier, throwIfAborted, type ChainStatus } from './integrity.ts';
import type { CheckRecord, LongWorkOptions } from './records.ts';

/** Records read per page: at most two pages (the one being hashed, the next being read) are held. */
export const VERIFY_PAGE = 1000;

/**
 * Verifies every device's chain in the store, walking the by-device-seq index in pages.
 * Each page is read in its own read-only transaction (a transaction cannot stay open across
 * WebCrypto's digests), the next one while the current one is being hashed; the hashes of a page
 * are computed concurrently (ChainVerifier.pushBatch). Reports per device: ok, or the first broken
 * record and why. Writes nothing, so a cancel leaves nothing behind.
 * @throws StoreError('cancelled') if options.signal aborts
 */
export async function verifyStoredChains(options: LongWorkOptions = {}): Promise<ChainStatus[]> {
  throwIfAborted(options.signal);
  const db = await getDb();
  const total = await db.count('checks');
  const verifier = new ChainVerifier();
  const readPage = (after: CheckRecord | null): Promise<CheckRecord[]> => {
    const range = after === null ? undefined : IDBKeyRange.lowerBound([after.deviceId, after.seq], true);
    const page = db.getAllFromIndex('checks', 'by-device-seq', range, VERIFY_PAGE);
    page.catch(() => {}); // observed below, or abandoned on cancel
    return page;
  };
  let done = 0;
  let next = readPage(null);
  for (;;) {
    const batch = await next;
    throwIfAborted(options.signal);
    if (batch.length === 0) break;
    // A full page may have a successor: start reading it now. A short page is the last one.
    next = batch.length === VERIFY_PAGE ? readPage(batch[batch.length - 1]!) : Promise.resolve([]);
    await verifier.pushBatch(batch, options.signal);
    done += batch.length;
    options.onProgress?.(done, total);
  }
  return verifier.results();
}
