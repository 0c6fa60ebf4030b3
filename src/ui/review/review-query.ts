// Filtered, cursor-paged reading of the check log. The store answers the whole filter (vessel,
// dates, verdict, outcome, technician, device) from its month buckets and reads only the
// records of each page, so nothing reads the whole log into memory.
import { listVessels, queryChecks, type CheckCursor, type CheckFilter, type CheckRecord, type VesselRecord } from '../../store/index.ts';
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
