// One log row as the review list shows it, and its orders: newest and oldest first over the whole
// match (the store pages in that order), the others over the rows shown so far.
import type { CheckRecord } from '../../store/index.ts';
import { OUTCOMES, factsOf, stampText, verdictLabel, type Outcome, type VerdictId } from './record-facts.ts';

export interface RowView {
  id: string;
  timeMs: number;
  /** "2026-12-01 14:05 +01:00": the time as the technician's device stamped it. */
  when: string;
  vesselTag: string;
  verdict: VerdictId;
  verdictText: string;
  /** The worst signal word among the check's findings, or 'none'. */
  outcome: Outcome;
  technician: string;
  deviceShort: string;
  correction: boolean;
}

export function rowView(r: CheckRecord): RowView {
  const f = factsOf(r);
  return {
    id: r.id,
    timeMs: r.timeMs,
    when: stampText(r.time),
    vesselTag: r.vessel.tag,
    verdict: f.verdict,
    verdictText: verdictLabel(f.verdict),
    outcome: f.outcome,
    technician: r.technician,
    deviceShort: r.deviceId.slice(0, 8),
    correction: r.corrects !== null,
  };
}

export type RowOrder = 'newest' | 'oldest' | 'vessel' | 'severity' | 'technician';

export const ROW_ORDERS: readonly { id: RowOrder; label: string }[] = [
  { id: 'newest', label: 'Newest first' },
  { id: 'oldest', label: 'Oldest first' },
  { id: 'vessel', label: 'Vessel tag (rows shown)' },
  { id: 'severity', label: 'Most severe outcome (rows shown)' },
  { id: 'technician', label: 'Technician (rows shown)' },
];

const severity = (o: Outcome) => OUTCOMES.indexOf(o);

/** The rows in the chosen order; ties stay newest first. A new array; the input is untouched. */
export function sortRows(rows: readonly RowView[], order: RowOrder): RowView[] {
  const newest = (a: RowView, b: RowView) => b.timeMs - a.timeMs || (a.id < b.id ? 1 : -1);
  const by: Record<RowOrder, (a: RowView, b: RowView) => number> = {
    newest,
    oldest: (a, b) => -newest(a, b),
    vessel: (a, b) => a.vesselTag.localeCompare(b.vesselTag) || newest(a, b),
    severity: (a, b) => severity(a.outcome) - severity(b.outcome) || newest(a, b),
    technician: (a, b) => a.technician.localeCompare(b.technician) || newest(a, b),
  };
  return [...rows].sort(by[order]);
}
