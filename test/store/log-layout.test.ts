// The block layout of the log (log-layout.ts): whatever order and batches checks arrive in, every
// one is found where the rule says, once, and listings page through them in order. Invented test
// records; the layout never looks inside a record beyond its id, device, seq, vessel and time.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { useFreshDatabase, loose } from './fixtures.ts';
import { getDb } from '../../src/store/connection.ts';
import { canonicalJson, chainFieldsOfText, contentOfText, hashedContent } from '../../src/store/integrity.ts';
import {
  addToLog,
  blockFor,
  BLOCK_TARGET,
  compareRows,
  LOG_STORES,
  LogConflict,
  monthOf,
  monthRowOf,
  MONTH_PART_MAX,
  MONTH_PART_TARGET,
  pageRows,
  placeRows,
  type MonthBucket,
  readRecords,
  seqIndex,
  type MonthRow,
} from '../../src/store/log-layout.ts';
import type { CheckRecord } from '../../src/store/records.ts';
import { idEntriesOf, idEntryOf } from '../../src/store/log-ids.ts';

useFreshDatabase();

const DEVICES = ['aaaaaaaa-0000-4000-8000-000000000001', 'bbbbbbbb-0000-4000-8000-000000000002', 'cccccccc-0000-4000-8000-000000000003'];
const VESSELS = ['11111111-0000-4000-8000-000000000001', '22222222-0000-4000-8000-000000000002'];
const T0 = Date.parse('2026-01-20T00:00:00Z');

/** A minimal record of the shape the store keeps (content beyond the layout's fields is filler). */
function record(deviceIndex: number, seq: number, timeMs: number, vesselIndex: number, corrects: string | null = null): CheckRecord {
  const device = DEVICES[deviceIndex]!;
  return {
    id: `${device.slice(0, 8)}-2222-4000-8000-${String(seq).padStart(12, '0')}`,
    deviceId: device, seq, time: new Date(timeMs).toISOString(), timeMs, technician: 'T. Test', note: '',
    vesselId: VESSELS[vesselIndex]!, vessel: { tag: 'X-1', spec: loose.spec({}) }, inputs: {}, reading: loose.reading({}), result: loose.stored({}), cautions: [],
    appVersion: '0', formulationId: 'test', corrects, reason: corrects ? 'test' : null, prevHash: '0'.repeat(64), hash: 'f'.repeat(64),
  };
}

async function add(records: CheckRecord[]): Promise<void> {
  const tx = (await getDb()).transaction(LOG_STORES, 'readwrite');
  await Promise.all([addToLog(tx, records.map((r) => ({ record: r, text: canonicalJson(r) }))), tx.done]);
}

/** Checks every layout rule over what is stored now, against the records that should be there. */
async function expectLayoutHolds(expected: CheckRecord[]): Promise<void> {
  const db = await getDb();
  const blocks = await db.getAll('logBlocks');
  for (const d of DEVICES) {
    const mine = blocks.filter((b) => b.deviceId === d);
    const starts = mine.map((b) => b.firstSeq);
    mine.forEach((b, i) => {
      expect(b.seqs.length).toBe(b.texts.length);
      expect(b.seqs[0]).toBeGreaterThanOrEqual(b.firstSeq);
      for (let k = 1; k < b.seqs.length; k += 1) expect(b.seqs[k]).toBeGreaterThan(b.seqs[k - 1]!);
      // The rule: every seq a block holds is below the next block's start.
      const next = mine[i + 1];
      if (next) expect(b.seqs.at(-1)!).toBeLessThan(next.firstSeq);
      b.seqs.forEach((s, k) => {
        expect(blockFor(starts, s)).toBe(b.firstSeq);
        expect((JSON.parse(b.texts[k]!) as CheckRecord).seq).toBe(s);
      });
    });
  }
  expect(blocks.reduce((n, b) => n + b.texts.length, 0)).toBe(expected.length);
  const tx = db.transaction(LOG_STORES);
  expect(await readRecords(tx, expected.map((r) => ({ deviceId: r.deviceId, seq: r.seq })))).toEqual(expected);
  // Month parts: each check once, in its vessel and month, sorted; no part over MONTH_PART_MAX; a
  // month's first part starting at (monthMs, ''), every row at or above its part's start and below
  // the next part's.
  const buckets = await db.getAll('logMonthParts');
  const rows: MonthRow[] = [];
  buckets.forEach((b, i) => {
    expect([...b.rows].sort(compareRows)).toEqual(b.rows);
    expect(b.rows.length).toBeLessThanOrEqual(MONTH_PART_MAX);
    const prev = buckets[i - 1];
    if (!prev || prev.vesselId !== b.vesselId || prev.monthMs !== b.monthMs) expect([b.startMs, b.startId]).toEqual([b.monthMs, '']);
    const next = buckets[i + 1];
    const sameMonth = next && next.vesselId === b.vesselId && next.monthMs === b.monthMs;
    for (const r of b.rows) {
      expect(monthOf(r[0])).toBe(b.monthMs);
      expect(r[0] > b.startMs || (r[0] === b.startMs && r[1] >= b.startId)).toBe(true);
      if (sameMonth) expect(r[0] < next.startMs || (r[0] === next.startMs && r[1] < next.startId)).toBe(true);
      rows.push(r);
    }
  });
  expect(rows.map((r) => r[1]).sort()).toEqual(expected.map((r) => r.id).sort());
  // Id buckets: each id where it is stored.
  const ids = new Map<string, unknown>();
  for (const bucket of await db.getAll('logIds')) for (const [id, entry] of idEntriesOf(bucket)) if (entry.at) ids.set(id, entry.at);
  expect(ids).toEqual(new Map(expected.map((r) => [r.id, [r.deviceId, r.seq]])));
}

