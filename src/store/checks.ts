// The append-only check log. A check is saved once, with `add` (which refuses an existing id), and
// never changed; a correction is a new record pointing at the one it corrects.
import type { IDBPDatabase, StoreNames } from 'idb';
import { getDb, setAfterOpen } from './connection.ts';
import { StoreError, storeErrorFromWrite } from './errors.ts';
import { OUTCOME_IDS, outcomeOfMask, SIGNAL_ORDER, VERDICT_IDS, type Signal, type StoredOutcome, type StoredVerdict } from './facts.ts';
import { canonicalJson, computeCheckHash } from './integrity.ts';
import {
  addToLog,
  blockPages,
  chainHead,
  countChecks,
  locateIds,
  LogConflict,
  LOG_STORES,
  pageRows,
  readRecords,
  type MonthRow,
  settle,
  type LogBlock,
} from './log-layout.ts';
import {
  GENESIS_HASH,
  isCheckRecord,
  type KindRecord,
  type LogRecord,
  type CheckCursor,
  type CheckPage,
  type CheckRecord,
  type NewCheck,
  type StoredCaution,
  type TypedInput,
} from './records.ts';
import { SETTING_SEAL_PENDING, type TanksideDB } from './schema.ts';
import { askPersistenceOnce, deviceId, dropDraftMirror } from './settings.ts';
import { deviceSigningKey, signChainHead } from './signing.ts';
import { formatIsoWithOffset } from './time.ts';
import { cloneJson, invalid, requireJson, requireJsonObject, requireText, requireUuid } from './validate.ts';

const STRICT = { durability: 'strict' } as const;
const SIGNALS: ReadonlySet<string> = new Set(['DANGER', 'WARNING', 'CAUTION', 'NOTICE']);
export const TEXT_LIMITS = {
  technician: 100,
  note: 4000,
  reason: 2000,
  inputText: 100,
  unit: 32,
  fieldName: 64,
  version: 100,
  cautionMessage: 2000,
  cautionRule: 200,
} as const;
const MAX_INPUTS = 32;
const MAX_CAUTIONS = 64;
/** How often a save recomputes when another tab moved the chain head under it. */
const CHAIN_RETRIES = 10;

/** Checks a TypedInput map; shared with the backup reader. */
export function requireInputs(field: string, value: unknown): Record<string, TypedInput> {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) throw invalid(field, 'expected an object');
  const entries = Object.entries(value);
  if (entries.length > MAX_INPUTS) throw invalid(field, `${entries.length} fields; at most ${MAX_INPUTS}`);
  for (const [name, input] of entries) {
    requireText(`${field} name`, name, 1, TEXT_LIMITS.fieldName);
    const f = `${field}.${name}`;
    if (typeof input !== 'object' || input === null || Array.isArray(input)) throw invalid(f, 'expected { text, unit }');
    for (const key of Object.keys(input)) {
      if (key !== 'text' && key !== 'unit' && key !== 'reference') throw invalid(`${f}.${key}`, 'unknown field');
    }
    const i = input as Record<string, unknown>;
    requireText(`${f}.text`, i['text'], 0, TEXT_LIMITS.inputText);
    requireText(`${f}.unit`, i['unit'], 0, TEXT_LIMITS.unit);
    if (i['reference'] !== undefined && i['reference'] !== 'gauge' && i['reference'] !== 'absolute') {
      throw invalid(`${f}.reference`, 'expected "gauge" or "absolute"');
    }
  }
  return value as Record<string, TypedInput>;
}

/** Checks a caution list; shared with the backup reader. */
export function requireCautions(field: string, value: unknown): StoredCaution[] {
  if (!Array.isArray(value)) throw invalid(field, 'expected a list');
  if (value.length > MAX_CAUTIONS) throw invalid(field, `${value.length} cautions; at most ${MAX_CAUTIONS}`);
  value.forEach((c: unknown, i) => {
    const f = `${field}[${i}]`;
    if (typeof c !== 'object' || c === null || Array.isArray(c)) throw invalid(f, 'expected { signal, message, rule }');
    for (const key of Object.keys(c)) {
      if (key !== 'signal' && key !== 'message' && key !== 'rule') throw invalid(`${f}.${key}`, 'unknown field');
    }
    const r = c as Record<string, unknown>;
    if (typeof r['signal'] !== 'string' || !SIGNALS.has(r['signal'])) throw invalid(`${f}.signal`, 'expected DANGER, WARNING, CAUTION or NOTICE');
    requireText(`${f}.message`, r['message'], 1, TEXT_LIMITS.cautionMessage);
    requireText(`${f}.rule`, r['rule'], 1, TEXT_LIMITS.cautionRule);
  });
  return value as StoredCaution[];
}

