// Pull: a database's changes feed (_changes with include_docs), a batch at a time. Each batch is
// handed to the store and committed there before the server's last_seq is saved as the
// checkpoint, so a sync cut off between the two pulls the batch again, and the store skips what
// it already holds as identical.
import { applyVesselVersions, getSyncState, isKnownKind, learnDeviceKeys, linksAround, mergePulledRecords, updateSyncState, type LinkProblem, type PlantReport, type PulledRecord } from '../store/transfer.ts';
import { applyRegisterRecords } from '../store/register-sync.ts';
import { answerError, type Couch } from './couch.ts';
import { CHECKS_DB, PLANT_DB, readEnvelope, REGISTER_DOC_TYPES, registerEnvelopeProblem, vesselEnvelopeProblem, type RecordDoc, type RegisterDoc, type VesselDoc } from './documents.ts';
import { throwIfCancelled } from './errors.ts';

/**
 * Changes per request. Each batch's merge reads and rewrites the store's 256 id buckets; until
 * schema v8 they held an object per id, so a first pull cost about (records)² / (batch) there: a
 * supervisor's first pull of 100,000 in Chromium took 37.0 s of the browser's CPU with 2,000 per
 * request and 14.7 s with 10,000 (bench/sync-browser.bench-run.ts, load average 13). Since v9 they
 * are flat arrays (src/store/log-ids.ts) and that term is small, and 10,000 is kept: at 10,000
 * checks, 2,500, 5,000 and 10,000 per request took 7.1, 4.9 and 3.3 s (load 17), and asking for
 * 1,250 first and twice as many each time after, so that merging starts sooner, gained 0.06 s of
 * 2.4–2.8 s for 0.5 s more of the browser's CPU (load 12): dropped. 10,000 of these documents are
 * about 23 MB of JSON per answer: a phone parses that in a fraction of a second, and a sync of a
 * few new checks asks for no more than there is.
 */
export const PULL_BATCH = 10_000;

interface ChangesAnswer<T> {
  results?: { id: string; seq: unknown; deleted?: boolean; doc?: T }[];
  last_seq?: unknown;
  pending?: number;
}

export interface PullProgress {
  /** Documents pulled so far in this run. */
  done: number;
  /** Documents the server says are left, when it says (CouchDB does; the stand-in may not). */
  pending: number | null;
}

/** The checkpoint key of a database on a server (a device enrolled anew elsewhere starts again). */
export function checkpointKey(server: string, db: string): string {
  return `${server} ${db}`;
}

/**
 * Reads a database's changes from the saved checkpoint on, `PULL_BATCH` at a time; `take`
 * commits each batch's documents locally, then the checkpoint moves past it.
 */
async function pullFeed<T extends { _id: string }>(
  couch: Couch,
  db: string,
  take: (docs: T[]) => Promise<void>,
  options: { signal?: AbortSignal | undefined; onProgress?: ((p: PullProgress) => void) | undefined; batch?: number | undefined },
): Promise<number> {
  const key = checkpointKey(couch.root.href, db);
  const since = (await getSyncState()).checkpoints[key] ?? 0;
  const limit = options.batch ?? PULL_BATCH;
  const read = (from: unknown) => couch.request<ChangesAnswer<T>>('GET', `${db}/_changes?since=${encodeURIComponent(String(from))}&include_docs=true&limit=${limit}`);
  let done = 0;
  let next = read(since);
  for (;;) {
    throwIfCancelled(options.signal);
    const r = await next;
    if (r.status !== 200 || !Array.isArray(r.body.results) || r.body.last_seq === undefined) throw answerError(`Reading the changes of ${db}`, r);
    const more = !(r.body.results.length < limit || (typeof r.body.pending === 'number' && r.body.pending === 0));
    if (more) {
      // The next batch is asked for while this one is merged here: the server's answer and the
      // phone's write overlap (bench/sync-browser.bench-run.ts: waiting on the server was about
      // 40 % of a first pull). The checkpoint still moves only past what has committed.
      next = read(r.body.last_seq);
      next.catch(() => undefined); // heard when awaited; a merge failing first must not leave it unhandled
    }
    const docs: T[] = [];
    for (const change of r.body.results) {
      if (change.deleted || !change.doc || change.id.startsWith('_design/')) continue;
      docs.push(change.doc);
    }
    if (docs.length > 0) await take(docs);
    done += r.body.results.length;
    // Only now, with the batch committed here: a batch pulled twice is skipped as identical.
    if (r.body.results.length > 0) await updateSyncState({ checkpoints: { [key]: r.body.last_seq as string | number } });
    options.onProgress?.({ done, pending: typeof r.body.pending === 'number' ? r.body.pending : null });
    if (!more) return done;
  }
}

/** What pulling the check log did. */
export interface ChecksPullResult {
  /** Documents read from the feed. */
  read: number;
  /** Ids of the checks stored. */
  added: string[];
  /** Records already here, identical. */
  skipped: number;
  /** Records not stored, by document id, and why (bad envelope, hash, link, seq taken, not a valid record). */
  refused: { label: string; why: string }[];
  /**
   * Where the chains of the devices pulled from are not whole once the pull is over, around the
   * records it stored: a gap shows as a gap (a record not on the server, or not pulled yet).
   */
  gaps: LinkProblem[];
  /** Documents of a kind this version of the app does not know (later record kinds), not stored. */
  unknownKinds: number;
  /** Device public key records (seq 0) seen, as their texts; each is learnt before its batch's records merge. */
  deviceKeys: { deviceId: string; text: string }[];
  /** Devices whose public key this pull learnt (their signed records now verify here). */
  keysLearnt: string[];
}

