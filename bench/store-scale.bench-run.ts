// Scale benchmark for the store under Node with fake-indexeddb: a generated log of 100 000 checks
// over 200 vessels (invented bench data). Prints each figure beside the issue's target (the
// targets are for headless Chromium on this machine; fake-indexeddb's in-memory engine is a
// different cost model, so these figures show where the time goes, not whether the target is met).
// Asserts only that the results are correct, never how long they took (RULES 7).
//   npm run bench                      100 000 checks (BENCH_CHECKS=20000 npm run bench for a quick run)
import 'fake-indexeddb/auto';
import { IDBFactory } from 'fake-indexeddb';
import { describe, expect, it } from 'vitest';
import { checksForVessel, closeStore, countStoredChecks, listChecks, openStore, verifyChains } from '../src/store/index.ts';
import { exportBackup, exportCsv, importBackup, verifyStoredChains } from '../src/store/transfer.ts';
import { getDb } from '../src/store/connection.ts';
import { canonicalJson } from '../src/store/integrity.ts';
import type { LogBlock } from '../src/store/log-layout.ts';
import { blocksAfter } from '../src/store/log-walks.ts';
import { resetPersistenceMemo } from '../src/store/settings.ts';
import { benchChecks, benchId, benchVessels, writeRaw } from './scale-data.ts';

const CHECKS = Number(process.env['BENCH_CHECKS'] ?? 100_000);
const VESSELS = 200;
const FULL = 100_000;

const rows: string[] = [];
/** `scales`: the work grows with the log (extrapolated when run smaller); a page read does not. */
function report(label: string, t: Timing, targetMs: number | null, note = '', scales = true): void {
  const ms = t.wallMs;
  const measured = `${(ms / 1000).toFixed(scales ? 2 : 3)} s (CPU ${(t.cpuMs / 1000).toFixed(scales ? 2 : 3)} s) at ${CHECKS.toLocaleString('en')} checks`;
  const scaled =
    CHECKS === FULL || !scales ? '' : `; extrapolated to 100,000 (linear, an estimate, not measured): ${((ms * FULL) / CHECKS / 1000).toFixed(2)} s`;
  const target = targetMs === null ? '' : ` [target ${targetMs / 1000} s for 100,000, headless Chromium]`;
  const line = `${label.padEnd(42)} ${measured}${scaled}${target}${note ? ` ${note}` : ''}`;
  rows.push(line);
  console.log(line);
}

// This machine's cores are shared, so wall time swings with other load; the process's CPU time
// (all its threads, WebCrypto's workers included) is printed beside it and swings less.
interface Timing {
  wallMs: number;
  cpuMs: number;
}
async function timed<T>(fn: () => Promise<T>): Promise<[T, Timing]> {
  const cpu0 = process.cpuUsage();
  const t0 = performance.now();
  const value = await fn();
  const wallMs = performance.now() - t0;
  const cpu = process.cpuUsage(cpu0);
  return [value, { wallMs, cpuMs: (cpu.user + cpu.system) / 1000 }];
}

async function useFactory(factory: IDBFactory): Promise<void> {
  await closeStore();
  (globalThis as { indexedDB: IDBFactory }).indexedDB = factory;
  resetPersistenceMemo();
  await openStore();
}

