// Prints how long the instrument functions take on this machine; asserts nothing about time.
// driftFromLog runs once per vessel and instrument pair when a check is saved or Review opens, over
// the checks since the last calibration: logs of 40, 400 and 4,000 checks (generated test logs,
// invented; see test/core/instrument/generated-log.ts).
import { it } from 'vitest';
import fc from 'fast-check';
import { driftFromLog, instrumentLimit, MS_PER_DAY, type InstrumentSpec } from '../src/core/instrument/index.ts';
import { buildLog, LOG_START_MS, MONTH_MS, rawLog } from '../test/core/instrument/generated-log.ts';

function time(label: string, n: number, run: (i: number) => void): void {
  for (let i = 0; i < Math.min(20, n); i++) run(i);
  const t0 = performance.now();
  for (let i = 0; i < n; i++) run(i);
  const us = ((performance.now() - t0) / n) * 1000;
  console.log(`${label}: ${us.toFixed(1)} µs per call (${n} calls)`);
}

it('instrument timings', () => {
  const rtd: InstrumentSpec = { tag: 'TE-B', kind: 'rtd', range: { low: 273.15, high: 473.15 }, tolerance: { kind: 'iec-60751', sensorClass: 'A' } };
  const history = [{ timeMs: LOG_START_MS, asFoundError: 0.3, asLeftError: 0.05 }, { timeMs: LOG_START_MS + 365 * MS_PER_DAY, asFoundError: 0.2 }];
  time('instrumentLimit, RTD with two calibrations', 20_000, (i) => {
    instrumentLimit(rtd, history, { nowMs: LOG_START_MS + (400 + (i % 100)) * MS_PER_DAY, readingValue: 394.15 + (i % 10) });
  });
  for (const count of [40, 400, 4000]) {
    const [raw] = fc.sample(rawLog(count, count), { numRuns: 1, seed: count });
    const { checks } = buildLog(raw!, { biasPa: 2000, driftPaPerMonth: 300 });
    time(`driftFromLog, ${count} checks`, count >= 4000 ? 50 : 500, () => {
      driftFromLog(checks, { nextCalibrationDueMs: LOG_START_MS + 24 * MONTH_MS });
    });
  }
});
