// The plant overview: which vessels need attention today. One row per vessel with its latest
// outcome, when and by whom it was last checked, its due state and open findings; overdue first
// in a group of its own. Read from the newest month row of each vessel, never the whole log.
import { useState } from 'preact/hooks';
import './desk.css';
import { useVessels } from '../state/app-state.ts';
import { useVesselDues } from '../state/vessel-due.ts';
import { OverviewFilters } from './OverviewFilters.tsx';
import { OverviewTable } from './OverviewTable.tsx';
import { NO_OVERVIEW_FILTER, filterOverview, groupOverdue, overviewRows, sortOverview, type OverviewSort } from './overview-rows.ts';

export function OverviewScreen() {
  const vessels = useVessels().filter((v) => !v.retired);
  const { dues, error } = useVesselDues(vessels);
  const [filter, setFilter] = useState(NO_OVERVIEW_FILTER);
  const [sort, setSort] = useState<{ by: OverviewSort; reverse: boolean }>({ by: 'outcome', reverse: false });
  const rows = dues ? sortOverview(filterOverview(overviewRows(dues), filter), sort.by, sort.reverse) : [];
  const { overdue, others } = groupOverdue(rows);
  const onSort = (by: OverviewSort) => setSort((s) => ({ by, reverse: s.by === by ? !s.reverse : false }));
  const flagged = rows.filter((r) => r.flagged).length;
  return (
    <div class="overview" data-overview-state={dues ? 'ready' : 'loading'} data-overview-rows={rows.length}>
      <p class="muted">What the last check of each vessel showed, and which checks are due. A finding stays flagged until a later check
        without one, or a supervisor's review note. Defer to local codes, the vessel's inspection regime and licensed practice.</p>
      <OverviewFilters filter={filter} onChange={setFilter} />
      {error ? <p class="field-error" role="alert">The log could not be read: {error}</p> : null}
      {!dues ? <p aria-busy="true">Reading each vessel's latest check…</p> : (
        <>
          <p aria-live="polite">{rows.length} of {vessels.length} vessels shown · {overdue.length} overdue · {flagged} flagged</p>
          {overdue.length > 0 ? <OverviewTable caption={`Overdue (${overdue.length})`} rows={overdue} sort={sort.by} reverse={sort.reverse} onSort={onSort} /> : null}
          <OverviewTable caption={overdue.length > 0 ? `All other vessels (${others.length})` : `Vessels (${others.length})`} rows={others} sort={sort.by} reverse={sort.reverse} onSort={onSort} />
        </>
      )}
    </div>
  );
}