/** Options of appendCheck. */
export interface AppendOptions {
  /**
   * The draft (saveDraft's key) that held this entry: deleted in the same transaction that adds
   * the check, so no moment exists at which the check is saved and its entry still looks unsaved.
   */
  clearDraft?: string;
}

/**
 * Saves a check to the log and returns the saved record. The record counts as saved only when this
 * resolves (its transaction committed with strict durability). The hash is computed before the
 * write transaction opens; inside it the chain head is read again and, if another tab moved it,
 * the write is abandoned and redone from the new head.
 * At the first saved check the store asks the browser to persist its data (see persistenceState).
 * @throws StoreError('invalid-record') naming the field; ('not-found') for an unknown vessel or
 *   corrected check; ('quota-exceeded' | 'write-failed' | 'chain-busy') with nothing saved (and
 *   the draft kept)
 */
export async function appendCheck(input: NewCheck, options: AppendOptions = {}): Promise<CheckRecord> {
  if (options.clearDraft !== undefined) requireText('clearDraft', options.clearDraft, 1, 100);
  requireUuid('vesselId', input.vesselId);
  const technician = requireText('technician', typeof input.technician === 'string' ? input.technician.trim() : input.technician, 1, TEXT_LIMITS.technician);
  const note = requireText('note', input.note ?? '', 0, TEXT_LIMITS.note);
  const inputs = cloneJson(requireInputs('inputs', input.inputs));
  requireJsonObject('reading', input.reading);
  requireJson('result', input.result);
  if (input.vesselSpec !== undefined) requireJsonObject('vesselSpec', input.vesselSpec);
  const reading = cloneJson(input.reading);
  const result = cloneJson(input.result);
  const cautions = cloneJson(requireCautions('cautions', input.cautions));
  const appVersion = requireText('appVersion', input.appVersion, 1, TEXT_LIMITS.version);
  const formulationId = requireText('formulationId', input.formulationId, 1, TEXT_LIMITS.version);
  const takenAt = input.takenAt ?? new Date();
  if (!(takenAt instanceof Date) || !Number.isFinite(takenAt.getTime())) throw invalid('takenAt', 'expected a valid Date');
  let corrects: string | null = null;
  let reason: string | null = null;
  if (input.corrects !== undefined) {
    corrects = requireUuid('corrects', input.corrects);
    reason = requireText('reason', typeof input.reason === 'string' ? input.reason.trim() : input.reason, 1, TEXT_LIMITS.reason);
  } else if (input.reason !== undefined) {
    throw invalid('reason', 'a reason is given only with `corrects`');
  }

  const db = await getDb();
  await sealMigratedChecks(db);
  const vessel = await db.get('vessels', input.vesselId);
  if (!vessel) throw new StoreError('not-found', `No vessel with id ${input.vesselId}.`, 'vesselId');
  if (vessel.retired && corrects === null) throw invalid('vesselId', `vessel ${vessel.tag} is retired; it takes no new checks`);
  if (corrects !== null && !(await hasCheck(db, corrects))) {
    throw new StoreError('not-found', `No check with id ${corrects} to correct.`, 'corrects');
  }
  const time = formatIsoWithOffset(takenAt);
  const base: ChainBase<CheckRecord> = {
    id: crypto.randomUUID(),
    deviceId: await deviceId(),
    time,
    // The stamp is to the second; sorting uses the same instant the stamp shows.
    timeMs: Math.floor(takenAt.getTime() / 1000) * 1000,
    technician,
    note,
    vesselId: vessel.id,
    vessel: { tag: vessel.tag, spec: input.vesselSpec === undefined ? vessel.spec : cloneJson(input.vesselSpec) },
    inputs,
    reading,
    result,
    cautions,
    appVersion,
    formulationId,
    corrects,
    reason,
  };

  return appendToChain(db, base, { clearDraft: options.clearDraft, what: 'the check' });
}

/** A record without the fields its place in the chain gives it. */
export type ChainBase<R extends LogRecord> = R extends LogRecord ? Omit<R, 'seq' | 'prevHash' | 'hash'> : never;

/** Options of appendToChain: a draft deleted with the write, and what the record is called in errors. */
export interface ChainWriteOptions {
  clearDraft?: string | undefined;
  what: string;
}

/**
 * Adds one record (a check, or a record of another kind) as the device's next link: seq and
 * prevHash from the chain head, hash and signature made before the write opens, then, inside one
 * strict transaction, the head read again and the record added (and a draft deleted with it). If
 * another tab moved the head meanwhile, the write is abandoned and redone from the new head.
 * `base` is the record without its chain fields, already validated.
 * @throws StoreError('quota-exceeded' | 'write-failed' | 'chain-busy') with nothing saved
 */
