// Speed of the field screens on a slow phone, measured in headless Chromium against the built app
// with the CPU throttled 4× (DevTools Emulation.setCPUThrottlingRate): key press to next paint on
// the Check screen (Event Timing, and a frame-accurate proxy beside it), first paint of a cold first
// visit and of a repeat visit served by the service worker. Prints each figure beside its target
// (issue 11: 16 ms median and 32 ms p90 key press to paint, 250 ms repeat visit, 800 ms cold);
// asserts nothing about time. Run: npx vite build && npx vitest run --config bench/vitest.config.ts bench/field-speed.bench-run.ts
import { readFileSync } from 'node:fs';
import { expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { DIST, launch, pickVessel, startServer, tempProfile, waitForControl } from '../test/e2e/harness.ts';

const THROTTLE = 4;

const quantile = (xs: readonly number[], q: number) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length ? s[Math.min(s.length - 1, Math.floor(q * s.length))]! : NaN;
};

function line(what: string, value: string, target: string): void {
  console.log(`  ${what.padEnd(58)} ${value.padStart(12)}   target ${target}`);
}

async function paints(page: Page): Promise<{ fp: number; fcp: number }> {
  // The paint entries appear once the page has painted; wait for the contentful one.
  await page.waitForFunction(() => performance.getEntriesByName('first-contentful-paint').length > 0, undefined, { timeout: 60_000 });
  return page.evaluate(() => ({
    fp: performance.getEntriesByName('first-paint')[0]?.startTime ?? NaN,
    fcp: performance.getEntriesByName('first-contentful-paint')[0]?.startTime ?? NaN,
  }));
}

it('field screens at 4× CPU throttle', async () => {
  const server = await startServer(DIST);
  const profile = tempProfile();
  const ctx = await launch(profile.dir);
  try {
    const page = ctx.pages()[0] ?? (await ctx.newPage());
    const cdp = await ctx.newCDPSession(page);
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: THROTTLE });

    await page.goto(`${server.url}#/check`);
    const cold = await paints(page);
    await waitForControl(page);
    await page.reload();
    const warm = await paints(page);
    await page.reload();
    const warm2 = await paints(page);

    await page.goto(`${server.url}#/vessels`);
    await page.getByRole('button', { name: 'Load demo plant' }).click();
    await page.getByRole('link', { name: /DEMO-JK-04/ }).waitFor();
    await page.goto(`${server.url}#/check`);
    await page.reload();
    // (Waits on the form itself, so the same benchmark also runs against an older build: TANKSIDE_DIST.)
    await page.locator('#chk-temperature').waitFor();
    await pickVessel(page, '#pick-vessel', 'DEMO-FT-02');
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: THROTTLE });
    // Event Timing reports key events of 16 ms or more (its smallest threshold); the proxy times
    // every key from the event's timestamp to the first task after the next frame.
    await page.evaluate(() => {
      const w = window as unknown as { eventDurations: number[]; proxy: number[]; byInteraction: Map<number, number> };
      w.eventDurations = [];
      w.proxy = [];
      // One figure per key press: the longest event of its interaction (keydown, keypress, keyup
      // share an interactionId), as Chromium's interaction-to-next-paint counts them.
      w.byInteraction = new Map();
      const since = performance.now();
      new PerformanceObserver((list) => {
        for (const e of list.getEntries() as (PerformanceEntry & { interactionId?: number })[]) {
          if (!e.interactionId || e.startTime < since) continue;
          w.byInteraction.set(e.interactionId, Math.max(w.byInteraction.get(e.interactionId) ?? 0, e.duration));
        }
        w.eventDurations = [...w.byInteraction.values()];
      }).observe({ type: 'event', durationThreshold: 16 } as PerformanceObserverInit);
      document.addEventListener('keydown', (ev) => {
        const t0 = ev.timeStamp;
        requestAnimationFrame(() => {
          const ch = new MessageChannel();
          ch.port1.onmessage = () => w.proxy.push(performance.now() - t0);
          ch.port2.postMessage(0);
        });
      }, { capture: true });
    });
    let keys = 0;
    for (let round = 0; round < 4; round++) {
      for (const [field, text] of [['#chk-temperature', '151,8'], ['#chk-pressure', '400'], ['#chk-gross', '612']] as const) {
        await page.fill(field, '');
        await page.focus(field);
        // A person's pace: a key every 150 ms (a benchmark's pacing, not a wait for the app).
        await page.keyboard.type(text, { delay: 150 });
        keys += text.length;
      }
    }
    await page.locator('#result[data-settled="true"], .verdict').first().waitFor();
    const evaluate = await page.evaluate(() => performance.getEntriesByName('tankside: evaluate the check').map((e) => e.duration));
    const { eventDurations, proxy } = await page.evaluate(() => {
      const w = window as unknown as { eventDurations: number[]; proxy: number[] };
      return { eventDurations: [...w.eventDurations], proxy: [...w.proxy] };
    });
    // Keys Event Timing did not report took under 16 ms: they count below every reported one.
    const timed = [...eventDurations, ...Array<number>(Math.max(0, keys - eventDurations.length)).fill(0)];
    const med = quantile(timed, 0.5), p90 = quantile(timed, 0.9);
    const show = (ms: number) => (ms === 0 ? '< 16 ms' : `${ms.toFixed(0)} ms`);

    console.log(`\nField screens, Chromium ${ctx.browser()?.version() ?? ''}, CPU throttled ${THROTTLE}×, load average ${readFileSync('/proc/loadavg', 'utf8').trim()}`);
    line(`key press to next paint, median (Event Timing, ${keys} keys, ${eventDurations.length} ≥ 16 ms)`, show(med), '≤ 16 ms');
    line('key press to next paint, p90 (Event Timing)', show(p90), '≤ 32 ms');
    line('key press to the first task after the next frame, median (proxy)', `${quantile(proxy, 0.5).toFixed(1)} ms`, '(beside the above)');
    line('key press to the first task after the next frame, p90 (proxy)', `${quantile(proxy, 0.9).toFixed(1)} ms`, '(beside the above)');
    line(`of which evaluating the check (engine and strip figures), median of ${evaluate.length}`, `${quantile(evaluate, 0.5).toFixed(1)} ms`, '(part of the above)');
    line('cold first visit: first paint', `${cold.fp.toFixed(0)} ms`, '≤ 800 ms');
    line('cold first visit: first contentful paint', `${cold.fcp.toFixed(0)} ms`, '(beside it)');
    line('repeat visit (service worker): first paint', `${warm.fp.toFixed(0)} ms, ${warm2.fp.toFixed(0)} ms`, '≤ 250 ms');
    line('repeat visit (service worker): first contentful paint', `${warm.fcp.toFixed(0)} ms, ${warm2.fcp.toFixed(0)} ms`, '(beside it)');
    expect(proxy.length).toBeGreaterThan(0);
  } finally {
    await ctx.close();
    await server.close();
    profile.remove();
  }
}, 600_000);
