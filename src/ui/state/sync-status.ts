// Plant sync as the shell sees it, in the start-up chunk and small: whether sync is on (the
// server this device is enrolled with), the current run (for the Sync screen's progress and the
// footer), and the triggers: on launch, on `online`, and after each save while online (debounced).
// The sync client itself (src/sync, with the store's transfer surface) loads on demand, the first
// time a sync runs (sync-run.ts); a save never waits for it.
import * as repo from './repo.ts';
import { shared, useShared } from './observable.ts';

/** Which part of a sync is running (the client's SyncStep, named here so this chunk does not load it). */
export type SyncStepName = 'sign-in' | 'push' | 'publish' | 'pull-plant' | 'pull-checks';

/** The current or last run of this page. */
export type SyncRun =
  | { state: 'idle' }
  | { state: 'running'; step: SyncStepName; done: number; total: number | null }
  | { state: 'ok'; message: string }
  | { state: 'failed'; kind: string; message: string }
  | { state: 'cancelled'; message: string };

const serverState = shared<string | null>(null);
const runState = shared<SyncRun>({ state: 'idle' });

/**
 * A save starts a sync this long after it (one for a burst of saves). Our own choice, not a measured
 * or published figure: long enough for a technician saving several checks in a row, short enough
 * that the supervisors' server hears within seconds.
 */
export const SAVE_DEBOUNCE_MS = 3_000;

/** The server this device syncs with; null while sync is off. */
export function useSyncServer(): string | null {
  return useShared(serverState);
}

export function useSyncRun(): SyncRun {
  return useShared(runState);
}

/** For the runner (sync-run.ts): the run's state as it goes. */
export function setSyncRun(run: SyncRun): void {
  runState.set(run);
}

/** For enrolment and leaving sync: the shell's idea of where checks go. */
export function setSyncServer(server: string | null): void {
  serverState.set(server);
}

/**
 * Where checks go, in words for the footer and the panels: the host and path of the server
 * (a path on the app's own origin, such as "/db/", with this origin's host).
 */
export function serverLabel(server: string, origin: string = location.origin): string {
  try {
    const url = new URL(server, origin);
    return `${url.host}${url.pathname}`;
  } catch {
    return server;
  }
}

let runner: Promise<typeof import('./sync-run.ts')> | null = null;
function loadRunner(): Promise<typeof import('./sync-run.ts')> {
  return (runner ??= import('./sync-run.ts'));
}

/** Starts a sync (or one more after the one running); resolves when none is pending. Never throws. */
export async function requestSync(): Promise<void> {
  if (serverState.get() === null) return;
  try {
    await (await loadRunner()).runSync();
  } catch (e) {
    runState.set({ state: 'failed', kind: 'load', message: `The sync client could not be loaded (${repo.storageMessage(e)}). Reload the app to try again; nothing saved is affected.` });
  }
}

/** Cancels the running sync, if any. */
export function cancelSync(): void {
  if (runner) void runner.then((r) => r.cancelSync());
}

let saveTimer: ReturnType<typeof setTimeout> | undefined;

/** Reads whether sync is on, then starts the triggers: now (launch), on `online`, after each save. */
export async function startSyncTriggers(): Promise<void> {
  serverState.set(await repo.syncServer());
  window.addEventListener('online', () => void requestSync());
  repo.onCheckSaved(() => {
    if (serverState.get() === null || !navigator.onLine) return;
    clearTimeout(saveTimer);
    saveTimer = setTimeout(() => void requestSync(), SAVE_DEBOUNCE_MS);
  });
  if (navigator.onLine) void requestSync();
}