export async function appendToChain(db: IDBPDatabase<TanksideDB>, base: ChainBase<CheckRecord>, options: ChainWriteOptions): Promise<CheckRecord>;
export async function appendToChain(db: IDBPDatabase<TanksideDB>, base: ChainBase<KindRecord>, options: ChainWriteOptions): Promise<KindRecord>;
export async function appendToChain(db: IDBPDatabase<TanksideDB>, base: ChainBase<LogRecord>, options: ChainWriteOptions): Promise<LogRecord> {
  const device = base.deviceId;
  const key = await deviceSigningKey(db);
  for (let attempt = 0; attempt < CHAIN_RETRIES; attempt += 1) {
    const head = (await chainHead(db.transaction(LOG_STORES), device)) ?? { seq: 0, hash: GENESIS_HASH };
    const unsigned = { ...base, seq: head.seq + 1, prevHash: head.hash };
    const record: LogRecord = { ...unsigned, hash: await computeCheckHash(unsigned) };
    const text = canonicalJson(record);
    // Signed before the write opens (no await of anything but IndexedDB inside it); a signature that
    // cannot be made leaves the record unsigned rather than unsaved.
    const signature = key ? await signChainHead(key, device, record.seq, record.hash).catch(() => '') : '';

    const scope: StoreNames<TanksideDB>[] = options.clearDraft === undefined ? [...LOG_STORES] : [...LOG_STORES, 'drafts'];
    // The draft's mirror goes now: once this commits the entry must not come back in the form, and
    // should it not commit, the draft in IndexedDB (deleted only with the record) still holds it.
    if (options.clearDraft !== undefined) dropDraftMirror(options.clearDraft);
    const tx = db.transaction(scope, 'readwrite', STRICT);
    const done = tx.done;
    done.catch(() => {}); // observed below; keeps an abort from surfacing as unhandled
    let moved = false;
    try {
      // Read-write transactions over the same stores run one at a time, so a head unchanged here
      // stays unchanged until this one commits.
      const now = (await chainHead(tx, device)) ?? { seq: 0, hash: GENESIS_HASH };
      if (now.seq !== head.seq || now.hash !== head.hash) {
        moved = true;
        tx.abort();
        await done;
      } else {
        const writes: Promise<unknown>[] = [addToLog(tx, [{ record, text, signature }])];
        if (options.clearDraft !== undefined) writes.push(tx.objectStore('drafts').delete(options.clearDraft));
        await settle(tx, Promise.all(writes));
      }
    } catch (error) {
      // Moved, or (another tab between our reads) the seq or id was taken: start again from the new head.
      if (moved || error instanceof LogConflict) continue;
      throw storeErrorFromWrite(error, `Saving ${options.what}`);
    }
    void askPersistenceOnce();
    return record;
  }
  throw new StoreError('chain-busy', `Other tabs kept saving at the same moment; ${options.what} was not saved. Try again.`);
}

/** One check, or undefined. */
export async function getCheck(id: string): Promise<CheckRecord | undefined> {
  if (typeof id !== 'string') return undefined;
  const tx = (await getDb()).transaction(LOG_STORES);
  const at = (await locateIds(tx, [id])).get(id)?.at;
  if (!at) return undefined;
  const [record] = await readRecords(tx, [{ deviceId: at[0], seq: at[1] }]);
  // Ids are unique across the log; a record of another kind is not a check (getRecord reads those).
  return record && isCheckRecord(record) ? record : undefined;
}

/** Whether a check with this id is stored. */
async function hasCheck(db: IDBPDatabase<TanksideDB>, id: string): Promise<boolean> {
  return (await locateIds(db.transaction(LOG_STORES), [id])).get(id)?.at !== undefined;
}

/** The corrections saved for a check, oldest first (a correction may itself be corrected). */
export async function correctionsOf(checkId: string): Promise<CheckRecord[]> {
  requireUuid('check id', checkId);
  const tx = (await getDb()).transaction(LOG_STORES);
  const by = (await locateIds(tx, [checkId])).get(checkId)?.by ?? [];
  const places = await locateIds(tx, by);
  const refs = by.flatMap((id) => {
    const at = places.get(id)?.at;
    return at ? [{ deviceId: at[0], seq: at[1] }] : [];
  });
  const found = (await readRecords(tx, refs)).filter((r): r is CheckRecord => r !== undefined && isCheckRecord(r));
  return found.sort((a, b) => a.timeMs - b.timeMs || (a.id < b.id ? -1 : 1));
}

