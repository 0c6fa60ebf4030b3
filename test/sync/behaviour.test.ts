// How the sync client behaves against the CouchDB stand-in, beyond the server's rules: the log is
// the queue (checks saved offline go up, in seq order, when the server is back), a cancel leaves
// nothing half-done, a server copy of this device's chain that differs from the one here stops
// the push loudly, a pulled record failing its hash is refused and a gap shows as a gap, a batch
// pulled twice is skipped as identical, and vessel versions: newest wins, two edits of one
// version are shown, never merged. The design these follow is issue 15 and
// ../shared/reference/plant-sync.md; the chain rules are BACKUP-FORMAT.md's (SHA-256, FIPS 180-4).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fakeUuid, inventedSpec, partialNewResult } from '../../bench/generated-log.ts';
import { makeDevice, seedChain, type Device } from './devices.ts';
import { StandIn } from './stand-in.ts';

const CHECKS = 'tankside-checks';
let server: StandIn;
beforeAll(async () => {
  server = await StandIn.start();
}, 60_000);
afterAll(async () => {
  await server?.stop();
});

const SPEC = inventedSpec('TEST-SPEC', 2.5, 1200); // invented test vessel

async function saveCheck(d: Device, vesselId: string, note: string): Promise<void> {
  await d.store.appendCheck({
    vesselId,
    technician: 'Test Technician',
    note,
    inputs: { temperature: { text: '151,8', unit: 'degC' } },
    reading: { time: '2026-12-01T10:00:00+01:00', temperatureK: 424.95, pressure: { reference: 'gauge', pressurePa: 4e5 }, weight: { kind: 'not-weighed' } },
    result: partialNewResult({ verdict: 'consistent' }), // a stand-in result: the store keeps any JSON
    cautions: [],
    appVersion: 'test',
    formulationId: 'IAPWS-IF97 (R7-97(2012))',
  });
}

/**
 * A fetch that notes the seqs of every check record each _bulk_docs request carries, in order
 * (the device-key record at seq 0, sent at each sync before the records, is left out).
 */
function recordingFetch(sent: number[]): typeof fetch {
  return (input, init) => {
    if (String(input).endsWith('/_bulk_docs') && typeof init?.body === 'string') {
      for (const doc of (JSON.parse(init.body) as { docs: { seq: number }[] }).docs) if (doc.seq > 0) sent.push(doc.seq);
    }
    return fetch(input, init);
  };
}

/** The server's documents of a device in the order its changes feed lists them. */
/**
 * The seqs of this device's check records the server holds (its key record at seq 0 left out),
 * ascending. The feed lists one _bulk_docs
 * batch in the order its writes finished, not in seq order, so the order is not asserted here
 * (what went up in which order is read off the request bodies instead).
 */
async function storedSeqs(deviceId: string): Promise<number[]> {
  const r = await server.admin<{ results: { id: string; doc: { deviceId: string; seq: number } }[] }>('GET', `${CHECKS}/_changes?include_docs=true`);
  return r.body.results.filter((c) => c.doc?.deviceId === deviceId && c.doc.seq > 0).map((c) => c.doc.seq).sort((x, y) => x - y);
}

