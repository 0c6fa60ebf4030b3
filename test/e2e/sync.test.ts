// Plant sync as deployed: deploy/nginx-tankside.conf run by Debian's nginx serves the built app and
// proxies /db/ to the CouchDB stand-in (test/sync/nginx.ts, test/sync/stand-in.ts), and three
// persistent Chromium profiles use it as three phones: two technicians and a supervisor. Each
// technician enrols (one from an enrolment link, one by typing the form, after a wrong password
// the screen names in plain words), saves checks with the network off, and sees them go up when it
// comes back (the `online` trigger); the supervisor enrols, pulls, and the Review's verification
// shows both technicians' chains intact and signed by their devices. The footer names the server
// only once sync is on. Every wait is on the app's own data attributes. The vessels are the demo
// plant (DEMO DATA).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BrowserContext, Page } from 'playwright-core';
import { DIST, axeViolations, launch, pickVessel, screenshot, tempProfile, verifyChainsOnScreen, waitForControl } from './harness.ts';
import { startSite, type NginxSite } from '../sync/nginx.ts';
import { StandIn } from '../sync/stand-in.ts';

describe('plant sync behind nginx, three profiles', () => {
  const profiles = [tempProfile(), tempProfile(), tempProfile()];
  let couch: StandIn;
  let site: NginxSite;
  let ctx: BrowserContext | null = null;
  const devices: string[] = [];

  beforeAll(async () => {
    couch = await StandIn.start();
    site = await startSite(DIST, couch.port);
  });
  afterAll(async () => {
    await ctx?.close();
    await site?.stop();
    await couch?.stop();
    for (const p of profiles) p.remove();
  });

  async function open(profile: number, hash: string): Promise<Page> {
    await ctx?.close();
    ctx = await launch(profiles[profile]!.dir);
    const page = ctx.pages()[0] ?? (await ctx.newPage());
    await page.goto(`${site.origin}/${hash}`);
    await page.locator('main[data-app-state="ready"]').waitFor();
    return page;
  }

  /** This profile's device id, as the Sync screen shows it before enrolment. */
  async function deviceIdOf(page: Page): Promise<string> {
    await page.goto(`${site.origin}/#/sync`);
    await page.locator('[data-sync-enrolment="none"]').waitFor();
    return ((await page.locator('[data-enrol-form] strong.device-id').textContent()) ?? '').trim();
  }

  async function enrolTyped(page: Page, password: string, role: 'Technician' | 'Supervisor'): Promise<void> {
    await page.fill('#sync-server', '/db/');
    await page.fill('#sync-password', password);
    await page.getByRole('radio', { name: role }).check();
    await page.getByRole('button', { name: 'Enrol this device' }).click();
    await page.locator('[data-sync-enrolment="enrolled"]').waitFor();
  }

  async function saveCheck(page: Page, tag: string, temperature: string): Promise<void> {
    await page.goto(`${site.origin}/#/check`);
    await page.reload();
    await page.locator('main[data-app-state="ready"]').waitFor();
    await pickVessel(page, '#pick-vessel', tag);
    await page.fill('#chk-temperature', temperature);
    await page.fill('#chk-pressure', '100');
    await page.fill('#chk-tech', 'Demo Technician');
    await page.getByRole('button', { name: 'Save check' }).click();
    await page.locator('[data-save-state="saved"]').waitFor();
  }

  /** A technician's day: enrolled, two checks saved offline, then back online. */
  async function offlineThenOnline(page: Page): Promise<void> {
    await ctx!.setOffline(true);
    await saveCheck(page, 'DEMO-ST-01', '120');
    await saveCheck(page, 'DEMO-FT-02', '133');
    // Offline: "Sync now" says so in plain words at once, and nothing is lost.
    await page.goto(`${site.origin}/#/sync`);
    await page.getByRole('button', { name: 'Sync now' }).click();
    await page.locator('[data-sync-error="offline"]').waitFor();
    expect(await page.locator('[data-pending-count]').getAttribute('data-pending-count')).toBe('2');
    await ctx!.setOffline(false); // the `online` event starts the sync
    await page.locator('[data-sync-state="ok"][data-sync-pending="0"]').waitFor();
  }

  it('technician A: enrols from an enrolment link; checks saved offline go up when the network returns', async () => {
    const page = await open(0, '#/vessels');
    await waitForControl(page);
    expect(await page.locator('footer').getAttribute('data-sync-promise')).toBe('local');
    expect(await page.locator('footer').textContent()).toContain('no data leaves this device');
    await page.getByRole('button', { name: 'Load demo plant' }).click();
    await page.getByRole('link', { name: /DEMO-ST-01/ }).waitFor();
    const id = await deviceIdOf(page);
    devices.push(id);
    const password = couch.addAccount('device', id);
    const link = `${site.origin}/#/sync/enrol?${new URLSearchParams({ server: '/db/', account: id, password, role: 'technician' })}`;
    await page.goto(link);
    await page.locator('[data-enrol-message]').filter({ hasText: 'Read from the enrolment link' }).waitFor();
    // The password is off the address once read.
    await expect.poll(() => page.evaluate(() => location.hash)).toBe('#/sync');
    expect(await page.inputValue('#sync-account')).toBe(id);
    await page.getByRole('button', { name: 'Enrol this device' }).click();
    await page.locator('[data-sync-enrolment="enrolled"] [data-sync-state="ok"]').waitFor();
    expect(await page.locator('footer').getAttribute('data-sync-promise')).toBe('server');
    expect(await page.locator('footer').textContent()).toContain(`checks are sent to ${new URL(site.origin).host}/db/`);
    await offlineThenOnline(page);
    await screenshot(page, 'sync-technician');
    expect(await axeViolations(page)).toEqual([]);
  });

  it('technician B: a wrong password is named in plain words; typed again, its offline checks go up', async () => {
    const page = await open(1, '#/vessels');
    await waitForControl(page);
    await page.getByRole('button', { name: 'Load demo plant' }).click();
    await page.getByRole('link', { name: /DEMO-ST-01/ }).waitFor();
    const id = await deviceIdOf(page);
    devices.push(id);
    const password = couch.addAccount('device', id);
    // A field out of range is named before anything is saved.
    await page.fill('#sync-password', 'short');
    await page.getByRole('button', { name: 'Enrol this device' }).click();
    expect(await page.locator('#sync-password-error').textContent()).toBe('Password: 5 characters; the administrator\'s passwords have 12 to 200.');
    await enrolTyped(page, `${password}x`, 'Technician');
    await page.locator('[data-sync-error="credentials"]').waitFor();
    await screenshot(page, 'sync-refused');
    await page.getByRole('button', { name: 'Stop syncing on this device' }).click();
    await page.locator('[data-sync-enrolment="none"]').waitFor();
    expect(await page.locator('footer').getAttribute('data-sync-promise')).toBe('local');
    await enrolTyped(page, password, 'Technician');
    await page.locator('[data-sync-state="ok"]').waitFor();
    await offlineThenOnline(page);
  });

  it('the supervisor pulls both chains and sees each intact and signed by its device', async () => {
    const page = await open(2, '#/sync');
    await waitForControl(page);
    const id = await deviceIdOf(page);
    await enrolTyped(page, couch.addAccount('supervisor', id), 'Supervisor');
    await page.locator('[data-sync-state="ok"]').waitFor();
    expect(await page.locator('[data-last-sync]').textContent()).toMatch(/finished/);
    await page.goto(`${site.origin}/#/review`);
    await page.locator('[data-review-state="ready"]').waitFor();
    const { state, lines } = await verifyChainsOnScreen(page);
    expect(state).toBe('done');
    for (const device of devices) {
      const line = lines.find((l) => l.text.includes(device.slice(0, 8)));
      expect(line, JSON.stringify(lines)).toBeDefined();
      expect(line!.chain).toBe('ok');
      expect(line!.text).toContain('2 records, seq 1 to 2');
      expect(line!.text).toContain(`signed by device ${device.slice(0, 8)}`);
      expect(line!.text).not.toContain('without');
    }
    await screenshot(page, 'sync-supervisor-review');
  });
});
