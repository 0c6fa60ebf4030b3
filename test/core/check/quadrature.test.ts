import { describe, expect, it } from 'vitest';
import { gaussLegendre } from '../../../src/core/check/quadrature.ts';

describe('gaussLegendre', () => {
  it('the n-point rule integrates x^k on [0, 1] to 1/(k + 1) for every k ≤ 2n − 1 (the defining property of Gauss–Legendre quadrature)', () => {
    for (const n of [1, 2, 5, 24]) {
      const [x, w] = gaussLegendre(n);
      for (let k = 0; k <= 2 * n - 1; k++) {
        let sum = 0;
        for (let i = 0; i < n; i++) sum += (w[i] as number) * (x[i] as number) ** k;
        expect(sum).toBeCloseTo(1 / (k + 1), 13);
      }
      // and not the next degree (while its error is above rounding): the rule is Gauss's, not a finer one
      if (n <= 5) {
        let next = 0;
        for (let i = 0; i < n; i++) next += (w[i] as number) * (x[i] as number) ** (2 * n);
        expect(Math.abs(next - 1 / (2 * n + 1))).toBeGreaterThan(1e-6);
      }
    }
  });
  it('nodes lie inside (0, 1) and the weights are positive and sum to 1', () => {
    const [x, w] = gaussLegendre(24);
    expect(Math.min(...x)).toBeGreaterThan(0);
    expect(Math.max(...x)).toBeLessThan(1);
    expect(Math.min(...w)).toBeGreaterThan(0);
    expect(w.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 14);
  });
});
