// Records of other kinds (cycles, periodic tests) in the device's chain: saved like a check (same
// seq, hash, signature), listed per kind, vessel and time, kept out of the checks' month rows (so
// the review's totals and the checks' CSV stay checks), carried by backup export and import, by
// verification and by plant sync's push and pull; a kind this version does not keep is still
// skipped. Hashes are re-checked with Node's crypto (SHA-256, FIPS 180-4), outside the project.
// The values saved are invented test data.
import { createHash } from 'node:crypto';
import { IDBFactory } from 'fake-indexeddb';
import { describe, expect, it } from 'vitest';
import {
  addVessel, appendCheck, appendRecord, countRecords, countStoredChecks, getCheck, getRecord, listChecks, listRecords,
  retireVessel, type KindRecord, type NewKindRecord,
} from '../../src/store/index.ts';
import { exportBackup, exportCsv, importBackup, mergePulledRecords, ownRecords, tallyChecks, verifyStoredChains } from '../../src/store/transfer.ts';
import { canonicalJson, contentOfText, kindOfText } from '../../src/store/integrity.ts';
import { getDb } from '../../src/store/connection.ts';
import { sampleCheck, SPEC, useFreshDatabase } from './fixtures.ts';
import { useDevice } from './backup-fixtures.ts';

useFreshDatabase();

const sha256 = (text: string) => createHash('sha256').update(text, 'utf8').digest('hex');
const T0 = Date.parse('2026-12-02T07:00:00Z');

function sampleCycle(vesselId: string | null, minutes = 0, overrides: Partial<NewKindRecord> = {}): NewKindRecord {
  return {
    vesselId,
    technician: 'A. Lindqvist',
    note: 'test cycle',
    takenAt: new Date(T0 + minutes * 60_000),
    values: { cycleType: { lowerK: 394.15, upperK: 397.15, holdS: 900 }, readings: [[0, 393.2, 205000], [60, 394.9, 214000]] },
    cautions: [{ signal: 'WARNING', message: 'Test caution text.', rule: 'test-rule' }],
    appVersion: '0.1.0',
    formulationId: 'IAPWS-IF97 (R7-97(2012))',
    ...overrides,
  };
}

describe('appendRecord', () => {
  it('puts a record into the same chain as the checks: next seq, prevHash of the check before, its own hash', async () => {
    const v = await addVessel({ tag: 'AC-1', spec: SPEC });
    const check = await appendCheck(sampleCheck(v.id));
    const cycle = await appendRecord('cycle', sampleCycle(v.id));
    const after = await appendCheck(sampleCheck(v.id));
    expect(cycle).toMatchObject({ kind: 'cycle', seq: 2, prevHash: check.hash, deviceId: check.deviceId, vesselId: v.id, vessel: { tag: 'AC-1' } });
    expect(after).toMatchObject({ seq: 3, prevHash: cycle.hash });
    const { hash, ...content } = cycle;
    expect(hash).toBe(sha256(canonicalJson(content)));
    expect(await getRecord(cycle.id)).toEqual(cycle);
    // Ids are one space; each reader gets only its own.
    expect(await getCheck(cycle.id)).toBeUndefined();
    expect(await getRecord(check.id)).toBeUndefined();
    // Signed like a check: the block holds a signature for every seq.
    const [block] = await (await getDb()).getAll('logBlocks');
    expect(block!.sigs).toHaveLength(3);
    expect(block!.sigs!.every((s) => s.length === 86)).toBe(true);
    expect(await verifyStoredChains()).toMatchObject([{ status: 'ok', count: 3, headSeq: 3, signature: { state: 'signed', throughSeq: 3 } }]);
  });

  it('keeps the checks\' month rows for checks: listings, counts, totals and the CSV are unchanged', async () => {
    const v = await addVessel({ tag: 'AC-1', spec: SPEC });
    await appendCheck(sampleCheck(v.id));
    await appendRecord('cycle', sampleCycle(v.id));
    await appendRecord('periodic-test', sampleCycle(null, 5, { values: { test: 'air-removal', passed: true } }));
    expect((await listChecks()).checks).toHaveLength(1);
    expect(await countStoredChecks()).toBe(1);
    expect((await tallyChecks({}))?.checks).toBe(1);
    const csv = await exportCsv();
    expect(csv.trim().split('\r\n')).toHaveLength(2); // the header and the one check
  });

  it('refuses bad input naming the field, and saves nothing', async () => {
    const v = await addVessel({ tag: 'AC-1', spec: SPEC });
    await expect(appendRecord('no-such-kind' as never, sampleCycle(v.id))).rejects.toMatchObject({ code: 'invalid-record', field: 'kind' });
    await expect(appendRecord('cycle', sampleCycle('nope'))).rejects.toMatchObject({ code: 'invalid-record', field: 'vesselId' });
    await expect(appendRecord('cycle', sampleCycle(v.id, 0, { technician: ' ' }))).rejects.toMatchObject({ field: 'technician' });
    await expect(appendRecord('cycle', sampleCycle(v.id, 0, { values: { x: Number.NaN } }))).rejects.toMatchObject({ field: 'values.x' });
    await expect(appendRecord('cycle', sampleCycle(v.id, 0, { takenAt: new Date(Number.NaN) }))).rejects.toMatchObject({ field: 'takenAt' });
    await retireVessel(v.id);
    await expect(appendRecord('cycle', sampleCycle(v.id))).rejects.toMatchObject({ field: 'vesselId' });
    expect(await countRecords('cycle')).toBe(0);
    expect(await (await getDb()).count('logBlocks')).toBe(0);
  });
});

