import { afterEach, describe, expect, it } from 'vitest';
import { IDBFactory } from 'fake-indexeddb';
import { closeStore, computeCheckHash, listVessels, StoreError, updateVessel, type CheckRecord } from '../../src/store/index.ts';
import { exportBackup, importBackup, verifyStoredChains } from '../../src/store/transfer.ts';
import { BACKUP_FORMAT_VERSION, BACKUP_LIMITS, parseBackup, parseBackupInSteps } from '../../src/store/backup.ts';
import { dump, makeDeviceWithBackup, seedDevice, useDevice } from './backup-fixtures.ts';
import { failWritesOverQuota } from './fixtures.ts';
import type { LogBlock } from '../../src/store/log-layout.ts';

afterEach(async () => {
  await closeStore();
});

const withoutExportedAt = (text: string) => text.replace(/"exportedAt":"[^"]*"/, '"exportedAt":""');

function edit(backup: string, change: (doc: { vessels: Record<string, unknown>[]; checks: Record<string, unknown>[]; chains: unknown[] } & Record<string, unknown>) => void): string {
  const doc = JSON.parse(backup);
  change(doc);
  return JSON.stringify(doc);
}

describe('export and import', () => {
  it('round trip: another profile gets identical records; export → import → export is byte-identical apart from exportedAt', async () => {
    const source = await makeDeviceWithBackup(8);
    const before = await dump();
    await useDevice(new IDBFactory());
    const report = await importBackup(source.backup);
    expect(report.checks.added).toHaveLength(9);
    expect(report.vessels.added).toHaveLength(2);
    expect(report.warnings).toEqual([]);
    expect(report.fileChains).toMatchObject([{ status: 'ok', count: 9, headSeq: 9 }]);
    expect(await dump()).toEqual(before);
    expect(withoutExportedAt(await exportBackup())).toBe(withoutExportedAt(source.backup));
    expect(await verifyStoredChains()).toMatchObject([{ status: 'ok', count: 9 }]);
  });

  it('the file is documented JSON: format, version, exportedAt with offset, one record per line', async () => {
    const { backup } = await makeDeviceWithBackup(2);
    const doc = parseBackup(backup);
    expect(doc.format).toBe('tankside-backup');
    expect(doc.formatVersion).toBe(BACKUP_FORMAT_VERSION);
    expect(BACKUP_FORMAT_VERSION).toBe(4);
    expect(doc.exportedAt).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d(Z|[+-]\d\d:\d\d)$/);
    // Header, then each section with one record per line (2 vessels, 3 checks, 3 signatures, 1 chain head; the test vessels have no typed instruments, so no register records).
    const recordLines = backup.split('\n').filter((l) => l.startsWith('{"') && !l.startsWith('{"format"'));
    expect(recordLines).toHaveLength(2 + 3 + 3 + 1);
    for (const line of recordLines) expect(() => JSON.parse(line.replace(/,$/, ''))).not.toThrow();
    expect(backup.startsWith('{"format":"tankside-backup","formatVersion":4,"exportedAt":')).toBe(true);
    expect(backup).toContain('\n"instruments":[],\n"calibrations":[],\n"fittings":[],\n');
  });

  it('importing the same file again adds nothing and reports every record as already here', async () => {
    const { backup } = await makeDeviceWithBackup(4);
    const before = await dump();
    const report = await importBackup(backup);
    expect(report.checks.added).toEqual([]);
    expect(report.checks.skipped).toHaveLength(5);
    expect(report.vessels.skipped.map((s) => s.why)).toEqual(['already here, identical', 'already here, identical']);
    expect(await dump()).toEqual(before);
  });

  it('merges another device\'s log beside this one; both chains stay intact', async () => {
    const other = await makeDeviceWithBackup(5, 'OT');
    await useDevice(new IDBFactory());
    await seedDevice(3, 'HM');
    const report = await importBackup(other.backup);
    expect(report.checks.added).toHaveLength(6);
    expect((await listVessels({ includeRetired: true })).map((v) => v.tag)).toEqual(['HM-1', 'HM-2', 'OT-1', 'OT-2']);
    const chains = await verifyStoredChains();
    expect(chains.map((c) => [c.status, c.count])).toEqual(
      expect.arrayContaining([['ok', 6], ['ok', 4]]),
    );
  });

  it('a later backup of the same device adds only the new records, linked to those already here', async () => {
    const device = await makeDeviceWithBackup(3);
    const early = device.backup;
    await useDevice(device.factory);
    await seedDevice(2, 'LT');
    const late = await exportBackup();
    await useDevice(new IDBFactory());
    await importBackup(early);
    const report = await importBackup(late);
    expect(report.checks.skipped).toHaveLength(4);
    expect(report.checks.added).toHaveLength(3);
    expect(await verifyStoredChains()).toMatchObject([{ status: 'ok', count: 7 }]);
  });

  /** Imports `text`, expects the whole file refused with exactly `refused` listed, and the store unchanged. */
  async function expectRefusedFor(text: string, refused: { deviceId?: string; seq: number; id?: string; why: RegExp }[]) {
    const before = await dump();
    const error = (await importBackup(text).then(() => null, (e: unknown) => e)) as StoreError | null;
    expect(error, 'the file was imported').not.toBeNull();
    expect(error).toMatchObject({ name: 'StoreError', code: 'invalid-backup', field: 'checks' });
    expect(error!.message).toMatch(/^Backup file not imported, nothing changed/);
    expect(error!.refused).toEqual(refused.map((r) => expect.objectContaining({ ...r, why: expect.stringMatching(r.why) })));
    expect(await dump()).toEqual(before);
    return error!;
  }

  it('one changed field in the file: the whole file is refused, naming that record by device and seq', async () => {
    const { backup } = await makeDeviceWithBackup(6);
    const doc = JSON.parse(backup);
    const target = doc.checks[3];
    target.reading.pressurePa += 1;
    await useDevice(new IDBFactory());
    await seedDevice(1, 'HM');
    const error = await expectRefusedFor(JSON.stringify(doc), [
      { deviceId: target.deviceId, seq: 4, id: target.id, why: /seq 4: content does not match its hash/ },
    ]);
    expect(error.message).toContain(`device ${String(target.deviceId).slice(0, 8)} seq 4`);
    // The untouched file then imports whole.
    expect((await importBackup(backup)).checks.added).toHaveLength(7);
    expect((await verifyStoredChains()).map((c) => c.status)).toEqual(['ok', 'ok']);
  });

  it('every bad record is listed, across devices, in device then seq order', async () => {
    const a = await makeDeviceWithBackup(5, 'AA');
    const b = await makeDeviceWithBackup(5, 'BB');
    await useDevice(a.factory);
    await importBackup(b.backup);
    const both = JSON.parse(await exportBackup());
    // Two records of one device and one of the other changed after they were saved.
    const picks = [both.checks[1], both.checks[4], both.checks[8]];
    for (const c of picks) c.note = `${c.note} (changed)`;
    await useDevice(new IDBFactory());
    const sorted = [...picks].sort((x, y) => (x.deviceId < y.deviceId ? -1 : x.deviceId > y.deviceId ? 1 : x.seq - y.seq));
    await expectRefusedFor(JSON.stringify(both), sorted.map((c) => ({ deviceId: c.deviceId, seq: c.seq, id: c.id, why: /content does not match its hash/ })));
  });

  it('the device\'s own backup with one record altered: refused as a failed hash, not only as an id already here', async () => {
    const device = await makeDeviceWithBackup(4);
    const doc = JSON.parse(device.backup);
    const target = doc.checks[2];
    target.technician = 'Someone Else';
    // Imported back into the same device, where every id is already here.
    await expectRefusedFor(JSON.stringify(doc), [{ deviceId: target.deviceId, seq: 3, id: target.id, why: /seq 3: content does not match its hash \(changed after it was saved\)/ }]);
  });

  it('a record re-hashed after editing breaks the next link: refused at that next record', async () => {
    const { backup } = await makeDeviceWithBackup(4);
    const doc = JSON.parse(backup);
    doc.checks[1].note = 'rewritten';
    doc.checks[1].hash = await computeCheckHash(doc.checks[1]);
    await useDevice(new IDBFactory());
    await expectRefusedFor(JSON.stringify(doc), [{ seq: 3, id: doc.checks[2].id, why: /prevHash is not the hash of seq 2/ }]);
  });

  it('a different record under an id already here refuses the file; the one here is kept', async () => {
    const { backup } = await makeDeviceWithBackup(3);
    const doc = JSON.parse(backup);
    doc.checks[0].note = 'other';
    doc.checks[0].hash = await computeCheckHash(doc.checks[0]);
    await expectRefusedFor(JSON.stringify(doc), [
      // The records after it are here already, identical, and skipped.
      { seq: 1, id: doc.checks[0].id, why: /seq 1: a different check with this id is already here/ },
    ]);
  });

  it('a record missing from the middle of a chain refuses the file at the record after the gap', async () => {
    const { backup } = await makeDeviceWithBackup(5);
    const doc = JSON.parse(backup);
    const [gone] = doc.checks.splice(2, 1);
    await useDevice(new IDBFactory());
    await expectRefusedFor(JSON.stringify(doc), [{ seq: 4, id: doc.checks[2].id, why: new RegExp(`seq ${gone.seq} is neither in the file nor here`) }]);
  });

  it('a newer edit of a vessel replaces the one here; an older one is skipped', async () => {
    const { backup } = await makeDeviceWithBackup(1);
    const [v] = await listVessels();
    await updateVessel(v!.id, { description: 'edited here later' });
    const report = await importBackup(backup);
    expect(report.vessels.skipped).toContainEqual({ id: v!.id, why: expect.stringMatching(/edited at the same time or later/) });
    const newer = edit(backup, (doc) => {
      const mine = doc.vessels.find((x) => x['id'] === v!.id)!;
      mine['description'] = 'edited elsewhere, even later';
      mine['updatedAt'] = '2099-01-01T00:00:00+00:00';
    });
    expect((await importBackup(newer)).vessels.updated).toEqual([v!.id]);
    expect((await listVessels()).find((x) => x.id === v!.id)!.description).toBe('edited elsewhere, even later');
  });

  it('refuses a file that stops before the chain head it names', async () => {
    const { backup } = await makeDeviceWithBackup(3);
    const cut = edit(backup, (doc) => void doc.checks.pop());
    await useDevice(new IDBFactory());
    await expectRefusedFor(cut, [{ seq: 4, id: '', why: /exported up to seq 4 but holds records only up to seq 3/ }]);
  });
});

