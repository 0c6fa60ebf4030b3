// A supervisor's review note (issue 14): a record of kind 'review-note' in the device's chain, the
// newest per vessel read from the kind rows alone, verified with the chain, carried by a backup.
// Names and texts are invented test data.
import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { addVessel, appendCheck, appendRecord, type NewKindRecord } from '../../src/store/index.ts';
import { latestOfKind } from '../../src/store/desk.ts';
import { exportBackup, verifyStoredChains } from '../../src/store/transfer.ts';
import { canonicalJson } from '../../src/store/integrity.ts';
import { sampleCheck, SPEC, useFreshDatabase } from './fixtures.ts';

useFreshDatabase();

const note = (vesselId: string, checkId: string, at: string, decision: string): NewKindRecord => ({
  vesselId, technician: 'S. Supervisor', note: decision, takenAt: new Date(at),
  values: { checkId, outcome: 'WARNING', findingSignals: ['WARNING'] }, cautions: [], appVersion: '0.1.0', formulationId: 'none (a note, nothing computed)',
});

describe("review notes (issue 14)", () => {
  it('join the chain after the check they answer, and the newest per vessel comes from the kind rows', async () => {
    const a = await addVessel({ tag: 'AC-1', spec: SPEC });
    const b = await addVessel({ tag: 'FT-2', spec: SPEC });
    const c = await addVessel({ tag: 'CR-3', spec: SPEC });
    const check = await appendCheck(sampleCheck(a.id, { cautions: [{ signal: 'WARNING', message: 'A finding made up for the test.', rule: 'test-finding' }] }));
    const first = await appendRecord('review-note', note(a.id, check.id, '2026-12-02T08:00:00Z', 'Gauge to be compared with the test gauge on Monday.'));
    const second = await appendRecord('review-note', note(a.id, check.id, '2026-12-03T08:00:00Z', 'Gauge replaced; next check as usual.'));
    await appendRecord('review-note', note(b.id, check.id, '2026-12-01T08:00:00Z', 'Noted.'));
    expect(first).toMatchObject({ kind: 'review-note', seq: 2, prevHash: check.hash, technician: 'S. Supervisor', vessel: { tag: 'AC-1' } });
    const { hash, ...content } = second;
    // Node's own SHA-256 (FIPS 180-4), outside the project.
    expect(hash).toBe(createHash('sha256').update(canonicalJson(content), 'utf8').digest('hex'));
    const [la, lb, lc] = await latestOfKind('review-note', [a.id, b.id, c.id]);
    expect(la).toEqual({ timeMs: Date.parse('2026-12-03T08:00:00Z'), id: second.id });
    expect(lb?.timeMs).toBe(Date.parse('2026-12-01T08:00:00Z'));
    expect(lc).toBeNull();
    expect(await verifyStoredChains()).toMatchObject([{ status: 'ok', count: 4 }]);
    const doc = JSON.parse(await exportBackup()) as { checks: { kind?: string; id: string }[] };
    expect(doc.checks.filter((r) => r.kind === 'review-note').map((r) => r.id)).toContain(second.id);
    await expect(latestOfKind('review-note', ['nope'])).rejects.toMatchObject({ code: 'invalid-record', field: 'vesselIds[0]' });
  });

  it('refuses a note without a supervisor or on an unknown vessel, and saves nothing', async () => {
    const a = await addVessel({ tag: 'AC-1', spec: SPEC });
    const base = note(a.id, '00000000-0000-4000-8000-000000000001', '2026-12-02T08:00:00Z', 'x');
    await expect(appendRecord('review-note', { ...base, technician: ' ' })).rejects.toMatchObject({ code: 'invalid-record', field: 'technician' });
    await expect(appendRecord('review-note', { ...base, vesselId: '00000000-0000-4000-8000-0000000000ff' })).rejects.toMatchObject({ code: 'not-found' });
    expect(await latestOfKind('review-note', [a.id])).toEqual([null]);
  });
});
