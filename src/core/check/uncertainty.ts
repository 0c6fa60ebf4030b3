// Instrument tolerances and how the check combines them.
//
// Every instrument figure is a ± limit (class or grade). Independent limits are combined by
// root-sum-square (RSS) and the arithmetic worst case is reported beside it. RSS is what the
// verdicts use: the errors of a gauge, a thermometer and a barometer are independent and rarely
// all at their limits together, and the wider worst-case band would let a few percent of air
// pass as "consistent" (121 °C field kit of an IEC 60751 class B RTD, a 0–4 bar EN 837-1 class 1.6
// gauge and ±3 kPa of atmosphere: RSS ±1.42 K against worst case ±2.36 K; 1 K of depression is about
// 3 % air by Dalton's law; both computed with python3-iapws 1.5.2 (IAPWS-IF97)). GUM expanded
// uncertainty with rectangular limits (U = 2·√(Σa²/3), JCGM 100:2008 §4.3.7) is 1.15 × RSS, close to it.

import { IF97, saturatedLiquidVolume, saturatedVaporVolume } from '../steam/index.ts';
import type { InstrumentAccuracy, TemperatureSensorTolerance, VesselSpec } from './vessel-spec.ts';
import { levelSolver, vesselVolume, type VesselGeometry } from './vessel-geometry.ts';
import type { ResolvedReading } from './reading.ts';

/** Weather swing of station pressure around a stored site value, Pa (sea-level pressure usually 970–1040 hPa, about −3 to +4 kPa from standard: University of Wisconsin meteorology course page, http://meteor.wisc.edu/~hopkins/online/cod/cod05t.htm ; ±3 kPa is our choice from that range). */
export const SITE_ATMOSPHERE_TOLERANCE_PA = 3000;

/** IF97's lowest temperature, K (273.15 K: IAPWS R7-97(2012) region 1 and the saturation line start there). */
const T_MIN_K = 273.15;

/** The combination rule the verdicts use. */
export const COMBINATION_METHOD = 'root-sum-square' as const;

/** A ± band: RSS (used) and worst case (reported), with each input's contribution in the band's unit. */
export interface Band<K extends string> {
  method: typeof COMBINATION_METHOD;
  plusMinus: number;
  worstCase: number;
  contributions: Record<K, number>;
}

/** Combines independent ± contributions (all ≥ 0, same unit). */
export function combineBand<K extends string>(contributions: Record<K, number>): Band<K> {
  const parts: number[] = [];
  for (const key in contributions) parts.push(Math.abs(contributions[key]));
  // Math.hypot scales before squaring, so tiny or huge parts neither underflow nor overflow.
  const plusMinus = Math.hypot(...parts);
  let worstCase = 0;
  for (const p of parts) worstCase += p;
  return { method: COMBINATION_METHOD, plusMinus, worstCase, contributions };
}

/**
 * combineBand over `first` and `added` together, where `added` holds parts introduced after a
 * band was first published (instrument indicator and drift): while they are all 0 the ± is the
 * RSS of `first` alone, the same double as before they existed (V8's Math.hypot can land an ulp
 * away when zeros join its arguments).
 */
export function combineBandWithAdded<K extends string, A extends string>(first: Record<K, number>, added: Record<A, number>): Band<K | A> {
  const all = { ...first, ...added } as Record<K | A, number>;
  for (const key in added) if (added[key] !== 0) return combineBand(all);
  const band = combineBand(first);
  // The zeros add nothing to the worst case either.
  return { method: band.method, plusMinus: band.plusMinus, worstCase: band.worstCase, contributions: all };
}

/**
 * Temperature sensor ± limit at T, K. IEC 60751 Pt100 classes, t in °C: AA ±(0.10 + 0.0017|t|),
 * A ±(0.15 + 0.002|t|), B ±(0.30 + 0.005|t|) (IEC 60751 tolerance classes: A and B as in the
 * IEC 60751:1995 class table, all three as reproduced at https://instrumentationforum.com/t/rtd-standards/6685 ;
 * the table number in the current edition was not confirmed).
 * temperatureK in K (any finite value).
 */
export function temperatureToleranceK(sensor: TemperatureSensorTolerance, temperatureK: number): number {
  if (sensor.kind === 'stated') return sensor.toleranceK;
  const t = Math.abs(temperatureK - 273.15);
  switch (sensor.sensorClass) {
    case 'AA':
      return 0.1 + 0.0017 * t;
    case 'A':
      return 0.15 + 0.002 * t;
    case 'B':
      return 0.3 + 0.005 * t;
  }
}

/** The thermometer's ± limits at T, K: the element's class or stated limit, the indicator's and the drift's; combined root-sum-square. */
export function thermometerLimitsK(instruments: InstrumentAccuracy, temperatureK: number): { element: number; indicator: number; drift: number; combined: number } {
  const element = temperatureToleranceK(instruments.temperatureSensor, temperatureK);
  const indicator = instruments.temperatureIndicatorToleranceK ?? 0;
  const drift = instruments.temperatureDriftToleranceK ?? 0;
  return { element, indicator, drift, combined: Math.hypot(element, indicator, drift) };
}

