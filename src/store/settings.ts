// Settings, drafts, the device id and the persistence request.
import { getDb } from './connection.ts';
import { StoreError, storeErrorFromWrite } from './errors.ts';
import type { IsoDateTime, JsonValue } from './records.ts';
import { RESERVED_SETTING_PREFIX, SETTING_DEVICE_ID, SETTING_LAST_BACKUP, SETTING_PERSISTENCE, SETTING_SYNC } from './schema.ts';
import { formatIsoWithOffset } from './time.ts';
import { requireJson, requireText } from './validate.ts';

const STRICT = { durability: 'strict' } as const;

function requireSettingKey(key: string): void {
  requireText('setting key', key, 1, 100);
  if (key.startsWith(RESERVED_SETTING_PREFIX)) {
    throw new StoreError('invalid-record', `setting key: "${key}" is reserved for the store`, 'setting key');
  }
}

/** Reads one setting (technician name, preferred units ...), or undefined if never saved. */
export async function getSetting(key: string): Promise<JsonValue | undefined> {
  requireSettingKey(key);
  // Keys outside "store:" hold only what putSetting wrote, which is plain JSON.
  return (await getDb()).get('settings', key) as Promise<JsonValue | undefined>;
}

/**
 * Saves one setting as plain JSON. Keys are 1–100 characters and may not start with "store:".
 * @throws StoreError('invalid-record' | 'quota-exceeded' | 'write-failed')
 */
export async function putSetting(key: string, value: JsonValue): Promise<void> {
  requireSettingKey(key);
  requireJson(`setting ${key}`, value);
  const db = await getDb();
  const tx = db.transaction('settings', 'readwrite', STRICT);
  try {
    await Promise.all([tx.store.put(value, key), tx.done]);
  } catch (error) {
    throw storeErrorFromWrite(error, `Saving setting ${key}`);
  }
}

// Drafts are mirrored in localStorage as well, written synchronously before the IndexedDB write is
// issued. A transaction whose commit was asked for can still be aborted when the page goes away
// before the browser's database thread has run it (seen under heavy load: a close straight after
// the last keystrokes lost the last two fields), while a localStorage write is in the browser's
// hands once the call returns and is flushed at an orderly shutdown. The mirror is only ever the
// newest copy: it is removed (not left stale) whenever its write fails or the IndexedDB draft is
// deleted, so a mirror that is present always wins over the IndexedDB draft.
const MIRROR_PREFIX = 'tankside.draft.';
/** What a discarded draft leaves in the mirror, so an IndexedDB delete cut short cannot bring it back. */
const DISCARDED = 'discarded';

type StoredDraft = { value: JsonValue; savedAt: IsoDateTime };

function mirror(): Storage | undefined {
  try {
    return typeof localStorage === 'undefined' ? undefined : localStorage;
  } catch {
    return undefined; // a browser that refuses storage access throws on reading the property
  }
}

function writeMirror(key: string, text: string | undefined): void {
  const m = mirror();
  if (!m) return;
  try {
    if (text === undefined) m.removeItem(MIRROR_PREFIX + key);
    else m.setItem(MIRROR_PREFIX + key, text);
  } catch {
    try { m.removeItem(MIRROR_PREFIX + key); } catch { /* the IndexedDB copy stands alone */ }
  }
}

function readMirror(key: string): StoredDraft | 'discarded' | undefined {
  let text: string | null | undefined;
  try { text = mirror()?.getItem(MIRROR_PREFIX + key); } catch { return undefined; }
  if (text === null || text === undefined) return undefined;
  if (text === DISCARDED) return 'discarded';
  try {
    const parsed = JSON.parse(text) as StoredDraft;
    return parsed && typeof parsed === 'object' && 'value' in parsed && typeof parsed.savedAt === 'string' ? parsed : undefined;
  } catch {
    return undefined;
  }
}

/**
 * Forgets the mirror of `key` at once: called as a save that deletes the draft in its own
 * transaction opens. Should that transaction not commit, the IndexedDB draft is still there.
 */
