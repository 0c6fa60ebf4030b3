// Devices upgrading in the real browser (and, last, from v6 to the instrument register): from schema v3 (one IndexedDB record per check) to the log
// in blocks, from v4 (every caution's signal words in the month rows) to v5 (the findings'), and
// from one value per vessel and month to v6's parts of at most 500 rows, and to v7 (records of other kinds
// beside the checks). The old database is written with raw IndexedDB exactly as that version created it, then the app
// opens it. Every check must arrive unchanged: the review counts them (by outcome, after v5), the
// chains verify, and the JSON backup's check lines are the records' canonical JSON, in device and
// seq order. The logs are generated test data (bench/generated-log.ts and below), not demo data.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { DIST, launch, startServer, tempProfile, type StaticServer, verifyChainsOnScreen } from './harness.ts';
import { factsOfRecord } from '../../src/store/facts.ts';
import { DB_VERSION } from '../../src/store/schema.ts';
import { fakeUuid, generatedBackup, generatedVessels, partialResult } from '../../bench/generated-log.ts';
import { canonicalJson, computeCheckHash } from '../../src/store/integrity.ts';
import { GENESIS_HASH, type CheckRecord } from '../../src/store/records.ts';

const LOG = {
  deviceId: '7c2d4e6f-8a9b-4c0d-9e1f-2a3b4c5d6e7f', vesselPrefix: '5eed0003', vessels: 3, checks: 250,
  startMs: Date.parse('2026-09-28T06:00:00Z'), stepMs: 7 * 3_600_000, technicians: ['Gen Three'], seed: 5,
};

