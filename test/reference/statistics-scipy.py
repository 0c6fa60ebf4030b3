# Recomputes the core's statistics with Debian's python3-scipy for the cases given on stdin as JSON
# and prints the answers as JSON. Run by test/reference/statistics-scipy.test.ts with /usr/bin/python3.
#   critical: [[confidence, df], ...]  -> scipy.stats.t.ppf(0.5 + confidence/2, df)
#   cdf:      [[t, df], ...]           -> scipy.stats.t.cdf(t, df)
#   beta:     [[x, a, b], ...]         -> scipy.special.betainc(a, b, x)
#   gammaln:  [x, ...]                 -> scipy.special.gammaln(x)
#   lines:    [[xs, ys], ...]          -> scipy.stats.linregress(xs, ys): slope, intercept at mean x, stderr
#   normalQuartile                     -> scipy.stats.norm.ppf(0.75)
import json
import sys

from scipy import special, stats

q = json.load(sys.stdin)
lines = []
for xs, ys in q["lines"]:
    r = stats.linregress(xs, ys)
    mx = sum(xs) / len(xs)
    lines.append({"slope": r.slope, "meanY": r.intercept + r.slope * mx, "slopeStandardError": r.stderr})
print(json.dumps({
    "critical": [float(stats.t.ppf(0.5 + c / 2, df)) for c, df in q["critical"]],
    "cdf": [float(stats.t.cdf(t, df)) for t, df in q["cdf"]],
    "beta": [float(special.betainc(a, b, x)) for x, a, b in q["beta"]],
    "gammaln": [float(special.gammaln(x)) for x in q["gammaln"]],
    "lines": lines,
    "normalQuartile": float(stats.norm.ppf(0.75)),
}))
