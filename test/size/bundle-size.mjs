#!/usr/bin/env node
// Size budget for the shipped JavaScript, gzip level 9, from the build manifest:
//  - at start: the entry chunk and everything it imports statically — what every phone parses when
//    the app opens — at most 45 KB (issue 11: the Check screen and what it needs first). History:
//    the instrument register, cycles, plant overview and sync took it to 48.0 KB; the register's
//    reads and writes moved on demand behind src/store/transfer.ts (47.4 KB); then workbox-window
//    loads only when the worker registers (after the store opens), the module-preload polyfill is
//    off (every browser the app runs in preloads modules itself) and the standing note's wording
//    left the rule catalogue (basics.ts had pulled all of cautions.ts in for one string): 44.3 KB;
//    the v9 id buckets (log-ids.ts) added 0.5 KB, and the full result's card with its chart and
//    sketch now loads with the engine (check-session.ts), which it always waited for: 43.2 KB;
//    issue 14's schema v10 (every month row keeps its check's key figures, written by every save,
//    and the rung that fills them in, sharing rung 5's row rebuild) and readRecords' one request
//    per block add about 0.25 KB;
//  - on demand: chunks behind a dynamic import (every screen but Check, the engine, the long jobs), at most 20 KB each,
//    but the check engine's chunk (`core-*.js`), at most 26 KB: issue 9's findings (40 rules and
//    their wording, the edge states, the stored region 3 starting values) took it from 15.4 to
//    24.3 KB; it loads when the page is first idle after the first screen, and the rules' reasons
//    stay out of it (rule-reasons.ts). Issue 13 (instruments) took it to 25.3 KB: the instruments
//    room stays out of it (src/core/index.ts says how), but the drift estimator's statistics
//    (Student's t, the serial trend) are reached through the core's index by the periodic-test
//    room as well, so the bundler keeps them here;
//  - the long jobs' surface (`transfer-*.js`), at most 23 KB: since it carries the instrument
//    register's reads and writes (21.37 KB, 21.60 KB with main's sorted review since; 19.64 KB without them). A surface of the register's own
//    was measured and made the start larger (47.76 KB: the bundler split the start-up store in two);
//    issue 14's long jobs on workers (sharing the devices between two log workers, and their
//    orchestration on the page) took it to 22.06 KB, and 22.54 KB with main's register screens
//    and sync since, so 23 KB;
//  - the import worker (`import-worker-*.js`), at most 22 KB: it carries the whole store (the schema
//    ladder with its upgrade rungs) and the reader of every backup format version; issue 13's
//    instrument register (its upgrade rung, format version 3's lists and their merge) took it
//    from 18.6 to 21.0 KB (with the record kinds of schema v7). It loads only when a backup is imported, off the page's thread;
//  - the total is printed too. The service worker runs in its own scope and is printed for information.
import { gzipSync } from 'node:zlib';
import { existsSync, readFileSync, readdirSync } from 'node:fs';
import { join, resolve } from 'node:path';

const DIST = resolve(import.meta.dirname, '../../dist');
const START_BUDGET_BYTES = 45 * 1024;
const ON_DEMAND_BUDGET_BYTES = 20 * 1024;
const ENGINE_CHUNK_BUDGET_BYTES = 26 * 1024;
const IMPORT_WORKER_BUDGET_BYTES = 22 * 1024;
const TRANSFER_CHUNK_BUDGET_BYTES = 23 * 1024;
const budgetOf = (file) => (/^assets\/core-[\w-]+\.js$/.test(file) ? ENGINE_CHUNK_BUDGET_BYTES
  : /^assets\/import-worker-[\w-]+\.js$/.test(file) ? IMPORT_WORKER_BUDGET_BYTES
  : /^assets\/transfer-[\w-]+\.js$/.test(file) ? TRANSFER_CHUNK_BUDGET_BYTES : ON_DEMAND_BUDGET_BYTES);
const MANIFEST = join(DIST, '.vite/manifest.json');

if (!existsSync(MANIFEST)) {
  console.error('bundle size: dist/.vite/manifest.json is missing; run `npx vite build` first.');
  process.exit(1);
}
const manifest = JSON.parse(readFileSync(MANIFEST, 'utf8'));
const gz = (file) => gzipSync(readFileSync(join(DIST, file)), { level: 9 }).length;
const kb = (bytes) => `${(bytes / 1024).toFixed(2)} KB`;

const atStart = new Set();
const visit = (key) => {
  const chunk = manifest[key];
  if (!chunk || atStart.has(chunk.file)) return;
  atStart.add(chunk.file);
  for (const dep of chunk.imports ?? []) visit(dep);
};
for (const [key, chunk] of Object.entries(manifest)) if (chunk.isEntry) visit(key);
const allJs = readdirSync(join(DIST, 'assets')).filter((f) => /\.m?js$/.test(f)).map((f) => `assets/${f}`);
const onDemand = allJs.filter((f) => !atStart.has(f));

let startTotal = 0;
let failed = false;
console.log('At start:');
for (const f of [...atStart].sort()) { const s = gz(f); startTotal += s; console.log(`  ${f}: ${kb(s)} gzip`); }
let lazyTotal = 0;
console.log('On demand:');
for (const f of onDemand.sort()) {
  const s = gz(f);
  lazyTotal += s;
  const over = s > budgetOf(f);
  failed ||= over;
  console.log(`  ${f}: ${kb(s)} gzip${over ? `  OVER the ${kb(budgetOf(f))} budget` : ''}`);
}
if (existsSync(join(DIST, 'sw.js'))) console.log(`  (service worker sw.js: ${kb(gz('sw.js'))} gzip, not counted)`);
console.log(`Shipped page JavaScript at start: ${kb(startTotal)} gzip (budget ${kb(START_BUDGET_BYTES)}); ` +
  `on demand: ${kb(lazyTotal)}; all JavaScript: ${kb(startTotal + lazyTotal)}`);
if (atStart.size === 0) { console.error('bundle size: the manifest names no entry chunk; the build looks wrong.'); process.exit(1); }
// Every screen but Check loads on demand, offline too: each chunk (and stylesheet) must be in the
// service worker's precache list, or the screen would fail to open without the network.
const worker = existsSync(join(DIST, 'sw.js')) ? readFileSync(join(DIST, 'sw.js'), 'utf8') : '';
const assets = readdirSync(join(DIST, 'assets')).filter((f) => /\.(m?js|css)$/.test(f)).map((f) => `assets/${f}`);
const missing = assets.filter((f) => !worker.includes(f));
console.log(`Precached by the service worker: ${assets.length - missing.length} of ${assets.length} chunks and stylesheets`);
if (missing.length) { console.error(`bundle size: not precached, so not available offline: ${missing.join(', ')}`); failed = true; }
if (startTotal > START_BUDGET_BYTES) {
  console.error(`bundle size: the page's start-up JavaScript is over budget by ${kb(startTotal - START_BUDGET_BYTES)}.`);
  failed = true;
}
if (failed) process.exit(1);
