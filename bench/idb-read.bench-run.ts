// How fast headless Chromium's IndexedDB gives back a generated log of checks, read the ways the
// store could read it: along an index, in primary key order, and (for comparison only; the store
// does not keep checks this way) as blocks of 100 records' JSON text per value; and what a
// SHA-256 digest per check costs. Prints wall time and the CPU of all browser processes; asserts
// nothing about time. Run: npx vitest run --config bench/vitest.config.ts bench/idb-read.bench-run.ts
// (BENCH_CHECKS sets the log's size, 20,000 unless told).
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { expect, it } from 'vitest';
import { DIST, ROOT, launch, startServer, tempProfile } from '../test/e2e/harness.ts';
import { generatedBackup } from './generated-log.ts';
import { browserCpuS } from './browser-cpu.ts';

const CHECKS = Number(process.env['BENCH_CHECKS'] ?? 20_000);


// Each runs in the page as the body of an async function; `H` holds the helpers defined below.
const WAYS: Record<string, string> = {
  'along by-device-seq, pages of 1000': `
    const ix = (await H.open('tankside')).transaction('checks').objectStore('checks').index('by-device-seq');
    let range, n = 0;
    for (;;) { const b = await H.req(ix.getAll(range, 1000)); n += b.length; if (b.length < 1000) return n;
      const l = b[b.length - 1]; range = IDBKeyRange.lowerBound([l.deviceId, l.seq], true); }`,
  'along by-time, pages of 1000': `
    const ix = (await H.open('tankside')).transaction('checks').objectStore('checks').index('by-time');
    let range, n = 0;
    for (;;) { const b = await H.req(ix.getAll(range, 1000)); n += b.length; if (b.length < 1000) return n;
      const l = b[b.length - 1]; range = IDBKeyRange.lowerBound([l.timeMs, l.id], true); }`,
  'primary key order, pages of 1000': `
    const st = (await H.open('tankside')).transaction('checks').objectStore('checks');
    let range, n = 0;
    for (;;) { const b = await H.req(st.getAll(range, 1000)); n += b.length; if (b.length < 1000) return n;
      range = IDBKeyRange.lowerBound(b[b.length - 1].id, true); }`,
  'primary key order, pages of 5000': `
    const st = (await H.open('tankside')).transaction('checks').objectStore('checks');
    let range, n = 0;
    for (;;) { const b = await H.req(st.getAll(range, 5000)); n += b.length; if (b.length < 5000) return n;
      range = IDBKeyRange.lowerBound(b[b.length - 1].id, true); }`,
  '(setup, not timed as a read) the same checks as blocks of 100 JSON lines': `
    const all = await H.req((await H.open('tankside')).transaction('checks').objectStore('checks').getAll());
    const db = await H.open('bench-blocks', (d) => d.createObjectStore('blocks'));
    const tx = db.transaction('blocks', 'readwrite');
    for (let i = 0; i < all.length; i += 100) tx.objectStore('blocks').put(all.slice(i, i + 100).map((r) => JSON.stringify(r)).join('\\n'), i);
    await new Promise((ok) => (tx.oncomplete = ok));
    db.close();
    return all.length;`,
  'blocks of 100 JSON lines, pages of 10 blocks (text only, not parsed)': `
    const st = (await H.open('bench-blocks')).transaction('blocks').objectStore('blocks');
    let range, n = 0;
    for (;;) { const b = await H.req(st.getAll(range, 10)); for (const t of b) n += t.split('\\n').length;
      if (b.length < 10) return n; const k = await H.req(st.getAllKeys(range, 10)); range = IDBKeyRange.lowerBound(k[k.length - 1], true); }`,
  'SHA-256 of 1.1 KB per check, 256 digests in flight': `
    const text = new TextEncoder().encode('x'.repeat(1100));
    const n = await H.req((await H.open('tankside')).transaction('checks').objectStore('checks').count());
    for (let g = 0; g < n; g += 256) await Promise.all(Array.from({ length: Math.min(256, n - g) }, () => crypto.subtle.digest('SHA-256', text)));
    return n;`,
};

it(`IndexedDB read floor at ${CHECKS.toLocaleString('en-GB')} checks`, async () => {
  const build = spawnSync('npx', ['vite', 'build', '--logLevel', 'warn'], { cwd: ROOT, stdio: 'inherit' });
  expect(build.status).toBe(0);
  const dir = mkdtempSync(join(tmpdir(), 'tankside-bench-'));
  const profile = tempProfile();
  const server = await startServer(DIST);
  const ctx = await launch(profile.dir);
  try {
    const file = join(dir, 'log.json');
    writeFileSync(file, await generatedBackup({
      vessels: 200, checks: CHECKS, vesselPrefix: '5eed0200', stepMs: 365 * 24 * 3_600_000 / CHECKS,
      technicians: ['Gen Adeyemi', 'Gen Berg'], deviceId: 'a0000000-0000-4000-8000-00000000000a',
      startMs: Date.parse('2026-01-01T00:00:00Z'), seed: 1,
    }));
    const page = ctx.pages()[0] ?? (await ctx.newPage());
    page.setDefaultTimeout(300_000);
    await page.goto(`${server.url}#/review`);
    await page.locator('[data-review-state="ready"]').waitFor();
    await page.setInputFiles('#rt-file', file);
    await Promise.all([page.locator('[data-import-result="done"]').waitFor(), page.getByRole('button', { name: 'Import and merge' }).click()]);
    await page.evaluate(() => {
      (globalThis as Record<string, unknown>)['H'] = {
        open: (name: string, create?: (db: IDBDatabase) => void) =>
          new Promise<IDBDatabase>((ok, no) => {
            const r = create ? indexedDB.open(name, 1) : indexedDB.open(name);
            r.onupgradeneeded = () => create?.(r.result);
            r.onsuccess = () => ok(r.result);
            r.onerror = () => no(r.error);
          }),
        req: (r: IDBRequest) => new Promise((ok, no) => { r.onsuccess = () => ok(r.result); r.onerror = () => no(r.error); }),
      };
    });
    console.log(`\nReading ${CHECKS.toLocaleString('en-GB')} generated checks back (headless Chromium; this machine):`);
    for (const [what, body] of Object.entries(WAYS)) {
      const cpu0 = browserCpuS(profile.dir);
      const t0 = Date.now();
      const n = await page.evaluate(`(async () => { ${body} })()`);
      const s = (Date.now() - t0) / 1000;
      const cpu = browserCpuS(profile.dir) - cpu0;
      expect(n).toBe(CHECKS);
      console.log(`  ${what.padEnd(72)} ${s.toFixed(3).padStart(7)} s  (${((s / CHECKS) * 1e6).toFixed(1)} µs/check)  CPU ${cpu.toFixed(2)} s`);
    }
  } finally {
    await ctx.close();
    await server.close();
    profile.remove();
    rmSync(dir, { recursive: true, force: true });
  }
});
