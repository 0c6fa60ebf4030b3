// Filtered, cursor-paged reading of the check log through the store's public listing functions:
// a vessel filter walks the store's vessel-and-time index (checksForVessel), anything else walks
// the whole-log time index (listChecks) from the `to` bound down and stops at `from`. Verdict,
// signal word, technician and device are tested record by record on the way (the store has no
// index for them). Only one store page is held at a time; nothing reads the whole log into memory.
import { checksForVessel, listChecks, listVessels, type CheckCursor, type CheckRecord, type VesselRecord } from '../../store/index.ts';
import { matches, needsScan, type ReviewFilter } from './review-filter.ts';

/** The store's largest page. */
const STORE_PAGE_MAX = 1000;

/** Store pages of the filter's vessel and time window, newest first, unfiltered beyond those. */
export class LogWalk {
  private before: CheckCursor | undefined;
  private finished = false;

  constructor(private readonly filter: ReviewFilter) {
    // listChecks' `before` is exclusive; one millisecond past `to` keeps every record at `to`.
    if (filter.vesselId === null && filter.toMs !== null) this.before = { timeMs: filter.toMs + 1, id: '' };
  }

  get done(): boolean {
    return this.finished;
  }

  /** The next store page (at most `limit` records, 1–1000) inside the vessel and time window. */
  async nextBatch(limit: number): Promise<CheckRecord[]> {
    if (this.finished) return [];
    const f = this.filter;
    const size = Math.min(STORE_PAGE_MAX, Math.max(1, Math.floor(limit)));
    const page =
      f.vesselId !== null
        ? await checksForVessel(f.vesselId, {
            limit: size,
            ...(f.fromMs !== null ? { from: new Date(f.fromMs) } : {}),
            ...(f.toMs !== null ? { to: new Date(f.toMs) } : {}),
            ...(this.before ? { before: this.before } : {}),
          })
        : await listChecks({ limit: size, ...(this.before ? { before: this.before } : {}) });
    let rows = page.checks;
    if (f.vesselId === null && f.fromMs !== null) {
      const from = f.fromMs;
      const inside = rows.filter((r) => r.timeMs >= from);
      if (inside.length < rows.length) this.finished = true;
      rows = inside;
    }
    if (page.next === null) this.finished = true;
    else this.before = page.next;
    return rows;
  }
}

export interface ReviewPage {
  rows: CheckRecord[];
  /** False when no more records can match. */
  more: boolean;
}

/**
 * Pages of records matching a filter, newest first. Each call to nextPage returns up to pageSize
 * matches; rows read from the store past the page are kept for the next call, so none is skipped.
 */
export class ReviewPager {
  private readonly walk: LogWalk;
  private buffer: CheckRecord[] = [];
  private readonly scan: boolean;
  private scanBatch = 100;

  constructor(private readonly filter: ReviewFilter, private readonly pageSize = 50) {
    this.walk = new LogWalk(filter);
    this.scan = needsScan(filter);
  }

  /** @param signal stops the walk between store pages (the page so far is dropped). */
  async nextPage(signal?: AbortSignal): Promise<ReviewPage> {
    const rows: CheckRecord[] = [];
    while (rows.length < this.pageSize) {
      if (this.buffer.length === 0) {
        if (this.walk.done) break;
        if (signal?.aborted) return { rows: [], more: false };
        // Index-only filters read exactly a page; record-by-record filters read wider and wider
        // pages (100, 200, 400 … 1000), so a common match fills the first page from a short read.
        const batch = await this.walk.nextBatch(this.scan ? this.scanBatch : this.pageSize - rows.length);
        this.scanBatch = Math.min(1000, this.scanBatch * 2);
        this.buffer = this.scan ? batch.filter((r) => matches(r, this.filter)) : batch;
        continue;
      }
      const take = this.buffer.splice(0, this.pageSize - rows.length);
      rows.push(...take);
    }
    return { rows, more: this.buffer.length > 0 || !this.walk.done };
  }
}

/** Every vessel, retired ones too (their checks stay reviewable), for the filter's picker. */
export function reviewVessels(): Promise<VesselRecord[]> {
  return listVessels({ includeRetired: true });
}
