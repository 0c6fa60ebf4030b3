# Recomputes check-engine figures with Debian's python3-iapws (IAPWS97 class; units K, MPa,
# kJ/kg, m³/kg) for the cases given on stdin as JSON, and prints the answers as JSON.
# Run by test/reference/check-engine-iapws.test.ts with /usr/bin/python3.
import json
import sys

from iapws import IAPWS97


def bisect(f, lo, hi):
    for _ in range(60):
        mid = 0.5 * (lo + hi)
        if f(mid) < 0:
            lo = mid
        else:
            hi = mid
    return 0.5 * (lo + hi)


def case(c):
    T, V, m, atm = c["T"], c["V"], c["m"], c["atmPa"] / 1e6
    f, g = IAPWS97(T=T, x=0), IAPWS97(T=T, x=1)
    v = V / m
    x = (v - f.v) / (g.v - f.v)
    fa, ga = IAPWS97(P=atm, x=0), IAPWS97(P=atm, x=1)
    flash = max(0.0, (f.h - fa.h) / (ga.h - fa.h))
    u1 = f.u + x * (g.u - f.u)
    s1 = f.s + x * (g.s - f.s)
    end = IAPWS97(P=atm, s=s1)
    work = max(0.0, (u1 - end.u) * 1e3 * m) if f.P > atm else 0.0
    t_full = None
    if v < 1 / 322:
        t_full = bisect(lambda t: IAPWS97(T=t, x=0).v - v, 277.14, 647.09)
    return {
        "quality": x,
        "liquidMassKg": (1 - x) * m,
        "saturationPressurePa": f.P * 1e6,
        "flashFraction": flash,
        "expansionWorkJ": work,
        "liquidFullTemperatureK": t_full,
        "dryChargeKg": V / g.v,
    }


print(json.dumps([case(c) for c in json.load(sys.stdin)]))
