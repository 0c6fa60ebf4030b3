#!/usr/bin/env node
// Size budget: the gzip size of all JavaScript the page ships (every script index.html loads plus
// every .js under dist/assets), at most 60 KB. The service worker is printed for information;
// it runs in its own scope and is not part of the page's budget.
import { gzipSync } from 'node:zlib';
import { existsSync, readFileSync, readdirSync } from 'node:fs';
import { join, resolve } from 'node:path';

const DIST = resolve(import.meta.dirname, '../../dist');
const BUDGET_BYTES = 60 * 1024;

if (!existsSync(join(DIST, 'index.html'))) {
  console.error('bundle size: dist/index.html is missing; run `npx vite build` first.');
  process.exit(1);
}

const html = readFileSync(join(DIST, 'index.html'), 'utf8');
const files = new Set();
for (const m of html.matchAll(/<(?:script|link)\b[^>]*?(?:src|href)="([^"]+\.m?js)"/g)) {
  files.add(m[1].replace(/^\.?\//, ''));
}
const assets = join(DIST, 'assets');
if (existsSync(assets)) for (const f of readdirSync(assets)) if (/\.m?js$/.test(f)) files.add(`assets/${f}`);

let total = 0;
for (const f of [...files].sort()) {
  const size = gzipSync(readFileSync(join(DIST, f)), { level: 9 }).length;
  total += size;
  console.log(`  ${f}: ${(size / 1024).toFixed(2)} KB gzip`);
}
if (existsSync(join(DIST, 'sw.js'))) {
  const sw = gzipSync(readFileSync(join(DIST, 'sw.js')), { level: 9 }).length;
  console.log(`  (service worker sw.js: ${(sw / 1024).toFixed(2)} KB gzip, not counted)`);
}
console.log(`Shipped page JavaScript: ${(total / 1024).toFixed(2)} KB gzip (budget ${BUDGET_BYTES / 1024} KB)`);
if (files.size === 0) {
  console.error('bundle size: found no JavaScript for the page; the build looks wrong.');
  process.exit(1);
}
if (total > BUDGET_BYTES) {
  console.error(`bundle size: over budget by ${((total - BUDGET_BYTES) / 1024).toFixed(2)} KB.`);
  process.exit(1);
}