export function dropDraftMirror(key: string): void {
  writeMirror(key, undefined);
}

/**
 * Saves a draft under `key` (e.g. "new-check"), replacing the previous one. Call it as the user
 * types: drafts live in IndexedDB, so they survive a reload, a closed tab and an app update. Once
 * the store is open, the write is issued and its commit asked for within the task that calls this
 * (only microtasks come between), so a page closed straight after still has it written; the
 * localStorage mirror is written before this returns its promise.
 * @throws StoreError('invalid-record' | 'quota-exceeded' | 'write-failed')
 */
export async function saveDraft(key: string, value: JsonValue): Promise<void> {
  requireText('draft key', key, 1, 100);
  requireJson(`draft ${key}`, value);
  const stored: StoredDraft = { value, savedAt: formatIsoWithOffset(new Date(), undefined, true) };
  writeMirror(key, JSON.stringify(stored));
  const db = await getDb();
  const tx = db.transaction('drafts', 'readwrite', STRICT);
  try {
    const put = tx.store.put(stored, key);
    // Without this the commit waits for the put's success event to come back to this page: a
    // page closed in between loses the write (an uncommitted transaction is aborted with it).
    tx.commit();
    await Promise.all([put, tx.done]);
  } catch (error) {
    throw storeErrorFromWrite(error, 'Saving the draft');
  }
}

/** The draft saved under `key`, with when it was saved, or undefined. */
export async function loadDraft(key: string): Promise<StoredDraft | undefined> {
  requireText('draft key', key, 1, 100);
  const mirrored = readMirror(key);
  const stored = await (await getDb()).get('drafts', key);
  if (mirrored === 'discarded') return undefined;
  return mirrored ?? stored;
}

/** Removes the draft under `key` (after the check it held was saved, or the user discarded it). */
export async function clearDraft(key: string): Promise<void> {
  requireText('draft key', key, 1, 100);
  writeMirror(key, DISCARDED);
  const db = await getDb();
  const tx = db.transaction('drafts', 'readwrite', STRICT);
  try {
    await Promise.all([tx.store.delete(key), tx.done]);
  } catch (error) {
    throw storeErrorFromWrite(error, 'Clearing the draft');
  }
}

/**
 * The plant server this device is enrolled with, as saved at enrolment (an absolute URL or a path
 * on the app's own origin), or null while plant sync is off. On the everyday surface, so the shell
 * can say where checks go without loading the sync client (sync-log.ts keeps the whole state).
 */
export async function syncServer(): Promise<string | null> {
  const stored = await (await getDb()).get('settings', SETTING_SYNC);
  const server = typeof stored === 'object' && stored !== null && !Array.isArray(stored) ? (stored as { server?: unknown }).server : null;
  return typeof server === 'string' && server !== '' ? server : null;
}

/** This install's device id (a UUID made on first use), which every check it saves carries. */
export async function deviceId(): Promise<string> {
  const db = await getDb();
  const existing = await db.get('settings', SETTING_DEVICE_ID);
  if (typeof existing === 'string') return existing;
  const tx = db.transaction('settings', 'readwrite', STRICT);
  const write = async () => {
    // Re-read inside the write: another tab may have made one meanwhile.
    const again = await tx.store.get(SETTING_DEVICE_ID);
    if (typeof again === 'string') return again;
    const made = crypto.randomUUID();
    await tx.store.put(made, SETTING_DEVICE_ID);
    return made;
  };
  let id: string;
  try {
    [id] = await Promise.all([write(), tx.done]);
  } catch (error) {
    throw storeErrorFromWrite(error, 'Saving the device id');
  }
  return id;
}

/**
 * Whether the browser keeps Tankside's data until the user clears it:
 * 'persisted' (granted), 'best-effort' (asked; the browser may evict under storage pressure),
 * 'not-asked' (no check saved yet), 'unsupported' (no StorageManager here).
 */
export interface PersistenceState {
  state: 'persisted' | 'best-effort' | 'not-asked' | 'unsupported';
  askedAt: IsoDateTime | null;
}

