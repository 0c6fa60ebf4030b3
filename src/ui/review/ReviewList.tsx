// The matching checks, a page at a time ("Show more" reads the next page from the store), in an
// order over the whole match that the person picks (the store sorts; row-view.ts ROW_ORDERS).
import { hrefFor } from '../router.ts';
import { ROW_ORDERS, sortOfOrder, type RowOrder, type RowView } from './row-view.ts';

interface Props {
  rows: readonly RowView[];
  order: RowOrder;
  /** The order the rows shown are in (the one picked, once its first page has arrived). */
  shownOrder: RowOrder;
  loading: boolean;
  more: boolean;
  onOrder(order: RowOrder): void;
  onMore(): void;
}

export function ReviewList({ rows, order, shownOrder, loading, more, onOrder, onMore }: Props) {
  const sort = sortOfOrder(shownOrder);
  return (
    <section class="panel" aria-labelledby="review-list-title">
      <div class="review-list-head">
        <h2 id="review-list-title">Checks</h2>
        <div class="field">
          <label for="rl-order">Order (every matching check)</label>
          <select id="rl-order" value={order} onChange={(e) => onOrder((e.currentTarget as HTMLSelectElement).value as RowOrder)}>
            {ROW_ORDERS.map((o) => <option key={o.id} value={o.id}>{o.label}</option>)}
          </select>
        </div>
      </div>
      <p class="muted" aria-live="polite" data-review-state={loading ? 'loading' : 'ready'}>
        {loading ? 'Reading the log…' : rows.length === 0 ? 'No checks match this filter.' : `Showing ${rows.length.toLocaleString('en-GB')}${more ? ' (more below)' : ''}.`}
      </p>
      <ul class="review-rows" data-sort-by={sort.by} data-sort-dir={sort.descending ? 'descending' : 'ascending'}>
        {rows.map((r) => (
          <li key={r.id}>
            <a class="review-row" href={hrefFor('log', r.id)} data-check-id={r.id}>
              <span class="review-row-top">
                <strong>{r.vesselTag}</strong>
                <span>{r.when}</span>
              </span>
              <span class="review-row-mid">
                {r.outcome !== 'none' ? <span class={`signal signal-${r.outcome}`}>{r.outcome}</span> : null}
                <span class={`review-verdict review-verdict-${r.verdict}`}>{r.verdictText}</span>
                {r.correction ? <span class="demo-tag">correction</span> : null}
              </span>
              <span class="review-row-low muted">{r.technician} · device {r.deviceShort}</span>
            </a>
          </li>
        ))}
      </ul>
      {more ? <button type="button" onClick={onMore} disabled={loading}>Show more</button> : null}
    </section>
  );
}