describe('small pieces', () => {
  it('blockFor: the greatest start at or below a seq; seqIndex: binary search', () => {
    expect(blockFor([], 5)).toBeUndefined();
    expect(blockFor([10, 110, 210], 9)).toBeUndefined();
    expect(blockFor([10, 110, 210], 10)).toBe(10);
    expect(blockFor([10, 110, 210], 209)).toBe(110);
    expect(blockFor([10, 110, 210], 1e9)).toBe(210);
    expect(seqIndex([1, 3, 5, 9], 5)).toBe(2);
    expect(seqIndex([1, 3, 5, 9], 4)).toBe(-1);
    expect(seqIndex([], 1)).toBe(-1);
  });

  it('monthOf: the UTC month of an instant', () => {
    expect(monthOf(Date.parse('2026-02-28T23:59:59.999Z'))).toBe(Date.parse('2026-02-01T00:00:00Z'));
    expect(monthOf(Date.parse('2026-03-01T00:30:00+01:00'))).toBe(Date.parse('2026-02-01T00:00:00Z'));
  });
});

describe('addToLog', () => {
  it('starts a new block after BLOCK_TARGET checks on the head, and fills gaps below it in place', async () => {
    const chain = Array.from({ length: BLOCK_TARGET + 5 }, (_, i) => record(0, i + 1, T0 + i * 60_000, i % 2));
    const gap = chain.filter((r) => r.seq !== 50);
    await add(gap);
    await expectLayoutHolds(gap);
    expect((await (await getDb()).getAll('logBlocks')).map((b) => [b.firstSeq, b.seqs.length])).toEqual([[1, BLOCK_TARGET], [BLOCK_TARGET + 2, 4]]);
    await add([chain[49]!]);
    await expectLayoutHolds(chain);
    expect((await (await getDb()).getAll('logBlocks')).map((b) => [b.firstSeq, b.seqs.length])).toEqual([[1, BLOCK_TARGET + 1], [BLOCK_TARGET + 2, 4]]);
  });

  it('a gap filled in a full head block goes into it, not into a new block above the seqs it holds', async () => {
    const chain = Array.from({ length: BLOCK_TARGET + 1 }, (_, i) => record(0, i + 1, T0 + i * 60_000, 0));
    const gap = chain.filter((r) => r.seq !== 50);
    await add(gap);
    await add([chain[49]!]);
    await expectLayoutHolds(chain);
    expect((await (await getDb()).getAll('logBlocks')).map((b) => [b.firstSeq, b.seqs.length])).toEqual([[1, BLOCK_TARGET + 1]]);
    // The next check on the head starts a new block.
    const next = record(0, BLOCK_TARGET + 2, T0 + 1e9, 0);
    await add([next]);
    await expectLayoutHolds([...chain, next]);
    expect((await (await getDb()).getAll('logBlocks')).map((b) => b.firstSeq)).toEqual([1, BLOCK_TARGET + 2]);
  });

  it('refuses an id or a seq already stored (LogConflict), and the aborted write leaves nothing', async () => {
    const a = record(0, 1, T0, 0);
    await add([a]);
    for (const twin of [{ ...record(0, 2, T0, 0), id: a.id }, { ...record(0, 1, T0, 0), id: 'aaaaaaaa-2222-4000-8000-999999999999' }]) {
      const tx = (await getDb()).transaction(LOG_STORES, 'readwrite');
      const attempt = addToLog(tx, [{ record: twin, text: canonicalJson(twin) }]);
      await expect(attempt).rejects.toBeInstanceOf(LogConflict);
      tx.abort();
      await tx.done.catch(() => {});
    }
    await expectLayoutHolds([a]);
  });

  it('keeps who corrects whom, also when the correction arrives before the check it corrects', async () => {
    const original = record(0, 1, T0, 0);
    const fix = record(1, 1, T0 + 1000, 0, original.id);
    await add([fix]);
    await add([original]);
    const buckets = await (await getDb()).getAll('logIds');
    const entry = buckets.map((b) => idEntryOf(b, original.id)).find((e) => e !== undefined);
    expect(entry).toEqual({ at: [original.deviceId, 1], by: [fix.id] });
  });

  it('whatever the order and batches the checks arrive in, the layout holds (property)', async () => {
    const plan = fc.record({
      // Per device: which seqs exist (1..420, gaps allowed), in what order they are added, in how many batches.
      seqs: fc.array(fc.uniqueArray(fc.integer({ min: 1, max: 420 }), { maxLength: 380 }), { minLength: 1, maxLength: 3 }),
      order: fc.infiniteStream(fc.double({ min: 0, max: 1, noNaN: true })),
      batches: fc.integer({ min: 1, max: 6 }),
    });
    await fc.assert(
      fc.asyncProperty(plan, async ({ seqs, order, batches }) => {
        const db = await getDb();
        const clear = db.transaction(LOG_STORES, 'readwrite');
        await Promise.all([...LOG_STORES.map((s) => clear.objectStore(s).clear()), clear.done]);
        const all = seqs.flatMap((list, d) => list.map((s) => record(d, s, T0 + s * 3_600_000 * 7 + d * 1000, s % 2)));
        const keyed = all.map((r) => ({ r, k: order.next().value as number })).sort((x, y) => x.k - y.k).map((x) => x.r);
        const size = Math.ceil(keyed.length / batches) || 1;
        for (let i = 0; i < keyed.length; i += size) await add(keyed.slice(i, i + size));
        await expectLayoutHolds(all);
      }),
      { numRuns: 25 },
    );
  });
});