function requireLimit(limit: number | undefined): number {
  const n = limit ?? 50;
  if (!Number.isInteger(n) || n < 1 || n > 1000) throw invalid('limit', `${n}; allowed 1 to 1000`);
  return n;
}

function requireCursor(field: string, cursor: CheckCursor): CheckCursor {
  if (typeof cursor !== 'object' || cursor === null || !Number.isFinite(cursor.timeMs) || typeof cursor.id !== 'string') {
    throw invalid(field, 'expected the `next` cursor of a previous page');
  }
  return cursor;
}

/** Options of a listing; see listChecks. */
export interface ListOptions {
  limit?: number;
  /** Newest first (the default) or oldest first. */
  order?: 'newest' | 'oldest';
  /** The previous page's `next`. */
  before?: CheckCursor;
}

/** Which checks a query covers; every part optional. */
export interface CheckFilter {
  vesselId?: string;
  /** Taken at or after. */
  from?: Date;
  /** Taken at or before. */
  to?: Date;
  /** The stored saturation verdict; 'none' for records without one. */
  verdict?: StoredVerdict | 'none';
  /** Checks with this outcome: the most severe signal word among their findings, or 'none'. */
  outcome?: StoredOutcome;
  /** Checks with a finding of this signal word (schema v4 held every caution's words here; since v5, the findings'). */
  signal?: Signal;
  /** Part of the technician's name, any case. */
  technician?: string;
  /** The start of the device id, any case. */
  device?: string;
}

/** A filter as the month buckets answer it: the vessel and time window, and a test of each row's facts. */
export interface LogWindow {
  vesselId: string | null;
  fromMs: number;
  toMs: number;
  match: ((row: MonthRow) => boolean) | undefined;
}

/** The filter as the month buckets answer it. @throws StoreError('invalid-record') naming a bad field */
export function windowOf(filter: CheckFilter): LogWindow {
  if (filter.vesselId !== undefined) requireUuid('vesselId', filter.vesselId);
  const fromMs = filter.from ? filter.from.getTime() : -Infinity;
  const toMs = filter.to ? filter.to.getTime() : Infinity;
  if (Number.isNaN(fromMs)) throw invalid('from', 'expected a valid Date');
  if (Number.isNaN(toMs)) throw invalid('to', 'expected a valid Date');
  const tests: ((row: MonthRow) => boolean)[] = [];
  if (filter.verdict !== undefined) {
    const want = filter.verdict;
    if (want !== 'none' && !(VERDICT_IDS as readonly string[]).includes(want)) {
      throw invalid('verdict', `expected one of ${VERDICT_IDS.join(', ')} or none`);
    }
    tests.push(want === 'none' ? (r) => r[4] === null : (r) => r[4] === want);
  }
  if (filter.outcome !== undefined) {
    const want = filter.outcome;
    if (!OUTCOME_IDS.includes(want)) throw invalid('outcome', `expected one of ${OUTCOME_IDS.join(', ')}`);
    tests.push((r) => outcomeOfMask(r[5]) === want);
  }
  if (filter.signal !== undefined) {
    const bit = 1 << SIGNAL_ORDER.indexOf(filter.signal);
    if (bit < 1) throw invalid('signal', `expected one of ${SIGNAL_ORDER.join(', ')}`);
    tests.push((r) => (r[5] & bit) !== 0);
  }
  const tech = (filter.technician ?? '').trim().toLowerCase();
  if (tech !== '') tests.push((r) => r[6].toLowerCase().includes(tech));
  const device = (filter.device ?? '').trim().toLowerCase();
  if (device !== '') tests.push((r) => r[2].toLowerCase().startsWith(device));
  const match = tests.length === 0 ? undefined : (r: MonthRow) => tests.every((t) => t(r));
  return { vesselId: filter.vesselId ?? null, fromMs, toMs, match };
}

/**
 * A page of the checks a filter covers, newest first unless `order` is 'oldest' (by the instant
 * taken; ties by id). The filter is answered from the month buckets; only the blocks of the page's
 * `limit` (1–1000, default 50) checks are read. Pass the previous page's `next` as `before`.
 * @throws StoreError('invalid-record') naming a bad filter field, limit or cursor
 */
