// The store's side of plant sync (src/store/sync-log.ts), without a server: this device's records
// as pushed (their hashes checked with Node's crypto, an implementation of SHA-256 outside the
// project, FIPS 180-4), the merge of pulled texts (the backup import's rules, BACKUP-FORMAT.md),
// the link check after a pull, the sync settings' field checks (RULES 6: the field and its range,
// nothing saved), and vessel versions refused for a bad text.
import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { appendCheck, addVessel, getSetting, putSetting, type CheckRecord } from '../../src/store/index.ts';
import {
  applyVesselVersions,
  getSyncState,
  linksAround,
  mergePulledRecords,
  ownChainHead,
  ownRecords,
  updateSyncState,
} from '../../src/store/transfer.ts';
import { canonicalJson, contentOfText } from '../../src/store/integrity.ts';
import { fakeUuid, generatedChecks, generatedVessels } from '../../bench/generated-log.ts';
import { sampleCheck, SPEC, useFreshDatabase } from './fixtures.ts';

useFreshDatabase();

const sha256 = (text: string) => createHash('sha256').update(text, 'utf8').digest('hex');

async function otherDevicesChain(n: number): Promise<CheckRecord[]> {
  const vessels = generatedVessels(0xfeed, 2, Date.UTC(2026, 10, 1));
  return generatedChecks(
    { deviceId: fakeUuid(0x0de71ce0, 9), vesselPrefix: 'feed', vessels: 2, checks: n, startMs: Date.UTC(2026, 10, 1), stepMs: 60_000, technicians: ['T'], seed: 7 },
    vessels,
  );
}

describe("this device's records, as pushed", () => {
  it('come as the stored canonical texts, with the id and hash cut from them', async () => {
    const vessel = await addVessel({ tag: 'FT-1', spec: SPEC });
    const saved = [];
    for (let i = 0; i < 5; i += 1) saved.push(await appendCheck(sampleCheck(vessel.id, { note: `n${i}` })));
    const { head } = await ownChainHead();
    expect(head).toEqual({ seq: 5, hash: saved[4]!.hash });
    const records = await ownRecords(2, 3);
    expect(records.map((r) => r.seq)).toEqual([2, 3, 4]);
    for (const r of records) {
      expect(r.text).toBe(canonicalJson(saved[r.seq - 1]));
      expect(r.id).toBe(saved[r.seq - 1]!.id);
      expect(sha256(contentOfText(r.text))).toBe(r.hash); // Node's crypto agrees with the stored hash
    }
    expect(await ownRecords(5, 100)).toHaveLength(1);
    await expect(ownRecords(0, 1)).rejects.toMatchObject({ code: 'invalid-record', field: 'fromSeq' });
    await expect(ownRecords(1, 10_001)).rejects.toMatchObject({ code: 'invalid-record', field: 'count' });
  });
});

