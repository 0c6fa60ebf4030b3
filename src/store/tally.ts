// Totals over the check log for the review, from the month buckets alone (no record is read).
// On the long-jobs surface (transfer.ts), so it loads with the Review screen, not at start-up.
import { windowOf, type CheckFilter } from './checks.ts';
import { getDb } from './connection.ts';
import { OUTCOME_IDS, outcomeOfMask, VERDICT_IDS, type StoredOutcome, type StoredVerdict } from './facts.ts';
import { LOG_STORES } from './log-layout.ts';
import { visitRows } from './log-walks.ts';

/** Counts over the checks a filter covers. */
export interface CheckTally {
  checks: number;
  byVerdict: Record<StoredVerdict | 'none', number>;
  /** By outcome: the most severe signal word among each check's findings; 'none' when it has none. */
  byOutcome: Record<StoredOutcome, number>;
  vessels: number;
  technicians: number;
  devices: number;
  /** First and last instant among the matches, ms; null when none matched. */
  firstMs: number | null;
  lastMs: number | null;
}

/**
 * Totals over the checks a filter covers, from the month buckets alone (no record is read).
 * `onProgress` gets the running totals after each month; returns null if `signal` aborts.
 */
export async function tallyChecks(
  filter: CheckFilter = {},
  options: { signal?: AbortSignal; onProgress?: (sofar: CheckTally) => void } = {},
): Promise<CheckTally | null> {
  const w = windowOf(filter);
  const tally: CheckTally = {
    checks: 0,
    byVerdict: Object.fromEntries([...VERDICT_IDS, 'none'].map((v) => [v, 0])) as CheckTally['byVerdict'],
    byOutcome: Object.fromEntries(OUTCOME_IDS.map((s) => [s, 0])) as CheckTally['byOutcome'],
    vessels: 0,
    technicians: 0,
    devices: 0,
    firstMs: null,
    lastMs: null,
  };
  const vessels = new Set<string>();
  const technicians = new Set<string>();
  const devices = new Set<string>();
  const finished = await visitRows((await getDb()).transaction(LOG_STORES), w, (r, vesselId) => {
    tally.checks += 1;
    tally.byVerdict[r[4] ?? 'none'] += 1;
    tally.byOutcome[outcomeOfMask(r[5])] += 1;
    vessels.add(vesselId);
    technicians.add(r[6]);
    devices.add(r[2]);
    if (tally.firstMs === null || r[0] < tally.firstMs) tally.firstMs = r[0];
    if (tally.lastMs === null || r[0] > tally.lastMs) tally.lastMs = r[0];
  }, {
    signal: options.signal,
    onMonth: () => {
      tally.vessels = vessels.size;
      tally.technicians = technicians.size;
      tally.devices = devices.size;
      options.onProgress?.({ ...tally });
    },
  });
  if (!finished) return null;
  tally.vessels = vessels.size;
  tally.technicians = technicians.size;
  tally.devices = devices.size;
  return tally;
}

