// Prints how long evaluateCheck and planFill take on this machine; asserts nothing about time.
import { it } from 'vitest';
import { evaluateCheck, planFill, type Reading, type VesselSpec } from '../src/core/index.ts';
import { testVessel } from '../test/core/check/test-vessel.ts';

// The check-engine tests' invented vessel, upright with torispherical heads for this run.
const vessel: VesselSpec = testVessel({
  tag: 'BENCH-1',
  description: 'benchmark vessel (invented)',
  geometry: { shape: 'vertical-cylinder', innerDiameterM: 1.2, straightLengthM: 2.5, head: { kind: 'torispherical' } },
  tareKg: 1200,
});

function time(label: string, n: number, run: (i: number) => void): void {
  for (let i = 0; i < 20; i++) run(i);
  const t0 = performance.now();
  for (let i = 0; i < n; i++) run(i);
  const ms = (performance.now() - t0) / n;
  console.log(`${label}: ${ms.toFixed(3)} ms per call (${n} calls)`);
}

it('check engine timings', () => {
  time('evaluateCheck, two-phase, weighed', 500, (i) => {
    const reading: Reading = {
      time: '2026-03-14T09:30:00Z',
      temperatureK: 380 + (i % 50),
      pressure: { reference: 'gauge', pressurePa: 1.2e5 },
      weight: { kind: 'gross', grossKg: 2000 + i },
    };
    evaluateCheck(vessel, reading);
  });
  time('planFill, quality target', 500, (i) => {
    planFill(vessel, { targetTemperatureK: 394.15 + (i % 20), startTemperatureK: 293.15, target: { kind: 'quality', quality: 0.01 }, liquidFullMarginK: 5, heaterPowerW: 20e3 });
  });
});
