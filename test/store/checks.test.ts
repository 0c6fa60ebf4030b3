import { describe, expect, it, vi } from 'vitest';
import { SPEC, failWritesOverQuota, sampleCheck, useFreshDatabase, loose } from './fixtures.ts';
import { GENESIS_HASH, addVessel, appendCheck, loadDraft, saveDraft, checksForVessel, computeCheckHash, correctionsOf, deviceId, getCheck, listChecks, persistenceState, type CheckRecord } from '../../src/store/index.ts';
import { verifyStoredChains } from '../../src/store/transfer.ts';
import { getDb } from '../../src/store/connection.ts';
import type { LogBlock } from '../../src/store/log-layout.ts';
import { addRaw } from './log-access.ts';
import { wrap } from 'idb';

useFreshDatabase();

const MINUTE = 60_000;
const T0 = Date.parse('2026-12-01T06:00:00Z');

describe('appendCheck', () => {
  it('saves a full record: typed inputs, SI reading, result, versions, chain fields', async () => {
    const v = await addVessel({ tag: 'FT-204', spec: SPEC });
    const saved = await appendCheck(sampleCheck(v.id));
    expect(saved.id).toMatch(/^[0-9a-f-]{36}$/);
    expect(saved.deviceId).toBe(await deviceId());
    expect(saved.seq).toBe(1);
    expect(saved.prevHash).toBe(GENESIS_HASH);
    expect(saved.time).toMatch(/^2026-12-0[12]T\d\d:\d\d:00(Z|[+-]\d\d:\d\d)$/);
    expect(Date.parse(saved.time)).toBe(Date.parse('2026-12-01T21:05:00Z'));
    expect(saved.timeMs).toBe(Date.parse('2026-12-01T21:05:00Z'));
    expect(saved.inputs['pressure']).toEqual({ text: '4,0', unit: 'bar', reference: 'gauge' });
    expect(saved.vessel).toEqual({ tag: 'FT-204', spec: SPEC });
    expect(saved.corrects).toBeNull();
    expect(saved.hash).toBe(await computeCheckHash(saved));
    expect(await getCheck(saved.id)).toEqual(saved);
  });

  it('deletes the entry\'s draft in the same transaction that adds the check; a failed save keeps it', async () => {
    const v = await addVessel({ tag: 'FT-204', spec: SPEC });
    await saveDraft('check', { vesselId: v.id, note: 'typed' });
    // The quota runs out on the write carrying the block: nothing lands, neither check nor deletion.
    const restore = failWritesOverQuota((value) => Array.isArray((value as LogBlock).texts));
    try {
      await expect(appendCheck(sampleCheck(v.id), { clearDraft: 'check' })).rejects.toMatchObject({ code: 'quota-exceeded' });
    } finally {
      restore();
    }
    expect((await loadDraft('check'))?.value).toEqual({ vesselId: v.id, note: 'typed' });
    expect((await listChecks()).checks).toEqual([]);
    // Both in one transaction: once the check is there, the draft is gone.
    const db = await getDb();
    const scopes: string[][] = [];
    const real = db.transaction.bind(db);
    const spy = vi.spyOn(db, 'transaction').mockImplementation(((names: string | string[], mode?: IDBTransactionMode, o?: IDBTransactionOptions) => {
      if (mode === 'readwrite') scopes.push([names].flat().sort());
      return real(names as never, mode, o);
    }) as never);
    try {
      const saved = await appendCheck(sampleCheck(v.id), { clearDraft: 'check' });
      expect((await listChecks()).checks.map((c) => c.id)).toEqual([saved.id]);
    } finally {
      spy.mockRestore();
    }
    expect(await loadDraft('check')).toBeUndefined();
    expect(scopes).toEqual([['drafts', 'logBlocks', 'logIds', 'logKinds', 'logMonthParts']]);
    await expect(appendCheck(sampleCheck(v.id), { clearDraft: '' })).rejects.toThrow(/clearDraft: 0 characters; allowed 1 to 100/);
  });

  it('chains each device\'s records: seq 1, 2, 3 and prevHash = previous hash', async () => {
    const v = await addVessel({ tag: 'FT-204', spec: SPEC });
    const a = await appendCheck(sampleCheck(v.id));
    const b = await appendCheck(sampleCheck(v.id));
    const c = await appendCheck(sampleCheck(v.id));
    expect([a.seq, b.seq, c.seq]).toEqual([1, 2, 3]);
    expect(b.prevHash).toBe(a.hash);
    expect(c.prevHash).toBe(b.hash);
    expect(await verifyStoredChains()).toEqual([{
      deviceId: a.deviceId, status: 'ok', count: 3, headSeq: 3, headHash: c.hash,
      // Each save signs the new head with this install's key.
      signature: { state: 'signed', fingerprint: expect.stringMatching(/^[A-Za-z0-9_-]{43}$/), throughSeq: 3, headSeq: 3 },
    }]);
  });

  it('saves concurrent appends one after another on the chain (head re-checked inside the write)', async () => {
    const v = await addVessel({ tag: 'FT-204', spec: SPEC });
    const saved = await Promise.all(Array.from({ length: 6 }, () => appendCheck(sampleCheck(v.id))));
    expect(saved.map((r) => r.seq).sort()).toEqual([1, 2, 3, 4, 5, 6]);
    const [status] = await verifyStoredChains();
    expect(status).toMatchObject({ status: 'ok', count: 6 });
  });

  it('another tab saving between our hash and our write: we start over from its record', async () => {
    const v = await addVessel({ tag: 'FT-204', spec: SPEC });
    const device = await deviceId();
    const other = await new Promise<IDBDatabase>((resolve, reject) => {
      const request = indexedDB.open('tankside');
      request.onsuccess = () => resolve(request.result);
      request.onerror = () => reject(request.error);
    });
    const theirs = await appendCheckShape(v.id, device);
    const realDigest = crypto.subtle.digest.bind(crypto.subtle);
    let interfered = false;
    const spy = vi.spyOn(crypto.subtle, 'digest').mockImplementation(async (algorithm, data) => {
      if (!interfered) {
        interfered = true;
        // The other tab's save lands while this one is hashing.
        await addRaw(wrap(other) as never, theirs);
      }
      return realDigest(algorithm, data);
    });
    try {
      const mine = await appendCheck(sampleCheck(v.id));
      expect(mine).toMatchObject({ seq: 2, prevHash: theirs.hash });
    } finally {
      spy.mockRestore();
      other.close();
    }
    expect(await verifyStoredChains()).toMatchObject([{ status: 'ok', count: 2 }]);
  });

  it('is append-only: a correction is a new record; the original is unchanged; the DB refuses an overwrite', async () => {
    const v = await addVessel({ tag: 'FT-204', spec: SPEC });
    const original = await appendCheck(sampleCheck(v.id));
    const fix = await appendCheck(sampleCheck(v.id, { corrects: original.id, reason: 'pressure was absolute, not gauge' }));
    expect(fix.id).not.toBe(original.id);
    expect(fix).toMatchObject({ corrects: original.id, reason: 'pressure was absolute, not gauge', seq: 2 });
    expect(await getCheck(original.id)).toEqual(original);
    const second = await appendCheck(sampleCheck(v.id, { corrects: original.id, reason: 'and the note was wrong' }));
    expect(await correctionsOf(original.id)).toEqual([fix, second].sort((a, b) => (a.id < b.id ? -1 : 1)));
    expect(await correctionsOf(fix.id)).toEqual([]);
    // The log's write path refuses an id it holds: the same id cannot land twice.
    const db = await getDb();
    await expect(addRaw(db, { ...original, seq: 99, note: 'edited' })).rejects.toMatchObject({ name: 'ConstraintError' });
    expect(await getCheck(original.id)).toEqual(original);
  });

  it('refuses bad input naming the field, and saves nothing', async () => {
    const v = await addVessel({ tag: 'FT-204', spec: SPEC });
    const cases: [Partial<Parameters<typeof sampleCheck>[1]>, string][] = [
      [{ technician: ' ' }, 'technician'],
      [{ note: 'x'.repeat(4001) }, 'note'],
      [{ reading: loose.reading({ temperatureK: Number.POSITIVE_INFINITY }) }, 'reading.temperatureK'],
      [{ inputs: { pressure: { text: '4', unit: 'bar', reference: 'vacuum' as 'gauge' } } }, 'inputs.pressure.reference'],
      [{ cautions: [{ signal: 'DANGEROUS' as 'DANGER', message: 'm', rule: 'r' }] }, 'cautions[0].signal'],
      [{ appVersion: '' }, 'appVersion'],
      [{ takenAt: new Date(Number.NaN) }, 'takenAt'],
      [{ reason: 'no target' }, 'reason'],
      [{ corrects: crypto.randomUUID() }, 'reason'],
    ];
    for (const [override, field] of cases) {
      await expect(appendCheck(sampleCheck(v.id, override)), field).rejects.toMatchObject({ field });
    }
    await expect(appendCheck(sampleCheck(crypto.randomUUID()))).rejects.toMatchObject({ code: 'not-found', field: 'vesselId' });
    await expect(appendCheck(sampleCheck(v.id, { corrects: crypto.randomUUID(), reason: 'r' }))).rejects.toMatchObject({
      code: 'not-found',
      field: 'corrects',
    });
    expect((await listChecks()).checks).toEqual([]);
  });

  it('maps a quota abort to StoreError quota-exceeded with nothing saved, and the chain continues after', async () => {
    const v = await addVessel({ tag: 'FT-204', spec: SPEC });
    const first = await appendCheck(sampleCheck(v.id));
    // The write carrying the new check (its block) runs out of room.
    const restore = failWritesOverQuota((value) => Array.isArray((value as LogBlock).texts) && (value as LogBlock).texts.some((t) => t.includes('"note":"too big"')));
    try {
      await expect(appendCheck(sampleCheck(v.id, { note: 'too big' }))).rejects.toMatchObject({
        name: 'StoreError',
        code: 'quota-exceeded',
      });
    } finally {
      restore();
    }
    expect((await listChecks()).checks).toEqual([first]);
    const next = await appendCheck(sampleCheck(v.id));
    expect(next).toMatchObject({ seq: 2, prevHash: first.hash });
  });
});

