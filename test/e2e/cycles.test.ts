// Cycles and periodic tests in the browser: a live cycle entered at a 10 s interval with the page's
// clock controlled (playwright's page.clock), kept across a reload as a draft; a recorder CSV with a
// bad row refused by its line number, then fixed; both saved, listed in Review, exported (the
// cycle's readings as CSV, the JSON backup) and printed; the periodic tests saved. Waits only on
// the app's own states (data attributes), never on a fixed time.
//
// The readings are invented demo data on the demo plant's steriliser DEMO-ST-01; their pressures
// are the saturation pressures at the listed temperatures from Debian's python3-iapws (IAPWS97,
// x = 1), rounded to 0.1 kPa, so the chamber reads as saturated steam.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Papa from 'papaparse';
import type { BrowserContext, Page } from 'playwright-core';
import { DIST, launch, pickVessel, screenshot, startServer, tempProfile, waitForControl, type StaticServer } from './harness.ts';

/** Live cycle, 134 °C for 3 min: (°C, kPa gauge) every 10 s; gauge = p_sat(T) − 101.325 kPa (python3-iapws). */
const LIVE: readonly [string, string][] = [
  ['100', '0.1'], ['110', '42.1'], ['120', '97.3'], ['130', '168.9'], ['133', '194.1'],
  ...Array.from({ length: 20 }, (_, i): [string, string] => (i % 2 ? ['135', '211.9'] : ['134.5', '207.3'])),
  ['125', '130.9'],
];

/** Recorder file, 121 °C for 15 min: seconds, °C, kPa absolute (p_sat from python3-iapws). Line 1 is the header. */
const CSV_ROWS = [
  '0,90,70.2', '60,105,120.9', '120,115,169.2', '180,119,192.5', '240,121.2,206.3',
  ...Array.from({ length: 16 }, (_, i) => ['300,121.3,207.0', '360,121.6,208.9', '420,121.9,210.9'][i % 3]!.replace(/^\d+/, String(300 + 60 * i))),
  '1260,118,186.4', '1320,108,134.0',
];
const header = 'elapsed_s,chamber_temp_C,chamber_press_kPa_abs';
/** The same file with line 7 damaged (a letter in the temperature). */
const badCsv = [header, ...CSV_ROWS.map((r, i) => (i === 5 ? r.replace('121.3', '121.x') : r))].join('\n') + '\n';
const goodCsv = [header, ...CSV_ROWS].join('\n') + '\n';

