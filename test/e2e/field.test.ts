// The field screens held to what a technician with one hand and gloves needs (issue 11): at 390×844
// and 320×700 the outcome stays in view while the readings are typed, the tab bar is one row of at
// most five no taller than 64 px, every control is at least 48 px; and one test per bug the field
// trial found that only a browser shows. Each waits on the app's own state attributes, never on a
// fixed time. The vessels are the invented demo plant (DEMO DATA) and an invented test vessel.
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BrowserContext, Page } from 'playwright-core';
import { DIST, PHONE, SMALL_PHONE, launch, pickVessel, screenshot, smallTargets, startServer, tempProfile, waitForControl, type StaticServer } from './harness.ts';

const SIGNALS = ['DANGER', 'WARNING', 'CAUTION', 'NOTICE', 'none'];

describe('field screens', () => {
  const profile = tempProfile();
  let server: StaticServer;
  let ctx: BrowserContext;
  let page: Page;
  /** Taps (clicks and selections) counted from app start, for the closing report. */
  let taps = 0;

  beforeAll(async () => {
    server = await startServer(DIST);
    ctx = await launch(profile.dir);
    page = ctx.pages()[0] ?? (await ctx.newPage());
    // TANKSIDE_E2E_WAIT_MS shortens every wait, for running these tests against an older build to see them fail.
    if (process.env.TANKSIDE_E2E_WAIT_MS) page.setDefaultTimeout(Number(process.env.TANKSIDE_E2E_WAIT_MS));
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

  /** The element's box lies wholly inside the viewport. */
  async function whollyInView(selector: string): Promise<boolean> {
    return page.$eval(selector, (el) => {
      const r = el.getBoundingClientRect();
      return r.top >= 0 && r.left >= 0 && r.bottom <= window.innerHeight && r.right <= window.innerWidth && r.height > 0;
    });
  }

  async function freshCheck(tag: string): Promise<void> {
    await page.goto(`${server.url}#/check`);
    await page.reload();
    await page.locator('main[data-app-state="ready"]').waitFor();
    await pickVessel(page, '#pick-vessel', tag);
  }

  for (const size of [PHONE, SMALL_PHONE]) {
    describe(`at ${size.width}×${size.height}`, () => {
      beforeAll(async () => { await page.setViewportSize(size); });

      it('after typing temperature and pressure the outcome strip lies wholly inside the viewport and says the outcome; tapping it opens the details', async () => {
        await freshCheck('DEMO-ST-01');
        await page.fill('#chk-temperature', '');
        await page.fill('#chk-pressure', '');
        await page.fill('#chk-gross', '');
        await page.locator('#chk-temperature').focus();
        await page.keyboard.type('133,5');
        await page.locator('#chk-pressure').focus();
        await page.keyboard.type('200');
        const strip = page.locator('[data-outcome]');
        await strip.waitFor();
        expect(SIGNALS).toContain(await strip.getAttribute('data-outcome'));
        expect(await whollyInView('[data-outcome]'), 'strip in view while the pressure is typed').toBe(true);
        // Still in view while the last field, lower down, is typed.
        await page.locator('#chk-gross').focus();
        await page.keyboard.type('1400');
        await page.locator('#result[data-settled="true"]').waitFor();
        expect(await whollyInView('[data-outcome]'), 'strip in view while the weight is typed').toBe(true);
        expect(await whollyInView('#chk-gross'), 'the field typed in is not hidden behind the tab bar').toBe(true);
        expect((await strip.textContent()) ?? '').toMatch(/No finding|DANGER|WARNING|CAUTION|NOTICE/);
        await screenshot(page, `14-check-typing-${size.width}x${size.height}`);
        await strip.click();
        await expect.poll(() => page.evaluate(() => document.activeElement?.id)).toBe('result-h');
      });

      it('the tab bar is one row of at most five, no taller than 64 px, the current screen marked by more than colour', async () => {
        const nav = await page.$eval('nav.tabbar', (el) => {
          const tabs = [...el.querySelectorAll('a')];
          const current = tabs.find((a) => a.getAttribute('aria-current') === 'page');
          const other = tabs.find((a) => a !== current)!;
          const style = (a: Element) => getComputedStyle(a);
          return {
            height: el.getBoundingClientRect().height,
            tops: [...new Set(tabs.map((a) => Math.round(a.getBoundingClientRect().top)))].length,
            count: tabs.length,
            current: current?.textContent,
            bar: current ? getComputedStyle(current, '::before').content : 'none',
            otherBar: getComputedStyle(other, '::before').content,
            weights: [style(current!).fontWeight, style(other).fontWeight],
          };
        });
        expect(nav.height).toBeLessThanOrEqual(64);
        expect(nav.tops).toBe(1);
        expect(nav.count).toBeLessThanOrEqual(5);
        expect(nav.current).toBe('Check');
        // A bar above the current tab and bolder text: shape and weight, not colour alone.
        expect(nav.bar).not.toBe('none');
        expect(nav.otherBar).toBe('none');
        expect(Number(nav.weights[0])).toBeGreaterThan(Number(nav.weights[1]));
      });

      it('no control on the Check screen with its result is under 48 px', async () => {
        expect(await smallTargets(page)).toEqual([]);
      });
    });
  }

  describe('at 390×844: the bugs of the field trial', () => {
    beforeAll(async () => { await page.setViewportSize(PHONE); });

    it('a pressure unit picked for one check is not the next one\'s, nor the next launch\'s; a differing unit is marked; the result is in the unit typed', async () => {
      await freshCheck('DEMO-FT-02');
      await page.fill('#chk-temperature', '125');
      await page.selectOption('#chk-pressure-unit', 'psi');
      // A differing unit is marked beside its field.
      await expect.poll(() => page.locator('#chk-pressure-unit-note').textContent()).toMatch(/Not the vessel's unit: its gauge reads kPa/);
      await page.fill('#chk-pressure', '20');
      await page.locator('[data-outcome]').waitFor();
      // The result shows the pressure in psi, the preferred kPa beside it.
      await page.locator('#result[data-settled="true"]').waitFor();
      expect(await page.locator('[data-group="saturation"] dd').first().textContent()).toMatch(/psi.*kPa/);
      await page.fill('#chk-tech', 'Demo Technician');
      await page.getByRole('button', { name: 'Save check' }).click();
      await page.locator('[data-save-state="saved"]').waitFor();
      expect(await page.inputValue('#chk-pressure-unit')).toBe('kPa');
      await page.locator('html[data-draft-state="saved"]').waitFor();
      await page.reload();
      await page.locator('main[data-app-state="ready"]').waitFor();
      await expect.poll(() => page.inputValue('#pick-vessel')).not.toBe('');
      expect(await page.inputValue('#chk-pressure-unit')).toBe('kPa');
    });

    it('"123,5" left in psi on the 0–400 kPa gauge of DEMO-ST-01 is refused before any result', async () => {
      await freshCheck('DEMO-ST-01');
      await page.fill('#chk-temperature', '125');
      await page.selectOption('#chk-pressure-unit', 'psi');
      await page.fill('#chk-pressure', '123,5');
      await page.locator('[data-check-state="input-error"]').waitFor();
      expect(await page.locator('[data-outcome]').count()).toBe(0);
      // 400 kPa = 58.0 psi.
      expect(await page.locator('#chk-pressure-error').textContent()).toMatch(/"123,5" psi is beyond this vessel's gauge, which reads 0 to 58\.0 psi gauge.*In kPa/);
      await page.fill('#chk-pressure', '');
    });

    it('a range message is in the unit typed, quotes the text as typed and uses a true minus', async () => {
      await page.locator('input[name="chk-kind"][value="absolute"]').check();
      await page.selectOption('#chk-pressure-unit', 'kPa');
      await page.fill('#chk-pressure', '-50');
      await page.locator('[data-check-state="input-error"]').waitFor();
      const msg = (await page.locator('#chk-pressure-error').textContent()) ?? '';
      expect(msg).toContain('"-50" kPa');
      expect(msg).not.toMatch(/\d Pa\b/);
      expect(msg.replace('"-50"', '')).not.toMatch(/-\d/);
      await page.locator('input[name="chk-kind"][value="gauge"]').check();
      await page.fill('#chk-pressure', '');
    });

    it('the vessel editor: mm for the diameter changes no other field, the inner volume shows as typed, a reload keeps the entry, and it saves', async () => {
      await page.goto(`${server.url}#/vessels/new`);
      await page.locator('form[data-draft="loaded"]').waitFor();
      await page.fill('#v-tag', 'E2E-HIGH');
      await page.fill('#v-desc', 'Invented test vessel on a high site');
      await page.selectOption('#v-shape', 'vertical-cylinder');
      await page.selectOption('#v-diameterM-unit', 'mm');
      expect(await page.inputValue('#v-straightLengthM-unit')).toBe('m');
      await page.fill('#v-diameterM', '600');
      await page.fill('#v-straightLengthM', '1,2');
      // πD²L/4 + 2·πD³/24 for 2:1 heads (common practice) = 0.396 m³.
      await expect.poll(() => page.locator('[data-volume]').textContent()).toMatch(/0\.396 m³/);
      await page.locator('[data-site-summary]').click(); // the site is folded, its defaults filled in
      await page.selectOption('#v-atm', 'elevation');
      expect(await page.inputValue('#v-elevationM-unit')).toBe('m');
      await page.fill('#v-elevationM', '1600');
      // US Standard Atmosphere 1976: about 83.5 kPa at 1600 m (its table, from memory).
      await expect.poll(() => page.locator('[data-site-counterpart]').textContent()).toMatch(/83\.5/);
      await page.fill('#v-mawp', '500');
      await page.fill('#v-relief', '450');
      await page.fill('#v-designTemperature', '180');
      await page.fill('#v-gaugeSpan', '1000');
      await page.fill('#v-tare', '300');
      await page.fill('#v-weightTol', '1');
      await page.locator('html[data-draft-state="saved"]').waitFor();
      await page.reload();
      await page.locator('form[data-draft="loaded"]').waitFor();
      await expect.poll(() => page.inputValue('#v-tag')).toBe('E2E-HIGH');
      expect(await page.inputValue('#v-diameterM')).toBe('600');
      expect(await page.inputValue('#v-diameterM-unit')).toBe('mm');
      expect(await page.inputValue('#v-elevationM')).toBe('1600');
      await page.getByRole('button', { name: 'Save vessel' }).click();
      await expect.poll(() => page.getByRole('link', { name: /E2E-HIGH/ }).count()).toBe(1);
    });

    it('the vessel editor keeps every field: typed, kept across a reload mid-edit, saved, and opened again with every value and unit back', async () => {
      // An invented vessel (test data) with every field of the editor filled, the folded ones too.
      const texts: [string, string][] = [
        ['#v-tag', 'E2E-EVERY'], ['#v-desc', 'Invented vessel with every field set'],
        ['#v-diameterM', '900'], ['#v-straightLengthM', '1,5'], ['#v-crownRadius', '850'], ['#v-knuckleRadius', '90'],
        ['#v-mawp', '300'], ['#v-relief', '280'], ['#v-designTemperature', '145'], ['#v-reliefTolPercent', '5'],
        ['#v-gaugeSpan', '400'], ['#v-sensorTol', '0,5'], ['#v-tare', '850'], ['#v-weightTol', '2'],
        ['#v-gaugeAccuracyPercent', '1,6'], ['#v-gaugeIndicatorPercent', '0,5'], ['#v-gaugeDriftPercent', '0,25'],
        ['#v-sensorIndicatorTol', '0,2'], ['#v-sensorDriftTol', '0,1'], ['#v-tareTol', '5'], ['#v-volumeTolPercent', '3'],
        ['#v-elevationM', '1600'], ['#v-ambientTemperature', '18'],
      ];
      const choices: [string, string][] = [
        ['#v-diameterM-unit', 'mm'], ['#v-crownRadius-unit', 'mm'], ['#v-knuckleRadius-unit', 'mm'], ['#v-straightLengthM-unit', 'm'],
        ['#v-service', 'steriliser'], ['#v-heating', 'steam-jacket'], ['#v-pressure-unit', 'kPa'], ['#v-temperature-unit', 'degC'],
        ['#v-sensor', 'stated'], ['#v-mass-unit', 'kg'], ['#v-tareKnown', 'stated'], ['#v-atm', 'elevation'], ['#v-elevationM-unit', 'm'],
      ];
      const openFolds = async () => {
        const folded = page.locator('form details:not([open]) > summary');
        while (await folded.count() > 0) await folded.first().click();
      };
      const same = (text: string) => text.replace(',', '.');
      const expectAll = async () => {
        await openFolds();
        for (const [sel, value] of choices) expect(await page.inputValue(sel), sel).toBe(value);
        for (const [sel, value] of texts) expect(same(await page.inputValue(sel)), sel).toBe(same(value));
        expect(await page.isChecked('#v-vacuumBreaker')).toBe(true);
        expect(await page.isChecked('#v-vacuum')).toBe(false);
      };

      await page.goto(`${server.url}#/vessels/new`);
      await page.locator('form[data-draft="loaded"]').waitFor();
      await page.selectOption('#v-shape', 'horizontal-cylinder');
      await page.selectOption('#v-head', 'torispherical');
      await page.selectOption('#v-sensor', 'stated');
      await openFolds();
      await page.selectOption('#v-atm', 'elevation');
      await page.selectOption('#v-tareKnown', 'stated');
      for (const [sel, value] of choices) await page.selectOption(sel, value);
      for (const [sel, value] of texts) await page.fill(sel, value);
      await page.check('#v-vacuumBreaker');
      await page.locator('html[data-draft-state="saved"]').waitFor();
      await page.reload();
      await page.locator('form[data-draft="loaded"]').waitFor();
      await expect.poll(() => page.inputValue('#v-tag')).toBe('E2E-EVERY');
      await expectAll();

      await page.getByRole('button', { name: 'Save vessel' }).click();
      await page.getByRole('link', { name: /E2E-EVERY/ }).click();
      await page.locator('form[data-draft="loaded"]').waitFor();
      await expect.poll(() => page.inputValue('#v-tag')).toBe('E2E-EVERY');
      await expectAll();
    });

    it('a new vessel\'s common case fits on about two screens (page at most 2 × 844 px with the usual fields shown)', async () => {
      await page.goto(`${server.url}#/vessels/new`);
      await page.locator('form[data-draft="loaded"]').waitFor();
      await page.getByRole('button', { name: 'Start over' }).click();
      await page.fill('#v-diameterM', '1');
      await page.fill('#v-straightLengthM', '2');
      await page.locator('.shape-preview svg, .shape-preview img, .shape-preview [role="img"]').first().waitFor();
      const height = await page.evaluate(() => document.documentElement.scrollHeight);
      await page.screenshot({ path: 'test-results/screens/vessel-editor-new-full.png', fullPage: true });
      console.log(`vessel editor, new vessel at 390×844: page ${height} px tall (${(height / 844).toFixed(2)} screens)`);
      expect(height).toBeLessThanOrEqual(2 * 844);
      await page.getByRole('button', { name: 'Start over' }).click();
    });

    it('Convert uses a vessel\'s own site atmosphere, not the standard one, and changes it with one 48 px control', async () => {
      await page.goto(`${server.url}#/convert`);
      await page.locator('#conv-atm').waitFor();
      expect(await page.locator('[data-atmosphere]').getAttribute('data-atmosphere')).toMatch(/^vessel:/);
      const box = await page.locator('#conv-atm').boundingBox();
      expect(box!.height).toBeGreaterThanOrEqual(48);
      const high = await page.$eval('#conv-atm', (el) => [...(el as HTMLSelectElement).options].find((o) => o.text.includes('E2E-HIGH'))!.value);
      await page.selectOption('#conv-atm', high);
      await expect.poll(() => page.locator('[data-atmosphere]').textContent()).toMatch(/83\.5\d* kPa absolute/);
      await page.fill('#conv-pressure', '0');
      await page.locator('[data-convert-state="ready"]').waitFor();
      // 0 gauge at that site is 83.5 kPa absolute.
      // Typed "0" resolves ±0.5 kPa: one decimal, no more (issue 11 §4).
      expect(await page.locator('tbody tr', { hasText: 'kPa' }).first().locator('td').first().textContent()).toMatch(/^83\.5$/);
    });

    it('the fill plan: a neutral box, full-size choices, plain words, the details folded', async () => {
      await page.goto(`${server.url}#/fill`);
      await pickVessel(page, '#fill-vessel', 'DEMO-FT-02');
      await page.fill('#fill-target', '150');
      await page.getByLabel('Steam share of the space').check();
      await page.fill('#fill-value', '40');
      await page.fill('#fill-start', '20');
      await page.locator('[data-plan-state="plan"]').waitFor({ state: 'attached' });
      const look = await page.$eval('.verdict', (el) => ({ cls: el.className, border: getComputedStyle(el).borderTopColor, ok: getComputedStyle(document.documentElement).getPropertyValue('--ok').trim() }));
      expect(look.cls).toContain('verdict-plan');
      expect(look.border).not.toBe('rgb(23, 96, 58)'); // --ok, the agreeing check's green (#17603a)
      const radios = await page.$$eval('.switch input[type="radio"]', (els) => els.map((e) => e.getBoundingClientRect()).map((r) => [r.width, r.height]));
      for (const [w, h] of radios) { expect(w).toBeGreaterThanOrEqual(20); expect(h).toBe(w); }
      const shown = await page.$eval('main', (el) => (el as HTMLElement).innerText);
      expect(shown).not.toMatch(/ideal-gas estimate|off IF97|liquid-full margin/i);
      expect(await page.locator('details[data-group="hazards"]').getAttribute('open')).toBeNull();
    });

    it('times carry their zone in the log and the record', async () => {
      await page.goto(`${server.url}#/log`);
      const row = page.getByRole('link', { name: /DEMO-FT-02/ }).first();
      await row.waitFor();
      expect(await row.textContent()).toMatch(/\d{2}:\d{2} UTC/);
    });

    it('one spelling: no screen says "vapor"', async () => {
      const seen: string[] = [];
      for (const route of ['check', 'vessels', 'log', 'convert', 'more', 'fill', 'settings', 'labels', 'review']) {
        await page.goto(`${server.url}#/${route}`);
        await expect.poll(() => page.locator('[data-screen-state="loading"]').count()).toBe(0);
        seen.push(await page.$eval('body', (el) => (el as HTMLElement).innerText));
      }
      await freshCheck('DEMO-ST-01');
      await page.fill('#chk-temperature', '133,5');
      await page.fill('#chk-pressure', '200');
      await page.fill('#chk-gross', '1400');
      // The card of the reading without the weight is settled too until the weighed one replaces it:
      // wait for the weighed result (its quality figure) before reading the words.
      await expect.poll(() => page.locator('#result[data-settled="true"]').innerText()).toMatch(/Quality \(steam mass fraction\)/);
      await page.$eval('details[data-group="hazards"]', (d) => { (d as HTMLDetailsElement).open = true; });
      seen.push(await page.$eval('body', (el) => (el as HTMLElement).innerText));
      expect(seen.join('\n')).toMatch(/vapour/);
      expect(seen.join('\n')).not.toMatch(/\bvapor/i);
    });

    it('print: the report puts the vessel description and the period on lines of their own', async () => {
      await page.goto(`${server.url}#/review`);
      await page.locator('#rf-vessel').waitFor();
      // The filter's vessel list fills in after the first rows: pickVessel waits for the option.
      await pickVessel(page, '#rf-vessel', 'DEMO-FT-02');
      await page.getByRole('button', { name: /Trend and report for DEMO-FT-02/ }).click();
      await page.locator('.report-period').waitFor();
      await page.emulateMedia({ media: 'print' });
      try {
        const [d, p] = await Promise.all([page.locator('.report-description').boundingBox(), page.locator('.report-period').boundingBox()]);
        expect(p!.y).toBeGreaterThanOrEqual(d!.y + d!.height - 0.5);
      } finally {
        await page.emulateMedia({ media: 'screen' });
      }
    });

    it('the CSV starts with a UTF-8 byte-order mark and carries the rounded columns', async () => {
      await page.goto(`${server.url}#/settings`);
      const [download] = await Promise.all([
        page.waitForEvent('download'),
        page.getByRole('button', { name: 'Export log for spreadsheets (CSV)' }).click(),
      ]);
      const bytes = readFileSync((await download.path())!);
      expect([...bytes.subarray(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
      expect(bytes.toString('utf8')).toContain('temperature (°C, as shown)');
    });

    it('taps from app start to an outcome and to a conversion', async () => {
      // A new check on a fresh start: the last entry was saved or cleared.
      await page.goto(`${server.url}#/check`);
      await page.locator('main[data-app-state="ready"]').waitFor();
      for (const f of ['#chk-temperature', '#chk-pressure', '#chk-gross']) await page.fill(f, '');
      await page.locator('html[data-draft-state="saved"]').waitFor();
      await page.goto(server.url);
      await page.reload();
      await page.locator('main[data-app-state="ready"]').waitFor();
      taps = 0;
      const tap = async (selector: string) => { await page.locator(selector).click(); taps += 1; };
      await tap('#pick-vessel');
      await pickVessel(page, '#pick-vessel', 'DEMO-ST-01');
      taps += 1;
      await tap('#chk-temperature');
      await page.keyboard.type('133,5');
      await tap('#chk-pressure');
      await page.keyboard.type('200');
      await page.locator('[data-outcome]').waitFor();
      const toOutcome = taps;
      taps = 0;
      await tap('nav.tabbar a[href="#/convert"]');
      await tap('#conv-pressure');
      await page.keyboard.type('250');
      await page.locator('[data-convert-state="ready"]').waitFor();
      console.log(`taps from app start: ${toOutcome} to an outcome (vessel list, vessel, temperature, pressure), ${taps} to a conversion (Convert tab, pressure field)`);
      expect(toOutcome).toBe(4);
      expect(taps).toBe(2);
    });
  });
});
