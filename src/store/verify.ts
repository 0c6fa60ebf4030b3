// Chain verification over the stored log, a page of blocks at a time (a large log never sits in
// memory), then each device's signatures (signatures.ts). Where workers can be made, the devices
// are shared between two verifying workers that read the blocks themselves (verify-worker.ts);
// otherwise (Node, a refused worker) this thread reads and a hashing worker, or this thread, hashes.
import type { IDBPDatabase } from 'idb';
import { getDb, storeName } from './connection.ts';
import { readPublicKeys } from './device-keys.ts';
import { hashTextsAside } from './hash-texts.ts';
import { ChainVerifier, throwIfAborted, type ChainStatus } from './integrity.ts';
import { countChecks, LOG_STORES, type LogBlock } from './log-layout.ts';
import { blocksAfter, storedHeadAt } from './log-walks.ts';
import type { LongWorkOptions } from './records.ts';
import type { TanksideDB } from './schema.ts';
import { signatureCoverage, verifyingKey, type SignatureStatus, type VerifyingKey } from './signatures.ts';
import { judgePage, preparePage, type PreparedPage, type Signed } from './verify-pages.ts';
import { StoreError } from './errors.ts';

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

/** Verifying workers at most (a small phone has two cores). */
const WORKERS = 2;
/** Blocks per page a verifying worker reads (about 100 records each). */
const WORKER_PAGE = 40;

/**
 * The walk on verifying workers, each given whole devices of about the same number of blocks (one
 * device's chain is judged by one worker, in order). Null where no worker can be made or one fails
 * before it reports, or when a record filed under one worker's device names another's (only a
 * hand-edited store has one): then the walk runs here instead, and says exactly what it finds.
 */
async function walkOnWorkers(db: IDBPDatabase<TanksideDB>, total: number, options: LongWorkOptions): Promise<Walked | null> {
  if (typeof Worker === 'undefined') return null;
  const keys = await db.getAllKeys('logBlocks');
  if (keys.length === 0) return null;
  const groups: [lower: [string, number], upper: [string, number]][] = [];
  let start = 0;
  for (let i = 0; i < keys.length; i += 1) {
    const last = i === keys.length - 1;
    const deviceEnds = last || keys[i + 1]![0] !== keys[i]![0];
    if (deviceEnds && (last || (groups.length < WORKERS - 1 && i + 1 >= (keys.length * (groups.length + 1)) / WORKERS))) {
      groups.push([keys[start]!, keys[i]!]);
      start = i + 1;
    }
  }
  const workers: Worker[] = [];
  const stopAll = () => workers.forEach((w) => w.terminate());
  const doneOf = new Array<number>(groups.length).fill(0);
  try {
    const results = await Promise.all(groups.map(([lower, upper], g) => new Promise<Walked | null>((resolve, reject) => {
      let w: Worker;
      try {
        w = new Worker(new URL('./verify-worker.ts', import.meta.url));
      } catch {
        resolve(null);
        return;
      }
      workers.push(w);
      const onAbort = () => reject(new StoreError('cancelled', 'Cancelled; nothing was changed.'));
      options.signal?.addEventListener('abort', onAbort, { once: true });
      w.onmessage = (e: MessageEvent<{ type: 'progress'; done: number } | { type: 'done'; chains: ChainStatus[]; signed: [string, Signed][] } | { type: 'failed'; message: string }>) => {
        const m = e.data;
        if (m.type === 'progress') {
          doneOf[g] = m.done;
          options.onProgress?.(doneOf.reduce((a, b) => a + b, 0), total);
          return;
        }
        options.signal?.removeEventListener('abort', onAbort);
        if (m.type === 'done') resolve({ chains: m.chains, signed: new Map(m.signed) });
        else resolve(null);
      };
      w.onerror = (e) => {
        e.preventDefault();
        options.signal?.removeEventListener('abort', onAbort);
        resolve(null);
      };
      w.postMessage({ dbName: storeName(), lower, upper, page: WORKER_PAGE });
    })));
    throwIfAborted(options.signal);
    if (results.some((r) => r === null)) return null;
    const chains = results.flatMap((r) => r!.chains);
    const devices = new Set(chains.map((c) => c.deviceId));
    if (devices.size !== chains.length) return null;
    chains.sort((a, b) => (a.deviceId < b.deviceId ? -1 : a.deviceId > b.deviceId ? 1 : 0));
    return { chains, signed: new Map(results.flatMap((r) => [...r!.signed])) };
  } finally {
    stopAll();
  }
}