describe('records pulled from the server', () => {
  it('are merged with the import\'s rules: bad text, non-canonical text, changed content refused; a repeat skipped', async () => {
    const chain = await otherDevicesChain(4);
    const texts = chain.map((c) => canonicalJson(c));
    const changed = texts[2]!.replace('"note":""', '"note":"changed"');
    const report = await mergePulledRecords([
      { label: 'r1', text: texts[0]! },
      { label: 'r2', text: JSON.stringify(JSON.parse(texts[1]!), null, 1) }, // re-serialised
      { label: 'r3', text: changed },
      { label: 'r4', text: '{"id":1}' },
      { label: 'r5', text: 'not json' },
    ]);
    expect(report.added).toEqual([chain[0]!.id]);
    expect(report.refused.map((r) => r.label)).toEqual(['r2', 'r4', 'r5', 'r3']);
    expect(report.refused.find((r) => r.label === 'r3')!.why).toBe('seq 3: content does not match its hash (changed after it was saved)');
    expect(report.refused.find((r) => r.label === 'r4')!.why).toMatch(/^record\.\w+: /);
    expect(report.gaps).toEqual([]);
    const again = await mergePulledRecords([{ label: 'r1', text: texts[0]! }, { label: 'r4', text: texts[3]! }]);
    expect(again).toMatchObject({ added: [chain[3]!.id], skipped: 1, refused: [] });
    expect(again.gaps).toHaveLength(1); // seq 4 came without seq 2 and 3
  });

  it('take the text as already parsed when given, and still hold the record to the text', async () => {
    const chain = await otherDevicesChain(3);
    const texts = chain.map((c) => canonicalJson(c));
    const other = JSON.parse(texts[1]!.replace('"note":""', '"note":"not what the text says"')) as unknown;
    const report = await mergePulledRecords([
      { label: 'r1', text: texts[0]!, parsed: JSON.parse(texts[0]!) },
      { label: 'r2', text: texts[1]!, parsed: other }, // a parse that is not the text's
      { label: 'r3', text: texts[2]!, parsed: JSON.parse(texts[2]!) },
    ]);
    expect(report.refused.map((r) => [r.label, r.why])).toEqual([['r2', 'the text is not in canonical form (re-serialised or edited after it was saved)']]);
    expect(report.added).toEqual([chain[0]!.id, chain[2]!.id]);
    expect(report.gaps).toHaveLength(1); // seq 3 came without seq 2
  });

  it('linksAround shows gaps and broken links once the pull is over', async () => {
    const chain = await otherDevicesChain(6);
    const text = (i: number) => ({ label: `r${i}`, text: canonicalJson(chain[i]) });
    await mergePulledRecords([text(0), text(1), text(3), text(5)]);
    const device = chain[0]!.deviceId;
    expect(await linksAround([{ deviceId: device, fromSeq: 1, toSeq: 6 }])).toMatchObject([
      { seq: 4, problem: 'gap', detail: 'seq 3 missing before seq 4' },
      { seq: 6, problem: 'gap', detail: 'seq 5 missing before seq 6' },
    ]);
    await mergePulledRecords([text(2), text(4)]);
    expect(await linksAround([{ deviceId: device, fromSeq: 1, toSeq: 6 }])).toEqual([]);
  });
});

describe('sync settings', () => {
  it('are saved field by field; a bad field is named with its range and nothing changes', async () => {
    expect(await getSyncState()).toMatchObject({ server: null, account: null, role: null, checkpoints: {}, lastSync: null });
    await updateSyncState({ server: '/db/', account: 'a', password: 'p', role: 'technician' });
    await updateSyncState({ checkpoints: { '/db/ tankside-plant': '12-abc' } });
    await updateSyncState({ checkpoints: { '/db/ tankside-checks': 40 } });
    const good = await getSyncState();
    expect(good.checkpoints).toEqual({ '/db/ tankside-plant': '12-abc', '/db/ tankside-checks': 40 });
    await expect(updateSyncState({ role: 'boss' as never })).rejects.toMatchObject({ field: 'role' });
    await expect(updateSyncState({ server: '' })).rejects.toMatchObject({ field: 'server', message: 'server: 0 characters; allowed 1 to 2000' });
    await expect(updateSyncState({ extra: 1 } as never)).rejects.toMatchObject({ field: 'extra' });
    await expect(updateSyncState({ lastSync: { at: 'yesterday', outcome: 'ok', pushed: 0, pulled: 0, message: '' } })).rejects.toMatchObject({ field: 'lastSync.at' });
    expect(await getSyncState()).toEqual(good);
    // The app's own settings cannot reach it.
    await expect(putSetting('store:sync', {})).rejects.toMatchObject({ code: 'invalid-record' });
    await expect(getSetting('store:sync')).rejects.toMatchObject({ code: 'invalid-record' });
  });
});

describe('vessel versions', () => {
  it('a version whose text is not a valid vessel version is refused, naming the field', async () => {
    const vessel = generatedVessels(0xbeef, 1, Date.UTC(2026, 10, 1))[0]!;
    const entry = { author: 'x', authorName: '', basedOn: null, kind: 'vessel', savedAt: '2026-12-01T10:00:00+01:00', vessel, vesselId: vessel.id, version: 1 };
    const report = await applyVesselVersions([
      { label: 'ok', text: canonicalJson(entry) },
      { label: 'v0', text: canonicalJson({ ...entry, version: 0 }) },
      { label: 'tag', text: canonicalJson({ ...entry, vessel: { ...vessel, tag: '' } }) },
      { label: 'id', text: canonicalJson({ ...entry, vesselId: fakeUuid(1, 2) }) },
    ]);
    expect(report.applied).toMatchObject([{ label: 'ok', version: 1 }]);
    expect(report.refused).toEqual([
      { label: 'v0', why: 'version: expected a whole number from 1 to 999999' },
      { label: 'tag', why: expect.stringMatching(/^vessel\.tag: /) },
      { label: 'id', why: 'vessel.id: differs from vesselId' },
    ]);
  });
});
