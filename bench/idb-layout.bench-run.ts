// How the layout of the check log in IndexedDB decides the cost of the long jobs, measured in
// headless Chromium on generated checks: writing them (as the import does, one strict transaction,
// requests in windows of 1000) and reading them back (as export and verification do), for
//   A. one structured record per check with four indexes (schema v3),
//   B. one row per check holding the record's canonical JSON text beside its index fields,
//   C. rows of index fields only, plus blocks of 100 records' texts per value.
// Prints wall time and the CPU of all browser processes; asserts nothing about time.
// Run: npx vitest run --config bench/vitest.config.ts bench/idb-layout.bench-run.ts (BENCH_CHECKS, 20,000 unless told).
import { expect, it } from 'vitest';
import { DIST, launch, startServer, tempProfile } from '../test/e2e/harness.ts';
import { generatedBackup } from './generated-log.ts';
import { browserCpuS } from './browser-cpu.ts';
import { spawnSync } from 'node:child_process';
import { ROOT } from '../test/e2e/harness.ts';

const CHECKS = Number(process.env['BENCH_CHECKS'] ?? 20_000);

const SETUP = `
  const H = globalThis.H = {};
  H.open = (name, create) => new Promise((ok, no) => { const r = indexedDB.open(name, 1);
    r.onupgradeneeded = () => create(r.result); r.onsuccess = () => ok(r.result); r.onerror = () => no(r.error); });
  H.req = (r) => new Promise((ok, no) => { r.onsuccess = () => ok(r.result); r.onerror = () => no(r.error); });
  H.indexes = (s) => { s.createIndex('by-vessel-time', ['vesselId', 'timeMs', 'id']); s.createIndex('by-time', ['timeMs', 'id']);
    s.createIndex('by-device-seq', ['deviceId', 'seq'], { unique: true }); s.createIndex('by-corrects', 'corrects'); };
  H.write = (db, stores, items) => new Promise((ok, no) => {
    const tx = db.transaction(stores, 'readwrite', { durability: 'strict' });
    tx.oncomplete = ok; tx.onabort = () => no(tx.error);
    const issue = (from) => { const to = Math.min(items.length, from + 1000); let r;
      for (let i = from; i < to; i++) { const [s, v, k] = items[i]; r = k === undefined ? tx.objectStore(s).add(v) : tx.objectStore(s).add(v, k); }
      if (r && to < items.length) r.onsuccess = () => issue(to); };
    issue(0); });
  H.slim = (r) => ({ id: r.id, vesselId: r.vesselId, timeMs: r.timeMs, deviceId: r.deviceId, seq: r.seq, corrects: r.corrects });
`;

