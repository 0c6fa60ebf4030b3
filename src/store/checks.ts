// The append-only check log. A check is saved once, with `add` (which refuses an existing id), and
// never changed; a correction is a new record pointing at the one it corrects.
import type { IDBPDatabase } from 'idb';
import { getDb, setAfterOpen } from './connection.ts';
import { StoreError, storeErrorFromWrite } from './errors.ts';
import { computeCheckHash } from './integrity.ts';
import {
  GENESIS_HASH,
  type CheckCursor,
  type CheckPage,
  type CheckRecord,
  type NewCheck,
  type StoredCaution,
  type TypedInput,
} from './records.ts';
import { SETTING_SEAL_PENDING, type TanksideDB } from './schema.ts';
import { askPersistenceOnce, deviceId } from './settings.ts';
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
/** How often appendCheck recomputes when another tab moved the chain head under it. */
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

/** The last record of a device's chain, read through `index` (inside whatever transaction holds it). */
async function chainHead(
  index: { openCursor(range: IDBKeyRange, direction: IDBCursorDirection): Promise<{ value: CheckRecord } | null> },
  device: string,
): Promise<{ seq: number; hash: string }> {
  const cursor = await index.openCursor(IDBKeyRange.bound([device, -Infinity], [device, Infinity]), 'prev');
  return cursor ? { seq: cursor.value.seq, hash: cursor.value.hash } : { seq: 0, hash: GENESIS_HASH };
}

/**
 * Saves a check to the log and returns the saved record. The record counts as saved only when this
 * resolves (its transaction committed with strict durability). The hash is computed before the
 * write transaction opens; inside it the chain head is read again and, if another tab moved it,
 * the write is abandoned and redone from the new head.
 * At the first saved check the store asks the browser to persist its data (see persistenceState).
 * @throws StoreError('invalid-record') naming the field; ('not-found') for an unknown vessel or
 *   corrected check; ('quota-exceeded' | 'write-failed' | 'chain-busy') with nothing saved
 */
export async function appendCheck(input: NewCheck): Promise<CheckRecord> {
  requireUuid('vesselId', input.vesselId);
  const technician = requireText('technician', typeof input.technician === 'string' ? input.technician.trim() : input.technician, 1, TEXT_LIMITS.technician);
  const note = requireText('note', input.note ?? '', 0, TEXT_LIMITS.note);
  const inputs = cloneJson(requireInputs('inputs', input.inputs));
  const reading = cloneJson(requireJsonObject('reading', input.reading));
  const result = cloneJson(requireJson('result', input.result));
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
  if (corrects !== null && !(await db.get('checks', corrects))) {
    throw new StoreError('not-found', `No check with id ${corrects} to correct.`, 'corrects');
  }
  const device = await deviceId();
  const time = formatIsoWithOffset(takenAt);
  const base = {
    id: crypto.randomUUID(),
    deviceId: device,
    time,
    // The stamp is to the second; sorting uses the same instant the stamp shows.
    timeMs: Math.floor(takenAt.getTime() / 1000) * 1000,
    technician,
    note,
    vesselId: vessel.id,
    vessel: { tag: vessel.tag, spec: vessel.spec },
    inputs,
    reading,
    result,
    cautions,
    appVersion,
    formulationId,
    corrects,
    reason,
  };

  for (let attempt = 0; attempt < CHAIN_RETRIES; attempt += 1) {
    const head = await chainHead(db.transaction('checks').store.index('by-device-seq'), device);
    const unsigned = { ...base, seq: head.seq + 1, prevHash: head.hash };
    const record: CheckRecord = { ...unsigned, hash: await computeCheckHash(unsigned) };

    const tx = db.transaction('checks', 'readwrite', STRICT);
    const done = tx.done;
    done.catch(() => {}); // observed below; keeps an abort from surfacing as unhandled
    let moved = false;
    try {
      const now = await chainHead(tx.store.index('by-device-seq'), device);
      if (now.seq !== head.seq || now.hash !== head.hash) {
        moved = true;
        tx.abort();
      } else {
        await tx.store.add(record);
      }
      await done;
    } catch (error) {
      if (moved) continue;
      // Another tab took this seq between our read and write: the unique index refused ours.
      if ((error as { name?: unknown }).name === 'ConstraintError') continue;
      throw storeErrorFromWrite(error, 'Saving the check');
    }
    void askPersistenceOnce();
    return record;
  }
  throw new StoreError('chain-busy', 'Other tabs kept saving checks at the same moment; this check was not saved. Try again.');
}

/** One check, or undefined. */
export async function getCheck(id: string): Promise<CheckRecord | undefined> {
  return (await getDb()).get('checks', id);
}

/** The corrections saved for a check, oldest first (a correction may itself be corrected). */
export async function correctionsOf(checkId: string): Promise<CheckRecord[]> {
  requireUuid('check id', checkId);
  const found = await (await getDb()).getAllFromIndex('checks', 'by-corrects', checkId);
  return found.sort((a, b) => a.timeMs - b.timeMs || (a.id < b.id ? -1 : 1));
}