describe('upgrade from schema v3 in Chromium', () => {
  const profile = tempProfile();
  let server: StaticServer;
  beforeAll(async () => {
    server = await startServer(DIST);
  });
  afterAll(async () => {
    await server.close();
    profile.remove();
  });

  it('moves a v3 log of 250 checks into blocks unchanged: counted, verified, exported byte for byte', async () => {
    const backup = await generatedBackup(LOG);
    const doc = JSON.parse(backup) as { vessels: unknown[]; checks: { deviceId: string; seq: number }[] };
    const ctx = await launch(profile.dir);
    try {
      const page = ctx.pages()[0] ?? (await ctx.newPage());
      // A page of the same origin that is not the app (the server's 404 text), so nothing opens the
      // database before the old schema is written.
      await page.goto(`${server.url}not-the-app`);
      await page.evaluate(async ({ vessels, checks }) => {
        const db = await new Promise<IDBDatabase>((ok, no) => {
          const r = indexedDB.open('tankside', 3);
          r.onupgradeneeded = () => {
            const d = r.result;
            d.createObjectStore('vessels', { keyPath: 'id' }).createIndex('by-tag', 'tagKey');
            const c = d.createObjectStore('checks', { keyPath: 'id' });
            c.createIndex('by-vessel-time', ['vesselId', 'timeMs', 'id']);
            c.createIndex('by-time', ['timeMs', 'id']);
            c.createIndex('by-device-seq', ['deviceId', 'seq'], { unique: true });
            c.createIndex('by-corrects', 'corrects');
            d.createObjectStore('settings');
            d.createObjectStore('drafts');
          };
          r.onsuccess = () => ok(r.result);
          r.onerror = () => no(r.error);
        });
        await new Promise<void>((ok, no) => {
          const tx = db.transaction(['vessels', 'checks'], 'readwrite');
          for (const v of vessels) tx.objectStore('vessels').put(v);
          for (const c of checks) tx.objectStore('checks').put(c);
          tx.oncomplete = () => ok();
          tx.onerror = () => no(tx.error);
        });
        db.close();
      }, doc);

      await page.goto(`${server.url}#/review`);
      await page.locator('[data-review-state="ready"]').waitFor();
      await expect.poll(() => page.textContent('[data-total="checks"]')).toBe('250');
      expect(await page.evaluate(async () => (await indexedDB.databases()).find((d) => d.name === 'tankside')?.version)).toBe(DB_VERSION);
      expect((await verifyChainsOnScreen(page)).lines.map((l) => l.chain)).toEqual(['ok']);
      expect(await page.textContent('[data-chain="ok"]')).toContain('250 records');

      const [dl] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download JSON backup' }).click()]);
      const exported = readFileSync((await dl.path())!, 'utf8');
      const lines = (text: string) => text.split('\n').filter((l) => l.startsWith('{"appVersion"'));
      // The generator writes each check as canonical JSON in seq order, one per line, as the store does.
      expect(lines(exported)).toEqual(lines(backup));
      expect(lines(exported)).toHaveLength(250);
    } finally {
      await ctx.close();
    }
  });

  it('v4 → v5 in Chromium: a release-0.1.0 log keeps every record byte for byte, and its totals now count outcomes', async () => {
    const { vessels, blocks, months, ids, records, want } = await v4Layout();
    const ctx = await launch(tempProfileV4.dir);
    try {
      const page = ctx.pages()[0] ?? (await ctx.newPage());
      await page.goto(`${server.url}not-the-app`);
      await page.evaluate(async ({ vessels, blocks, months, ids }) => {
        const db = await new Promise<IDBDatabase>((ok, no) => {
          const r = indexedDB.open('tankside', 4);
          r.onupgradeneeded = () => {
            const d = r.result;
            d.createObjectStore('vessels', { keyPath: 'id' }).createIndex('by-tag', 'tagKey');
            d.createObjectStore('settings');
            d.createObjectStore('drafts');
            d.createObjectStore('logBlocks', { keyPath: ['deviceId', 'firstSeq'] });
            d.createObjectStore('logMonths', { keyPath: ['vesselId', 'monthMs'] }).createIndex('by-month', 'monthMs');
            d.createObjectStore('logIds');
          };
          r.onsuccess = () => ok(r.result);
          r.onerror = () => no(r.error);
        });
        await new Promise<void>((ok, no) => {
          const tx = db.transaction(['vessels', 'logBlocks', 'logMonths', 'logIds'], 'readwrite');
          for (const v of vessels) tx.objectStore('vessels').put(v);
          for (const b of blocks) tx.objectStore('logBlocks').put(b);
          for (const m of months) tx.objectStore('logMonths').put(m);
          for (const [key, bucket] of ids) tx.objectStore('logIds').put(bucket, key);
          tx.oncomplete = () => ok();
          tx.onerror = () => no(tx.error);
        });
        db.close();
      }, { vessels, blocks, months, ids });

      await page.goto(`${server.url}#/review`);
      await page.locator('[data-review-state="ready"]').waitFor();
      const complete = page.locator('.review-totals[data-complete="yes"]');
      await complete.locator('[data-total="checks"]', { hasText: new RegExp(`^${records.length}$`) }).waitFor();
      expect(await page.evaluate(async () => (await indexedDB.databases()).find((d) => d.name === 'tankside')?.version)).toBe(DB_VERSION);
      for (const [outcome, n] of Object.entries(want)) expect(await complete.locator(`[data-total="outcome-${outcome}"]`).textContent(), outcome).toBe(String(n));
      expect((await verifyChainsOnScreen(page)).lines.map((l) => l.chain)).toEqual(['ok']);
      expect(await page.textContent('[data-chain="ok"]')).toContain(`${records.length} records`);
      const [dl] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download JSON backup' }).click()]);
      const exported = readFileSync((await dl.path())!, 'utf8').split('\n').filter((l) => l.startsWith('{"appVersion"')).map((l) => l.replace(/,$/, ''));
      expect(exported).toEqual(records.map((r) => canonicalJson(r)));
    } finally {
      await ctx.close();
    }
  });
  it('splits a v4 month bucket of 1,200 checks into parts: counted, listed, verified, exported byte for byte', async () => {
    // One vessel checked every 30 minutes for 25 days: one v4 month bucket of 1,200 rows.
    const backup = await generatedBackup({ ...LOG, deviceId: '2b3c4d5e-6f70-4812-a3b4-c5d6e7f80912', vesselPrefix: '5eed0004', vessels: 1, checks: 1200, startMs: Date.parse('2026-10-01T00:00:00Z'), stepMs: 1_800_000, seed: 6 });
    const doc = JSON.parse(backup) as { vessels: { id: string }[]; checks: CheckRecord[] };
    const blocks = [];
    for (let b = 0; b < doc.checks.length; b += 100) {
      const run = doc.checks.slice(b, b + 100);
      blocks.push({ deviceId: run[0]!.deviceId, firstSeq: run[0]!.seq, seqs: run.map((c) => c.seq), texts: run.map((c) => canonicalJson(c)) });
    }
    const rows = doc.checks.map((c) => {
      const f = factsOfRecord(c);
      return [c.timeMs, c.id, c.deviceId, c.seq, f.verdict, f.signals, f.technician];
    });
    const ids: Record<string, Record<string, { at: [string, number] }>> = {};
    for (const c of doc.checks) (ids[c.id.slice(-2)] ??= {})[c.id] = { at: [c.deviceId, c.seq] };
    const profile2 = tempProfile();
    const ctx = await launch(profile2.dir);
    try {
      const page = ctx.pages()[0] ?? (await ctx.newPage());
      await page.goto(`${server.url}not-the-app`);
      await page.evaluate(async ({ vessels, blocks, rows, ids, deviceId }) => {
        const db = await new Promise<IDBDatabase>((ok, no) => {
          const r = indexedDB.open('tankside', 4);
          r.onupgradeneeded = () => {
            const d = r.result;
            d.createObjectStore('vessels', { keyPath: 'id' }).createIndex('by-tag', 'tagKey');
            d.createObjectStore('settings');
            d.createObjectStore('drafts');
            d.createObjectStore('logBlocks', { keyPath: ['deviceId', 'firstSeq'] });
            d.createObjectStore('logMonths', { keyPath: ['vesselId', 'monthMs'] }).createIndex('by-month', 'monthMs');
            d.createObjectStore('logIds');
          };
          r.onsuccess = () => ok(r.result);
          r.onerror = () => no(r.error);
        });
        await new Promise<void>((ok, no) => {
          const tx = db.transaction(['vessels', 'settings', 'logBlocks', 'logMonths', 'logIds'], 'readwrite');
          for (const v of vessels) tx.objectStore('vessels').put(v);
          tx.objectStore('settings').put(deviceId, 'store:deviceId');
          for (const b of blocks) tx.objectStore('logBlocks').put(b);
          tx.objectStore('logMonths').put({ vesselId: vessels[0]!.id, monthMs: Date.UTC(2026, 9, 1), rows });
          for (const [k, bucket] of Object.entries(ids)) tx.objectStore('logIds').put(bucket, k);
          tx.oncomplete = () => ok();
          tx.onerror = () => no(tx.error);
        });
        db.close();
      }, { vessels: doc.vessels, blocks, rows, ids, deviceId: doc.checks[0]!.deviceId });

      await page.goto(`${server.url}#/review`);
      await page.locator('[data-review-state="ready"]').waitFor();
      await page.locator('.review-totals[data-complete="yes"]').waitFor();
      expect(await page.textContent('[data-total="checks"]')).toBe('1,200');
      const stores = await page.evaluate(async () => {
        const db = await new Promise<IDBDatabase>((ok) => { const r = indexedDB.open('tankside'); r.onsuccess = () => ok(r.result); });
        const names = [...db.objectStoreNames];
        const sizes = await new Promise<number[]>((ok) => {
          const q = db.transaction('logMonthParts').objectStore('logMonthParts').getAll();
          q.onsuccess = () => ok((q.result as { rows: unknown[] }[]).map((p) => p.rows.length));
        });
        db.close();
        return { version: db.version, names, sizes };
      });
      expect(stores).toEqual({ version: DB_VERSION, names: expect.not.arrayContaining(['logMonths']), sizes: [500, 500, 200] });
      expect((await verifyChainsOnScreen(page)).lines.map((l) => l.chain)).toEqual(['ok']);
      // The newest page of the list, across the parts: the 50 newest checks, newest first.
      const shown = await page.locator('.review-row').evaluateAll((els) => els.length);
      expect(shown).toBe(50);
      const [dl] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download JSON backup' }).click()]);
      const exported = readFileSync((await dl.path())!, 'utf8');
      const lines = (text: string) => text.split('\n').filter((l) => l.startsWith('{"appVersion"'));
      expect(lines(exported)).toEqual(lines(backup));
    } finally {
      await ctx.close();
      profile2.remove();
    }
  });
});

