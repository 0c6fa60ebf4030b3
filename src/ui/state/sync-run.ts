// The one runner of plant syncs on this page, loaded on demand with the sync client: one sync at
// a time (SyncRunner), progress and outcome into the shell's sync state, a cancel that stops the
// running one. Every trigger and the Sync screen's "Sync now" come through here.
import { DEFAULT_RETRY, SyncError, SyncRunner, syncNow } from '../../sync/index.ts';

/**
 * While the phone says it is offline one try is enough: backing off for half a minute would only
 * keep "Sync now" busy, and the `online` event starts the next sync.
 */
const OFFLINE_RETRY = { attempts: 1, firstDelayMs: 0, maxDelayMs: 0 } as const;
import { setSyncRun } from './sync-status.ts';

let controller: AbortController | null = null;

const runner = new SyncRunner(
  async () => {
    controller = new AbortController();
    setSyncRun({ state: 'running', step: 'sign-in', done: 0, total: null });
    try {
      const report = await syncNow({
        fetch: (input, init) => fetch(input, init),
        signal: controller.signal,
        retry: navigator.onLine ? DEFAULT_RETRY : OFFLINE_RETRY,
        onProgress: (p) => setSyncRun({ state: 'running', step: p.step, done: p.done, total: p.total }),
      });
      setSyncRun({ state: 'ok', message: report.message });
    } finally {
      controller = null;
    }
  },
  (error) => {
    if (error instanceof SyncError && error.kind === 'cancelled') setSyncRun({ state: 'cancelled', message: error.message });
    else if (error instanceof SyncError) setSyncRun({ state: 'failed', kind: error.kind, message: error.message });
    else setSyncRun({ state: 'failed', kind: 'store', message: error instanceof Error ? error.message : String(error) });
  },
);

/** One sync now, or one more after the running one. */
export function runSync(): Promise<void> {
  return runner.request();
}

export function cancelSync(): void {
  controller?.abort();
}
