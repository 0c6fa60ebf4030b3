#!/usr/bin/env node
// The browser tests under load: builds once, keeps one core busy with a spinning process (as CI's
// other jobs would), and runs every browser test file RUNS times. The bar is zero failures: a test
// that waits on a fixed time instead of the app's own completion state shows up here first.
// Prints each run's counts and the load average, and exits non-zero if any test failed.
//   npm run test:stress            (TANKSIDE_STRESS_RUNS=n for another number of runs)
import { spawn, spawnSync } from 'node:child_process';
import { mkdirSync, readFileSync } from 'node:fs';
import { loadavg } from 'node:os';

const RUNS = Number(process.env.TANKSIDE_STRESS_RUNS ?? 5);
const load = () => loadavg().map((x) => x.toFixed(2)).join(', ');

function run(cmd, args) {
  const r = spawnSync(cmd, args, { stdio: 'inherit' });
  return r.status ?? 1;
}

if (run('npx', ['vite', 'build', '--logLevel', 'warn']) !== 0) process.exit(1);
mkdirSync('test-results', { recursive: true });
// One core kept busy for the whole run; ended by its own pid when the runs are over.
const spinner = spawn(process.execPath, ['-e', 'for (;;) {}'], { stdio: 'ignore' });
const stop = () => { if (spinner.exitCode === null) spinner.kill('SIGTERM'); };
process.on('exit', stop);
process.on('SIGINT', () => { stop(); process.exit(130); });

const results = [];
for (let i = 1; i <= RUNS; i += 1) {
  console.log(`\n== browser tests, run ${i} of ${RUNS}, one core kept busy (load average ${load()})`);
  const file = `test-results/stress-${i}.json`;
  const status = run('npx', ['vitest', 'run', '--config', 'test/e2e/vitest.config.ts', '--reporter=default', '--reporter=json', `--outputFile.json=${file}`]);
  let passed = 0;
  let failed = 0;
  let names = [];
  try {
    const summary = JSON.parse(readFileSync(file, 'utf8'));
    passed = summary.numPassedTests;
    failed = summary.numFailedTests;
    names = summary.testResults.flatMap((f) => f.assertionResults.filter((a) => a.status === 'failed').map((a) => `${f.name.replace(/^.*test\/e2e\//, '')}: ${a.fullName}`));
  } catch {
    failed = Math.max(1, failed);
  }
  if (status !== 0 && failed === 0) failed = 1;
  results.push({ run: i, passed, failed, names, load: load() });
}
stop();

console.log('\nStress summary (browser tests, one core kept busy):');
for (const r of results) {
  console.log(`  run ${r.run}: ${r.passed} passed, ${r.failed} failed (load average after: ${r.load})`);
  for (const n of r.names) console.log(`    failed: ${n}`);
}
const failures = results.reduce((n, r) => n + r.failed, 0);
console.log(failures === 0 ? `\nZero failures in ${RUNS} runs.` : `\n${failures} failures in ${RUNS} runs.`);
process.exit(failures === 0 ? 0 : 1);
