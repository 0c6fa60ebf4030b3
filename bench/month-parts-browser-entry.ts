// The script month-parts.bench-run.ts bundles and runs in a page served from 127.0.0.1: the cost of
// a save into a vessel's month that already holds many checks, with the month split into parts
// (schema v5), beside what v4 did for the same save: read and write back the whole month's value.
import { addVessel, appendCheck, closeStore, openStore } from '../src/store/index.ts';
import { benchCheck } from './bench-check.ts';
import { importBackup } from '../src/store/transfer.ts';
import { getDb } from '../src/store/connection.ts';

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[s.length >> 1]!;
}

const RUN = 10;

/** µs per call over runs of RUN awaited calls (the page's clock ticks in 100 µs steps). */
async function each(n: number, call: (i: number) => Promise<unknown>): Promise<{ median: number; fastest: number }> {
  for (let i = 0; i < 5; i += 1) await call(i);
  const per: number[] = [];
  for (let done = 0; done < n; done += RUN) {
    const t0 = performance.now();
    for (let k = 0; k < RUN; k += 1) await call(done + k);
    per.push(((performance.now() - t0) * 1000) / RUN);
  }
  return { median: median(per), fastest: Math.min(...per) };
}

export async function measure(backup: string, vesselId: string, monthMs: number, n: number): Promise<Record<string, { median: number; fastest: number } | number>> {
  await openStore({ name: `month-bench-${Date.now()}` });
  await importBackup(backup);
  const db = await getDb();
  const parts = (await db.getAll('logMonthParts')).filter((p) => p.vesselId === vesselId).map((p) => p.rows.length);
  const save = await each(n, (i) => appendCheck({
    ...benchCheck(vesselId, { note: `save ${i}`, appVersion: 'bench', takenAt: new Date(monthMs + 20 * 86_400_000 + i * 1000) }),
  }));
  // What v4 added to every save into this month: its one value read and written back whole.
  const all = (await db.getAll('logMonthParts')).filter((p) => p.vesselId === vesselId).flatMap((p) => p.rows);
  const scratch = await new Promise<IDBDatabase>((ok) => {
    const r = indexedDB.open(`month-bench-v4-${Date.now()}`, 1);
    r.onupgradeneeded = () => r.result.createObjectStore('logMonths', { keyPath: ['vesselId', 'monthMs'] });
    r.onsuccess = () => ok(r.result);
  });
  const bucket = { vesselId, monthMs, rows: all };
  const whole = await each(n, () => new Promise<void>((ok, no) => {
    const tx = scratch.transaction('logMonths', 'readwrite', { durability: 'strict' });
    const store = tx.objectStore('logMonths');
    const get = store.get([vesselId, monthMs]);
    get.onsuccess = () => {
      const b = (get.result as typeof bucket | undefined) ?? bucket;
      store.put({ ...b, rows: b.rows });
    };
    tx.oncomplete = () => ok();
    tx.onerror = () => no(tx.error);
  }));
  scratch.close();
  await closeStore();
  return { save, whole, rows: all.length, parts: parts.length, largestPart: Math.max(...parts) };
}