/** The pressure gauge's own ± limits, Pa: class, indicator and drift (each % of span). */
export function gaugeLimitsPa(instruments: InstrumentAccuracy): { pressureGauge: number; pressureGaugeIndicator: number; pressureGaugeDrift: number; combined: number } {
  const g = instruments.pressureGauge;
  const pressureGauge = (g.accuracyPercentOfSpan / 100) * g.spanPa;
  const pressureGaugeIndicator = ((g.indicatorPercentOfSpan ?? 0) / 100) * g.spanPa;
  const pressureGaugeDrift = ((g.driftPercentOfSpan ?? 0) / 100) * g.spanPa;
  return { pressureGauge, pressureGaugeIndicator, pressureGaugeDrift, combined: Math.hypot(pressureGauge, pressureGaugeIndicator, pressureGaugeDrift) };
}

/** ± limits on the absolute pressure, Pa: the gauge (class, indicator, drift, each × span) and, for a gauge reading, the atmosphere. */
export function pressureTolerancesPa(
  vessel: VesselSpec,
  reading: ResolvedReading,
  reference: 'gauge' | 'absolute',
): { pressureGauge: number; pressureGaugeIndicator: number; pressureGaugeDrift: number; atmosphere: number } {
  const { pressureGauge, pressureGaugeIndicator, pressureGaugeDrift } = gaugeLimitsPa(vessel.instruments);
  if (reference === 'absolute') return { pressureGauge, pressureGaugeIndicator, pressureGaugeDrift, atmosphere: 0 };
  const atmosphere = reading.atmosphereSource === 'measured' ? vessel.instruments.barometerTolerancePa : SITE_ATMOSPHERE_TOLERANCE_PA;
  return { pressureGauge, pressureGaugeIndicator, pressureGaugeDrift, atmosphere };
}

/**
 * ± limit of the net mass, kg: one weight reading for a net weight. For a gross weight, the gross
 * reading and the tare combined root-sum-square: a tare weighed like the gross is another
 * independent reading (√2 × the weight tolerance); a stated (nameplate or historic) tare brings
 * its own limit.
 */
export function netMassToleranceKg(vessel: VesselSpec, weightKind: 'gross' | 'net'): number {
  const a = vessel.instruments.weightToleranceKg;
  if (weightKind === 'net') return a;
  const tare = vessel.instruments.tare;
  return tare?.kind === 'stated' ? Math.hypot(a, tare.toleranceKg) : Math.SQRT2 * a;
}

/** A band with its ends clipped to what the quantity can be (quality 0…1, liquid mass 0…net mass). */
export type ClippedBand<K extends string> = Band<K> & { low: number; high: number };

/**
 * Why a quality band says nothing: near the critical point v_g − v_f vanishes and the band grows
 * without limit; a weight tolerance at or above the contents swamps them; otherwise the limits
 * together span the whole two-phase range.
 */
export type UndeterminedReason = 'near-critical-point' | 'weight-tolerance-exceeds-contents' | 'band-spans-regime';

/** Quality, liquid mass and liquid level with ± bands propagated from the net mass, temperature and volume limits. */
export interface InventoryBands {
  /** Quality band; `undetermined` when its clipped ends reach both 0 and 1 (the whole regime). */
  quality: ClippedBand<'weight' | 'temperature' | 'volume'> & { undetermined: { reason: UndeterminedReason } | null };
  liquidMassKg: ClippedBand<'weight' | 'temperature' | 'volume'>;
  /** Liquid level, m; null for a stated volume (no geometry, no level). */
  liquidLevelM: Band<'weight' | 'temperature' | 'volume'> | null;
}

/**
 * First-order propagation through x = (V/m − v_f)/(v_g − v_f) and m_liq = (m·v_g − V)/(v_g − v_f)
 * (the mass and volume balances): analytic partial derivatives in m and V, a central difference of the
 * saturation values in T. Limits are ± (same as the instruments'). Valid for a two-phase state:
 * temperatureK 273.15–647.096 K, massKg > 0, volumeM3 > 0, tolerances ≥ 0.
 */
