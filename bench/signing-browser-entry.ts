// The script signing.bench-run.ts bundles and runs in a page served from 127.0.0.1 (IndexedDB needs
// an origin): the cost of a chain-head signature, of verifying one, and of a whole save with it.
import { addVessel, appendCheck, closeStore, openStore } from '../src/store/index.ts';
import { benchCheck } from './bench-check.ts';
import { inventedSpec } from './generated-log.ts';
import { getDb } from '../src/store/connection.ts';
import { deviceSigningKey, signChainHead } from '../src/store/signing.ts';
import { verifyChainHead } from '../src/store/signatures.ts';

const HASH = 'ab'.repeat(32);
const DEVICE = '6b1e0d2a-3c4f-4a5b-8c6d-7e8f90a1b2c3';

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[s.length >> 1]!;
}

/** Calls per timed run: the page's clock ticks in 100 µs steps (no cross-origin isolation), so one call alone cannot be timed. */
const RUN = 25;

/**
 * µs per call: median and fastest over runs of RUN calls, each call awaited before the next (as a
 * save awaits its one signature), `n` calls in all after a warm-up.
 */
async function each(n: number, call: (i: number) => Promise<unknown>): Promise<{ median: number; fastest: number }> {
  for (let i = 0; i < 20; i += 1) await call(i);
  const per: number[] = [];
  for (let done = 0; done < n; done += RUN) {
    const t0 = performance.now();
    for (let k = 0; k < RUN; k += 1) await call(done + k);
    per.push(((performance.now() - t0) * 1000) / RUN);
  }
  return { median: median(per), fastest: Math.min(...per) };
}

export async function measure(n: number): Promise<Record<string, { median: number; fastest: number }>> {
  await openStore({ name: `signing-bench-${Date.now()}` });
  const db = await getDb();
  const key = (await deviceSigningKey(db))!;
  const sign = await each(n, (i) => signChainHead(key, DEVICE, i + 1, HASH));
  const signature = await signChainHead(key, DEVICE, 1, HASH);
  const verify = await each(n, () => verifyChainHead(key.publicKey, DEVICE, { id: '', seq: 1, hash: HASH, signature }));
  const vessel = await addVessel({ tag: 'BENCH-1', description: 'benchmark vessel (invented)', spec: inventedSpec('BENCH-1', 2, 500) });
  const save = await each(Math.min(n, 200), (i) => appendCheck({
    ...benchCheck(vessel.id, { note: `save ${i}`, appVersion: 'bench' }),
  }));
  await closeStore();
  return { sign, verify, save };
}
