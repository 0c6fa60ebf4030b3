// The store's long jobs read and hash in pages of blocks and groups; these tests put records on
// both sides of each boundary (invented test records, written straight into the log the way
// appendCheck would have saved them, since saving a thousand through appendCheck is slow).
import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { SPEC, useFreshDatabase, loose } from './fixtures.ts';
import { dump } from './backup-fixtures.ts';
import { addVessel, type CheckRecord } from '../../src/store/index.ts';
import { exportBackup, exportCsv, importBackup, verifyStoredChains } from '../../src/store/transfer.ts';
import { getDb } from '../../src/store/connection.ts';
import { computeCheckHash } from '../../src/store/integrity.ts';
import { canonicalJson } from '../../src/store/integrity.ts';
import { mayHoldForbiddenKey, parseBackup } from '../../src/store/backup.ts';
import { addToLog, BLOCK_PAGE, BLOCK_TARGET, LOG_STORES } from '../../src/store/log-layout.ts';
import { editStored } from './log-access.ts';
import { GENESIS_HASH } from '../../src/store/records.ts';
import { IDBFactory } from 'fake-indexeddb';
import { closeStore, openStore } from '../../src/store/index.ts';

useFreshDatabase();

const D1 = 'aaaaaaaa-0000-4000-8000-000000000001';
const D2 = 'bbbbbbbb-0000-4000-8000-000000000002';
const T0 = Date.parse('2026-11-02T06:00:00Z');

/** `n` chained checks of `deviceId` spread over `vesselIds`, hashed as the store hashes them. */
async function makeChain(
  deviceId: string,
  n: number,
  vesselIds: string[],
  tag = 'FT-204',
  idOf: (seq: number) => string = (seq) => `${deviceId.slice(0, 8)}-1111-4000-8000-${String(seq).padStart(12, '0')}`,
): Promise<CheckRecord[]> {
  const out: CheckRecord[] = [];
  let prevHash = GENESIS_HASH;
  for (let seq = 1; seq <= n; seq += 1) {
    const timeMs = T0 + seq * 60_000 + (deviceId === D2 ? 30_000 : 0);
    const unsigned = {
      id: idOf(seq),
      deviceId,
      seq,
      time: new Date(timeMs).toISOString().replace('.000Z', 'Z'),
      timeMs,
      technician: 'R. Okafor',
      note: seq % 7 === 0 ? '=1+1 typed by a test' : `n${seq}`,
      vesselId: vesselIds[seq % vesselIds.length]!,
      vessel: { tag, spec: SPEC },
      inputs: { temperature: { text: '151,8', unit: 'degC' } },
      reading: loose.reading({ temperatureK: 424.95 + seq / 1000 }),
      result: loose.stored({ saturation: { verdict: { verdict: 'consistent' } } }),
      cautions: [],
      appVersion: '0.1.0',
      formulationId: 'IAPWS-IF97 (R7-97(2012))',
      corrects: null,
      reason: null,
      prevHash,
    };
    const record: CheckRecord = { ...unsigned, hash: await computeCheckHash(unsigned) };
    out.push(record);
    prevHash = record.hash;
  }
  return out;
}

/** Records one page of full blocks holds: what verification and the whole-log reads take at a time. */
const VERIFY_PAGE = BLOCK_PAGE * BLOCK_TARGET;

async function writeChecks(records: CheckRecord[]): Promise<void> {
  const tx = (await getDb()).transaction(LOG_STORES, 'readwrite');
  await Promise.all([addToLog(tx, records.map((record) => ({ record, text: canonicalJson(record) }))), tx.done]);
}

