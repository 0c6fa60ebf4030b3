// The one connection to the database. Every repository function asks for it through getDb(), so
// the app never holds an IDB handle and a connection lost to an upgrade or a crash is handled here.
import { openDB, type IDBPDatabase } from 'idb';
import { DB_NAME, DB_VERSION, upgradeSchema, type TanksideDB } from './schema.ts';
import { StoreError } from './errors.ts';

/** What the store tells the app about the connection. */
export type StoreEvent =
  /** An older tab keeps the database from upgrading: ask the user to close other Tankside tabs. */
  | { type: 'blocked' }
  /** A newer version of the app wants the database: this connection closed; ask the user to reload. */
  | { type: 'closed-for-upgrade' }
  /** The browser dropped the connection (e.g. Safari's storage process died); the next call reopens. */
  | { type: 'terminated' };

/** Options for openStore. */
export interface OpenStoreOptions {
  /** Database name; tests give each case its own. Default "tankside". */
  name?: string;
  /** Receives connection events (see StoreEvent). */
  onEvent?: (event: StoreEvent) => void;
}

let options: OpenStoreOptions = {};
let connection: Promise<IDBPDatabase<TanksideDB>> | null = null;
let closedForUpgrade = false;
let afterOpen: ((db: IDBPDatabase<TanksideDB>) => Promise<void>) | null = null;

/** Lets db-level housekeeping (sealing migrated checks) run once after each open. */
export function setAfterOpen(hook: (db: IDBPDatabase<TanksideDB>) => Promise<void>): void {
  afterOpen = hook;
}

function emit(event: StoreEvent): void {
  try {
    options.onEvent?.(event);
  } catch {
    // A listener's bug must not break the store.
  }
}

function open(): Promise<IDBPDatabase<TanksideDB>> {
  if (typeof indexedDB === 'undefined') {
    return Promise.reject(new StoreError('unavailable', 'This browser offers no IndexedDB storage; Tankside cannot save here.'));
  }
  const name = options.name ?? DB_NAME;
  const opening = openDB<TanksideDB>(name, DB_VERSION, {
    upgrade(db, oldVersion, _newVersion, tx) {
      try {
        upgradeSchema(db, oldVersion, tx);
      } catch (error) {
        // idb drops upgrade()'s failures; abort so a half-done rung never commits.
        tx.abort();
        throw error;
      }
    },
    blocked() {
      emit({ type: 'blocked' });
    },
    blocking() {
      // Running transactions still finish after close(); drafts are saved as the user types, so
      // nothing in memory is lost. The app asks the user to reload into the new version.
      closedForUpgrade = true;
      void opening.then((db) => db.close());
      connection = null;
      emit({ type: 'closed-for-upgrade' });
    },
    terminated() {
      connection = null;
      emit({ type: 'terminated' });
    },
  });
  return opening.then(async (db) => {
    if (afterOpen) await afterOpen(db);
    return db;
  });
}

/**
 * Opens the database (once) and runs pending migrations. Call it at start-up; every other store
 * function also opens on first use with the options given here.
 * @throws StoreError('unavailable' | 'write-failed') if the database cannot be opened
 */
export async function openStore(opts: OpenStoreOptions = {}): Promise<void> {
  options = opts;
  closedForUpgrade = false;
  await connect();
}

/** The name of the database the store opens (a worker doing the store's work opens the same). */
export function storeName(): string {
  return options.name ?? DB_NAME;
}

/** Closes the connection (tests, or before deleting data). The next call reopens. */
export async function closeStore(): Promise<void> {
  const current = connection;
  connection = null;
  if (current) (await current.catch(() => null))?.close();
}

/** The open database, opening it if needed. */
export async function getDb(): Promise<IDBPDatabase<TanksideDB>> {
  const db = await connect();
  try {
    // A connection the browser closed without a close event (a page restored from the back/forward
    // cache, Safari's storage process restarting) throws InvalidStateError on transaction(): probe
    // with an unused read-only transaction (it commits empty) and reopen once if so.
    db.transaction('settings');
    return db;
  } catch (error) {
    if ((error as { name?: unknown }).name !== 'InvalidStateError') throw error;
    connection = null;
    return connect();
  }
}

function connect(): Promise<IDBPDatabase<TanksideDB>> {
  if (closedForUpgrade) {
    return Promise.reject(
      new StoreError('closed-for-upgrade', 'A newer version of Tankside is open in another tab. Reload this page to continue.'),
    );
  }
  if (!connection) {
    const attempt = open();
    connection = attempt;
    attempt.catch(() => {
      if (connection === attempt) connection = null;
    });
  }
  return connection;
}
