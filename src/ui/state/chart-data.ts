// Points for the saturation-line picture, in the display units: the IF97 saturation line around
// the reading, and the reading's tolerance box. Computed by the core; only sampled here.
import { IF97, pressureFromPa, saturationPressure, temperatureFromK } from '../../core/index.ts';
import { PRESSURE_UNITS, TEMPERATURE_UNITS } from '../../core/index.ts';
import type { ChartData } from '../components/SaturationChart.tsx';
import type { UnitPrefs } from './settings-model.ts';


/** T K and absolute p Pa with their ± limits → chart data; undefined where IF97 has no saturation line. */
export function saturationChartData(
  reading: { temperatureK: number; absolutePressurePa: number; temperatureTolK: number; pressureTolPa: number },
  u: UnitPrefs,
): ChartData | undefined {
  const { temperatureK: T, absolutePressurePa: p, temperatureTolK: dT, pressureTolPa: dp } = reading;
  const half = Math.max(8, 4 * dT);
  const lo = Math.max(IF97.Tt, T - half);
  const hi = Math.min(IF97.Tc, T + half);
  if (!(hi > lo)) return undefined;
  const curve: { T: number; p: number }[] = [];
  const n = 40;
  for (let i = 0; i <= n; i++) {
    const Ti = lo + ((hi - lo) * i) / n;
    curve.push({ T: temperatureFromK(Ti, u.temperature), p: pressureFromPa(saturationPressure(Ti), u.pressure) });
  }
  const tc = (k: number) => temperatureFromK(k, u.temperature);
  const pc = (pa: number) => pressureFromPa(Math.max(0, pa), u.pressure);
  return {
    curve,
    point: { T: tc(T), p: pc(p) },
    box: { Tmin: tc(T - dT), Tmax: tc(T + dT), pmin: pc(p - dp), pmax: pc(p + dp) },
    tLabel: TEMPERATURE_UNITS.find((x) => x.id === u.temperature)?.label ?? u.temperature,
    pLabel: PRESSURE_UNITS.find((x) => x.id === u.pressure)?.label ?? u.pressure,
  };
}
