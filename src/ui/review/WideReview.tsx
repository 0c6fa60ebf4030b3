// The Review at 1024 px and wider: the filter and totals in a side panel, the checks as a table,
// the chosen check's full record beside it.
import type { ComponentChildren } from 'preact';
import type { CheckRecord } from '../../store/index.ts';
import { CheckRecordView } from '../components/CheckRecordView.tsx';
import { useSettings } from '../state/app-state.ts';
import { unitsInForce } from '../state/settings-model.ts';
import type { ReviewFilter } from './review-filter.ts';
import { ReviewTable } from './ReviewTable.tsx';

interface Props {
  side: ComponentChildren;
  filter: ReviewFilter;
  generation: number;
  /** The record shown beside the table; held by the screen, so a layout change (a rotated tablet) keeps it. */
  open: CheckRecord | null;
  onOpen(record: CheckRecord): void;
}

export function WideReview({ side, filter, generation, open, onOpen: setOpen }: Props) {
  const prefs = unitsInForce(useSettings());
  return (
    <div class="review-desk">
      <aside class="review-side" aria-label="Filter and totals">{side}</aside>
      <ReviewTable filter={filter} generation={generation} prefs={prefs} openId={open?.id ?? null} onOpen={setOpen} />
      <aside class="review-record" aria-label="The chosen check" data-open-record={open?.id ?? ''}>
        {open ? <CheckRecordView record={open} /> : <p class="panel muted">Pick a row (click, or arrow keys and Enter) to see its full record here.</p>}
      </aside>
    </div>
  );
}
