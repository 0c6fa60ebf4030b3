# Recomputes issue 9's edge-state figures with Debian's python3-iapws (IAPWS97 class; units K, MPa,
# m³/kg) for the liquid-full fills given on stdin as JSON: the hydraulic pressure at the reading,
# whether the fill goes two-phase at ambient, and the pressure there (p_sat(ambient) when
# two-phase, the hydraulic pressure when still full). Prints the answers as JSON.
# Run by test/reference/check-findings-iapws.test.ts with /usr/bin/python3.
import json
import sys

from iapws import IAPWS97


def liquid_pressure(T, v):
    """Pressure (MPa) of compressed liquid at T with specific volume v, by bisection on P."""
    lo = IAPWS97(T=T, x=0).P * (1 + 1e-9)
    hi = 100.0
    if IAPWS97(T=T, P=hi).v > v:
        return None
    for _ in range(200):
        mid = 0.5 * (lo + hi)
        if IAPWS97(T=T, P=mid).v > v:
            lo = mid
        else:
            hi = mid
    return 0.5 * (lo + hi)


def case(c):
    T, v, amb = c["T"], c["v"], c["ambientK"]
    f_amb = IAPWS97(T=amb, x=0)
    two_phase = v > f_amb.v
    cooled = f_amb.P if two_phase else liquid_pressure(amb, v)
    nominal = liquid_pressure(T, v)
    return {
        "hydraulicPa": None if nominal is None else nominal * 1e6,
        "twoPhaseAtAmbient": two_phase,
        "cooledPa": None if cooled is None else cooled * 1e6,
    }


print(json.dumps([case(c) for c in json.load(sys.stdin)]))
