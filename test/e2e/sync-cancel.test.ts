// Cancelling "Sync now" in the middle of a supervisor's pull, in Chromium behind
// deploy/nginx-tankside.conf (Debian's nginx) with the CouchDB stand-in as the server. A device in
// this process (Node, fake-indexeddb) pushes a generated chain (invented test data) longer than
// one of the client's pull batches; the supervisor's first pull is held at its second request to
// the changes feed (Playwright's route, released only by the test) and cancelled there. Then:
// exactly the first batch's records are stored, and the checkpoint is that batch's last_seq (it
// moves only after its records committed); a second sync takes the rest, and the Review's
// verification shows the chain whole, with every record once. A second cancel, given as the next
// batch is handed over, may land before that batch's merge, in it (its transaction aborted) or
// after it commits: whichever, the store then holds whole batches and nothing past the checkpoint
// is missing. Every wait is on the app's own data attributes or on the held request itself.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BrowserContext, Page, Route } from 'playwright-core';
import { DIST, LONG_JOB_MS, launch, tempProfile, verifyChainsOnScreen, waitForControl } from './harness.ts';
import { startSite, type NginxSite } from '../sync/nginx.ts';
import { StandIn } from '../sync/stand-in.ts';
import { makeDevice, seedChain } from '../sync/devices.ts';
import { fakeUuid } from '../../bench/generated-log.ts';
import { PULL_BATCH } from '../../src/sync/pull.ts';

/** More than one of the client's pull batches, so a pull has a middle to cancel in. */
const CHECKS = PULL_BATCH + 700;

interface StoredFacts {
  /** Check ids in the month rows, each as often as it is listed. */
  ids: string[];
  /** The saved checkpoint of tankside-checks, if any. */
  checkpoint: unknown;
}