describe('month parts', () => {
  const V = VESSELS[0]!;
  const M = Date.UTC(2026, 0, 1);
  const row = (timeMs: number, k: number): MonthRow => [timeMs, `r${String(k).padStart(6, '0')}`, DEVICES[0]!, k + 1, null, 0, 'T'];
  const startOf = (p: MonthBucket) => [p.startMs, p.startId] as const;
  const below = (r: MonthRow, s: readonly [number, string]) => r[0] < s[0] || (r[0] === s[0] && r[1] < s[1]);

  /** The month's parts as addToLog reads them for `rows`: the one holding the lowest row, up to the highest. */
  function partsFor(all: MonthBucket[], rows: MonthRow[]): MonthBucket[] {
    const lo = rows[0]!;
    const hi = rows[rows.length - 1]!;
    let from = 0;
    all.forEach((p, i) => { if (!below(lo, startOf(p))) from = i; });
    return all.filter((p, i) => i >= from && !below(hi, startOf(p)));
  }

  it('rows arriving in any order and batches stay sorted, each in one part, no part over the limit (property)', () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 0, max: 2_500_000_000 }), { minLength: 1, maxLength: 3000 }), fc.integer({ min: 1, max: 40 }), (times, batches) => {
        let stored: MonthBucket[] = [];
        const rows = times.map((t, k) => row(M + t, k));
        const size = Math.ceil(rows.length / batches);
        for (let i = 0; i < rows.length; i += size) {
          const batch = rows.slice(i, i + size).sort(compareRows);
          const written = placeRows(V, M, partsFor(stored, batch), batch);
          const key = (p: MonthBucket) => `${p.startMs} ${p.startId}`;
          const byKey = new Map(stored.map((p) => [key(p), p]));
          for (const p of written) byKey.set(key(p), p);
          stored = [...byKey.values()].sort((a, b) => a.startMs - b.startMs || (a.startId < b.startId ? -1 : 1));
        }
        expect(stored.flatMap((p) => p.rows)).toEqual([...rows].sort(compareRows));
        expect(startOf(stored[0]!)).toEqual([M, '']);
        stored.forEach((p, i) => {
          expect(p.rows.length).toBeLessThanOrEqual(MONTH_PART_MAX);
          const next = stored[i + 1];
          for (const r of p.rows) {
            expect(below(r, startOf(p))).toBe(false);
            if (next) expect(below(r, startOf(next))).toBe(true);
          }
        });
      }),
      { numRuns: 60 },
    );
  });

  it('saves in time order: each save writes one part of at most MONTH_PART_TARGET rows, however large the month', async () => {
    const db = await getDb();
    const n = 2 * MONTH_PART_TARGET + 7;
    const chain = Array.from({ length: n }, (_, i) => record(0, i + 1, T0 + i * 60_000, 0));
    const proto = Object.getPrototypeOf(db.transaction('logMonthParts').store) as { put: (...a: unknown[]) => unknown };
    const put = proto.put;
    const written: number[] = [];
    proto.put = function (this: { name: string }, value: unknown, ...rest: unknown[]) {
      if (this.name === 'logMonthParts') written.push((value as MonthBucket).rows.length);
      return put.call(this, value, ...rest);
    };
    try {
      for (const r of chain) await add([r]);
    } finally {
      proto.put = put;
    }
    expect(written).toHaveLength(n);
    expect(Math.max(...written)).toBeLessThanOrEqual(MONTH_PART_TARGET);
    expect((await db.getAll('logMonthParts')).map((p) => p.rows.length)).toEqual([MONTH_PART_TARGET, MONTH_PART_TARGET, 7]);
    await expectLayoutHolds(chain);
  });
});

