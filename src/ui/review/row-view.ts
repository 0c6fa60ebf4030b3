// One log row as the review list shows it, and its orders: every one over the whole match (the
// store sorts the match's month rows, sortChecks, and pages through it).
import type { CheckRecord } from '../../store/index.ts';
import { factsOf, stampText, verdictLabel, type Outcome, type VerdictId } from './record-facts.ts';
import type { TableSort } from './review-query.ts';

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

/** The phone list's orders: each a store order over the whole match (sortChecks), not only the rows read. */
export type RowOrder = 'newest' | 'oldest' | 'vessel' | 'severity' | 'verdict' | 'technician' | 'device' | 'temperature' | 'pressure' | 'quality' | 'liquid';

export const ROW_ORDERS: readonly { id: RowOrder; label: string; sort: TableSort }[] = [
  { id: 'newest', label: 'Newest first', sort: { by: 'time', descending: true } },
  { id: 'oldest', label: 'Oldest first', sort: { by: 'time', descending: false } },
  { id: 'severity', label: 'Most severe outcome first', sort: { by: 'outcome', descending: false } },
  { id: 'verdict', label: 'Verdict', sort: { by: 'verdict', descending: false } },
  { id: 'vessel', label: 'Vessel tag A–Z', sort: { by: 'vessel', descending: false } },
  { id: 'technician', label: 'Technician A–Z', sort: { by: 'technician', descending: false } },
  { id: 'device', label: 'Device', sort: { by: 'device', descending: false } },
  { id: 'temperature', label: 'Highest temperature first', sort: { by: 'temperature', descending: true } },
  { id: 'pressure', label: 'Highest absolute pressure first', sort: { by: 'pressure', descending: true } },
  { id: 'quality', label: 'Highest quality first', sort: { by: 'quality', descending: true } },
  { id: 'liquid', label: 'Least liquid mass first', sort: { by: 'liquid', descending: false } },
];

/** The store order a row order stands for. */
export function sortOfOrder(order: RowOrder): TableSort {
  return (ROW_ORDERS.find((o) => o.id === order) ?? ROW_ORDERS[0]!).sort;
}