describe('hostile and damaged files change nothing', () => {
  async function expectRefused(text: string, field: string | RegExp) {
    const before = await dump();
    const attempt = importBackup(text);
    await expect(attempt).rejects.toMatchObject({ name: 'StoreError', code: 'invalid-backup' });
    const error = (await attempt.catch((e: unknown) => e)) as { field: string };
    if (typeof field === 'string') expect(error.field).toBe(field);
    else expect(error.field).toMatch(field);
    expect(await dump()).toEqual(before);
  }

  it('refuses prototype keys anywhere, unknown and missing fields, bad types and ranges', async () => {
    const { backup } = await makeDeviceWithBackup(2);
    await useDevice(new IDBFactory());
    await seedDevice(1, 'HM');
    const v0 = backup.indexOf('"vessels":[\n{') + '"vessels":[\n{'.length;
    await expectRefused(backup.slice(0, v0) + '"__proto__":{"retired":true},' + backup.slice(v0), 'file');
    await expectRefused(backup.replace('"inputs":{', '"inputs":{"constructor":{"text":"1","unit":"K"},'), 'file');
    await expectRefused(backup.replace('"reading":{', '"reading":{"prototype":1,'), 'file');
    await expectRefused(edit(backup, (d) => void (d.checks[0]!['extra'] = 1)), 'checks[0].extra');
    await expectRefused(edit(backup, (d) => void delete d.checks[1]!['hash']), 'checks[1].hash');
    await expectRefused(edit(backup, (d) => void (d.checks[0]!['seq'] = 0)), 'checks[0].seq');
    await expectRefused(edit(backup, (d) => void (d.checks[0]!['seq'] = 1.5)), 'checks[0].seq');
    await expectRefused(edit(backup, (d) => void (d.checks[0]!['time'] = '2026-12-01 22:05')), 'checks[0].time');
    await expectRefused(edit(backup, (d) => void (d.checks[0]!['timeMs'] = 5)), 'checks[0].timeMs');
    await expectRefused(edit(backup, (d) => void (d.checks[0]!['technician'] = 'x'.repeat(101))), 'checks[0].technician');
    await expectRefused(edit(backup, (d) => void (d.checks[0]!['cautions'] = [{ signal: 'ALARM', message: 'm', rule: 'r' }])), 'checks[0].cautions[0].signal');
    await expectRefused(edit(backup, (d) => void (d.checks[0]!['hash'] = 'A'.repeat(64))), 'checks[0].hash');
    await expectRefused(edit(backup, (d) => void (d.vessels[0]!['tagKey'] = 'nope')), 'vessels[0].tagKey');
    await expectRefused(edit(backup, (d) => void (d.vessels[1]!['id'] = d.vessels[0]!['id'])), 'vessels[1]');
    await expectRefused(edit(backup, (d) => void (d['formatVersion'] = BACKUP_FORMAT_VERSION + 1)), 'formatVersion');
    await expectRefused(edit(backup, (d) => void (d['formatVersion'] = 0)), 'formatVersion');
    await expectRefused(edit(backup, (d) => void (d['format'] = 'other')), 'format');
    await expectRefused(edit(backup, (d) => void (d['extra'] = true)), 'file.extra');
    await expectRefused(backup.slice(0, -10), 'file');
    await expectRefused('', 'file');
    await expectRefused('[]', 'file');
    await expectRefused('null', 'file');
    await expectRefused('['.repeat(200_000) + ']'.repeat(200_000), 'file');
  });

  it('names a newer format version so the user knows to update', async () => {
    const { backup } = await makeDeviceWithBackup(1);
    await expect(importBackup(edit(backup, (d) => void (d['formatVersion'] = BACKUP_FORMAT_VERSION + 1)))).rejects.toThrow(new RegExp(`${BACKUP_FORMAT_VERSION + 1} was written by a newer Tankside`));
  });

  it('refuses a file over the size or count limits before parsing it', async () => {
    const { backup } = await makeDeviceWithBackup(3);
    expect(() => parseBackup(backup, { ...BACKUP_LIMITS, maxChars: backup.length - 1 })).toThrow(/characters; at most/);
    expect(() => parseBackup(backup, { ...BACKUP_LIMITS, maxChecks: 3 })).toThrow(/checks: 4 entries; at most 3/);
    expect(parseBackup(backup, { ...BACKUP_LIMITS, maxChars: backup.length }).checks).toHaveLength(4);
  });
});

