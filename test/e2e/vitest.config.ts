// Browser tests: headless Debian chromium driven by playwright-core against the built app.
// One file at a time: the machine is small and each test owns a browser.
import { defineConfig } from 'vitest/config';
import { resolve } from 'node:path';

export default defineConfig({
  test: {
    root: resolve(import.meta.dirname, '../..'),
    include: ['test/e2e/**/*.test.ts'],
    environment: 'node',
    fileParallelism: false,
    testTimeout: 180_000,
    hookTimeout: 180_000,
    // expect.poll waits on what the page shows; its default second is too short on a loaded 2-core
    // machine. The waits stay on the app's own state: this only bounds how long they may take.
    expect: { poll: { timeout: 60_000, interval: 100 } },
  },
});
