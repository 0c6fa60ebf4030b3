// Plant sync rates in headless Chromium, including its IndexedDB writes: the app's own sync client
// and store, bundled by Vite, on a page served by deploy/nginx-tankside.conf under Debian's nginx
// with /db/ proxied to the CouchDB stand-in (pouchdb-server 4.2.0, another process on this
// machine). At 10,000 and 100,000 generated checks (invented bench data) each: one device pushes
// its whole log, then a supervisor's first pull takes it into an empty store. Printed beside the
// issue's targets (push ≥ 1,000 checks/s, pull ≥ 5,000 checks/s into the store, a first pull of
// 100,000 under 30 s), with the share spent waiting on the server's answers and the load average
// (2 shared cores). Asserts only that every check arrived, never how long it took.
// Run: npx vitest run --config bench/vitest.config.ts bench/sync-browser.bench-run.ts
//   (BENCH_SYNC_SIZES=10000 for a quicker run; BENCH_SYNC_PROFILE=1 also prints where the pull's
//   time goes on the page's thread: Chromium's CPU profile, self time by function, unminified)
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { build } from 'vite';
import type { BrowserContext, Page } from 'playwright-core';
import { readFileSync } from 'node:fs';
import { ROOT, launch, tempProfile } from '../test/e2e/harness.ts';
import { browserCpuS } from './browser-cpu.ts';
import { startSite, type NginxSite } from '../test/sync/nginx.ts';
import { StandIn } from '../test/sync/stand-in.ts';
import { fakeUuid, generatedBackup } from './generated-log.ts';

const SIZES = (process.env['BENCH_SYNC_SIZES'] ?? '10000,100000').split(',').map(Number);
const PROFILE = process.env['BENCH_SYNC_PROFILE'] === '1';
/** Changes per pull request: the client's own (0), or others to compare (BENCH_SYNC_PULL_BATCHES=0,10000). */
const PULL_BATCHES = (process.env['BENCH_SYNC_PULL_BATCHES'] ?? '0').split(',').map(Number);
const rows: string[] = [];
let couch: StandIn;
let site: NginxSite;
let dir: string;
let ctx: BrowserContext;
let page: Page;
const profile = tempProfile();

beforeAll(async () => {
  const built = await build({
    configFile: false, logLevel: 'warn', root: ROOT,
    build: { write: false, minify: !PROFILE, lib: { entry: join(ROOT, 'bench/sync-browser-entry.ts'), formats: ['iife'], name: 'syncBench', fileName: 'bench' } },
  });
  const output = (Array.isArray(built) ? built[0]! : built) as { output: { type: string; code?: string }[] };
  dir = mkdtempSync(join(tmpdir(), 'tankside-sync-bench-'));
  writeFileSync(join(dir, 'bench.js'), output.output.find((o) => o.type === 'chunk')!.code!);
  writeFileSync(join(dir, 'index.html'), '<!doctype html><title>sync bench</title><script src="/bench.js"></script>');
  couch = await StandIn.start();
  site = await startSite(dir, couch.port);
  ctx = await launch(profile.dir);
  page = ctx.pages()[0] ?? (await ctx.newPage());
  await page.goto(`${site.origin}/index.html`);
}, 120_000);

afterAll(async () => {
  await ctx?.close();
  await site?.stop();
  await couch?.stop();
  profile.remove();
  if (dir) rmSync(dir, { recursive: true, force: true });
  console.log(`\nPlant sync in Chromium behind nginx (load average at the end: ${loadavg().map((l) => l.toFixed(2)).join(' ')})`);
  for (const r of rows) console.log(r);
});

/** CPU seconds so far of process `pid` (Linux /proc; USER_HZ 100). */
function processCpuS(pid: number | undefined): number {
  if (pid === undefined) return NaN;
  const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
  const f = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
  return (Number(f[11]) + Number(f[12])) / 100;
}

/** Runs `fn`, adding the browser's and the server's CPU seconds over it to its figures. */
async function withCpu(fn: () => Promise<Record<string, number>>): Promise<Record<string, number>> {
  const b0 = browserCpuS(profile.dir);
  const s0 = processCpuS(couch.pid);
  const r = await fn();
  return { ...r, browserCpuS: browserCpuS(profile.dir) - b0, serverCpuS: processCpuS(couch.pid) - s0 };
}

