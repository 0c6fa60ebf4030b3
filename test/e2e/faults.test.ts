// The fault matrix: every fault the reliability work covers, injected into the built app in
// headless Chromium, each scenario counting the saved checks before and after, the checks (or typed
// fields) lost, the checks saved twice, and the message the person was shown. The table is printed
// at the end; the bar is zero lost and zero duplicated on every row.
//
// What each row is held to is outside the app's own say-so: the counts come from the Review
// screen's totals (the store's month buckets) and from the files the test made; the typed values
// are the ones the test typed. The data is invented (generated logs from bench/generated-log.ts and
// the demo plant, which is labelled DEMO DATA). No fixed waits stand for "the app is done": every
// wait is on the app's own completion state (data-save, data-draft, data-drafts, data-import-result,
// data-complete, data-chain-runs); the only timed pauses are the faults themselves (a close 100 ms
// after Save).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BrowserContext, Page } from 'playwright-core';
import { DIST, LONG_JOB_MS, launch, pickVessel, startServer, tempProfile, waitForControl, type StaticServer } from './harness.ts';
import { SCREENS } from '../../src/ui/router.ts';

interface Row {
  scenario: string;
  before: number;
  after: number;
  /** Saved checks missing afterwards, or (for an entry in progress) typed fields missing. */
  lost: number;
  duplicated: number;
  message: string;
}
const rows: Row[] = [];

const pause = (ms: number) => new Promise<void>((done) => setTimeout(done, ms));

function printTable(): void {
  const head = ['scenario', 'records before', 'records after', 'lost', 'duplicated', 'message shown'];
  const body = rows.map((r) => [r.scenario, String(r.before), String(r.after), String(r.lost), String(r.duplicated), r.message.replace(/\s+/g, ' ').slice(0, 110)]);
  const widths = head.map((h, i) => Math.max(h.length, ...body.map((b) => b[i]!.length)));
  const line = (cells: string[]) => `| ${cells.map((c, i) => c.padEnd(widths[i]!)).join(' | ')} |`;
  console.log(['', 'Fault matrix', line(head), `|${widths.map((w) => '-'.repeat(w + 2)).join('|')}|`, ...body.map(line), ''].join('\n'));
}

