// Totals for the filter, counted in the background; they grow as the walk goes on.
import { Fragment } from 'preact';
import type { ReviewTotals as Totals } from './review-totals.ts';
import { OUTCOMES, VERDICTS, outcomeLabel } from './record-facts.ts';

const n = (v: number) => v.toLocaleString('en-GB');

export function ReviewTotals({ totals, complete, paused }: { totals: Totals | null; complete: boolean; paused: boolean }) {
  return (
    <section class="panel" aria-labelledby="review-totals-title">
      <h2 id="review-totals-title">Totals{complete || paused ? '' : ' (counting…)'}</h2>
      {totals ? (
        <dl class="figures review-figures review-totals" data-complete={complete ? 'yes' : 'no'}>
          <dt>Checks</dt><dd data-total="checks">{n(totals.checks)}</dd>
          <dt>Vessels · technicians · devices</dt><dd>{n(totals.vessels)} · {n(totals.technicians)} · {n(totals.devices)}</dd>
          {VERDICTS.filter((v) => totals.byVerdict[v.id] > 0).map((v) => (
            <Fragment key={v.id}><dt>{v.label}</dt><dd>{n(totals.byVerdict[v.id])}</dd></Fragment>
          ))}
          {OUTCOMES.map((o) => (
            <Fragment key={o}><dt>Outcome {outcomeLabel(o)}</dt><dd data-total={`outcome-${o}`}>{n(totals.byOutcome[o])}</dd></Fragment>
          ))}
        </dl>
      ) : <p class="muted">{paused ? 'Counted again when the import is done.' : 'Counting…'}</p>}
    </section>
  );
}
