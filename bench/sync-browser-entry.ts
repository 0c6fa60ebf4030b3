// The script sync-browser.bench-run.ts bundles and runs in a page behind the nginx site (so /db/ is
// on the page's own origin, as deployed): a device's push of its whole log and a supervisor's first
// pull, through the app's own sync client into the app's own store (Chromium's IndexedDB), with
// the time spent waiting on the server's answers counted apart.
import { closeStore, countStoredChecks, openStore } from '../src/store/index.ts';
import { importBackup } from '../src/store/transfer.ts';
import { getDb } from '../src/store/connection.ts';
import { enrol, syncNow } from '../src/sync/index.ts';

interface Run {
  dbName: string;
  deviceId: string;
  password: string;
  role: 'technician' | 'supervisor';
}

/** A fetch that adds up the time from each request to its whole body read. */
function timedFetch(): { fetch: typeof fetch; waitedMs: () => number; requests: () => number; bytes: () => number } {
  let waited = 0;
  let count = 0;
  let bytes = 0;
  return {
    fetch: async (input, init) => {
      const t0 = performance.now();
      const r = await fetch(input, init);
      const body = await r.arrayBuffer();
      waited += performance.now() - t0;
      count += 1;
      bytes += body.byteLength;
      return new Response(body, { status: r.status, statusText: r.statusText, headers: r.headers });
    },
    waitedMs: () => waited,
    requests: () => count,
    bytes: () => bytes,
  };
}

async function open(run: Run): Promise<void> {
  closeStore();
  await openStore({ name: run.dbName });
  // The account is named by the device id; the bench's generated log is that device's own.
  await (await getDb()).put('settings', run.deviceId, 'store:deviceId');
  await enrol({ server: '/db/', account: run.deviceId, password: run.password, role: run.role });
}

/** Imports the generated log at `seedUrl` as this device's own, then times one sync (the push). */
export async function push(run: Run, seedUrl: string): Promise<Record<string, number>> {
  await open(run);
  const t0 = performance.now();
  await importBackup(await (await fetch(seedUrl)).text());
  const seedMs = performance.now() - t0;
  const f = timedFetch();
  const t1 = performance.now();
  const report = await syncNow({ fetch: f.fetch, deviceKeyText: null });
  return { seedMs, syncMs: performance.now() - t1, waitedMs: f.waitedMs(), requests: f.requests(), bytes: f.bytes(), pushed: report.push.pushed };
}

/** Times a supervisor's first sync (its pull of every device's checks) into an empty store. */
export async function pull(run: Run, batch?: number): Promise<Record<string, number>> {
  await open(run);
  const f = timedFetch();
  const t0 = performance.now();
  const report = await syncNow({ fetch: f.fetch, ...(batch ? { pullBatch: batch } : {}) });
  const syncMs = performance.now() - t0;
  return {
    syncMs, waitedMs: f.waitedMs(), requests: f.requests(), bytes: f.bytes(),
    added: report.checks!.added.length, refused: report.checks!.refused.length, gaps: report.checks!.gaps.length,
    stored: await countStoredChecks(),
  };
}
