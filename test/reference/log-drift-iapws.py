# Recomputes the offset arithmetic of the log-drift estimate with Debian's python3-iapws (IAPWS-IF97
# region 4: _PSat_T in MPa, _TSat_P in K) for the checks given on stdin as JSON
# ([{"temperatureK", "absolutePressurePa"}, ...]) and prints JSON: each check's p - p_sat(T) and
# T - T_sat(p), their means, the mean temperature, dp_sat/dT there (central difference, +-0.005 K).
# Run by test/reference/log-drift-iapws.test.ts with /usr/bin/python3.
import json
import sys

from iapws.iapws97 import _PSat_T, _TSat_P

checks = json.load(sys.stdin)
offsets = [c["absolutePressurePa"] - _PSat_T(c["temperatureK"]) * 1e6 for c in checks]
shortfalls = [c["temperatureK"] - _TSat_P(c["absolutePressurePa"] / 1e6) for c in checks]
mean_t = sum(c["temperatureK"] for c in checks) / len(checks)
slope = (_PSat_T(mean_t + 0.005) - _PSat_T(mean_t - 0.005)) * 1e6 / 0.01
print(json.dumps({
    "offsetsPa": offsets,
    "meanOffsetPa": sum(offsets) / len(offsets),
    "meanTemperatureDeviationK": sum(shortfalls) / len(shortfalls),
    "meanTemperatureK": mean_t,
    "slopePaPerK": slope,
}))
