// A device upgrading from schema v3 (one IndexedDB record per check) to v4 (the log in blocks) in
// the real browser: the old database is written with raw IndexedDB exactly as v3 created it, then
// the app opens it. Every check must arrive unchanged: the review counts them, the chains verify,
// and the JSON backup's check lines are the records' canonical JSON, in device and seq order.
// The log is generated test data (bench/generated-log.ts), not demo data.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { DIST, launch, startServer, tempProfile, type StaticServer, verifyChainsOnScreen } from './harness.ts';
import { generatedBackup } from '../../bench/generated-log.ts';

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
      expect(await page.evaluate(async () => (await indexedDB.databases()).find((d) => d.name === 'tankside')?.version)).toBe(4);
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
});
