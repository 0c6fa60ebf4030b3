// The trend chart's data and geometry, computed here so the chart component only draws: per series
// (quality, liquid mass, pressure deviation from saturation), a path in SVG user units, its axis
// ticks, and a mark at every check with findings (by outcome; standing hazards are on every hot
// check and would mark them all). Also the vessel's standing hazards, gathered once for the report.
import { isStandingRule } from '../../core/index.ts';
import { checksForVessel, type CheckRecord, type Signal } from '../../store/index.ts';
import { factsOf, type FigureBands, type Outcome, type VerdictId } from './record-facts.ts';

export interface TrendPoint {
  id: string;
  timeMs: number;
  quality: number | null;
  liquidMassKg: number | null;
  pressureDeviationPa: number | null;
  /** The engine's ± bands of those figures; absent: shown to a few significant digits. */
  bands?: FigureBands;
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
    id: r.id, timeMs: r.timeMs, quality: f.quality, liquidMassKg: f.liquidMassKg, pressureDeviationPa: f.pressureDeviationPa, bands: f.bands,
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
  /** What the time axis counts in: the date and zone of an hour axis, the zone of a date axis. */
  xCaption: string;
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

const pad2 = (n: number) => String(n).padStart(2, '0');
const dayLabel = (d: Date) => `${d.getFullYear()}-${pad2(d.getMonth() + 1)}-${pad2(d.getDate())}`;
const HOUR_MS = 3_600_000;
const DAY_MS = 24 * HOUR_MS;

/** This device's zone as "UTC+01:00" ("UTC" at zero), for the time axis caption. */
function zoneLabel(ms: number): string {
  const east = -new Date(ms).getTimezoneOffset();
  if (east === 0) return 'UTC';
  const a = Math.abs(east);
  return `UTC${east < 0 ? '\u2212' : '+'}${pad2(Math.floor(a / 60))}:${pad2(a % 60)}`;
}

/**
 * Time-axis ticks that suit the span, in this device's local time: within two days, whole hours
 * (the date once, in the caption); within about four months, whole days; beyond, month starts.
 * Never the same label twice, at most `count` of them.
 */
export function timeTicks(t0: number, t1: number, count = 4): { ticks: { ms: number; label: string }[]; caption: string } {
  const zone = zoneLabel(t0);
  const first = new Date(t0), last = new Date(t1);
  const span = Math.max(0, t1 - t0);
  const ticks: { ms: number; label: string }[] = [];
  if (span < 2 * DAY_MS) {
    const step = [1, 2, 3, 4, 6, 12, 24].map((h) => h * HOUR_MS).find((s) => span / s <= count) ?? DAY_MS;
    const start = new Date(first); start.setMinutes(0, 0, 0);
    for (let ms = start.getTime(); ms <= t1; ms += step) if (ms >= t0) ticks.push({ ms, label: `${pad2(new Date(ms).getHours())}:00` });
    if (ticks.length === 0) ticks.push({ ms: t0, label: `${pad2(first.getHours())}:${pad2(first.getMinutes())}` });
    const days = dayLabel(first) === dayLabel(last) ? dayLabel(first) : `${dayLabel(first)} to ${dayLabel(last)}`;
    return { ticks, caption: `${days}, time ${zone}` };
  }
  if (span < 120 * DAY_MS) {
    const step = [1, 2, 7, 14, 30].map((d) => d * DAY_MS).find((s) => span / s <= count - 1) ?? 30 * DAY_MS;
    const start = new Date(first); start.setHours(0, 0, 0, 0);
    for (let ms = start.getTime(); ms <= t1; ms += step) if (ms >= t0 - DAY_MS / 2) ticks.push({ ms: Math.max(ms, t0), label: dayLabel(new Date(ms)) });
    return { ticks: dedupe(ticks).slice(0, count), caption: `date (${zone})` };
  }
  const months = (last.getFullYear() - first.getFullYear()) * 12 + last.getMonth() - first.getMonth();
  const stepMonths = [1, 2, 3, 6, 12, 24, 60].find((m) => months / m <= count - 1) ?? 120;
  for (let m = 0; m <= months; m += stepMonths) {
    const d = new Date(first.getFullYear(), first.getMonth() + m, 1);
    if (d.getTime() >= t0 - 15 * DAY_MS) ticks.push({ ms: Math.max(d.getTime(), t0), label: `${d.getFullYear()}-${pad2(d.getMonth() + 1)}` });
  }
  return { ticks: dedupe(ticks).slice(0, count), caption: `month (${zone})` };
}

function dedupe(ticks: { ms: number; label: string }[]): { ms: number; label: string }[] {
  return ticks.filter((t, i) => ticks.findIndex((u) => u.label === t.label) === i);
}

const round1 = (v: number) => Math.round(v * 10) / 10;

/** Lays out the points in a chart `width` wide, one panel of `panelHeight` per series. */
export function trendGeometry(points: readonly TrendPoint[], width = 340, panelHeight = 120): TrendGeometry {
  const plot = { left: 48, right: width - 10, top: 22, bottom: panelHeight - 22 };
  const t0 = points.length ? points[0]!.timeMs : 0;
  const t1 = points.length ? points[points.length - 1]!.timeMs : 1;
  const span = t1 > t0 ? t1 - t0 : 1;
  const xOf = (ms: number) => round1(plot.left + ((ms - t0) / span) * (plot.right - plot.left));
  const time = timeTicks(t0, t1);
  // A label near either end hangs inward, so none is cut at the plot's edges.
  const anchorAt = (x: number): Tick['anchor'] => (x - plot.left < 30 ? 'start' : plot.right - x < 30 ? 'end' : 'middle');
  const xTicks: Tick[] = points.length === 0 ? [] : time.ticks.map((t) => ({ at: xOf(t.ms), label: t.label, anchor: anchorAt(xOf(t.ms)) }));
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
  return { width, height: panelHeight * panels.length, panelHeight, plot, xTicks, xCaption: points.length ? time.caption : '', panels };
}