describe(`store at scale (${CHECKS} checks, ${VESSELS} vessels)`, () => {
  it('verify, export CSV, export JSON, import and merge', async () => {
    const vessels = benchVessels(VESSELS);
    await useFactory(new IDBFactory());
    const [home, genMs] = await timed(() => benchChecks(1, CHECKS, vessels));
    const [, seedMs] = await timed(() => writeRaw(vessels, home));
    const homeHead = home[CHECKS - 1]!.hash;
    console.log(`set-up (not a target): generate and hash ${CHECKS} checks ${(genMs.wallMs / 1000).toFixed(2)} s, raw write ${(seedMs.wallMs / 1000).toFixed(2)} s`);
    // The hashing alone, without IndexedDB: what verification costs on top of reading the log.
    const [inMemory, inMemoryMs] = await timed(() => verifyChains(home));
    expect(inMemory).toMatchObject([{ status: 'ok', count: CHECKS }]);
    home.length = 0; // only the store holds the log from here on

    // fake-indexeddb's own cost of handing out the log's blocks in pages (a structured clone per
    // block): a floor under every figure below that has nothing to do with the store's code.
    const [readCount, readMs] = await timed(async () => {
      const db = await getDb();
      let n = 0;
      let after: LogBlock | null = null;
      for (;;) {
        const page = await blocksAfter(db, after);
        if (page.length === 0) return n;
        for (const b of page) n += b.texts.length;
        after = page[page.length - 1]!;
      }
    });
    expect(readCount).toBe(CHECKS);
    report('(reading the log in pages, no other work)', readMs, null, '(fake-indexeddb cost, not a target)');
    report('(hashing only: verifyChains in memory)', inMemoryMs, null, '(the part of verification that is the store\'s own)');

    const [firstPage, firstMs] = await timed(() => listChecks({ limit: 50 }));
    expect(firstPage.checks).toHaveLength(50);
    expect(firstPage.checks[0]!.seq).toBe(CHECKS); // newest first
    report('first page of the review list (50 rows)', firstMs, 300, '(store call only, no rendering)', false);
    // The calendar month (UTC) in the middle of the generated log.
    const middle = new Date(Date.parse('2026-01-06T06:00:00Z') + (CHECKS / 2) * 600_000);
    const month = {
      from: new Date(Date.UTC(middle.getUTCFullYear(), middle.getUTCMonth(), 1)),
      to: new Date(Date.UTC(middle.getUTCFullYear(), middle.getUTCMonth() + 1, 1) - 1),
    };
    const [monthPage, monthMs] = await timed(() => checksForVessel(vessels[7]!.id, { ...month, limit: 50 }));
    expect(monthPage.checks.length).toBeGreaterThan(0);
    expect(monthPage.checks.every((c) => c.vesselId === vessels[7]!.id && c.timeMs >= month.from.getTime() && c.timeMs <= month.to.getTime())).toBe(true);
    report('filter: one vessel, one month (50 rows)', monthMs, 200, '(store call only, no rendering)', false);

    const [chains, verifyMs] = await timed(() => verifyStoredChains());
    expect(chains).toEqual([{ deviceId: benchId(1, 0), status: 'ok', count: CHECKS, headSeq: CHECKS, headHash: homeHead }]);
    report('chain verification', verifyMs, 2000);

    const [csv, csvMs] = await timed(() => exportCsv());
    expect(csv.split('\r\n').length).toBe(CHECKS + 2); // header, rows, and the empty piece after the last CRLF
    report('CSV export', csvMs, 3000, `(${(csv.length / 1e6).toFixed(1)} M characters)`);

    const [json, jsonMs] = await timed(() => exportBackup());
    const exported = JSON.parse(json) as { checks: unknown[]; vessels: unknown[] };
    expect(exported.checks).toHaveLength(CHECKS);
    expect(exported.vessels).toHaveLength(VESSELS);
    report('JSON export', jsonMs, 3000, `(${(json.length / 1e6).toFixed(1)} M characters)`);

    // Another device's log over the same vessels, as its own export would write it.
    const other = await benchChecks(2, CHECKS, vessels);
    const otherId = benchId(2, 0);
    const file =
      `{"format":"tankside-backup","formatVersion":1,"exportedAt":"2026-12-01T22:05:00+01:00",\n` +
      `"vessels":[\n${vessels.map((v) => canonicalJson(v)).join(',\n')}\n],\n` +
      `"checks":[\n${other.map((c) => canonicalJson(c)).join(',\n')}\n],\n` +
      `"chains":[\n${canonicalJson({ deviceId: otherId, count: CHECKS, headSeq: CHECKS, headHash: other[CHECKS - 1]!.hash })}\n]}\n`;
    other.length = 0;
    const [imported, importMs] = await timed(() => importBackup(file));
    expect(imported.checks.added).toHaveLength(CHECKS);
    expect(imported.vessels.skipped).toHaveLength(VESSELS);
    expect(imported.fileChains).toMatchObject([{ deviceId: otherId, status: 'ok', count: CHECKS }]);
    expect(await countStoredChecks()).toBe(2 * CHECKS);
    report(`import + merge into a store holding ${CHECKS}`, importMs, 10000, `(${(file.length / 1e6).toFixed(1)} M characters)`);

    const [after, verify2Ms] = await timed(() => verifyStoredChains());
    expect(after.map((c) => [c.status, c.count])).toEqual([['ok', CHECKS], ['ok', CHECKS]]);
    console.log(`(chain verification after the merge, ${2 * CHECKS} checks: ${(verify2Ms.wallMs / 1000).toFixed(2)} s (CPU ${(verify2Ms.cpuMs / 1000).toFixed(2)} s))`);
    console.log(`heap used at the end: ${(process.memoryUsage().heapUsed / 1e6).toFixed(0)} MB`);
    await closeStore();
    console.log(`\nSummary (Node ${process.version}, fake-indexeddb):\n${rows.join('\n')}`);
  });
});
