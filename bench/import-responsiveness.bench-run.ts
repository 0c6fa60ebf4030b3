// How the page answers a tap while a 150 MB backup is imported, and how much memory the import
// takes, in headless Chromium through the Review screen. Another device's valid signed log of
// 82,000 generated checks (about 150 MB, invented data) is imported into a fresh profile; while it
// runs, the test taps the import panel's heading again and again, each tap sent as soon as the last was
// handled, and the page records each tap's input delay (handler time minus the event's own time
// stamp). Afterwards: the import's time (its User Timing entry), the taps' delays, and the peak
// resident memory of the browser's processes (VmHWM). Prints figures and the load average (a
// shared 2-core machine); asserts only that the import added every check.
// Run: npx vitest run --config bench/vitest.config.ts bench/import-responsiveness.bench-run.ts
// TANKSIDE_BENCH_DIST=<folder> measures another build of the app (e.g. one importing on the page).
import { mkdtempSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { expect, it } from 'vitest';
import { DIST, launch, startServer, tempProfile } from '../test/e2e/harness.ts';
import { generatedBackup } from './generated-log.ts';
import { browserPeakKb } from './browser-memory.ts';

const CHECKS = 82_000;

it('prints tap delays and peak memory during a 150 MB import', async () => {
  const dist = process.env.TANKSIDE_BENCH_DIST ?? DIST;
  const files = mkdtempSync(join(tmpdir(), 'tankside-import-bench-'));
  const file = join(files, 'large.json');
  writeFileSync(file, await generatedBackup({
    deviceId: '8e2d4c6a-1b3f-4a5e-8c7d-9f0a1b2c3d4e', vesselPrefix: '5eed0302', vessels: 200, checks: CHECKS,
    startMs: Date.parse('2022-01-01T00:00:00Z'), stepMs: 600_000, technicians: ['Gen Eight', 'Gen Nine', 'Gen Ten'], seed: 42, signed: true,
  }));
  const server = await startServer(dist);
  const profile = tempProfile();
  const ctx = await launch(profile.dir);
  try {
    const page = ctx.pages()[0] ?? (await ctx.newPage());
    await page.goto(`${server.url}#/review`);
    await page.locator('[data-review-state="ready"]').waitFor();
    await page.evaluate(() => {
      const w = window as unknown as { tapDelays: number[] };
      w.tapDelays = [];
      document.getElementById('review-transfer-title')!.addEventListener('mousedown', (e) => w.tapDelays.push(performance.now() - e.timeStamp));
    });
    const before = browserPeakKb(profile.dir);
    const load = loadavg().map((x) => x.toFixed(2)).join(', ');
    await page.setInputFiles('#rt-file', file);
    await page.getByRole('button', { name: 'Import and merge' }).click();
    // The panel's heading, a plain text element, where the import controls were scrolled into view.
    const box = (await page.locator('#review-transfer-title').boundingBox())!;
    const report = page.locator('[data-import-run="1"] [data-import-result]');
    let ended = false;
    const done = report.waitFor({ timeout: 590_000 }).then(() => { ended = true; });
    // Each tap sent when the page has handled the last: a page that is busy holds the next one back.
    const roundTrips: number[] = [];
    while (!ended) {
      const t0 = performance.now();
      await page.mouse.click(box.x + 5, box.y + 5);
      roundTrips.push(performance.now() - t0);
    }
    await done;
    expect(await page.getAttribute('[data-import-added]', 'data-import-added')).toBe(String(CHECKS));
    const delays = await page.evaluate(() => (window as unknown as { tapDelays: number[] }).tapDelays);
    const importMs = await page.evaluate(() => performance.getEntriesByName('tankside: Importing the backup').at(-1)?.duration ?? NaN);
    const peak = browserPeakKb(profile.dir);
    const sorted = [...delays].sort((a, b) => a - b);
    const at = (q: number) => sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))] ?? NaN;
    const mb = (kb: number) => `${(kb / 1024).toFixed(0)} MB`;
    console.log(
      `\nImport of a ${(statSync(file).size / 1e6).toFixed(0)} MB signed backup (${CHECKS.toLocaleString('en-GB')} checks) in headless Chromium, ${dist === DIST ? 'this build' : dist}\n` +
        `load average before ${load}, after ${loadavg().map((x) => x.toFixed(2)).join(', ')} (2 cores, shared)\n` +
        `  import, start to report (User Timing):      ${(importMs / 1000).toFixed(1)} s\n` +
        `  taps during it: ${delays.length}; input delay median ${at(0.5).toFixed(0)} ms, 95th percentile ${at(0.95).toFixed(0)} ms, longest ${Math.max(...delays).toFixed(0)} ms\n` +
        `  longest round trip of a tap (send to handled, from the test): ${Math.max(...roundTrips).toFixed(0)} ms\n` +
        `  peak resident memory (VmHWM) by process type, before → after: ${Object.keys(peak.byType).sort().map((t) => `${t} ${mb(before.byType[t] ?? 0)} → ${mb(peak.byType[t]!)}`).join(', ')}\n` +
        `  largest single renderer (the page and its workers): ${mb(peak.largestRendererKb)}\n`,
    );
  } finally {
    await ctx.close();
    await server.close();
    profile.remove();
    rmSync(files, { recursive: true, force: true });
  }
});