function storageManager(): StorageManager | null {
  const nav = (globalThis as { navigator?: Navigator }).navigator;
  return nav?.storage && typeof nav.storage.persist === 'function' ? nav.storage : null;
}

/**
 * Asks the browser to keep Tankside's data (navigator.storage.persist()) and records when. Firefox
 * may show a prompt; Chrome and Safari decide silently. The store calls it at the first saved check.
 */
export async function requestPersistence(): Promise<PersistenceState> {
  const manager = storageManager();
  if (!manager) return { state: 'unsupported', askedAt: null };
  let granted = false;
  try {
    granted = await manager.persist();
  } catch {
    granted = false;
  }
  const askedAt = formatIsoWithOffset(new Date());
  const db = await getDb();
  const tx = db.transaction('settings', 'readwrite', STRICT);
  try {
    await Promise.all([tx.store.put({ askedAt, granted }, SETTING_PERSISTENCE), tx.done]);
  } catch {
    // Only the record of asking was lost; the browser keeps its own answer.
  }
  return { state: granted ? 'persisted' : 'best-effort', askedAt };
}

/** The current persistence state, for Settings. Reads the browser's live answer where it can. */
export async function persistenceState(): Promise<PersistenceState> {
  const manager = storageManager();
  if (!manager) return { state: 'unsupported', askedAt: null };
  const asked = (await (await getDb()).get('settings', SETTING_PERSISTENCE)) as { askedAt?: unknown } | undefined;
  const askedAt = typeof asked?.askedAt === 'string' ? asked.askedAt : null;
  let persisted = false;
  try {
    persisted = typeof manager.persisted === 'function' ? await manager.persisted() : false;
  } catch {
    persisted = false;
  }
  if (persisted) return { state: 'persisted', askedAt };
  return { state: askedAt ? 'best-effort' : 'not-asked', askedAt };
}

let firstAsk: Promise<PersistenceState> | null = null;

/** Asks once per install (and at most once per page), at the first saved check. Never throws. */
export function askPersistenceOnce(): Promise<PersistenceState | null> {
  if (!firstAsk) {
    firstAsk = (async () => {
      const asked = await (await getDb()).get('settings', SETTING_PERSISTENCE);
      if (asked !== undefined) return persistenceState();
      return requestPersistence();
    })();
    firstAsk.catch(() => {
      firstAsk = null;
    });
  }
  return firstAsk.catch(() => null);
}

/** Forgets the once-per-page memo (tests open fresh databases). */
export function resetPersistenceMemo(): void {
  firstAsk = null;
}

/** When the log last left this device whole: exported as a backup file, or consolidated at the plant. */
export interface BackupState {
  /** The last backup export, ISO 8601 with offset; null if never. */
  exportedAt: IsoDateTime | null;
  /** The last plant-wide consolidation (written by the sync work when it lands); null if never. */
  consolidatedAt: IsoDateTime | null;
}

/** When the log was last exported and last consolidated. */
export async function backupState(): Promise<BackupState> {
  return backupStateIn((await getDb()).get('settings', SETTING_LAST_BACKUP));
}

export async function backupStateIn(stored: Promise<unknown>): Promise<BackupState> {
  const v = (await stored) as Partial<Record<keyof BackupState, unknown>> | undefined;
  const at = (x: unknown) => (typeof x === 'string' ? x : null);
  return { exportedAt: at(v?.exportedAt), consolidatedAt: at(v?.consolidatedAt) };
}

/** How much the browser says this app stores and may store, in bytes (navigator.storage.estimate()); null where it does not say. */
export async function storageUsage(): Promise<{ usageBytes: number | null; quotaBytes: number | null }> {
  const manager = storageManager();
  if (!manager || typeof manager.estimate !== 'function') return { usageBytes: null, quotaBytes: null };
  try {
    const e = await manager.estimate();
    return { usageBytes: e.usage ?? null, quotaBytes: e.quota ?? null };
  } catch {
    return { usageBytes: null, quotaBytes: null };
  }
}
