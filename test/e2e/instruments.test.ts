// The instrument register in Chromium with the page's clock under the test's control (playwright's
// page.clock): a calibration entered for a demo vessel's gauge, a bad entry refused naming its field,
// the instrument listed as due soon, then the clock moved past its due date: the next check carries
// the calibration-overdue finding naming the gauge, and Review's report shows the gauge overdue at
// that check. Then a new gauge is added (a bad range refused first, naming the field), swapped in
// for the demo vessel's gauge (the next check names the new one; the old one keeps its history),
// and retired (it comes off the vessel; the next check no longer rests on it). Waits only on the
// app's own states (data attributes), never a fixed time. The vessels, the calibration and the
// added gauge are the invented demo plant (DEMO DATA).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BrowserContext, Page } from 'playwright-core';
import { DIST, launch, pickVessel, screenshot, startServer, tempProfile, waitForControl, type StaticServer } from './harness.ts';

describe('instruments: a calibration, its due date passing, the finding on the next check and in Review', () => {
  const profile = tempProfile();
  let server: StaticServer;
  let ctx: BrowserContext;
  let page: Page;
  beforeAll(async () => {
    server = await startServer(DIST);
    ctx = await launch(profile.dir);
    page = ctx.pages()[0] ?? (await ctx.newPage());
    // The clock runs from here at its normal rate; setSystemTime moves it later.
    await page.clock.install({ time: new Date('2026-11-30T08:00:00Z') });
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

  async function checkOn(tag: string): Promise<void> {
    await page.goto(`${server.url}#/check`);
    await page.locator('main[data-app-state="ready"]').waitFor();
    await pickVessel(page, '#pick-vessel', tag);
    // 121 °C and the gauge pressure of saturation there (205 kPa absolute, site atmosphere 101.3 kPa): gauge and thermometer agree.
    await page.fill('#chk-temperature', '121');
    await page.fill('#chk-pressure', '103.8');
    await page.locator('[data-outcome]').waitFor();
    await page.locator('#result[data-settled="true"]').waitFor();
  }

  it('the demo vessels\' gauges and thermometers are in the register, none calibrated yet; More lists the screen', async () => {
    await page.goto(`${server.url}#/more`);
    await page.getByRole('link', { name: /Instruments/ }).click();
    await page.locator('[data-register-state="ready"]').waitFor();
    await expect.poll(() => page.locator('li[data-tag]').count()).toBe(8);
    expect(await page.getAttribute('li[data-tag="DEMO-ST-01 PI"]', 'data-status')).toBe('no-calibration');
  });

  it('a calibration with a bad as-found figure is refused naming the field and its range; nothing is saved', async () => {
    await page.locator('li[data-tag="DEMO-ST-01 PI"] a').click();
    await page.locator('[data-instrument-state="ready"]').waitFor();
    await page.fill('#cal-date', '2026-11-29');
    await page.fill('#cal-asFound', '900');
    await page.fill('#cal-who', 'Demo calibration lab (DEMO DATA)');
    await page.getByRole('button', { name: 'Save calibration' }).click();
    await page.locator('form[data-calibration-save="refused"]').waitFor();
    const message = await page.textContent('#cal-asFound-error');
    expect(message).toMatch(/as-found error: 900 kPa is outside the valid range −400 to 400 kPa/);
    expect(await page.locator('tr[data-calibration]').count()).toBe(0);
  });

  it('a good calibration is saved and listed; due in 10 days the gauge is due soon', async () => {
    await page.fill('#cal-asFound', '1,5');
    await page.fill('#cal-asLeft', '0.2');
    await page.fill('#cal-nextDue', '2026-12-10');
    await page.fill('#cal-certificate', 'DEMO-CERT-0001');
    await page.getByRole('button', { name: 'Save calibration' }).click();
    await page.locator('form[data-calibration-save="saved"]').waitFor();
    await page.locator('tr[data-calibration]').waitFor();
    expect(await page.textContent('tr[data-calibration]')).toMatch(/2026-11-29.*\+1\.50 kPa.*\+0\.200 kPa.*2026-12-10.*DEMO-CERT-0001/);
    await page.locator('[data-instrument-state="ready"][data-status="due-soon"]').waitFor();
    await screenshot(page, 'instrument-page');
  });

  it('a check now uses the calibration: the instruments line names it, and no finding about it', async () => {
    await checkOn('DEMO-ST-01');
    const instruments = page.locator('#result dt', { hasText: 'Instruments used' }).locator('xpath=following-sibling::dd[1]');
    expect(await instruments.textContent()).toMatch(/DEMO-ST-01 PI: due soon, due 2026-12-10, calibration of 2026-11-29/);
    expect(await page.locator('#result [data-rule="calibration-overdue"]').count()).toBe(0);
  });

  it('after the due date the next check carries the finding naming the gauge, saved with it; Review shows it overdue at that check', async () => {
    await page.clock.setSystemTime(new Date('2026-12-15T08:00:00Z'));
    await checkOn('DEMO-ST-01');
    await expect.poll(() => page.getAttribute('[data-outcome]', 'data-outcome')).toBe('CAUTION');
    const finding = page.locator('#result [data-rule="calibration-overdue"]').first();
    expect(await finding.textContent()).toMatch(/DEMO-ST-01 PI: calibration overdue since 2026-12-10/);
    await page.fill('#chk-tech', 'Demo Technician');
    await page.getByRole('button', { name: 'Save check' }).click();
    await page.locator('[data-save-state="saved"]').waitFor();

    await page.goto(`${server.url}#/review`);
    await pickVessel(page, '#rf-vessel', 'DEMO-ST-01');
    await page.getByRole('button', { name: 'Trend and report for DEMO-ST-01' }).click();
    await page.locator('[data-report-instruments="ready"]').waitFor();
    expect(await page.getAttribute('[data-report-instruments] li[data-instrument-tag="DEMO-ST-01 PI"]', 'data-state-at-checks')).toBe('overdue');
    expect(await page.textContent('[data-report-instruments] li[data-instrument-tag="DEMO-ST-01 PI"]')).toMatch(/now overdue since 2026-12-10/);
    await expect.poll(() => page.locator('.review-row').count()).toBe(1);
    expect(await page.textContent('.review-row')).toMatch(/CAUTION/);
    await screenshot(page, 'review-instruments');
  });

  const usedLine = () => page.locator('#result dt', { hasText: 'Instruments used' }).locator('xpath=following-sibling::dd[1]').textContent();

  it('a gauge is added to the register: a range high below its low is refused naming the field, then it is saved and its page opens', async () => {
    await page.goto(`${server.url}#/instruments`);
    await page.locator('[data-register-state="ready"]').waitFor();
    await page.getByRole('link', { name: 'Add an instrument' }).click();
    await page.fill('#inst-tag', 'DEMO-PI-NEW');
    await page.selectOption('#inst-unit', 'kPa');
    await page.fill('#inst-low', '0');
    await page.fill('#inst-high', '-5');
    await page.fill('#inst-class', '1');
    await page.getByRole('button', { name: 'Add to the register' }).click();
    await page.locator('form[data-instrument-save="refused"]').waitFor();
    expect(await page.textContent('#inst-high-error')).toBe('range high: -5 kPa must be above the range low (0 kPa).');
    await page.fill('#inst-high', '400');
    await page.getByRole('button', { name: 'Add to the register' }).click();
    await page.locator('[data-instrument-state="ready"][data-status="no-calibration"]').waitFor();
    expect(await page.textContent('main h2')).toBe('DEMO-PI-NEW');
  });

  it('swapped in for the demo vessel\'s gauge: the next check names the new gauge; the old one keeps its calibration and fitting', async () => {
    await page.selectOption('#fit-vessel', { label: 'DEMO-ST-01' });
    await page.locator('[data-place-holder="DEMO-ST-01 PI"]').waitFor();
    await page.getByRole('button', { name: 'Swap in for DEMO-ST-01 PI' }).click();
    await page.locator('[data-fit-state="saved"]').waitFor();
    await screenshot(page, 'instrument-swap');
    await checkOn('DEMO-ST-01');
    expect(await usedLine()).toMatch(/DEMO-PI-NEW: no calibration on record/);
    expect(await usedLine()).not.toMatch(/DEMO-ST-01 PI:/);
    await page.goto(`${server.url}#/instruments`);
    await page.locator('li[data-tag="DEMO-ST-01 PI"] a').click();
    await page.locator('[data-instrument-state="ready"]').waitFor();
    expect(await page.locator('tr[data-calibration]').count()).toBe(1);
    expect(await page.textContent('section[aria-labelledby="fit-h"]')).toMatch(/DEMO-ST-01 from/);
  });

  it('the new gauge retired: it stays in the register as retired and comes off the vessel; the next check no longer rests on it', async () => {
    await page.goto(`${server.url}#/instruments`);
    await page.locator('li[data-tag="DEMO-PI-NEW"] a').click();
    await page.locator('[data-instrument-state="ready"]').waitFor();
    await page.getByRole('button', { name: 'Retire this instrument…' }).click();
    await page.getByRole('button', { name: 'Retire DEMO-PI-NEW' }).click();
    await page.locator('[data-instrument-state="ready"][data-status="retired"]').waitFor();
    await page.goto(`${server.url}#/instruments`);
    await page.locator('[data-register-state="ready"]').waitFor();
    expect(await page.getAttribute('li[data-tag="DEMO-PI-NEW"]', 'data-status')).toBe('retired');
    await checkOn('DEMO-ST-01');
    expect(await usedLine()).not.toMatch(/DEMO-PI-NEW/);
    expect(await usedLine()).toMatch(/DEMO-ST-01 TI/);
  });
});