/** A valid seq-1 record for `device`, hashed as the store would (what another tab would save). */
async function appendCheckShape(vesselId: string, device: string): Promise<CheckRecord> {
  const unsigned = {
    id: crypto.randomUUID(), deviceId: device, seq: 1, time: '2026-12-01T20:00:00+00:00', timeMs: Date.parse('2026-12-01T20:00:00Z'),
    technician: 'Other tab', note: '', vesselId, vessel: { tag: 'FT-204', spec: SPEC }, inputs: {}, reading: loose.reading({}), result: loose.stored({}),
    cautions: [], appVersion: '0.1.0', formulationId: 'IAPWS-IF97 (R7-97(2012))', corrects: null, reason: null, prevHash: GENESIS_HASH,
  };
  return { ...unsigned, hash: await computeCheckHash(unsigned) };
}

describe('persistence', () => {
  it('asks navigator.storage.persist() once, at the first saved check, and reports the answer', async () => {
    let granted = false;
    const persist = vi.fn(async () => granted);
    vi.stubGlobal('navigator', { storage: { persist, persisted: async () => granted } });
    try {
      expect(await persistenceState()).toEqual({ state: 'not-asked', askedAt: null });
      const v = await addVessel({ tag: 'FT-204', spec: SPEC });
      expect(persist).not.toHaveBeenCalled();
      await appendCheck(sampleCheck(v.id));
      await vi.waitFor(async () => expect((await persistenceState()).state).toBe('best-effort'));
      await appendCheck(sampleCheck(v.id));
      expect(persist).toHaveBeenCalledTimes(1);
      granted = true; // e.g. the user installed the app later
      expect((await persistenceState()).state).toBe('persisted');
    } finally {
      vi.unstubAllGlobals();
    }
  });

  it('reports unsupported where there is no StorageManager', async () => {
    vi.stubGlobal('navigator', {});
    try {
      expect(await persistenceState()).toEqual({ state: 'unsupported', askedAt: null });
    } finally {
      vi.unstubAllGlobals();
    }
  });
});

