// The plant overview: which vessels need attention today. One row per vessel with its latest
// outcome, when and by whom it was last checked, its due state and open findings; overdue first
// in a group of its own. Read from the newest month row of each vessel, never the whole log.
import { useMemo, useState } from 'preact/hooks';
import './wide-layout.css';
import './desk.css';
import { useVessels } from '../state/app-state.ts';
import { OverviewFilters } from './OverviewFilters.tsx';
import { OverviewTable } from './OverviewTable.tsx';
import { ReviewNoteForm } from './ReviewNoteForm.tsx';
import { useOverview } from './overview-data.ts';
import { NO_OVERVIEW_FILTER, filterOverview, groupOverdue, sortOverview, type OverviewSort } from './overview-rows.ts';

export function OverviewScreen() {
  const all = useVessels();
  const vessels = useMemo(() => all.filter((v) => !v.retired), [all]);
  const [generation, setGeneration] = useState(0);
  const { rows: read, error } = useOverview(vessels, generation);
  const [noting, setNoting] = useState<string | null>(null);
  const [filter, setFilter] = useState(NO_OVERVIEW_FILTER);
  const [sort, setSort] = useState<{ by: OverviewSort; reverse: boolean }>({ by: 'outcome', reverse: false });
  const rows = read ? sortOverview(filterOverview(read, filter), sort.by, sort.reverse) : [];
  const notingRow = noting ? read?.find((r) => r.vessel.id === noting) : undefined;
  const { overdue, others } = groupOverdue(rows);
  const onSort = (by: OverviewSort) => setSort((s) => ({ by, reverse: s.by === by ? !s.reverse : false }));
  const flagged = rows.filter((r) => r.flagged).length;
  return (
    <div class="overview" data-overview-state={read ? 'ready' : 'loading'} data-overview-rows={rows.length} data-overview-generation={generation}>
      <p class="muted">What the last check of each vessel showed, and which checks are due. A finding stays flagged until a later check
        without one, or a supervisor's review note. Defer to local codes, the vessel's inspection regime and licensed practice.</p>
      <OverviewFilters filter={filter} onChange={setFilter} />
      {error ? <p class="field-error" role="alert">The log could not be read: {error}</p> : null}
      {!read ? <p aria-busy="true">Reading each vessel's latest check…</p> : (
        <>
          <p aria-live="polite">{rows.length} of {vessels.length} vessels shown · {overdue.length} overdue · {flagged} flagged</p>
          {notingRow?.latest ? (
            <ReviewNoteForm key={notingRow.vessel.id} row={notingRow} onCancel={() => setNoting(null)}
              onSaved={() => { setNoting(null); setGeneration((g) => g + 1); }} />
          ) : null}
          {overdue.length > 0 ? <OverviewTable caption={`Overdue (${overdue.length})`} rows={overdue} sort={sort.by} reverse={sort.reverse} onSort={onSort} onNote={setNoting} /> : null}
          <OverviewTable caption={overdue.length > 0 ? `All other vessels (${others.length})` : `Vessels (${others.length})`} rows={others} sort={sort.by} reverse={sort.reverse} onSort={onSort} onNote={setNoting} />
        </>
      )}
    </div>
  );
}
