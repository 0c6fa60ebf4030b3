// The Review screen judges checks by their outcome (the worst signal word among their findings),
// not by every caution: a generated log whose results are the check engine's own, a mix of checks
// that agree (outcome none, though each carries standing hazards up to DANGER) and checks that do
// not, imported into a fresh profile; the totals' counts must separate them. Waits only on the
// app's completion states (the import result, the totals' data-complete). Generated test data
// (bench/generated-log.ts), not demo data.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Papa from 'papaparse';
import { DIST, launch, pickVessel, startServer, tempProfile, type StaticServer } from './harness.ts';
import { evaluatedBackup } from '../../bench/generated-log.ts';
import type { CheckRecord } from '../../src/store/index.ts';

const LOG = {
  deviceId: 'a1b2c3d4-0000-4000-8000-000000000001', vesselPrefix: '5eed0009', vessels: 3, checks: 36,
  startMs: Date.parse('2026-11-02T06:00:00Z'), stepMs: 6 * 3_600_000, technicians: ['Gen Four', 'Gen Five'], seed: 21,
};

describe('Review totals by outcome', () => {
  const files = mkdtempSync(join(tmpdir(), 'tankside-outcomes-'));
  const profile = tempProfile();
  let server: StaticServer;
  let checks: CheckRecord[] = [];
  beforeAll(async () => {
    server = await startServer(DIST);
    const backup = await evaluatedBackup(LOG);
    checks = backup.checks;
    writeFileSync(join(files, 'evaluated.json'), backup.text);
  });
  afterAll(async () => {
    await server.close();
    profile.remove();
    rmSync(files, { recursive: true, force: true });
  });

  it('counts agreeing and disagreeing checks apart, filters by outcome, lists standing hazards once, and exports the outcome', async () => {
    // What the engine said of each check, counted here from the results themselves.
    const want = { DANGER: 0, WARNING: 0, CAUTION: 0, NOTICE: 0, none: 0 };
    for (const c of checks) want[(c.result as { outcome: keyof typeof want }).outcome] += 1;
    expect(want.none).toBeGreaterThan(0);
    expect(want.WARNING + want.CAUTION).toBeGreaterThan(0);
    // Every check carries standing hazards (flash on release, the gauge above zero): by every caution's word they would all look alike.
    for (const c of checks) expect(c.cautions.some((x) => x.signal === 'DANGER' || x.signal === 'WARNING')).toBe(true);

    const ctx = await launch(profile.dir);
    try {
      const page = ctx.pages()[0] ?? (await ctx.newPage());
      await page.goto(`${server.url}#/review`);
      await page.locator('[data-review-state="ready"]').waitFor();
      await page.setInputFiles('#rt-file', join(files, 'evaluated.json'));
      await page.getByRole('button', { name: 'Import and merge' }).click();
      const result = page.locator('[data-import-run="1"] [data-import-result]');
      await result.waitFor();
      expect(await result.getAttribute('data-import-result'), await result.textContent() ?? '').toBe('done');

      // The totals of the whole log, once counting has finished.
      const complete = page.locator('.review-totals[data-complete="yes"]');
      await complete.locator('[data-total="checks"]', { hasText: /^36$/ }).waitFor();
      for (const [outcome, n] of Object.entries(want)) expect(await complete.locator(`[data-total="outcome-${outcome}"]`).textContent(), outcome).toBe(String(n));

      // Filtered by outcome, the totals and the rows agree with the engine's.
      await page.selectOption('#rf-outcome', 'none');
      await complete.locator('[data-total="checks"]', { hasText: new RegExp(`^${want.none}$`) }).waitFor();
      expect(await complete.locator('[data-total="outcome-WARNING"]').textContent()).toBe('0');
      await page.locator('[data-review-state="ready"]').waitFor();
      expect(await page.locator('.review-row .signal').count()).toBe(0);
      await page.selectOption('#rf-outcome', 'WARNING');
      await complete.locator('[data-total="checks"]', { hasText: new RegExp(`^${want.WARNING}$`) }).waitFor();
      await page.selectOption('#rf-outcome', '');
      await complete.locator('[data-total="checks"]', { hasText: /^36$/ }).waitFor();

      // The report of one vessel lists its standing hazards once, apart from the outcomes.
      await pickVessel(page, '#rf-vessel', 'GEN-0001');
      await page.getByRole('button', { name: 'Trend and report for GEN-0001' }).click();
      await page.locator('.trend-chart').waitFor();
      const standing = page.getByRole('list', { name: 'Standing hazards of GEN-0001' });
      const rules = await standing.locator('li').allTextContents();
      expect(rules.length).toBeGreaterThan(0);
      expect(rules.filter((t) => t.includes('flashes'))).toHaveLength(1);

      await page.selectOption('#rf-vessel', '');
      await complete.locator('[data-total="checks"]', { hasText: /^36$/ }).waitFor();
      // The CSV keeps its columns and adds the outcome.
      const [dl] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download CSV' }).click()]);
      const csv = Papa.parse<Record<string, string>>(readFileSync((await dl.path())!, 'utf8'), { header: true, skipEmptyLines: true });
      expect(csv.errors).toEqual([]);
      const byId = new Map(checks.map((c) => [c.id, (c.result as { outcome: string }).outcome]));
      expect(csv.data).toHaveLength(36);
      for (const row of csv.data) expect(row['outcome (worst signal word among the findings; none when none)']).toBe(byId.get(row['check id']!));
      expect(csv.meta.fields?.[0]).toBe('time (ISO 8601)');
    } finally {
      await ctx.close();
    }
  });
});
