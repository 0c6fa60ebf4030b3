// The id buckets' shape (log-ids.ts, schema v9): the same answers as the one-member-per-id objects
// of v4 to v8, held to a plain Map as the model.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { DuplicateId, emptyIdBucket, idBucketFromV8, idEntriesOf, idEntryOf, isIdBucket, withIds, type IdEntry } from '../../src/store/log-ids.ts';

const DEV_A = 'aaaaaaaa-0000-4000-8000-000000000001';
const DEV_B = 'bbbbbbbb-0000-4000-8000-000000000002';
const id = (n: number) => `c0000000-0000-4000-8000-${n.toString(16).padStart(10, '0')}a7`;

describe('id buckets', () => {
  it('finds each stored id at its device and seq, and the checks correcting an id, stored or not', () => {
    const b = withIds(emptyIdBucket(), [
      { id: id(3), deviceId: DEV_A, seq: 7 },
      { id: id(1), deviceId: DEV_B, seq: 1 },
      { id: id(2), deviceId: DEV_A, seq: 8 },
    ], [[id(1), id(2)], [id(9), id(3)], [id(1), id(3)]]);
    expect(b.ids).toEqual([id(1), id(2), id(3)]);
    expect(b.devices).toEqual([DEV_A, DEV_B]);
    expect(idEntryOf(b, id(1))).toEqual({ at: [DEV_B, 1], by: [id(2), id(3)] });
    expect(idEntryOf(b, id(3))).toEqual({ at: [DEV_A, 7] });
    expect(idEntryOf(b, id(9))).toEqual({ by: [id(3)] });
    expect(idEntryOf(b, id(4))).toBeUndefined();
    expect(isIdBucket(b)).toBe(true);
    expect(isIdBucket({ [id(1)]: { at: [DEV_A, 1] } })).toBe(false);
  });

  it('refuses an id already stored, or twice in one write, and leaves the bucket it was given unchanged', () => {
    const b = withIds(emptyIdBucket(), [{ id: id(1), deviceId: DEV_A, seq: 1 }]);
    const before = structuredClone(b);
    expect(() => withIds(b, [{ id: id(1), deviceId: DEV_B, seq: 5 }])).toThrow(DuplicateId);
    expect(() => withIds(b, [{ id: id(2), deviceId: DEV_B, seq: 5 }, { id: id(2), deviceId: DEV_B, seq: 6 }])).toThrow(/already stored/);
    withIds(b, [{ id: id(0), deviceId: DEV_B, seq: 2 }], [[id(1), id(0)]]);
    expect(b).toEqual(before);
  });

  it('a v8 bucket (one member per id) says the same in the new shape', () => {
    const old = { [id(5)]: { at: [DEV_A, 3] as [string, number], by: [id(6)] }, [id(6)]: { at: [DEV_B, 4] as [string, number] }, [id(7)]: { by: [id(5)] } };
    expect(idEntriesOf(idBucketFromV8(old))).toEqual(new Map(Object.entries(old)));
  });

  it('whatever ids arrive in whatever writes, the answers are a Map\'s (property)', () => {
    const op = fc.record({
      adds: fc.array(fc.record({ n: fc.integer({ min: 0, max: 60 }), device: fc.constantFrom(DEV_A, DEV_B), seq: fc.integer({ min: 1, max: 1e6 }) }), { maxLength: 20 }),
      fixes: fc.array(fc.tuple(fc.integer({ min: 0, max: 60 }), fc.integer({ min: 0, max: 60 })), { maxLength: 4 }),
    });
    fc.assert(fc.property(fc.array(op, { maxLength: 8 }), (ops) => {
      const model = new Map<string, IdEntry>();
      let bucket = emptyIdBucket();
      for (const { adds, fixes } of ops) {
        const ns = adds.map((a) => a.n);
        const duplicate = new Set(ns).size < ns.length || ns.some((n) => model.get(id(n))?.at !== undefined);
        const write = () => withIds(bucket, adds.map((a) => ({ id: id(a.n), deviceId: a.device, seq: a.seq })), fixes.map(([t, f]) => [id(t), id(f)] as const));
        if (duplicate) {
          expect(write).toThrow(DuplicateId);
          continue;
        }
        bucket = write();
        for (const a of adds) model.set(id(a.n), { ...model.get(id(a.n)), at: [a.device, a.seq] });
        for (const [t, f] of fixes) {
          const e = model.get(id(t)) ?? {};
          model.set(id(t), { ...e, by: [...(e.by ?? []), id(f)] });
        }
      }
      expect(idEntriesOf(bucket)).toEqual(model);
      expect([...bucket.ids].sort()).toEqual(bucket.ids);
    }));
  });
});