export function inventoryBands(args: {
  geometry?: VesselGeometry;
  temperatureK: number;
  massKg: number;
  volumeM3: number;
  massToleranceKg: number;
  temperatureToleranceK: number;
  volumeToleranceM3: number;
  /** levelSolver(geometry), shared with the check's own level solve so the band's solves start near it; one of its own otherwise. */
  levelAt?: (volumeM3: number) => number;
}): InventoryBands {
  const { temperatureK: T, massKg: m, volumeM3: V } = args;
  const at = (t: number) => {
    const vf = saturatedLiquidVolume(t);
    const vg = saturatedVaporVolume(t);
    return { vf, vg, x: (V / m - vf) / (vg - vf), mLiq: (m * vg - V) / (vg - vf) };
  };
  const here = at(T);
  const vfg = here.vg - here.vf;
  // Stay off the critical point itself, where v_g − v_f = 0.
  const dT = 0.01;
  const top = IF97.Tc - 1e-6;
  let hi = Math.min(top, T + dT);
  let lo = Math.max(T_MIN_K, T - dT);
  if (hi <= lo) lo = hi - dT;
  if (hi <= lo) hi = lo + dT;
  const a = at(lo);
  const b = at(hi);
  const dxdT = (b.x - a.x) / (hi - lo);
  const dmLiqdT = (b.mLiq - a.mLiq) / (hi - lo);
  const qualityBand = combineBand({
    weight: ((V / (m * m)) / vfg) * args.massToleranceKg,
    temperature: Math.abs(dxdT) * args.temperatureToleranceK,
    volume: (1 / (m * vfg)) * args.volumeToleranceM3,
  });
  const liquidBand = combineBand({
    weight: (here.vg / vfg) * args.massToleranceKg,
    temperature: Math.abs(dmLiqdT) * args.temperatureToleranceK,
    volume: (1 / vfg) * args.volumeToleranceM3,
  });
  const x = here.x;
  const low = clamp01(x - qualityBand.plusMinus);
  const high = clamp01(x + qualityBand.plusMinus);
  const undetermined: InventoryBands['quality']['undetermined'] = low > 0 || high < 1 ? null : {
    reason: IF97.Tc - T < 1 ? 'near-critical-point' : args.massToleranceKg >= m ? 'weight-tolerance-exceeds-contents' : 'band-spans-regime',
  };
  const quality = { ...qualityBand, low, high, undetermined };
  const liquidMassKg = {
    ...liquidBand,
    low: Math.min(m, Math.max(0, here.mLiq - liquidBand.plusMinus)),
    high: Math.min(m, Math.max(0, here.mLiq + liquidBand.plusMinus)),
  };
  const liquidLevelM = args.geometry === undefined || args.geometry.shape === 'stated-volume' ? null : levelBand(args.geometry, args, here.vf, here.vg);
  return { quality, liquidMassKg, liquidLevelM };
}

function clamp01(x: number): number {
  return x < 0 ? 0 : x > 1 ? 1 : x;
}

/**
 * Liquid level band, m, through the vessel geometry. The liquid volume is V_liq = v_f·(m·v_g − V)/(v_g − v_f)
 * (the mass and volume balances at the saturation values of T); for each input in turn the level
 * h(V_liq) is evaluated with that input at −limit and +limit (the others nominal), and its
 * contribution is half the difference (a central difference over the limit). Not the derivative
 * dh/dV_liq: that is infinite at the bottom and top of a horizontal shell and at a head's apex,
 * while the level itself stays finite. V_liq is held to 0 … V of the drawn geometry (a level cannot
 * leave the vessel). The volume limit enters through the mass balance (how much of the contents is
 * liquid); the shape is taken as drawn. T is kept to 273.15 K … Tc − 1e-6 K and m above 0; a
 * difference shortened by those limits is scaled back to the full limit.
 */
function levelBand(
  geometry: Exclude<VesselGeometry, { shape: 'stated-volume' }>,
  args: { temperatureK: number; massKg: number; volumeM3: number; massToleranceKg: number; temperatureToleranceK: number; volumeToleranceM3: number; levelAt?: (volumeM3: number) => number },
  vfHere: number,
  vgHere: number,
): Band<'weight' | 'temperature' | 'volume'> {
  const drawn = vesselVolume(geometry);
  const levelAt = args.levelAt ?? levelSolver(geometry);
  const { temperatureK: T, massKg: m, volumeM3: V } = args;
  // v_f and v_g at the reading's own T (vfHere, vgHere, m³/kg, as inventoryBands has them) serve
  // four of the six levels (the weight and volume limits).
  const level = (t: number, m: number, V: number) => {
    const vf = t === T ? vfHere : saturatedLiquidVolume(t);
    const vg = t === T ? vgHere : saturatedVaporVolume(t);
    const liquidM3 = (vf * (m * vg - V)) / (vg - vf);
    return levelAt(Math.min(Math.max(liquidM3, 0), drawn));
  };
  const across = (limit: number, lo: number, hi: number, at: (x: number) => number) =>
    limit === 0 || hi <= lo ? 0 : (Math.abs(at(hi) - at(lo)) * limit) / (hi - lo);
  const dT = args.temperatureToleranceK;
  const dm = args.massToleranceKg;
  const dV = args.volumeToleranceM3;
  return combineBand({
    weight: across(dm, Math.max(m - dm, m * 1e-9), m + dm, (x) => level(T, x, V)),
    temperature: across(dT, Math.max(T_MIN_K, T - dT), Math.min(IF97.Tc - 1e-6, T + dT), (x) => level(x, m, V)),
    volume: across(dV, Math.max(V - dV, V * 1e-9), V + dV, (x) => level(T, m, x)),
  });
}