describe('cancelling a supervisor\'s pull', () => {
  const profile = tempProfile();
  let couch: StandIn;
  let site: NginxSite;
  let ctx: BrowserContext;
  let page: Page;
  let deviceId: string;
  /** The feed's check document ids batch by batch, as the client asks for them from the start (since=0, limit PULL_BATCH). */
  let feedBatches: { ids: string[]; lastSeq: unknown }[];

  beforeAll(async () => {
    couch = await StandIn.start();
    const device = await makeDevice(fakeUuid(0xcace0001, 1));
    deviceId = device.id;
    await device.enrol(couch.url, couch.addAccount('device', device.id));
    await seedChain(device, CHECKS, 77);
    const pushed = await device.syncNow({ deviceKeyText: null });
    expect(pushed.push.localHead).toBe(CHECKS);
    feedBatches = [];
    let since: unknown = 0;
    for (;;) {
      const r = await couch.admin<{ results: { id: string }[]; last_seq: unknown }>('GET', `tankside-checks/_changes?since=${encodeURIComponent(String(since))}&limit=${PULL_BATCH}`);
      if (r.body.results.length === 0) break;
      feedBatches.push({ ids: r.body.results.map((c) => c.id).filter((id) => !id.startsWith('_design/')), lastSeq: r.body.last_seq });
      since = r.body.last_seq;
    }
    expect(feedBatches.length).toBeGreaterThanOrEqual(2);
    site = await startSite(DIST, couch.port);
    ctx = await launch(profile.dir);
    page = ctx.pages()[0] ?? (await ctx.newPage());
    // Every wait below is on the app's own state; on a loaded CI machine a batch of 10,000 can take
    // longer to merge than Playwright's default 30 s, which once failed a gate here.
    page.setDefaultTimeout(LONG_JOB_MS);
  });
  afterAll(async () => {
    await ctx?.close();
    await site?.stop();
    await couch?.stop();
    profile.remove();
  });

  /** What the app's IndexedDB holds, read in the page without the app's code. */
  function storedFacts(): Promise<StoredFacts> {
    return page.evaluate(() => new Promise<StoredFacts>((resolve, reject) => {
      const open = indexedDB.open('tankside');
      open.onerror = () => reject(open.error);
      open.onsuccess = () => {
        const db = open.result;
        const tx = db.transaction(['logMonthParts', 'settings']);
        const parts = tx.objectStore('logMonthParts').getAll();
        const sync = tx.objectStore('settings').get('store:sync');
        tx.oncomplete = () => {
          const ids = (parts.result as { rows: [number, string][] }[]).flatMap((p) => p.rows.map((r) => r[1]));
          const checkpoints = (sync.result as { checkpoints?: Record<string, unknown> } | undefined)?.checkpoints ?? {};
          const key = Object.keys(checkpoints).find((k) => k.endsWith(' tankside-checks'));
          db.close();
          resolve({ ids, checkpoint: key === undefined ? undefined : checkpoints[key] });
        };
        tx.onerror = () => reject(tx.error);
      };
    }));
  }

  /** The record ids (seq 1 and up) of the first `n` feed batches. */
  function recordsOfBatches(n: number): string[] {
    return feedBatches.slice(0, n).flatMap((b) => b.ids).filter((id) => !id.endsWith(':0000000000'));
  }

  /** The ids stored, as the server's document ids ("<device>:<seq 10 digits>"): the generated checks' ids are not the documents'. */
  async function storedDocIds(facts: StoredFacts): Promise<string[]> {
    const seqs = await page.evaluate((ids) => new Promise<number[]>((resolve, reject) => {
      const open = indexedDB.open('tankside');
      open.onerror = () => reject(open.error);
      open.onsuccess = () => {
        const db = open.result;
        const tx = db.transaction('logMonthParts');
        const parts = tx.objectStore('logMonthParts').getAll();
        tx.oncomplete = () => {
          const want = new Set(ids);
          const out: number[] = [];
          for (const p of parts.result as { rows: [number, string, string, number][] }[]) for (const r of p.rows) if (want.has(r[1])) out.push(r[3]);
          db.close();
          resolve(out);
        };
        tx.onerror = () => reject(tx.error);
      };
    }), facts.ids);
    return seqs.map((s) => `${deviceId}:${String(s).padStart(10, '0')}`).sort();
  }

  it('cancelled while the second batch is asked for: the first batch is stored whole and the checkpoint is its last_seq; a second sync takes the rest, every record once', async () => {
    // Hold the feed's second request until the test says; count every request.
    let asked = 0;
    let heldAsked!: () => void;
    const secondAsked = new Promise<void>((resolve) => (heldAsked = resolve));
    let release!: () => void;
    const released = new Promise<void>((resolve) => (release = resolve));
    const hold = async (route: Route) => {
      asked += 1;
      if (asked === 2) {
        heldAsked();
        await released;
      }
      await route.continue().catch(() => undefined); // the client may have given the request up
    };
    await page.route('**/db/tankside-checks/_changes*', hold);

    await page.goto(`${site.origin}/#/sync`);
    await page.locator('main[data-app-state="ready"]').waitFor();
    await waitForControl(page);
    await page.locator('[data-sync-enrolment="none"]').waitFor();
    const id = ((await page.locator('[data-enrol-form] strong.device-id').textContent()) ?? '').trim();
    await page.fill('#sync-server', '/db/');
    await page.fill('#sync-password', couch.addAccount('supervisor', id));
    await page.getByRole('radio', { name: 'Supervisor' }).check();
    await page.getByRole('button', { name: 'Enrol this device' }).click();
    // Enrolling starts a sync. The first batch merges and commits while the second request is held.
    await secondAsked;
    // Progress counts the feed's answers, design documents and the key record included.
    await page.locator(`[data-sync-step="pull-checks"][data-sync-done="${PULL_BATCH}"]`).waitFor();
    await page.getByRole('button', { name: 'Cancel sync' }).click();
    await page.locator('[data-sync-result="cancelled"]').waitFor();
    release();

    const afterCancel = await storedFacts();
    expect(afterCancel.checkpoint).toEqual(feedBatches[0]!.lastSeq);
    expect(await storedDocIds(afterCancel)).toEqual(recordsOfBatches(1).sort());
    expect(new Set(afterCancel.ids).size).toBe(afterCancel.ids.length);
    expect(await page.locator('[data-last-sync]').getAttribute('data-last-sync')).toBe('cancelled');

    // Second run, cancelled as the next batch is handed over: wherever it lands, only whole batches.
    await page.unroute('**/db/tankside-checks/_changes*', hold);
    let handed!: () => void;
    const handedOver = new Promise<void>((resolve) => (handed = resolve));
    await page.route('**/db/tankside-checks/_changes*', async (route) => {
      const answer = await route.fetch().catch(() => null);
      if (!answer) return route.abort().catch(() => undefined);
      await route.fulfill({ response: answer }).catch(() => undefined);
      handed();
    });
    await page.getByRole('button', { name: 'Sync now' }).click();
    await handedOver;
    // Clicked at once if it is there: the run may have ended first.
    await page.evaluate(() => [...document.querySelectorAll('button')].find((b) => b.textContent === 'Cancel sync')?.click());
    await page.locator('[data-sync-state="cancelled"], [data-sync-state="ok"]').waitFor();
    const secondEnded = await page.locator('[data-sync-state]').getAttribute('data-sync-state');
    const mid = await storedFacts();
    const whole = feedBatches.findIndex((b) => b.lastSeq === mid.checkpoint) + 1;
    expect(whole).toBeGreaterThanOrEqual(1);
    const stored = await storedDocIds(mid);
    // Everything at or below the checkpoint is here; past it, at most the one batch whose commit the cancel came after.
    const below = new Set(recordsOfBatches(whole));
    for (const docId of below) expect(stored).toContain(docId);
    expect([recordsOfBatches(whole).length, recordsOfBatches(whole + 1).length]).toContain(stored.length);
    expect(new Set(mid.ids).size).toBe(mid.ids.length);
    console.log(`second cancel: run ended ${secondEnded}, ${stored.length} of ${CHECKS} stored, checkpoint after batch ${whole} of ${feedBatches.length}`);

    // A last sync, left alone, completes: every record once, the chain whole. (Its state is not
    // "ok" until it ends, unless the second run was not cancelled in time and ended "ok" itself.)
    await page.unrouteAll({ behavior: 'ignoreErrors' });
    if (secondEnded === 'cancelled') {
      await page.getByRole('button', { name: 'Sync now' }).click();
      await page.locator('[data-sync-state="ok"]').waitFor();
    }
    const done = await storedFacts();
    expect(done.ids).toHaveLength(CHECKS);
    expect(new Set(done.ids).size).toBe(CHECKS);
    expect(await storedDocIds(done)).toEqual(recordsOfBatches(feedBatches.length).sort());
    // The checkpoint is the server's head (past the supervisor's own key record, sent by its syncs).
    const past = await couch.admin<{ results: unknown[] }>('GET', `tankside-checks/_changes?since=${encodeURIComponent(String(done.checkpoint))}`);
    expect(past.body.results).toEqual([]);
    await page.goto(`${site.origin}/#/review`);
    await page.locator('[data-review-state="ready"]').waitFor();
    const { state, lines } = await verifyChainsOnScreen(page);
    expect(state).toBe('done');
    const line = lines.find((l) => l.text.includes(deviceId.slice(0, 8)));
    expect(line, JSON.stringify(lines)).toBeDefined();
    expect(line!.chain).toBe('ok');
    expect(line!.text).toContain(`${CHECKS} records, seq 1 to ${CHECKS}`);
  });
});
