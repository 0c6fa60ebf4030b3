import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { logGamma, regularizedIncompleteBeta, studentTCdf, studentTCritical } from '../../../src/core/statistics/student-t.ts';

describe("Student's t critical values", () => {
  // Two-sided 95 % and 99 % critical values as printed in the t tables of statistics handbooks
  // (NIST/SEMATECH e-Handbook of Statistical Methods §1.3.6.7.2, "Critical values of Student's t";
  // the values from memory, to the 3 decimals printed; scipy.stats.t re-checks them to 1e-8 in
  // test/reference/statistics-scipy.test.ts).
  const table: [number, number, number][] = [
    [1, 12.706, 63.657], [2, 4.303, 9.925], [3, 3.182, 5.841], [5, 2.571, 4.032], [10, 2.228, 3.169],
    [20, 2.086, 2.845], [30, 2.042, 2.750], [100, 1.984, 2.626],
  ];
  it.each(table)('ν = %s: 95 %% → %s, 99 %% → %s (handbook t table, from memory)', (nu, t95, t99) => {
    expect(studentTCritical(0.95, nu)).toBeCloseTo(t95, 3);
    expect(studentTCritical(0.99, nu)).toBeCloseTo(t99, 3);
  });
  it('tends to the normal values 1.960 and 2.576 for large ν (standard normal quantiles, from memory)', () => {
    expect(studentTCritical(0.95, 1e6)).toBeCloseTo(1.95996, 4);
    expect(studentTCritical(0.99, 1e6)).toBeCloseTo(2.57583, 4);
  });
  it('falls as ν grows and rises with the confidence, for real ν (fast-check; properties of the t distribution)', () => {
    fc.assert(fc.property(fc.double({ min: 1, max: 500, noNaN: true }), fc.double({ min: 0.5, max: 0.999, noNaN: true }), (nu, c) => {
      const t = studentTCritical(c, nu);
      return Number.isFinite(t) && studentTCritical(c, nu * 1.5) < t && studentTCritical(Math.min(c + 0.0005, 0.9995), nu) > t;
    }), { numRuns: 200 });
  });
});

describe("Student's t distribution function", () => {
  it('ν = 1 is the Cauchy distribution, F(t) = ½ + atan(t)/π (closed form, fast-check)', () => {
    fc.assert(fc.property(fc.double({ min: -1e4, max: 1e4, noNaN: true }), (t) => Math.abs(studentTCdf(t, 1) - (0.5 + Math.atan(t) / Math.PI)) < 1e-12));
  });
  it('ν = 2: F(t) = ½ + t/(2·√(2 + t²)) (closed form, fast-check)', () => {
    fc.assert(fc.property(fc.double({ min: -1e3, max: 1e3, noNaN: true }), (t) => Math.abs(studentTCdf(t, 2) - (0.5 + t / (2 * Math.sqrt(2 + t * t)))) < 1e-12));
  });
  it('is symmetric: F(−t) = 1 − F(t) (fast-check; definition)', () => {
    fc.assert(fc.property(fc.double({ min: -50, max: 50, noNaN: true }), fc.double({ min: 1, max: 200, noNaN: true }), (t, nu) =>
      Math.abs(studentTCdf(-t, nu) - (1 - studentTCdf(t, nu))) < 1e-12));
  });
  it('the critical value inverts it: F(t_c) = ½ + c/2 (fast-check; definition)', () => {
    fc.assert(fc.property(fc.double({ min: 1, max: 300, noNaN: true }), fc.double({ min: 0.05, max: 0.999, noNaN: true }), (nu, c) =>
      Math.abs(studentTCdf(studentTCritical(c, nu), nu) - (0.5 + c / 2)) < 1e-10), { numRuns: 200 });
  });
});

describe('ln Γ and the incomplete beta function', () => {
  it('Γ(n) = (n − 1)! and Γ(½) = √π (definition; A&S 6.1.6, 6.1.8, from memory)', () => {
    let factorial = 1;
    for (let n = 1; n <= 30; n++) {
      expect(logGamma(n)).toBeCloseTo(Math.log(factorial), 11);
      factorial *= n;
    }
    expect(logGamma(0.5)).toBeCloseTo(0.5 * Math.log(Math.PI), 13);
  });
  it('ln Γ(x + 1) = ln Γ(x) + ln x (fast-check; the recurrence)', () => {
    fc.assert(fc.property(fc.double({ min: 1e-3, max: 1e4, noNaN: true }), (x) => Math.abs(logGamma(x + 1) - logGamma(x) - Math.log(x)) < 1e-11 * Math.max(1, Math.abs(logGamma(x + 1)))));
  });
  it('I_x(a, 1) = xᵃ, I_x(1, b) = 1 − (1 − x)ᵇ and I_x(a, b) = 1 − I_(1−x)(b, a) (closed forms and symmetry, fast-check)', () => {
    fc.assert(fc.property(fc.double({ min: 0.001, max: 0.999, noNaN: true }), fc.double({ min: 0.1, max: 50, noNaN: true }), fc.double({ min: 0.1, max: 50, noNaN: true }), (x, a, b) =>
      Math.abs(regularizedIncompleteBeta(x, a, 1) - x ** a) < 1e-12 &&
      Math.abs(regularizedIncompleteBeta(x, 1, b) - (1 - (1 - x) ** b)) < 1e-12 &&
      Math.abs(regularizedIncompleteBeta(x, a, b) - (1 - regularizedIncompleteBeta(1 - x, b, a))) < 1e-12));
  });
  it('is 0 at x = 0 and 1 at x = 1 (definition)', () => {
    expect(regularizedIncompleteBeta(0, 2, 3)).toBe(0);
    expect(regularizedIncompleteBeta(1, 2, 3)).toBe(1);
  });
});
