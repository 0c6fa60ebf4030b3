// The plant overview's rows: one per vessel, from its newest check's month row (the store never
// reads a record for it) and the core's due state; how they sort, filter and group.
import { CHECK_DUE_ORDER } from '../../core/basics.ts';
import type { CheckDue, CheckDueState } from '../../core/basics.ts';
import type { Outcome } from '../state/outcome.ts';
import type { VesselDue } from '../state/vessel-due.ts';

export interface OverviewRow extends VesselDue {
  /** The newest check's outcome, or null for a vessel never checked. */
  outcome: Outcome | null;
  /** Its latest check showed a finding that no later check or review note has cleared. */
  flagged: boolean;
}

/** A review note as the overview needs it: when it was written, on which vessel. */
export interface NoteMark { vesselId: string; timeMs: number }

/**
 * The rows of the overview. A vessel is flagged while its newest check has a finding (outcome other
 * than none), until a later check without one or a review note written at or after that check.
 */
export function overviewRows(dues: readonly VesselDue[], notes: readonly NoteMark[] = []): OverviewRow[] {
  const lastNote = new Map<string, number>();
  for (const n of notes) lastNote.set(n.vesselId, Math.max(lastNote.get(n.vesselId) ?? -Infinity, n.timeMs));
  return dues.map((d) => {
    const outcome = d.latest ? d.latest.outcome : null;
    const noted = d.latest !== null && (lastNote.get(d.vessel.id) ?? -Infinity) >= d.latest.timeMs;
    return { ...d, outcome, flagged: outcome !== null && outcome !== 'none' && !noted };
  });
}

export type OverviewSort = 'vessel' | 'outcome' | 'last-checked' | 'due' | 'technician';
export const OVERVIEW_SORTS: readonly { id: OverviewSort; label: string }[] = [
  { id: 'outcome', label: 'Latest outcome' },
  { id: 'due', label: 'Due' },
  { id: 'last-checked', label: 'Last checked' },
  { id: 'vessel', label: 'Vessel' },
  { id: 'technician', label: 'Checked by' },
];

const SEVERITY: readonly (Outcome | null)[] = ['DANGER', 'WARNING', 'CAUTION', 'NOTICE', 'none', null];
const dueRank = (d: CheckDue) => CHECK_DUE_ORDER.indexOf(d.state);
const dueAt = (d: CheckDue) => ('dueMs' in d ? d.dueMs : 0);
const byTag = (a: OverviewRow, b: OverviewRow) => a.vessel.tagKey.localeCompare(b.vessel.tagKey);

const COMPARE: Record<OverviewSort, (a: OverviewRow, b: OverviewRow) => number> = {
  // Most severe first; a flagged vessel before one whose finding a note cleared.
  outcome: (a, b) => SEVERITY.indexOf(a.outcome) - SEVERITY.indexOf(b.outcome) || Number(b.flagged) - Number(a.flagged),
  due: (a, b) => dueRank(a.due) - dueRank(b.due) || dueAt(a.due) - dueAt(b.due),
  // Longest since checked first; never checked before all.
  'last-checked': (a, b) => (a.latest?.timeMs ?? -Infinity) - (b.latest?.timeMs ?? -Infinity),
  vessel: byTag,
  technician: (a, b) => (a.latest?.technician ?? '\uffff').localeCompare(b.latest?.technician ?? '\uffff'),
};

/** The rows in the chosen order (most urgent first; `reverse` turns it round), ties by tag. A new array. */
export function sortOverview(rows: readonly OverviewRow[], sort: OverviewSort, reverse = false): OverviewRow[] {
  const sign = reverse ? -1 : 1;
  return [...rows].sort((a, b) => sign * COMPARE[sort](a, b) || byTag(a, b));
}

export interface OverviewFilter {
  /** Start of the tag, any case. */
  tag: string;
  /** '' any; an outcome; 'not-checked' for vessels with no check. */
  outcome: '' | Outcome | 'not-checked';
  /** '' everything; 'flagged'; 'due' (overdue, never checked or due today). */
  attention: '' | 'flagged' | 'due';
}

export const NO_OVERVIEW_FILTER: OverviewFilter = { tag: '', outcome: '', attention: '' };

const DUE_STATES: ReadonlySet<CheckDueState> = new Set(['overdue', 'never-checked', 'due-today']);

export function filterOverview(rows: readonly OverviewRow[], f: OverviewFilter): OverviewRow[] {
  const tag = f.tag.trim().toLowerCase();
  return rows.filter((r) =>
    (tag === '' || r.vessel.tagKey.startsWith(tag)) &&
    (f.outcome === '' || (f.outcome === 'not-checked' ? r.outcome === null : r.outcome === f.outcome)) &&
    (f.attention === '' || (f.attention === 'flagged' ? r.flagged : DUE_STATES.has(r.due.state))));
}

/** Overdue vessels (past their due time, or an interval and no check on record) as their own group, then the rest. */
export function groupOverdue(rows: readonly OverviewRow[]): { overdue: OverviewRow[]; others: OverviewRow[] } {
  const late = (r: OverviewRow) => r.due.state === 'overdue' || r.due.state === 'never-checked';
  return { overdue: rows.filter(late), others: rows.filter((r) => !late(r)) };
}
