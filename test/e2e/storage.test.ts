// Storage that lasts, as a technician sees it: Settings says whether the browser keeps the data
// (its own navigator.storage.persisted()), how much is used (navigator.storage.estimate()) and when
// the log was last backed up; the Log screen reminds gently once checks are saved with no backup,
// and stops once a backup is exported. The reminder's days field refuses what is not 1 to 60,
// naming the field and the range. Figures are compared with what the browser itself answers.
import { afterAll, describe, expect, it } from 'vitest';
import { DIST, LONG_JOB_MS, launch, pickVessel, startServer, tempProfile } from './harness.ts';

describe('storage panel and backup reminder', () => {
  const profile = tempProfile();
  afterAll(() => profile.remove());

  it('shows the browser\'s answers, reminds after checks with no backup, and stops after an export', async () => {
    const server = await startServer(DIST);
    const ctx = await launch(profile.dir);
    try {
      const page = ctx.pages()[0] ?? (await ctx.newPage());
      await page.goto(`${server.url}#/vessels`);
      await page.getByRole('button', { name: 'Load demo plant' }).click();
      await page.getByRole('link', { name: /DEMO-FT-02/ }).waitFor();

      // No check yet: no reminder.
      await page.goto(`${server.url}#/log`);
      await page.locator('[data-backup-reminder="not-due"]').waitFor({ state: 'attached', timeout: LONG_JOB_MS });

      await page.goto(`${server.url}#/check`);
      await page.locator('[data-draft="loaded"]').waitFor();
      await pickVessel(page, '#pick-vessel', 'DEMO-FT-02');
      await page.selectOption('#chk-temperature-unit', 'degC');
      await page.fill('#chk-temperature', '151,8');
      await page.selectOption('#chk-pressure-unit', 'kPa');
      await page.fill('#chk-pressure', '400');
      await page.fill('#chk-tech', 'Storage Test');
      await page.getByRole('button', { name: 'Save check' }).click();
      await page.locator('[data-save-state="saved"]').waitFor({ timeout: LONG_JOB_MS });

      await page.goto(`${server.url}#/log`);
      const reminder = page.locator('[data-backup-reminder="due"]');
      await reminder.waitFor({ timeout: LONG_JOB_MS });
      expect(await reminder.textContent()).toMatch(/No backup yet/);
      expect(await reminder.getAttribute('role')).toBe('status');

      await page.goto(`${server.url}#/settings`);
      const panel = page.locator('[data-storage="ready"]');
      await panel.waitFor({ timeout: LONG_JOB_MS });
      const browser = await page.evaluate(async () => ({ persisted: await navigator.storage.persisted(), usage: (await navigator.storage.estimate()).usage ?? 0 }));
      const text = (await panel.textContent()) ?? '';
      expect(text).toContain(browser.persisted ? 'persistent' : 'best effort');
      const shownMb = Number(/Used: ([\d.,]+) MB used/.exec(text)?.[1]?.replace(/,/g, ''));
      // The usage shown is the browser's, to the 0.1 MB it is rounded to (a draft write may land between the two reads).
      expect(Math.abs(shownMb - browser.usage / 1e6)).toBeLessThan(0.2);
      expect(text).toContain('Last backup: never');

      // Bad days are refused with the field and the range named; nothing is changed.
      await page.fill('#set-reminder', '0');
      expect(await page.textContent('#set-reminder-error')).toBe('Backup reminder: "0" is not a whole number of days from 1 to 60.');
      await page.fill('#set-reminder', '3');
      expect(await page.locator('#set-reminder-error').count()).toBe(0);

      const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Export full backup (JSON)' }).click()]);
      expect(download.suggestedFilename()).toMatch(/^tankside-backup-/);
      await page.locator('[data-last-backup]:not([data-last-backup=""])').waitFor({ timeout: LONG_JOB_MS });
      expect(await page.textContent('[data-last-backup]')).toMatch(/^\d{4}-\d\d-\d\d \d\d:\d\d( [A-Z+\-:\d]+)? \(exported\)$/);

      await page.goto(`${server.url}#/log`);
      await page.locator('[data-backup-reminder="not-due"]').waitFor({ state: 'attached', timeout: LONG_JOB_MS });
      // The setting was kept.
      await page.goto(`${server.url}#/settings`);
      await page.locator('[data-storage="ready"]').waitFor({ timeout: LONG_JOB_MS });
      expect(await page.inputValue('#set-reminder')).toBe('3');
    } finally {
      await ctx.close();
      await server.close();
    }
  });
});
