// Records of other kinds than checks (record-kinds.ts lists them): saved into the device's chain
// exactly as a check is (appendToChain: same blocks, seq, hash and signature), listed per kind,
// vessel and time from their logKinds rows. Never changed once saved; a later record can point at
// an earlier one inside its `values` (the store does not read them).
import { getDb } from './connection.ts';
import { appendToChain, requireCautions, sealMigratedChecks, TEXT_LIMITS, type ChainBase } from './checks.ts';
import { StoreError } from './errors.ts';
import { locateIds, LOG_STORES, readRecords, type KindRow } from './log-layout.ts';
import { isCheckRecord, type CheckCursor, type KindRecord, type KindRecordPage, type NewKindRecord } from './records.ts';
import { isKnownKind, RECORD_KINDS, type RecordKind } from './record-kinds.ts';
import { deviceId } from './settings.ts';
import { formatIsoWithOffset } from './time.ts';
import { cloneJson, invalid, requireJsonObject, requireText, requireUuid } from './validate.ts';

/** Options of appendRecord. */
export interface AppendRecordOptions {
  /** A draft (saveDraft's key) deleted in the same transaction that adds the record. */
  clearDraft?: string;
}

/**
 * Saves a record of `kind` into this device's chain and returns it as stored; saved only when this
 * resolves (strict durability). As appendCheck: seq, prevHash, hash and signature exactly as a
 * check's, the draft (if named) deleted with it.
 * @throws StoreError('invalid-record') naming the field (a kind this version does not keep
 *   included); ('not-found') for an unknown vessel; ('quota-exceeded' | 'write-failed' |
 *   'chain-busy') with nothing saved and the draft kept
 */
export async function appendRecord(kind: RecordKind, input: NewKindRecord, options: AppendRecordOptions = {}): Promise<KindRecord> {
  if (!isKnownKind(kind)) throw invalid('kind', `expected one of ${RECORD_KINDS.join(', ')}`);
  if (options.clearDraft !== undefined) requireText('clearDraft', options.clearDraft, 1, 100);
  if (input.vesselId !== null) requireUuid('vesselId', input.vesselId);
  const technician = requireText('technician', typeof input.technician === 'string' ? input.technician.trim() : input.technician, 1, TEXT_LIMITS.technician);
  const note = requireText('note', input.note ?? '', 0, TEXT_LIMITS.note);
  const values = cloneJson(requireJsonObject('values', input.values));
  const cautions = cloneJson(requireCautions('cautions', input.cautions));
  const appVersion = requireText('appVersion', input.appVersion, 1, TEXT_LIMITS.version);
  const formulationId = requireText('formulationId', input.formulationId, 1, TEXT_LIMITS.version);
  const takenAt = input.takenAt ?? new Date();
  if (!(takenAt instanceof Date) || !Number.isFinite(takenAt.getTime())) throw invalid('takenAt', 'expected a valid Date');

  const db = await getDb();
  await sealMigratedChecks(db);
  let vessel: { tag: string } | null = null;
  if (input.vesselId !== null) {
    const v = await db.get('vessels', input.vesselId);
    if (!v) throw new StoreError('not-found', `No vessel with id ${input.vesselId}.`, 'vesselId');
    if (v.retired) throw invalid('vesselId', `vessel ${v.tag} is retired; it takes no new records`);
    vessel = { tag: v.tag };
  }
  const base: ChainBase<KindRecord> = {
    kind,
    id: crypto.randomUUID(),
    deviceId: await deviceId(),
    time: formatIsoWithOffset(takenAt),
    // To the second, as a check's: sorting uses the instant the stamp shows.
    timeMs: Math.floor(takenAt.getTime() / 1000) * 1000,
    technician,
    note,
    vesselId: input.vesselId,
    vessel,
    values,
    cautions,
    appVersion,
    formulationId,
  };
  return appendToChain(db, base, { clearDraft: options.clearDraft, what: `the ${kind} record` });
}

/** One record of another kind by id, or undefined (a check's id gives undefined: getCheck reads those). */
export async function getRecord(id: string): Promise<KindRecord | undefined> {
  if (typeof id !== 'string') return undefined;
  const tx = (await getDb()).transaction(LOG_STORES);
  const at = (await locateIds(tx, [id])).get(id)?.at;
  if (!at) return undefined;
  const [record] = await readRecords(tx, [{ deviceId: at[0], seq: at[1] }]);
  return record && !isCheckRecord(record) ? record : undefined;
}