describe('pageRows', () => {
  it('pages newest first and oldest first through any window, every check once, in (time, id) order (property)', async () => {
    // 300 checks of two devices over two vessels and five months, some at the same instant.
    const all: CheckRecord[] = [];
    for (let i = 0; i < 300; i += 1) all.push(record(i % 2, Math.floor(i / 2) + 1, T0 + Math.floor(i / 3) * 36 * 3_600_000, (i >> 2) % 2));
    await add(all);
    const span = all.at(-1)!.timeMs - T0;
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom<'newest' | 'oldest'>('newest', 'oldest'),
        fc.option(fc.constantFrom(0, 1), { nil: null }),
        fc.option(fc.integer({ min: -1, max: span + 1 }), { nil: null }),
        fc.option(fc.integer({ min: -1, max: span + 1 }), { nil: null }),
        fc.integer({ min: 1, max: 70 }),
        async (order, vessel, from, to, limit) => {
          const fromMs = from === null ? -Infinity : T0 + from;
          const toMs = to === null ? Infinity : T0 + to;
          const vesselId = vessel === null ? null : VESSELS[vessel]!;
          const want = all
            .filter((r) => r.timeMs >= fromMs && r.timeMs <= toMs && (vesselId === null || r.vesselId === vesselId))
            .map((r): MonthRow => monthRowOf(r))
            .sort(compareRows);
          if (order === 'newest') want.reverse();
          const got: MonthRow[] = [];
          let cursor: { timeMs: number; id: string } | undefined;
          for (let pages = 0; pages < 400; pages += 1) {
            const tx = (await getDb()).transaction(LOG_STORES);
            const { rows, more } = await pageRows(tx, {
              vesselId, fromMs, toMs, limit, order, ...(order === 'newest' ? { before: cursor } : { after: cursor }),
            });
            expect(rows.length).toBeLessThanOrEqual(limit);
            got.push(...rows);
            const last = rows.at(-1);
            if (!more || !last) break;
            cursor = { timeMs: last[0], id: last[1] };
          }
          expect(got).toEqual(want);
        },
      ),
      { numRuns: 60 },
    );
  });
});

describe('contentOfText', () => {
  const text = fc.string({ unit: fc.constantFrom('a', '"', '\\', ',', ':', 'h', '{', '}', '#', 'é', '\u2028') });
  it('gives exactly hashedContent for any record the store accepts, quotes and look-alike text included (property)', () => {
    fc.assert(
      fc.property(text, text, text, text, fc.array(fc.record({ signal: fc.constant('NOTICE' as const), message: text, rule: text }), { maxLength: 3 }), fc.option(fc.string({ unit: fc.constantFrom(...'0123456789abcdef'), minLength: 64, maxLength: 64 }), { nil: '' }),
        (appVersion, formulationId, note, corrects, cautions, hash) => {
          const r = { ...record(0, 1, T0, 0), appVersion, formulationId, note: `,"hash":"${note}`, cautions, corrects: corrects === '' ? null : `,"hash":"${corrects}`, hash };
          expect(contentOfText(canonicalJson(r))).toBe(hashedContent(r));
        }),
      { numRuns: 500 },
    );
  });

  it('chainFieldsOfText reads id, device, hashes and content exactly, and refuses a text filed under another seq (property)', () => {
    const inputs = fc.dictionary(fc.constantFrom('prevHash', 'hash', 'seq', 'id', 'temperature'), fc.record({ text, unit: text }), { maxKeys: 3 });
    fc.assert(
      fc.property(text, text, inputs, fc.integer({ min: 1, max: 1e9 }), fc.jsonValue(), (note, technician, typed, seq, result) => {
        const r = { ...record(0, seq, T0, 0), note: `,"prevHash":"${note}`, technician, inputs: typed, result: { x: result, seq, technician: 'x' } as never };
        const textOf = canonicalJson(r);
        const got = chainFieldsOfText(textOf, seq);
        expect(got).toEqual({ link: { id: r.id, deviceId: r.deviceId, seq, hash: r.hash, prevHash: r.prevHash }, content: hashedContent(r) });
        expect(chainFieldsOfText(textOf, seq + 1)).toBeNull();
      }),
      { numRuns: 300 },
    );
  });
});
