// Readings taken over time (a cycle's temperature and pressure, a vacuum hold's pressure): the checks
// every series must pass before anything is computed from it, and the straight-line reading between
// two readings that the band, hold and lethality figures rely on.
//
// Between readings the record is taken as a straight line in time (linear interpolation): the
// least a recorder's figures say, and what the trapezoid rule for lethality assumes too. A dip
// shorter than the reading interval does not show; the cycle evaluation says so when readings are
// sparse.

import { InputError, requireInRange } from '../errors.ts';

/** How many readings a series may hold, and the time range, s (about ±31 years from any origin). */
export const SERIES_LIMITS = {
  readings: { min: 2, max: 200_000, unit: 'readings' },
  timeS: { min: -1e9, max: 1e9, unit: 's' },
} as const;

/** The field name of one reading's value in messages, readings numbered from 1 in the order given. */
export function readingField(index: number, quantity: string): string {
  return `reading ${index + 1} ${quantity}`;
}

/**
 * Throws InputError unless `readings` is an array of 2 to 200 000 readings whose `timeS` are finite,
 * within ±1e9 s and strictly increasing (field "readings", or "reading N time").
 */
export function requireTimeSeries(readings: readonly { timeS: number }[]): void {
  const L = SERIES_LIMITS;
  if (!Array.isArray(readings)) {
    throw new InputError('readings', 'empty', String(readings), L.readings, 'readings: no list of readings was given.');
  }
  if (readings.length < L.readings.min || readings.length > L.readings.max) {
    throw new InputError('readings', 'out-of-range', readings.length, L.readings,
      `readings: ${readings.length} given; between ${L.readings.min} and ${L.readings.max} are needed.`);
  }
  let previous = -Infinity;
  readings.forEach((r, i) => {
    const t = requireInRange(readingField(i, 'time'), r?.timeS, L.timeS.min, L.timeS.max, L.timeS.unit);
    if (!(t > previous)) {
      throw new InputError(readingField(i, 'time'), 'inconsistent', t, { min: previous, max: L.timeS.max, unit: 's' },
        `${readingField(i, 'time')}: ${t} s is not after reading ${i} (${previous} s); times must increase from one reading to the next.`);
    }
    previous = t;
  });
}

/** Throws InputError ("reading N <quantity>") unless every reading's `key` is finite and within min…max. */
export function requireEachInRange<K extends string>(
  readings: readonly Record<K, number>[],
  key: K,
  quantity: string,
  range: { readonly min: number; readonly max: number; readonly unit: string },
): void {
  readings.forEach((r, i) => requireInRange(readingField(i, quantity), r[key], range.min, range.max, range.unit));
}

/** A series as parallel arrays: times s, values in one unit. Already validated. */
export interface Series {
  readonly timesS: readonly number[];
  readonly values: readonly number[];
}

/** The value at time t on the straight line between the readings either side (t inside the record). */
export function valueAt(s: Series, t: number): number {
  const { timesS: ts, values: vs } = s;
  let lo = 0;
  let hi = ts.length - 1;
  if (t <= ts[0]!) return vs[0]!;
  if (t >= ts[hi]!) return vs[hi]!;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (ts[mid]! <= t) lo = mid;
    else hi = mid;
  }
  const t0 = ts[lo]!, t1 = ts[hi]!, v0 = vs[lo]!, v1 = vs[hi]!;
  return v0 + ((v1 - v0) * (t - t0)) / (t1 - t0);
}

/** One stretch of the record at or above a level, s. `endedWithRecord`: still at or above it at the last reading. */
export interface Run {
  startS: number;
  endS: number;
  endedWithRecord: boolean;
}

/** Every stretch where the straight-line record is at or above `level`, in time order, ends interpolated. */
export function runsAtOrAbove(s: Series, level: number): Run[] {
  const { timesS: ts, values: vs } = s;
  const runs: Run[] = [];
  let startS: number | null = vs[0]! >= level ? ts[0]! : null;
  for (let i = 0; i + 1 < ts.length; i++) {
    const t0 = ts[i]!, t1 = ts[i + 1]!, v0 = vs[i]!, v1 = vs[i + 1]!;
    if (startS === null && v1 >= level) {
      startS = t0 + ((level - v0) / (v1 - v0)) * (t1 - t0);
    } else if (startS !== null && v1 < level) {
      runs.push({ startS, endS: t0 + ((v0 - level) / (v0 - v1)) * (t1 - t0), endedWithRecord: false });
      startS = null;
    }
  }
  if (startS !== null) runs.push({ startS, endS: ts[ts.length - 1]!, endedWithRecord: true });
  return runs;
}

/** The readings between fromS and toS (inside the record), with the interpolated values at both ends added. */
export function sliceSeries(s: Series, fromS: number, toS: number): { timeS: number; value: number }[] {
  const out = [{ timeS: fromS, value: valueAt(s, fromS) }];
  s.timesS.forEach((t, i) => {
    if (t > fromS && t < toS) out.push({ timeS: t, value: s.values[i]! });
  });
  if (toS > fromS) out.push({ timeS: toS, value: valueAt(s, toS) });
  return out;
}

/** Time, s, between fromS and toS that the straight-line record spends within lo ≤ value ≤ hi. */
export function timeWithin(s: Series, lo: number, hi: number, fromS: number, toS: number): number {
  const points = sliceSeries(s, fromS, toS);
  let total = 0;
  for (let i = 0; i + 1 < points.length; i++) {
    const a = points[i]!, b = points[i + 1]!;
    const dt = b.timeS - a.timeS;
    const dv = b.value - a.value;
    if (dv === 0) {
      if (a.value >= lo && a.value <= hi) total += dt;
      continue;
    }
    // The fraction of the segment inside [lo, hi]: the parameter interval where the line is in band.
    const u1 = (lo - a.value) / dv;
    const u2 = (hi - a.value) / dv;
    const from = Math.max(0, Math.min(u1, u2));
    const to = Math.min(1, Math.max(u1, u2));
    if (to > from) total += (to - from) * dt;
  }
  return total;
}

/** Lowest and highest value between fromS and toS on the straight-line record, with when each occurs. */
export function extremesWithin(s: Series, fromS: number, toS: number): { min: { timeS: number; value: number }; max: { timeS: number; value: number } } {
  const points = sliceSeries(s, fromS, toS);
  let min = points[0]!;
  let max = points[0]!;
  for (const p of points) {
    if (p.value < min.value) min = p;
    if (p.value > max.value) max = p;
  }
  return { min, max };
}

/** Largest interval between consecutive readings whose span overlaps fromS … toS, s. */
export function largestIntervalWithin(s: Series, fromS: number, toS: number): number {
  const ts = s.timesS;
  let largest = 0;
  for (let i = 0; i + 1 < ts.length; i++) {
    const t0 = ts[i]!, t1 = ts[i + 1]!;
    if (t1 > fromS && t0 < toS) largest = Math.max(largest, t1 - t0);
  }
  return largest;
}
