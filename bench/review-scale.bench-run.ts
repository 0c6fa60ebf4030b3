// Scale benchmark of the review screen in headless Chromium against the built app: a generated
// log of 100,000 checks over 200 vessels (imported through the screen) and the figures a
// supervisor feels on it; then another device's 100,000 imported and merged into it, and the same
// figures again on the 200,000. Then a plant's consolidated log (issue 14): 500,000 checks from 50
// devices, the same figures against targets per 100,000, plus the plant overview, the wide
// review's sort over the whole match and a filtered CSV. Prints each figure beside its target and
// the load average; asserts nothing about time.
// Run: npm run bench (builds first; ~3–5 minutes on a small machine for the first run, ~15 more for
// the plant's). BENCH_PLANT_ONLY=1 runs only the plant's; BENCH_PLANT_DEVICES and
// BENCH_PLANT_PER_DEVICE make it smaller while changing the benchmark itself.
import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { DIST, ROOT, launch, startServer, tempProfile } from '../test/e2e/harness.ts';
import { generatedBackup } from './generated-log.ts';
import { browserCpuSplit } from './browser-cpu.ts';

// BENCH_CHECKS lets a quick run use a smaller log while changing the benchmark itself.
const CHECKS = Number(process.env['BENCH_CHECKS'] ?? 100_000);
const VESSELS = 200;
const YEAR_MS = 365 * 24 * 3_600_000;
const START = Date.parse('2026-01-01T00:00:00Z');

const N = CHECKS.toLocaleString('en-GB');
const N2 = (2 * CHECKS).toLocaleString('en-GB');
const rows: { what: string; ms: number; target: string }[] = [];
function note(what: string, ms: number, target: string): void {
  rows.push({ what, ms, target });
  const load = loadavg().map((x) => x.toFixed(1)).join(' ');
  console.log(`  ${what.padEnd(66)} ${(ms / 1000).toFixed(3).padStart(8)} s   target ${target.padEnd(28)} load ${load}`);
}

/** For a row timed by timeRows: how much of it was reading the store. */
function noteRead(): void {
  console.log(`    ${'of which reading the first page from the store'.padEnd(64)} ${(lastRead / 1000).toFixed(3).padStart(8)} s`);
}

/** When the last timed first page had been read from the store, ms after the action. */
let lastRead = NaN;

/** Runs `act` in the page and waits until the review shows a new first page; ms by the page's clock. */
async function timeRows(page: Page, act: string): Promise<number> {
  return page.evaluate(async (action) => {
    const root = () => document.querySelector('.review-screen');
    const before = Number(root()?.getAttribute('data-shown') ?? '-1');
    const t0 = performance.now();
    // The action is one of a few fixed statements written below, not user input.
    const [kind, selector, value] = action.split('|') as [string, string, string];
    if (kind === 'hash') location.hash = value;
    else {
      const el = document.querySelector(selector) as HTMLInputElement | HTMLSelectElement;
      el.value = value;
      el.dispatchEvent(new Event('change', { bubbles: true }));
    }
    await new Promise<void>((done) => {
      const tick = () => {
        const r = root();
        if (r && Number(r.getAttribute('data-shown')) > before && r.querySelector('.review-row, .review-table tbody tr')) done();
        else requestAnimationFrame(tick);
      };
      tick();
    });
    const read = performance.getEntriesByName('tankside: first page read').at(-1)?.startTime ?? NaN;
    return [performance.now() - t0, read - t0] as const;
  }, act).then(([ms, readMs]) => {
    lastRead = readMs;
    return ms;
  });
}

/** The page's own timing of its last job with this label (store work plus making the file). */
async function jobMs(page: Page, label: string): Promise<number> {
  return page.evaluate((name) => performance.getEntriesByName(`tankside: ${name}`).at(-1)?.duration ?? NaN, label);
}

function noteJob(what: string, ms: number): void {
  console.log(`    ${what.padEnd(64)} ${(ms / 1000).toFixed(3).padStart(8)} s`);
  console.log(`    ${'CPU used by all browser processes during the click'.padEnd(64)} ${lastCpuS.toFixed(3).padStart(8)} s`);
  console.log(`    ${'… of which the renderer (the page and its workers)'.padEnd(64)} ${lastRendererCpuS.toFixed(3).padStart(8)} s`);
}

