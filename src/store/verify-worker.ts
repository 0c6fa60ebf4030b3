// A worker that verifies the chains of a run of devices straight from IndexedDB, with its own
// connection: it reads their blocks a page at a time, cuts each record's chain fields, hashes what
// the hash covers and judges the links, so the page's thread neither reads nor copies the texts
// (posting them to a hashing worker cost the page about a quarter of its time; src/store/README.md).
// Two of them verify on both cores of a small phone.
//
// Messages in: { dbName, lower, upper, page }: the block keys [deviceId, firstSeq] from lower to
// upper, inclusive. Out: { type: 'progress', done } after each page (records so far), then
// { type: 'done', chains, signed } (ChainStatus per device, and each device's signed seqs) or
// { type: 'failed', message }.
import { openDB } from 'idb';
import { ChainVerifier } from './integrity.ts';
import { sha256OfText } from './sha256.ts';
import { judgePage, preparePage, type BlockTexts, type Signed } from './verify-pages.ts';

interface Ask {
  dbName: string;
  lower: [string, number];
  upper: [string, number];
  page: number;
}

// The DOM lib types `self` as a window; in a dedicated worker it posts to the page that made it.
const scope = globalThis as unknown as { onmessage: ((e: MessageEvent<Ask>) => void) | null; postMessage(message: unknown): void };

scope.onmessage = (e) => {
  run(e.data).then(
    (done) => scope.postMessage({ type: 'done', ...done }),
    (error: unknown) => scope.postMessage({ type: 'failed', message: error instanceof Error ? error.message : String(error) }),
  );
};

async function run({ dbName, lower, upper, page }: Ask) {
  // Opened at whatever version it has: this worker only reads the log's blocks, and closes when a
  // newer version asks for the database, so it never holds an upgrade back.
  const db = await openDB(dbName, undefined, { blocking: () => db.close() });
  try {
    const verifier = new ChainVerifier();
    const signed = new Map<string, Signed>();
    let done = 0;
    let range = IDBKeyRange.bound(lower, upper);
    for (;;) {
      const blocks = (await db.getAll('logBlocks', range, page)) as (BlockTexts & { firstSeq: number })[];
      if (blocks.length === 0) break;
      const last = blocks[blocks.length - 1]!;
      const prepared = preparePage(blocks, signed);
      judgePage(prepared, prepared.contents.map((c) => (c === '' ? '' : sha256OfText(c))), verifier);
      done += prepared.links.length;
      scope.postMessage({ type: 'progress', done });
      if (blocks.length < page) break;
      range = IDBKeyRange.bound([last.deviceId, last.firstSeq], upper, true, false);
    }
    return { chains: verifier.results(), signed: [...signed] };
  } finally {
    db.close();
  }
}
