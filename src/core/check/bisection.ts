// Bisection that lands exactly where plain bisection lands, with fewer evaluations.
//
// The engine's level solve and heat-up temperatures are plain bisections (halve [lo, hi], keep the
// half where f changes sign), and their results are stored: a supervisor's recomputation must give
// the same doubles. Plain bisection evaluates f at every midpoint (40 to 60 of them), which made the
// first check in a fresh process slow (every evaluation runs cold there). This one first closes in
// on the sign change (from the caller's estimate or known points when it has them, else a few
// halvings, then secant steps aimed just past the root: a handful of evaluations), then replays
// the bisection: a midpoint more than a margin below the last point where f was found
// negative must be negative too (f rises), one more than the margin above the first point where f
// was found non-negative must be non-negative, and only midpoints within the margin of the sign
// change are evaluated. If the computed f is within ±fNoise of the true f, a midpoint x below the
// bracket has true f(x) ≤ f(below) − slope·(below − x) < fNoise − slope·(below − x), which is below
// −fNoise once below − x > 2·fNoise/slope; the margin is 8·fNoise/slope (slope across the bracket,
// a factor 4 for a slope that changes away from the root), and never less than minMargin. Each
// caller names its fNoise and why. The engine fixture (test/core/check/engine-outputs.test.ts) holds the results to plain
// bisection's, byte for byte, and test/core/check/bisection.test.ts compares the two directly.

/**
 * Where plain bisection of an increasing f on [lo, hi] ends: repeat `mid = (lo + hi)/2; if f(mid) < 0
 * then lo = mid else hi = mid` while fewer than `maxSteps` steps were taken and hi − lo > stopWidth,
 * then return (lo + hi)/2. f must rise with x (not strictly) and be deterministic, its computed
 * value within ±fNoise(x) (f's unit) of the true one near x; minMargin > 0 (x's unit). `start`, if
 * given, only decides where f is evaluated, never the result (see BisectionStart).
 */
