// Benchmarks run through Vitest only to load TypeScript; they print figures and assert nothing about time.
import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    root: new URL('..', import.meta.url).pathname,
    include: ['bench/**/*.bench-run.ts'],
    testTimeout: 600_000,
    reporters: ['default'],
    silent: false,
    disableConsoleIntercept: true,
  },
});
