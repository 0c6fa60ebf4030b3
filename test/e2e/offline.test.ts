// As a new user: first visit, the service worker takes control, the network goes away, and the
// whole job still works: add a vessel, enter a check, see the verdict, save it; then the browser
// is closed and relaunched with the same profile, still offline, and the check is in the log.
import { afterAll, describe, expect, it } from 'vitest';
import type { Worker } from 'playwright-core';
import { DIST, launch, pickVessel, startServer, tempProfile, waitForControl, verifyChainsOnScreen } from './harness.ts';

describe('offline first use and restart', () => {
  const profile = tempProfile();
  afterAll(() => profile.remove());

  it('keeps working offline and keeps the saved check across a browser restart', async () => {
    const server = await startServer(DIST);
    const foreign: string[] = [];
    let ctx = await launch(profile.dir);
    ctx.on('request', (r) => { if (!r.url().startsWith(server.url)) foreign.push(r.url()); });
    let page = ctx.pages()[0] ?? (await ctx.newPage());
    await page.goto(server.url);
    await waitForControl(page);

    // Installable: Chromium's own installability check finds nothing missing.
    const cdp = await ctx.newCDPSession(page);
    const { installabilityErrors } = (await cdp.send('Page.getInstallabilityErrors')) as { installabilityErrors: unknown[] };
    expect(installabilityErrors).toEqual([]);

    await ctx.setOffline(true);
    const reloaded = await page.reload();
    expect(reloaded?.fromServiceWorker()).toBe(true);

    // Add a vessel.
    await page.getByRole('link', { name: 'Vessels' }).click();
    await page.getByRole('button', { name: 'Add vessel' }).click();
    await page.fill('#v-tag', 'E2E-101');
    await page.fill('#v-desc', 'Browser test vessel');
    await page.selectOption('#v-shape', 'vertical-cylinder');
    await page.fill('#v-diameterM', '1');
    await page.fill('#v-straightLengthM', '2');
    await page.selectOption('#v-mass-unit', 'kg');
    await page.fill('#v-tare', '500');
    await page.fill('#v-weightTol', '2');
    await page.selectOption('#v-pressure-unit', 'kPa');
    await page.fill('#v-mawp', '500');
    await page.fill('#v-relief', '450');
    await page.fill('#v-gaugeSpan', '1000');
    await page.selectOption('#v-temperature-unit', 'degC');
    await page.fill('#v-designTemperature', '180');
    await page.locator('[data-site-summary]').click(); // the site is folded, its defaults filled in
    await page.fill('#v-ambientTemperature', '20');
    await page.fill('#v-barometerTol', '0,5');
    await page.getByRole('button', { name: 'Save vessel' }).click();
    await expect.poll(() => page.getByRole('link', { name: /E2E-101/ }).count()).toBe(1);

    // Enter a check (a decimal comma in the pressure) and see the verdict.
    await page.getByRole('link', { name: 'Check' }).click();
    await pickVessel(page, '#pick-vessel', 'E2E-101');
    await page.selectOption('#chk-temperature-unit', 'degC');
    await page.fill('#chk-temperature', '120');
    await page.selectOption('#chk-pressure-unit', 'kPa');
    await page.fill('#chk-pressure', '97,3');
    await page.selectOption('#chk-gross-unit', 'kg');
    await page.fill('#chk-gross', '1400');
    const strip = page.locator('[data-outcome]');
    await strip.waitFor();
    const outcome = (await strip.getAttribute('data-outcome')) ?? '';
    const verdict = (await strip.locator('.outcome-line').textContent()) ?? '';
    expect(verdict.length).toBeGreaterThan(3);
    expect(await page.locator('.standing-note').count()).toBeGreaterThan(0);

    await page.fill('#chk-tech', 'A. Tester');
    await page.fill('#chk-note', 'offline test');
    await page.getByRole('button', { name: 'Save check' }).click();
    await page.locator('[data-save-state="saved"]').waitFor();

    // Start the next check, then close the tab and the browser: the half entry is a saved draft
    // (written as typed; the page's own data-draft-state says when it is stored).
    await page.fill('#chk-temperature', '88,8');
    await page.locator('html[data-draft-state="saved"]').waitFor();
    await page.close();
    await ctx.close();

    // Relaunch with the same profile, offline, with the server gone too.
    await server.close();
    ctx = await launch(profile.dir);
    await ctx.setOffline(true);
    page = ctx.pages()[0] ?? (await ctx.newPage());
    const cold = await page.goto(`${server.url}#/log`);
    expect(cold?.fromServiceWorker()).toBe(true);
    const entry = page.getByRole('link', { name: /E2E-101/ });
    await expect.poll(() => entry.count()).toBe(1);
    await entry.click();
    await expect.poll(() => page.getByText('97,3 kPa (gauge)').count()).toBe(1);
    // The log row and the record say what the strip said.
    await page.locator('#result').waitFor();
    expect(await page.locator('#result').textContent()).toContain(outcome === 'none' ? 'No finding' : outcome);
    expect(await page.getByText('A. Tester').count()).toBe(1);

    await page.getByRole('link', { name: 'Check' }).click();
    await expect.poll(() => page.inputValue('#chk-temperature')).toBe('88,8');
    expect(await page.inputValue('#chk-tech')).toBe('A. Tester');

    // Every other screen is a chunk of its own, loaded on demand: the worker must hold each of them.
    for (const [tab, ready] of [['Vessels', '#vessel-search'], ['Log', '.list'], ['Convert', '#conv-pressure'], ['More', '.more-screen']] as const) {
      await page.getByRole('link', { name: tab, exact: true }).click();
      await page.locator(ready).first().waitFor();
    }
    for (const [link, ready] of [['Fill plan', '#fill-target'], ['Vessel labels', '.vessel-label'], ['Settings', '#set-tech']] as const) {
      await page.goto(`${server.url}#/more`);
      await page.getByRole('link', { name: new RegExp(link) }).click();
      await page.locator(ready).first().waitFor();
    }
    expect(await page.getByText(/could not be loaded/).count()).toBe(0);
    await page.goto(`${server.url}#/more`);
    await page.getByRole('link', { name: /Review/ }).click();
    await expect.poll(() => page.locator('#rf-vessel').count()).toBe(1);
    expect(await page.getByText(/could not be loaded/).count()).toBe(0);
    // Verifying the chain offline: the log worker's script comes from the worker's cache too. Had
    // it failed to load, the page would have walked the log itself with the hashing worker.
    const workers: Worker[] = [];
    page.on('worker', (w) => workers.push(w));
    expect((await verifyChainsOnScreen(page)).lines.map((l) => l.chain)).toEqual(['ok']);
    expect(workers.some((w) => w.url().includes('log-worker')), 'the log worker started').toBe(true);
    expect(workers.some((w) => w.url().includes('hash-worker')), 'no fallback to this thread').toBe(false);
    await ctx.close();

    // Nothing ever left for another origin (no fonts, analytics or CDNs).
    expect(foreign).toEqual([]);
  });
});
