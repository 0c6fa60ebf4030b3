import { describe, expect, it } from 'vitest';
import { filterOverview, groupOverdue, overviewRows, sortOverview } from '../../../src/ui/desk/overview-rows.ts';
import { vesselDues, type LatestCheck } from '../../../src/ui/state/vessel-due.ts';
import type { VesselRecord } from '../../../src/store/index.ts';
import type { Signal } from '../../../src/store/facts.ts';

// Invented vessels and checks (demo-style data), only to exercise the grouping and orders.
const vessel = (n: number, tag: string, checkIntervalS?: number): VesselRecord => ({
  id: `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`, tag, tagKey: tag.toLowerCase(), description: '', spec: {} as VesselRecord['spec'],
  retired: false, retiredAt: null, createdAt: '2026-01-01T00:00:00Z', updatedAt: '2026-01-01T00:00:00Z',
  ...(checkIntervalS === undefined ? {} : { checkIntervalS }),
});
const latest = (v: VesselRecord, iso: string, outcome: Signal | 'none', technician = 'T. Tester'): LatestCheck => ({
  vesselId: v.id, id: `c-${v.tag}`, timeMs: Date.parse(iso), deviceId: 'd', seq: 1, technician, verdict: 'consistent',
  outcome, findingSignals: outcome === 'none' ? [] : [outcome],
});

const now = Date.parse('2026-12-04T10:00:00Z');
const day = 86_400;
const vs = [vessel(1, 'AC-1', 7 * day), vessel(2, 'FT-2', day), vessel(3, 'CR-3'), vessel(4, 'JV-4', 30 * day), vessel(5, 'ST-5', 7 * day)];
const last = [
  latest(vs[0]!, '2026-11-20T08:00:00Z', 'WARNING', 'B. Second'),
  latest(vs[1]!, '2026-12-04T09:00:00Z', 'none', 'A. First'),
  latest(vs[2]!, '2026-12-02T09:00:00Z', 'DANGER', 'C. Third'),
  latest(vs[3]!, '2026-12-01T09:00:00Z', 'CAUTION', 'A. First'),
  null,
];

describe('plant overview rows (issue 14)', () => {
  const rows = overviewRows(vesselDues(vs, last, now));

  it('flags a vessel whose newest check has a finding, until a review note at or after it', () => {
    expect(rows.map((r) => [r.vessel.tag, r.outcome, r.flagged])).toEqual([
      ['AC-1', 'WARNING', true], ['FT-2', 'none', false], ['CR-3', 'DANGER', true], ['JV-4', 'CAUTION', true], ['ST-5', null, false],
    ]);
    const noted = overviewRows(vesselDues(vs, last, now), [
      { vesselId: vs[2]!.id, timeMs: Date.parse('2026-12-02T09:00:00Z') },
      { vesselId: vs[3]!.id, timeMs: Date.parse('2026-11-30T09:00:00Z') }, // before the check: still flagged
    ]);
    expect(noted.map((r) => r.flagged)).toEqual([true, false, false, true, false]);
  });

  it('puts overdue vessels (and those with an interval and no check) in their own group', () => {
    const { overdue, others } = groupOverdue(sortOverview(rows, 'due'));
    expect(overdue.map((r) => r.vessel.tag)).toEqual(['AC-1', 'ST-5']);
    expect(others.map((r) => r.vessel.tag)).toEqual(['FT-2', 'JV-4', 'CR-3']);
  });

  it('sorts by outcome (most severe first), by last checked (longest ago first) and reversed', () => {
    expect(sortOverview(rows, 'outcome').map((r) => r.vessel.tag)).toEqual(['CR-3', 'AC-1', 'JV-4', 'FT-2', 'ST-5']);
    expect(sortOverview(rows, 'outcome', true).map((r) => r.vessel.tag)).toEqual(['ST-5', 'FT-2', 'JV-4', 'AC-1', 'CR-3']);
    expect(sortOverview(rows, 'last-checked').map((r) => r.vessel.tag)).toEqual(['ST-5', 'AC-1', 'JV-4', 'CR-3', 'FT-2']);
    expect(sortOverview(rows, 'technician').map((r) => r.vessel.tag)).toEqual(['FT-2', 'JV-4', 'AC-1', 'CR-3', 'ST-5']);
  });

  it('filters by tag start, latest outcome and what needs attention', () => {
    const tags = (f: Parameters<typeof filterOverview>[1]) => filterOverview(rows, f).map((r) => r.vessel.tag);
    expect(tags({ tag: 'a', outcome: '', attention: '' })).toEqual(['AC-1']);
    expect(tags({ tag: '', outcome: 'not-checked', attention: '' })).toEqual(['ST-5']);
    expect(tags({ tag: '', outcome: '', attention: 'flagged' })).toEqual(['AC-1', 'CR-3', 'JV-4']);
    expect(tags({ tag: '', outcome: '', attention: 'due' })).toEqual(['AC-1', 'ST-5']);
  });
});
