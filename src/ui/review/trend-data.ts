// The trend chart's data and geometry, computed here so the chart component only draws: per series
// (quality, liquid mass, pressure deviation from saturation), a path in SVG user units, its axis
// ticks, and a mark at every check with findings (by outcome; standing hazards are on every hot
// check and would mark them all). Also the vessel's standing hazards, gathered once for the report.
import { isStandingRule } from '../../core/index.ts';
import { checksForVessel, type CheckRecord, type Signal } from '../../store/index.ts';
import { factsOf, type Outcome, type VerdictId } from './record-facts.ts';

export interface TrendPoint {
  id: string;
  timeMs: number;
  quality: number | null;
  liquidMassKg: number | null;
  pressureDeviationPa: number | null;
  outcome: Outcome;
  verdict: VerdictId;
  technician: string;
  /** The stored ISO 8601 time with its offset. */
  time: string;
}

/** At most this many checks are drawn (the newest); more would not show on a phone anyway. */
export const TREND_MAX_POINTS = 2000;

/** A standing hazard of the vessel as the report lists it once: its latest wording and how many checks carried it. */
export interface StandingHazard {
  rule: string;
  signal: Signal;
  message: string;
  checks: number;
}

/**
 * The vessel's checks in [fromMs, toMs] (either null = open) as trend points, oldest first,
 * read a store page at a time; `capped` when older checks were left out. `standing`: the standing
 * hazards those checks carried, each once, most severe first (the standing note left out: the
 * report has its own).
 */
export async function trendPoints(vesselId: string, fromMs: number | null, toMs: number | null): Promise<{ points: TrendPoint[]; capped: boolean; standing: StandingHazard[] }> {
  const points: TrendPoint[] = [];
  const standing = new Map<string, StandingHazard>();
  const done = (capped: boolean) => ({ points: points.reverse(), capped, standing: standingList(standing) });
  let before: { timeMs: number; id: string } | undefined;
  for (;;) {
    const page = await checksForVessel(vesselId, {
      limit: 1000,
      ...(fromMs !== null ? { from: new Date(fromMs) } : {}),
      ...(toMs !== null ? { to: new Date(toMs) } : {}),
      ...(before ? { before } : {}),
    });
    for (const r of page.checks) {
      if (points.length >= TREND_MAX_POINTS) return done(true);
      points.push(pointOf(r));
      // Newest first: the first wording met for a rule is the latest.
      for (const c of r.cautions) {
        if (!isStandingRule(c.rule) || c.rule === 'standing-note') continue;
        const known = standing.get(c.rule);
        if (known) known.checks += 1;
        else standing.set(c.rule, { rule: c.rule, signal: c.signal, message: c.message, checks: 1 });
      }
    }
    if (!page.next) return done(false);
    before = page.next;
  }
}

const ORDER: readonly Signal[] = ['DANGER', 'WARNING', 'CAUTION', 'NOTICE'];

function standingList(found: Map<string, StandingHazard>): StandingHazard[] {
  return [...found.values()].sort((a, b) => ORDER.indexOf(a.signal) - ORDER.indexOf(b.signal) || b.checks - a.checks);
}

export function pointOf(r: CheckRecord): TrendPoint {
  const f = factsOf(r);
  return {
    id: r.id, timeMs: r.timeMs, quality: f.quality, liquidMassKg: f.liquidMassKg, pressureDeviationPa: f.pressureDeviationPa,
    outcome: f.outcome, verdict: f.verdict, technician: r.technician, time: r.time,
  };
}

export type SeriesKey = 'quality' | 'liquidMassKg' | 'pressureDeviationPa';

export interface SeriesSpec { key: SeriesKey; title: string; unit: string; scale: number }

/** What each panel shows, and the display unit (SI value × scale). */
export const TREND_SERIES: readonly SeriesSpec[] = [
  { key: 'quality', title: 'Quality (vapour mass fraction)', unit: '%', scale: 100 },
  { key: 'liquidMassKg', title: 'Liquid mass', unit: 'kg', scale: 1 },
  { key: 'pressureDeviationPa', title: 'Pressure − saturation pressure at T', unit: 'kPa', scale: 1e-3 },
];

export interface Tick { at: number; label: string; /** Where the label hangs from `at`, so none is cut at the plot's ends. */ anchor?: 'start' | 'middle' | 'end' }
export interface Mark { x: number; y: number; signal: Signal; id: string }

