// The review's filtered paging and totals against a brute-force reading of the same log: whatever
// the filter, page size and order, paging returns exactly the matching records, in order, once each.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { loose, useFreshDatabase } from '../../store/fixtures.ts';
import { isStandingRule } from '../../../src/core/index.ts';
import { addVessel, appendCheck, listChecks, type CheckRecord, type StoredCaution } from '../../../src/store/index.ts';
import { NO_FILTER, type ReviewFilter } from '../../../src/ui/review/review-filter.ts';
import { ReviewPager } from '../../../src/ui/review/review-query.ts';
import { countTotals } from '../../../src/ui/review/review-totals.ts';
import { outcomeOf, OUTCOMES, verdictOf, VERDICTS } from '../../../src/ui/review/record-facts.ts';

useFreshDatabase();

const T0 = Date.parse('2026-11-01T00:00:00Z');
const HOUR = 3_600_000;
const TECHS = ['A. Lindqvist', 'M. Osei', 'K. Tanaka'];
const VERDICT_IDS = ['consistent', 'pressure-above-saturation', 'pressure-below-saturation'] as const;
const CAUTIONS: StoredCaution[][] = [
  [],
  [{ signal: 'CAUTION', message: 'Test caution.', rule: 'test-caution' }],
  [{ signal: 'WARNING', message: 'Test warning.', rule: 'test-warning' }, { signal: 'NOTICE', message: 'Test notice.', rule: 'test-notice' }],
  [{ signal: 'DANGER', message: 'Test danger.', rule: 'test-danger' }],
  // Standing hazards and a method note only: on every hot check, never the outcome.
  [{ signal: 'DANGER', message: 'Test door.', rule: 'do-not-open-under-pressure' }, { signal: 'WARNING', message: 'Test flash.', rule: 'flash-on-release' }, { signal: 'NOTICE', message: 'Test limits.', rule: 'saturation-check-limits' }],
  [{ signal: 'WARNING', message: 'Test flash.', rule: 'flash-on-release' }, { signal: 'CAUTION', message: 'Test below.', rule: 'pressure-below-saturation' }],
];

/** A small invented log: 3 vessels, 60 checks spread over 30 days, some sharing one instant. */
async function buildLog(): Promise<CheckRecord[]> {
  const vessels = [];
  for (const tag of ['RX-1', 'RX-2', 'RX-3']) vessels.push(await addVessel({ tag, spec: loose.spec({ volumeM3: 1 }) }));
  for (let i = 0; i < 60; i += 1) {
    // i % 7 === 0 reuses the previous instant, so ties broken by id are exercised.
    const hours = i % 7 === 0 && i > 0 ? (i - 1) * 12 : i * 12;
    await appendCheck({
      vesselId: vessels[i % 3]!.id,
      technician: TECHS[i % TECHS.length]!,
      takenAt: new Date(T0 + hours * HOUR),
      inputs: {},
      reading: loose.reading({}),
      result: loose.result({ saturation: { verdict: { verdict: VERDICT_IDS[i % 3]! }, pressureDeviationPa: i * 10 } }),
      cautions: [...CAUTIONS[i % CAUTIONS.length]!, { signal: 'NOTICE', message: 'Standing note.', rule: 'standing-note' }],
      appVersion: 'test',
      formulationId: 'IAPWS-IF97 (R7-97(2012))',
    });
  }
  const all: CheckRecord[] = [];
  let before;
  for (;;) {
    const page = await listChecks({ limit: 1000, ...(before ? { before } : {}) });
    all.push(...page.checks);
    if (!page.next) return all;
    before = page.next;
  }
}

/** The worst signal word among a record's cautions that are not standing items (the core's classification), or none. */
function ownOutcome(r: CheckRecord): string {
  const words = ['DANGER', 'WARNING', 'CAUTION', 'NOTICE'];
  const worst = Math.min(...r.cautions.filter((c) => !isStandingRule(c.rule)).map((c) => words.indexOf(c.signal)), 4);
  return worst === 4 ? 'none' : words[worst]!;
}

/** The filter read straight off each record (this test's own reading, not the store's buckets). */
function matches(r: CheckRecord, f: ReviewFilter): boolean {
  const verdict = (r.result as { saturation?: { verdict?: { verdict?: string } } }).saturation?.verdict?.verdict;
  if (f.vesselId !== null && r.vesselId !== f.vesselId) return false;
  if (f.fromMs !== null && r.timeMs < f.fromMs) return false;
  if (f.toMs !== null && r.timeMs > f.toMs) return false;
  if (f.verdict !== null && (VERDICT_IDS.includes(verdict as never) ? verdict : 'none') !== f.verdict) return false;
  if (f.outcome !== null && ownOutcome(r) !== f.outcome) return false;
  if (f.technician.trim() !== '' && !r.technician.toLowerCase().includes(f.technician.trim().toLowerCase())) return false;
  if (f.device.trim() !== '' && !r.deviceId.toLowerCase().startsWith(f.device.trim().toLowerCase())) return false;
  return true;
}

