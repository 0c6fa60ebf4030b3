// The whole match of a filter in any order its month rows can give: time, vessel, outcome, verdict,
// technician, device, and the key figures (temperature, pressure, quality, liquid mass). The rows are gathered from one snapshot of the month buckets and sorted once;
// pages then read only the blocks of the checks they show. So a supervisor's sort by outcome covers
// every matching check, not only the rows read so far.
import { getDb } from './connection.ts';
import { windowOf, type CheckFilter } from './checks.ts';
import { SIGNAL_ORDER, VERDICT_IDS } from './facts.ts';
import { LOG_STORES, matchingRows, readRecords, type MonthRow } from './log-layout.ts';
import { isCheckRecord, type CheckRecord } from './records.ts';
import { invalid } from './validate.ts';

/** What the whole match can be sorted by (every one a fact the month rows keep). */
export const CHECK_SORT_KEYS = ['time', 'vessel', 'outcome', 'verdict', 'technician', 'device', 'temperature', 'pressure', 'quality', 'liquid'] as const;
export type CheckSortKey = (typeof CHECK_SORT_KEYS)[number];

/** How to sort: `descending` turns the key's natural order round (newest, Z–A, least severe first). */
export interface CheckSort {
  by: CheckSortKey;
  descending?: boolean;
}

/** A filter's whole match in one order; pages read the records. */
export interface SortedChecks {
  /** How many checks match. */
  total: number;
  /**
   * Checks `offset` to `offset + limit − 1` (limit 1–1000) of the order. A check no longer stored
   * (the log cannot lose one; a hand-edited store can) is left out.
   */
  page(offset: number, limit: number): Promise<CheckRecord[]>;
}

const SEVERITY_OF_MASK = (mask: number): number => {
  for (let bit = 0; bit < SIGNAL_ORDER.length; bit += 1) if ((mask & (1 << bit)) !== 0) return bit;
  return SIGNAL_ORDER.length; // none: after NOTICE
};

const text = (a: string, b: string): number => (a < b ? -1 : a > b ? 1 : 0);

/**
 * The checks a filter covers, sorted over the whole match by `sort.by`: 'time' oldest first,
 * 'vessel' by tag (case-insensitive), 'outcome' most severe first, 'verdict' in the order of
 * VERDICT_IDS with none last, 'technician' and 'device' A–Z, 'temperature', 'pressure' (absolute),
 * 'quality' and 'liquid' (mass) lowest first with checks lacking the figure last either way round
 * (facts.ts keyFiguresOf, kept in the month rows since schema v10); `descending` reverses the key; ties
 * are always newest first, then by id. Reads the month buckets once, the vessel tags once.
 * @throws StoreError('invalid-record') naming a bad filter field or sort key
 */
export async function sortChecks(filter: CheckFilter, sort: CheckSort): Promise<SortedChecks> {
  const w = windowOf(filter);
  if (!(CHECK_SORT_KEYS as readonly string[]).includes(sort.by)) throw invalid('sort.by', `expected one of ${CHECK_SORT_KEYS.join(', ')}`);
  const db = await getDb();
  const tx = db.transaction([...LOG_STORES, 'vessels'] as const);
  const [{ rows, vesselIds }, vessels] = await Promise.all([matchingRows(tx, w), sort.by === 'vessel' ? tx.objectStore('vessels').getAll() : []]);
  const sign = sort.descending === true ? -1 : 1;
  const order = rows.map((_, i) => i);
  const key = keyOf(sort.by, rows, vesselIds, new Map(vessels.map((v) => [v.id, v.tagKey])));
  const newest = (a: number, b: number): number => rows[b]![0] - rows[a]![0] || text(rows[b]![1], rows[a]![1]);
  // A check without the figure sorted by goes last either way round (it has nothing to compare).
  const missing = FIGURE_AT[sort.by] === undefined ? null : rows.map((r) => (typeof r[FIGURE_AT[sort.by]!] === 'number' ? 0 : 1));
  order.sort((a, b) => (missing ? missing[a]! - missing[b]! : 0) || sign * key(a, b) || newest(a, b));
  return {
    total: order.length,
    async page(offset: number, limit: number): Promise<CheckRecord[]> {
      if (!Number.isInteger(offset) || offset < 0) throw invalid('offset', `${offset}; expected a whole number ≥ 0`);
      if (!Number.isInteger(limit) || limit < 1 || limit > 1000) throw invalid('limit', `${limit}; allowed 1 to 1000`);
      const refs = order.slice(offset, offset + limit).map((i) => ({ deviceId: rows[i]![2], seq: rows[i]![3] }));
      const read = await readRecords((await getDb()).transaction(LOG_STORES), refs);
      return read.filter((r): r is CheckRecord => r !== undefined && isCheckRecord(r));
    },
  };
}

/** Where each key figure sits in a month row (log-layout.ts MonthRow, schema v10). */
const FIGURE_AT: Partial<Record<CheckSortKey, 7 | 8 | 9 | 10>> = { temperature: 7, pressure: 8, quality: 9, liquid: 10 };

function keyOf(by: CheckSortKey, rows: readonly MonthRow[], vesselIds: readonly string[], tags: ReadonlyMap<string, string>): (a: number, b: number) => number {
  const at = FIGURE_AT[by];
  if (at !== undefined) {
    const value = Float64Array.from(rows, (r) => r[at] ?? 0);
    return (a, b) => value[a]! - value[b]!;
  }
  switch (by) {
    case 'time': return (a, b) => rows[a]![0] - rows[b]![0] || text(rows[a]![1], rows[b]![1]);
    case 'vessel': {
      // A vessel not in the inventory (checks pulled or imported without it) sorts by its id, after every tag.
      const tagOf = vesselIds.map((id) => tags.get(id) ?? `\uffff${id}`);
      return (a, b) => text(tagOf[a]!, tagOf[b]!);
    }
    case 'outcome': {
      const rank = rows.map((r) => SEVERITY_OF_MASK(r[5]));
      return (a, b) => rank[a]! - rank[b]!;
    }
    case 'verdict': {
      const rank = rows.map((r) => (r[4] === null ? VERDICT_IDS.length : VERDICT_IDS.indexOf(r[4])));
      return (a, b) => rank[a]! - rank[b]!;
    }
    case 'technician': {
      const folded = rows.map((r) => r[6].toLowerCase());
      return (a, b) => text(folded[a]!, folded[b]!);
    }
    case 'device': return (a, b) => text(rows[a]![2], rows[b]![2]);
    default: throw invalid('sort.by', `expected one of ${CHECK_SORT_KEYS.join(', ')}`);
  }
}
