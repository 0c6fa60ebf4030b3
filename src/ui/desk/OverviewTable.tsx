// The overview's table: one row per vessel; the column headings sort; the vessel's tag opens its
// history in the Review. On a phone each row stacks into a card (desk.css).
import { hrefFor } from '../router.ts';
import { dueText, instantText } from '../state/vessel-due.ts';
import { outcomeLabel } from '../review/record-facts.ts';
import { isDemoVessel } from '../state/demo-label.ts';
import { OVERVIEW_SORTS, type OverviewRow, type OverviewSort } from './overview-rows.ts';

interface Props {
  caption: string;
  rows: readonly OverviewRow[];
  sort: OverviewSort;
  reverse: boolean;
  onSort(sort: OverviewSort): void;
  /** Opens the review note form for a flagged vessel. */
  onNote(vesselId: string): void;
}

const COLUMN_OF: Partial<Record<string, OverviewSort>> = { Vessel: 'vessel', 'Latest outcome': 'outcome', 'Last checked': 'last-checked', 'Checked by': 'technician', Due: 'due' };
const COLUMNS = ['Vessel', 'Latest outcome', 'Last checked', 'Checked by', 'Due', 'Open findings'] as const;

export function OverviewTable({ caption, rows, sort, reverse, onSort, onNote }: Props) {
  return (
    <table class="overview-table">
      <caption>{caption}</caption>
      <thead>
        <tr>
          {COLUMNS.map((c) => {
            const id = COLUMN_OF[c];
            if (!id) return <th key={c} scope="col">{c}</th>;
            const current = id === sort;
            const label = OVERVIEW_SORTS.find((s) => s.id === id)!.label;
            return (
              <th key={c} scope="col" aria-sort={current ? (reverse ? 'descending' : 'ascending') : undefined}>
                <button type="button" class="sort-button" onClick={() => onSort(id)} data-sort-column={id}>
                  {c}<span class="visually-hidden">: sort by {label.toLowerCase()}</span>{current ? (reverse ? ' ▲' : ' ▼') : ''}
                </button>
              </th>
            );
          })}
        </tr>
      </thead>
      <tbody>
        {rows.map((r) => (
          <tr key={r.vessel.id} data-vessel-tag={r.vessel.tag} data-outcome={r.outcome ?? 'not-checked'} data-due-state={r.due.state} data-flagged={String(r.flagged)}>
            <th scope="row" data-label="Vessel">
              <a href={hrefFor('review', r.vessel.id)}>{r.vessel.tag}</a>
              {isDemoVessel(r.vessel) ? <> <span class="demo-tag">DEMO DATA</span></> : null}
            </th>
            <td data-label="Latest outcome">
              {r.outcome === null ? 'no check on record' : r.outcome === 'none' ? outcomeLabel('none') : <span class={`signal signal-${r.outcome}`}>{r.outcome}</span>}
            </td>
            <td data-label="Last checked">{r.latest ? instantText(r.latest.timeMs) : '—'}</td>
            <td data-label="Checked by">{r.latest?.technician ?? '—'}</td>
            <td data-label="Due" class={`due-${r.due.state}`}>{dueText(r.due)}</td>
            <td data-label="Open findings">
              {openFindingsText(r)}
              {r.flagged ? <> <button type="button" class="note-button" onClick={() => onNote(r.vessel.id)}>Review note<span class="visually-hidden"> on {r.vessel.tag}</span></button></> : null}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

function openFindingsText(r: OverviewRow): string {
  if (!r.latest || r.latest.findingSignals.length === 0) return 'none';
  const words = r.latest.findingSignals.join(', ');
  return r.flagged ? `${words}: needs a look` : `${words}: cleared by a review note`;
}
