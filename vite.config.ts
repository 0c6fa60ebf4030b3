import { defineConfig } from 'vitest/config';
import preact from '@preact/preset-vite';
import { VitePWA } from 'vite-plugin-pwa';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';

const rootDir = import.meta.dirname;
// The plant's CouchDB is normally reached at /db/ on the app's own origin (deploy/nginx-tankside.conf),
// so connect-src stays 'self'. A plant that serves it elsewhere names that origin at build time:
// TANKSIDE_SYNC_ORIGIN=https://couch.plant.example npm run build (added to connect-src only).
const SYNC_ORIGIN = syncOrigin(process.env.TANKSIDE_SYNC_ORIGIN);
const CONTENT_SECURITY_POLICY = [
  "default-src 'self'", "script-src 'self'", "style-src 'self'", "img-src 'self' data:", `connect-src 'self'${SYNC_ORIGIN ? ` ${SYNC_ORIGIN}` : ''}`,
  "manifest-src 'self'", "worker-src 'self'", "object-src 'none'", "base-uri 'self'", "form-action 'self'",
].join('; ');
const packageVersion = (JSON.parse(readFileSync(resolve(rootDir, 'package.json'), 'utf8')) as { version: string }).version;
// TANKSIDE_BUILD_TAG marks a build variant (the browser tests build a second one to deliver an update).
const appVersion = process.env.TANKSIDE_BUILD_TAG ? `${packageVersion}+${process.env.TANKSIDE_BUILD_TAG}` : packageVersion;

export default defineConfig({
  root: resolve(rootDir, 'src'),
  publicDir: resolve(rootDir, 'src/public'),
  base: './',
  define: { __APP_VERSION__: JSON.stringify(appVersion), __SYNC_ORIGIN__: JSON.stringify(SYNC_ORIGIN ?? '') },
  build: {
    outDir: resolve(rootDir, 'dist'),
    emptyOutDir: true,
    target: 'es2022',
    // The field screens are one chunk; only the supervisors' Review screen loads on demand. Every
    // chunk is precached, and an update is applied only by a reload the user asks for, so a page
    // never asks for a chunk its worker no longer holds. The manifest lets the size check tell
    // what the page loads at start from what it loads later.
    manifest: true,
    // Every browser the app runs in (ES2022 modules, service workers) preloads modules itself; the
    // polyfill would be 0.5 KB gzip of start-up script that only ever checks that.
    modulePreload: { polyfill: false },
  },
  plugins: [
    preact(),
    VitePWA({
      strategies: 'injectManifest',
      srcDir: resolve(rootDir, 'sw'),
      filename: 'sw.ts',
      injectRegister: false,
      manifest: false,
      injectManifest: {
        globPatterns: ['**/*.{js,css,html,svg,png,webmanifest}'],
      },
    }),
    {
      // The built page allows only its own origin. Build only: the dev server injects styles
      // inline for hot reload. A meta policy must come first in <head> and cannot carry
      // frame-ancestors (header-only); a host that can set headers should send it as a header too.
      name: 'tankside-csp',
      apply: 'build',
      transformIndexHtml() {
        return [{ tag: 'meta', attrs: { 'http-equiv': 'Content-Security-Policy', content: CONTENT_SECURITY_POLICY }, injectTo: 'head-prepend' }];
      },
    },
    {
      // The manifest lives at the repository's top level; ship it beside index.html.
      name: 'tankside-manifest',
      generateBundle() {
        this.emitFile({ type: 'asset', fileName: 'manifest.webmanifest', source: readManifest() });
      },
      configureServer(server) {
        // The dev server serves the same top-level manifest, so `npm start` links no missing file.
        server.middlewares.use('/manifest.webmanifest', (_req, res) => {
          res.setHeader('Content-Type', 'application/manifest+json');
          res.end(readManifest());
        });
      },
    },
  ],
  test: {
    root: rootDir,
    include: ['test/**/*.test.ts', 'test/**/*.test.tsx'],
    exclude: ['test/e2e/**', 'node_modules/**'],
    environment: 'node',
    setupFiles: ['test/fast-check-seed.ts'],
    testTimeout: 60_000,
  },
});

/** The origin TANKSIDE_SYNC_ORIGIN names, or null when unset. @throws naming the setting and the form expected */
function syncOrigin(value: string | undefined): string | null {
  if (value === undefined || value === '') return null;
  let url: URL | null = null;
  try {
    url = new URL(value);
  } catch {
    url = null;
  }
  if (!url || (url.protocol !== 'https:' && url.protocol !== 'http:') || url.origin !== value.replace(/\/$/, '')) {
    throw new Error(`TANKSIDE_SYNC_ORIGIN: "${value}" is not an origin; expected scheme, host and optional port only, e.g. https://couch.plant.example`);
  }
  return url.origin;
}

function readManifest(): string {
  return readFileSync(resolve(rootDir, 'manifest.webmanifest'), 'utf8');
}
