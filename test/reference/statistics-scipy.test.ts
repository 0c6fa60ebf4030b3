// The core's statistics (src/core/statistics) against Debian's python3-scipy, run live with
// /usr/bin/python3 (script statistics-scipy.py beside this file): Student's t critical values and
// distribution function for real degrees of freedom, the regularised incomplete beta function,
// ln Γ, the MAD scale, and the least-squares line and its standard error.
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  logGamma, MAD_TO_STANDARD_DEVIATION, regularizedIncompleteBeta, serialTrend, studentTCdf, studentTCritical,
} from '../../src/core/index.ts';

const SCRIPT = fileURLToPath(new URL('./statistics-scipy.py', import.meta.url));

const critical: [number, number][] = [];
for (const c of [0.8, 0.95, 0.99, 0.999]) for (const df of [1, 1.37, 2, 2.5, 4, 7.3, 12, 30.6, 100, 1000]) critical.push([c, df]);
const cdf = fc.sample(fc.tuple(fc.double({ min: -40, max: 40, noNaN: true }), fc.double({ min: 1, max: 300, noNaN: true })), { numRuns: 60, seed: 13 });
const beta = fc.sample(fc.tuple(fc.double({ min: 0.001, max: 0.999, noNaN: true }), fc.double({ min: 0.2, max: 80, noNaN: true }), fc.double({ min: 0.2, max: 80, noNaN: true })), { numRuns: 60, seed: 17 });
const gammaln = [0.01, 0.3, 0.5, 1, 1.5, 2.75, 9.9, 10, 31.2, 500, 1e5];
// Times as running sums of gaps of 0.1 to 5 days, in seconds, like a log's.
const lines = fc.sample(fc.array(fc.tuple(fc.double({ min: 8640, max: 432000, noNaN: true }), fc.double({ min: -1e4, max: 1e4, noNaN: true })), { minLength: 5, maxLength: 50 }), { numRuns: 12, seed: 19 })
  .map((pairs) => {
    let t = 0;
    return [pairs.map((p) => (t += p[0])), pairs.map((p) => p[1])] as [number[], number[]];
  });

interface Answer {
  critical: number[];
  cdf: number[];
  beta: number[];
  gammaln: number[];
  lines: { slope: number; meanY: number; slopeStandardError: number }[];
  normalQuartile: number;
}

function scipy(): Answer {
  const r = spawnSync('/usr/bin/python3', [SCRIPT], { input: JSON.stringify({ critical, cdf, beta, gammaln, lines }), encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`python3-scipy failed: ${r.stderr}`);
  return JSON.parse(r.stdout) as Answer;
}

describe('statistics against python3-scipy (/usr/bin/python3)', () => {
  const a = scipy();
  it('t critical values, real ν from 1 to 1000, 80 % to 99.9 %: to 1e-8 relative (scipy.stats.t.ppf)', () => {
    critical.forEach(([c, df], i) => expect(Math.abs(studentTCritical(c, df) / a.critical[i]! - 1), `c=${c} ν=${df}`).toBeLessThan(1e-8));
  });
  it('t distribution function: to 1e-12 absolute (scipy.stats.t.cdf)', () => {
    cdf.forEach(([t, df], i) => expect(Math.abs(studentTCdf(t, df) - a.cdf[i]!), `t=${t} ν=${df}`).toBeLessThan(1e-12));
  });
  it('regularised incomplete beta: to 1e-11 absolute (scipy.special.betainc)', () => {
    beta.forEach(([x, p, q], i) => expect(Math.abs(regularizedIncompleteBeta(x, p, q) - a.beta[i]!), `x=${x} a=${p} b=${q}`).toBeLessThan(1e-11));
  });
  it('ln Γ: to 1e-12 relative or absolute (scipy.special.gammaln)', () => {
    gammaln.forEach((x, i) => expect(Math.abs(logGamma(x) - a.gammaln[i]!), `x=${x}`).toBeLessThan(1e-12 * Math.max(1, Math.abs(a.gammaln[i]!))));
  });
  it('the MAD scale 1/Φ⁻¹(0.75) (scipy.stats.norm.ppf)', () => {
    expect(MAD_TO_STANDARD_DEVIATION * a.normalQuartile).toBeCloseTo(1, 12);
  });
  it('the line: slope and mean as least squares, and the slope standard error = scipy.stats.linregress stderr × √inflation', () => {
    lines.forEach(([xs, ys], i) => {
      const t = serialTrend(xs, ys);
      const ref = a.lines[i]!;
      const scale = Math.max(1, Math.abs(ref.slope));
      expect(Math.abs(t.slope!.value - ref.slope) / scale).toBeLessThan(1e-9);
      expect(Math.abs(t.mean - ref.meanY)).toBeLessThan(1e-9 * Math.max(1, Math.abs(ref.meanY)));
      expect(t.slope!.standardError / Math.sqrt(t.inflation) / ref.slopeStandardError).toBeCloseTo(1, 9);
    });
  });
});