describe('the log is the queue', () => {
  it('checks saved while the server is unreachable go up when it returns, in order', async () => {
    const d = await makeDevice(fakeUuid(0x0ff11e00, 1));
    await d.enrol(server.url, server.addAccount('device', d.id));
    const vessel = await d.store.addVessel({ tag: 'TEST-01', spec: SPEC });
    const errors: unknown[] = [];
    const sent: number[] = [];
    const runner = new d.sync.SyncRunner(
      () => d.syncNow({ fetch: recordingFetch(sent), retry: { attempts: 2, firstDelayMs: 20, maxDelayMs: 20 } }),
      (e) => errors.push(e),
    );
    await server.kill();
    for (const note of ['first', 'second', 'third']) {
      await saveCheck(d, vessel.id, note);
      await runner.request(); // as the app does after each save
    }
    expect(errors).toHaveLength(3);
    expect(errors.every((e) => (e as { kind?: string }).kind === 'offline')).toBe(true);
    expect((await d.transfer.getSyncState()).lastSync).toMatchObject({ outcome: 'failed', pushed: 0 });
    // A failed sync consolidated nothing: the storage panel still says never.
    expect((await d.store.backupState()).consolidatedAt).toBeNull();
    await server.launch();
    await runner.request(); // as the app does on `online`
    expect(errors).toHaveLength(3);
    expect(sent).toEqual([1, 2, 3]);
    expect(await storedSeqs(d.id)).toEqual([1, 2, 3]);
    const last = (await d.transfer.getSyncState()).lastSync;
    expect(last).toMatchObject({ outcome: 'ok', pushed: 3 });
    // An ok sync counts as the log leaving the device whole (the storage panel, the backup reminder).
    expect((await d.store.backupState()).consolidatedAt).toBe(last!.at);
  });

  it('a cancelled push stops; the next one sends the rest, nothing twice', async () => {
    const d = await makeDevice(fakeUuid(0xca11ce00, 2));
    await d.enrol(server.url, server.addAccount('device', d.id));
    await seedChain(d, 1200, 41);
    const stop = new AbortController();
    const sent: number[] = [];
    const first = d.syncNow({ fetch: recordingFetch(sent), signal: stop.signal, onProgress: (p) => p.step === 'push' && p.done >= 500 && stop.abort() });
    await expect(first).rejects.toMatchObject({ kind: 'cancelled' });
    expect((await d.transfer.getSyncState()).lastSync).toMatchObject({ outcome: 'cancelled' });
    const before = (await storedSeqs(d.id)).length;
    expect(before).toBeGreaterThanOrEqual(500);
    expect(before).toBeLessThan(1200);
    const second = await d.syncNow({ fetch: recordingFetch(sent) });
    expect(second.push.pushed).toBe(1200 - before);
    // Sent in seq order, each once: the second push starts right after the server's head.
    expect(sent).toEqual(Array.from({ length: 1200 }, (_, i) => i + 1));
    expect(await storedSeqs(d.id)).toEqual(Array.from({ length: 1200 }, (_, i) => i + 1));
  });

  it('a server copy of this chain that differs from the one here stops the push, nothing sent', async () => {
    const id = fakeUuid(0xd1ffe500, 3);
    const first = await makeDevice(id);
    const password = server.addAccount('device', id);
    await first.enrol(server.url, password);
    await seedChain(first, 3, 42);
    await first.syncNow();
    // Another install with the same id and other records (a device restored wrongly, or a copy).
    const other = await makeDevice(id);
    await other.enrol(server.url, password);
    await seedChain(other, 5, 43);
    await expect(other.syncNow()).rejects.toMatchObject({ kind: 'chain-differs' });
    expect(await storedSeqs(id)).toEqual([1, 2, 3]);
    // An install that holds fewer records than the server is stopped too.
    const older = await makeDevice(id);
    await older.enrol(server.url, password);
    await seedChain(older, 2, 42);
    await expect(older.syncNow()).rejects.toMatchObject({ kind: 'chain-differs', message: expect.stringContaining('up to 3') });
  });
});

describe('what a supervisor pulls', () => {
  it('a record failing its hash is refused, a gap shows as a gap, a batch pulled twice changes nothing', async () => {
    const e = await makeDevice(fakeUuid(0xe0000000, 4));
    await e.enrol(server.url, server.addAccount('device', e.id));
    await seedChain(e, 6, 44);
    await e.syncNow();
    // An administrator (past the rules) damages record 3's text and removes record 5.
    const docId = (seq: number) => encodeURIComponent(`${e.id}:${String(seq).padStart(10, '0')}`);
    const three = (await server.admin<Record<string, unknown>>('GET', `${CHECKS}/${docId(3)}`)).body;
    await server.admin('PUT', `${CHECKS}/${docId(3)}`, { ...three, text: (three['text'] as string).replace('"note":""', '"note":"edited"') });
    const five = (await server.admin<Record<string, unknown>>('GET', `${CHECKS}/${docId(5)}`)).body;
    await server.admin('DELETE', `${CHECKS}/${docId(5)}?rev=${five['_rev'] as string}`);

    const s = await makeDevice(fakeUuid(0x5e000000, 5));
    await s.enrol(server.url, server.addAccount('supervisor', s.id), 'supervisor');
    const report = (await s.syncNow()).checks!;
    const mine = (label: string) => label.startsWith(e.id);
    expect(report.refused.filter((r) => mine(r.label))).toEqual([
      { label: `${e.id}:0000000003`, why: 'seq 3: content does not match its hash (changed after it was saved)' },
    ]);
    expect(report.gaps.filter((g) => g.deviceId === e.id).map((g) => [g.seq, g.problem])).toEqual([[4, 'gap'], [6, 'gap']]);
    const status = (await s.transfer.verifyStoredChains()).find((c) => c.deviceId === e.id);
    expect(status).toMatchObject({ status: 'broken', problem: 'missing-seq', at: { seq: 4 } });

    // The checkpoint moved only past what committed: pulling again from the start skips every
    // record already here as identical.
    const stored = await s.store.countStoredChecks();
    const key = Object.keys((await s.transfer.getSyncState()).checkpoints).find((k) => k.endsWith(` ${CHECKS}`))!;
    await s.transfer.updateSyncState({ checkpoints: { [key]: 0 } });
    const again = (await s.syncNow()).checks!;
    expect(again.added).toEqual([]);
    expect(again.skipped).toBe(stored);
    expect(await s.store.countStoredChecks()).toBe(stored);
  });
});