function requireLimit(limit: number | undefined): number {
  const n = limit ?? 50;
  if (!Number.isInteger(n) || n < 1 || n > 1000) throw invalid('limit', `${n}; allowed 1 to 1000`);
  return n;
}

async function page(
  db: IDBPDatabase<TanksideDB>,
  indexName: 'by-time' | 'by-vessel-time',
  range: IDBKeyRange | null,
  limit: number,
): Promise<CheckPage> {
  const checks: CheckRecord[] = [];
  if (!range && indexName === 'by-vessel-time') return { checks, next: null };
  let cursor = await db.transaction('checks').store.index(indexName).openCursor(range, 'prev');
  while (cursor && checks.length < limit) {
    checks.push(cursor.value);
    cursor = await cursor.continue();
  }
  const last = checks[checks.length - 1];
  return { checks, next: cursor && last ? { timeMs: last.timeMs, id: last.id } : null };
}

function requireCursor(before: CheckCursor): CheckCursor {
  if (typeof before !== 'object' || before === null || !Number.isFinite(before.timeMs) || typeof before.id !== 'string') {
    throw invalid('before', 'expected the `next` cursor of a previous page');
  }
  return before;
}

/**
 * A page of the whole log, newest first (by the instant taken; ties by id). Walks the by-time
 * index with a cursor: only `limit` records (1–1000, default 50) are read.
 */
export async function listChecks(options: { limit?: number; before?: CheckCursor } = {}): Promise<CheckPage> {
  const limit = requireLimit(options.limit);
  const range = options.before
    ? IDBKeyRange.upperBound([requireCursor(options.before).timeMs, options.before.id], true)
    : null;
  return page(await getDb(), 'by-time', range, limit);
}

/**
 * A page of one vessel's checks, newest first, taken from `from` to `to` inclusive (either open).
 * Pass the previous page's `next` as `before` for the next page.
 */
export async function checksForVessel(
  vesselId: string,
  options: { from?: Date; to?: Date; limit?: number; before?: CheckCursor } = {},
): Promise<CheckPage> {
  requireUuid('vesselId', vesselId);
  const limit = requireLimit(options.limit);
  const fromMs = options.from ? options.from.getTime() : -Infinity;
  const toMs = options.to ? options.to.getTime() : Infinity;
  if (Number.isNaN(fromMs)) throw invalid('from', 'expected a valid Date');
  if (Number.isNaN(toMs)) throw invalid('to', 'expected a valid Date');
  // Key order: a shorter array before a longer one with the same start; any array after any string.
  let upper: unknown[] = [vesselId, toMs, []];
  let upperOpen = false;
  if (options.before) {
    const b = requireCursor(options.before);
    if (b.timeMs <= toMs) {
      upper = [vesselId, b.timeMs, b.id];
      upperOpen = true;
    }
  }
  const lower = [vesselId, fromMs];
  if (indexedDB.cmp(lower, upper) > 0) return { checks: [], next: null };
  return page(await getDb(), 'by-vessel-time', IDBKeyRange.bound(lower, upper, false, upperOpen), limit);
}

/**
 * Hashes checks migrated from a schema before v3 (they joined the chain with empty hashes, since
 * WebCrypto cannot run inside the upgrade transaction). Reads them, hashes outside any transaction,
 * then writes all hashes in one strict transaction that first re-checks nothing changed meanwhile.
 * Idempotent; a no-op once done.
 */
export async function sealMigratedChecks(db: IDBPDatabase<TanksideDB>): Promise<void> {
  if ((await db.get('settings', SETTING_SEAL_PENDING)) !== true) return;
  const pending = (await db.getAllFromIndex('checks', 'by-device-seq')).filter((r) => r.hash === '');
  pending.sort((a, b) => (a.deviceId < b.deviceId ? -1 : a.deviceId > b.deviceId ? 1 : a.seq - b.seq));
  const sealed: CheckRecord[] = [];
  let prev: { deviceId: string; hash: string } | null = null;
  for (const r of pending) {
    // Migrated checks are the first records of their device's chain, seq 1, 2, 3 ...
    const prevHash: string = prev && prev.deviceId === r.deviceId ? prev.hash : GENESIS_HASH;
    const unsigned = { ...r, prevHash };
    const { hash: _h, ...content } = unsigned;
    const hash = await computeCheckHash(content);
    sealed.push({ ...unsigned, hash });
    prev = { deviceId: r.deviceId, hash };
  }
  const tx = db.transaction(['checks', 'settings'], 'readwrite', STRICT);
  const writeAll = async () => {
    if ((await tx.objectStore('settings').get(SETTING_SEAL_PENDING)) !== true) return;
    for (const r of sealed) {
      const current = await tx.objectStore('checks').get(r.id);
      if (!current || current.hash !== '') continue;
      // The one place a saved check is rewritten: filling in the hash a migration could not.
      await tx.objectStore('checks').put(r);
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

setAfterOpen(async (db) => {
  try {
    await sealMigratedChecks(db);
  } catch {
    // Left pending; appendCheck seals first, and the next open tries again.
  }
});