/** CPU seconds of the browser's processes during the last timed click, and of its renderers. */
let lastCpuS = NaN;
let lastRendererCpuS = NaN;

/** The profile folder of the running browser, so its processes can be found. */
let profileDir = '';

/** CPU seconds used so far by every process of the running browser. */
const browserCpuSNow = () => browserCpuSplit(profileDir);

// BENCH_PROFILE=<folder> records a CPU profile of the page around each timed click (and builds
// without minifying, so the profile names functions); the figures of such a run are not comparable.
const PROFILE_DIR = process.env['BENCH_PROFILE'];

async function timeClick(page: Page, name: string, until: () => Promise<unknown>): Promise<number> {
  const cdp = PROFILE_DIR ? await page.context().newCDPSession(page) : null;
  if (cdp) {
    await cdp.send('Profiler.enable');
    await cdp.send('Profiler.setSamplingInterval', { interval: 200 });
    await cdp.send('Profiler.start');
  }
  const t0 = Date.now();
  const cpu0 = browserCpuSNow();
  await Promise.all([until(), page.getByRole('button', { name }).click()]);
  const ms = Date.now() - t0;
  const cpu1 = browserCpuSNow();
  lastCpuS = cpu1.total - cpu0.total;
  lastRendererCpuS = cpu1.renderers - cpu0.renderers;
  if (cdp && PROFILE_DIR) {
    const { profile } = await cdp.send('Profiler.stop');
    mkdirSync(PROFILE_DIR, { recursive: true });
    writeFileSync(join(PROFILE_DIR, `${name.replace(/\W+/g, '-')}-${Date.now()}.cpuprofile`), JSON.stringify(profile));
    await cdp.detach();
  }
  return ms;
}

/** Targets of the long jobs for a log of `count` checks. */
interface JobTargets { csv: string; json: string; verify: string }

/** Everything a supervisor does with the log as it stands (`count` checks on `devices` devices). */
async function reviewFigures(page: Page, url: string, count: string, devices: number, targets: JobTargets, checks: number): Promise<void> {
  const per100k = (ms: number) => `${((ms / 1000) * (100_000 / checks)).toFixed(2)} s per 100,000`;
  // A download counts when the file is complete on disk, not when it starts.
  const download = async () => {
    const d = await page.waitForEvent('download', { timeout: 600_000 });
    await d.path();
  };
  console.log(`\n With ${count} checks on the device:`);
  await page.goto(`${url}#/settings`);
  await page.reload();
  await page.locator('header h1').waitFor();
  note(`first rows of the review screen (${count} checks; from another screen)`, await timeRows(page, 'hash||#/review'), '≤ 300 ms');
  noteRead();
  await page.reload();
  const cold = await page.evaluate(async () => {
    await new Promise<void>((done) => {
      const tick = () => (document.querySelector('.review-row') ? done() : requestAnimationFrame(tick));
      tick();
    });
    return performance.now();
  });
  note(`first rows after a reload (page load, store open, first page; ${count})`, cold, '(≤ 300 ms for the screen)');
  const vesselId = await page.locator('#rf-vessel option').nth(17).getAttribute('value');
  note(`filter by vessel (1 of 200; ${count})`, await timeRows(page, `change|#rf-vessel|${vesselId}`), '≤ 200 ms');
  noteRead();
  note(`… and by month (2026-06; ${count})`, await timeRows(page, 'change|#rf-month|2026-06'), '≤ 200 ms');
  noteRead();
  note(`filter by month only, all vessels (vessel cleared; ${count})`, await timeRows(page, 'change|#rf-vessel|'), '≤ 200 ms');
  noteRead();
  note(`filter by outcome DANGER as well (${count})`, await timeRows(page, 'change|#rf-outcome|DANGER'), '≤ 200 ms');
  noteRead();
  await page.locator('.review-totals[data-complete="yes"]').waitFor();
  note(`CSV of the filtered checks (June, DANGER; ${count})`, await timeClick(page, 'Filtered checks as CSV', download), '(no target)');
  noteJob('of which exportCsvParts({ filter }) and making the file, timed in the page', await jobMs(page, 'Writing the CSV of the filtered checks'));
  note(`filter cleared (${count})`, await timeRows(page, 'change|#rf-month|'), '≤ 200 ms');
  await page.selectOption('#rf-outcome', '');
  await page.locator('.review-totals[data-complete="yes"]').waitFor();
  const csv = await timeClick(page, 'Download CSV', download);
  note(`CSV export (${count} checks; click to file complete)`, csv, targets.csv);
  console.log(`    ${per100k(csv)}`);
  noteJob('of which exportCsv and making the file, timed in the page', await jobMs(page, 'Writing the CSV'));
  const json = await timeClick(page, 'Download JSON backup', download);
  note(`JSON backup export (${count} checks; click to file complete)`, json, targets.json);
  console.log(`    ${per100k(json)}`);
  noteJob('of which exportBackup and making the file, timed in the page', await jobMs(page, 'Writing the backup'));
  const verify = await timeClick(page, 'Verify chains', () => page.locator('[data-chain]').first().waitFor());
  note(`chain verification (${devices} device${devices > 1 ? 's' : ''}, ${count} checks)`, verify, targets.verify);
  console.log(`    ${per100k(verify)}`);
  noteJob('of which verifyStoredChains, timed in the page', await jobMs(page, 'Verifying chains'));
  expect(await page.locator('[data-chain="ok"]').count()).toBe(devices);
}

