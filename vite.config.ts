import { defineConfig } from 'vitest/config';
import preact from '@preact/preset-vite';
import { VitePWA } from 'vite-plugin-pwa';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';

const rootDir = import.meta.dirname;
const CONTENT_SECURITY_POLICY = [
  "default-src 'self'", "script-src 'self'", "style-src 'self'", "img-src 'self' data:", "connect-src 'self'",
  "manifest-src 'self'", "worker-src 'self'", "object-src 'none'", "base-uri 'self'", "form-action 'self'",
].join('; ');
const packageVersion = (JSON.parse(readFileSync(resolve(rootDir, 'package.json'), 'utf8')) as { version: string }).version;
// TANKSIDE_BUILD_TAG marks a build variant (the browser tests build a second one to deliver an update).
const appVersion = process.env.TANKSIDE_BUILD_TAG ? `${packageVersion}+${process.env.TANKSIDE_BUILD_TAG}` : packageVersion;

export default defineConfig({
  root: resolve(rootDir, 'src'),
  publicDir: resolve(rootDir, 'src/public'),
  base: './',
  define: { __APP_VERSION__: JSON.stringify(appVersion) },
  build: {
    outDir: resolve(rootDir, 'dist'),
    emptyOutDir: true,
    target: 'es2022',
    // One chunk: lazy chunks can vanish from the precache under a running page after an update.
    rollupOptions: { output: { codeSplitting: false } },
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
      apply: 'build',
      generateBundle() {
        this.emitFile({ type: 'asset', fileName: 'manifest.webmanifest', source: readManifest() });
      },
    },
  ],
  test: {
    root: rootDir,
    include: ['test/**/*.test.ts', 'test/**/*.test.tsx'],
    exclude: ['test/e2e/**', 'node_modules/**'],
    environment: 'node',
    testTimeout: 60_000,
  },
});

function readManifest(): string {
  return readFileSync(resolve(rootDir, 'manifest.webmanifest'), 'utf8');
}
