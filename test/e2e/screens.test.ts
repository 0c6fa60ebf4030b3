// Every screen, as a phone shows it: axe-core finds no violations (light and dark scheme), nothing
// scrolls sideways at 320 px, touch targets are at least 48 px, and a 390×844 screenshot of each
// (what the screen shows, and the whole page) is saved in test-results/screens/ for a person to look at.
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BrowserContext, Page } from 'playwright-core';
import {
  DIST, PHONE, SCREENS_DIR, SMALL_PHONE, axeViolations, launch, pickVessel, screenshot, smallTargets, startServer, tempProfile, waitForControl,
  type StaticServer,
} from './harness.ts';

describe('every screen', () => {
  const profile = tempProfile();
  let server: StaticServer;
  let ctx: BrowserContext;
  let page: Page;

  beforeAll(async () => {
    server = await startServer(DIST);
    ctx = await launch(profile.dir);
    page = ctx.pages()[0] ?? (await ctx.newPage());
    await page.goto(`${server.url}#/vessels`);
    await waitForControl(page);
    await page.getByRole('button', { name: 'Load demo plant' }).click();
    await page.getByRole('link', { name: /DEMO-JK-04/ }).waitFor();
  });
  afterAll(async () => {
    await ctx.close();
    await server.close();
    profile.remove();
  });

  async function inspect(name: string): Promise<void> {
    // Every screen has finished its own loading by now: no "Opening …" placeholder is left.
    await expect.poll(() => page.locator('[data-screen-state="loading"], [aria-busy="true"]').count()).toBe(0);
    expect(await axeViolations(page), `${name}: axe`).toEqual([]);
    expect(await smallTargets(page), `${name}: touch targets`).toEqual([]);
    await screenshot(page, name);
    await page.emulateMedia({ colorScheme: 'dark' });
    expect(await axeViolations(page), `${name} (dark): axe`).toEqual([]);
    await screenshot(page, `${name}-dark`);
    await page.emulateMedia({ colorScheme: 'light' });
    await page.setViewportSize(SMALL_PHONE);
    try {
      const wide = await page.evaluate(() => [...document.querySelectorAll('body *')]
        .filter((el) => el.getBoundingClientRect().right > document.documentElement.clientWidth + 0.5)
        .map((el) => `${el.tagName.toLowerCase()}${el.id ? '#' + el.id : ''}.${el.className}`).slice(0, 5));
      expect(wide, `${name}: elements wider than 320 px`).toEqual([]);
      expect(await smallTargets(page), `${name} at 320 px: touch targets`).toEqual([]);
    } finally {
      await page.setViewportSize(PHONE);
    }
  }

  it('refuses inline script (the CSP allows only the app\'s own files)', async () => {
    const policy = await page.locator('meta[http-equiv="Content-Security-Policy"]').getAttribute('content');
    expect(policy).toContain("default-src 'self'");
    expect(policy).not.toMatch(/unsafe|https?:|\*/);
    await expect(page.addScriptTag({ content: 'window.inlineRan = true' })).rejects.toThrow(/Content Security Policy/);
    expect(await page.evaluate(() => 'inlineRan' in window)).toBe(false);
  });

  it('Vessels list with the demo plant', async () => {
    await inspect('01-vessels');
    expect(await page.getByText('DEMO DATA').count()).toBeGreaterThan(3);
  });

  it('Vessel editor', async () => {
    await page.getByRole('link', { name: /DEMO-FT-02/ }).click();
    await expect.poll(() => page.inputValue('#v-tag')).toBe('DEMO-FT-02');
    // SI preference: dimensions in metres, stored in metres.
    expect(await page.inputValue('#v-diameterM-unit')).toBe('m');
    expect(await page.inputValue('#v-diameterM')).toBe('0.6');
    // The inner volume the dimensions imply is shown as they stand.
    expect(await page.locator('[data-volume]').textContent()).toMatch(/m³/);
    await inspect('02-vessel-editor');
  });

  it('New check with a result', async () => {
    await page.getByRole('link', { name: 'Check' }).click();
    await pickVessel(page, '#pick-vessel', 'DEMO-FT-02');
    await page.selectOption('#chk-temperature-unit', 'degC');
    await page.fill('#chk-temperature', '151,8');
    await page.selectOption('#chk-pressure-unit', 'kPa');
    await page.fill('#chk-pressure', '400');
    await page.selectOption('#chk-gross-unit', 'kg');
    await page.fill('#chk-gross', '612');
    await page.locator('[data-outcome]').waitFor();
    await page.locator('#result[data-settled="true"]').waitFor();
    expect(await page.locator('[aria-live="polite"]').count()).toBeGreaterThan(0);
    expect(await page.locator('svg.picture').count()).toBe(2);
    expect(await page.locator('.standing-note').count()).toBe(1);
    // A demo vessel's check says so in the strip and in the result.
    expect(await page.locator('[data-outcome]').textContent()).toContain('DEMO DATA');
    expect(await page.locator('#result-h .demo-tag').textContent()).toBe('DEMO DATA');
    expect(await page.getByText(/Liquid level/).count()).toBe(1);
    // The hazards of the contents are folded; the findings come first.
    expect(await page.locator('details[data-group="hazards"]').getAttribute('open')).toBeNull();
    await inspect('03-check');
    await page.fill('#chk-tech', 'Demo Technician');
    await page.getByRole('button', { name: 'Save check' }).click();
    await page.locator('[data-save-state="saved"]').waitFor();
  });

  it('New check refusing bad input with a message naming the field', async () => {
    await page.fill('#chk-temperature', '15a');
    await expect.poll(() => page.locator('#chk-temperature-error').textContent()).toMatch(/temperature/);
    expect(await page.locator('[data-check-state="input-error"]').count()).toBe(1);
    await inspect('04-check-error');
    await page.fill('#chk-temperature', '');
  });

  it('Fill plan', async () => {
    await page.goto(`${server.url}#/more`);
    await page.getByRole('link', { name: /Fill plan/ }).click();
    await pickVessel(page, '#fill-vessel', 'DEMO-FT-02');
    await page.selectOption('#fill-target-unit', 'degC');
    await page.fill('#fill-target', '150');
    await page.getByLabel('Steam share of the space').check();
    await page.fill('#fill-value', '40');
    await page.fill('#fill-start', '20');
    await page.fill('#fill-margin', '10');
    await page.locator('[data-plan-state="plan"]').waitFor({ state: 'attached' });
    expect(await page.locator('.verdict').count()).toBe(1);
    expect(await page.locator('.standing-note').count()).toBe(1);
    await inspect('05-fill-plan');
  });

  it('Log and one record', async () => {
    await page.getByRole('link', { name: 'Log' }).click();
    const entry = page.getByRole('link', { name: /DEMO-FT-02/ });
    await expect.poll(() => entry.count()).toBe(1);
    expect(await entry.getByText('DEMO DATA').count()).toBe(1);
    await inspect('06-log');
    await entry.click();
    await expect.poll(() => page.getByText('151,8 °C').count()).toBe(1);
    await page.locator('#result').waitFor();
    expect(await page.getByText('IAPWS-IF97', { exact: false }).count()).toBeGreaterThan(0);
    expect(await page.locator('#rec-h .demo-tag').count()).toBe(1);
    expect(await page.locator('#result-h .demo-tag').count()).toBe(1);
    await inspect('07-log-record');
  });

  it('Retiring a vessel keeps its checks', async () => {
    await page.getByRole('link', { name: 'Vessels' }).click();
    await page.getByRole('link', { name: /DEMO-FT-02/ }).click();
    const history = page.getByRole('region', { name: 'Checks of this vessel' }).getByRole('link');
    await expect.poll(() => history.count()).toBe(1);
    await page.getByRole('button', { name: 'Retire vessel' }).click();
    await page.getByRole('button', { name: 'Tap again to retire' }).click();
    await expect.poll(() => page.getByRole('link', { name: /DEMO-FT-02/ }).count()).toBe(0);
    await page.getByLabel('Show retired vessels').check();
    await expect.poll(() => page.getByRole('link', { name: /DEMO-FT-02 \(retired\)/ }).count()).toBe(1);
    await page.getByRole('link', { name: 'Check' }).click();
    expect(await page.locator('#pick-vessel option', { hasText: 'DEMO-FT-02' }).count()).toBe(0);
    await page.getByRole('link', { name: 'Log' }).click();
    await expect.poll(() => page.getByRole('link', { name: /DEMO-FT-02/ }).count()).toBe(1);
  });

  it('Convert', async () => {
    await page.getByRole('link', { name: 'Convert' }).click();
    await page.selectOption('#conv-pressure-unit', 'bar');
    await page.fill('#conv-pressure', '2,5');
    await page.selectOption('#sat-t-unit', 'degC');
    await page.fill('#sat-t', '100');
    await page.locator('[data-convert-state="ready"]').waitFor();
    expect(await page.locator('table tbody tr').count()).toBeGreaterThan(5);
    await inspect('08-convert');
  });

  it('works from the keyboard alone', async () => {
    await page.goto(`${server.url}#/vessels`);
    // The screen heading takes focus on every screen change; the menu sits just before it.
    await expect.poll(() => page.evaluate(() => document.activeElement?.tagName)).toBe('H1');
    let focused = '';
    for (let i = 0; i < 8 && focused !== 'Convert'; i++) {
      await page.keyboard.press('Shift+Tab');
      focused = await page.evaluate(() => document.activeElement?.textContent?.trim() ?? '');
    }
    expect(focused).toBe('Convert');
    await page.keyboard.press('Enter');
    await expect.poll(() => page.evaluate(() => document.activeElement?.tagName)).toBe('H1');
    let id = '';
    for (let i = 0; i < 10 && id !== 'conv-pressure'; i++) {
      await page.keyboard.press('Tab');
      id = await page.evaluate(() => document.activeElement?.id ?? '');
    }
    expect(id).toBe('conv-pressure');
    await page.keyboard.type('1,5');
    await page.locator('[data-convert-state="ready"]').waitFor();
  });

  it('More, and every destination on it one tap away', async () => {
    await page.getByRole('link', { name: 'More' }).click();
    // The More screen is its own chunk: count its links once it is drawn, not while it loads.
    await page.locator('.more-screen').waitFor();
    for (const name of ['Fill plan', 'Review', 'Plant overview', 'Cycle record', 'Steam and chamber tests', 'Vessel labels', 'Instruments', 'Plant sync', 'Settings']) expect(await page.getByRole('link', { name: new RegExp(name) }).count()).toBe(1);
    await inspect('11-more');
  });

  it('Vessel labels', async () => {
    await page.goto(`${server.url}#/labels`);
    await expect.poll(() => page.locator('.vessel-label').count()).toBe(3);
    await inspect('12-labels');
  });

  it('Instruments, one instrument\'s page, and the form that adds one', async () => {
    await page.goto(`${server.url}#/instruments`);
    await page.locator('[data-register-state="ready"]').waitFor();
    await inspect('16-instruments');
    await page.locator('li[data-tag] a').first().click();
    await page.locator('[data-instrument-state="ready"]').waitFor();
    await inspect('17-instrument');
    await page.goto(`${server.url}#/instruments/new`);
    await page.locator('form[data-instrument-save="idle"]').waitFor();
    await inspect('17-instrument-new');
  });

  it('Plant sync, not enrolled: the enrolment form, and the footer\'s promise kept', async () => {
    await page.goto(`${server.url}#/sync`);
    await page.locator('[data-sync-enrolment="none"]').waitFor();
    expect(await page.locator('footer').getAttribute('data-sync-promise')).toBe('local');
    await inspect('14-sync');
  });

  it('Review', async () => {
    await page.goto(`${server.url}#/review`);
    await page.locator('#rf-vessel').waitFor();
    await page.locator('.review-screen[data-shown="1"]').waitFor();
    await inspect('13-review');
  });

  it('Cycle record', async () => {
    await page.goto(`${server.url}#/cycles`);
    await page.locator('.cycles-screen[data-draft="loaded"]').waitFor();
    await pickVessel(page, '#cycle-vessel', 'DEMO-ST-01');
    await page.locator('.live-cycle[data-live-state="idle"]').waitFor();
    await inspect('14-cycles');
  });

  it('Steam and chamber tests', async () => {
    await page.goto(`${server.url}#/steam-tests`);
    await page.locator('.steam-tests-screen[data-draft="loaded"]').waitFor();
    await pickVessel(page, '#test-vessel', 'DEMO-ST-01');
    await page.selectOption('#test-kind', 'noncondensable-gas');
    await page.fill('#st-gas', '4.2');
    await page.fill('#st-cond', '100');
    await page.locator('[data-test="noncondensable-gas"][data-test-outcome]').waitFor();
    await inspect('15-steam-tests');
  });

  it('Plant overview (the demo plant; issue 14)', async () => {
    await page.goto(`${server.url}#/overview`);
    await page.locator('[data-overview-state="ready"]').waitFor();
    // The demo plant's vessels in service (one of its four is retired by an earlier test).
    expect(await page.locator('.overview-table tbody tr').count()).toBeGreaterThanOrEqual(3);
    await inspect('16-overview');
  });

  it('Settings', async () => {
    await page.goto(`${server.url}#/settings`);
    await page.getByLabel('Elevation').check();
    expect(await page.inputValue('#set-elev-unit')).toBe('m');
    await page.fill('#set-elev', '350');
    await inspect('09-settings');
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Export full backup (JSON)' }).click(),
    ]);
    const backup = JSON.parse(readFileSync((await download.path())!, 'utf8')) as { vessels: { tag: string }[]; checks: unknown[] };
    expect(backup.vessels.map((v) => v.tag)).toContain('DEMO-FT-02');
    expect(backup.checks).toHaveLength(1);
    await expect.poll(() => page.getByText(/Last backup: \d{4}-/).count()).toBe(1);
  });

  it('US customary: the vessel editor shows feet, new vessels start with the site elevation in feet', async () => {
    await page.goto(`${server.url}#/settings`);
    await page.getByLabel('US customary').check();
    await page.getByRole('link', { name: 'Vessels' }).click();
    await page.getByRole('link', { name: /DEMO-ST-01/ }).click();
    await expect.poll(() => page.inputValue('#v-tag')).toBe('DEMO-ST-01');
    expect(await page.inputValue('#v-diameterM-unit')).toBe('ft');
    // 0.9 m / 0.3048 m per ft (NIST SP 811 (2008) B.8) = 2.952 76 ft
    expect(Number(await page.inputValue('#v-diameterM'))).toBeCloseTo(2.95276, 4);
    await inspect('10-vessel-editor-us');
    await page.getByRole('link', { name: 'Vessels' }).click();
    await page.getByRole('button', { name: 'Add vessel' }).click();
    // Settings hold 350 m; a new vessel starts with it in feet: 350 / 0.3048 = 1148.29 ft.
    await expect.poll(async () => Number(await page.inputValue('#v-elevationM'))).toBeCloseTo(1148.29, 1);
    expect(await page.inputValue('#v-elevationM-unit')).toBe('ft');
  });
});
