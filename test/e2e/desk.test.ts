// The supervisor's desk (issue 14) in Chromium at a desk (1440×900) and on a phone (390×844): the
// plant overview of a generated plant of invented demo vessels (labelled DEMO DATA) with 10,000
// checks, its latest outcomes and due states against the clock the test sets (page.clock); the wide
// review's sort by outcome and by the key figures over the whole match; the keyboard in the table;
// the phone list's order picker over the whole match. Waits only on the app's
// own states (data-overview-state, data-review-table-state, the import's result).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { DIST, PHONE, launch, screenshot, startServer, tempProfile, verifyChainsOnScreen, type StaticServer } from './harness.ts';
import { backupText, generatedChecks, generatedVessels } from '../../bench/generated-log.ts';
import { checkDue, type CheckDueState } from '../../src/core/check/check-due.ts';
import { keyFiguresOf, outcomeOfRecord } from '../../src/store/facts.ts';
import { csvFromChecks } from '../../src/store/csv-rows.ts';
import { canonicalJson } from '../../src/store/integrity.ts';
import type { CheckRecord, VesselRecord } from '../../src/store/index.ts';

const HOUR_S = 3_600;
const DAY_S = 86_400;
const STEP_MS = 30 * 60_000;
const CHECKS = 10_000;
/** The last check of the log (vessel 3's); vessel i's last is ((3 − i) mod 12) half-hours before it. */
const LAST_MS = Date.parse('2026-12-04T06:00:00Z');
/** The clock the page runs on. */
const NOW = new Date('2026-12-04T12:00:00Z');
const KINDS = ['SV', 'FT', 'CR', 'JV', 'AC', 'FT', 'SV', 'CR', 'JV', 'AC', 'SV', 'FT', 'CR'];
// Chosen so the plant holds every state: none set, overdue, due today, in date, never checked.
const INTERVALS: (number | null)[] = [null, HOUR_S, 8 * HOUR_S, 7 * DAY_S, 12 * HOUR_S, 4 * HOUR_S, DAY_S, null, 14 * DAY_S, 6 * HOUR_S, null, 30 * DAY_S, DAY_S];

/** The invented demo plant: 13 vessels, the first 12 checked in turn, the last never. */
function demoPlant(): VesselRecord[] {
  return generatedVessels(0x5eed0014, 13, LAST_MS - CHECKS * STEP_MS).map((v, i) => {
    const tag = `DEMO-${KINDS[i]}-${String(i + 1).padStart(2, '0')}`;
    const description = 'DEMO DATA: invented plant for the supervisor\'s overview';
    const interval = INTERVALS[i];
    return { ...v, tag, tagKey: tag.toLowerCase(), description, spec: { ...v.spec, tag, description }, ...(interval === null ? {} : { checkIntervalS: interval }) };
  });
}

const SEVERITY = ['DANGER', 'WARNING', 'CAUTION', 'NOTICE', 'none'];
const newest = (a: CheckRecord, b: CheckRecord) => b.timeMs - a.timeMs || (a.id < b.id ? 1 : -1);

