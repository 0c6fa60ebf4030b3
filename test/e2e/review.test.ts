// The review screen as a supervisor uses it, across two browser profiles (two devices): import a
// generated log, filter it, check the chains, print the vessel report, export a backup; in the
// second profile a backup with one field changed is refused whole, naming exactly that record, and
// the untouched backup then makes both profiles' records identical.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';
import Papa from 'papaparse';
import { DIST, LONG_JOB_MS, SCREENS_DIR, axeViolations, launch, pickVessel, screenshot, smallTargets, startServer, tempProfile, type StaticServer, verifyChainsOnScreen } from './harness.ts';
import { generatedBackup } from '../../bench/generated-log.ts';

const DEVICE = '6b1e0d2a-3c4f-4a5b-8c6d-7e8f90a1b2c3';
const LOG = {
  deviceId: DEVICE, vesselPrefix: '5eed0001', vessels: 4, checks: 40,
  startMs: Date.parse('2026-10-20T06:00:00Z'), stepMs: 24 * 3_600_000, technicians: ['Gen One', 'Gen Two'], seed: 11,
};

describe('review across two profiles', () => {
  const files = mkdtempSync(join(tmpdir(), 'tankside-review-'));
  const profiles = [tempProfile(), tempProfile()];
  let server: StaticServer;
  let ctx: BrowserContext | null = null;

  beforeAll(async () => {
    server = await startServer(DIST);
    writeFileSync(join(files, 'generated.json'), await generatedBackup(LOG));
  });
  afterAll(async () => {
    await ctx?.close();
    await server.close();
    for (const p of profiles) p.remove();
    rmSync(files, { recursive: true, force: true });
  });

  /** Imports done in the current page (the screen numbers its import reports from 1). */
  let run = 0;
  async function open(profile: number): Promise<Page> {
    await ctx?.close();
    ctx = await launch(profiles[profile]!.dir);
    run = 0;
    const page = ctx.pages()[0] ?? (await ctx.newPage());
    await page.goto(`${server.url}#/review`);
    await page.locator('[data-review-state="ready"]').waitFor();
    return page;
  }

  async function importFile(page: Page, file: string): Promise<void> {
    run += 1;
    await page.setInputFiles('#rt-file', file);
    await page.getByRole('button', { name: 'Import and merge' }).click();
    const result = page.locator(`[data-import-run="${run}"] [data-import-result]`);
    await result.waitFor();
    expect(await result.getAttribute('data-import-result'), await result.textContent() ?? '').toBe('done');
  }

  async function download(page: Page, button: string, name: string): Promise<string> {
    const [dl] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: button }).click()]);
    const path = join(files, name);
    await dl.saveAs(path);
    return path;
  }

  const withoutStamp = (text: string) => text.replace(/"exportedAt":"[^"]*"/, '"exportedAt":""');

  it('profile A: imports the log, filters it, shows intact chains, prints the report, exports', async () => {
    const page = await open(0);
    await importFile(page, join(files, 'generated.json'));
    expect(await page.getAttribute('[data-import-added]', 'data-import-added')).toBe('40');

    await expect.poll(() => page.locator('#rf-vessel option').count()).toBe(5);
    await pickVessel(page, '#rf-vessel', 'GEN-0002');
    await expect.poll(() => page.textContent('[data-total="checks"]')).toBe('10');
    const tags = await page.locator('.review-row strong').allTextContents();
    expect(tags).toHaveLength(10);
    expect(new Set(tags)).toEqual(new Set(['GEN-0002']));
    await page.fill('#rf-month', '2026-11');
    await page.dispatchEvent('#rf-month', 'change');
    // GEN-0002 takes every 4th of 40 daily checks (2026-10-20 to 11-28) from 10-21: in November the 2nd … 26th, seven.
    await expect.poll(() => page.textContent('[data-total="checks"]')).toBe('7');
    const days = await page.locator('.review-row-top span').allTextContents();
    expect(days.map((d) => d.slice(0, 10)).sort()).toEqual(['02', '06', '10', '14', '18', '22', '26'].map((d) => `2026-11-${d}`));

    expect((await verifyChainsOnScreen(page)).lines.map((l) => l.chain)).toEqual(['ok']);
    expect(await page.textContent('[data-chain="ok"]')).toContain('40 records');

    // Keyboard only: Tab reaches every control of the screen, in reading order.
    await page.focus('header h1');
    const reached: string[] = [];
    for (let i = 0; i < 40; i += 1) {
      await page.keyboard.press('Tab');
      reached.push(await page.evaluate(() => {
        const el = document.activeElement as HTMLElement | null;
        return el?.id || el?.textContent?.trim().slice(0, 24) || el?.tagName || '';
      }));
    }
    const order = ['rf-vessel', 'rf-month', 'rf-from', 'rf-to', 'rf-verdict', 'rf-outcome', 'rf-tech', 'rf-device', 'Clear filter', 'rl-order', 'Trend and report for GEN', 'Verify chains', 'Download CSV', 'Download JSON backup', 'rt-file'];
    const positions = order.map((name) => reached.findIndex((r) => r.startsWith(name)));
    expect(positions.every((p) => p >= 0), `${order.filter((_, i) => positions[i]! < 0)} not reached in ${reached}`).toBe(true);
    expect([...positions].sort((a, b) => a - b)).toEqual(positions);
    await page.keyboard.press('Escape');

    await page.getByRole('button', { name: 'Trend and report for GEN-0002' }).click();
    await page.locator('.trend-chart').waitFor();
    expect(await page.locator('.report-table tbody tr').count()).toBe(7);
    expect(await page.locator('.trend-line').count()).toBe(3);
    expect(await page.locator('.trend-mark').count()).toBeGreaterThan(0);
    expect(await axeViolations(page)).toEqual([]);
    expect(await smallTargets(page)).toEqual([]);
    await screenshot(page, 'review');
    await page.emulateMedia({ colorScheme: 'dark' });
    expect(await axeViolations(page)).toEqual([]);
    await screenshot(page, 'review-dark');
    await page.emulateMedia({ colorScheme: 'light' });
    await page.setViewportSize({ width: 320, height: 700 });
    const wide = await page.evaluate(() => [...document.querySelectorAll('body *')]
      .filter((el) => !el.closest('.table-wrap') && el.getBoundingClientRect().right > document.documentElement.clientWidth + 0.5)
      .map((el) => `${el.tagName.toLowerCase()}.${el.className}`).slice(0, 5));
    expect(wide, 'wider than 320 px (the report table scrolls inside its own region)').toEqual([]);
    await page.setViewportSize({ width: 360, height: 780 });
    await page.emulateMedia({ colorScheme: 'light', media: 'print' });
    expect(await page.locator('.top').isVisible()).toBe(false);
    expect(await page.locator('.review-filters').isVisible()).toBe(false);
    expect(await page.locator('.print-report').isVisible()).toBe(true);
    mkdirSync(SCREENS_DIR, { recursive: true });
    const pdf = join(SCREENS_DIR, 'review-report.pdf');
    await page.pdf({ path: pdf, format: 'A4', printBackground: true });
    expect(readFileSync(pdf).subarray(0, 5).toString()).toBe('%PDF-');
    if (existsSync('/usr/bin/pdftoppm')) spawnSync('/usr/bin/pdftoppm', ['-png', '-r', '60', '-f', '1', '-l', '2', pdf, join(SCREENS_DIR, 'review-report')]);
    await page.emulateMedia({ media: 'screen' });

    await page.selectOption('#rf-vessel', '');
    const json = JSON.parse(readFileSync(await download(page, 'Download JSON backup', 'a.json'), 'utf8')) as { checks: { id: string; result: { inventory: { liquidMassKg: number; quality: number } } }[] };
    // Read back with a general-purpose CSV parser (papaparse): one row per check, numbers as numbers.
    const csv = Papa.parse<Record<string, unknown>>(readFileSync(await download(page, 'Download CSV', 'a.csv'), 'utf8'), { header: true, dynamicTyping: true, skipEmptyLines: true });
    expect(csv.errors).toEqual([]);
    expect(csv.data).toHaveLength(40);
    const byId = new Map(json.checks.map((c) => [c.id, c]));
    for (const row of csv.data) {
      const check = byId.get(String(row['check id']));
      expect(check).toBeDefined();
      expect(row['liquid mass (kg)']).toBe(check!.result.inventory.liquidMassKg);
      expect(row['quality (kg/kg)']).toBe(check!.result.inventory.quality);
    }
  });

  it('profile B: one changed field refuses the whole file, naming that record by device and seq; the untouched file then makes records match A', async () => {
    const original = readFileSync(join(files, 'a.json'), 'utf8');
    const lines = original.split('\n');
    const i = lines.findIndex((l) => l.includes('"seq":13,'));
    // Canonical JSON sorts keys, so the record's own "id" is the first one on its line.
    const changedId = /"id":"([0-9a-f-]{36})"/.exec(lines[i]!)![1]!;
    expect(lines[i]).toContain('"technician":"Gen One"');
    lines[i] = lines[i]!.replace('"technician":"Gen One"', '"technician":"Gen Three"');
    writeFileSync(join(files, 'changed.json'), lines.join('\n'));

    const page = await open(1);
    // The panel's promise, and the import keeping it: nothing of the damaged file is written.
    expect(await page.textContent('#rt-file + .hint')).toMatch(/nothing is imported and every such record is listed/);
    run += 1;
    await page.setInputFiles('#rt-file', join(files, 'changed.json'));
    await page.getByRole('button', { name: 'Import and merge' }).click();
    const refused = page.locator(`[data-import-run="${run}"] [data-import-result]`);
    await refused.waitFor({ timeout: LONG_JOB_MS });
    expect(await refused.getAttribute('data-import-result')).toBe('refused');
    expect(await refused.getAttribute('data-import-refused')).toBe('1');
    expect(await refused.textContent()).toMatch(/nothing changed/);
    const listed = await page.locator('[data-import="refused"] li').allTextContents();
    expect(listed).toHaveLength(1);
    expect(listed[0]).toContain(`device ${DEVICE.slice(0, 8)} seq 13`);
    expect(listed[0]).toContain(changedId);
    expect(listed[0]).toMatch(/content does not match its hash/);
    await page.locator('.review-totals[data-complete="yes"]').waitFor({ timeout: LONG_JOB_MS });
    expect(await page.textContent('[data-total="checks"]')).toBe('0');
    const none = await verifyChainsOnScreen(page);
    expect(none.state).toBe('done');
    expect(none.lines).toEqual([]);

    await importFile(page, join(files, 'a.json'));
    expect(await page.getAttribute(`[data-import-run="${run}"] [data-import-added]`, 'data-import-added')).toBe('40');
    expect((await verifyChainsOnScreen(page)).lines.map((l) => l.chain)).toEqual(['ok']);
    const again = await download(page, 'Download JSON backup', 'b.json');
    expect(withoutStamp(readFileSync(again, 'utf8'))).toBe(withoutStamp(original));
  });
});