describe('cycle records and periodic tests', () => {
  const files = mkdtempSync(join(tmpdir(), 'tankside-cycles-'));
  const profile = tempProfile();
  let server: StaticServer;
  let ctx: BrowserContext;
  let page: Page;

  beforeAll(async () => {
    writeFileSync(join(files, 'recorder-bad.csv'), badCsv);
    writeFileSync(join(files, 'recorder.csv'), goodCsv);
    server = await startServer(DIST);
    ctx = await launch(profile.dir);
    page = ctx.pages()[0] ?? (await ctx.newPage());
    await page.clock.install({ time: new Date('2026-12-02T07:00:00Z') });
    await page.goto(`${server.url}#/vessels`);
    await waitForControl(page);
    await page.getByRole('button', { name: 'Load demo plant' }).click();
    await page.getByRole('link', { name: /DEMO-ST-01/ }).waitFor();
  });
  afterAll(async () => {
    await ctx.close();
    await server.close();
    profile.remove();
    rmSync(files, { recursive: true, force: true });
  });

  async function openScreen(route: string, draft = true): Promise<void> {
    await page.goto(`${server.url}#/${route}`);
    await page.locator('main[data-app-state="ready"]').waitFor();
    if (draft) await page.locator('[data-draft="loaded"]').waitFor();
  }

  async function save(prefix: string, technician: string): Promise<string> {
    await page.fill(`#${prefix}-tech`, technician);
    await page.getByRole('button', { name: prefix === 'cycle' ? 'Save cycle' : 'Save test' }).click();
    const ended = page.locator('[data-save-state="saved"], [data-save-state="failed"]');
    await ended.waitFor();
    expect(await ended.getAttribute('data-save-state'), await ended.textContent() ?? '').toBe('saved');
    return (await ended.getAttribute('data-saved-id')) ?? '';
  }

  async function download(button: string, name: string): Promise<string> {
    const [dl] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: button }).first().click()]);
    const path = join(files, name);
    await dl.saveAs(path);
    return path;
  }

  it('a live cycle at a 10 s interval: prompted as each reading falls due, kept across a reload, judged and saved', async () => {
    await openScreen('cycles');
    await pickVessel(page, '#cycle-vessel', 'DEMO-ST-01');
    await page.fill('#ct-temperature', '134');
    await page.fill('#ct-hold', '3');
    await page.fill('#live-interval', '10');
    await page.getByRole('button', { name: 'Start cycle' }).click();
    const panel = page.locator('.live-cycle');
    for (let i = 0; i < LIVE.length; i += 1) {
      await page.clock.runFor(10_000);
      await page.locator('.live-cycle[data-live-state="due"]').waitFor();
      await page.fill('#live-temperature', LIVE[i]![0]);
      await page.fill('#live-pressure', LIVE[i]![1]);
      await page.getByRole('button', { name: 'Add reading' }).click();
      await page.locator(`.live-cycle[data-live-readings="${i + 1}"][data-live-state="running"]`).waitFor();
      if (i === 6) {
        // A reload mid-cycle: the draft brings the running cycle back with its readings.
        await page.locator('html[data-draft-state="saved"]').waitFor().catch(() => undefined);
        await page.reload();
        await page.locator('main[data-app-state="ready"]').waitFor();
        await page.locator(`.live-cycle[data-live-readings="${i + 1}"]`).waitFor();
        expect(await page.inputValue('#ct-temperature')).toBe('134');
      }
    }
    await page.getByRole('button', { name: 'Finish cycle' }).click();
    await expect.poll(() => panel.getAttribute('data-live-state')).toBe('finished');
    const result = page.locator('.cycle-result');
    await result.waitFor();
    expect(await result.getAttribute('data-hold')).toBe('met');
    expect(await page.locator('.cycle-chart').getAttribute('data-cycle-chart')).toBe(String(LIVE.length));
    expect(await page.locator('.standing-note[data-rule="cycle-standing-note"]').count()).toBe(1);
    await screenshot(page, 'cycle-live');
    console.log('live cycle as shown:', await page.locator('.cycle-outcome').textContent(), '|', await page.locator('[data-f-value]').textContent());
    const id = await save('cycle', 'Demo Technician');
    expect(id).toMatch(/^[0-9a-f-]{36}$/);
  });

  it('a recorder CSV: a bad row is refused by its line number and nothing is taken; the fixed file is judged and saved', async () => {
    await openScreen('cycles');
    await pickVessel(page, '#cycle-vessel', 'DEMO-ST-01');
    await page.fill('#ct-temperature', '121');
    await page.fill('#ct-hold', '15');
    await page.getByText('absolute', { exact: true }).click();
    await page.getByText('from a recorder file').click();
    await page.setInputFiles('#cycle-file', join(files, 'recorder-bad.csv'));
    const refused = page.locator('[data-file-state="refused"]');
    await refused.waitFor();
    expect(await refused.textContent()).toContain('line 7: temperature');
    expect(await page.locator('.cycle-result').count()).toBe(0);
    await page.setInputFiles('#cycle-file', join(files, 'recorder.csv'));
    await page.locator('[data-file-state="read"]').waitFor();
    expect(await page.getAttribute('[data-file-readings]', 'data-file-readings')).toBe(String(CSV_ROWS.length));
    const result = page.locator('.cycle-result');
    await result.waitFor();
    expect(await result.getAttribute('data-hold')).toBe('met');
    await screenshot(page, 'cycle-file');
    await save('cycle', 'Demo Technician');
  });

  it('the periodic tests: each judged against its limit and saved', async () => {
    await openScreen('steam-tests');
    await pickVessel(page, '#test-vessel', 'DEMO-ST-01');
    const outcomes: Record<string, string> = {};
    const run = async (test: string, fill: Record<string, string>) => {
      await page.selectOption('#test-kind', test);
      for (const [id, v] of Object.entries(fill)) {
        if (v.startsWith('choice:')) await page.locator(`input[name="st-${id}"][value="${v.slice(7)}"]`).check();
        else await page.fill(`#st-${id}`, v);
      }
      const shown = page.locator(`[data-test="${test}"][data-test-outcome]`);
      await shown.waitFor();
      outcomes[test] = `${(await shown.getAttribute('data-test-outcome')) ?? ''}: ${(await shown.locator('p').first().textContent()) ?? ''}`;
      await save('test', 'Demo Technician');
      await page.locator('[data-save-state="saved"]').waitFor();
    };
    // Invented demo readings. Line 300 kPa abs throttled to 101.325 kPa at 110 °C.
    await run('throttling-dryness', { line: '300', calP: '101.325', calT: '110' });
    await run('expansion-superheat', { temp: '112', down: '101.325' });
    await run('noncondensable-gas', { gas: '2.1', cond: '100' });
    await run('vacuum-leak', { readings: '0 5.0\n5 5.4\n10 5.9' });
    await run('air-removal', { result: 'choice:pass', batch: 'DEMO-LOT-7' });
    await run('dryness-value', { supply: '300', empty: '500', before: '1150', after: '1190', tBefore: '20', tAfter: '56', heat: '400' });
    expect(Object.keys(outcomes)).toHaveLength(6);
    console.log('periodic tests as shown:', JSON.stringify(outcomes, null, 1));
  });

  it('Review lists them beside the checks, exports the readings and the backup, and prints the report with the charts', async () => {
    await openScreen('review', false);
    await page.locator('[data-review-state="ready"]').waitFor().catch(() => undefined);
    const list = page.locator('.kind-records[data-kind-records="8"]');
    await list.first().waitFor();
    await page.selectOption('#rk-kind', 'cycle');
    await page.locator('.kind-records[data-kind-records="2"]').first().waitFor();
    const csv = Papa.parse<Record<string, unknown>>(readFileSync(await download('Readings as CSV', 'cycle.csv'), 'utf8').replace(/^\uFEFF/, ''), { header: true, dynamicTyping: true, skipEmptyLines: true });
    expect(csv.errors).toEqual([]);
    expect(csv.data).toHaveLength(CSV_ROWS.length);
    expect(csv.data[4]!['temperature (K)']).toBeCloseTo(394.35, 6);
    const backup = JSON.parse(readFileSync(await download('Download JSON backup', 'backup.json'), 'utf8')) as { checks: { kind?: string }[] };
    expect(backup.checks.filter((c) => c.kind === 'cycle')).toHaveLength(2);
    expect(backup.checks.filter((c) => c.kind === 'periodic-test')).toHaveLength(6);

    await pickVessel(page, '#rf-vessel', 'DEMO-ST-01');
    await page.getByRole('button', { name: 'Trend and report for DEMO-ST-01' }).click();
    const report = page.locator('.print-report .kind-records[data-kind-records="8"]');
    await report.waitFor();
    expect(await report.locator('.cycle-chart').count()).toBe(2);
    await page.emulateMedia({ media: 'print' });
    expect(await page.locator('.print-report .cycle-chart').first().isVisible()).toBe(true);
    await screenshot(page, 'cycle-report-print');
    await page.emulateMedia({ media: 'screen' });
  });
});
