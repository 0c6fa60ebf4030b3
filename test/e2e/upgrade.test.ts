// A device upgrading in the real browser, from schema v3 (one IndexedDB record per check; v4 put the
// log in blocks) and from v4 (one value per vessel and month; v5 splits it into parts): the old
// database is written with raw IndexedDB exactly as that version created it, then the app opens
// it. Every check must arrive unchanged: the review counts them, the chains verify, and the JSON
// backup's check lines are the records' canonical JSON, in device and seq order. The logs are
// generated test data (bench/generated-log.ts), not demo data.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { DIST, launch, startServer, tempProfile, type StaticServer, verifyChainsOnScreen } from './harness.ts';
import { generatedBackup } from '../../bench/generated-log.ts';
import { factsOfRecord } from '../../src/store/facts.ts';
import { DB_VERSION } from '../../src/store/schema.ts';
import { canonicalJson } from '../../src/store/integrity.ts';
import type { CheckRecord } from '../../src/store/records.ts';

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
