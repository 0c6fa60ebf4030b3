// Gauss–Legendre quadrature: the n-point rule on [0, 1] integrates every polynomial of degree up to
// 2n − 1 exactly, and converges geometrically for functions analytic near the interval.

/**
 * Nodes and weights of n-point Gauss–Legendre quadrature on [0, 1]: the roots of the Legendre
 * polynomial P_n, by Newton's method on the three-term recurrence from the usual starting values
 * cos(π(i − ¼)/(n + ½)) (the textbook construction; the test checks that the rule integrates
 * every polynomial up to degree 2n − 1 exactly).
 */
export function gaussLegendre(n: number): [Float64Array, Float64Array] {
  const x = new Float64Array(n);
  const w = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let z = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let dp = 0;
    for (let k = 0; k < 100; k++) {
      let p0 = 1;
      let p1 = z;
      for (let j = 2; j <= n; j++) {
        const p2 = ((2 * j - 1) * z * p1 - (j - 1) * p0) / j;
        p0 = p1;
        p1 = p2;
      }
      dp = (n * (z * p1 - p0)) / (z * z - 1);
      const step = p1 / dp;
      z -= step;
      if (Math.abs(step) <= 1e-16) break;
    }
    x[i] = 0.5 * (1 - z);
    w[i] = 1 / ((1 - z * z) * dp * dp);
  }
  return [x, w];
}