describe('all or nothing', () => {
  it('a write failing over quota mid-import leaves nothing written', async () => {
    const { backup } = await makeDeviceWithBackup(6);
    const doc = JSON.parse(backup);
    await useDevice(new IDBFactory());
    await seedDevice(1, 'HM');
    const before = await dump();
    const victim = doc.checks[4].id as string;
    // The write that carries the victim (its block) runs out of room.
    const restore = failWritesOverQuota((value) => Array.isArray((value as LogBlock).texts) && (value as LogBlock).texts.some((t) => t.includes(victim)));
    try {
      await expect(importBackup(backup)).rejects.toMatchObject({ code: 'quota-exceeded' });
    } finally {
      restore();
    }
    expect(await dump()).toEqual(before);
    expect((await importBackup(backup)).checks.added).toHaveLength(7);
  });

  it('cancelled while hashing or while writing: nothing written', async () => {
    const { backup } = await makeDeviceWithBackup(6);
    await useDevice(new IDBFactory());
    const before = await dump();
    for (const at of [1, 9, 13]) {
      const controller = new AbortController();
      const seen: number[] = [];
      const attempt = importBackup(backup, {
        signal: controller.signal,
        onProgress: (done) => {
          seen.push(done);
          if (done >= at) controller.abort();
        },
      });
      await expect(attempt).rejects.toMatchObject({ code: 'cancelled' });
      expect(seen.length).toBeGreaterThan(0);
      expect(await dump()).toEqual(before);
    }
  });

  it('reports progress up to the total', async () => {
    const { backup } = await makeDeviceWithBackup(3);
    await useDevice(new IDBFactory());
    const seen: [number, number][] = [];
    await importBackup(backup, { onProgress: (d, t) => seen.push([d, t]) });
    expect(seen.at(-1)).toEqual([4 * 2 + 2, 4 * 2 + 2]);
    // Full only once the write has committed: the last block written still leaves one step.
    expect(seen.filter(([d, t]) => d === t)).toHaveLength(1);
    expect(seen.map((s) => s[0])).toEqual([...seen.map((s) => s[0])].sort((a, b) => a - b));
  });
});

