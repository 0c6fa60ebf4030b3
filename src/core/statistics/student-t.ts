// Student's t distribution: the cumulative distribution and its inverse for any real number of
// degrees of freedom ν ≥ 1 (an effective sample size is rarely a whole number). Built from the
// regularised incomplete beta function, F(t) = 1 − ½·I_{ν/(ν+t²)}(ν/2, ½) for t ≥ 0
// (Abramowitz & Stegun, Handbook of Mathematical Functions, 26.7.1 with 26.5.1; from memory),
// evaluated by its continued fraction (A&S 26.5.8) with the modified Lentz method, and ln Γ by
// Stirling's series (A&S 6.1.41). Checked against scipy.stats.t in
// test/reference/statistics-scipy.test.ts. The core cannot import a statistics package (its
// tsconfig resolves nothing outside src/core), hence these few functions.

/**
 * Stirling's series for ln Γ(x), A&S 6.1.41: coefficients B_2k / (2k·(2k − 1)) for k = 1 … 6,
 * exact rationals from the Bernoulli numbers B_2 = 1/6, B_4 = −1/30, B_6 = 1/42, B_8 = −1/30,
 * B_10 = 5/66, B_12 = −691/2730. Dimensionless.
 */
const STIRLING = [1 / 12, -1 / 360, 1 / 1260, -1 / 1680, 1 / 1188, -691 / 360360] as const;

/** Below this the argument is raised by the recurrence Γ(x + 1) = x·Γ(x): at x ≥ 10 the next term, 3617/122400/x¹³, is below 1e-14. */
const STIRLING_FROM = 10;

const HALF_LN_TWO_PI = 0.5 * Math.log(2 * Math.PI);

/** ln Γ(x) for x > 0 (finite), to about 1e-14 absolute. */
export function logGamma(x: number): number {
  let shift = 0;
  let z = x;
  while (z < STIRLING_FROM) {
    shift += Math.log(z);
    z += 1;
  }
  const inv = 1 / z;
  const inv2 = inv * inv;
  let series = 0;
  for (let k = STIRLING.length - 1; k >= 0; k--) series = series * inv2 + STIRLING[k]!;
  return (z - 0.5) * Math.log(z) - z + HALF_LN_TWO_PI + series * inv - shift;
}

/** Continued fraction of the incomplete beta function (A&S 26.5.8), modified Lentz; converges fast for x < (a + 1)/(a + b + 2). */
function betaContinuedFraction(x: number, a: number, b: number): number {
  const tiny = 1e-300;
  let c = 1;
  let d = 1 - ((a + b) * x) / (a + 1);
  if (Math.abs(d) < tiny) d = tiny;
  d = 1 / d;
  let f = d;
  for (let m = 1; m <= 300; m++) {
    const m2 = 2 * m;
    // even step
    let num = (m * (b - m) * x) / ((a + m2 - 1) * (a + m2));
    d = 1 + num * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + num / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    f *= d * c;
    // odd step
    num = (-(a + m) * (a + b + m) * x) / ((a + m2) * (a + m2 + 1));
    d = 1 + num * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + num / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const step = d * c;
    f *= step;
    if (Math.abs(step - 1) < 1e-15) break;
  }
  return f;
}

/**
 * The regularised incomplete beta function I_x(a, b), 0 ≤ x ≤ 1, a > 0, b > 0. `complement` is
 * 1 − x when the caller has it more exactly than 1 − x can be formed (x close to 1).
 */
export function regularizedIncompleteBeta(x: number, a: number, b: number, complement = 1 - x): number {
  if (x <= 0) return 0;
  if (complement <= 0) return 1;
  const front = Math.exp(logGamma(a + b) - logGamma(a) - logGamma(b) + a * Math.log(x) + b * Math.log(complement));
  // The fraction converges quickly on one side of the mean a/(a + b); use the symmetry I_x(a, b) = 1 − I_{1−x}(b, a) on the other.
  if (x < (a + 1) / (a + b + 2)) return (front * betaContinuedFraction(x, a, b)) / a;
  return 1 - (front * betaContinuedFraction(complement, b, a)) / b;
}

/** P(T ≤ t) for Student's t with ν degrees of freedom (ν > 0, t finite). */
export function studentTCdf(t: number, degreesOfFreedom: number): number {
  const nu = degreesOfFreedom;
  const t2 = t * t;
  // x = ν/(ν + t²) is within rounding of 1 for small t; its complement t²/(ν + t²) keeps the digits.
  const tail = 0.5 * regularizedIncompleteBeta(nu / (nu + t2), nu / 2, 0.5, t2 / (nu + t2));
  return t >= 0 ? 1 - tail : tail;
}

/**
 * The two-sided critical value: t such that P(|T| ≤ t) = confidence, for ν ≥ 1 degrees of freedom
 * (real) and 0 < confidence < 1. Bisection on the distribution function to 1e-12 relative.
 */
export function studentTCritical(confidence: number, degreesOfFreedom: number): number {
  const target = 0.5 + confidence / 2;
  let lo = 0;
  let hi = 2;
  while (studentTCdf(hi, degreesOfFreedom) < target) {
    lo = hi;
    hi *= 2;
  }
  for (let i = 0; i < 200 && hi - lo > 1e-12 * hi; i++) {
    const mid = 0.5 * (lo + hi);
    if (studentTCdf(mid, degreesOfFreedom) < target) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}
