// Lighthouse 12 (npm, pinned, dev only) on the built app's start page with its mobile defaults
// (simulated slow 4G and 4× CPU, a phone's screen), in Debian's Chromium: the three category scores
// beside their targets (issue 11: performance, accessibility and best practices at 100) and the
// paint figures behind the performance score. A benchmark, never a gate: it prints and asserts only
// that a report came back. Run: npx vite build && npx vitest run --config bench/vitest.config.ts bench/lighthouse.bench-run.ts
import { readFileSync } from 'node:fs';
import { expect, it } from 'vitest';
import lighthouse from 'lighthouse';
import { launch as launchChrome } from 'chrome-launcher';
import { DIST, startServer } from '../test/e2e/harness.ts';

it('Lighthouse, mobile, start page', async () => {
  const server = await startServer(DIST);
  const chrome = await launchChrome({ chromePath: '/usr/bin/chromium', chromeFlags: ['--headless=new', '--no-sandbox', '--disable-background-networking'] });
  try {
    const result = await lighthouse(server.url, { port: chrome.port, output: 'json', logLevel: 'error', onlyCategories: ['performance', 'accessibility', 'best-practices'] });
    const lhr = result?.lhr;
    expect(lhr).toBeDefined();
    console.log(`\nLighthouse ${lhr!.lighthouseVersion}, mobile defaults, Chromium ${lhr!.environment.hostUserAgent.match(/Chrome\/[\d.]+/)?.[0] ?? ''}, load average ${readFileSync('/proc/loadavg', 'utf8').trim()}`);
    for (const c of Object.values(lhr!.categories)) console.log(`  ${c.title.padEnd(40)} ${String(Math.round((c.score ?? 0) * 100)).padStart(5)}   target 100`);
    for (const id of ['first-contentful-paint', 'largest-contentful-paint', 'speed-index', 'total-blocking-time', 'cumulative-layout-shift']) {
      const a = lhr!.audits[id]!;
      console.log(`  ${a.title.padEnd(40)} ${String(a.displayValue ?? '').padStart(8)}   (behind the performance score)`);
    }
  } finally {
    chrome.kill();
    await server.close();
  }
}, 300_000);