const STEPS: [string, string][] = [
  ['A write: structured record per check, 4 indexes', `
    const db = await H.open('a', (d) => H.indexes(d.createObjectStore('checks', { keyPath: 'id' })));
    await H.write(db, ['checks'], H.records.map((r) => ['checks', r])); db.close(); return H.records.length;`],
  ['A read: by-device-seq, pages of 1000', `
    const ix = (await H.open('a')).transaction('checks').objectStore('checks').index('by-device-seq');
    let range, n = 0;
    for (;;) { const b = await H.req(ix.getAll(range, 1000)); n += b.length; if (b.length < 1000) return n;
      const l = b[b.length - 1]; range = IDBKeyRange.lowerBound([l.deviceId, l.seq], true); }`],
  ['B write: index fields + text per check, 4 indexes', `
    const db = await H.open('b', (d) => H.indexes(d.createObjectStore('checks', { keyPath: 'id' })));
    await H.write(db, ['checks'], H.records.map((r, i) => ['checks', { ...H.slim(r), text: H.texts[i] }])); db.close(); return H.records.length;`],
  ['B write: index fields + text per check, key [deviceId, seq], 2 indexes', `
    const db = await H.open('b2', (d) => { const s = d.createObjectStore('checks', { keyPath: ['deviceId', 'seq'] });
      s.createIndex('by-vessel-time', ['vesselId', 'timeMs', 'id']); s.createIndex('by-time', ['timeMs', 'id']); });
    await H.write(db, ['checks'], H.records.map((r, i) => ['checks', { ...H.slim(r), text: H.texts[i] }])); db.close(); return H.records.length;`],
  ['B read: by-device-seq, pages of 1000, texts parsed', `
    const ix = (await H.open('b')).transaction('checks').objectStore('checks').index('by-device-seq');
    let range, n = 0;
    for (;;) { const b = await H.req(ix.getAll(range, 1000)); for (const r of b) { JSON.parse(r.text); n++; } if (b.length < 1000) return n;
      const l = b[b.length - 1]; range = IDBKeyRange.lowerBound([l.deviceId, l.seq], true); }`],
  ['B read: primary key [deviceId, seq], pages of 1000, texts parsed', `
    const st = (await H.open('b2')).transaction('checks').objectStore('checks');
    let range, n = 0;
    for (;;) { const b = await H.req(st.getAll(range, 1000)); for (const r of b) { JSON.parse(r.text); n++; } if (b.length < 1000) return n;
      const l = b[b.length - 1]; range = IDBKeyRange.lowerBound([l.deviceId, l.seq], true); }`],
  ['C write: index rows (4 indexes) + blocks of 100 texts', `
    const db = await H.open('c', (d) => { H.indexes(d.createObjectStore('checks', { keyPath: 'id' })); d.createObjectStore('blocks'); });
    const items = H.records.map((r) => ['checks', H.slim(r)]);
    for (let i = 0; i < H.texts.length; i += 100) items.push(['blocks', H.texts.slice(i, i + 100), i]);
    await H.write(db, ['checks', 'blocks'], items); db.close(); return H.records.length;`],
  ['C write: blocks of 100 texts only', `
    const db = await H.open('c2', (d) => { d.createObjectStore('blocks'); });
    const items = [];
    for (let i = 0; i < H.texts.length; i += 100) items.push(['blocks', H.texts.slice(i, i + 100), i]);
    await H.write(db, ['blocks'], items); db.close(); return H.records.length;`],
  ['C read: blocks, pages of 10 blocks, texts parsed', `
    const st = (await H.open('c')).transaction('blocks').objectStore('blocks');
    let range, n = 0;
    for (;;) { const b = await H.req(st.getAll(range, 10)); for (const t of b) for (const x of t) { JSON.parse(x); n++; }
      if (b.length < 10) return n; const k = await H.req(st.getAllKeys(range, 10)); range = IDBKeyRange.lowerBound(k[k.length - 1], true); }`],
  ['(for scale) JSON.parse of every text, no IndexedDB', `let n = 0; for (const t of H.texts) { JSON.parse(t); n++; } return n;`],
];

it(`IndexedDB layouts at ${CHECKS.toLocaleString('en-GB')} checks`, async () => {
  const build = spawnSync('npx', ['vite', 'build', '--logLevel', 'warn'], { cwd: ROOT, stdio: 'inherit' });
  expect(build.status).toBe(0);
  const profile = tempProfile();
  const server = await startServer(DIST);
  const ctx = await launch(profile.dir);
  try {
    const text = await generatedBackup({
      vessels: 200, checks: CHECKS, vesselPrefix: '5eed0200', stepMs: 365 * 24 * 3_600_000 / CHECKS,
      technicians: ['Gen Adeyemi', 'Gen Berg'], deviceId: 'a0000000-0000-4000-8000-00000000000a',
      startMs: Date.parse('2026-01-01T00:00:00Z'), seed: 1,
    });
    const page = ctx.pages()[0] ?? (await ctx.newPage());
    page.setDefaultTimeout(300_000);
    await page.goto(`${server.url}#/settings`);
    await page.evaluate(SETUP);
    await page.evaluate((t) => {
      const H = (globalThis as unknown as { H: Record<string, unknown> }).H;
      const doc = JSON.parse(t) as { checks: unknown[] };
      H['records'] = doc.checks;
      H['texts'] = doc.checks.map((c) => JSON.stringify(c));
    }, text);
    console.log(`\n${CHECKS.toLocaleString('en-GB')} generated checks (headless Chromium; this machine):`);
    for (const [what, body] of STEPS) {
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
  }
});
