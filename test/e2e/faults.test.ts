// The fault matrix: every fault the reliability work covers, injected into the built app in
// headless Chromium, each scenario counting the saved checks before and after, the checks (or typed
// fields) lost, the checks saved twice, and the message the person was shown. The table is printed
// at the end; the bar is zero lost and zero duplicated on every row.
//
// What each row is held to is outside the app's own say-so: the counts come from the Review
// screen's totals and from the files the test made; the typed values are the ones the test typed;
// hostile strings are looked for in the DOM itself. The data is invented: generated logs
// (bench/generated-log.ts) and the demo plant, which is labelled DEMO DATA. No fixed waits stand
// for "the app is done": every wait is on the app's own completion state (data-save-state, data-draft,
// data-draft-state, data-import-result, data-complete); the only timed pauses are the faults themselves
// (a close 100 ms after Save).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';
import { DIST, LONG_JOB_MS, ROOT, launch, pickVessel, startServer, tempProfile, waitForControl, type StaticServer } from './harness.ts';
import { SCREENS } from '../../src/ui/router.ts';
import { backupText, generatedBackup, generatedChecks, generatedVessels, signGenerated, type LogSpec } from '../../bench/generated-log.ts';
import { computeCheckHash } from '../../src/store/integrity.ts';
import type { CheckRecord } from '../../src/store/records.ts';

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
  const body = rows.map((r) => [r.scenario, String(r.before), String(r.after), String(r.lost), String(r.duplicated), r.message.replace(/\s+/g, ' ').slice(0, 120)]);
  const widths = head.map((h, i) => Math.max(h.length, ...body.map((b) => b[i]!.length)));
  const line = (cells: string[]) => `| ${cells.map((c, i) => c.padEnd(widths[i]!)).join(' | ')} |`;
  console.log(['', 'Fault matrix', line(head), `|${widths.map((w) => '-'.repeat(w + 2)).join('|')}|`, ...body.map(line), ''].join('\n'));
}

/** Re-hashes a chain from record `from` on (each prevHash the hash before it), as the store would have hashed it. */
async function rechain(checks: CheckRecord[], from = 0): Promise<void> {
  for (let i = from; i < checks.length; i += 1) {
    const r = checks[i]!;
    r.prevHash = i === 0 ? '0'.repeat(64) : checks[i - 1]!.hash;
    const { hash: _h, ...content } = r;
    r.hash = await computeCheckHash(content);
  }
}

/** Strings that would do something if they were ever treated as markup, script, a link or a formula. */
const HOSTILE = [
  '<img src=x onerror="window.__pwned=1">',
  '<script>window.__pwned=2</script>',
  '"><svg onload="window.__pwned=3">',
  'javascript:window.__pwned=4',
  '{{constructor.constructor("window.__pwned=5")()}}',
  '=HYPERLINK("http://198.51.100.7/x","open")',
  '\u202eRTL override\u202c <b>bold</b> &amp; &lt;',
] as const;

const BASE: LogSpec = {
  deviceId: '3c9f0e21-7a4b-4d6e-9f10-2b3c4d5e6f70', vesselPrefix: '5eed0301', vessels: 6, checks: 2000,
  startMs: Date.parse('2025-03-01T06:00:00Z'), stepMs: 3_600_000, technicians: ['Gen Six', 'Gen Seven'], seed: 41,
};
/**
 * About 150 MB: 82,000 signed generated checks of about 1,840 bytes each (TANKSIDE_FAULTS_SMALL=1,
 * for a quicker run while working on this file: 3,000).
 */
const LARGE: LogSpec = {
  deviceId: '8e2d4c6a-1b3f-4a5e-8c7d-9f0a1b2c3d4e', vesselPrefix: '5eed0302', vessels: 200, checks: process.env.TANKSIDE_FAULTS_SMALL ? 3000 : 82_000,
  startMs: Date.parse('2022-01-01T00:00:00Z'), stepMs: 600_000, technicians: ['Gen Eight', 'Gen Nine', 'Gen Ten'], seed: 42, signed: true,
};

