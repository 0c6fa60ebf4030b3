// CSV export of the check log: one row per check, SI units in the header, ISO 8601 times, text
// cells neutralised against spreadsheet formula injection. RFC 4180 quoting, CRLF line ends.
import type { IDBPTransaction } from 'idb';
import { getDb } from './connection.ts';
import { throwIfAborted } from './integrity.ts';
import { csvFromChecks, csvRow } from './csv-rows.ts';
import { blockPages, compareRows, countChecks, LOG_STORES, matchingRows, pageRows, readRecords, type MonthRow } from './log-layout.ts';
import { windowOf, type CheckFilter } from './checks.ts';
import { isCheckRecord, type CheckCursor, type CheckRecord, type LogRecord, type LongWorkOptions } from './records.ts';
import type { TanksideDB } from './schema.ts';
import { requireUuid } from './validate.ts';
import { onLogWorkers } from './log-workers.ts';

export { CSV_BOM, CSV_COLUMNS, csvCell, csvFromChecks, roundedAsShown } from './csv-rows.ts';

const PAGE = 1000;

/** What a CSV export covers: the whole log, one vessel's checks, or the checks a review filter lets through. */
export interface CsvOptions extends LongWorkOptions {
  vesselId?: string;
  /** Only the checks this filter covers (the Review's filter); with `vesselId`, both apply. */
  filter?: CheckFilter;
}

/**
 * The log (all of it, one vessel's, or a filter's selection) as CSV text, oldest first, read from one snapshot.
 * @throws StoreError('invalid-record') for a bad vesselId or filter field; ('cancelled') if options.signal aborts
 */
export async function exportCsv(options: CsvOptions = {}): Promise<string> {
  return (await exportCsvParts(options)).join('');
}

/** Rows per piece of exportCsvParts. */
const ROWS_PER_PART = 2000;

type LogReadTx = IDBPTransaction<TanksideDB, (typeof LOG_STORES)[number][], 'readonly'>;

/**
 * As exportCsv, as pieces whose concatenation is the file: a Blob or File made from them skips
 * building one string of the whole file.
 */
export async function exportCsvParts(options: CsvOptions = {}): Promise<string[]> {
  if (options.vesselId !== undefined) requireUuid('vesselId', options.vesselId);
  const filter: CheckFilter = { ...options.filter, ...(options.vesselId !== undefined ? { vesselId: options.vesselId } : {}) };
  const window = windowOf(filter);
  const narrowed = window.match !== undefined || Number.isFinite(window.fromMs) || Number.isFinite(window.toMs);
  if (!narrowed && window.vesselId === null) return [csvFromChecks([]), ...(await wholeLogPieces(options))];
  const tx = (await getDb()).transaction(LOG_STORES);
  const pieces = narrowed ? await selectionPieces(tx, window, options) : await vesselPieces(tx, window.vesselId!, options);
  await tx.done;
  return [csvFromChecks([]), ...pieces];
}

/** Rows with their line ends, ROWS_PER_PART to a piece. */
function piecesOf(rows: readonly string[]): string[] {
  const pieces: string[] = [];
  for (let i = 0; i < rows.length; i += ROWS_PER_PART) pieces.push(rows.slice(i, i + ROWS_PER_PART).join('\r\n') + '\r\n');
  return pieces;
}

/**
 * The whole log's rows, oldest first. The order comes from the month buckets (every check's
 * time, id, device and seq, small values), sorted once: it gives each check its line. Then the
 * blocks are read in their own order (device, then seq: large pages, cheaper than any other
 * walk), each record parsed once and its row put straight on its line, and each piece of lines
 * joined as soon as it is full, so the rows written are held as a few large strings and nothing is
 * sorted beside them (bench/review-scale.bench-run.ts measured the ways; src/store/README.md).
 * The reading, parsing and writing of rows runs on the log workers where they can be made
 * (log-worker.ts: whole devices each, both cores), this thread only putting rows on their lines.
 */
async function wholeLogPieces(options: LongWorkOptions): Promise<string[]> {
  const db = await getDb();
  const table = await lineTable(db.transaction(LOG_STORES), options);
  const onWorkers = await onLogWorkers(db, 'csv-rows', options.signal, (news) => {
    if (news.type !== 'rows') return;
    for (const b of news.blocks) {
      for (let i = 0; i < b.rows.length; i += 1) if (!table.place(b.deviceId, b.seqs[i]!, b.ids[i]!, b.rows[i]!)) return 'stop';
    }
    table.progress();
  });
  if (onWorkers) return table.pieces();
  // Here instead, from one snapshot (the table again, as the workers may have stopped half-way).
  const tx = db.transaction(LOG_STORES);
  const here = await lineTable(tx, options);
  for await (const page of blockPages(tx)) {
    throwIfAborted(options.signal);
    for (const block of page) {
      for (let i = 0; i < block.texts.length; i += 1) {
        const r = JSON.parse(block.texts[i]!) as LogRecord;
        // Records of other kinds are not checks: they have no month row and no line here.
        if (!isCheckRecord(r)) continue;
        if (!here.place(block.deviceId, block.seqs[i]!, r.id, csvRow(r))) return sortedByTime(tx, options.signal);
      }
    }
    here.progress();
  }
  return here.pieces();
}

/** The whole log's lines: where each check's row goes, the rows placed so far, the pieces joined. */
interface LineTable {
  /** Puts a check's row on its line; false for a check the month buckets do not list (a hand-edited store) or one placed twice. */
  place(deviceId: string, seq: number, id: string, row: string): boolean;
  /** Reports rows placed so far to options.onProgress. */
  progress(): void;
  /** Every piece, joined (a row the buckets list but no block holds leaves no line). */
  pieces(): string[];
}