/**
 * A supervisor's pull of every device's records from tankside-checks into the store. The links
 * around the records stored are checked again at the end (the feed need not follow seq order).
 * @throws SyncError('offline' | 'credentials' | 'refused' | 'server' | 'cancelled'); StoreError from the store's write
 */
export async function pullChecks(
  couch: Couch,
  options: { signal?: AbortSignal | undefined; onProgress?: ((p: PullProgress) => void) | undefined; batch?: number | undefined } = {},
): Promise<ChecksPullResult> {
  const result: ChecksPullResult = { read: 0, added: [], skipped: 0, refused: [], gaps: [], unknownKinds: 0, deviceKeys: [], keysLearnt: [] };
  const touched = new Map<string, { fromSeq: number; toSeq: number }>();
  result.read = await pullFeed<RecordDoc>(couch, CHECKS_DB, async (docs) => {
    const records: PulledRecord[] = [];
    const keys: { label: string; text: string }[] = [];
    const seqOf = new Map<string, RecordDoc>();
    for (const doc of docs) {
      const { problem, parsed } = readEnvelope(doc);
      if (problem !== null) result.refused.push({ label: doc._id, why: `envelope: ${problem}` });
      else if (doc.seq === 0) {
        result.deviceKeys.push({ deviceId: doc.deviceId, text: doc.text });
        keys.push({ label: doc._id, text: doc.text });
      } else if (doc.type !== 'check' && !isKnownKind(doc.type)) result.unknownKinds += 1;
      else {
        // The text was parsed for its envelope: the merge takes that, and checks it against the text.
        records.push(doc.signature ? { label: doc._id, text: doc.text, signature: doc.signature, parsed } : { label: doc._id, text: doc.text, parsed });
        seqOf.set(doc.id!, doc);
      }
    }
    // A device writes its key before its first record, so the feed brings it first: learnt before
    // the records it vouches for are merged (the merge reads the keys the store knows).
    if (keys.length > 0) {
      const learnt = await learnDeviceKeys(keys);
      result.keysLearnt.push(...learnt.learnt);
      result.refused.push(...learnt.refused);
    }
    const merged = await mergePulledRecords(records, options.signal ? { signal: options.signal } : {});
    for (const id of merged.added) {
      result.added.push(id);
      const doc = seqOf.get(id)!;
      const range = touched.get(doc.deviceId);
      if (!range) touched.set(doc.deviceId, { fromSeq: doc.seq, toSeq: doc.seq });
      else {
        range.fromSeq = Math.min(range.fromSeq, doc.seq);
        range.toSeq = Math.max(range.toSeq, doc.seq);
      }
    }
    result.skipped += merged.skipped;
    result.refused.push(...merged.refused);
  }, options);
  result.gaps = await linksAround([...touched].map(([deviceId, r]) => ({ deviceId, ...r })));
  return result;
}

/**
 * A device's pull of the plant inventory (tankside-plant): the newest version of each vessel is
 * applied, clashing edits are reported (PlantReport.conflicts), never merged; the instrument
 * register's documents are merged as a backup's register is (`register`: added, updated).
 */
export async function pullPlant(
  couch: Couch,
  options: { signal?: AbortSignal | undefined; onProgress?: ((p: PullProgress) => void) | undefined } = {},
): Promise<PlantReport & { read: number; register: { added: number; updated: number } }> {
  const result: PlantReport & { read: number; register: { added: number; updated: number } } = {
    read: 0, applied: [], skipped: 0, refused: [], conflicts: [], register: { added: 0, updated: 0 },
  };
  const conflicts = new Map<string, PlantReport['conflicts'][number]>();
  result.read = await pullFeed<VesselDoc | RegisterDoc>(couch, PLANT_DB, async (docs) => {
    const versions: { label: string; text: string }[] = [];
    const register: { label: string; type: RegisterDoc['type']; text: string }[] = [];
    for (const doc of docs) {
      if (doc.type === 'vessel') {
        const problem = vesselEnvelopeProblem(doc);
        if (problem) result.refused.push({ label: doc._id, why: `envelope: ${problem}` });
        else versions.push({ label: doc._id, text: doc.text });
      } else if ((REGISTER_DOC_TYPES as readonly string[]).includes(doc.type)) {
        const problem = registerEnvelopeProblem(doc);
        if (problem) result.refused.push({ label: doc._id, why: `envelope: ${problem}` });
        else register.push({ label: doc._id, type: doc.type, text: doc.text });
      } // other kinds of plant document, from a later version: left for it
    }
    const report = await applyVesselVersions(versions);
    result.applied.push(...report.applied);
    for (const a of report.applied) conflicts.delete(a.vesselId);
    result.skipped += report.skipped;
    result.refused.push(...report.refused);
    for (const c of report.conflicts) conflicts.set(c.vesselId, c); // the latest word on each vessel
    if (register.length > 0) {
      const r = await applyRegisterRecords(register);
      result.register.added += r.added;
      result.register.updated += r.updated;
      result.refused.push(...r.refused);
    }
  }, options);
  result.conflicts = [...conflicts.values()];
  return result;
}

/** For a message: how many records a pull refused, and the first reason. */
export function refusedSummary(refused: readonly { label: string; why: string }[]): string {
  if (refused.length === 0) return '';
  const first = refused[0]!;
  return `${refused.length} record${refused.length === 1 ? '' : 's'} refused (first: ${first.label}: ${first.why})`;
}