function expected(all: CheckRecord[], f: ReviewFilter, order: 'newest' | 'oldest' = 'newest'): string[] {
  const ids = all
    .filter((r) => matches(r, f))
    .sort((a, b) => b.timeMs - a.timeMs || (a.id < b.id ? 1 : -1))
    .map((r) => r.id);
  return order === 'newest' ? ids : ids.reverse();
}

async function pageAll(f: ReviewFilter, pageSize: number, order: 'newest' | 'oldest' = 'newest'): Promise<string[]> {
  const pager = new ReviewPager(f, pageSize, order);
  const ids: string[] = [];
  for (let guard = 0; guard < 200; guard += 1) {
    const page = await pager.nextPage();
    expect(page.rows.length).toBeLessThanOrEqual(pageSize);
    ids.push(...page.rows.map((r) => r.id));
    if (!page.more) return ids;
  }
  throw new Error('pager never finished');
}

describe('ReviewPager and countTotals', () => {
  it('return exactly the matching records for random filters and page sizes', async () => {
    const all = await buildLog();
    expect(all).toHaveLength(60);
    const vesselIds = [...new Set(all.map((r) => r.vesselId))];
    const devices = [...new Set(all.map((r) => r.deviceId))];
    const times = all.map((r) => r.timeMs);
    const filterArb = fc.record({
      vesselId: fc.option(fc.constantFrom(...vesselIds), { nil: null }),
      // Bounds often land exactly on a check's instant: both ends are inclusive.
      fromMs: fc.option(fc.oneof(fc.constantFrom(...times), fc.integer({ min: T0 - 2 * HOUR * 24, max: T0 + 32 * 24 * HOUR })), { nil: null }),
      toMs: fc.option(fc.oneof(fc.constantFrom(...times), fc.integer({ min: T0 - 2 * HOUR * 24, max: T0 + 32 * 24 * HOUR })), { nil: null }),
      verdict: fc.option(fc.constantFrom(...VERDICTS.map((v) => v.id)), { nil: null }),
      outcome: fc.option(fc.constantFrom(...OUTCOMES), { nil: null }),
      technician: fc.constantFrom('', 'osei', 'TANAKA', 'nobody'),
      device: fc.constantFrom('', devices[0]!.slice(0, 4), 'zzzz'),
      pageSize: fc.integer({ min: 1, max: 25 }),
      order: fc.constantFrom<'newest' | 'oldest'>('newest', 'oldest'),
    });
    await fc.assert(
      fc.asyncProperty(filterArb, async (a) => {
        const f: ReviewFilter = {
          ...NO_FILTER,
          vesselId: a.vesselId,
          fromMs: a.fromMs,
          toMs: a.toMs,
          verdict: a.verdict,
          outcome: a.outcome,
          technician: a.technician,
          device: a.device,
        };
        const want = expected(all, f, a.order);
        expect(await pageAll(f, a.pageSize, a.order)).toEqual(want);
        const totals = await countTotals(f);
        expect(totals?.checks).toBe(want.length);
        const picked = all.filter((r) => want.includes(r.id));
        for (const v of VERDICTS) expect(totals?.byVerdict[v.id]).toBe(picked.filter((r) => verdictOf(r) === v.id).length);
        for (const o of OUTCOMES) expect(totals?.byOutcome[o]).toBe(picked.filter((r) => ownOutcome(r) === o).length);
        for (const r of picked) expect(outcomeOf(r)).toBe(ownOutcome(r));
      }),
      { numRuns: 40 },
    );
  });

  it('keeps checks taken exactly at either bound (both ends inclusive), with and without a vessel', async () => {
    const all = await buildLog();
    for (const r of all.slice(0, 12)) {
      for (const f of [
        { ...NO_FILTER, toMs: r.timeMs },
        { ...NO_FILTER, fromMs: r.timeMs, toMs: r.timeMs },
        { ...NO_FILTER, vesselId: r.vesselId, fromMs: r.timeMs, toMs: r.timeMs },
      ]) {
        const got = await pageAll(f, 7);
        expect(got).toContain(r.id);
        expect(got).toEqual(expected(all, f));
      }
    }
  });

  it('stops counting when cancelled and reports nothing', async () => {
    await buildLog();
    const stop = new AbortController();
    stop.abort();
    expect(await countTotals(NO_FILTER, { signal: stop.signal })).toBeNull();
  });

  it('standing hazards, method notes and the standing note never make an outcome', async () => {
    const all = await buildLog();
    const onlyStanding = all.filter((r) => r.cautions.every((c) => isStandingRule(c.rule)));
    expect(onlyStanding.length).toBeGreaterThan(0);
    expect(onlyStanding.some((r) => r.cautions.some((c) => c.signal === 'DANGER'))).toBe(true);
    for (const r of onlyStanding) expect(outcomeOf(r)).toBe('none');
    const totals = await countTotals(NO_FILTER);
    expect(totals?.byOutcome.none).toBe(onlyStanding.length);
  });
});