describe('verifyStoredChains across pages', () => {
  it('reads page by page (progress per page) and finds faults on either side of a page boundary', async () => {
    const v = await addVessel({ tag: 'FT-204', spec: SPEC });
    const chain = await makeChain(D1, VERIFY_PAGE + 2, [v.id]);
    await writeChecks(chain);
    const seen: [number, number][] = [];
    expect(await verifyStoredChains({ onProgress: (d, t) => seen.push([d, t]) })).toEqual([
      { deviceId: D1, status: 'ok', count: VERIFY_PAGE + 2, headSeq: VERIFY_PAGE + 2, headHash: chain.at(-1)!.hash, signature: { state: 'unsigned' } },
    ]);
    expect(seen).toEqual([[VERIFY_PAGE, VERIFY_PAGE + 2], [VERIFY_PAGE + 2, VERIFY_PAGE + 2]]);

    const last = chain[VERIFY_PAGE - 1]!; // the last record of the first page
    const first = chain[VERIFY_PAGE]!; // the first record of the second page
    await editStored(first.id, (r) => ({ ...r, technician: 'someone else' }));
    expect(await verifyStoredChains()).toMatchObject([{ status: 'broken', problem: 'content-changed', at: { seq: VERIFY_PAGE + 1 } }]);
    await editStored(first.id, () => first);
    const { hash: _h, ...edited } = { ...last, note: 'edited' };
    const rehashed = { ...edited, hash: await computeCheckHash(edited) };
    await editStored(last.id, () => rehashed);
    expect(await verifyStoredChains()).toMatchObject([{ status: 'broken', problem: 'link-broken', at: { seq: VERIFY_PAGE + 1 } }]);
    await editStored(last.id, () => null);
    expect(await verifyStoredChains()).toMatchObject([
      { status: 'broken', problem: 'missing-seq', at: { seq: VERIFY_PAGE + 1 }, count: VERIFY_PAGE + 1 },
    ]);
  });

  it('two devices sharing a page are each verified', async () => {
    const v = await addVessel({ tag: 'FT-204', spec: SPEC });
    const a = await makeChain(D1, VERIFY_PAGE - 5, [v.id]);
    const b = await makeChain(D2, 10, [v.id]);
    await writeChecks([...a, ...b]);
    expect(await verifyStoredChains()).toMatchObject([
      { deviceId: D1, status: 'ok', count: VERIFY_PAGE - 5, headHash: a.at(-1)!.hash },
      { deviceId: D2, status: 'ok', count: 10, headHash: b.at(-1)!.hash },
    ]);
  });

  it('a cancel after the first page stops it with "cancelled" and changes nothing', async () => {
    const v = await addVessel({ tag: 'FT-204', spec: SPEC });
    await writeChecks(await makeChain(D1, VERIFY_PAGE + 1, [v.id]));
    const before = await dump();
    const controller = new AbortController();
    const seen: number[] = [];
    const attempt = verifyStoredChains({
      signal: controller.signal,
      onProgress: (d) => {
        seen.push(d);
        controller.abort();
      },
    });
    await expect(attempt).rejects.toMatchObject({ code: 'cancelled' });
    expect(seen).toEqual([VERIFY_PAGE]);
    expect(await dump()).toEqual(before);
  });
});

describe('exports across pages', () => {
  it('CSV: every row once, oldest first, for the whole log and for one vessel', async () => {
    const a = await addVessel({ tag: 'FT-204', spec: SPEC });
    const b = await addVessel({ tag: 'CR-3', spec: SPEC });
    // 2 × (VERIFY_PAGE / 2 + 3) checks, one in three on vessel b: the whole-log read (blocks in
    // device order, then sorted by time: the two devices interleave) and the vessel walk (month
    // buckets, pages of 1000) both cross a page boundary.
    const half = VERIFY_PAGE / 2 + 3;
    const d1 = await makeChain(D1, half, [a.id, a.id, b.id]);
    const d2 = await makeChain(D2, half, [a.id, a.id, b.id]);
    await writeChecks([...d1, ...d2]);
    const all = [...d1, ...d2].sort((x, y) => x.timeMs - y.timeMs || (x.id < y.id ? -1 : 1));
    const seen: number[] = [];
    const rows = Papa.parse<Record<string, string>>(await exportCsv({ onProgress: (d) => seen.push(d) }), { header: true, skipEmptyLines: true }).data;
    expect(rows.map((r) => r['check id'])).toEqual(all.map((r) => r.id));
    expect(seen.at(-1)).toBe(2 * half);
    expect(seen).toEqual([...seen].sort((x, y) => x - y));
    expect(rows.find((r) => r['note']!.startsWith("'="))).toBeDefined();
    const onA = Papa.parse<Record<string, string>>(await exportCsv({ vesselId: a.id }), { header: true, skipEmptyLines: true }).data;
    expect(onA.map((r) => r['check id'])).toEqual(all.filter((r) => r.vesselId === a.id).map((r) => r.id));
    expect(onA.length).toBeGreaterThan(1000);
  });

  it('JSON: every check once in device and seq order, one per line, chain heads right; it imports back identically', async () => {
    const v = await addVessel({ tag: 'FT-204', spec: SPEC });
    const d1 = await makeChain(D1, 1001, [v.id]);
    const d2 = await makeChain(D2, 3, [v.id]);
    await writeChecks([...d2, ...d1]);
    const text = await exportBackup();
    const doc = parseBackup(text);
    expect(doc.checks.map((c) => c.id)).toEqual([...d1, ...d2].map((c) => c.id));
    expect(doc.chains).toEqual([
      { deviceId: D1, count: 1001, headSeq: 1001, headHash: d1.at(-1)!.hash, publicKey: null },
      { deviceId: D2, count: 3, headSeq: 3, headHash: d2.at(-1)!.hash, publicKey: null },
    ]);
    expect(text.split('\n').filter((l) => l.startsWith('{"appVersion"'))).toHaveLength(1004);
    const before = await dump();
    await closeStore();
    (globalThis as { indexedDB: IDBFactory }).indexedDB = new IDBFactory();
    await openStore();
    const report = await importBackup(text);
    expect(report.checks.added).toHaveLength(1004);
    expect(await dump()).toEqual(before);
    expect((await exportBackup()).replace(/"exportedAt":"[^"]*"/, '')).toBe(text.replace(/"exportedAt":"[^"]*"/, ''));
  });
});