/** A browser on a fresh profile, the built app served, and a folder for the generated files. */
async function session<T>(work: (page: Page, url: string, dir: string) => Promise<T>): Promise<T> {
  // Built into the folder served (TANKSIDE_DIST when set), so a long run keeps its own build while the worktree builds again.
  const build = spawnSync('npx', ['vite', 'build', '--logLevel', 'warn', '--outDir', DIST, '--emptyOutDir', ...(PROFILE_DIR ? ['--minify', 'false'] : [])], { cwd: ROOT, stdio: 'inherit' });
  expect(build.status).toBe(0);
  const dir = mkdtempSync(join(tmpdir(), 'tankside-bench-'));
  const profile = tempProfile();
  const server = await startServer(DIST);
  const ctx = await launch(profile.dir);
  profileDir = profile.dir;
  try {
    const page = ctx.pages()[0] ?? (await ctx.newPage());
    page.setDefaultTimeout(600_000);
    await page.goto(`${server.url}#/review`);
    await page.locator('[data-review-state="ready"]').waitFor();
    return await work(page, server.url, dir);
  } finally {
    await ctx.close();
    await server.close();
    profile.remove();
    rmSync(dir, { recursive: true, force: true });
  }
}

async function importFile(page: Page, file: string, run: number): Promise<number> {
  await page.setInputFiles('#rt-file', file);
  return timeClick(page, 'Import and merge', () => page.locator(`[data-import-run="${run}"] [data-import-result="done"]`).waitFor());
}

const common = { vessels: VESSELS, vesselPrefix: '5eed0200', technicians: ['Gen Adeyemi', 'Gen Berg', 'Gen Castro', 'Gen Dubois', 'Gen Endo'] };

it.skipIf(process.env['BENCH_PLANT_ONLY'] === '1')(`review at ${N} + ${N} checks`, async () => {
  await session(async (page, url, dir) => {
    const t = Date.now();
    const one = { ...common, checks: CHECKS, stepMs: YEAR_MS / CHECKS };
    const fileA = join(dir, 'device-a.json');
    const fileB = join(dir, 'device-b.json');
    writeFileSync(fileA, await generatedBackup({ ...one, deviceId: 'a0000000-0000-4000-8000-00000000000a', startMs: START, seed: 1 }));
    writeFileSync(fileB, await generatedBackup({ ...one, deviceId: 'b0000000-0000-4000-8000-00000000000b', startMs: START + 60_000, seed: 2 }));
    console.log(`\nGenerated 2 × ${CHECKS} checks over ${VESSELS} vessels in ${((Date.now() - t) / 1000).toFixed(1)} s` +
      ` (files ${(statSync(fileA).size / 1e6).toFixed(1)} MB each, generated data)`);
    console.log('Figures (headless Chromium, built app; this machine):');
    note(`import ${N} checks into an empty device (seeding)`, await importFile(page, fileA, 1), '(seeding, no target)');
    await reviewFigures(page, url, N, 1, { csv: '≤ 3 s', json: '≤ 3 s', verify: '≤ 2 s' }, CHECKS);
    await page.goto(`${url}#/review`);
    await page.locator('[data-review-state="ready"]').waitFor();
    console.log('');
    note(`import and merge ${N} checks into a device holding ${N}`, await importFile(page, fileB, 1), '≤ 10 s');
    noteJob('of which reading the file and importBackup, timed in the page', await jobMs(page, 'Importing the backup'));
    expect(await page.locator('[data-import-added]').getAttribute('data-import-added')).toBe(String(CHECKS));
    await reviewFigures(page, url, N2, 2, { csv: '≤ 3 s', json: '≤ 3 s', verify: '≤ 2 s' }, 2 * CHECKS);
    console.log('Summary:', JSON.stringify(rows.map((r) => ({ [r.what]: Math.round(r.ms) }))));
  });
});