describe('records of other kinds', () => {
  it('a cycle record goes up under its kind through the server\'s rules and comes down to a supervisor, listed and verified', async () => {
    const d = await makeDevice(fakeUuid(0xc1c1e000, 6));
    await d.enrol(server.url, server.addAccount('device', d.id));
    const vessel = await d.store.addVessel({ tag: 'TEST-AC', spec: SPEC });
    await saveCheck(d, vessel.id, 'before the cycle');
    const cycle = await d.store.appendRecord('cycle', {
      vesselId: vessel.id, technician: 'Test Technician', values: { invented: 'test cycle' }, cautions: [],
      appVersion: 'test', formulationId: 'IAPWS-IF97 (R7-97(2012))',
    });
    expect((await d.syncNow()).push.pushed).toBe(2);
    const doc = (await server.admin<{ type: string; id: string }>('GET', `${CHECKS}/${encodeURIComponent(`${d.id}:${String(2).padStart(10, '0')}`)}`)).body;
    expect(doc).toMatchObject({ type: 'cycle', id: cycle.id });

    const s = await makeDevice(fakeUuid(0x5ec1c1e0, 1));
    await s.enrol(server.url, server.addAccount('supervisor', s.id), 'supervisor');
    const report = (await s.syncNow()).checks!;
    expect(report.added).toContain(cycle.id);
    expect(report.unknownKinds).toBe(0);
    expect((await s.store.listRecords({ kind: 'cycle', vesselId: vessel.id })).records).toEqual([cycle]);
    expect((await s.transfer.verifyStoredChains()).find((c) => c.deviceId === d.id)).toMatchObject({ status: 'ok', count: 2 });
  });
});

describe('the plant inventory: versions', () => {
  it('newest version wins; two edits of one version are shown and not applied; a newer version resolves it', async () => {
    const s1 = await makeDevice(fakeUuid(0x51000000, 6));
    const s2 = await makeDevice(fakeUuid(0x52000000, 7));
    const t = await makeDevice(fakeUuid(0x7e000000, 8));
    await s1.enrol(server.url, server.addAccount('supervisor', s1.id), 'supervisor');
    await s2.enrol(server.url, server.addAccount('supervisor', s2.id), 'supervisor');
    await t.enrol(server.url, server.addAccount('device', t.id));
    const vessel = await s1.store.addVessel({ tag: 'FT-TEST', description: 'version 1', spec: SPEC });
    expect((await s1.syncNow({ authorName: 'Supervisor One' })).publish!.published).toMatchObject([{ vesselId: vessel.id, version: 1 }]);
    await s2.syncNow();
    expect((await t.syncNow()).plant.applied).toMatchObject([{ vesselId: vessel.id, version: 1 }]);
    expect((await t.store.getVessel(vessel.id))?.description).toBe('version 1');

    // Both supervisors edit version 1.
    await s1.store.updateVessel(vessel.id, { description: 'edit by one' });
    await s2.store.updateVessel(vessel.id, { description: 'edit by two' });
    expect((await s1.syncNow()).publish!.published).toMatchObject([{ version: 2 }]);
    const s2sync = await s2.syncNow();
    expect(s2sync.publish!.published).toMatchObject([{ version: 2 }]);
    const tsync = await t.syncNow();
    expect(tsync.plant.conflicts).toMatchObject([{ kind: 'two-edits', vesselId: vessel.id, version: 2 }]);
    expect((await t.store.getVessel(vessel.id))?.description).toBe('version 1');

    // A supervisor saves version 3 from the clash; every device takes it.
    await s1.syncNow();
    await s1.store.updateVessel(vessel.id, { description: 'resolved' });
    expect((await s1.syncNow()).publish!.published).toMatchObject([{ version: 3 }]);
    expect((await t.syncNow()).plant.applied).toMatchObject([{ version: 3 }]);
    expect((await t.store.getVessel(vessel.id))?.description).toBe('resolved');

    // An edit made on the technician's device is not overwritten by a newer version: held, shown.
    await t.store.updateVessel(vessel.id, { description: 'edited on the phone' });
    await s1.store.updateVessel(vessel.id, { description: 'version 4' });
    await s1.syncNow();
    expect((await t.syncNow()).plant.conflicts).toMatchObject([{ kind: 'local-edit', vesselId: vessel.id, version: 4 }]);
    expect((await t.store.getVessel(vessel.id))?.description).toBe('edited on the phone');
  });
});

