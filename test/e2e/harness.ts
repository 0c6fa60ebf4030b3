// Shared pieces of the browser tests: a static server for a built app on 127.0.0.1 (its folder
// can be swapped to deliver an update), a persistent Chromium profile, axe-core, screenshots.
import { createServer, type Server } from 'node:http';
import { mkdirSync, mkdtempSync, readFileSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { extname, join, normalize, resolve } from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

export const ROOT = resolve(import.meta.dirname, '../..');
// TANKSIDE_DIST serves another build (for example an older one, to see a new test fail on it).
export const DIST = process.env.TANKSIDE_DIST ?? join(ROOT, 'dist');
export const SCREENS_DIR = join(ROOT, 'test-results/screens');

const MIME: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.webmanifest': 'application/manifest+json',
  '.json': 'application/json',
};

export interface StaticServer {
  url: string;
  /** Serve another build from now on (how an app update reaches the browser). */
  serve(dir: string): void;
  /** Every path requested, in order. */
  requests: string[];
  close(): Promise<void>;
}

/** A static server for `dir` on a free port of 127.0.0.1; no caching headers that could hide an update. */
export async function startServer(dir: string): Promise<StaticServer> {
  let root = dir;
  const requests: string[] = [];
  const server: Server = createServer((req, res) => {
    const path = decodeURIComponent(new URL(req.url ?? '/', 'http://x').pathname);
    requests.push(path);
    let file = normalize(join(root, path));
    if (!file.startsWith(root)) { res.writeHead(403).end(); return; }
    try {
      if (statSync(file).isDirectory()) file = join(file, 'index.html');
      const body = readFileSync(file);
      res.writeHead(200, { 'content-type': MIME[extname(file)] ?? 'application/octet-stream', 'cache-control': 'no-cache' });
      res.end(body);
    } catch {
      res.writeHead(404, { 'content-type': 'text/plain' }).end('not found');
    }
  });
  await new Promise<void>((ok) => server.listen(0, '127.0.0.1', ok));
  const address = server.address();
  if (!address || typeof address === 'string') throw new Error('server has no port');
  return {
    url: `http://127.0.0.1:${address.port}/`,
    serve(next) { root = next; },
    requests,
    close: () => new Promise<void>((ok) => { server.closeAllConnections(); server.close(() => ok()); }),
  };
}

export function tempProfile(): { dir: string; remove(): void } {
  const dir = mkdtempSync(join(tmpdir(), 'tankside-e2e-'));
  return { dir, remove: () => rmSync(dir, { recursive: true, force: true }) };
}

/** The phone sizes the field screens are held to: a common phone and a small one. */
export const PHONE = { width: 390, height: 844 } as const;
export const SMALL_PHONE = { width: 320, height: 700 } as const;

/**
 * A phone-sized persistent Chromium profile (service workers and storage survive a relaunch).
 * `extraArgs`: more Chromium switches (the label test's fake camera).
 */
export async function launch(profileDir: string, colorScheme: 'light' | 'dark' = 'light', extraArgs: readonly string[] = []): Promise<BrowserContext> {
  return chromium.launchPersistentContext(profileDir, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    args: ['--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', ...extraArgs],
    viewport: { width: PHONE.width, height: PHONE.height },
    deviceScaleFactor: 1,
    colorScheme,
    locale: 'en-GB',
  });
}

/** Waits until a service worker is activated and controls the page. */
export async function waitForControl(page: Page): Promise<void> {
  // A synchronous predicate: waitForFunction treats a returned promise as truthy.
  await page.waitForFunction(() => navigator.serviceWorker.controller?.state === 'activated', undefined, { timeout: 30_000, polling: 200 });
}

export interface AxeViolation { id: string; impact: string | null; help: string; nodes: { target: unknown[] }[] }

const AXE_SOURCE = readFileSync(join(ROOT, 'node_modules/axe-core/axe.min.js'), 'utf8');