const PLANT_DEVICES = Number(process.env['BENCH_PLANT_DEVICES'] ?? 50);
const PER_DEVICE = Number(process.env['BENCH_PLANT_PER_DEVICE'] ?? 10_000);
const PLANT = PLANT_DEVICES * PER_DEVICE;

it(`a plant's consolidated log: ${PLANT.toLocaleString('en-GB')} checks from ${PLANT_DEVICES} devices`, async () => {
  rows.length = 0;
  await session(async (page, url, dir) => {
    const count = PLANT.toLocaleString('en-GB');
    const per100k = (s: number) => `≤ ${((s * PLANT) / 100_000).toFixed(1)} s (${s} s per 100,000)`;
    console.log(`\nA plant's log: ${PLANT_DEVICES} devices × ${PER_DEVICE.toLocaleString('en-GB')} checks over ${VESSELS} vessels (generated data), each device's file imported in turn`);
    let generating = 0;
    let importing = 0;
    for (let d = 0; d < PLANT_DEVICES; d += 1) {
      const t = Date.now();
      const file = join(dir, `device-${d}.json`);
      const deviceId = `d${String(d).padStart(7, '0')}-0000-4000-8000-000000000050`;
      writeFileSync(file, await generatedBackup({ ...common, checks: PER_DEVICE, stepMs: YEAR_MS / PER_DEVICE, deviceId, startMs: START + d * 7_000, seed: 100 + d }));
      generating += Date.now() - t;
      importing += await importFile(page, file, d + 1);
      rmSync(file);
      if ((d + 1) % 10 === 0) console.log(`  ${d + 1} devices imported (${((d + 1) * PER_DEVICE).toLocaleString('en-GB')} checks); generating ${(generating / 1000).toFixed(0)} s, importing ${(importing / 1000).toFixed(0)} s so far`);
    }
    note(`seeding: ${PLANT_DEVICES} imports, ${count} checks in all`, importing, '(seeding, no target)');
    await reviewFigures(page, url, count, PLANT_DEVICES, { csv: per100k(1.5), json: per100k(1.5), verify: per100k(1) }, PLANT);

    // At a desk: the overview, and the wide review's sort over the whole match.
    await page.setViewportSize({ width: 1440, height: 900 });
    await page.goto(`${url}#/settings`);
    await page.locator('header h1').waitFor();
    const overview = await page.evaluate(async () => {
      const t0 = performance.now();
      location.hash = '#/overview';
      await new Promise<void>((done) => {
        const tick = () => (document.querySelector('[data-overview-state="ready"] .overview-table tbody tr') ? done() : requestAnimationFrame(tick));
        tick();
      });
      return performance.now() - t0;
    });
    note(`plant overview, ${VESSELS} vessels (${count} checks; from another screen)`, overview, '(≤ 300 ms, as first rows)');
    await page.goto(`${url}#/review`);
    await page.locator('[data-review-table-state="ready"]').waitFor();
    const sorted = await page.evaluate(async () => {
      const t0 = performance.now();
      // data-sort-by names the order of the rows shown, so this waits for the sorted rows themselves.
      (document.querySelector('.review-table [data-sort-column="outcome"]') as HTMLButtonElement).click();
      await new Promise<void>((done) => {
        const tick = () => (document.querySelector('.review-table[data-sort-by="outcome"][data-review-table-state="ready"] tbody tr') ? done() : requestAnimationFrame(tick));
        tick();
      });
      return performance.now() - t0;
    });
    note(`wide review: sort the whole match by outcome (${count})`, sorted, '(no target)');
    console.log('Summary:', JSON.stringify(rows.map((r) => ({ [r.what]: Math.round(r.ms) }))));
  });
}, 3_600_000);