/** Prints a run's figures beside its target, and whether this run met it (`met` given its seconds and rate). */
function row(label: string, checks: number, r: Record<string, number>, target: string, met: (s: number, perS: number) => boolean): void {
  const s = r['syncMs']! / 1000;
  const line = `  ${label.padEnd(44)} ${checks.toLocaleString('en')} checks in ${s.toFixed(2)} s = ${Math.round(checks / s).toLocaleString('en')}/s` +
    ` [${target}: ${met(s, checks / s) ? 'met' : 'missed'}]; waiting on the server ${(r['waitedMs']! / 1000).toFixed(2)} s over ${r['requests']} requests (${(r['bytes']! / 1e6).toFixed(1)} MB of answers);` +
    ` CPU: browser ${r['browserCpuS']!.toFixed(1)} s, server ${r['serverCpuS']!.toFixed(1)} s; load ${loadavg()[0]!.toFixed(2)}`;
  rows.push(line);
  console.log(line);
}

type Bench = { syncBench: Record<'push' | 'pull', (...a: unknown[]) => Promise<Record<string, number>>> };

for (const size of SIZES) {
  it(`${size.toLocaleString('en')} checks: a device pushes them, a supervisor's first pull takes them`, async () => {
    const deviceId = fakeUuid(0xbe7c0000 + size, 1);
    writeFileSync(join(dir, `seed-${size}.json`), await generatedBackup({
      deviceId, vesselPrefix: 'be7c0001', vessels: 50, checks: size, startMs: Date.UTC(2026, 0, 1), stepMs: 300_000, technicians: ['Bench One', 'Bench Two'], seed: size,
    }));
    const password = couch.addAccount('device', deviceId);
    const pushed = await withCpu(() => page.evaluate(([run, url]) => (globalThis as unknown as Bench).syncBench.push(run, url),
      [{ dbName: `device-${size}`, deviceId, password, role: 'technician' }, `/seed-${size}.json`] as const));
    expect(pushed['pushed']).toBe(size);
    rows.push(`  (the device's log imported first in ${(pushed['seedMs']! / 1000).toFixed(1)} s, not counted)`);
    row('push, one device', size, pushed, 'target ≥ 1,000/s', (_s, perS) => perS >= 1000);
    // A first pull takes the whole database: the smaller runs' checks too.
    const total = SIZES.filter((s) => s <= size).reduce((a, b) => a + b, 0);
    for (const batch of PULL_BATCHES) {
      const supervisorId = fakeUuid(0x5e7c0000 + size + batch, 1);
      const supervisorPassword = couch.addAccount('supervisor', supervisorId);
      const cdp = PROFILE ? await ctx.newCDPSession(page) : null;
      if (cdp) {
        await cdp.send('Profiler.enable');
        await cdp.send('Profiler.setSamplingInterval', { interval: 1000 });
        await cdp.send('Profiler.start');
      }
      const pulled = await withCpu(() => page.evaluate(([run, b]) => (globalThis as unknown as Bench).syncBench.pull(run, b),
        [{ dbName: `supervisor-${size}-${batch}`, deviceId: supervisorId, password: supervisorPassword, role: 'supervisor' }, batch || undefined] as const));
      expect(pulled['added']).toBe(total);
      expect(pulled['refused']).toBe(0);
      row(`first pull into the store, supervisor${batch ? ` (${batch} per request)` : ''}`, total, pulled, `target ≥ 5,000/s${size >= 100_000 ? '; 100,000 under 30 s' : ''}`,
        (s, perS) => perS >= 5000 && (size < 100_000 || s < 30));
      if (cdp) {
        const { profile: p } = (await cdp.send('Profiler.stop')) as unknown as { profile: CpuProfile };
        rows.push(...selfTimes(p, 15).map((l) => `    ${l}`));
        await cdp.detach();
      }
    }
  }, 1_200_000);
}

interface CpuProfile {
  nodes: { id: number; callFrame: { functionName: string; url: string; lineNumber: number } }[];
  samples: number[];
  timeDeltas: number[];
}

/** The `top` functions by self time in a CPU profile, with their share of the samples. */
function selfTimes(p: CpuProfile, top: number): string[] {
  const byId = new Map(p.nodes.map((n) => [n.id, n.callFrame]));
  const self = new Map<string, number>();
  let all = 0;
  p.samples.forEach((id, i) => {
    const f = byId.get(id)!;
    const name = `${f.functionName || '(anonymous)'} ${f.url.split('/').pop()}:${f.lineNumber + 1}`;
    const dt = p.timeDeltas[i] ?? 0;
    self.set(name, (self.get(name) ?? 0) + dt);
    all += dt;
  });
  return [...self].sort((a, b) => b[1] - a[1]).slice(0, top).map(([name, us]) => `${(us / 1000).toFixed(0).padStart(7)} ms ${((100 * us) / all).toFixed(1).padStart(5)} %  ${name}`);
}
