// Scale benchmark for the store under Node with fake-indexeddb: a generated log of 100 000 checks
// over 200 vessels (invented bench data). Prints each figure beside the issue's target (the
// targets are for headless Chromium on this machine; fake-indexeddb's in-memory engine is a
// different cost model, so these figures show where the time goes, not whether the target is met).
// Asserts only that the results are correct, never how long they took (RULES 7).
//   npm run bench                      100 000 checks (BENCH_CHECKS=20000 npm run bench for a quick run)
import 'fake-indexeddb/auto';
import { IDBFactory } from 'fake-indexeddb';
import { describe, expect, it } from 'vitest';
import { closeStore, exportBackup, exportCsv, importBackup, openStore, verifyStoredChains } from '../src/store/index.ts';
import { getDb } from '../src/store/connection.ts';
import { canonicalJson } from '../src/store/integrity.ts';
import { resetPersistenceMemo } from '../src/store/settings.ts';
import { benchChecks, benchId, benchVessels, writeRaw } from './scale-data.ts';

const CHECKS = Number(process.env['BENCH_CHECKS'] ?? 100_000);
const VESSELS = 200;
const FULL = 100_000;

const rows: string[] = [];
function report(label: string, ms: number, targetMs: number | null, note = ''): void {
  const measured = `${(ms / 1000).toFixed(2)} s at ${CHECKS.toLocaleString('en')} checks`;
  const scaled = CHECKS === FULL ? '' : `; extrapolated to 100,000 (linear, an estimate, not measured): ${((ms * FULL) / CHECKS / 1000).toFixed(2)} s`;
  const target = targetMs === null ? '' : ` [target ${targetMs / 1000} s for 100,000, headless Chromium]`;
  const line = `${label.padEnd(42)} ${measured}${scaled}${target}${note ? ` ${note}` : ''}`;
  rows.push(line);
  console.log(line);
}

async function timed<T>(fn: () => Promise<T>): Promise<[T, number]> {
  const t0 = performance.now();
  const value = await fn();
  return [value, performance.now() - t0];
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
    console.log(`set-up (not a target): generate and hash ${CHECKS} checks ${(genMs / 1000).toFixed(2)} s, raw write ${(seedMs / 1000).toFixed(2)} s`);

    const [chains, verifyMs] = await timed(() => verifyStoredChains());
    expect(chains).toEqual([{ deviceId: benchId(1, 0), status: 'ok', count: CHECKS, headSeq: CHECKS, headHash: home[CHECKS - 1]!.hash }]);
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
    expect(imported.checks.rejected).toEqual([]);
    expect(imported.vessels.skipped).toHaveLength(VESSELS);
    expect(imported.fileChains).toMatchObject([{ deviceId: otherId, status: 'ok', count: CHECKS }]);
    expect(await (await getDb()).count('checks')).toBe(2 * CHECKS);
    report(`import + merge into a store holding ${CHECKS}`, importMs, 10000, `(${(file.length / 1e6).toFixed(1)} M characters)`);

    const [after, verify2Ms] = await timed(() => verifyStoredChains());
    expect(after.map((c) => [c.status, c.count])).toEqual([['ok', CHECKS], ['ok', CHECKS]]);
    console.log(`(chain verification after the merge, ${2 * CHECKS} checks: ${(verify2Ms / 1000).toFixed(2)} s)`);
    console.log(`heap used at the end: ${(process.memoryUsage().heapUsed / 1e6).toFixed(0)} MB`);
    await closeStore();
    console.log(`\nSummary (Node ${process.version}, fake-indexeddb):\n${rows.join('\n')}`);
  });
});
