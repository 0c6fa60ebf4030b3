// The generated log the benchmark and browser tests use is a valid backup: the store's own
// importer takes all of it, and its chain verifies; one changed field refuses the file, naming that record.
import { describe, expect, it } from 'vitest';
import { useFreshDatabase } from '../../store/fixtures.ts';
import { importBackup, verifyStoredChains } from '../../../src/store/transfer.ts';
import { countStoredChecks, StoreError } from '../../../src/store/index.ts';
import { generatedBackup } from '../../../bench/generated-log.ts';

useFreshDatabase();

const SPEC = {
  deviceId: '6b1e0d2a-3c4f-4a5b-8c6d-7e8f90a1b2c3',
  vesselPrefix: '5eed0001',
  vessels: 4,
  checks: 30,
  startMs: Date.parse('2026-11-01T06:00:00Z'),
  stepMs: 3_600_000,
  technicians: ['Gen One', 'Gen Two'],
  seed: 7,
};

describe('generated log', () => {
  it('imports whole through the store and verifies', async () => {
    const report = await importBackup(await generatedBackup(SPEC));
    expect(report.checks.added).toHaveLength(30);
    expect(report.vessels.added).toHaveLength(4);
    expect(await verifyStoredChains()).toEqual([expect.objectContaining({ deviceId: SPEC.deviceId, status: 'ok', count: 30 })]);
  });

  it('signed, imports whole and verifies as signed by its key, through its last record', async () => {
    const report = await importBackup(await generatedBackup({ ...SPEC, signed: true }));
    expect(report.checks.added).toHaveLength(30);
    expect(report.fileSignatures).toEqual([{ deviceId: SPEC.deviceId, signature: expect.objectContaining({ state: 'signed', throughSeq: 30 }) }]);
    expect(await verifyStoredChains()).toEqual([expect.objectContaining({ status: 'ok', signature: expect.objectContaining({ state: 'signed', throughSeq: 30 }) })]);
  });

  it('with one field changed, the file is refused, naming exactly that record', async () => {
    const text = await generatedBackup(SPEC);
    const lines = text.split('\n');
    const i = lines.findIndex((l) => l.includes('"seq":12,'));
    lines[i] = lines[i]!.replace('"technician":"Gen Two"', '"technician":"Someone Else"');
    const error = (await importBackup(lines.join('\n')).catch((e: unknown) => e)) as StoreError;
    expect(error).toBeInstanceOf(StoreError);
    expect(error.refused).toHaveLength(1);
    expect(error.refused[0]).toMatchObject({ deviceId: SPEC.deviceId, seq: 12, why: expect.stringMatching(/hash/) });
    expect(lines[i]).toContain(error.refused[0]!.id);
    expect(await countStoredChecks()).toBe(0);
  });
});
