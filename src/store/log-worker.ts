// A worker that does a long job's reading straight from IndexedDB, with its own connection, over
// a run of devices' blocks: so the page's thread neither reads nor copies the stored texts, and
// two such workers share the work on both cores of a small phone (log-workers.ts makes them).
// - 'verify': cuts each record's chain fields, hashes what its hash covers and judges the links
//   (posting the texts to a hashing worker instead cost the page a quarter of its time at 100,000
//   checks; src/store/README.md);
// - 'csv-rows': parses each check and writes its CSV row, which the page puts on its line.
//
// Messages in: { job, dbName, lower, upper, page }: the block keys [deviceId, firstSeq] from lower
// to upper, inclusive, `page` blocks at a time. Out: { type: 'progress', done } after each page
// (records so far); for 'csv-rows' also { type: 'rows', blocks } with each block's deviceId and,
// per check, its seq, id and row; then { type: 'done', chains?, signed? } ('verify': ChainStatus
// per device, each device's signed seqs) or { type: 'failed', message }.
import { openDB } from 'idb';
import { csvRow } from './csv-rows.ts';
import { ChainVerifier } from './integrity.ts';
import { isCheckRecord, type LogRecord } from './records.ts';
import { sha256OfText } from './sha256.ts';
import { judgePage, preparePage, type BlockTexts, type Signed } from './verify-pages.ts';

/** A job for a log worker (log-workers.ts sends it). */
export interface LogJob {
  job: 'verify' | 'csv-rows';
  dbName: string;
  lower: [string, number];
  upper: [string, number];
  page: number;
}

/** A block's checks as CSV rows (the 'csv-rows' job). */
export interface BlockRows {
  deviceId: string;
  seqs: number[];
  ids: string[];
  rows: string[];
}

// The DOM lib types `self` as a window; in a dedicated worker it posts to the page that made it.
const scope = globalThis as unknown as { onmessage: ((e: MessageEvent<LogJob>) => void) | null; postMessage(message: unknown): void };

scope.onmessage = (e) => {
  run(e.data).then(
    (done) => scope.postMessage({ type: 'done', ...done }),
    (error: unknown) => scope.postMessage({ type: 'failed', message: error instanceof Error ? error.message : String(error) }),
  );
};

async function run({ job, dbName, lower, upper, page }: LogJob) {
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
      if (job === 'verify') {
        const prepared = preparePage(blocks, signed);
        judgePage(prepared, prepared.contents.map((c) => (c === '' ? '' : sha256OfText(c))), verifier);
        done += prepared.links.length;
      } else {
        scope.postMessage({ type: 'rows', blocks: blocks.map(rowsOf) });
        done += blocks.reduce((n, b) => n + b.texts.length, 0);
      }
      scope.postMessage({ type: 'progress', done });
      if (blocks.length < page) break;
      range = IDBKeyRange.bound([last.deviceId, last.firstSeq], upper, true, false);
    }
    return job === 'verify' ? { chains: verifier.results(), signed: [...signed] } : {};
  } finally {
    db.close();
  }
}

/** A block's checks, each parsed once and written as its CSV row; records of other kinds have no row. */
function rowsOf(block: BlockTexts): BlockRows {
  const out: BlockRows = { deviceId: block.deviceId, seqs: [], ids: [], rows: [] };
  block.texts.forEach((text, i) => {
    const r = JSON.parse(text) as LogRecord;
    if (!isCheckRecord(r)) return;
    out.seqs.push(block.seqs[i]!);
    out.ids.push(r.id);
    out.rows.push(csvRow(r));
  });
  return out;
}
