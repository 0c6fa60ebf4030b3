// Vessel labels on the plant floor: the printed sheet's QR codes, decoded by a second, independent
// library (jsqr, npm), carry each vessel's new-check link; opening that link picks the vessel; and
// where the browser offers BarcodeDetector the in-app scanner reads a label and picks its vessel
// (a stand-in detector over Chromium's fake camera, since desktop Chromium on Linux has none).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import jsQR from 'jsqr';
import type { BrowserContext, Page } from 'playwright-core';
import { DIST, launch, startServer, tempProfile, waitForControl, type StaticServer } from './harness.ts';

describe('vessel labels', () => {
  const profile = tempProfile();
  let server: StaticServer;
  let ctx: BrowserContext;
  let page: Page;

  beforeAll(async () => {
    server = await startServer(DIST);
    ctx = await launch(profile.dir, 'light', ['--use-fake-device-for-media-stream', '--use-fake-ui-for-media-stream']);
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

  it('each label\'s QR code decodes (jsqr) to that vessel\'s new-check link, and the link opens it', async () => {
    await page.goto(`${server.url}#/labels`);
    await expect.poll(() => page.locator('.vessel-label').count()).toBe(4);
    const labels = await page.$$eval('.vessel-label', (els) => els.map((el) => {
      const svg = el.querySelector('svg')!;
      const size = Number(svg.getAttribute('viewBox')!.split(' ')[2]);
      const scale = 4;
      const canvas = document.createElement('canvas');
      canvas.width = canvas.height = size * scale;
      const g = canvas.getContext('2d')!;
      g.fillStyle = '#fff';
      g.fillRect(0, 0, canvas.width, canvas.height);
      g.scale(scale, scale);
      g.fillStyle = '#000';
      g.fill(new Path2D(svg.querySelector('path')!.getAttribute('d')!));
      const img = g.getImageData(0, 0, canvas.width, canvas.height);
      return { link: el.getAttribute('data-link')!, tag: el.querySelector('.label-tag')!.textContent!, width: img.width, height: img.height, rgba: [...img.data] };
    }));
    for (const l of labels) {
      const decoded = jsQR(Uint8ClampedArray.from(l.rgba), l.width, l.height);
      expect(decoded?.data, l.tag).toBe(l.link);
      expect(l.link).toMatch(new RegExp(`^${server.url.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}#/check/[0-9a-f-]{36}$`));
    }
    const st = labels.find((l) => l.tag === 'DEMO-ST-01')!;
    await page.goto(st.link);
    await page.locator('main[data-app-state="ready"]').waitFor();
    await expect.poll(async () => page.$eval('#pick-vessel', (el) => (el as HTMLSelectElement).selectedOptions[0]?.text ?? '')).toMatch(/^DEMO-ST-01/);
  });

  it('where BarcodeDetector exists, Scan reads a label through the camera and picks its vessel', async () => {
    await page.goto(`${server.url}#/labels`);
    await page.locator('.vessel-label').first().waitFor();
    const link = await page.$$eval('.vessel-label', (els) => els.find((e) => e.querySelector('.label-tag')?.textContent === 'DEMO-JK-04')!.getAttribute('data-link')!);
    // A stand-in for the Shape Detection API: it "sees" the label once the camera is playing.
    await page.addInitScript((text: string) => {
      (window as unknown as { BarcodeDetector: unknown }).BarcodeDetector = class {
        async detect(video: HTMLVideoElement) { return video.readyState >= 2 ? [{ rawValue: text }] : []; }
      };
    }, link);
    await page.goto(`${server.url}#/check`);
    await page.reload();
    await page.locator('main[data-app-state="ready"]').waitFor();
    await page.getByRole('button', { name: "Scan the vessel's label" }).click();
    await expect.poll(async () => page.$eval('#pick-vessel', (el) => (el as HTMLSelectElement).selectedOptions[0]?.text ?? ''), { timeout: 20_000 }).toMatch(/^DEMO-JK-04/);
    expect(await page.locator('.scan-view').count()).toBe(0);
  });

  it('without BarcodeDetector the tag is typed instead', async () => {
    const fresh = await ctx.newPage();
    await fresh.goto(`${server.url}#/check`);
    await fresh.locator('main[data-app-state="ready"]').waitFor();
    expect(await fresh.getByRole('button', { name: "Scan the vessel's label" }).count()).toBe(0);
    await fresh.getByText('Type the tag instead').click();
    await fresh.fill('#chk-tag', 'demo-cr');
    await expect.poll(async () => fresh.$eval('#pick-vessel', (el) => (el as HTMLSelectElement).selectedOptions[0]?.text ?? '')).toMatch(/^DEMO-CR-03/);
    // DEMO-CR-03's instruments read psi, °F and lb: the empty fields start in them.
    await expect.poll(() => fresh.inputValue('#chk-pressure-unit')).toBe('psi');
    expect(await fresh.inputValue('#chk-temperature-unit')).toBe('degF');
    await fresh.close();
  });
});
