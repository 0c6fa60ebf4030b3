// Chain verification over the stored log, after someone edits the database behind the app's back
// (e.g. with the browser's developer tools).
import { describe, expect, it } from 'vitest';
import { SPEC, sampleCheck, useFreshDatabase } from './fixtures.ts';
import { addVessel, appendCheck, type CheckRecord } from '../../src/store/index.ts';
import { exportBackup, verifyStoredChains } from '../../src/store/transfer.ts';
import { editStored } from './log-access.ts';

useFreshDatabase();

async function seed(n: number): Promise<CheckRecord[]> {
  const v = await addVessel({ tag: 'FT-204', spec: SPEC });
  const out: CheckRecord[] = [];
  for (let i = 0; i < n; i += 1) out.push(await appendCheck(sampleCheck(v.id, { note: `n${i}` })));
  return out;
}

describe('verifyStoredChains', () => {
  it('points at a record edited in the database', async () => {
    const saved = await seed(5);
    await editStored(saved[2]!.id, (r) => ({ ...r, technician: 'someone else' }));
    expect(await verifyStoredChains()).toMatchObject([
      { status: 'broken', problem: 'content-changed', at: { id: saved[2]!.id, seq: 3 }, count: 5 },
    ]);
  });

  it('points at the gap a deleted record leaves', async () => {
    const saved = await seed(5);
    await editStored(saved[1]!.id, () => null);
    expect(await verifyStoredChains()).toMatchObject([{ status: 'broken', problem: 'missing-seq', at: { seq: 3 }, count: 4 }]);
  });

  it('points at records swapped between places (seq rewritten, hashes kept)', async () => {
    const saved = await seed(4);
    const device = saved[0]!.deviceId;
    await editStored({ deviceId: device, seq: 2 }, () => ({ ...saved[2]!, seq: 2 }));
    await editStored({ deviceId: device, seq: 3 }, () => ({ ...saved[1]!, seq: 3 }));
    expect(await verifyStoredChains()).toMatchObject([{ status: 'broken', problem: 'content-changed', at: { seq: 2 } }]);
  });

  it('points at a record whose own seq is not the one it is filed under', async () => {
    const saved = await seed(4);
    await editStored(saved[2]!.id, (r) => ({ ...r, seq: 7 }));
    expect(await verifyStoredChains()).toMatchObject([{ status: 'broken', problem: 'reordered', at: { id: saved[2]!.id, seq: 7 } }]);
  });

  it('reports progress over pages and stops on cancel', async () => {
    await seed(3);
    const seen: [number, number][] = [];
    expect(await verifyStoredChains({ onProgress: (d, t) => seen.push([d, t]) })).toMatchObject([{ status: 'ok', count: 3 }]);
    expect(seen.at(-1)).toEqual([3, 3]);
    const controller = new AbortController();
    controller.abort();
    await expect(verifyStoredChains({ signal: controller.signal })).rejects.toMatchObject({ code: 'cancelled' });
  });
});

describe('exportBackup progress and cancel', () => {
  it('reports progress and refuses to finish once cancelled', async () => {
    await seed(3);
    const seen: [number, number][] = [];
    await exportBackup({ onProgress: (d, t) => seen.push([d, t]) });
    expect(seen.at(-1)).toEqual([3, 3]);
    const controller = new AbortController();
    controller.abort();
    await expect(exportBackup({ signal: controller.signal })).rejects.toMatchObject({ code: 'cancelled' });
  });
});
