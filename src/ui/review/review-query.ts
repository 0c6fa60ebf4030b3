// Filtered, cursor-paged reading of the check log. The store answers the whole filter (vessel,
// dates, verdict, outcome, technician, device) from its month buckets and reads only the
// records of each page, so nothing reads the whole log into memory.
import { listVessels, queryChecks, type CheckCursor, type CheckFilter, type CheckRecord, type VesselRecord } from '../../store/index.ts';
import { sortChecks, type CheckSortKey, type SortedChecks } from '../../store/desk.ts';
import type { ReviewFilter } from './review-filter.ts';

/** The review's filter as the store takes it. */
export function storeFilter(f: ReviewFilter): CheckFilter {
  return {
    ...(f.vesselId !== null ? { vesselId: f.vesselId } : {}),
    ...(f.fromMs !== null ? { from: new Date(f.fromMs) } : {}),
    ...(f.toMs !== null ? { to: new Date(f.toMs) } : {}),
    ...(f.verdict !== null ? { verdict: f.verdict } : {}),
    ...(f.outcome !== null ? { outcome: f.outcome } : {}),
    ...(f.technician.trim() !== '' ? { technician: f.technician } : {}),
    ...(f.device.trim() !== '' ? { device: f.device } : {}),
  };
}

export interface ReviewPage {
  rows: CheckRecord[];
  /** False when no more records can match. */
  more: boolean;
}

/** Pages of records matching a filter, newest (or oldest) first. */
export class ReviewPager {
  private before: CheckCursor | undefined;
  private finished = false;

  constructor(
    private readonly filter: ReviewFilter,
    private readonly pageSize = 50,
    private readonly order: 'newest' | 'oldest' = 'newest',
  ) {}

  /** @param signal when it has aborted, no read is started (the page is empty). */
  async nextPage(signal?: AbortSignal): Promise<ReviewPage> {
    if (this.finished || signal?.aborted) return { rows: [], more: false };
    const page = await queryChecks({
      ...storeFilter(this.filter),
      limit: this.pageSize,
      order: this.order,
      ...(this.before ? { before: this.before } : {}),
    });
    if (page.next === null) this.finished = true;
    else this.before = page.next;
    return { rows: page.checks, more: page.next !== null };
  }
}

/** Every vessel, retired ones too (their checks stay reviewable), for the filter's picker. */
export function reviewVessels(): Promise<VesselRecord[]> {
  return listVessels({ includeRetired: true });
}

/** The wide table's order: a store order over the whole match; newest first by default. */
export interface TableSort { by: CheckSortKey; descending: boolean }
export const NEWEST_FIRST: TableSort = { by: 'time', descending: true };

/**
 * Pages of a filter's whole match in the table's order. Time order pages straight from the month
 * buckets (the first rows cost the months they touch); any other order sorts the whole match's
 * month rows once, in the store, and pages through that.
 */
export class TablePager {
  private readonly byTime: ReviewPager | null;
  private sorted: Promise<SortedChecks> | null = null;
  private offset = 0;

  constructor(private readonly filter: ReviewFilter, readonly sort: TableSort, private readonly pageSize = 50) {
    this.byTime = sort.by === 'time' ? new ReviewPager(filter, pageSize, sort.descending ? 'newest' : 'oldest') : null;
  }

  /** The next page; `total` is the whole match's size when the order had to count it (null otherwise). */
  async nextPage(signal?: AbortSignal): Promise<ReviewPage & { total: number | null }> {
    if (this.byTime) return { ...(await this.byTime.nextPage(signal)), total: null };
    if (signal?.aborted) return { rows: [], more: false, total: null };
    this.sorted ??= sortChecks(storeFilter(this.filter), this.sort);
    const sorted = await this.sorted;
    const rows = await sorted.page(this.offset, this.pageSize);
    this.offset += this.pageSize;
    return { rows, more: this.offset < sorted.total, total: sorted.total };
  }
}
