// Totals for a filter, counted by the store from its month buckets (no record is read), reported
// as they grow so the screen can show them.
import { tallyChecks, type CheckTally } from '../../store/transfer.ts';
import type { ReviewFilter } from './review-filter.ts';
import { storeFilter } from './review-query.ts';

export type ReviewTotals = CheckTally;

/**
 * Counts the records matching `filter`. Reports the running totals after each month of the log;
 * stops (returning null) when `signal` aborts.
 */
export function countTotals(
  filter: ReviewFilter,
  options: { signal?: AbortSignal; onProgress?: (sofar: ReviewTotals) => void } = {},
): Promise<ReviewTotals | null> {
  return tallyChecks(storeFilter(filter), options);
}
