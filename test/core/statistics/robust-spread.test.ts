import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { MAD_TO_STANDARD_DEVIATION, median, robustSpread } from '../../../src/core/statistics/robust-spread.ts';
import { normal, words } from './normal-deviates.ts';

describe('median and robust spread', () => {
  it('median of odd and even counts, in any order (definition)', () => {
    expect(median([5, 1, 3])).toBe(3);
    expect(median([4, 1, 3, 2])).toBe(2.5);
    expect(median([7])).toBe(7);
  });
  it('1.4826 × MAD is 1/Φ⁻¹(0.75) × MAD: Φ⁻¹(0.75) = 0.674 490 (standard normal quantile, from memory; scipy re-checks it)', () => {
    expect(1 / MAD_TO_STANDARD_DEVIATION).toBeCloseTo(0.67449, 5);
  });
  it('estimates the standard deviation of normal values: 4,000 deviates with σ = 2.5 give 2.5 within 5 % (definition of the scale; fast-check deviates)', () => {
    const [w] = fc.sample(words(8000), 1);
    const values = Array.from({ length: 4000 }, (_, i) => 10 + 2.5 * normal(w![2 * i]!, w![2 * i + 1]!));
    const s = robustSpread(values);
    expect(s.median).toBeCloseTo(10, 0);
    expect(Math.abs(s.standardDeviation / 2.5 - 1)).toBeLessThan(0.05);
  });
  it('a few wild values barely move it (fast-check)', () => {
    fc.assert(fc.property(fc.array(fc.double({ min: -1, max: 1, noNaN: true }), { minLength: 40, maxLength: 60 }), fc.double({ min: 1e3, max: 1e9, noNaN: true }), (values, wild) => {
      const clean = robustSpread(values);
      const spoiled = robustSpread([...values, wild, -wild, wild]);
      return Math.abs(spoiled.median - clean.median) <= 1 && spoiled.standardDeviation <= 3;
    }));
  });
  it('more than half equal: the mean absolute deviation takes over; all equal gives 0', () => {
    const s = robustSpread([1, 1, 1, 1, 1, 1, 3, -1]);
    expect(s.median).toBe(1);
    expect(s.standardDeviation).toBeCloseTo(Math.sqrt(Math.PI / 2) * (4 / 8), 12);
    expect(robustSpread([2, 2, 2]).standardDeviation).toBe(0);
  });
});
