// The error chart's geometry: an instrument's as-found and as-left errors at each calibration, and
// the offset the log shows for each pair it belongs to (as if the other instrument were right), on
// one time axis, in its display unit, with its class as a band around zero. Pure: numbers in, SVG
// coordinates out.
import type { InstrumentHistory } from '../../store/index.ts';
import type { PairDrift } from '../state/pair-drift.ts';
import { errorInDisplay, shownUnit } from '../state/instrument-view.ts';
import { formatNumber } from '../state/format.ts';
import { unitLabel } from '../state/unit-labels.ts';

export const CHART = { width: 360, height: 200, left: 48, right: 352, top: 16, bottom: 172 } as const;

export interface ErrorChartGeometry {
  unit: string;
  found: { x: number; y: number; id: string }[];
  left: { x: number; y: number; id: string }[];
  offsets: { x: number; y: number }[];
  zeroY: number;
  band: { y: number; height: number } | null;
  yTicks: { at: number; label: string }[];
  xTicks: { at: number; label: string }[];
  /** Nothing to draw. */
  empty: boolean;
}

/** The chart of one instrument. The class band is drawn where its limit does not depend on the reading (not for an IEC 60751 class). */
export function errorChartGeometry(h: InstrumentHistory, pairs: readonly PairDrift[]): ErrorChartGeometry {
  const { spec, displayUnit } = h.instrument;
  const inUnit = (si: number) => errorInDisplay(spec, displayUnit, si);
  const isTemperature = spec.kind === 'thermometer' || spec.kind === 'rtd';
  const offsetsSi: { timeMs: number; value: number }[] = [];
  for (const p of pairs) {
    if (p.drift.estimate !== 'made' && isTemperature) continue;
    // The pair's offset as this instrument's error if the other one were right: Pa for the gauge; −offset ÷ dp_sat/dT for the thermometer.
    const slope = p.drift.estimate === 'made' ? p.drift.saturationSlopePaPerK : 1;
    for (const o of p.offsets) offsetsSi.push({ timeMs: o.timeMs, value: isTemperature ? -o.offsetPa / slope : o.offsetPa });
  }
  const points = [
    ...h.calibrations.map((c) => ({ t: c.timeMs, v: inUnit(c.asFoundError) })),
    ...h.calibrations.flatMap((c) => (c.asLeftError === null ? [] : [{ t: c.timeMs, v: inUnit(c.asLeftError) }])),
    ...offsetsSi.map((o) => ({ t: o.timeMs, v: inUnit(o.value) })),
  ];
  const span = spec.range.high - spec.range.low;
  const classSi = spec.tolerance.kind === 'percent-of-span' ? (spec.tolerance.percentOfSpan / 100) * span : spec.tolerance.kind === 'stated' ? spec.tolerance.plusMinus : null;
  const classShown = classSi === null ? null : Math.abs(inUnit(classSi));
  const unit = unitLabel(shownUnit(spec, displayUnit));
  const empty = points.length === 0;
  const t0 = empty ? 0 : Math.min(...points.map((p) => p.t));
  const t1 = empty ? 1 : Math.max(...points.map((p) => p.t));
  const tSpan = t1 > t0 ? t1 - t0 : 86_400_000;
  const vMax = Math.max(...points.map((p) => Math.abs(p.v)), classShown ?? 0, 1e-9) * 1.15;
  const x = (t: number) => CHART.left + ((t - (t1 > t0 ? t0 : t0 - tSpan / 2)) / tSpan) * (CHART.right - CHART.left);
  const y = (v: number) => CHART.top + ((vMax - v) / (2 * vMax)) * (CHART.bottom - CHART.top);
  const day = (ms: number) => new Date(ms).toISOString().slice(0, 10);
  return {
    unit,
    found: h.calibrations.map((c) => ({ x: x(c.timeMs), y: y(inUnit(c.asFoundError)), id: c.id })),
    left: h.calibrations.flatMap((c) => (c.asLeftError === null ? [] : [{ x: x(c.timeMs), y: y(inUnit(c.asLeftError)), id: c.id }])),
    offsets: offsetsSi.map((o) => ({ x: x(o.timeMs), y: y(inUnit(o.value)) })),
    zeroY: y(0),
    band: classShown === null ? null : { y: y(classShown), height: y(-classShown) - y(classShown) },
    yTicks: [vMax / 1.15, 0, -vMax / 1.15].map((v) => ({ at: y(v), label: formatNumber(v, 2) })),
    xTicks: empty ? [] : t1 > t0 ? [{ at: x(t0), label: day(t0) }, { at: x(t1), label: day(t1) }] : [{ at: x(t0), label: day(t0) }],
    empty,
  };
}
