// The store's one error type. The UI switches on `code`; `field` names the offending field when a
// caller passed a bad value, so the message can point at it (RULES 6).

/** Why a store call failed. */
export type StoreErrorCode =
  | 'unavailable'        // no IndexedDB in this browser (private mode in some engines, very old engines)
  | 'quota-exceeded'     // the device is out of storage for this app; nothing from the failed write was saved
  | 'closed-for-upgrade' // a newer version of the app opened the database in another tab; reload to continue
  | 'blocked'            // an older tab of the app keeps the database from upgrading; close other tabs
  | 'not-found'          // no record with that id
  | 'invalid-record'     // a value passed to the store is not acceptable (field and range in the message)
  | 'append-only'        // an attempt to overwrite or delete a saved check
  | 'chain-busy'         // the device's chain head kept moving under concurrent saves; nothing was saved
  | 'invalid-backup'     // a backup file failed validation; nothing was written
  | 'cancelled'          // the caller's AbortSignal fired; nothing was written
  | 'write-failed';      // the browser refused or aborted a write for another reason; nothing was written

/** A record that made an import refuse its whole file: where it is (device and seq), its id, and why. */
export interface RefusedRecord {
  deviceId: string;
  seq: number;
  /** The record's id; '' when the problem is a missing record (nothing in the file to name). */
  id: string;
  why: string;
}

/** A typed failure from src/store. Nothing was written when one of these is thrown from a write. */
export class StoreError extends Error {
  override readonly name = 'StoreError';
  /** For 'invalid-backup' refused for its records' hashes, links, seqs or signatures: every such record, by device then seq. */
  readonly refused: readonly RefusedRecord[];
  constructor(
    readonly code: StoreErrorCode,
    message: string,
    /** The field a caller got wrong (for 'invalid-record' and 'invalid-backup'), in dotted form. */
    readonly field?: string,
    options?: { cause?: unknown; refused?: readonly RefusedRecord[] },
  ) {
    super(message, options);
    this.refused = options?.refused ?? [];
  }
}

/** True for a quota failure from any engine: Chrome 138+ has a QuotaExceededError class, older engines a DOMException of that name. */
export function isQuotaError(error: unknown): boolean {
  if (typeof error !== 'object' || error === null) return false;
  const name = (error as { name?: unknown }).name;
  if (name === 'QuotaExceededError') return true;
  // A StoreError already mapped, or a wrapped cause.
  if (error instanceof StoreError) return error.code === 'quota-exceeded';
  return false;
}

/**
 * Maps a failed IndexedDB write to a StoreError. A quota abort surfaces only on `tx.done` (the
 * request may even succeed), so callers pass whatever `tx.done` rejected with.
 */
export function storeErrorFromWrite(error: unknown, what: string): StoreError {
  if (error instanceof StoreError) return error;
  if (isQuotaError(error)) {
    return new StoreError(
      'quota-exceeded',
      `${what}: the device has no storage left for Tankside; nothing was saved. Free space or export a backup, then try again.`,
      undefined,
      { cause: error },
    );
  }
  const name = typeof error === 'object' && error !== null ? String((error as { name?: unknown }).name) : '';
  return new StoreError('write-failed', `${what}: the write was refused (${name || String(error)}); nothing was saved.`, undefined, {
    cause: error,
  });
}
