// The cost of signing each save in headless Chromium: µs for one ECDSA P-256 chain-head signature
// with the device key (awaited on its own, as a save awaits it), for verifying one, and for a whole
// save (appendCheck: validation, hash, signature, the strict write) that includes it. The store's
// own code, bundled by Vite and run on a page of a local server. Prints the figures and the load
// average (a shared 2-core machine); asserts nothing about time.
// Run: npx vitest run --config bench/vitest.config.ts bench/signing.bench-run.ts
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { expect, it } from 'vitest';
import { build } from 'vite';
import { ROOT, launch, startServer, tempProfile } from '../test/e2e/harness.ts';

const N = 300;

it('prints µs per chain-head signature, per verification and per save in Chromium', async () => {
  const built = await build({
    configFile: false,
    logLevel: 'warn',
    root: ROOT,
    build: { write: false, minify: true, lib: { entry: join(ROOT, 'bench/signing-browser-entry.ts'), formats: ['iife'], name: 'signingBench', fileName: 'bench' } },
  });
  const output = (Array.isArray(built) ? built[0]! : built) as { output: { type: string; code?: string }[] };
  const dir = mkdtempSync(join(tmpdir(), 'tankside-signing-'));
  writeFileSync(join(dir, 'bench.js'), output.output.find((o) => o.type === 'chunk')!.code!);
  writeFileSync(join(dir, 'index.html'), '<!doctype html><title>signing bench</title><script src="bench.js"></script>');
  const server = await startServer(dir);
  const profile = tempProfile();
  const ctx = await launch(profile.dir);
  try {
    const page = ctx.pages()[0] ?? (await ctx.newPage());
    await page.goto(server.url);
    const load = loadavg().map((x) => x.toFixed(2)).join(', ');
    const r = await page.evaluate((n) => (globalThis as unknown as { signingBench: { measure(n: number): Promise<Record<string, { median: number; fastest: number }>> } }).signingBench.measure(n), N);
    const row = (label: string, m: { median: number; fastest: number }) => `  ${label.padEnd(44)} ${m.median.toFixed(0).padStart(7)} µs   (fastest ${m.fastest.toFixed(0)} µs)`;
    console.log(
      `\nSigning in headless Chromium: µs per call, median over runs of 25 calls each awaited (${N} calls; saves: 200)\n` +
        `load average before ${load}, after ${loadavg().map((x) => x.toFixed(2)).join(', ')} (2 cores, shared)\n` +
        `${row('sign one chain head (ECDSA P-256, SHA-256)', r['sign']!)}\n` +
        `${row('verify one chain-head signature', r['verify']!)}\n` +
        `${row('save one check (appendCheck, signing included)', r['save']!)}\n` +
        `  signing's share of a save: ${((100 * r['sign']!.median) / r['save']!.median).toFixed(1)} %\n`,
    );
    expect(r['sign']!.median).toBeGreaterThan(0);
  } finally {
    await ctx.close();
    await server.close();
    profile.remove();
    rmSync(dir, { recursive: true, force: true });
  }
});
