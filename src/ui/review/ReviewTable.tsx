// The wide review's table of checks: the chosen columns, a sort by any sortable column over the
// whole match (the store sorts), arrow keys to move the row, Enter to open it beside the table.
import { useEffect, useRef, useState } from 'preact/hooks';
import type { CheckRecord } from '../../store/index.ts';
import type { UnitPrefs } from '../state/settings-model.ts';
import { chosenColumns, type Column } from './review-columns.ts';
import { TablePager, type TableSort } from './review-query.ts';
import type { ReviewFilter } from './review-filter.ts';
import { factsOf } from './record-facts.ts';
import { ColumnChooser, useChosenColumns } from './ColumnChooser.tsx';

interface Props {
  filter: ReviewFilter;
  /** Changes when the log changed (an import): the table reads again. */
  generation: number;
  prefs: UnitPrefs;
  openId: string | null;
  onOpen(record: CheckRecord): void;
}

export function ReviewTable({ filter, generation, prefs, openId, onOpen }: Props) {
  const [ids, setIds] = useChosenColumns();
  const columns = chosenColumns(ids);
  const [sort, setSort] = useState<TableSort>({ by: 'time', descending: true });
  const [rows, setRows] = useState<CheckRecord[]>([]);
  // The order the rows shown are in (the one asked for until its first page arrives): what data-sort-by says.
  const [shownSort, setShownSort] = useState<TableSort>(sort);
  const [state, setState] = useState<{ loading: boolean; more: boolean; total: number | null; error: string }>({ loading: true, more: false, total: null, error: '' });
  const [active, setActiveState] = useState(0);
  // Keys can come faster than renders: the handler reads the row the last key moved to, not the last render's.
  const activeNow = useRef(0);
  const setActive = (i: number) => { activeNow.current = i; setActiveState(i); };
  const pager = useRef<TablePager | null>(null);
  const body = useRef<HTMLTableSectionElement>(null);

  useEffect(() => {
    const stop = new AbortController();
    const p = new TablePager(filter, sort);
    pager.current = p;
    setState((s) => ({ ...s, loading: true, error: '' }));
    p.nextPage(stop.signal).then((page) => {
      if (stop.signal.aborted) return;
      setRows(page.rows);
      setShownSort(sort);
      setActive(0);
      setState({ loading: false, more: page.more, total: page.total, error: '' });
    }, (e: unknown) => { if (!stop.signal.aborted) setState({ loading: false, more: false, total: null, error: e instanceof Error ? e.message : String(e) }); });
    return () => stop.abort();
  }, [filter, sort, generation]);

  const more = async () => {
    const p = pager.current;
    if (!p) return;
    setState((s) => ({ ...s, loading: true }));
    const page = await p.nextPage();
    if (pager.current !== p) return;
    setRows((r) => [...r, ...page.rows]);
    setState((s) => ({ ...s, loading: false, more: page.more }));
  };

  const move = (to: number) => {
    const next = Math.max(0, Math.min(rows.length - 1, to));
    setActive(next);
    (body.current?.children[next] as HTMLElement | undefined)?.focus();
  };
  const onKey = (e: KeyboardEvent) => {
    const at = activeNow.current;
    if (e.key === 'ArrowDown') { e.preventDefault(); move(at + 1); }
    else if (e.key === 'ArrowUp') { e.preventDefault(); move(at - 1); }
    else if (e.key === 'Home') { e.preventDefault(); move(0); }
    else if (e.key === 'End') { e.preventDefault(); move(rows.length - 1); }
    else if (e.key === 'Enter' && rows[at]) { e.preventDefault(); onOpen(rows[at]!); }
  };
  const sortBy = (c: Column) => {
    if (!c.sort) return;
    const by = c.sort;
    setSort((s) => (s.by === by ? { by, descending: !s.descending } : { by, descending: by === 'time' }));
  };

  return (
    <section class="panel review-table-panel" aria-labelledby="review-table-title">
      <div class="review-list-head">
        <h2 id="review-table-title">Checks</h2>
        <ColumnChooser chosen={ids} onChange={setIds} />
      </div>
      <p class="muted" aria-live="polite">
        {state.loading ? 'Reading the log…' : state.error ? '' : rows.length === 0 ? 'No checks match this filter.'
          : `Showing ${rows.length.toLocaleString('en-GB')}${state.total !== null ? ` of ${state.total.toLocaleString('en-GB')}` : ''}, sorted over every match. Arrow keys move, Enter opens the record beside the table.`}
      </p>
      {state.error ? <p class="field-error" role="alert">The log could not be read: {state.error}</p> : null}
      <div class="review-table-scroll">
        <table class="review-table" data-review-table-state={state.loading ? 'loading' : 'ready'} data-sort-by={shownSort.by} data-sort-dir={shownSort.descending ? 'descending' : 'ascending'}>
          <thead>
            <tr>
              {columns.map((c) => (
                <th key={c.id} scope="col" aria-sort={c.sort === sort.by ? (sort.descending ? 'descending' : 'ascending') : undefined}>
                  {c.sort ? (
                    <button type="button" class="sort-button" data-sort-column={c.sort} title={c.sortNote} onClick={() => sortBy(c)}>
                      {c.label}{c.sort === sort.by ? (sort.descending ? ' ▼' : ' ▲') : ''}
                    </button>
                  ) : <span>{c.label}</span>}
                </th>
              ))}
            </tr>
          </thead>
          <tbody ref={body} onKeyDown={onKey}>
            {rows.map((r, i) => (
              <tr key={r.id} tabIndex={i === active ? 0 : -1} data-check-id={r.id} data-outcome={factsOf(r).outcome}
                aria-selected={r.id === openId ? 'true' : 'false'} class={r.id === openId ? 'is-open' : undefined}
                onClick={() => { setActive(i); onOpen(r); }} onFocus={() => setActive(i)}>
                {columns.map((c) => c.id === 'outcome'
                  ? <td key={c.id}>{factsOf(r).outcome === 'none' ? 'none' : <span class={`signal signal-${factsOf(r).outcome}`}>{factsOf(r).outcome}</span>}</td>
                  : <td key={c.id}>{c.text(r, prefs)}</td>)}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {state.more ? <button type="button" onClick={() => void more()} disabled={state.loading}>Show more</button> : null}
    </section>
  );
}