describe('validating a backup in steps (the import\'s way)', () => {
  it('gives what parseBackup gives, document or first error, across validation groups; stops on cancel', async () => {
    const { backup } = await makeDeviceWithBackup(3);
    const doc = JSON.parse(backup) as { checks: Record<string, unknown>[] };
    // 1,500 copies of the checks (6,000 records) with fresh ids: the steps pause every 2,000.
    const many = Array.from({ length: 1500 }, (_, k) => doc.checks.map((c, j) => ({ ...c, id: `00000000-0000-4000-8000-${String(k * doc.checks.length + j).padStart(12, '0')}` }))).flat();
    const big = JSON.stringify({ ...doc, checks: many });
    expect(await parseBackupInSteps(big)).toEqual(parseBackup(big));
    const broken = JSON.stringify({ ...doc, checks: many.map((c, i) => (i === 4321 ? { ...c, seq: 0 } : c)) });
    expect(() => parseBackup(broken)).toThrow(/checks\[4321\]\.seq/);
    await expect(parseBackupInSteps(broken)).rejects.toMatchObject({ code: 'invalid-backup', field: 'checks[4321].seq' });
    const stop = new AbortController();
    stop.abort();
    await expect(parseBackupInSteps(big, { signal: stop.signal })).rejects.toMatchObject({ code: 'cancelled' });
  });
});