describe('upgrade from schema v6 in Chromium', () => {
  let server: StaticServer;
  beforeAll(async () => {
    server = await startServer(DIST);
  });
  afterAll(async () => {
    await server.close();
  });

  it('v6 → v7: the log stays byte for byte, and a periodic test saved after it joins the same chain', async () => {
    const backup = await generatedBackup({ ...LOG, deviceId: '3c4d5e6f-7081-4923-b4c5-d6e7f8091a2b', vesselPrefix: '5eed0007', vessels: 2, checks: 30, seed: 7 });
    const doc = JSON.parse(backup) as { vessels: { id: string; tag: string }[]; checks: CheckRecord[] };
    const deviceId = doc.checks[0]!.deviceId;
    const block = { deviceId, firstSeq: 1, seqs: doc.checks.map((c) => c.seq), texts: doc.checks.map((c) => canonicalJson(c)) };
    const monthOf = (ms: number) => { const d = new Date(ms); return Date.UTC(d.getUTCFullYear(), d.getUTCMonth(), 1); };
    const parts = new Map<string, { vesselId: string; monthMs: number; startMs: number; startId: string; rows: unknown[][] }>();
    for (const c of doc.checks) {
      const key = `${c.vesselId} ${monthOf(c.timeMs)}`;
      if (!parts.has(key)) parts.set(key, { vesselId: c.vesselId, monthMs: monthOf(c.timeMs), startMs: monthOf(c.timeMs), startId: '', rows: [] });
      const f = factsOfRecord(c);
      parts.get(key)!.rows.push([c.timeMs, c.id, c.deviceId, c.seq, f.verdict, f.signals, f.technician]);
    }
    const ids: Record<string, Record<string, { at: [string, number] }>> = {};
    for (const c of doc.checks) (ids[c.id.slice(-2)] ??= {})[c.id] = { at: [c.deviceId, c.seq] };
    const profile = tempProfile();
    const ctx = await launch(profile.dir);
    try {
      const page = ctx.pages()[0] ?? (await ctx.newPage());
      await page.goto(`${server.url}not-the-app`);
      await page.evaluate(async ({ vessels, block, parts, ids, deviceId }) => {
        const db = await new Promise<IDBDatabase>((ok, no) => {
          const r = indexedDB.open('tankside', 6);
          r.onupgradeneeded = () => {
            const d = r.result;
            d.createObjectStore('vessels', { keyPath: 'id' }).createIndex('by-tag', 'tagKey');
            d.createObjectStore('settings');
            d.createObjectStore('drafts');
            d.createObjectStore('logBlocks', { keyPath: ['deviceId', 'firstSeq'] });
            d.createObjectStore('logMonthParts', { keyPath: ['vesselId', 'monthMs', 'startMs', 'startId'] }).createIndex('by-month', 'monthMs');
            d.createObjectStore('logIds');
          };
          r.onsuccess = () => ok(r.result);
          r.onerror = () => no(r.error);
        });
        await new Promise<void>((ok, no) => {
          const tx = db.transaction(['vessels', 'settings', 'logBlocks', 'logMonthParts', 'logIds'], 'readwrite');
          for (const v of vessels) tx.objectStore('vessels').put(v);
          tx.objectStore('settings').put(deviceId, 'store:deviceId');
          tx.objectStore('logBlocks').put(block);
          for (const p of parts) tx.objectStore('logMonthParts').put(p);
          for (const [k, bucket] of Object.entries(ids)) tx.objectStore('logIds').put(bucket, k);
          tx.oncomplete = () => ok();
          tx.onerror = () => no(tx.error);
        });
        db.close();
      }, { vessels: doc.vessels, block, parts: [...parts.values()], ids, deviceId });

      await page.goto(`${server.url}#/steam-tests`);
      await page.locator('.steam-tests-screen[data-draft="loaded"]').waitFor();
      const tag = doc.vessels[0]!.tag;
      await page.locator('#test-vessel option', { hasText: tag }).waitFor({ state: 'attached' });
      await page.selectOption('#test-vessel', doc.vessels[0]!.id);
      await page.selectOption('#test-kind', 'air-removal');
      await page.fill('#st-batch', 'TEST-LOT-1');
      await page.locator('[data-test="air-removal"][data-test-outcome]').waitFor();
      await page.fill('#test-tech', 'Gen Seven');
      await page.getByRole('button', { name: 'Save test' }).click();
      await page.locator('[data-save-state="saved"]').waitFor();

      await page.goto(`${server.url}#/review`);
      await page.locator('.review-totals[data-complete="yes"]').waitFor();
      // Checks are still 30: the test is a record of another kind, listed beside them.
      expect(await page.textContent('[data-total="checks"]')).toBe('30');
      await page.locator('.kind-records[data-kind-records="1"]').waitFor();
      const version = await page.evaluate(async () => {
        const db = await new Promise<IDBDatabase>((ok) => { const r = indexedDB.open('tankside'); r.onsuccess = () => ok(r.result); });
        // The v9 rung's id buckets: flat arrays, every id of the log once (the 30 checks and the test).
        const buckets = await new Promise<unknown[]>((ok) => { const r = db.transaction('logIds').objectStore('logIds').getAll(); r.onsuccess = () => ok(r.result); });
        const ids = buckets.flatMap((b) => ((b as { ids?: unknown }).ids as string[] | undefined) ?? ['not the v9 shape']);
        const out = { version: db.version, kinds: [...db.objectStoreNames].includes('logKinds'), ids: ids.length, distinct: new Set(ids).size };
        db.close();
        return out;
      });
      expect(version).toEqual({ version: DB_VERSION, kinds: true, ids: 31, distinct: 31 });
      const chains = await verifyChainsOnScreen(page);
      expect(chains.lines.map((l) => l.chain)).toEqual(['ok']);
      expect(chains.lines[0]!.text).toContain('31 records, seq 1 to 31');
      const [dl] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download JSON backup' }).click()]);
      const exported = readFileSync((await dl.path())!, 'utf8');
      const lines = (text: string) => text.split('\n').filter((l) => l.startsWith('{"appVersion"')).map((l) => l.replace(/,$/, ''));
      const after = lines(exported);
      // The 30 checks byte for byte, then the test as seq 31 of the same chain.
      expect(after.slice(0, 30)).toEqual(lines(backup));
      const test = JSON.parse(after[30]!) as { kind: string; seq: number; prevHash: string };
      expect(test).toMatchObject({ kind: 'periodic-test', seq: 31, prevHash: doc.checks[29]!.hash });
    } finally {
      await ctx.close();
      profile.remove();
    }
  });
});

