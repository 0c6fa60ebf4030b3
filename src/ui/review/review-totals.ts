// Totals for a filter, counted while walking the log a store page at a time: only the counts are
// kept, never the records, so a 100,000-check log costs a walk, not memory.
import { matches, needsScan, type ReviewFilter } from './review-filter.ts';
import { LogWalk } from './review-query.ts';
import { SIGNALS, VERDICTS, verdictOf, worstSignalOf, type Signal, type VerdictId } from './record-facts.ts';

export interface ReviewTotals {
  checks: number;
  byVerdict: Record<VerdictId, number>;
  /** By the most severe signal word of each check; 'none' when it had only the standing note. */
  byWorstSignal: Record<Signal | 'none', number>;
  vessels: number;
  technicians: number;
  devices: number;
  /** First and last instant among the matches, ms; null when none matched. */
  firstMs: number | null;
  lastMs: number | null;
}

export function emptyTotals(): ReviewTotals {
  return {
    checks: 0,
    byVerdict: Object.fromEntries(VERDICTS.map((v) => [v.id, 0])) as Record<VerdictId, number>,
    byWorstSignal: Object.fromEntries([...SIGNALS, 'none'].map((s) => [s, 0])) as Record<Signal | 'none', number>,
    vessels: 0,
    technicians: 0,
    devices: 0,
    firstMs: null,
    lastMs: null,
  };
}

/**
 * Counts the records matching `filter`. Reports the running totals after each store page, so the
 * screen can show them growing; stops (returning null) when `signal` aborts.
 */
export async function countTotals(
  filter: ReviewFilter,
  options: { signal?: AbortSignal; onProgress?: (sofar: ReviewTotals) => void } = {},
): Promise<ReviewTotals | null> {
  const walk = new LogWalk(filter);
  const scan = needsScan(filter);
  const totals = emptyTotals();
  // Distinct counts keep ids, not records: at most one entry per vessel, technician and device.
  const vessels = new Set<string>();
  const technicians = new Set<string>();
  const devices = new Set<string>();
  while (!walk.done) {
    if (options.signal?.aborted) return null;
    // Small store pages: a cancelled count (the filter changed) lets go of the store quickly.
    for (const r of await walk.nextBatch(200)) {
      if (scan && !matches(r, filter)) continue;
      totals.checks += 1;
      totals.byVerdict[verdictOf(r)] += 1;
      totals.byWorstSignal[worstSignalOf(r) ?? 'none'] += 1;
      vessels.add(r.vesselId);
      technicians.add(r.technician);
      devices.add(r.deviceId);
      // Newest first: the first match seen is the last in time.
      if (totals.lastMs === null) totals.lastMs = r.timeMs;
      totals.firstMs = r.timeMs;
    }
    totals.vessels = vessels.size;
    totals.technicians = technicians.size;
    totals.devices = devices.size;
    options.onProgress?.({ ...totals });
  }
  return totals;
}
