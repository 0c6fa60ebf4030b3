// Normal deviates for the statistical tests, from unbiased 32-bit integers drawn by fast-check (so
// the project's fixed seed fixes every series) and the Box–Muller transform (Box & Muller, Ann.
// Math. Statist. 29 (1958) 610; from memory): two uniforms on (0, 1) to one standard normal.
import fc from 'fast-check';

/** fast-check arbitrary: `count` unbiased 32-bit integers. */
export function words(count: number): fc.Arbitrary<number[]> {
  return fc.noBias(fc.array(fc.noBias(fc.integer({ min: 0, max: 0xffffffff })), { minLength: count, maxLength: count }));
}

/** A uniform on (0, 1) from a 32-bit integer. */
export const uniform = (w: number) => (w + 0.5) / 4294967296;

/** One standard normal deviate from two 32-bit integers. */
export const normal = (a: number, b: number) => Math.sqrt(-2 * Math.log(uniform(a))) * Math.cos(2 * Math.PI * uniform(b));

/** An AR(1) series of m standard-normal-variance values with lag-1 correlation rho, from 2m integers. */
export function ar1Series(w: readonly number[], m: number, rho: number): number[] {
  const out: number[] = [];
  let e = 0;
  for (let i = 0; i < m; i++) {
    const z = normal(w[2 * i]!, w[2 * i + 1]!);
    e = i === 0 ? z : rho * e + Math.sqrt(1 - rho * rho) * z;
    out.push(e);
  }
  return out;
}
