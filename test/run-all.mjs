#!/usr/bin/env node
// The one gate: system prerequisites, type checks, unit + reference tests, build, bundle size,
// browser tests. CI runs exactly this (npm test). Each step prints what it runs.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync } from 'node:fs';

const CHROMIUM = '/usr/bin/chromium';
const DEBIAN_PYTHON = '/usr/bin/python3';
const NGINX = '/usr/sbin/nginx';

function run(label, cmd, args) {
  console.log(`\n== ${label}: ${cmd} ${args.join(' ')}`);
  const r = spawnSync(cmd, args, { stdio: 'inherit' });
  if (r.status !== 0) {
    console.error(`\n${label} failed (exit ${r.status ?? r.signal}).`);
    process.exit(r.status || 1);
  }
}

function missingSystemPackages() {
  const missing = [];
  if (!existsSync(CHROMIUM)) missing.push('chromium');
  if (!existsSync(NGINX)) missing.push('nginx');
  const py = spawnSync(DEBIAN_PYTHON, ['-c', 'import iapws, scipy'], { stdio: 'ignore' });
  if (py.status !== 0) missing.push('python3-iapws', 'python3-scipy');
  return missing;
}

let missing = missingSystemPackages();
if (missing.length > 0 && process.getuid?.() === 0 && existsSync('/usr/bin/apt-get')) {
  console.log(`Installing Debian packages the tests need: ${missing.join(' ')}`);
  run('apt-get update', 'apt-get', ['update', '-qq']);
  run('apt-get install', 'apt-get', ['install', '-y', '-qq', ...missing]);
  missing = missingSystemPackages();
}
if (missing.length > 0) {
  console.error(
    `The tests need these Debian packages, which are missing: ${missing.join(', ')}.\n` +
      `Install them with:  sudo apt-get install -y ${missing.join(' ')}\n` +
      `(chromium drives the browser tests; python3-iapws, run by ${DEBIAN_PYTHON}, is the reference library; nginx serves the\n` +
      ` deploy/ site file in front of the CouchDB stand-in in test/sync/nginx-site.test.ts.)`,
  );
  process.exit(1);
}

run('type check', 'npx', ['tsc', '-p', 'tsconfig.json', '--noEmit']);
run('type check (core, no DOM, no packages)', 'npx', ['tsc', '-p', 'src/core/tsconfig.json', '--noEmit']);
run('type check (service worker)', 'npx', ['tsc', '-p', 'sw/tsconfig.json', '--noEmit']);
mkdirSync('test-results', { recursive: true });
const counts = { passed: 0, failed: 0 };
/** Runs a vitest suite with the default reporter on screen and a JSON summary for the closing count. */
function runVitest(label, extraArgs, summaryFile) {
  run(label, 'npx', ['vitest', 'run', ...extraArgs, '--reporter=default', '--reporter=json', `--outputFile.json=${summaryFile}`]);
  const summary = JSON.parse(readFileSync(summaryFile, 'utf8'));
  counts.passed += summary.numPassedTests;
  counts.failed += summary.numFailedTests;
}

runVitest('unit and reference tests', [], 'test-results/unit-summary.json');
run('build', 'npx', ['vite', 'build', '--logLevel', 'warn']);
if (existsSync('test/size/bundle-size.mjs')) run('bundle size', 'node', ['test/size/bundle-size.mjs']);
if (existsSync('test/e2e/vitest.config.ts')) {
  runVitest('browser tests', ['--config', 'test/e2e/vitest.config.ts'], 'test-results/e2e-summary.json');
}
if (counts.passed === 0) {
  console.error('No test ran: the suites were found empty, which is a failure.');
  process.exit(1);
}
console.log('\nAll gates passed.');
console.log(`${counts.passed} passed, ${counts.failed} failed`);