describe('fault matrix', () => {
  const profile = tempProfile();
  let server: StaticServer;
  let ctx: BrowserContext | null = null;

  beforeAll(async () => {
    server = await startServer(DIST);
  });
  afterAll(async () => {
    await ctx?.close();
    await server.close();
    profile.remove();
    printTable();
  });

  /** A fresh browser on the same profile (the previous one closed), on `route`. */
  async function relaunch(route: string): Promise<Page> {
    await ctx?.close();
    ctx = await launch(profile.dir);
    const page = ctx.pages()[0] ?? (await ctx.newPage());
    await page.goto(`${server.url}${route}`);
    return page;
  }

  /** The Check screen with its stored draft read. */
  async function checkScreen(page: Page): Promise<void> {
    if (!page.url().endsWith('#/check')) await page.goto(`${server.url}#/check`);
    await page.locator('[data-draft="loaded"]').waitFor({ timeout: LONG_JOB_MS });
  }

  /** How many checks the store holds, from the Review screen's completed totals. */
  async function storedChecks(page: Page): Promise<number> {
    await page.goto(`${server.url}#/review`);
    const totals = page.locator('.review-totals[data-complete="yes"]');
    await totals.waitFor({ timeout: LONG_JOB_MS });
    return Number((await totals.locator('[data-total="checks"]').textContent())!.replace(/,/g, ''));
  }

  const ENTRY = { temperature: '151,8', pressure: '400', gross: '612' };
  type Entry = typeof ENTRY;

  /** Types a check on DEMO-FT-02, the last keystroke last. */
  async function typeEntry(page: Page, entry: Entry, note: string): Promise<void> {
    await pickVessel(page, '#pick-vessel', 'DEMO-FT-02');
    await page.fill('#chk-tech', 'Fault Matrix');
    await page.fill('#chk-note', note);
    await page.selectOption('#chk-temperature-unit', 'degC');
    await page.selectOption('#chk-pressure-unit', 'kPa');
    await page.selectOption('#chk-gross-unit', 'kg');
    await page.fill('#chk-temperature', entry.temperature);
    await page.fill('#chk-pressure', entry.pressure);
    await page.fill('#chk-gross', entry.gross);
  }

  /** Waits until every draft write the page issued has committed (the app's own data-drafts state). */
  async function draftsStored(page: Page): Promise<void> {
    await page.locator('html[data-drafts="saved"]').waitFor({ state: 'attached', timeout: LONG_JOB_MS });
  }

  /** The typed fields of `entry` not in the form as shown. */
  async function fieldsLost(page: Page, entry: Entry): Promise<number> {
    const shown = [await page.inputValue('#chk-temperature'), await page.inputValue('#chk-pressure'), await page.inputValue('#chk-gross')];
    return [entry.temperature, entry.pressure, entry.gross].filter((v, i) => shown[i] !== v).length;
  }

  it('has a demo plant to work on', async () => {
    const page = await relaunch('#/vessels');
    await page.getByRole('button', { name: 'Load demo plant' }).click();
    await page.getByRole('link', { name: /DEMO-FT-02/ }).waitFor({ timeout: LONG_JOB_MS });
  });

  for (const ms of [0, 100, 250]) {
    it(`close ${ms} ms after Save: the check is in the log once and the form is empty`, async () => {
      let page = await relaunch('#/check');
      const before = await storedChecks(page);
      await checkScreen(page);
      await typeEntry(page, ENTRY, `close ${ms} ms after Save`);
      // A person reads the result before pressing Save: by then the entry is stored as a draft.
      await draftsStored(page);
      await page.getByRole('button', { name: 'Save check' }).click();
      const status = page.locator('[data-save="saved"]');
      await status.waitFor({ timeout: LONG_JOB_MS });
      let message = (await status.textContent()) ?? '';
      await pause(ms);
      page = await relaunch('#/check');
      await checkScreen(page);
      // The entry back in the form with Save enabled invites saving it twice: do what a person would.
      const back = (await fieldsLost(page, ENTRY)) === 0;
      if (back && (await page.getByRole('button', { name: 'Save check' }).isEnabled())) {
        await page.getByRole('button', { name: 'Save check' }).click();
        await page.locator('[data-save="saved"]').waitFor({ timeout: LONG_JOB_MS });
        message += ' / after reopening: the saved entry was back in the form, saved again';
      }
      const after = await storedChecks(page);
      rows.push({ scenario: `close ${ms} ms after Save`, before, after, lost: Math.max(0, before + 1 - after), duplicated: Math.max(0, after - before - 1), message });
      expect(back, 'the saved entry came back in the form').toBe(false);
      expect(after).toBe(before + 1);
    });
  }

  it('close at 0 ms mid-entry: every typed field is back', async () => {
    let page = await relaunch('#/check');
    const before = await storedChecks(page);
    await checkScreen(page);
    await typeEntry(page, ENTRY, 'closed mid-entry');
    // The last keystroke, then the browser closes at once.
    page = await relaunch('#/check');
    await checkScreen(page);
    const lost = await fieldsLost(page, ENTRY);
    const after = await storedChecks(page);
    rows.push({ scenario: 'close at 0 ms mid-entry', before, after, lost: lost + Math.max(0, before - after), duplicated: Math.max(0, after - before), message: lost === 0 ? '(entry back in the form)' : '' });
    expect(lost).toBe(0);
    expect(after).toBe(before);
  });

  it('reload at 0 ms mid-entry: every typed field is back', async () => {
    const page = await relaunch('#/check');
    const before = await storedChecks(page);
    await checkScreen(page);
    const entry = { temperature: '149,2', pressure: '380', gross: '640' };
    await typeEntry(page, entry, 'reloaded mid-entry');
    await page.reload();
    await checkScreen(page);
    const lost = await fieldsLost(page, entry);
    const after = await storedChecks(page);
    rows.push({ scenario: 'reload at 0 ms mid-entry', before, after, lost: lost + Math.max(0, before - after), duplicated: Math.max(0, after - before), message: lost === 0 ? '(entry back in the form)' : '' });
    expect(lost).toBe(0);
    expect(after).toBe(before);
  });

  it('offline: every route and a deep path render from the service worker', async () => {
    let page = await relaunch('#/vessels');
    await waitForControl(page);
    const before = await storedChecks(page);
    await ctx!.setOffline(true);
    // A fresh start offline, as on a phone with no signal, then each route and two paths no link makes.
    page = await relaunch('#/vessels');
    await ctx!.setOffline(true);
    const targets = [
      ...SCREENS.map((s) => ({ path: `#/${s.id}`, title: s.title })),
      { path: 'some/deep/path', title: 'New check' },
      { path: 'some/deep/path#/log', title: 'Log' },
      { path: 'a/b/c/d/index.html#/settings', title: 'Settings' },
    ];
    const failed: string[] = [];
    for (const t of targets) {
      // From a blank page, so a route that differs only in its hash is still a load of the shell.
      await page.goto('about:blank');
      const response = await page.goto(`${server.url}${t.path}`);
      const heading = page.locator('main h1');
      const shown = await heading.waitFor({ timeout: 20_000 }).then(() => heading.textContent(), () => null);
      const styled = await page.evaluate(() => getComputedStyle(document.body).margin === '0px');
      if (shown !== t.title || !response?.fromServiceWorker() || !styled) failed.push(`${t.path}: ${shown ?? 'blank'}`);
    }
    const after = await storedChecks(page);
    await ctx!.setOffline(false);
    rows.push({
      scenario: `offline load of ${SCREENS.length} routes and 3 deep paths`,
      before, after, lost: Math.max(0, before - after), duplicated: Math.max(0, after - before),
      message: failed.length === 0 ? `all ${targets.length} rendered from the service worker` : `blank or wrong: ${failed.join('; ')}`,
    });
    expect(failed).toEqual([]);
  });

  it('no scenario lost or duplicated anything', () => {
    expect(rows.length).toBeGreaterThan(0);
    expect(rows.filter((r) => r.lost > 0 || r.duplicated > 0)).toEqual([]);
  });
});
