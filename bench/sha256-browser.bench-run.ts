// SHA-256 of record-sized text in headless Chromium: µs per call for the store's sha256OfText
// (src/store/sha256.ts) next to @noble/hashes' sha256, both bundled by Vite into one script and run
// on a blank page, over the same 1,100-character texts as the Node benchmark (sha256.bench-run.ts).
// Medians of repeated timed runs after a warm-up. Prints a table and the load average (a shared
// 2-core machine); asserts only that the two give the same digests as Node's crypto.
// Run: npx vitest run --config bench/vitest.config.ts bench/sha256-browser.bench-run.ts
import { createHash } from 'node:crypto';
import { loadavg } from 'node:os';
import { join } from 'node:path';
import { expect, it } from 'vitest';
import { build } from 'vite';
import { ROOT, launch, tempProfile } from '../test/e2e/harness.ts';
import { LENGTH, recordText } from './sha256-candidates.ts';

const N = 256;
const RUNS = 25;

interface Timing { median: number; fastest: number }

it('prints µs per call for sha256OfText and @noble/hashes in Chromium (the two agree)', async () => {
  const built = await build({
    configFile: false,
    logLevel: 'warn',
    root: ROOT,
    build: {
      write: false,
      minify: true,
      lib: { entry: join(ROOT, 'bench/sha256-browser-entry.ts'), formats: ['iife'], name: 'sha256Bench', fileName: 'bench' },
    },
  });
  const output = (Array.isArray(built) ? built[0]! : built) as { output: { type: string; code?: string }[] };
  const script = output.output.find((o) => o.type === 'chunk')!.code!;
  const profile = tempProfile();
  const ctx = await launch(profile.dir);
  try {
    const page = ctx.pages()[0] ?? (await ctx.newPage());
    await page.goto('about:blank');
    await page.evaluate(script);
    const lines: string[] = [];
    const load = loadavg().map((x) => x.toFixed(2)).join(', ');
    for (const nonAscii of [false, true]) {
      const texts = Array.from({ length: N }, (_, i) => recordText(i, nonAscii));
      const expected = texts.map((t) => createHash('sha256').update(t).digest('hex'));
      const result = await page.evaluate(([t, runs]) => {
        const b = (globalThis as unknown as { sha256Bench: { ours(s: string): string; noble(s: string): string } }).sha256Bench;
        const time = (call: (s: string) => string) => {
          let sink = 0;
          for (const end = performance.now() + 300; performance.now() < end; ) for (const s of t) sink += call(s).length;
          const w0 = performance.now();
          for (const s of t) sink += call(s).length;
          const reps = Math.max(1, Math.round(8 / Math.max(0.01, performance.now() - w0)));
          const per: number[] = [];
          for (let r = 0; r < runs; r += 1) {
            const t0 = performance.now();
            for (let k = 0; k < reps; k += 1) for (const s of t) sink += call(s).length;
            per.push(((performance.now() - t0) * 1000) / (reps * t.length));
          }
          per.sort((x, y) => x - y);
          return { median: per[per.length >> 1]!, fastest: per[0]!, sink };
        };
        // Alternated, so neither gets the quieter moments of a shared machine.
        const ours = time(b.ours);
        const noble = time(b.noble);
        return { ours, noble, digests: { ours: t.map(b.ours), noble: t.map(b.noble) } };
      }, [texts, RUNS] as const);
      expect(result.digests.ours).toEqual(expected);
      expect(result.digests.noble).toEqual(expected);
      const row = (label: string, m: Timing) => `  ${label.padEnd(48)} ${m.median.toFixed(2).padStart(7)} µs   (fastest run ${m.fastest.toFixed(2)} µs)`;
      lines.push(
        `${nonAscii ? 'with −, °, é' : 'ASCII'}, ${LENGTH} units:`,
        row('sha256OfText', result.ours),
        row('@noble/hashes sha256 (TextEncoder, bytesToHex)', result.noble),
        `  ${'noble ÷ ours'.padEnd(48)} ${(result.noble.median / result.ours.median).toFixed(2).padStart(7)}×`,
      );
    }
    const version = await page.evaluate(() => navigator.userAgent.match(/Chrome\/[\d.]+/)?.[0] ?? navigator.userAgent);
    console.log(
      `\nSHA-256 in headless Chromium (${version}), µs per call: median of ${RUNS} runs over ${N} texts\n` +
        `load average before ${load}, after ${loadavg().map((x) => x.toFixed(2)).join(', ')} (2 cores, shared)\n${lines.join('\n')}\n`,
    );
  } finally {
    await ctx.close();
    profile.remove();
  }
});