export async function queryChecks(filter: CheckFilter & ListOptions = {}): Promise<CheckPage> {
  const w = windowOf(filter);
  const limit = requireLimit(filter.limit);
  const order = filter.order ?? 'newest';
  if (order !== 'newest' && order !== 'oldest') throw invalid('order', 'expected "newest" or "oldest"');
  const cursor = filter.before === undefined ? undefined : requireCursor('before', filter.before);
  const tx = (await getDb()).transaction(LOG_STORES);
  const { rows, more } = await pageRows(tx, {
    ...w, limit, order,
    ...(order === 'newest' ? { before: cursor } : { after: cursor }),
  });
  const records = await readRecords(tx, rows.map((r) => ({ deviceId: r[2], seq: r[3] })));
  const checks = records.filter((r): r is CheckRecord => r !== undefined && isCheckRecord(r));
  const last = rows[rows.length - 1];
  return { checks, next: more && last ? { timeMs: last[0], id: last[1] } : null };
}

/**
 * A page of the whole log, newest first unless `order` is 'oldest' (by the instant taken; ties by
 * id): queryChecks with no filter.
 */
export async function listChecks(options: ListOptions = {}): Promise<CheckPage> {
  return queryChecks(options);
}

/**
 * A page of one vessel's checks, newest first unless `order` is 'oldest', taken from `from` to
 * `to` inclusive (either open). Pass the previous page's `next` as `before` for the next page.
 */
export async function checksForVessel(
  vesselId: string,
  options: ListOptions & { from?: Date; to?: Date } = {},
): Promise<CheckPage> {
  return queryChecks({ ...options, vesselId });
}

/** How many checks are stored (one vessel's when given). Reads the month buckets, not the checks. */
export async function countStoredChecks(vesselId?: string): Promise<number> {
  if (vesselId !== undefined) requireUuid('vesselId', vesselId);
  return countChecks((await getDb()).transaction(LOG_STORES), vesselId);
}

/**
 * Hashes checks migrated from a schema before v3 (they joined the chain with empty hashes, since
 * WebCrypto cannot run inside the upgrade transaction). Reads their blocks, hashes outside any
 * transaction, then rewrites those blocks in one strict transaction that first re-checks that
 * nothing changed meanwhile. Idempotent; a no-op once done.
 */
export async function sealMigratedChecks(db: IDBPDatabase<TanksideDB>): Promise<void> {
  if ((await db.get('settings', SETTING_SEAL_PENDING)) !== true) return;
  const read = db.transaction(LOG_STORES);
  const pending: LogBlock[] = [];
  for await (const page of blockPages(read)) {
    for (const block of page) if (block.texts.some((t) => t.includes(UNSEALED))) pending.push(block);
  }
  const rewritten: { before: LogBlock; after: LogBlock }[] = [];
  let prev: { deviceId: string; hash: string } | null = null;
  for (const block of pending) {
    const texts: string[] = [];
    for (const text of block.texts) {
      const r = JSON.parse(text) as CheckRecord;
      if (r.hash !== '') {
        texts.push(text);
        prev = { deviceId: r.deviceId, hash: r.hash };
        continue;
      }
      // Migrated checks are the first records of their device's chain, seq 1, 2, 3 ...
      const prevHash: string = prev && prev.deviceId === r.deviceId ? prev.hash : GENESIS_HASH;
      const { hash: _h, ...content } = { ...r, prevHash };
      const hash = await computeCheckHash(content);
      texts.push(canonicalJson({ ...content, hash }));
      prev = { deviceId: r.deviceId, hash };
    }
    rewritten.push({ before: block, after: { ...block, texts } });
  }
  const tx = db.transaction([...LOG_STORES, 'settings'] as const, 'readwrite', STRICT);
  const writeAll = async () => {
    if ((await tx.objectStore('settings').get(SETTING_SEAL_PENDING)) !== true) return;
    for (const { before, after } of rewritten) {
      const current = await tx.objectStore('logBlocks').get([before.deviceId, before.firstSeq]);
      if (!current || current.texts.length !== before.texts.length || current.texts.some((t, i) => t !== before.texts[i])) continue;
      // The one place a saved check is rewritten: filling in the hash a migration could not.
      await tx.objectStore('logBlocks').put(after);
    }
    await tx.objectStore('settings').delete(SETTING_SEAL_PENDING);
  };
  try {
    // Both observed at once, so an abort mid-loop cannot leave tx.done rejected and unheard.
    await Promise.all([writeAll(), tx.done]);
  } catch (error) {
    throw storeErrorFromWrite(error, 'Sealing migrated checks');
  }
}

/** How an unsealed record's text shows its empty hash (canonical JSON, keys sorted). */
const UNSEALED = ',"hash":"",';

setAfterOpen(async (db) => {
  try {
    await sealMigratedChecks(db);
  } catch {
    // Left pending; appendCheck seals first, and the next open tries again.
  }
});