const tempProfileV4 = tempProfile();
afterAll(() => tempProfileV4.remove());

/**
 * A v4 database's contents, by hand: checks as release 0.1.0 saved them (its rule ids and words:
 * agreeing ones whose worst word is WARNING only through standing hazards, ones with air, ones at
 * MAWP), blocks of 100 canonical texts, month rows holding every caution's words, and id buckets.
 */
async function v4Layout() {
  const DEVICE = '4c4c4c4c-0000-4000-8000-000000000004';
  const vessels = generatedVessels(0x5eed0004, 2, Date.parse('2026-09-01T06:00:00Z'));
  const standing = [
    { signal: 'WARNING', message: 'Liquid released to atmosphere flashes: 3.9 % turns to steam, about 62 times the liquid volume.', rule: 'flash-on-release' },
    { signal: 'WARNING', message: 'Cooled to 20.0 °C the vessel falls to −99.0 kPa gauge and it is not rated for vacuum.', rule: 'vacuum-on-cooling' },
    { signal: 'CAUTION', message: 'Contents at 121.0 °C: contact scalds within seconds.', rule: 'scald' },
    { signal: 'NOTICE', message: 'Advisory figures only.', rule: 'standing-note' },
  ] as const;
  const kinds = [
    { verdict: 'consistent', extra: [{ signal: 'NOTICE', message: 'Pressure and temperature agree with saturated steam within ±0.92 K.', rule: 'saturation-check-limits' }], outcome: 'none' },
    { verdict: 'pressure-above-saturation', extra: [{ signal: 'WARNING', message: 'Pressure is 40.0 kPa above saturation for 121.0 °C.', rule: 'noncondensable-gas' }], outcome: 'WARNING' },
    { verdict: 'consistent', extra: [{ signal: 'DANGER', message: 'Gauge pressure 995.0 kPa is at the MAWP (1000.0 kPa gauge).', rule: 'pressure-at-mawp' }], outcome: 'DANGER' },
  ] as const;
  const t0 = Date.parse('2026-09-29T06:00:00Z');
  const records: CheckRecord[] = [];
  const want = { DANGER: 0, WARNING: 0, CAUTION: 0, NOTICE: 0, none: 0 };
  let prevHash = GENESIS_HASH;
  for (let seq = 1; seq <= 240; seq += 1) {
    const k = kinds[seq % 3]!;
    const v = vessels[seq % 2]!;
    const timeMs = t0 + seq * 3 * 3_600_000;
    const unsigned = {
      id: fakeUuid(0x4c4c4c4c, seq), deviceId: DEVICE, seq, time: new Date(timeMs).toISOString().replace('.000Z', 'Z'), timeMs,
      technician: 'Gen Six', note: `v4 ${seq}`, vesselId: v.id, vessel: { tag: v.tag, spec: v.spec },
      inputs: { temperature: { text: '121,0', unit: 'degC' } },
      reading: { time: new Date(timeMs).toISOString().replace('.000Z', 'Z'), temperatureK: 394.15, pressure: { reference: 'gauge' as const, pressurePa: 104e3 }, weight: { kind: 'not-weighed' as const } },
      // A release-0.1.0 result, cut to the part the review reads.
      result: partialResult({ saturation: { verdict: { verdict: k.verdict } } }),
      cautions: [...k.extra, ...standing].map((c) => ({ ...c })),
      appVersion: '0.1.0', formulationId: 'IAPWS-IF97 (R7-97(2012))', corrects: null, reason: null, prevHash,
    };
    const record: CheckRecord = { ...unsigned, hash: await computeCheckHash(unsigned) };
    records.push(record);
    want[k.outcome] += 1;
    prevHash = record.hash;
  }
  const texts = records.map((r) => canonicalJson(r));
  const blocks = [0, 100, 200].map((start) => ({ deviceId: DEVICE, firstSeq: start + 1, seqs: records.slice(start, start + 100).map((r) => r.seq), texts: texts.slice(start, start + 100) }));
  const monthOf = (ms: number) => { const d = new Date(ms); return Date.UTC(d.getUTCFullYear(), d.getUTCMonth(), 1); };
  const words = ['DANGER', 'WARNING', 'CAUTION', 'NOTICE'];
  const byMonth = new Map<string, { vesselId: string; monthMs: number; rows: unknown[][] }>();
  for (const r of records) {
    const key = `${r.vesselId} ${monthOf(r.timeMs)}`;
    if (!byMonth.has(key)) byMonth.set(key, { vesselId: r.vesselId, monthMs: monthOf(r.timeMs), rows: [] });
    const mask = r.cautions.reduce((m, c) => (c.rule === 'standing-note' ? m : m | (1 << words.indexOf(c.signal))), 0);
    byMonth.get(key)!.rows.push([r.timeMs, r.id, DEVICE, r.seq, (r.result as { saturation: { verdict: { verdict: string } } }).saturation.verdict.verdict, mask, r.technician]);
  }
  const idBuckets = new Map<string, Record<string, { at: [string, number] }>>();
  for (const r of records) {
    const key = r.id.slice(-2);
    if (!idBuckets.has(key)) idBuckets.set(key, {});
    idBuckets.get(key)![r.id] = { at: [DEVICE, r.seq] };
  }
  return { vessels, blocks, months: [...byMonth.values()], ids: [...idBuckets], records, want };
}

