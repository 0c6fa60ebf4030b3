// Which columns the wide review shows: the person's choice, kept for the session.
import { useState } from 'preact/hooks';
import { COLUMNS, DEFAULT_COLUMNS, type ColumnId } from './review-columns.ts';

// Kept outside the component so leaving the Review and coming back keeps the choice.
let chosenNow: readonly ColumnId[] = DEFAULT_COLUMNS;

export function useChosenColumns(): [readonly ColumnId[], (ids: readonly ColumnId[]) => void] {
  const [ids, setIds] = useState(chosenNow);
  return [ids, (next) => { chosenNow = next; setIds(next); }];
}

export function ColumnChooser({ chosen, onChange }: { chosen: readonly ColumnId[]; onChange(ids: readonly ColumnId[]): void }) {
  return (
    <details class="column-chooser">
      <summary>Columns</summary>
      <fieldset>
        <legend>Show these columns</legend>
        {COLUMNS.map((c) => (
          <label key={c.id} class="row">
            <input type="checkbox" class="check" checked={c.id === 'time' || chosen.includes(c.id)} disabled={c.id === 'time'}
              data-column={c.id}
              onChange={(e) => onChange(e.currentTarget.checked ? [...chosen, c.id] : chosen.filter((x) => x !== c.id))} />
            {c.label}
          </label>
        ))}
      </fieldset>
    </details>
  );
}
