// The leak rate's statistics against Debian's python3-scipy, run live with /usr/bin/python3: the
// Student t quantiles t(0.975, ν) for ν = 1 … 400 (scipy.stats.t.ppf), and the slope and its 95 %
// half-width for noisy vacuum holds (scipy.stats.linregress: slope, stderr).
import { spawnSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { vacuumLeakRate } from '../../src/core/index.ts';
import { studentT975 } from '../../src/core/periodic-tests/student-t.ts';

function python<T>(program: string, input: unknown): T {
  const r = spawnSync('/usr/bin/python3', ['-c', program], { input: JSON.stringify(input), encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`python3-scipy failed: ${r.stderr}`);
  return JSON.parse(r.stdout) as T;
}

describe('Student t quantiles against scipy.stats.t.ppf (python3-scipy)', () => {
  const nus = Array.from({ length: 400 }, (_, i) => i + 1);
  const want = python<number[]>('import json,sys\nfrom scipy.stats import t\nprint(json.dumps([t.ppf(0.975, n) for n in json.load(sys.stdin)]))', nus);
  it('agree to 5e-7 where tabulated (ν ≤ 30, 40, 60, 120) and to 1e-4 relative between the rows', () => {
    nus.forEach((nu, i) => {
      const tabulated = nu <= 30 || nu === 40 || nu === 60 || nu === 120;
      const err = Math.abs(studentT975(nu) - want[i]!);
      if (tabulated) expect(err).toBeLessThan(5e-7);
      else expect(err / want[i]!).toBeLessThan(1e-4);
    });
  });
});

describe('leak rate against scipy.stats.linregress (python3-scipy)', () => {
  // Invented vacuum holds: a leak rate, a start pressure and reading scatter, read every 30 s to 60 s.
  const holds = fc.sample(fc.record({
    rate: fc.double({ min: -20, max: 300, noNaN: true }),
    p0: fc.double({ min: 3000, max: 8000, noNaN: true }),
    n: fc.integer({ min: 3, max: 25 }),
    step: fc.integer({ min: 30, max: 60 }),
    noise: fc.array(fc.double({ min: -40, max: 40, noNaN: true }), { minLength: 25, maxLength: 25 }),
  }), { numRuns: 30, seed: 12 }).map(({ rate, p0, n, step, noise }) =>
    Array.from({ length: n }, (_, i) => ({ timeS: i * step, absolutePressurePa: p0 + (rate * i * step) / 60 + noise[i]! })));
  const want = python<{ slope: number; half: number }[]>(
    'import json,sys\nfrom scipy.stats import linregress, t\nout=[]\nfor h in json.load(sys.stdin):\n' +
      '  r=linregress([x["timeS"] for x in h],[x["absolutePressurePa"] for x in h])\n' +
      '  out.append({"slope": r.slope*60, "half": t.ppf(0.975, len(h)-2)*r.stderr*60})\nprint(json.dumps(out))', holds);
  it('slope to 1e-9 Pa/min and the 95 % half-width to 1e-6 relative', () => {
    holds.forEach((h, i) => {
      const r = vacuumLeakRate(h);
      expect(Math.abs(r.paPerMinute - want[i]!.slope)).toBeLessThan(1e-9);
      expect(Math.abs(r.statisticalPaPerMinute - want[i]!.half)).toBeLessThanOrEqual(1e-6 * want[i]!.half + 1e-9);
    });
  });
});