/** The line table of the whole log, its order read from the month buckets in `tx`. */
async function lineTable(tx: LogReadTx, options: LongWorkOptions): Promise<LineTable> {
  const order: MonthRow[] = [];
  for (const bucket of await tx.objectStore('logMonthParts').getAll()) for (const r of bucket.rows) order.push(r);
  order.sort(compareRows);
  const total = order.length;
  const lineOf = lineNumbers(order);
  const lines = new Array<string | undefined>(total);
  const pieces = new Array<string | null>(Math.ceil(total / ROWS_PER_PART)).fill(null);
  const filled = new Int32Array(pieces.length);
  const joinPiece = (p: number): string => {
    const out: string[] = [];
    for (let i = p * ROWS_PER_PART; i < Math.min(total, (p + 1) * ROWS_PER_PART); i += 1) {
      const line = lines[i];
      if (line !== undefined) out.push(line);
      lines[i] = undefined;
    }
    return out.length === 0 ? '' : out.join('\r\n') + '\r\n';
  };
  let done = 0;
  return {
    place(deviceId, seq, id, row) {
      const line = lineOf(deviceId, seq);
      const p = Math.floor(line / ROWS_PER_PART);
      if (line < 0 || order[line]![1] !== id || pieces[p] !== null || lines[line] !== undefined) return false;
      lines[line] = row;
      done += 1;
      filled[p] = filled[p]! + 1;
      if (filled[p] === Math.min(ROWS_PER_PART, total - p * ROWS_PER_PART)) pieces[p] = joinPiece(p);
      return true;
    },
    progress: () => options.onProgress?.(done, total),
    pieces: () => pieces.map((piece, p) => piece ?? joinPiece(p)).filter((piece) => piece !== ''),
  };
}

/** The line of each (deviceId, seq) in `order`, or −1. */
function lineNumbers(order: readonly MonthRow[]): (deviceId: string, seq: number) => number {
  const span = new Map<string, [number, number]>();
  for (const r of order) {
    const sp = span.get(r[2]);
    if (!sp) span.set(r[2], [r[3], r[3]]);
    else if (r[3] < sp[0]) sp[0] = r[3];
    else if (r[3] > sp[1]) sp[1] = r[3];
  }
  const byDevice = new Map<string, { first: number; lines: Int32Array }>();
  for (const [deviceId, [lo, hi]] of span) byDevice.set(deviceId, { first: lo, lines: new Int32Array(hi - lo + 1).fill(-1) });
  order.forEach((r, i) => {
    const d = byDevice.get(r[2])!;
    d.lines[r[3] - d.first] = i;
  });
  return (deviceId, seq) => {
    const d = byDevice.get(deviceId);
    return d && seq >= d.first && seq - d.first < d.lines.length ? d.lines[seq - d.first]! : -1;
  };
}

/**
 * The whole log's rows from the same snapshot, every row kept beside its time and id and all of
 * them sorted: for a store whose month buckets do not list every stored record, so that each
 * still goes out, in its place by time.
 */
async function sortedByTime(tx: LogReadTx, signal: AbortSignal | undefined): Promise<string[]> {
  const keyed: { timeMs: number; id: string; text: string }[] = [];
  for await (const page of blockPages(tx)) {
    throwIfAborted(signal);
    for (const block of page) {
      for (const text of block.texts) {
        const r = JSON.parse(text) as LogRecord;
        if (!isCheckRecord(r)) continue;
        keyed.push({ timeMs: r.timeMs, id: r.id, text: csvRow(r) });
      }
    }
  }
  keyed.sort((x, y) => x.timeMs - y.timeMs || (x.id < y.id ? -1 : x.id > y.id ? 1 : 0));
  return piecesOf(keyed.map((k) => k.text));
}

/**
 * A filter's rows, oldest first: the matching month rows gathered and sorted once, then their
 * records read a page at a time (each page's blocks once), so only the blocks of the selection open.
 */
async function selectionPieces(tx: LogReadTx, window: ReturnType<typeof windowOf>, options: LongWorkOptions): Promise<string[]> {
  const { rows } = await matchingRows(tx, window);
  rows.sort(compareRows);
  const pieces: string[] = [];
  for (let at = 0; at < rows.length; at += PAGE) {
    throwIfAborted(options.signal);
    const page = rows.slice(at, at + PAGE);
    const records = await readRecords(tx, page.map((r) => ({ deviceId: r[2], seq: r[3] })));
    const lines: string[] = [];
    for (const r of records) if (r && isCheckRecord(r)) lines.push(csvRow(r));
    pieces.push(...piecesOf(lines));
    options.onProgress?.(Math.min(rows.length, at + PAGE), rows.length);
  }
  return pieces;
}

/** One vessel's rows, oldest first: its month buckets a page of rows at a time, each page's blocks read once. */
async function vesselPieces(tx: LogReadTx, vesselId: string, options: LongWorkOptions): Promise<string[]> {
  const total = await countChecks(tx, vesselId);
  const pieces: string[] = [];
  let done = 0;
  let after: CheckCursor | undefined;
  for (;;) {
    const { rows, more } = await pageRows(tx, { vesselId, fromMs: -Infinity, toMs: Infinity, after, order: 'oldest', limit: PAGE });
    throwIfAborted(options.signal);
    const records = await readRecords(tx, rows.map((r) => ({ deviceId: r[2], seq: r[3] })));
    const lines: string[] = [];
    for (const r of records) if (r && isCheckRecord(r)) lines.push(csvRow(r));
    pieces.push(...piecesOf(lines));
    done += rows.length;
    options.onProgress?.(done, total);
    const last = rows[rows.length - 1];
    if (!more || !last) return pieces;
    after = { timeMs: last[0], id: last[1] };
  }
}