describe('fault matrix', () => {
  const profile = tempProfile();
  const files = mkdtempSync(join(tmpdir(), 'tankside-faults-'));
  const NEXT = join(ROOT, 'test-results/dist-faults-next');
  const file = (name: string) => join(files, name);
  let server: StaticServer;
  let ctx: BrowserContext | null = null;
  /** Import reports shown in the current page (the panel numbers them from 1). */
  let importRuns = 0;
  const foreign: string[] = [];
  const dialogs: string[] = [];
  const workers: string[] = [];

  beforeAll(async () => {
    server = await startServer(DIST);
    // A second build with another version, to arrive as an update mid-entry.
    const built = spawnSync('npx', ['vite', 'build', '--outDir', NEXT, '--logLevel', 'warn'], { cwd: ROOT, env: { ...process.env, NODE_ENV: 'production', TANKSIDE_BUILD_TAG: 'next' }, stdio: 'inherit' });
    expect(built.status).toBe(0);

    // Another device's valid signed log, and damaged copies of it.
    const vessels = generatedVessels(parseInt(BASE.vesselPrefix, 16), BASE.vessels, BASE.startMs);
    const checks = await generatedChecks(BASE, vessels);
    const signing = await signGenerated(checks);
    const at = '2025-06-01T00:00:00+01:00';
    const valid = backupText(vessels, checks, at, signing);
    writeFileSync(file('valid.json'), valid);
    writeFileSync(file('truncated.json'), valid.slice(0, Math.floor(valid.length / 2)));
    // One digit of one record changed, not re-hashed.
    const lines = valid.split('\n');
    const i = lines.findIndex((l) => l.includes(`"seq":${BASE.checks / 2},`));
    lines[i] = lines[i]!.replace(/"liquidMassKg":(\d)/, (_m, d: string) => `"liquidMassKg":${(Number(d) + 1) % 10}`);
    writeFileSync(file('altered.json'), lines.join('\n'));
    // A record changed and the chain re-hashed after it; the signatures left as they were.
    const edited = checks.map((c) => ({ ...c }));
    edited[999] = { ...edited[999]!, technician: 'Someone Else' };
    await rechain(edited, 999);
    writeFileSync(file('rehashed.json'), backupText(vessels, edited, at, signing));
    const proto = valid.replace('"vessels":[\n{', '"vessels":[\n{"__proto__":{"retired":true},');
    writeFileSync(file('proto.json'), proto);
    writeFileSync(file('nested.json'), valid.replace('"reading":{', `"reading":{"deep":${'['.repeat(100_000)}${']'.repeat(100_000)},`));

    // A valid file of its own device whose texts are hostile, every one shown somewhere by the app.
    const hv = generatedVessels(parseInt('5eed0303', 16), 2, BASE.startMs).map((v, k) => ({
      ...v, tag: k === 0 ? '<b>X-1</b>' : 'javascript:alert(1)', tagKey: (k === 0 ? '<b>X-1</b>' : 'javascript:alert(1)').toLowerCase(), description: HOSTILE[0],
    }));
    const hc = await generatedChecks({ ...BASE, deviceId: '4d0e1f32-8b5c-4e7f-a021-3c4d5e6f7081', vesselPrefix: '5eed0303', vessels: 2, checks: 6, seed: 43 }, hv);
    hc.forEach((c, k) => {
      c.technician = HOSTILE[(k + 1) % HOSTILE.length]!;
      c.note = HOSTILE.join(' ');
      c.inputs['temperature'] = { text: '<i>150</i>', unit: 'degC' };
      c.cautions = [{ signal: 'WARNING', message: HOSTILE[2], rule: '<script>rule</script>' }, ...c.cautions];
      c.vessel = { tag: hv[k % 2]!.tag, spec: hv[k % 2]!.spec };
    });
    await rechain(hc);
    writeFileSync(file('hostile.json'), backupText(hv, hc, at));

    // Large enough that each phase of its import lasts long enough to be cancelled in (as cancel.test.ts).
    writeFileSync(file('medium.json'), await generatedBackup({ ...BASE, deviceId: '5e1f2a43-9c6d-4f80-b132-4d5e6f708192', checks: 30_000, seed: 44 }));
    writeFileSync(file('large.json'), await generatedBackup(LARGE));
  });
  afterAll(async () => {
    await ctx?.close();
    await server.close();
    profile.remove();
    rmSync(files, { recursive: true, force: true });
    rmSync(NEXT, { recursive: true, force: true });
    printTable();
  });

  /** A fresh browser on the same profile (the previous one closed), on `route`; `beforeLoad` runs on the blank page first. */
  async function relaunch(route: string, beforeLoad?: (page: Page) => Promise<void>): Promise<Page> {
    await ctx?.close();
    ctx = await launch(profile.dir);
    importRuns = 0;
    ctx.on('request', (r) => { if (/^(https?|wss?):/.test(r.url()) && !r.url().startsWith(server.url)) foreign.push(r.url()); });
    // What the page's own thread parses as JSON: an import done on the page would parse the whole file here.
    await ctx.addInitScript(() => {
      const parse = JSON.parse;
      (window as unknown as { __parsedChars: number }).__parsedChars = 0;
      JSON.parse = function (text: string, reviver?: (this: unknown, key: string, value: unknown) => unknown) {
        const w = window as unknown as { __parsedChars: number };
        if (typeof text === 'string') w.__parsedChars = Math.max(w.__parsedChars, text.length);
        return parse(text, reviver);
      } as typeof JSON.parse;
    });
    const page = ctx.pages()[0] ?? (await ctx.newPage());
    page.on('dialog', (d) => { dialogs.push(d.message()); void d.dismiss(); });
    page.on('worker', (w) => workers.push(w.url()));
    await beforeLoad?.(page);
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

  /** Waits until every draft write the page issued has committed (the app's own data-draft-state). */
  async function draftsStored(page: Page): Promise<void> {
    await page.locator('html[data-draft-state="saved"]').waitFor({ state: 'attached', timeout: LONG_JOB_MS });
  }

  /** The typed fields of `entry` not in the form as shown. */
  async function fieldsLost(page: Page, entry: Entry): Promise<number> {
    const shown = [await page.inputValue('#chk-temperature'), await page.inputValue('#chk-pressure'), await page.inputValue('#chk-gross')];
    return [entry.temperature, entry.pressure, entry.gross].filter((v, i) => shown[i] !== v).length;
  }

  /** Imports `name` on the Review screen; `arm` runs first (a cancel armed in the page). Returns the report's outcome and text. */
  async function importOnScreen(page: Page, name: string, arm?: () => Promise<void>): Promise<{ result: string; text: string }> {
    if (!page.url().endsWith('#/review')) await page.goto(`${server.url}#/review`);
    await page.locator('[data-review-state="ready"]').waitFor({ timeout: LONG_JOB_MS });
    await arm?.();
    importRuns += 1;
    await page.setInputFiles('#rt-file', file(name));
    await page.getByRole('button', { name: 'Import and merge' }).click();
    const report = page.locator(`[data-import-run="${importRuns}"] [data-import-result]`);
    await report.waitFor({ timeout: LONG_JOB_MS });
    return { result: (await report.getAttribute('data-import-result')) ?? '', text: (await report.textContent()) ?? '' };
  }

  /** Has the page click Cancel beside the import's progress as soon as it stands at `at` (see cancel.test.ts). */
  async function cancelAt(page: Page, at: 'start' | { above: number; below: number }): Promise<void> {
    await page.evaluate((when) => {
      const w = window as unknown as { cancelledAt: string | null };
      w.cancelledAt = null;
      const observer = new MutationObserver(() => {
        const p = document.getElementById('transfer-progress') as HTMLProgressElement | null;
        if (!p) return;
        const counting = p.hasAttribute('value');
        const ready = when === 'start' ? !counting : counting && p.value > when.above && p.value < when.below && p.value < p.max;
        if (!ready) return;
        observer.disconnect();
        w.cancelledAt = counting ? `${p.value} of ${p.max}` : 'start';
        p.closest('.work-progress')!.querySelector('button')!.click();
      });
      observer.observe(document.body, { subtree: true, childList: true, attributes: true, attributeFilter: ['value', 'max'] });
    }, at);
  }

  /** One import scenario: the file must change nothing (refused or cancelled), or add exactly `adds` checks. */
  async function importRow(
    scenario: string, name: string, expect_: { result: string; adds: number; text: RegExp },
    arm?: (page: Page) => Promise<void>, beforeLoad?: (page: Page) => Promise<void>,
  ): Promise<void> {
    const page = await relaunch('#/review', beforeLoad);
    const before = await storedChecks(page);
    const outcome = await importOnScreen(page, name, arm && (() => arm(page)));
    const after = await storedChecks(page);
    rows.push({ scenario, before, after, lost: Math.max(0, before + expect_.adds - after), duplicated: Math.max(0, after - before - expect_.adds), message: outcome.text });
    expect(outcome.result, outcome.text).toBe(expect_.result);
    expect(outcome.text).toMatch(expect_.text);
    expect(after).toBe(before + expect_.adds);
  }

  it('has a demo plant to work on', async () => {
    const page = await relaunch('#/vessels');
    await waitForControl(page);
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
      const status = page.locator('[data-save-state="saved"]');
      await status.waitFor({ timeout: LONG_JOB_MS });
      let message = (await status.textContent()) ?? '';
      await pause(ms);
      page = await relaunch('#/check');
      await checkScreen(page);
      // The entry back in the form with Save enabled invites saving it twice: do what a person would.
      const back = (await fieldsLost(page, ENTRY)) === 0;
      if (back && (await page.getByRole('button', { name: 'Save check' }).isEnabled())) {
        await page.getByRole('button', { name: 'Save check' }).click();
        await page.locator('[data-save-state="saved"]').waitFor({ timeout: LONG_JOB_MS });
        message += ' / after reopening: the saved entry was back in the form, saved again';
      }
      const after = await storedChecks(page);
      rows.push({ scenario: `close ${ms} ms after Save`, before, after, lost: Math.max(0, before + 1 - after), duplicated: Math.max(0, after - before - 1), message });
      expect(back, 'the saved entry came back in the form').toBe(false);
      expect(after).toBe(before + 1);
    });
  }

  for (const how of ['close', 'reload'] as const) {
    it(`${how} at 0 ms mid-entry: every typed field is back`, async () => {
      let page = await relaunch('#/check');
      const before = await storedChecks(page);
      await checkScreen(page);
      const entry = how === 'close' ? ENTRY : { temperature: '149,2', pressure: '380', gross: '640' };
      await typeEntry(page, entry, `${how} mid-entry`);
      // The last keystroke, then at once the browser closes or the page reloads.
      if (how === 'close') page = await relaunch('#/check');
      else await page.reload();
      await checkScreen(page);
      const lost = await fieldsLost(page, entry);
      const after = await storedChecks(page);
      rows.push({ scenario: `${how} at 0 ms mid-entry`, before, after, lost: lost + Math.max(0, before - after), duplicated: Math.max(0, after - before), message: lost === 0 ? '(entry back in the form)' : '' });
      expect(lost).toBe(0);
      expect(after).toBe(before);
    });
  }

  it('offline restart: a check saved offline is there after the browser restarts offline', async () => {
    let page = await relaunch('#/check');
    const before = await storedChecks(page);
    await ctx!.setOffline(true);
    await checkScreen(page);
    await typeEntry(page, ENTRY, 'saved offline');
    await page.getByRole('button', { name: 'Save check' }).click();
    const status = page.locator('[data-save-state="saved"]');
    await status.waitFor({ timeout: LONG_JOB_MS });
    const message = (await status.textContent()) ?? '';
    await ctx!.close();
    ctx = await launch(profile.dir);
    await ctx.setOffline(true);
    page = ctx.pages()[0] ?? (await ctx.newPage());
    const after = await storedChecks(page);
    await ctx.setOffline(false);
    rows.push({ scenario: 'offline restart after a save', before, after, lost: Math.max(0, before + 1 - after), duplicated: Math.max(0, after - before - 1), message });
    expect(after).toBe(before + 1);
  });

  it('quota exceeded on save: refused with a message, the entry kept, saved once there is room', async () => {
    let page = await relaunch('#/check');
    const before = await storedChecks(page);
    const usage = await page.evaluate(async () => (await navigator.storage.estimate()).usage ?? 0);
    const origin = server.url.replace(/\/$/, '');
    // Chromium keeps an origin's quota from its first IndexedDB use in a browser session, so the
    // override goes in before the app opens its database: a quota just above what is used.
    page = await relaunch('#/check', async (blank) => {
      await (await ctx!.newCDPSession(blank)).send('Storage.overrideQuotaForOrigin', { origin, quotaSize: usage + 400_000 });
    });
    await checkScreen(page);
    await typeEntry(page, ENTRY, 'quota on save');
    await draftsStored(page);
    // The room left filled with values that do not compress: the save's write (a block, a month
    // bucket, an id bucket) then finds none.
    const filled = await page.evaluate(async () => {
      const db = await new Promise<IDBDatabase>((ok, no) => {
        const q = indexedDB.open('fault-filler', 1);
        q.onupgradeneeded = () => q.result.createObjectStore('fill');
        q.onsuccess = () => ok(q.result);
        q.onerror = () => no(q.error);
      });
      const put = (bytes: number) => new Promise<boolean>((ok) => {
        const random = crypto.getRandomValues(new Uint8Array(bytes / 2));
        const tx = db.transaction('fill', 'readwrite', { durability: 'strict' });
        tx.objectStore('fill').put(Array.from(random, (b) => b.toString(16).padStart(2, '0')).join(''), crypto.randomUUID());
        tx.oncomplete = () => ok(true);
        tx.onabort = () => ok(false);
      });
      let n = 0;
      for (const size of [32_000, 4_000, 1_000]) for (let i = 0; i < 400 && (await put(size)); i += 1) n += size;
      db.close();
      return n;
    });
    await page.getByRole('button', { name: 'Save check' }).click();
    const failed = page.locator('[data-save-state="failed"]');
    await failed.waitFor({ timeout: LONG_JOB_MS });
    const message = (await failed.textContent()) ?? '';
    const kept = await fieldsLost(page, ENTRY);
    // Room again: the filler goes, and the same entry saves once.
    await page.evaluate(() => new Promise((done) => { indexedDB.deleteDatabase('fault-filler').onsuccess = done; }));
    await (await ctx!.newCDPSession(page)).send('Storage.overrideQuotaForOrigin', { origin });
    await page.getByRole('button', { name: 'Save check' }).click();
    await page.locator('[data-save-state="saved"]').waitFor({ timeout: LONG_JOB_MS });
    const after = await storedChecks(page);
    rows.push({ scenario: 'quota exceeded on save, then room', before, after, lost: kept + Math.max(0, before + 1 - after), duplicated: Math.max(0, after - before - 1), message });
    expect(filled).toBeGreaterThan(0);
    expect(message).toMatch(/Not saved, your entry is kept: .*no storage left/);
    expect(kept).toBe(0);
    expect(after).toBe(before + 1);
  });

  it('quota exceeded on import: nothing written, said so', async () => {
    const page = await relaunch('#/review');
    const usage = await page.evaluate(async () => (await navigator.storage.estimate()).usage ?? 0);
    const origin = server.url.replace(/\/$/, '');
    // As above: the quota set before the app first opens its database in this browser session.
    await importRow('quota exceeded on import', 'valid.json', { result: 'refused', adds: 0, text: /no storage left/ }, undefined, async (blank) => {
      await (await ctx!.newCDPSession(blank)).send('Storage.overrideQuotaForOrigin', { origin, quotaSize: usage + 50_000 });
    });
    await (await ctx!.newCDPSession(ctx!.pages()[0]!)).send('Storage.overrideQuotaForOrigin', { origin });
  });

  for (const [stage, at] of [['reading and parsing', 'start'], ['hashing', { above: 0, below: 30_000 }], ['writing', { above: 30_000, below: Infinity }]] as const) {
    it(`import cancelled while ${stage}: nothing written`, async () => {
      await importRow(`import cancelled while ${stage}`, 'medium.json', { result: 'cancelled', adds: 0, text: /cancelled; nothing was changed/ }, (page) => cancelAt(page, at));
    });
  }

  it('damaged and hostile files: each refused whole, nothing written, the reason named', async () => {
    await importRow('truncated file', 'truncated.json', { result: 'refused', adds: 0, text: /not imported, nothing changed\. file: not valid JSON/ });
    await importRow('one digit altered', 'altered.json', { result: 'refused', adds: 0, text: new RegExp(`one record fails its checks.*seq ${BASE.checks / 2}: content does not match its hash`) });
    await importRow('edited and re-hashed (signed)', 'rehashed.json', { result: 'refused', adds: 0, text: /seq 1000: its signature does not verify/ });
    await importRow('"__proto__" key', 'proto.json', { result: 'refused', adds: 0, text: /the key "__proto__" is not allowed/ });
    await importRow('nested 100,000 deep', 'nested.json', { result: 'refused', adds: 0, text: /not valid JSON|nested deeper than 16 levels/ });
  });

  it('a valid file with hostile strings imports, and every string stays text in the DOM', async () => {
    await importRow('hostile strings (valid file)', 'hostile.json', { result: 'done', adds: 6, text: /Added 6 checks/ });
    const page = ctx!.pages()[0]!;
    const inert = async (where: string) => {
      const found = await page.evaluate(() => ({
        pwned: (window as unknown as { __pwned?: unknown }).__pwned ?? null,
        imgX: document.querySelectorAll('img[src="x"], img[onerror]').length,
        inlineScripts: [...document.scripts].filter((s) => !s.src).length,
        handlers: [...document.querySelectorAll('*')].filter((el) => [...el.attributes].some((a) => a.name.toLowerCase().startsWith('on'))).length,
        markup: document.querySelectorAll('main b, main i, main svg[onload]').length,
        scriptLinks: [...document.querySelectorAll('a')].filter((a) => a.href.toLowerCase().startsWith('javascript:')).length,
      }));
      expect(found, where).toEqual({ pwned: null, imgX: 0, inlineScripts: 0, handlers: 0, markup: 0, scriptLinks: 0 });
    };
    await page.locator('.review-row').first().waitFor({ timeout: LONG_JOB_MS });
    expect(await page.locator('main').textContent()).toContain('<b>X-1</b>');
    await inert('review list');
    await page.goto(`${server.url}#/log`);
    await page.getByRole('link', { name: /<b>X-1<\/b>/ }).first().click();
    await page.locator('#rec-h').waitFor({ timeout: LONG_JOB_MS });
    expect(await page.locator('main').textContent()).toContain(HOSTILE[0]);
    expect(await page.locator('main').textContent()).toContain('<i>150</i>');
    await inert('record view');
    await page.goto(`${server.url}#/vessels`);
    await page.getByRole('link', { name: /javascript:alert\(1\)/ }).first().waitFor({ timeout: LONG_JOB_MS });
    await inert('vessel list');
    expect(dialogs).toEqual([]);
  });

  it('a real 150 MB valid signed backup imports whole on a worker; the page parses none of it', async () => {
    const size = statSync(file('large.json')).size;
    await importRow(`valid ${(size / 1e6).toFixed(0)} MB signed backup`, 'large.json', { result: 'done', adds: LARGE.checks, text: new RegExp(`Added ${LARGE.checks.toLocaleString('en-GB')} checks`) });
    const page = ctx!.pages()[0]!;
    // The import ran on its worker, which read and parsed the file: the page's thread parsed no JSON text near its size.
    expect(workers.some((u) => u.includes('import-worker'))).toBe(true);
    expect(await page.evaluate(() => (window as unknown as { __parsedChars: number }).__parsedChars)).toBeLessThan(1_000_000);
    rows[rows.length - 1]!.message += ` (signed by device ${LARGE.deviceId.slice(0, 8)}; the page's thread parsed no JSON over 1 MB)`;
  });

  it('offline: every route and three deep paths render from the service worker', async () => {
    let page = await relaunch('#/vessels');
    await waitForControl(page);
    const before = await storedChecks(page);
    await ctx!.setOffline(true);
    // A fresh start offline, as on a phone with no signal, then each route and paths no link makes.
    page = await relaunch('#/vessels');
    await ctx!.setOffline(true);
    const targets = [
      ...SCREENS.map((s) => ({ path: `#/${s.id}`, title: s.title })),
      { path: 'some/deep/path', title: 'New check' },
      { path: 'some/deep/path#/log', title: 'Log' },
      { path: 'a/b/c/d/index.html#/review', title: 'Review' },
    ];
    const failed: string[] = [];
    for (const t of targets) {
      // From a blank page, so a route that differs only in its hash is still a load of the shell.
      await page.goto('about:blank');
      const response = await page.goto(`${server.url}${t.path}`);
      // The screen is up once the store is open and its chunk (from the worker's cache) has loaded.
      const screen = page.locator('main[data-app-state="ready"]:not(:has([data-screen-state="loading"]))');
      const up = await screen.waitFor({ state: 'attached', timeout: 20_000 }).then(() => true, () => false);
      const shown = up ? await page.locator('header h1').textContent() : null;
      const broken = await page.getByText(/could not be loaded/).count();
      const styled = await page.evaluate(() => getComputedStyle(document.body).margin === '0px');
      if (shown !== t.title || broken > 0 || !response?.fromServiceWorker() || !styled) failed.push(`${t.path}: ${shown ?? 'blank'}${broken ? ' (not loaded)' : ''}`);
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

  it('the precache holds every built file', async () => {
    const page = await relaunch('#/vessels');
    await waitForControl(page);
    const cached = await page.evaluate(async () => {
      const urls: string[] = [];
      for (const name of await caches.keys()) for (const r of await (await caches.open(name)).keys()) urls.push(new URL(r.url).pathname);
      return urls;
    });
    const built: string[] = [];
    const walk = (dir: string) => {
      for (const entry of readdirSync(dir)) {
        const path = join(dir, entry);
        if (statSync(path).isDirectory()) walk(path);
        else built.push(`/${relative(DIST, path)}`);
      }
    };
    walk(DIST);
    // The worker's own script is not precached (the browser keeps it), nor the build's manifest for the size check.
    const expected = built.filter((p) => p !== '/sw.js' && !p.startsWith('/.vite/')).sort();
    const missing = expected.filter((p) => !cached.includes(p));
    const n = await storedChecks(page);
    rows.push({ scenario: 'precache holds every built file', before: n, after: n, lost: 0, duplicated: 0, message: missing.length === 0 ? `${expected.length} of ${expected.length} files cached` : `missing: ${missing.join(', ')}` });
    expect(missing).toEqual([]);
  });

  it('update mid-entry: the person accepts at once after the last keystroke, the entry is all there after the reload', async () => {
    const page = await relaunch('#/check');
    await waitForControl(page);
    const before = await storedChecks(page);
    await checkScreen(page);
    const entry = { temperature: '147,0', pressure: '350', gross: '655' };
    await typeEntry(page, entry, 'update mid-entry');
    server.serve(NEXT);
    await page.evaluate(async () => { await (await navigator.serviceWorker.getRegistration())?.update(); });
    const banner = page.getByText('A new version of Tankside is ready');
    await banner.waitFor({ timeout: LONG_JOB_MS });
    await page.fill('#chk-gross', '656');
    await page.getByRole('button', { name: 'Reload now' }).click();
    await page.locator('.app-version', { hasText: '+next' }).waitFor({ timeout: LONG_JOB_MS });
    await checkScreen(page);
    const lost = await fieldsLost(page, { ...entry, gross: '656' });
    const after = await storedChecks(page);
    server.serve(DIST);
    rows.push({ scenario: 'update accepted mid-entry', before, after, lost: lost + Math.max(0, before - after), duplicated: Math.max(0, after - before), message: 'A new version of Tankside is ready / (entry back after the reload)' });
    expect(lost).toBe(0);
  });

  it('no request ever left for another origin', () => {
    rows.push({ scenario: 'requests to other origins', before: 0, after: 0, lost: 0, duplicated: 0, message: foreign.length === 0 ? 'none' : foreign.slice(0, 5).join(' ') });
    expect(foreign).toEqual([]);
  });

  it('no scenario lost or duplicated anything', () => {
    expect(rows.length).toBeGreaterThan(20);
    expect(rows.filter((r) => r.lost > 0 || r.duplicated > 0)).toEqual([]);
  });
});