describe('listRecords', () => {
  it('lists one kind per vessel and time, newest first or oldest first, in pages', async () => {
    const a = await addVessel({ tag: 'AC-1', spec: SPEC });
    const b = await addVessel({ tag: 'AC-2', spec: SPEC });
    const saved: KindRecord[] = [];
    for (let i = 0; i < 7; i += 1) saved.push(await appendRecord('cycle', sampleCycle(i % 2 ? b.id : a.id, i * 30)));
    await appendRecord('periodic-test', sampleCycle(a.id, 10, { values: { test: 'vacuum-leak-rate' } }));
    const ids = (rs: KindRecord[]) => rs.map((r) => r.id);
    const newest = await listRecords({ kind: 'cycle', limit: 3 });
    expect(ids(newest.records)).toEqual(ids(saved.slice(4).reverse()));
    const second = await listRecords({ kind: 'cycle', limit: 3, before: newest.next! });
    expect(ids(second.records)).toEqual(ids(saved.slice(1, 4).reverse()));
    const last = await listRecords({ kind: 'cycle', limit: 3, before: second.next! });
    expect(ids(last.records)).toEqual([saved[0]!.id]);
    expect(last.next).toBeNull();
    expect(ids((await listRecords({ kind: 'cycle', vesselId: b.id, order: 'oldest' })).records)).toEqual(ids([saved[1]!, saved[3]!, saved[5]!]));
    const window = await listRecords({ kind: 'cycle', from: new Date(T0 + 60 * 60_000), to: new Date(T0 + 120 * 60_000) });
    expect(ids(window.records)).toEqual(ids([saved[4]!, saved[3]!, saved[2]!]));
    expect((await listRecords({ kind: 'periodic-test' })).records.map((r) => r.values['test'])).toEqual(['vacuum-leak-rate']);
    expect(await countRecords('cycle')).toBe(7);
    expect(await countRecords('cycle', b.id)).toBe(3);
    // A kind nothing saved lists nothing, and breaks nothing.
    expect((await listRecords({ kind: 'review-note' })).records).toEqual([]);
    await expect(listRecords({ kind: 'cycle', limit: 0 })).rejects.toMatchObject({ field: 'limit' });
  });
});

