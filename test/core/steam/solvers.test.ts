// solveBracketed: Newton's method with bisection on a bracket.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { solveBracketed } from '../../../src/core/steam/solvers.ts';
import type { ValueAndSlope } from '../../../src/core/steam/solvers.ts';

describe('solveBracketed', () => {
  it('finds the real root of x³ − 2x − 5 (Newton\'s own example; root 2.0945514815423265, from memory)', () => {
    const f: ValueAndSlope = (x, out) => {
      out[0] = x * x * x - 2 * x - 5;
      out[1] = 3 * x * x - 2;
    };
    const x = solveBracketed(f, 2, -1, 3, 16, 2.5, 1e-15, 1e-16);
    expect(x).toBeCloseTo(2.0945514815423265, 14);
  });

  it('falls back to bisection where Newton alone diverges (atan(x − c) from far away)', () => {
    fc.assert(
      fc.property(fc.double({ min: -50, max: 50, noNaN: true }), (c) => {
        const f: ValueAndSlope = (x, out) => {
          out[0] = Math.atan(x - c);
          out[1] = 1 / (1 + (x - c) * (x - c));
        };
        const x = solveBracketed(f, -100, Math.atan(-100 - c), 100, Math.atan(100 - c), 99, 1e-14, 1e-16);
        expect(Math.abs(x - c)).toBeLessThan(1e-12);
      }),
      { numRuns: 200 },
    );
  });

  it('survives a zero slope and a decreasing function, and never leaves the bracket', () => {
    const f: ValueAndSlope = (x, out) => {
      out[0] = 1 - x * x * x; // decreasing, f'(0) = 0
      out[1] = -3 * x * x;
    };
    const x = solveBracketed(f, -1, 2, 3, -26, 0, 1e-15, 1e-16);
    expect(x).toBeCloseTo(1, 12);
    expect(solveBracketed(f, 1, 0, 3, -26, 2, 1e-15, 1e-16)).toBe(1);
  });
});
