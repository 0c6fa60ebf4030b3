// Chain verification over the stored log, a page of blocks at a time (a large log never sits in
// memory), then each device's signatures (signatures.ts). Where workers can be made, the devices
// are shared between two log workers that read the blocks themselves (log-worker.ts);
// otherwise (Node, a refused worker) this thread reads and a hashing worker, or this thread, hashes.
import type { IDBPDatabase } from 'idb';
import { getDb } from './connection.ts';
import { readPublicKeys } from './device-keys.ts';
import { hashTextsAside } from './hash-texts.ts';
import { ChainVerifier, throwIfAborted, type ChainStatus } from './integrity.ts';
import { countChecks, LOG_STORES, type LogBlock } from './log-layout.ts';
import { blocksAfter, storedHeadAt } from './log-walks.ts';
import type { LongWorkOptions } from './records.ts';
import type { TanksideDB } from './schema.ts';
import { signatureCoverage, verifyingKey, type SignatureStatus, type VerifyingKey } from './signatures.ts';
import { judgePage, preparePage, type PreparedPage, type Signed } from './verify-pages.ts';
import { onLogWorkers } from './log-workers.ts';

/** A device's chain as verifyStoredChains reports it: its links, and how far its signatures vouch for it. */
export type StoredChainStatus = ChainStatus & { signature: SignatureStatus };

/** A page on its way through the hashing. */
interface Hashing {
  page: PreparedPage;
  hashes: Promise<string[]>;
}

/** What the chains' walk found: each device's links, and its signed seqs. */
interface Walked {
  chains: ChainStatus[];
  signed: Map<string, Signed>;
}

/**
 * Verifies every device's chain in the store, reading its blocks in device-then-seq order. Each
 * page of blocks is read in its own read-only transaction (a transaction cannot stay open across
 * the hashing between pages); each hash is over the stored text without its hash member, which
 * is the record's hashed content. Then each device's signatures, with the public key known for
 * it. Reports per device: ok, or the first broken record and why; and signed by which key through
 * which seq, unsigned, or the first record no valid signature vouches for. Writes nothing, so a
 * cancel leaves nothing behind.
 * @throws StoreError('cancelled') if options.signal aborts
 */
export async function verifyStoredChains(options: LongWorkOptions = {}): Promise<StoredChainStatus[]> {
  throwIfAborted(options.signal);
  const db = await getDb();
  const total = await countChecks(db.transaction(LOG_STORES));
  const walked = (await walkOnWorkers(db, total, options)) ?? (await walkHere(db, total, options));
  const { chains, signed } = walked;
  const stored = await readPublicKeys(db, chains.map((c) => c.deviceId));
  const out: StoredChainStatus[] = [];
  for (const chain of chains) {
    throwIfAborted(options.signal);
    const s = signed.get(chain.deviceId) ?? { first: null, last: null, head: 0 };
    const known = stored.get(chain.deviceId);
    let key: VerifyingKey | null = null;
    if (known) key = known.cryptoKey ? { key: known.cryptoKey, jwk: known.publicJwk, fingerprint: known.fingerprint } : await verifyingKey(known.publicJwk);
    const signature = await signatureCoverage({
      deviceId: chain.deviceId, key, firstSigned: s.first, lastSigned: s.last, headSeq: s.head,
      at: (seq) => storedHeadAt(db, chain.deviceId, seq),
    });
    out.push({ ...chain, signature });
  }
  return out;
}

/**
 * The walk on this thread: while one page is hashed (on the hashing worker when there is one), the
 * next is read and its chain fields cut out; then the first page's results are judged, in order.
 */
async function walkHere(db: IDBPDatabase<TanksideDB>, total: number, options: LongWorkOptions): Promise<Walked> {
  const verifier = new ChainVerifier();
  const readPage = (after: LogBlock | null): Promise<LogBlock[]> => {
    const page = blocksAfter(db, after);
    page.catch(() => {}); // observed below, or abandoned on cancel
    return page;
  };
  const signed = new Map<string, Signed>();
  let done = 0;
  let next = readPage(null);
  let hashing: Hashing | null = null;
  for (;;) {
    const blocks = await next;
    throwIfAborted(options.signal);
    if (blocks.length > 0) next = readPage(blocks[blocks.length - 1]!);
    let prepared: Hashing | null = null;
    if (blocks.length > 0) {
      const page = preparePage(blocks, signed);
      const hashes = hashTextsAside(page.contents);
      hashes.catch(() => {}); // observed when the page is judged, or abandoned on cancel
      prepared = { page, hashes };
    }
    if (hashing) {
      const hashes = await hashing.hashes;
      throwIfAborted(options.signal);
      judgePage(hashing.page, hashes, verifier);
      done += hashing.page.links.length;
      options.onProgress?.(done, total);
    }
    if (!prepared) break;
    hashing = prepared;
  }
  return { chains: verifier.results(), signed };
}

/**
 * The walk on the log workers (log-workers.ts). Null where no worker can be made or one fails, or
 * when a record filed under one worker's device names another's (only a hand-edited store has
 * one): then the walk runs here instead, and says exactly what it finds.
 */
async function walkOnWorkers(db: IDBPDatabase<TanksideDB>, total: number, options: LongWorkOptions): Promise<Walked | null> {
  const doneOf: number[] = [];
  const results = await onLogWorkers(db, 'verify', options.signal, (news, g) => {
    if (news.type !== 'progress') return;
    doneOf[g] = news.done;
    options.onProgress?.(doneOf.reduce((a, b) => a + (b ?? 0), 0), total);
  });
  if (!results) return null;
  const chains = results.flatMap((r) => r.chains ?? []);
  if (new Set(chains.map((c) => c.deviceId)).size !== chains.length) return null;
  chains.sort((a, b) => (a.deviceId < b.deviceId ? -1 : a.deviceId > b.deviceId ? 1 : 0));
  return { chains, signed: new Map(results.flatMap((r) => r.signed ?? [])) };
}
