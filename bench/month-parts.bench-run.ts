// A save into a vessel's month that already holds 20,000 checks, in headless Chromium: µs per save
// with the month split into parts (schema v5; the save rewrites one part of at most 500 rows),
// beside the read and write-back of the whole month's one value that every such save cost in v4.
// The store's own code, bundled by Vite and run on a page of a local server; the log is generated
// (invented) data. Prints the figures and the load average; asserts nothing about time.
// Run: npx vitest run --config bench/vitest.config.ts bench/month-parts.bench-run.ts
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { expect, it } from 'vitest';
import { build } from 'vite';
import { ROOT, launch, startServer, tempProfile } from '../test/e2e/harness.ts';
import { generatedBackup, fakeUuid } from './generated-log.ts';

const CHECKS = 20_000;
const SAVES = 100;

it('prints µs per save into a month of 20,000 checks, split into parts and as one value', async () => {
  const startMs = Date.UTC(2026, 2, 1);
  // One vessel checked every two minutes: 20,000 checks in 27.8 days of March.
  const backup = await generatedBackup({
    deviceId: '1f2e3d4c-5b6a-4789-8a9b-0c1d2e3f4a5b', vesselPrefix: '5eed0401', vessels: 1, checks: CHECKS,
    startMs, stepMs: 120_000, technicians: ['Gen Eleven'], seed: 51,
  });
  const built = await build({
    configFile: false, logLevel: 'warn', root: ROOT,
    build: { write: false, minify: true, lib: { entry: join(ROOT, 'bench/month-parts-browser-entry.ts'), formats: ['iife'], name: 'monthBench', fileName: 'bench' } },
  });
  const output = (Array.isArray(built) ? built[0]! : built) as { output: { type: string; code?: string }[] };
  const dir = mkdtempSync(join(tmpdir(), 'tankside-month-'));
  writeFileSync(join(dir, 'bench.js'), output.output.find((o) => o.type === 'chunk')!.code!);
  writeFileSync(join(dir, 'index.html'), '<!doctype html><title>month parts bench</title><script src="bench.js"></script>');
  const server = await startServer(dir);
  const profile = tempProfile();
  const ctx = await launch(profile.dir);
  try {
    const page = ctx.pages()[0] ?? (await ctx.newPage());
    await page.goto(server.url);
    const load = loadavg().map((x) => x.toFixed(2)).join(', ');
    type T = { median: number; fastest: number };
    const r = await page.evaluate(
      ([text, vesselId, monthMs, n]) => (globalThis as unknown as { monthBench: { measure(...a: unknown[]): Promise<Record<string, unknown>> } }).monthBench.measure(text, vesselId, monthMs, n),
      [backup, fakeUuid(0x5eed0401, 0), startMs, SAVES] as const,
    ) as { save: T; whole: T; rows: number; parts: number; largestPart: number };
    const row = (label: string, m: T) => `  ${label.padEnd(58)} ${m.median.toFixed(0).padStart(7)} µs   (fastest ${m.fastest.toFixed(0)} µs)`;
    console.log(
      `\nA save into a month of ${CHECKS.toLocaleString('en-GB')} checks in headless Chromium: µs per save, median over runs of 10 (${SAVES} saves)\n` +
        `load average before ${load}, after ${loadavg().map((x) => x.toFixed(2)).join(', ')} (2 cores, shared)\n` +
        `  the month afterwards: ${r.rows.toLocaleString('en-GB')} rows in ${r.parts} parts, the largest ${r.largestPart} rows\n` +
        `${row('save (appendCheck: hash, signature, one block, one part)', r.save)}\n` +
        `${row("v4's extra per save: the month's one value read and written", r.whole)}\n`,
    );
    expect(r.rows).toBe(CHECKS + SAVES + 5);
  } finally {
    await ctx.close();
    await server.close();
    profile.remove();
    rmSync(dir, { recursive: true, force: true });
  }
});