describe('the instrument register rung in Chromium (v6 → current)', () => {
  const profile = tempProfile();
  let server: StaticServer;
  beforeAll(async () => {
    server = await startServer(DIST);
  });
  afterAll(async () => {
    await server.close();
    profile.remove();
  });

  it('every generated vessel\'s typed gauge and thermometer become register entries fitted to it; the vessel records stay byte for byte', async () => {
    const vessels = generatedVessels(0x5eed0006, 4, Date.parse('2026-09-01T06:00:00Z'));
    const ctx = await launch(profile.dir);
    try {
      const page = ctx.pages()[0] ?? (await ctx.newPage());
      await page.goto(`${server.url}not-the-app`);
      await page.evaluate(async ({ vessels }) => {
        const db = await new Promise<IDBDatabase>((ok, no) => {
          const r = indexedDB.open('tankside', 6);
          r.onupgradeneeded = () => {
            const d = r.result;
            d.createObjectStore('vessels', { keyPath: 'id' }).createIndex('by-tag', 'tagKey');
            d.createObjectStore('settings');
            d.createObjectStore('drafts');
            d.createObjectStore('logBlocks', { keyPath: ['deviceId', 'firstSeq'] });
            d.createObjectStore('logMonthParts', { keyPath: ['vesselId', 'monthMs', 'startMs', 'startId'] }).createIndex('by-month', 'monthMs');
            d.createObjectStore('logIds');
          };
          r.onsuccess = () => ok(r.result);
          r.onerror = () => no(r.error);
        });
        await new Promise<void>((ok, no) => {
          const tx = db.transaction(['vessels'], 'readwrite');
          for (const v of vessels) tx.objectStore('vessels').put(v);
          tx.oncomplete = () => ok();
          tx.onerror = () => no(tx.error);
        });
        db.close();
      }, { vessels });

      await page.goto(`${server.url}#/instruments`);
      await page.locator('[data-register-state="ready"]').waitFor();
      const tags = await page.locator('li[data-tag]').evaluateAll((els) => els.map((e) => e.getAttribute('data-tag')).sort());
      expect(tags).toEqual(vessels.flatMap((v) => [`${v.tag} PI`, `${v.tag} TI`]).sort());
      const stored = await page.evaluate(async () => {
        const db = await new Promise<IDBDatabase>((ok) => { const r = indexedDB.open('tankside'); r.onsuccess = () => ok(r.result); });
        const all = <T,>(store: string) => new Promise<T[]>((ok) => { const q = db.transaction(store).objectStore(store).getAll(); q.onsuccess = () => ok(q.result as T[]); });
        const out = { version: db.version, vessels: await all<unknown>('vessels'), fittings: await all<{ vesselId: string; role: string }>('fittings') };
        db.close();
        return out;
      });
      expect(stored.version).toBe(DB_VERSION);
      expect(stored.vessels.map((v) => canonicalJson(v as never)).sort()).toEqual(vessels.map((v) => canonicalJson(v as never)).sort());
      expect(stored.fittings.map((f) => `${f.vesselId} ${f.role}`).sort()).toEqual(vessels.flatMap((v) => [`${v.id} pressure`, `${v.id} temperature`]).sort());
      // A vessel's page names its fitted instruments.
      await page.goto(`${server.url}#/vessels/${vessels[0]!.id}`);
      await page.locator('[data-drift-state="ready"]').waitFor();
      expect(await page.textContent('[data-drift-state="ready"]')).toContain(`${vessels[0]!.tag} PI`);
    } finally {
      await ctx.close();
    }
  });
});