describe('paging', () => {
  async function seed(count: number) {
    const a = await addVessel({ tag: 'A', spec: SPEC });
    const b = await addVessel({ tag: 'B', spec: SPEC });
    // Saved out of time order, alternating vessels, with ties on the same minute.
    for (let i = 0; i < count; i += 1) {
      const minute = (i * 37) % count;
      await appendCheck(sampleCheck(i % 2 ? b.id : a.id, { takenAt: new Date(T0 + Math.floor(minute / 2) * MINUTE) }));
    }
    return { a, b };
  }

  it('lists newest first in pages, without gaps or repeats', async () => {
    await seed(120);
    const seen: CheckRecord[] = [];
    let page = await listChecks({ limit: 50 });
    const sizes = [page.checks.length];
    seen.push(...page.checks);
    while (page.next) {
      page = await listChecks({ limit: 50, before: page.next });
      sizes.push(page.checks.length);
      seen.push(...page.checks);
    }
    expect(sizes).toEqual([50, 50, 20]);
    expect(new Set(seen.map((r) => r.id)).size).toBe(120);
    const keys = seen.map((r) => [r.timeMs, r.id] as const);
    const sorted = [...keys].sort((x, y) => y[0] - x[0] || (y[1] < x[1] ? -1 : 1));
    expect(keys).toEqual(sorted);
  });

  it('an exact last page has next = null', async () => {
    await seed(10);
    const page = await listChecks({ limit: 10 });
    expect(page.checks).toHaveLength(10);
    expect(page.next).toBeNull();
  });

  it('lists one vessel between two instants, newest first, paged', async () => {
    const { a } = await seed(60);
    const from = new Date(T0 + 5 * MINUTE);
    const to = new Date(T0 + 20 * MINUTE);
    const all: CheckRecord[] = [];
    let page = await checksForVessel(a.id, { from, to, limit: 4 });
    all.push(...page.checks);
    while (page.next) {
      page = await checksForVessel(a.id, { from, to, limit: 4, before: page.next });
      all.push(...page.checks);
    }
    const everything: CheckRecord[] = [];
    for (let p = await listChecks({ limit: 1000 }); ; ) {
      everything.push(...p.checks);
      if (!p.next) break;
      p = await listChecks({ limit: 1000, before: p.next });
    }
    const expected = everything.filter((r) => r.vesselId === a.id && r.timeMs >= from.getTime() && r.timeMs <= to.getTime());
    expect(expected.length).toBeGreaterThan(8);
    expect(all.map((r) => r.id)).toEqual(expected.map((r) => r.id));
    expect((await checksForVessel(a.id, { from: to, to: from })).checks).toEqual([]);
  });

  it('refuses a limit outside 1 to 1000', async () => {
    await expect(listChecks({ limit: 0 })).rejects.toMatchObject({ field: 'limit' });
    await expect(listChecks({ limit: 1001 })).rejects.toThrow(/allowed 1 to 1000/);
  });
});
