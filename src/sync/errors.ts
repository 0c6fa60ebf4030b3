// The sync client's one error type. The screen shows `message` as it is (plain words) and may
// switch on `kind`; `reason` is the server's own words where it gave any.

/** Why a sync stopped. */
export type SyncErrorKind =
  | 'not-enrolled'  // no server, account or password saved yet
  | 'offline'       // the server could not be reached (no network, server down, proxy down)
  | 'credentials'   // the server refused this device's account name or password
  | 'refused'       // the server refused a write or a read; `reason` holds its words
  | 'chain-differs' // the server's copy of this device's chain is not the one stored here
  | 'server'        // the server answered with an error or something that is not CouchDB's JSON
  | 'cancelled';    // the caller's AbortSignal fired

export class SyncError extends Error {
  override readonly name = 'SyncError';
  constructor(
    readonly kind: SyncErrorKind,
    message: string,
    /** The server's reason, when it gave one. */
    readonly reason?: string,
    /** The HTTP status, when there was an answer. */
    readonly status?: number,
  ) {
    super(message);
  }
}

export function cancelled(): SyncError {
  return new SyncError('cancelled', 'Sync cancelled. What was sent or saved before the cancel stays; the rest goes next time.');
}

export function throwIfCancelled(signal: AbortSignal | undefined): void {
  if (signal?.aborted) throw cancelled();
}