/** Which records a listing covers: one kind, optionally one vessel and a time window (inclusive). */
export interface KindFilter {
  kind: string;
  vesselId?: string;
  from?: Date;
  to?: Date;
  /** 1–1000, default 50. */
  limit?: number;
  order?: 'newest' | 'oldest';
  /** The previous page's `next`. */
  before?: CheckCursor;
}

/**
 * A page of the records of one kind, newest first unless `order` is 'oldest' (by instant, ties by
 * id), from their logKinds rows; only the blocks of the page's records are read. A kind this
 * version does not keep simply lists nothing.
 * @throws StoreError('invalid-record') naming a bad filter field
 */
export async function listRecords(filter: KindFilter): Promise<KindRecordPage> {
  requireText('kind', filter.kind, 1, 64);
  if (filter.vesselId !== undefined) requireUuid('vesselId', filter.vesselId);
  const limit = filter.limit ?? 50;
  if (!Number.isInteger(limit) || limit < 1 || limit > 1000) throw invalid('limit', `${limit}; allowed 1 to 1000`);
  const order = filter.order ?? 'newest';
  if (order !== 'newest' && order !== 'oldest') throw invalid('order', 'expected "newest" or "oldest"');
  let lowMs = filter.from ? filter.from.getTime() : -Infinity;
  let highMs = filter.to ? filter.to.getTime() : Infinity;
  if (Number.isNaN(lowMs)) throw invalid('from', 'expected a valid Date');
  if (Number.isNaN(highMs)) throw invalid('to', 'expected a valid Date');
  // The cursor bounds the range; the one row at the cursor's own instant and id is dropped below.
  const c = filter.before;
  if (c !== undefined && (typeof c !== 'object' || c === null || !Number.isFinite(c.timeMs) || typeof c.id !== 'string')) {
    throw invalid('before', 'expected the `next` cursor of a previous page');
  }
  if (c && order === 'newest') highMs = Math.min(highMs, c.timeMs);
  if (c && order === 'oldest') lowMs = Math.max(lowMs, c.timeMs);
  if (lowMs > highMs) return { records: [], next: null };
  const tx = (await getDb()).transaction(LOG_STORES);
  const kinds = tx.objectStore('logKinds');
  const source = filter.vesselId === undefined
    ? kinds.index('by-kind-time').openCursor(IDBKeyRange.bound([filter.kind, lowMs], [filter.kind, highMs, '\uffff']), order === 'newest' ? 'prev' : 'next')
    : kinds.openCursor(IDBKeyRange.bound([filter.kind, filter.vesselId, lowMs], [filter.kind, filter.vesselId, highMs, '\uffff']), order === 'newest' ? 'prev' : 'next');
  const rows: KindRow[] = [];
  let cursor = await source;
  while (cursor && rows.length <= limit) {
    const r = cursor.value;
    const past = !c || (order === 'newest' ? r.timeMs < c.timeMs || (r.timeMs === c.timeMs && r.id < c.id) : r.timeMs > c.timeMs || (r.timeMs === c.timeMs && r.id > c.id));
    if (past) rows.push(r);
    cursor = await cursor.continue();
  }
  const page = rows.slice(0, limit);
  const found = await readRecords(tx, page.map((r) => ({ deviceId: r.deviceId, seq: r.seq })));
  const records = found.filter((r): r is KindRecord => r !== undefined && !isCheckRecord(r));
  const last = page[page.length - 1];
  return { records, next: rows.length > limit && last ? { timeMs: last.timeMs, id: last.id } : null };
}

/** How many records of `kind` are stored (one vessel's when given). Reads the rows, not the records. */
export async function countRecords(kind: string, vesselId?: string): Promise<number> {
  requireText('kind', kind, 1, 64);
  if (vesselId !== undefined) requireUuid('vesselId', vesselId);
  const kinds = (await getDb()).transaction('logKinds').store;
  return vesselId === undefined
    ? kinds.index('by-kind-time').count(IDBKeyRange.bound([kind], [kind, Infinity]))
    : kinds.count(IDBKeyRange.bound([kind, vesselId], [kind, vesselId, Infinity]));
}