/** axe-core's violations on the page as it stands (WCAG 2.x A and AA rules plus best practice). */
export async function axeViolations(page: Page): Promise<{ id: string; help: string; targets: string }[]> {
  // The page's CSP (script-src 'self') refuses an inline <script> (page.addScriptTag), as it
  // should; DevTools-protocol evaluation is outside the page's policy.
  const injected = await page.evaluate(() => 'axe' in window);
  if (!injected) await page.evaluate(AXE_SOURCE);
  const violations = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run(ctx: Document, opts: object): Promise<{ violations: AxeViolation[] }> } }).axe;
    const result = await axe.run(document, { resultTypes: ['violations'] });
    return result.violations;
  });
  return violations.map((v) => ({ id: v.id, help: v.help, targets: v.nodes.map((n) => JSON.stringify(n.target)).join(' ') }));
}

/**
 * A screenshot of what the phone shows (`name.png`, the viewport as the person sees it, the tab
 * bar in its place) and of the whole page (`name-full.png`); with TANKSIDE_SLICES=1 also
 * screen-high slices of the whole page for close reading.
 */
export async function screenshot(page: Page, name: string): Promise<void> {
  mkdirSync(SCREENS_DIR, { recursive: true });
  await page.screenshot({ path: join(SCREENS_DIR, `${name}.png`) });
  await page.screenshot({ path: join(SCREENS_DIR, `${name}-full.png`), fullPage: true });
  if (!process.env.TANKSIDE_SLICES) return;
  const dir = join(SCREENS_DIR, 'slices');
  mkdirSync(dir, { recursive: true });
  const { width, height } = await page.evaluate(() => ({ width: document.documentElement.clientWidth, height: document.documentElement.scrollHeight }));
  const screen = await page.evaluate(() => window.innerHeight);
  for (let y = 0, i = 1; y < height; y += screen, i++) {
    await page.screenshot({ path: join(dir, `${name}-${i}.png`), fullPage: true, clip: { x: 0, y, width, height: Math.min(screen, height - y) } });
  }
}

/** Picks the option whose text starts with `tag` in a vessel <select>. */
export async function pickVessel(page: Page, selector: string, tag: string): Promise<void> {
  // The picker fills in once the vessel list has been read from the store: wait for the option.
  await page.waitForFunction(
    ([sel, t]) => [...((document.querySelector(sel) as HTMLSelectElement | null)?.options ?? [])].some((o) => o.text.startsWith(t)),
    [selector, tag] as const,
    { timeout: 10_000 },
  ).catch(() => undefined);
  const value = await page.$eval(selector, (el, t) => {
    const opt = [...(el as HTMLSelectElement).options].find((o) => o.text.startsWith(t));
    return opt?.value ?? '';
  }, tag);
  if (!value) throw new Error(`no vessel ${tag} in ${selector}`);
  await page.selectOption(selector, value);
}

/** Interactive elements smaller than 48 px tall or wide (a link inside a sentence: at least 48 px tall). */
export async function smallTargets(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const out: string[] = [];
    for (const el of document.querySelectorAll<HTMLElement>('button, select, input, textarea, a.button, nav a, .switch label, label.row, summary')) {
      if (el instanceof HTMLInputElement && (el.type === 'radio' || el.type === 'checkbox')) continue;
      const r = el.getBoundingClientRect();
      if (r.width === 0 && r.height === 0) continue;
      if (r.height < 47.5 || r.width < 47.5) out.push(`${el.tagName.toLowerCase()}#${el.id || el.textContent?.trim().slice(0, 20)} ${Math.round(r.width)}x${Math.round(r.height)}`);
    }
    for (const el of document.querySelectorAll<HTMLElement>('main a:not(.button)')) {
      const r = el.getBoundingClientRect();
      if (r.width === 0 && r.height === 0) continue;
      if (r.height < 47.5) out.push(`link "${el.textContent?.trim().slice(0, 20)}" ${Math.round(r.width)}x${Math.round(r.height)}`);
    }
    return out;
  });
}