export function bisectionResult(
  f: (x: number) => number,
  lo: number,
  hi: number,
  maxSteps: number,
  stopWidth: number,
  fNoise: (x: number) => number,
  minMargin: number,
  start?: BisectionStart,
): number {
  let below = Number.NaN;
  let above = Number.NaN;
  let fBelow = 0;
  let fAbove = 0;
  // The last two points evaluated, for the secant steps.
  let lastX = Number.NaN;
  let lastF = 0;
  let prevX = Number.NaN;
  let prevF = 0;
  const record = (x: number, fx: number) => {
    prevX = lastX;
    prevF = lastF;
    lastX = x;
    lastF = fx;
    if (fx < 0) {
      if (!(x <= below)) {
        below = x;
        fBelow = fx;
      }
    } else if (!(x >= above)) {
      above = x;
      fAbove = fx;
    }
  };
  // 1a. From the estimate, Newton steps that aim a little past the root (by a quarter of the
  // margin the replay will need there), so that the second or third point usually lands on the
  // other side of the sign change, close to it. A slope that is not positive, a step that leaves
  // (lo, hi), or a sign change that has not shown after a few steps hand over to 1b.
  if (start !== undefined && 'below' in start) {
    if (start.fBelow < 0 && start.fAbove >= 0 && lo <= start.below && start.below < start.above && start.above <= hi) {
      record(start.below, start.fBelow);
      record(start.above, start.fAbove);
    }
  } else if (start !== undefined && start.x > lo && start.x < hi && start.slope > 0 && Number.isFinite(start.slope)) {
    let x = start.x;
    let slope = start.slope;
    for (let k = 0; k < 6; k++) {
      record(x, f(x));
      if (below < above) break;
      if (k > 0 && prevX !== lastX) {
        const secant = (lastF - prevF) / (lastX - prevX);
        if (secant > 0 && Number.isFinite(secant)) slope = secant;
      }
      const push = 0.25 * Math.max(minMargin, (8 * fNoise(x)) / slope);
      x = lastX - lastF / slope + (lastF < 0 ? push : -push);
      if (!(x > lo && x < hi)) break;
    }
    // Noise can put a negative point above a non-negative one; 1b then starts afresh.
    if (!(below < above)) {
      below = above = Number.NaN;
      lastX = prevX = Number.NaN;
    }
  }
  // 1b. Plain bisection until f has been seen negative and non-negative (usually two steps); if
  // one sign never shows, that bisection ran to its end and is the answer.
  if (!(below < above)) {
    let l = lo;
    let h = hi;
    for (let i = 0; i < maxSteps && h - l > stopWidth; i++) {
      const mid = 0.5 * (l + h);
      const fm = f(mid);
      record(mid, fm);
      if (fm < 0) l = mid;
      else h = mid;
      if (below === below && above === above) break;
    }
    if (!(below === below && above === above)) return 0.5 * (l + h);
  }
  // 2. Secant steps on [below, above] until the bracket is narrower than the margin, each aimed a
  // quarter margin past the root it estimates so that the next point lands across the sign
  // change; a step that leaves the bracket, or two steps that did not halve it, bisect instead.
  const marginOf = () => {
    const slope = (fAbove - fBelow) / (above - below);
    return Math.max(minMargin, slope > 0 ? (8 * Math.max(fNoise(below), fNoise(above))) / slope : Infinity);
  };
  let margin = marginOf();
  let width = above - below;
  for (let k = 0; k < 200; k++) {
    // An end where f's noise is unbounded (fNoise Infinity) leaves the margin infinite, and the
    // replay would then evaluate every midpoint: a few steps first, to move that end off.
    if (margin === Infinity ? k >= 12 : !(above - below > margin)) break;
    let slope = (fAbove - fBelow) / (above - below);
    if (prevX === prevX && prevX !== lastX) {
      const secant = (lastF - prevF) / (lastX - prevX);
      if (secant > 0 && Number.isFinite(secant)) slope = secant;
    }
    const estimate = lastX - lastF / slope;
    const push = 0.25 * (margin === Infinity ? minMargin : margin);
    // An estimate within half a margin of one end aims a quarter margin inside the bracket from
    // it, so the bracket closes to under a margin in one step; otherwise past the root, away from
    // the point just evaluated.
    const closing = margin !== Infinity && (estimate >= above - 2 * push || estimate <= below + 2 * push);
    let x = estimate + (lastF < 0 ? push : -push);
    if (closing) x = estimate >= above - 2 * push ? Math.min(estimate, above) - push : Math.max(estimate, below) + push;
    if (!(x > below && x < above) || (!closing && k % 2 === 1 && above - below > 0.5 * width)) x = 0.5 * (below + above);
    if (k % 2 === 1) width = above - below;
    record(x, f(x));
    margin = marginOf();
  }
  // 3. The replay: only midpoints near the sign change are evaluated.
  // Once hi − lo is below an ulp the midpoint is lo or hi again; after the first step each end
  // is a midpoint already decided, so its sign is known without evaluating it twice.
  const low = below - margin;
  const high = above + margin;
  let loDecided = false;
  let hiDecided = false;
  for (let i = 0; i < maxSteps && hi - lo > stopWidth; i++) {
    const mid = 0.5 * (lo + hi);
    const negative = mid < low ? true : mid > high ? false
      : mid === lo && loDecided ? true : mid === hi && hiDecided ? false : f(mid) < 0;
    if (negative) {
      lo = mid;
      loDecided = true;
    } else {
      hi = mid;
      hiDecided = true;
    }
  }
  return 0.5 * (lo + hi);
}

/**
 * Where bisectionResult may begin, instead of halving [lo, hi] until f shows both signs: an
 * estimate of the root with f's slope there (f's unit per x's unit), from which it takes Newton
 * steps; or two points where f's value is already known (stored values, say), f(below) < 0 ≤
 * f(above), exactly what f would return there. Neither changes the result, only how many
 * evaluations it takes; a start that does not hold (a slope that is not positive, points outside
 * [lo, hi] or of the wrong signs) is ignored.
 */
export type BisectionStart = { x: number; slope: number } | { below: number; fBelow: number; above: number; fAbove: number };
