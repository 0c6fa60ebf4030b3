// An app update arriving while a check is half entered: the person is told a new version is
// ready, chooses when to reload, and the entry (even the last keystroke) is still there after.
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DIST, ROOT, launch, pickVessel, startServer, tempProfile, waitForControl } from './harness.ts';

const NEXT = join(ROOT, 'test-results/dist-next');
const VERSION = (JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8')) as { version: string }).version;

describe('app update during an entry', () => {
  const profile = tempProfile();
  beforeAll(() => {
    // A second build with a different version: new bytes for every asset and for sw.js. NODE_ENV is
    // Vitest's 'test' here, which Vite would build with import.meta.env.DEV set (and the new page's
    // worker bridge switched off); the update must be a production build like the first.
    const r = spawnSync('npx', ['vite', 'build', '--outDir', NEXT, '--logLevel', 'warn'], {
      cwd: ROOT, env: { ...process.env, NODE_ENV: 'production', TANKSIDE_BUILD_TAG: 'next' }, stdio: 'inherit',
    });
    expect(r.status).toBe(0);
  });
  afterAll(() => profile.remove());

  it('waits for the person, saves the draft, reloads once into the new version', async () => {
    const server = await startServer(DIST);
    const ctx = await launch(profile.dir);
    const page = ctx.pages()[0] ?? (await ctx.newPage());
    await page.goto(`${server.url}#/vessels`);
    await waitForControl(page);
    await expect.poll(() => page.locator('.app-version').textContent()).toBe(`Tankside ${VERSION}`);

    await page.getByRole('button', { name: 'Load demo plant' }).click();
    await expect.poll(() => page.getByRole('link', { name: /DEMO-FT-02/ }).count()).toBe(1);
    await page.getByRole('link', { name: 'Check' }).click();
    await pickVessel(page, '#pick-vessel', 'DEMO-FT-02');
    await page.fill('#chk-temperature', '151,8');
    await page.fill('#chk-pressure', '400');

    // The new version arrives; nothing reloads by itself.
    server.serve(NEXT);
    let loads = 0;
    page.on('load', () => { loads += 1; });
    await page.evaluate(async () => { await (await navigator.serviceWorker.getRegistration())?.update(); });
    const banner = page.getByText('A new version of Tankside is ready');
    await expect.poll(() => banner.count(), { timeout: 30_000 }).toBe(1);
    expect(loads).toBe(0);
    expect(await page.inputValue('#chk-temperature')).toBe('151,8');

    // Type the last field and accept at once: the draft flush must catch the last keystroke.
    await page.fill('#chk-gross', '612');
    await page.getByRole('button', { name: 'Reload now' }).click();
    await expect.poll(() => page.locator('.app-version').textContent(), { timeout: 30_000 }).toBe(`Tankside ${VERSION}+next`);
    await expect.poll(() => page.inputValue('#chk-gross')).toBe('612');
    expect(await page.inputValue('#chk-temperature')).toBe('151,8');
    expect(await page.inputValue('#chk-pressure')).toBe('400');
    expect(await page.locator('#pick-vessel option:checked').textContent()).toMatch(/DEMO-FT-02/);
    // The new page says when its worker registration has settled (controlled by the new worker,
    // nothing installing or waiting): a second reload (an unguarded controllerchange) would have
    // been issued by then, and the new page would not have settled in the old one's place.
    await page.waitForSelector('html[data-worker-state="current"]', { timeout: 30_000 });
    expect(await page.locator('.app-version').textContent()).toBe(`Tankside ${VERSION}+next`);
    expect(loads).toBe(1);
    await ctx.close();
    await server.close();
  });
});