describe('JSON export in device and seq order whatever the ids', () => {
  it('ids sorting against seq, across a page of blocks: still device then seq order, heads right', async () => {
    const v = await addVessel({ tag: 'FT-204', spec: SPEC });
    // Ids run backwards against seq, and device D2's ids sort before D1's.
    const n = VERIFY_PAGE + 2;
    const idOf = (prefix: string) => (seq: number) => `${prefix}-1111-4000-8000-${String(n + 10 - seq).padStart(12, '0')}`;
    const d1 = await makeChain(D1, n, [v.id], 'FT-204', idOf('cccccccc'));
    const d2 = await makeChain(D2, 4, [v.id], 'FT-204', idOf('00000000'));
    await writeChecks([...d1, ...d2]);
    const seen: number[] = [];
    const doc = parseBackup(await exportBackup({ onProgress: (d) => seen.push(d) }));
    expect(doc.checks.map((c) => c.id)).toEqual([...d1, ...d2].map((c) => c.id));
    expect(doc.checks).toEqual([...d1, ...d2]);
    expect(doc.chains).toEqual([
      { deviceId: D1, count: n, headSeq: n, headHash: d1.at(-1)!.hash, publicKey: null },
      { deviceId: D2, count: 4, headSeq: 4, headHash: d2.at(-1)!.hash, publicKey: null },
    ]);
    expect(seen).toEqual([VERIFY_PAGE, n + 4]);
  });
});

describe('import writes block by block in one transaction', () => {
  it('a cancel after the first block is written leaves nothing written; a full run writes all', async () => {
    const v = await addVessel({ tag: 'FT-204', spec: SPEC });
    await writeChecks(await makeChain(D1, 1004, [v.id]));
    const text = await exportBackup();
    await closeStore();
    (globalThis as { indexedDB: IDBFactory }).indexedDB = new IDBFactory();
    await openStore();
    const before = await dump();
    const total = 2 * 1004 + 1;
    const hashedAndVessel = 1004 + 1; // every check hashed, then the vessel written
    const controller = new AbortController();
    const seen: number[] = [];
    const attempt = importBackup(text, {
      signal: controller.signal,
      onProgress: (d) => {
        seen.push(d);
        if (d > hashedAndVessel) controller.abort();
      },
    });
    await expect(attempt).rejects.toMatchObject({ code: 'cancelled' });
    expect(seen).toContain(hashedAndVessel + BLOCK_TARGET);
    expect(await dump()).toEqual(before);
    const progress: number[] = [];
    const report = await importBackup(text, { onProgress: (d) => progress.push(d) });
    expect(report.checks.added).toHaveLength(1004);
    expect(progress.at(-1)).toBe(total);
    expect(progress).toEqual([...progress].sort((x, y) => x - y));
    expect(await verifyStoredChains()).toMatchObject([{ status: 'ok', count: 1004 }]);
    // Again: every check is found here and skipped.
    const after = await dump();
    const again = await importBackup(text);
    expect(again.checks.added).toEqual([]);
    expect(again.checks.skipped).toHaveLength(1004);
    expect(again.checks.skipped.every((s) => s.why === 'already here, identical')).toBe(true);
    expect(await dump()).toEqual(after);
  });
});

describe('backup parsing without the key-checking reviver', () => {
  it('is skipped only when no key can spell a forbidden name', () => {
    expect(mayHoldForbiddenKey('{"a":"plain text"}')).toBe(false);
    for (const text of ['{"__proto__":1}', '{"a":"the constructor"}', '{"prototype":1}', '{"\\u005f_proto__":1}', '{"a":"\\u00e9"}']) {
      expect(mayHoldForbiddenKey(text)).toBe(true);
    }
  });

  it('a forbidden key spelt with escapes is still refused', async () => {
    const text = await exportBackup();
    expect(() => parseBackup(text.replace('"vessels":[', '"vessels":[],"\\u005f_proto__":[')))
      .toThrow(/"__proto__" is not allowed/);
    expect(() => parseBackup(text.replace('"checks":[', '"checks":[],"constr\\u0075ctor":['))).toThrow(/"constructor" is not allowed/);
  });
});
