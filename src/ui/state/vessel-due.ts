// Each vessel's newest check (from the store's month buckets, never the records) and the core's due
// state of its routine check, for the Vessels screen and the plant overview.
import { useEffect, useState } from 'preact/hooks';
import { CHECK_DUE_ORDER, checkDue, type CheckDue, type CheckDueState } from '../../core/basics.ts';
import * as repo from './repo.ts';
import type { VesselRecord } from './repo.ts';
import { latestChecks, type LatestCheck } from '../../store/desk.ts';
import { formatIsoWithOffset } from '../../store/index.ts';
import { shortTime } from './format.ts';
import { intervalText } from './check-interval.ts';

export type { LatestCheck } from '../../store/desk.ts';

export interface VesselDue {
  vessel: VesselRecord;
  latest: LatestCheck | null;
  due: CheckDue;
}

/** The end of the local calendar day of `nowMs` (the next local midnight). */
export function localDayEndMs(nowMs: number): number {
  const d = new Date(nowMs);
  return new Date(d.getFullYear(), d.getMonth(), d.getDate() + 1).getTime();
}

/** The due state of each vessel at `nowMs`; a stored interval out of range (a hand-edited store) reads as none. */
export function vesselDues(vessels: readonly VesselRecord[], latest: readonly (LatestCheck | null)[], nowMs: number): VesselDue[] {
  const dayEnd = localDayEndMs(nowMs);
  return vessels.map((vessel, i) => {
    const l = latest[i] ?? null;
    let due: CheckDue;
    try {
      due = checkDue(l?.timeMs ?? null, vessel.checkIntervalS ?? null, nowMs, dayEnd);
    } catch {
      due = { state: 'no-interval' };
    }
    return { vessel, latest: l, due };
  });
}

/** Most urgent first (overdue, never checked, due today, in date, no interval), then the soonest due, then by tag. */
export function byUrgency(a: VesselDue, b: VesselDue): number {
  const rank = (d: VesselDue) => CHECK_DUE_ORDER.indexOf(d.due.state);
  const dueOf = (d: VesselDue) => ('dueMs' in d.due ? d.due.dueMs : 0);
  return rank(a) - rank(b) || dueOf(a) - dueOf(b) || a.vessel.tagKey.localeCompare(b.vessel.tagKey);
}

/** The states counted as needing a check today. */
export function isDueToday(state: CheckDueState): boolean {
  return state === 'overdue' || state === 'never-checked' || state === 'due-today';
}

/** An instant shown with this device's zone (the month rows keep the instant, not the zone it was stamped in). */
export function instantText(ms: number): string {
  return shortTime(formatIsoWithOffset(new Date(ms)));
}

/** One line saying the due state, e.g. "overdue since 2026-12-03 09:30 UTC (every 7 days)". */
export function dueText(due: CheckDue): string {
  switch (due.state) {
    case 'no-interval': return 'no check interval set';
    case 'never-checked': return `due now: no check on record (${intervalText(due.intervalS)})`;
    case 'overdue': return `overdue since ${instantText(due.dueMs)} (${intervalText(due.intervalS)})`;
    case 'due-today': return `due today at ${instantText(due.dueMs).slice(11)} (${intervalText(due.intervalS)})`;
    case 'in-date': return `next due ${instantText(due.dueMs)} (${intervalText(due.intervalS)})`;
  }
}

/** The due state of every vessel given, read once per change of the list; null until read. */
export function useVesselDues(vessels: readonly VesselRecord[]): { dues: VesselDue[] | null; error: string } {
  const [state, setState] = useState<{ dues: VesselDue[] | null; error: string }>({ dues: null, error: '' });
  useEffect(() => {
    let live = true;
    latestChecks(vessels.map((v) => v.id)).then(
      (latest) => { if (live) setState({ dues: vesselDues(vessels, latest, Date.now()), error: '' }); },
      (e: unknown) => { if (live) setState({ dues: null, error: repo.storageMessage(e) }); },
    );
    return () => { live = false; };
  }, [vessels]);
  return state;
}
