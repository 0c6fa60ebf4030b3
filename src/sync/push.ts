// Push: this device's chain goes up from the server's own head. There is no push checkpoint: the
// log is the queue, and what is pending is the local head minus the server's head. Batches are
// sent in seq order and the next one only after the last was stored whole, so a record missing
// on the server below its head can only be in the last batch window; that window is filled in
// first at every push (a batch cut off by a crash, on a server that stored part of it).
import { ownChainHead, ownRecords, type OwnRecord } from '../store/transfer.ts';
import { answerError, jsonParam, type Couch } from './couch.ts';
import { CHECKS_DB, deviceKeyDoc, recordDoc, recordDocId, type RecordDoc } from './documents.ts';
import { SyncError, throwIfCancelled } from './errors.ts';

/** Documents per _bulk_docs request (measured with the prototype: 250 worked well). */
export const PUSH_BATCH = 250;

export interface PushProgress {
  done: number;
  total: number;
}

/** What a push did. */
export interface PushResult {
  /** Records the server stored in this push (re-sent ones it already held are not counted). */
  pushed: number;
  /** The server's head of this device's chain afterwards. */
  serverHead: number;
  /** The local head. */
  localHead: number;
}

interface BulkRow {
  id: string;
  ok?: boolean;
  error?: string;
  reason?: string;
}

interface AllDocsRow<T> {
  id?: string;
  key: string;
  error?: string;
  value?: { rev: string; deleted?: boolean };
  doc?: T | null;
}

/** The server's last record of a device's chain (seq 1 and up), or null. */
export async function serverHead(couch: Couch, deviceId: string): Promise<{ seq: number; hash: string } | null> {
  const q = `startkey=${jsonParam(`${deviceId}:\ufff0`)}&endkey=${jsonParam(recordDocId(deviceId, 1))}&descending=true&limit=1&include_docs=true`;
  const r = await couch.request<{ rows?: AllDocsRow<RecordDoc>[] }>('GET', `${CHECKS_DB}/_all_docs?${q}`);
  if (r.status !== 200 || !Array.isArray(r.body.rows)) throw answerError('Reading the server\'s copy of this device\'s chain', r);
  const doc = r.body.rows[0]?.doc;
  if (!doc) return null;
  if (doc.deviceId !== deviceId || typeof doc.seq !== 'number' || typeof doc.hash !== 'string') {
    throw new SyncError('chain-differs', `The server's last record for this device (${doc._id}) is not a record of its chain. Sync stopped; ask the administrator.`);
  }
  return { seq: doc.seq, hash: doc.hash };
}

/**
 * Pushes this device's records the server does not hold yet, oldest first, after checking that
 * the server's head of this chain is the record stored here at that seq.
 * @throws SyncError('chain-differs') if the server's copy is not this device's chain (nothing is sent);
 *   ('refused') with the server's reason; ('offline' | 'credentials' | 'server' | 'cancelled')
 */
export async function pushOwnChain(
  couch: Couch,
  options: { signal?: AbortSignal | undefined; onProgress?: ((p: PushProgress) => void) | undefined; deviceKeyText?: string | null | undefined } = {},
): Promise<PushResult> {
  const { deviceId, head } = await ownChainHead();
  const localHead = head?.seq ?? 0;
  const server = await serverHead(couch, deviceId);
  if (server) {
    const [mine] = server.seq <= localHead ? await ownRecords(server.seq, 1) : [];
    if (!mine || mine.hash !== server.hash) {
      throw new SyncError(
        'chain-differs',
        mine
          ? `The server's record ${server.seq} of this device differs from the one stored here. Sync stopped and nothing was sent: ask the administrator to compare this device's backup with the server.`
          : `The server holds records of this device up to ${server.seq}, but this device only up to ${localHead} (was it restored from an older backup, or is another install using its id?). Sync stopped and nothing was sent: ask the administrator.`,
      );
    }
  }
  // Written at the first sync after enrolment; sent again each time (a refusal as existing is read
  // back and compared, two small requests) so a device enrolled before it had a key, or whose first
  // answer was lost, still gets its key onto the server before its records.
  if (options.deviceKeyText) await sendDocs(couch, [deviceKeyDoc(deviceId, options.deviceKeyText)]);
  const from = server?.seq ?? 0;
  const total = localHead - from;
  let pushed = 0;
  options.onProgress?.({ done: 0, total });
  if (from > 0) pushed += await fillWindow(couch, deviceId, from);
  for (let seq = from + 1; seq <= localHead; seq += PUSH_BATCH) {
    throwIfCancelled(options.signal);
    const records = await ownRecords(seq, Math.min(PUSH_BATCH, localHead - seq + 1));
    pushed += await sendDocs(couch, records.map((r) => recordDoc(deviceId, r)));
    options.onProgress?.({ done: Math.min(localHead, seq + PUSH_BATCH - 1) - from, total });
  }
  return { pushed, serverHead: localHead, localHead };
}