describe("the supervisor's desk", () => {
  const files = mkdtempSync(join(tmpdir(), 'tankside-desk-'));
  const profile = tempProfile();
  let server: StaticServer;
  let vessels: VesselRecord[] = [];
  let checks: CheckRecord[] = [];
  const expected = new Map<string, { outcome: string; due: CheckDueState }>();

  beforeAll(async () => {
    server = await startServer(DIST);
    vessels = demoPlant();
    checks = await generatedChecks({
      deviceId: 'a1b2c3d4-0000-4000-8000-000000000014', vesselPrefix: '5eed0014', vessels: 12, checks: CHECKS,
      startMs: LAST_MS - (CHECKS - 1) * STEP_MS, stepMs: STEP_MS, technicians: ['Demo Tech One', 'Demo Tech Two', 'Demo Tech Three'], seed: 14,
    }, vessels.slice(0, 12));
    writeFileSync(join(files, 'plant.json'), backupText(vessels, checks, '2026-12-04T07:00:00+01:00'));
    // What the overview should say, from the records themselves and the core's rule.
    const dayEnd = new Date(NOW.getFullYear(), NOW.getMonth(), NOW.getDate() + 1).getTime();
    for (const v of vessels) {
      const mine = checks.filter((c) => c.vesselId === v.id).sort(newest);
      const last = mine[0];
      expected.set(v.tag, {
        outcome: last ? outcomeOfRecord(last) : 'not-checked',
        due: checkDue(last?.timeMs ?? null, v.checkIntervalS ?? null, NOW.getTime(), dayEnd).state,
      });
    }
    const states = new Set([...expected.values()].map((e) => e.due));
    for (const s of ['no-interval', 'overdue', 'due-today', 'in-date', 'never-checked'] as const) expect(states, s).toContain(s);
  });
  afterAll(async () => {
    await server.close();
    profile.remove();
    rmSync(files, { recursive: true, force: true });
  });

  /** The checks in the order of key figure `at` (keyFiguresOf: temperature, absolute pressure, quality, liquid mass), those without it last, ties newest first. */
  function byFigure(at: 0 | 1 | 2 | 3, descending: boolean): CheckRecord[] {
    return [...checks].sort((a, b) => {
      const x = keyFiguresOf(a)[at];
      const y = keyFiguresOf(b)[at];
      if (x === null || y === null) return (x === null ? 1 : 0) - (y === null ? 1 : 0) || newest(a, b);
      return (descending ? y - x : x - y) || newest(a, b);
    });
  }

  async function overviewRows(page: Page): Promise<Map<string, { outcome: string; due: string; group: string }>> {
    await page.locator('[data-overview-state="ready"]').waitFor();
    const rows = await page.locator('.overview-table').evaluateAll((tables) => tables.flatMap((t) => {
      const group = t.querySelector('caption')?.textContent ?? '';
      return [...t.querySelectorAll('tbody tr')].map((tr) => ({
        tag: tr.getAttribute('data-vessel-tag') ?? '', outcome: tr.getAttribute('data-outcome') ?? '', due: tr.getAttribute('data-due-state') ?? '', group,
      }));
    }));
    return new Map(rows.map((r) => [r.tag, r]));
  }

  it('at 1440×900 opens on the overview: every vessel with its latest outcome and due state, overdue in its own group', async () => {
    const ctx = await launch(profile.dir);
    try {
      const page = ctx.pages()[0] ?? (await ctx.newPage());
      await page.clock.setFixedTime(NOW);
      await page.setViewportSize({ width: 1440, height: 900 });
      await page.goto(`${server.url}#/review`);
      await page.locator('[data-review-table-state="ready"]').waitFor();
      await page.setInputFiles('#rt-file', join(files, 'plant.json'));
      await page.getByRole('button', { name: 'Import and merge' }).click();
      const result = page.locator('[data-import-run="1"] [data-import-result]');
      await result.waitFor({ timeout: 120_000 });
      expect(await result.getAttribute('data-import-result'), await result.textContent() ?? '').toBe('done');

      // No route on a wide display: the overview is the first screen.
      await page.goto(server.url);
      const rows = await overviewRows(page);
      expect(rows.size).toBe(vessels.length);
      for (const [tag, want] of expected) {
        const got = rows.get(tag);
        expect(got, tag).toBeDefined();
        expect({ tag, outcome: got!.outcome, due: got!.due }).toEqual({ tag, outcome: want.outcome, due: want.due });
        expect(got!.group.startsWith('Overdue'), tag).toBe(want.due === 'overdue' || want.due === 'never-checked');
      }
      expect(await page.getByRole('heading', { level: 1 }).textContent()).toBe('Plant overview');
      await screenshot(page, 'desk-overview-1440');

      // Sorted by the outcome heading: most severe first within each group.
      await page.locator('.overview-table').last().locator('[data-sort-column="outcome"]').click();
      const order = await page.locator('.overview-table').last().locator('tbody tr').evaluateAll((trs) => trs.map((tr) => tr.getAttribute('data-outcome') ?? ''));
      const rank = (o: string) => (o === 'not-checked' ? 5 : SEVERITY.indexOf(o));
      const ranks = order.map(rank);
      // The first click on the already-sorted column turns the order round: least severe first.
      expect(ranks).toEqual([...ranks].sort((a, b) => b - a));
    } finally {
      await ctx.close();
    }
  });

  it('at 1440×900 the review sorts the whole 10,000-check match by outcome; arrow keys and Enter open a record beside the table', async () => {
    const ctx = await launch(profile.dir);
    try {
      const page = ctx.pages()[0] ?? (await ctx.newPage());
      await page.clock.setFixedTime(NOW);
      await page.setViewportSize({ width: 1440, height: 900 });
      await page.goto(`${server.url}#/review`);
      const table = page.locator('.review-table');
      await page.locator('[data-review-table-state="ready"]').waitFor();
      await table.locator('[data-sort-column="outcome"]').click();
      await page.locator('.review-table[data-sort-by="outcome"][data-review-table-state="ready"]').waitFor();
      const sorted = [...checks].sort((a, b) => SEVERITY.indexOf(outcomeOfRecord(a)) - SEVERITY.indexOf(outcomeOfRecord(b)) || newest(a, b));
      const shownIds = () => table.locator('tbody tr').evaluateAll((trs) => trs.map((tr) => tr.getAttribute('data-check-id') ?? ''));
      expect(await shownIds()).toEqual(sorted.slice(0, 50).map((c) => c.id));
      await expect.poll(() => page.locator('.review-table-panel').textContent()).toContain('of 10,000');

      // Again: least severe first, over the whole match too.
      await table.locator('[data-sort-column="outcome"]').click();
      await page.locator('.review-table[data-sort-by="outcome"][data-sort-dir="descending"][data-review-table-state="ready"]').waitFor();
      const reversed = [...checks].sort((a, b) => SEVERITY.indexOf(outcomeOfRecord(b)) - SEVERITY.indexOf(outcomeOfRecord(a)) || newest(a, b));
      expect(await shownIds()).toEqual(reversed.slice(0, 50).map((c) => c.id));

      // Keyboard: focus the first row, down twice, Enter: the third row's record opens beside the table.
      await table.locator('tbody tr').first().focus();
      await page.keyboard.press('ArrowDown');
      await page.keyboard.press('ArrowDown');
      await page.keyboard.press('Enter');
      await page.locator(`[data-open-record="${reversed[2]!.id}"]`).waitFor();
      await expect.poll(() => page.locator('.review-record').textContent()).toContain(reversed[2]!.vessel.tag);
      await screenshot(page, 'desk-review-1440');
    } finally {
      await ctx.close();
    }
  });

  it('at 1440×900 the key figures sort the whole match too (schema v10 month rows): temperature up, pressure down, checks without a figure last', async () => {
    const ctx = await launch(profile.dir);
    try {
      const page = ctx.pages()[0] ?? (await ctx.newPage());
      await page.clock.setFixedTime(NOW);
      await page.setViewportSize({ width: 1440, height: 900 });
      await page.goto(`${server.url}#/review`);
      const table = page.locator('.review-table');
      await page.locator('[data-review-table-state="ready"]').waitFor();
      const shownIds = () => table.locator('tbody tr').evaluateAll((trs) => trs.map((tr) => tr.getAttribute('data-check-id') ?? ''));
      await table.locator('[data-sort-column="temperature"]').click();
      await page.locator('.review-table[data-sort-by="temperature"][data-sort-dir="ascending"][data-review-table-state="ready"]').waitFor();
      expect(await shownIds()).toEqual(byFigure(0, false).slice(0, 50).map((c) => c.id));
      await table.locator('[data-sort-column="pressure"]').click();
      await page.locator('.review-table[data-sort-by="pressure"][data-sort-dir="ascending"][data-review-table-state="ready"]').waitFor();
      await table.locator('[data-sort-column="pressure"]').click();
      await page.locator('.review-table[data-sort-by="pressure"][data-sort-dir="descending"][data-review-table-state="ready"]').waitFor();
      expect(await shownIds()).toEqual(byFigure(1, true).slice(0, 50).map((c) => c.id));
    } finally {
      await ctx.close();
    }
  });

  it('at 1440×900 a review note clears a flag, and the note verifies in this device\'s chain', async () => {
    const ctx = await launch(profile.dir);
    try {
      const page = ctx.pages()[0] ?? (await ctx.newPage());
      await page.clock.setFixedTime(NOW);
      await page.setViewportSize({ width: 1440, height: 900 });
      await page.goto(`${server.url}#/overview`);
      await page.locator('[data-overview-state="ready"]').waitFor();
      const flagged = page.locator('tr[data-flagged="true"]');
      const before = await flagged.count();
      const tag = (await flagged.first().getAttribute('data-vessel-tag'))!;
      expect(before, 'the generated plant has flagged vessels').toBeGreaterThan(0);
      expect(expected.get(tag)!.outcome).not.toBe('none');
      await page.locator(`tr[data-vessel-tag="${tag}"]`).getByRole('button', { name: /Review note/ }).click();
      // Bad input is named, nothing is saved.
      await page.getByRole('button', { name: 'Save review note' }).click();
      await expect.poll(() => page.locator('.review-note-form').textContent()).toContain('Supervisor: give your name, 1 to 100 characters.');
      await page.fill('#note-supervisor', 'Demo Supervisor');
      await page.fill('#note-decision', 'Demo data: gauge to be compared with the reference gauge; vessel stays in service meanwhile.');
      await page.getByRole('button', { name: 'Save review note' }).click();
      await page.locator(`[data-overview-generation="1"][data-overview-state="ready"] tr[data-vessel-tag="${tag}"][data-flagged="false"]`).waitFor();
      expect(await page.locator('tr[data-flagged="true"]').count()).toBe(before - 1);
      expect(await page.locator(`tr[data-vessel-tag="${tag}"]`).textContent()).toContain('cleared by a review note');

      // The note is a record in this device's chain: the chain verifies, signed.
      await page.goto(`${server.url}#/review`);
      await page.locator('[data-review-table-state="ready"]').waitFor();
      const { state, lines } = await verifyChainsOnScreen(page);
      expect(state).toBe('done');
      expect(lines.map((l) => l.chain)).toEqual(['ok', 'ok']);
      expect(lines.some((l) => l.text.includes('1 records, seq 1 to 1') && l.text.includes('signed by device'))).toBe(true);
      // After a reload the flag stays cleared (read from the stored note).
      await page.goto(`${server.url}#/overview`);
      await page.locator(`[data-overview-state="ready"] tr[data-vessel-tag="${tag}"][data-flagged="false"]`).waitFor();
    } finally {
      await ctx.close();
    }
  });

  it('at 1440×900 verification on the workers finds one changed stored record, at its seq, and finds the chain whole again once it is put back', async () => {
    const ctx = await launch(profile.dir);
    try {
      const page = ctx.pages()[0] ?? (await ctx.newPage());
      await page.setViewportSize({ width: 1440, height: 900 });
      await page.goto(`${server.url}#/review`);
      await page.locator('[data-review-table-state="ready"]').waitFor();
      // Changed behind the app's back, in IndexedDB itself: one letter of seq 4,321's technician.
      const edit = (restore: boolean) => page.evaluate(async ([deviceId, put]) => {
        const db = await new Promise<IDBDatabase>((ok, fail) => {
          const r = indexedDB.open('tankside');
          r.onsuccess = () => ok(r.result);
          r.onerror = () => fail(r.error);
        });
        const tx = db.transaction('logBlocks', 'readwrite');
        const store = tx.objectStore('logBlocks');
        const cursor = await new Promise<IDBCursorWithValue | null>((ok) => {
          const r = store.openCursor(IDBKeyRange.bound([deviceId, -Infinity], [deviceId, 4321]), 'prev');
          r.onsuccess = () => ok(r.result);
        });
        const block = cursor!.value as { seqs: number[]; texts: string[] };
        const at = block.seqs.indexOf(4321);
        block.texts[at] = put ? block.texts[at]!.replace('"technician":"Demo Tech ', '"technician":"Demo tech ') : block.texts[at]!.replace('"technician":"Demo tech ', '"technician":"Demo Tech ');
        cursor!.update(block);
        await new Promise((ok) => { tx.oncomplete = ok; });
        db.close();
        return at;
      }, ['a1b2c3d4-0000-4000-8000-000000000014', !restore] as const);
      expect(await edit(false)).toBeGreaterThanOrEqual(0);
      const changed = await verifyChainsOnScreen(page);
      expect(changed.state).toBe('done');
      const line = changed.lines.find((l) => l.chain !== 'ok');
      expect(line?.text).toContain('seq 4321');
      expect(changed.lines.filter((l) => l.chain === 'ok')).toHaveLength(1);
      await edit(true);
      const whole = await verifyChainsOnScreen(page);
      expect(whole.lines.map((l) => l.chain)).toEqual(['ok', 'ok']);
    } finally {
      await ctx.close();
    }
  });

  it('at 1440×900 the whole log\'s CSV, written on the workers, is byte for byte the CSV of the 10,000 checks', async () => {
    const ctx = await launch(profile.dir);
    try {
      const page = ctx.pages()[0] ?? (await ctx.newPage());
      await page.setViewportSize({ width: 1440, height: 900 });
      await page.goto(`${server.url}#/review`);
      await page.locator('[data-review-table-state="ready"]').waitFor();
      const [dl] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download CSV' }).click()]);
      const path = join(files, 'log.csv');
      await dl.saveAs(path);
      const oldest = [...checks].sort((a, b) => a.timeMs - b.timeMs || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
      // As stored: each record's canonical JSON (keys sorted, so "inputs as typed" lists pressure first).
      expect(readFileSync(path, 'utf8')).toBe(csvFromChecks(oldest.map((c) => JSON.parse(canonicalJson(c)) as CheckRecord)));
    } finally {
      await ctx.close();
    }
  });

  it('at 390×844 the overview is one tap from More and lists the same; the review keeps its phone list', async () => {
    const ctx = await launch(profile.dir);
    try {
      const page = ctx.pages()[0] ?? (await ctx.newPage());
      await page.clock.setFixedTime(NOW);
      await page.setViewportSize(PHONE);
      await page.goto(`${server.url}#/more`);
      await page.getByRole('link', { name: /Plant overview/ }).click();
      const rows = await overviewRows(page);
      expect(rows.size).toBe(vessels.length);
      for (const [tag, want] of expected) expect({ tag, outcome: rows.get(tag)?.outcome, due: rows.get(tag)?.due }).toEqual({ tag, outcome: want.outcome, due: want.due });
      await screenshot(page, 'desk-overview-390');
      await page.goto(`${server.url}#/review`);
      await page.locator('[data-review-state="ready"]').waitFor();
      expect(await page.locator('.review-table').count()).toBe(0);
      expect(await page.locator('.review-row').count()).toBeGreaterThan(0);

      // The phone's order picker sorts the whole 10,000-check match, not only the rows read.
      const shownIds = () => page.locator('.review-row').evaluateAll((as) => as.map((a) => a.getAttribute('data-check-id') ?? ''));
      await page.selectOption('#rl-order', 'severity');
      await page.locator('.review-rows[data-sort-by="outcome"][data-sort-dir="ascending"]').waitFor();
      await page.locator('[data-review-state="ready"]').waitFor();
      const bySeverity = [...checks].sort((a, b) => SEVERITY.indexOf(outcomeOfRecord(a)) - SEVERITY.indexOf(outcomeOfRecord(b)) || newest(a, b));
      expect(await shownIds()).toEqual(bySeverity.slice(0, 50).map((c) => c.id));
      await page.selectOption('#rl-order', 'liquid');
      await page.locator('.review-rows[data-sort-by="liquid"][data-sort-dir="ascending"]').waitFor();
      await page.locator('[data-review-state="ready"]').waitFor();
      expect(await shownIds()).toEqual(byFigure(3, false).slice(0, 50).map((c) => c.id));
      await screenshot(page, 'desk-review-sorted-390');
    } finally {
      await ctx.close();
    }
  });
});