describe('signatures over sync', () => {
  it('a device\'s key goes up once before its records; a supervisor learns it and verifies the chain as signed', async () => {
    const t = await makeDevice(fakeUuid(0x5191ed00, 6));
    await t.enrol(server.url, server.addAccount('device', t.id));
    // Two records saved before the device signed (an import of its own older records carries no
    // signature), then two signed saves: old documents without a signature still pull.
    await seedChain(t, 2, 61);
    const vessel = await t.store.addVessel({ tag: 'TEST-SIG', spec: SPEC });
    await saveCheck(t, vessel.id, 'signed one');
    await saveCheck(t, vessel.id, 'signed two');
    await t.syncNow();
    await t.syncNow(); // the key record again: read back, identical, nothing new
    const doc = (seq: number) => server.admin<Record<string, unknown>>('GET', `${CHECKS}/${encodeURIComponent(`${t.id}:${String(seq).padStart(10, '0')}`)}`);
    expect((await doc(0)).body).toMatchObject({ type: 'device-key', seq: 0 });
    expect((await doc(1)).body['signature']).toBeUndefined();
    expect((await doc(4)).body['signature']).toMatch(/^[A-Za-z0-9_-]{86}$/);

    const s = await makeDevice(fakeUuid(0x5e000000, 7));
    await s.enrol(server.url, server.addAccount('supervisor', s.id), 'supervisor');
    const report = (await s.syncNow()).checks!;
    expect(report.keysLearnt).toContain(t.id);
    expect(report.refused.filter((r) => r.label.startsWith(t.id))).toEqual([]);
    const status = (await s.transfer.verifyStoredChains()).find((c) => c.deviceId === t.id);
    expect(status).toMatchObject({ status: 'ok', count: 4, signature: { state: 'signed', throughSeq: 4 } });
  });

  it('a record whose signature was changed on the server is refused; the ones its valid signatures vouch for are taken', async () => {
    const f = await makeDevice(fakeUuid(0xf0e9ed00, 8));
    await f.enrol(server.url, server.addAccount('device', f.id));
    const vessel = await f.store.addVessel({ tag: 'TEST-FORGE', spec: SPEC });
    for (const note of ['one', 'two', 'three']) await saveCheck(f, vessel.id, note);
    await f.syncNow();
    // An administrator (past the rules) gives record 3 the signature of record 2.
    const id = (seq: number) => encodeURIComponent(`${f.id}:${String(seq).padStart(10, '0')}`);
    const two = (await server.admin<Record<string, unknown>>('GET', `${CHECKS}/${id(2)}`)).body;
    const three = (await server.admin<Record<string, unknown>>('GET', `${CHECKS}/${id(3)}`)).body;
    await server.admin('PUT', `${CHECKS}/${id(3)}`, { ...three, signature: two['signature'] });

    const s = await makeDevice(fakeUuid(0x5e000000, 9));
    await s.enrol(server.url, server.addAccount('supervisor', s.id), 'supervisor');
    const report = (await s.syncNow()).checks!;
    const refused = report.refused.filter((r) => r.label.startsWith(f.id));
    expect(refused.map((r) => r.label)).toEqual([`${f.id}:0000000003`]);
    expect(refused[0]!.why).toMatch(/signature does not verify/);
    const status = (await s.transfer.verifyStoredChains()).find((c) => c.deviceId === f.id);
    expect(status).toMatchObject({ status: 'ok', count: 2, signature: { state: 'signed', throughSeq: 2 } });
  });
});
