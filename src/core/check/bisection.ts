// Bisection that lands exactly where plain bisection lands, with fewer evaluations.
//
// The engine's level solve and heat-up temperatures are plain bisections (halve [lo, hi], keep the
// half where f changes sign), and their results are stored: a supervisor's recomputation must give
// the same doubles. Plain bisection evaluates f at every midpoint (40 to 60 of them), which made the
// first check in a fresh process slow (every evaluation runs cold there). This one first closes in
// on the sign change with the Illinois variant of regula falsi (a handful of evaluations), then
// replays the bisection: a midpoint more than a margin below the last point where f was found
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
 * value within ±fNoise(x) (f's unit) of the true one near x; minMargin > 0 (x's unit).
 */
export function bisectionResult(
  f: (x: number) => number,
  lo: number,
  hi: number,
  maxSteps: number,
  stopWidth: number,
  fNoise: (x: number) => number,
  minMargin: number,
): number {
  // 1. Plain bisection until f has been seen negative and non-negative (usually two steps); if
  // one sign never shows, that bisection ran to its end and is the answer.
  let below = Number.NaN;
  let above = Number.NaN;
  let fBelow = 0;
  let fAbove = 0;
  let l = lo;
  let h = hi;
  for (let i = 0; i < maxSteps && h - l > stopWidth; i++) {
    const mid = 0.5 * (l + h);
    const fm = f(mid);
    if (fm < 0) {
      l = below = mid;
      fBelow = fm;
    } else {
      h = above = mid;
      fAbove = fm;
    }
    if (below === below && above === above) break;
  }
  if (!(below === below && above === above)) return 0.5 * (l + h);
  // 2. Illinois on [below, above] until the bracket is narrower than the margin.
  const marginOf = () => {
    const slope = (fAbove - fBelow) / (above - below);
    return Math.max(minMargin, slope > 0 ? (8 * Math.max(fNoise(below), fNoise(above))) / slope : Infinity);
  };
  let margin = marginOf();
  let side = 0;
  let a = fBelow;
  let b = fAbove;
  let width = above - below;
  for (let k = 0; k < 200 && above - below > margin; k++) {
    let x = (below * b - above * a) / (b - a);
    // Halve instead when the secant leaves the bracket, or when two secant steps did not halve
    // it: Illinois can creep from one side.
    if (!(x > below && x < above) || (k % 2 === 1 && above - below > 0.5 * width)) x = 0.5 * (below + above);
    if (k % 2 === 1) width = above - below;
    const fx = f(x);
    if (fx < 0) {
      below = x;
      fBelow = a = fx;
      if (side === -1) b *= 0.5;
      side = -1;
    } else {
      above = x;
      fAbove = b = fx;
      if (side === 1) a *= 0.5;
      side = 1;
    }
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