/** Sends the records of the last batch window below the server's head that the server lacks. */
async function fillWindow(couch: Couch, deviceId: string, head: number): Promise<number> {
  const low = Math.max(1, head - PUSH_BATCH + 1);
  const q = `startkey=${jsonParam(recordDocId(deviceId, low))}&endkey=${jsonParam(recordDocId(deviceId, head))}`;
  const r = await couch.request<{ rows?: AllDocsRow<never>[] }>('GET', `${CHECKS_DB}/_all_docs?${q}`);
  if (r.status !== 200 || !Array.isArray(r.body.rows)) throw answerError('Reading the server\'s copy of this device\'s chain', r);
  const there = new Set(r.body.rows.map((row) => row.key));
  const records: OwnRecord[] = (await ownRecords(low, head - low + 1)).filter((rec) => !there.has(recordDocId(deviceId, rec.seq)));
  return records.length === 0 ? 0 : sendDocs(couch, records.map((rec) => recordDoc(deviceId, rec)));
}

/**
 * Stores documents with _bulk_docs; returns how many the server newly stored. A document the
 * server refuses as existing (409 on CouchDB, 403 from the stand-in's rules) is read back: the
 * same text means it was stored by an earlier try; any other answer stops the sync.
 */
export async function sendDocs<D extends { _id: string; text: string }>(couch: Couch, docs: readonly D[], db: string = CHECKS_DB): Promise<number> {
  let r = await couch.request<BulkRow[] | { error?: string; reason?: string }>('POST', `${db}/_bulk_docs`, { docs });
  if (Array.isArray(r.body) && r.body.some((row) => row.error === 'unauthorized')) {
    // Seen from the stand-in just after a restart: the session is no longer known, and each
    // document of the batch is answered "unauthorized" instead of the request. Sign in again once.
    couch.forgetSession();
    r = await couch.request<BulkRow[] | { error?: string; reason?: string }>('POST', `${db}/_bulk_docs`, { docs });
  }
  if (r.status !== 201 && r.status !== 200) throw answerError('Sending records', r);
  if (!Array.isArray(r.body) || r.body.length !== docs.length) throw new SyncError('server', 'The server\'s answer to a batch of records does not list each of them.', undefined, r.status);
  let stored = 0;
  const again: { doc: D; row: BulkRow }[] = [];
  r.body.forEach((row, i) => {
    if (row.ok) stored += 1;
    else again.push({ doc: docs[i]!, row });
  });
  if (again.length === 0) return stored;
  const read = await couch.request<{ rows?: AllDocsRow<D>[] }>('POST', `${db}/_all_docs?include_docs=true`, { keys: again.map((a) => a.doc._id) });
  if (read.status !== 200 || !Array.isArray(read.body.rows)) throw answerError('Reading back refused records', read);
  const found = new Map(read.body.rows.map((row) => [row.key, row.doc ?? null]));
  for (const { doc, row } of again) {
    const there = found.get(doc._id);
    if (there && there.text === doc.text) continue; // stored by an earlier try whose answer was lost
    if (there) {
      throw new SyncError('chain-differs', `The server already holds a different ${doc._id}. Sync stopped: ask the administrator to compare this device's backup with the server.`);
    }
    const reason = row.reason ?? row.error ?? 'no reason given';
    throw new SyncError('refused', `The server refused ${doc._id}: ${reason}.`, reason, row.error === 'forbidden' ? 403 : row.error === 'unauthorized' ? 401 : undefined);
  }
  return stored;
}