describe('backup, verification and sync carry them', () => {
  it('an export holds them in their chains; an import into another device keeps them, listed and verified; again, skipped as identical', async () => {
    const v = await addVessel({ tag: 'AC-1', spec: SPEC });
    await appendCheck(sampleCheck(v.id));
    const cycle = await appendRecord('cycle', sampleCycle(v.id));
    const test = await appendRecord('periodic-test', sampleCycle(null, 3, { values: { test: 'air-removal', passed: false, batch: 'B-7' } }));
    await appendCheck(sampleCheck(v.id));
    const backup = await exportBackup();
    const doc = JSON.parse(backup) as { checks: { kind?: string; seq: number }[]; chains: { count: number }[] };
    expect(doc.checks.map((c) => c.kind ?? 'check')).toEqual(['check', 'cycle', 'periodic-test', 'check']);
    expect(doc.chains[0]!.count).toBe(4);

    await useDevice(new IDBFactory());
    const report = await importBackup(backup);
    expect(report.checks.added).toHaveLength(2);
    expect(report.records.added).toEqual([{ id: cycle.id, kind: 'cycle' }, { id: test.id, kind: 'periodic-test' }]);
    expect(report.skippedKinds).toEqual({});
    expect(await getRecord(cycle.id)).toEqual(cycle);
    expect((await listRecords({ kind: 'cycle', vesselId: v.id })).records).toEqual([cycle]);
    expect(await verifyStoredChains()).toMatchObject([{ status: 'ok', count: 4, signature: { state: 'signed', throughSeq: 4 } }]);
    expect(await exportBackup().then((t) => t.replace(/"exportedAt":"[^"]*"/, ''))).toBe(backup.replace(/"exportedAt":"[^"]*"/, ''));
    const again = await importBackup(backup);
    expect(again.records).toEqual({ added: [], skipped: [{ id: cycle.id, why: 'already here, identical' }, { id: test.id, why: 'already here, identical' }] });
  });

  it('a record of a kept kind that breaks its shape refuses the file, naming the field', async () => {
    const v = await addVessel({ tag: 'AC-1', spec: SPEC });
    await appendRecord('cycle', sampleCycle(v.id));
    const doc = JSON.parse(await exportBackup()) as { checks: Record<string, unknown>[] };
    doc.checks[0]!['values'] = 'not an object';
    await useDevice(new IDBFactory());
    await expect(importBackup(JSON.stringify(doc))).rejects.toMatchObject({ code: 'invalid-backup', field: 'checks[0].values' });
  });

  it('push reads them with their kind; a pull takes a valid one and refuses a changed one', async () => {
    const v = await addVessel({ tag: 'AC-1', spec: SPEC });
    await appendCheck(sampleCheck(v.id));
    await appendRecord('cycle', sampleCycle(v.id));
    const own = await ownRecords(1, 10);
    expect(own.map((r) => r.kind)).toEqual(['check', 'cycle']);
    for (const r of own) expect(r.hash).toBe(sha256(contentOfText(r.text)));
    expect(own.map((r) => kindOfText(r.text))).toEqual(['check', 'cycle']);

    await useDevice(new IDBFactory());
    const changed = own[1]!.text.replace('"note":"test cycle"', '"note":"edited"');
    const refused = await mergePulledRecords([{ label: 'a:1', text: own[0]!.text }, { label: 'a:2', text: changed }]);
    expect(refused.added).toHaveLength(1);
    expect(refused.refused).toEqual([{ label: 'a:2', why: expect.stringMatching(/content does not match its hash/) }]);
    const taken = await mergePulledRecords([{ label: 'a:2', text: own[1]!.text }]);
    expect(taken.added).toEqual([own[1]!.id]);
    expect((await listRecords({ kind: 'cycle' })).records.map((r) => r.id)).toEqual([own[1]!.id]);
    const bad = JSON.parse(own[1]!.text) as Record<string, unknown>;
    delete bad['values'];
    const shape = await mergePulledRecords([{ label: 'a:3', text: canonicalJson(bad) }]);
    expect(shape.refused).toEqual([{ label: 'a:3', why: expect.stringMatching(/record\.values: missing/) }]);
  });
});
