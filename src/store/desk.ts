// The desk's reads (issue 14), a surface of their own loaded on demand with the Vessels screen, the
// plant overview and the wide review, so the start-up script does not carry them: each vessel's
// newest check (month rows) and newest record of a kind (kind rows), and a filter's whole match in
// any order the month rows give (sorted-checks.ts).
import { getDb } from './connection.ts';
import { outcomeOfMask, SIGNAL_ORDER, type Signal, type StoredOutcome, type StoredVerdict } from './facts.ts';
import { latestRows, LOG_STORES } from './log-layout.ts';
import { requireText, requireUuid } from './validate.ts';

export { CHECK_SORT_KEYS, sortChecks } from './sorted-checks.ts';
export type { CheckSort, CheckSortKey, SortedChecks } from './sorted-checks.ts';

/** A vessel's newest check as its month bucket row has it (no record is read). */
export interface LatestCheck {
  vesselId: string;
  id: string;
  timeMs: number;
  deviceId: string;
  seq: number;
  technician: string;
  verdict: StoredVerdict | null;
  /** The most severe signal word among its findings, or 'none'. */
  outcome: StoredOutcome;
  /** Its findings' signal words, most severe first. */
  findingSignals: Signal[];
}

/**
 * The newest check of each vessel named (by the instant taken; ties by id), or null for a vessel with
 * none. Read from the top of each vessel's month buckets: a step per vessel, whatever the log holds.
 * @throws StoreError('invalid-record') for an id that is not a UUID
 */
export async function latestChecks(vesselIds: readonly string[]): Promise<(LatestCheck | null)[]> {
  vesselIds.forEach((id, i) => requireUuid(`vesselIds[${i}]`, id));
  const rows = await latestRows((await getDb()).transaction(LOG_STORES), vesselIds);
  return rows.map((r, i) => r === undefined ? null : {
    vesselId: vesselIds[i]!, timeMs: r[0], id: r[1], deviceId: r[2], seq: r[3], verdict: r[4], technician: r[6],
    outcome: outcomeOfMask(r[5]), findingSignals: SIGNAL_ORDER.filter((_, bit) => (r[5] & (1 << bit)) !== 0),
  });
}

/**
 * The newest record of `kind` about each vessel named (by instant; ties by id), as its logKinds row
 * says (no record is read): { timeMs, id }, or null for a vessel with none. One cursor step per vessel.
 * @throws StoreError('invalid-record') for a bad kind or vessel id
 */
export async function latestOfKind(kind: string, vesselIds: readonly string[]): Promise<({ timeMs: number; id: string } | null)[]> {
  requireText('kind', kind, 1, 64);
  vesselIds.forEach((id, i) => requireUuid(`vesselIds[${i}]`, id));
  const kinds = (await getDb()).transaction(LOG_STORES).objectStore('logKinds');
  return Promise.all(vesselIds.map(async (vesselId) => {
    const cursor = await kinds.openCursor(IDBKeyRange.bound([kind, vesselId, -Infinity], [kind, vesselId, Infinity, '\uffff']), 'prev');
    return cursor ? { timeMs: cursor.value.timeMs, id: cursor.value.id } : null;
  }));
}