describe('importBackupFile', () => {
  it('where no worker can be made (Node), imports the file on this thread, the same as importBackup', async () => {
    const { importBackupFile } = await import('../../src/store/import-job.ts');
    const { backup } = await makeDeviceWithBackup(3);
    await useDevice(new IDBFactory());
    expect(typeof Worker).toBe('undefined');
    const report = await importBackupFile(new Blob([backup]));
    expect(report.checks.added).toHaveLength(4);
    const stop = new AbortController();
    stop.abort();
    await expect(importBackupFile(new Blob([backup]), { signal: stop.signal })).rejects.toMatchObject({ code: 'cancelled' });
  });
});

describe('the last word before the commit (the import worker asks the page)', () => {
  it('the write waits, open, for the answer: no stops it with nothing written, yes lets it commit', async () => {
    const { importDocument } = await import('../../src/store/backup.ts');
    const { backup } = await makeDeviceWithBackup(5);
    await useDevice(new IDBFactory());
    const before = await dump();
    // A late answer (the page's, through the worker's messages) while the transaction has nothing else to do.
    const late = (go: boolean) => () => new Promise<boolean>((done) => setTimeout(() => done(go), 30));
    await expect(importDocument(parseBackup(backup), { beforeCommit: late(false) })).rejects.toMatchObject({ code: 'cancelled' });
    expect(await dump()).toEqual(before);
    const report = await importDocument(parseBackup(backup), { beforeCommit: late(true) });
    expect(report.checks.added).toHaveLength(6);
    expect((await dump()).checks).toHaveLength(6);
  });
});