export interface PanelGeometry {
  spec: SeriesSpec;
  /** SVG path data ("M x y L x y …"); a gap where a check has no value. */
  path: string;
  yTicks: Tick[];
  marks: Mark[];
  /** Checks with a value in this series. */
  count: number;
  /** Where this panel starts down the chart. */
  offsetY: number;
}

export interface TrendGeometry {
  width: number;
  height: number;
  panelHeight: number;
  plot: { left: number; right: number; top: number; bottom: number };
  xTicks: Tick[];
  panels: PanelGeometry[];
}

/** Round tick values covering [min, max]: steps of 1, 2 or 5 × 10^n, about `count` of them. */
export function niceTicks(min: number, max: number, count = 4): number[] {
  // A flat (or vanishingly narrow) series still gets an axis: widen it around its value.
  if (!(max - min >= 1e-6 * Math.max(1, Math.abs(min), Math.abs(max)))) {
    const pad = Math.max(Math.abs(min) * 0.1, 1e-3);
    return niceTicks(min - pad, max + pad, count);
  }
  const raw = (max - min) / count;
  const power = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * power).find((s) => s >= raw) ?? 10 * power;
  const ticks: number[] = [];
  let start = Math.floor(min / step) * step;
  // min / step can underflow to −0 for a subnormal min; never start above min.
  if (start > min) start -= step;
  for (let v = start; v <= max + step * 1e-9; v += step) ticks.push(Number(v.toPrecision(12)));
  if (ticks[ticks.length - 1]! < max) ticks.push(Number((ticks[ticks.length - 1]! + step).toPrecision(12)));
  return ticks;
}

function dayLabel(ms: number): string {
  const d = new Date(ms);
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
}

const round1 = (v: number) => Math.round(v * 10) / 10;

/** Lays out the points in a chart `width` wide, one panel of `panelHeight` per series. */
export function trendGeometry(points: readonly TrendPoint[], width = 340, panelHeight = 120): TrendGeometry {
  const plot = { left: 48, right: width - 10, top: 22, bottom: panelHeight - 22 };
  const t0 = points.length ? points[0]!.timeMs : 0;
  const t1 = points.length ? points[points.length - 1]!.timeMs : 1;
  const span = t1 > t0 ? t1 - t0 : 1;
  const xOf = (ms: number) => round1(plot.left + ((ms - t0) / span) * (plot.right - plot.left));
  const xAt = t1 > t0 ? [t0, t0 + span / 2, t1] : [t0];
  const anchors = ['start', 'middle', 'end'] as const;
  const xTicks: Tick[] = points.length === 0 ? [] : xAt.map((ms, i) => ({ at: xOf(ms), label: dayLabel(ms), anchor: xAt.length === 1 ? 'start' : anchors[i]! }));
  const panels = TREND_SERIES.map((spec, index): PanelGeometry => {
    const values = points.map((p) => (p[spec.key] === null ? null : p[spec.key]! * spec.scale));
    const present = values.filter((v): v is number => v !== null);
    const ticks = present.length ? niceTicks(Math.min(...present), Math.max(...present)) : [0, 1];
    const lo = ticks[0]!;
    const hi = ticks[ticks.length - 1]!;
    const yOf = (v: number) => round1(plot.bottom - ((v - lo) / (hi - lo)) * (plot.bottom - plot.top));
    let path = '';
    let pen = false;
    const marks: Mark[] = [];
    points.forEach((p, i) => {
      const v = values[i];
      if (v === null || v === undefined) {
        pen = false;
        if (p.outcome !== 'none') marks.push({ x: xOf(p.timeMs), y: plot.bottom, signal: p.outcome, id: p.id });
        return;
      }
      // `l0 0` after a move: with round caps a lone value still shows as a dot.
      path += pen ? `L${xOf(p.timeMs)} ${yOf(v)}` : `M${xOf(p.timeMs)} ${yOf(v)}l0 0`;
      pen = true;
      if (p.outcome !== 'none') marks.push({ x: xOf(p.timeMs), y: yOf(v), signal: p.outcome, id: p.id });
    });
    return {
      spec,
      path,
      yTicks: ticks.map((v) => ({ at: yOf(v), label: String(v) })),
      marks,
      count: present.length,
      offsetY: index * panelHeight,
    };
  });
  return { width, height: panelHeight * panels.length, panelHeight, plot, xTicks, panels };
}
