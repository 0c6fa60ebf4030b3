# Recomputes the supply-steam test figures with Debian's python3-iapws (IAPWS97 class; units K, MPa,
# kJ/kg) for the cases given on stdin as JSON, and prints the answers as JSON. Run by
# test/reference/periodic-tests-iapws.test.ts with /usr/bin/python3.
#   throttling: x = (h(p2, T2) - h_f(p1)) / (h_g(p1) - h_f(p1))
#   expansion:  T2 from IAPWS97(P=p2, h=h_f(p1) + x*h_fg(p1)); superheat = T2 - T_sat(p2) (0 when wet)
#   flask:      D = ((T1 - T0)*(c*Mw + A)/Mc - c*(Ts - T1)) / L with Ts, L = h_g - h_f at the supply pressure
import json
import sys

from iapws import IAPWS97
from iapws.iapws97 import _TSat_P


def throttling(c):
    p1, p2, T2 = c["p1Pa"] / 1e6, c["p2Pa"] / 1e6, c["T2"]
    f, g = IAPWS97(P=p1, x=0), IAPWS97(P=p1, x=1)
    h2 = IAPWS97(P=p2, T=T2).h
    return {"dryness": (h2 - f.h) / (g.h - f.h)}


def expansion(c):
    p1, p2, x = c["p1Pa"] / 1e6, c["p2Pa"] / 1e6, c["x"]
    f, g = IAPWS97(P=p1, x=0), IAPWS97(P=p1, x=1)
    h = f.h + x * (g.h - f.h)
    ts = _TSat_P(p2)
    if h <= IAPWS97(P=p2, x=1).h:
        return {"temperatureK": ts, "superheatK": 0.0}
    t2 = IAPWS97(P=p2, h=h).T
    return {"temperatureK": t2, "superheatK": t2 - ts}


def flask(c):
    p = c["supplyPressurePa"] / 1e6
    f, g = IAPWS97(P=p, x=0), IAPWS97(P=p, x=1)
    ts = _TSat_P(p)
    latent = (g.h - f.h) * 1e3
    cw = 4180.0
    mw = c["massBeforeKg"] - c["emptyFlaskMassKg"]
    mc = c["massAfterKg"] - c["massBeforeKg"]
    t0, t1 = c["temperatureBeforeK"], c["temperatureAfterK"]
    d = ((t1 - t0) * (cw * mw + c["flaskHeatCapacityJPerK"]) / mc - cw * (ts - t1)) / latent
    return {"drynessValue": d, "steamTemperatureK": ts, "latentHeatJPerKg": latent}


KINDS = {"throttling": throttling, "expansion": expansion, "flask": flask}
print(json.dumps([KINDS[c["kind"]](c) for c in json.load(sys.stdin)]))
