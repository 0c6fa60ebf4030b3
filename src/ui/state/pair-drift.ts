// Drift from the log for one vessel: its saved checks grouped by the gauge and thermometer they
// used (the instruments a check names, or for a check saved before the register the ones fitted
// at its time), the checks that showed saturated steam since the later of the pair's last
// calibrations, and the core's estimate over them. Pure: records in, figures and findings out.
// The instruments room by its files (src/core/instrument/README.md, "Imports").
import { driftFromLog, type LogDrift, type SaturatedCheck } from '../../core/instrument/log-drift.ts';
import { calibrationDue, type CalibrationDue } from '../../core/instrument/calibration-due.ts';
import { saturationPressure } from '../../core/steam/index.ts';
import type { Caution, VesselSpec } from '../../core/index.ts';
import { calibrationFigures, fittedAt, type CheckRecord, type FittingRecord, type InstrumentHistory } from '../../store/index.ts';

/** The newest checks a pair's estimate looks at: our choice, enough for a year of daily checks, few enough to stay quick on a phone. */
export const DRIFT_CHECKS_MAX = 400;

/** Within the IAPWS-IF97 saturation line (R7-97(2012) region 4), where the estimator takes a check. */
const SAT_T_K = { min: 273.16, max: 647.096 } as const;
const SAT_P_PA = { min: 611.657, max: 22.064e6 } as const;

export interface PairDrift {
  gaugeId: string;
  thermometerId: string;
  gaugeTag: string;
  thermometerTag: string;
  /** Since when checks count: the later of the two last calibrations (ms), or null with neither calibrated. */
  sinceMs: number | null;
  drift: LogDrift;
  /** Each saturated check used: its time and offset p − p_sat(T), Pa (what the chart draws). */
  offsets: { timeMs: number; offsetPa: number }[];
  findings: Caution[];
}

/** The pressure and temperature instruments a saved check used: as it names them, else as fitted at its time. */
export function pairOfCheck(record: CheckRecord, fittings: readonly FittingRecord[]): { gaugeId: string; thermometerId: string } | null {
  const used = (record.vessel.spec as VesselSpec).instrumentsUsed;
  if (Array.isArray(used)) {
    const g = used.find((u) => u.role === 'pressure');
    const t = used.find((u) => u.role === 'temperature');
    return g && t ? { gaugeId: g.instrumentId, thermometerId: t.instrumentId } : null;
  }
  const at = fittedAt(fittings, record.timeMs);
  const g = at.pressure?.instrumentId;
  const t = at.temperature?.instrumentId;
  return g && t ? { gaugeId: g, thermometerId: t } : null;
}

/** A saved check as the estimator takes it, when its contents were two-phase (liquid and steam) and its figures are on the saturation line's range. */
export function saturatedCheckOf(record: CheckRecord): SaturatedCheck | null {
  const r = record.result as { inventory?: { regime?: unknown }; reading?: { temperatureK?: unknown }; saturation?: { absolutePressurePa?: unknown; pressureBand?: { plusMinus?: unknown } } };
  if (r.inventory?.regime !== 'two-phase') return null;
  const T = r.reading?.temperatureK;
  const p = r.saturation?.absolutePressurePa;
  const band = r.saturation?.pressureBand?.plusMinus;
  if (typeof T !== 'number' || typeof p !== 'number' || !(T >= SAT_T_K.min && T <= SAT_T_K.max) || !(p >= SAT_P_PA.min && p <= SAT_P_PA.max)) return null;
  const check: SaturatedCheck = { timeMs: record.timeMs, temperatureK: T, absolutePressurePa: p };
  if (typeof band === 'number' && Number.isFinite(band) && band >= 0 && band <= SAT_P_PA.max) check.pressureBandPa = band;
  return check;
}

function dueOf(h: InstrumentHistory, nowMs: number): CalibrationDue {
  return calibrationDue(h.instrument.spec, h.calibrations.filter((c) => c.timeMs <= nowMs).map(calibrationFigures), { nowMs });
}

/**
 * The drift estimate of every gauge–thermometer pair among a vessel's checks (any order; corrections
 * count as checks of their own time), newest pair first. Instruments missing from `register` (a
 * backup from elsewhere) are named by id. An instrument whose register entry cannot be judged is left
 * without a due date rather than failing the vessel.
 */
export function pairDrifts(checks: readonly CheckRecord[], fittings: readonly FittingRecord[], register: ReadonlyMap<string, InstrumentHistory>, nowMs: number): PairDrift[] {
  const groups = new Map<string, { gaugeId: string; thermometerId: string; records: CheckRecord[]; lastMs: number }>();
  for (const c of checks) {
    const pair = pairOfCheck(c, fittings);
    if (!pair) continue;
    const key = `${pair.gaugeId}\u0000${pair.thermometerId}`;
    const g = groups.get(key) ?? { ...pair, records: [], lastMs: -Infinity };
    g.records.push(c);
    g.lastMs = Math.max(g.lastMs, c.timeMs);
    groups.set(key, g);
  }
  const out: PairDrift[] = [];
  for (const g of [...groups.values()].sort((a, b) => b.lastMs - a.lastMs)) {
    const gauge = register.get(g.gaugeId);
    const thermometer = register.get(g.thermometerId);
    const lastCal = (h: InstrumentHistory | undefined) => Math.max(-Infinity, ...(h?.calibrations.filter((c) => c.timeMs <= nowMs).map((c) => c.timeMs) ?? []));
    const since = Math.max(lastCal(gauge), lastCal(thermometer));
    const saturated = g.records
      .filter((c) => c.timeMs > since)
      .sort((a, b) => b.timeMs - a.timeMs)
      .slice(0, DRIFT_CHECKS_MAX)
      .flatMap((c) => { const s = saturatedCheckOf(c); return s ? [s] : []; });
    const dues = [gauge, thermometer].flatMap((h) => {
      if (!h) return [];
      try {
        const d = dueOf(h, nowMs);
        return d.state === 'no-calibration' ? [] : [d.dueMs];
      } catch {
        return [];
      }
    });
    const gaugeTag = gauge?.instrument.tag ?? g.gaugeId;
    const thermometerTag = thermometer?.instrument.tag ?? g.thermometerId;
    const context = dues.length > 0 ? { gaugeTag, thermometerTag, nextCalibrationDueMs: Math.min(...dues) } : { gaugeTag, thermometerTag };
    const drift = driftFromLog(saturated, context);
    out.push({
      gaugeId: g.gaugeId, thermometerId: g.thermometerId, gaugeTag, thermometerTag,
      sinceMs: Number.isFinite(since) ? since : null,
      drift,
      offsets: saturated.map((s) => ({ timeMs: s.timeMs, offsetPa: s.absolutePressurePa - saturationPressure(s.temperatureK) })).sort((a, b) => a.timeMs - b.timeMs),
      findings: drift.findings,
    });
  }
  return out;
}
