// Two-sided 95 % quantiles of Student's t distribution, for the confidence band of a least-squares
// slope from few readings (a leak test has a handful).

/**
 * t(0.975, ν) for ν = 1 … 30, 40, 60, 120 and ∞, dimensionless: computed with scipy.stats.t.ppf
 * (Debian python3-scipy) to six decimals; to three decimals they are the printed values of the usual
 * t tables (e.g. NIST/SEMATECH e-Handbook of Statistical Methods, §1.3.6.7.2, from memory). The
 * last entry is the normal quantile 1.959964. test/reference/student-t-scipy.test.ts checks every ν
 * from 1 to 400 against scipy live.
 */
const DEGREES = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15, 16, 17, 18, 19, 20, 21, 22, 23, 24, 25, 26, 27, 28, 29, 30, 40, 60, 120] as const;
const T_975 = [
  12.706205, 4.302653, 3.182446, 2.776445, 2.570582, 2.446912, 2.364624, 2.306004, 2.262157, 2.228139,
  2.200985, 2.178813, 2.160369, 2.144787, 2.131450, 2.119905, 2.109816, 2.100922, 2.093024, 2.085963,
  2.079614, 2.073873, 2.068658, 2.063899, 2.059539, 2.055529, 2.051831, 2.048407, 2.045230, 2.042272,
  2.021075, 2.000298, 1.979930,
] as const;
const T_975_INFINITE = 1.959964;

/**
 * t(0.975, ν) for whole ν ≥ 1: tabulated up to 30; between the entries above that, linear in 1/ν
 * (the usual way to read a t table between its rows; error below 1e-4 here, measured against scipy).
 */
export function studentT975(degreesOfFreedom: number): number {
  const nu = Math.floor(degreesOfFreedom);
  if (nu < 1) throw new RangeError('studentT975: at least 1 degree of freedom');
  if (nu <= 30) return T_975[nu - 1]!;
  for (let i = 30; i < DEGREES.length; i++) {
    const hi = DEGREES[i]!;
    if (nu <= hi) return between(DEGREES[i - 1]!, T_975[i - 1]!, hi, T_975[i]!, nu);
  }
  // Beyond 120: toward the normal quantile at 1/ν = 0.
  const last = DEGREES.length - 1;
  const a = 1 / DEGREES[last]!;
  return T_975_INFINITE + ((T_975[last]! - T_975_INFINITE) * (1 / nu)) / a;
}

function between(nuLo: number, tLo: number, nuHi: number, tHi: number, nu: number): number {
  const u = (1 / nu - 1 / nuHi) / (1 / nuLo - 1 / nuHi);
  return tHi + u * (tLo - tHi);
}
