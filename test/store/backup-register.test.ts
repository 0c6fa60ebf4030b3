// The instrument register in the JSON backup (format version 3): exported, carried to another
// device with nothing lost, skipped when already there, refused when a field breaks the format, and
// files of versions 1 and 2 (no register) still import. Invented test instruments and figures.
import { afterEach, describe, expect, it } from 'vitest';
import { IDBFactory } from 'fake-indexeddb';
import { addVessel, closeStore, StoreError } from '../../src/store/index.ts';
import {
  addCalibration, addInstrument, exportBackup, exportRegisterCsv, fitInstrument, fittingsOfVessel, importBackup, listRegister,
} from '../../src/store/transfer.ts';
import { BACKUP_FORMAT_VERSION, parseBackup } from '../../src/store/backup.ts';
import { dump, useDevice } from './backup-fixtures.ts';
import { SPEC, sampleCheck } from './fixtures.ts';
import { appendCheck } from '../../src/store/index.ts';
import Papa from 'papaparse';

afterEach(async () => {
  await closeStore();
});

async function deviceWithRegister(): Promise<{ backup: string; vesselId: string }> {
  await useDevice(new IDBFactory());
  const v = await addVessel({ tag: 'RX-1', spec: SPEC });
  const g = await addInstrument({ spec: { tag: 'PI-7', kind: 'pressure-gauge', range: { low: 0, high: 1e6 }, tolerance: { kind: 'percent-of-span', percentOfSpan: 1 } }, displayUnit: 'bar' });
  const t = await addInstrument({ spec: { tag: 'TI-7', kind: 'thermometer', range: { low: 273.15, high: 473.15 }, tolerance: { kind: 'stated', plusMinus: 1 } }, displayUnit: 'degC', description: '=cmd|x, a "quoted" note' });
  await addCalibration({ instrumentId: g.id, calibratedAt: new Date('2026-05-01T09:00:00Z'), asFoundError: 3200, asLeftError: 100, who: 'Test Lab', certificate: 'C-77', enteredUnit: 'bar', nextDueAt: new Date('2027-05-01T09:00:00Z') });
  await fitInstrument(v.id, 'pressure', g.id, { from: new Date('2026-05-02T09:00:00Z') });
  await fitInstrument(v.id, 'temperature', t.id, { from: new Date('2026-05-02T09:00:00Z') });
  await appendCheck(sampleCheck(v.id));
  return { backup: await exportBackup(), vesselId: v.id };
}

describe('the register in the backup', () => {
  it(`format version ${BACKUP_FORMAT_VERSION}: instruments, calibrations and fittings, one per line, carried to another device with nothing lost`, async () => {
    const { backup, vesselId } = await deviceWithRegister();
    const doc = parseBackup(backup);
    expect(doc.formatVersion).toBe(4);
    expect(doc.register!.instruments.map((i) => i.tag).sort()).toEqual(['PI-7', 'TI-7']);
    expect(doc.register!.calibrations).toHaveLength(1);
    expect(doc.register!.fittings).toHaveLength(2);
    const here = await listRegister();
    const fittings = await fittingsOfVessel(vesselId);
    await useDevice(new IDBFactory());
    const report = await importBackup(backup);
    expect(report.register).toEqual({ added: 5, updated: 0, skipped: [] });
    expect(await listRegister()).toEqual(here);
    expect(await fittingsOfVessel(vesselId)).toEqual(fittings);
    // Again: every register record is already here.
    const again = await importBackup(backup);
    expect(again.register.added).toBe(0);
    expect(again.register.skipped.map((s) => s.why)).toEqual(Array(5).fill('already here, identical'));
  });

  it('a calibration changed under its id is not taken (append-only): the one here stays, and the report says why', async () => {
    const { backup } = await deviceWithRegister();
    const doc = JSON.parse(backup) as { calibrations: { asFoundError: number }[] };
    doc.calibrations[0]!.asFoundError = 10;
    const before = await listRegister();
    const report = await importBackup(JSON.stringify(doc));
    expect(report.register.skipped.find((s) => /never changed/.test(s.why))).toBeDefined();
    expect(await listRegister()).toEqual(before);
  });

  it('a bad register field refuses the whole file, naming the field, with nothing written', async () => {
    const { backup } = await deviceWithRegister();
    await useDevice(new IDBFactory());
    const before = await dump();
    const bad = (edit: (d: Record<string, unknown[]>) => void) => {
      const d = JSON.parse(backup) as Record<string, unknown[]>;
      edit(d);
      return JSON.stringify(d);
    };
    const cases: [string, (d: Record<string, unknown[]>) => void][] = [
      ['calibrations[0].asFoundError', (d) => void ((d['calibrations']![0] as Record<string, unknown>)['asFoundError'] = 'high')],
      ['calibrations[0].timeMs', (d) => void ((d['calibrations']![0] as Record<string, unknown>)['timeMs'] = 5)],
      ['fittings[0].role', (d) => void ((d['fittings']![0] as Record<string, unknown>)['role'] = 'roof')],
      ['instruments[0].spec.kind', (d) => void (((d['instruments']![0] as Record<string, Record<string, unknown>>)['spec']!)['kind'] = 'sundial')],
      ['instruments[0].extra', (d) => void ((d['instruments']![0] as Record<string, unknown>)['extra'] = 1)],
      ['file.fittings', (d) => void delete d['fittings']],
    ];
    for (const [field, edit] of cases) {
      const e = await importBackup(bad(edit)).then(() => null, (x: unknown) => x);
      expect(e, field).toBeInstanceOf(StoreError);
      expect((e as StoreError).field, field).toBe(field);
    }
    expect(await dump()).toEqual(before);
    expect(await listRegister()).toEqual([]);
  });

  it('a file of format version 3 (the register, no barometer place) still imports with its register; version 4 carries an atmosphere fitting', async () => {
    const { backup, vesselId } = await deviceWithRegister();
    const v3 = { ...(JSON.parse(backup) as Record<string, unknown>), formatVersion: 3 };
    await useDevice(new IDBFactory());
    expect((await importBackup(JSON.stringify(v3))).register.added).toBe(5);
    expect(await fittingsOfVessel(vesselId)).toHaveLength(2);
    const baro = await addInstrument({ spec: { tag: 'PB-7', kind: 'barometer', range: { low: 80e3, high: 110e3 }, tolerance: { kind: 'stated', plusMinus: 50 } }, displayUnit: 'hPa' });
    await fitInstrument(vesselId, 'atmosphere', baro.id, { from: new Date('2026-06-01T09:00:00Z') });
    const again = await exportBackup();
    await useDevice(new IDBFactory());
    await importBackup(again);
    expect((await fittingsOfVessel(vesselId)).map((f) => f.role).sort()).toEqual(['atmosphere', 'pressure', 'temperature']);
  });

  it('files of format versions 1 and 2 (no register) still import', async () => {
    const { backup } = await deviceWithRegister();
    const d = JSON.parse(backup) as Record<string, unknown>;
    delete d['instruments'];
    delete d['calibrations'];
    delete d['fittings'];
    d['formatVersion'] = 2;
    await useDevice(new IDBFactory());
    const report = await importBackup(JSON.stringify(d));
    expect(report.checks.added).toHaveLength(1);
    expect(report.register).toEqual({ added: 0, updated: 0, skipped: [] });
    const v1 = { ...d, formatVersion: 1, chains: (d['chains'] as Record<string, unknown>[]).map(({ publicKey: _k, ...h }) => h) };
    delete (v1 as Record<string, unknown>)['signatures'];
    await useDevice(new IDBFactory());
    // A v1 file carries no signatures; its records import unsigned.
    expect((await importBackup(JSON.stringify(v1))).checks.added).toHaveLength(1);
  });

  it('the register as CSV: UTF-8 BOM, one row per calibration (an instrument with none gets one), CRLF line ends', async () => {
    await deviceWithRegister();
    const csv = await exportRegisterCsv(Date.parse('2026-06-01T00:00:00Z'));
    expect(csv.startsWith('\uFEFFinstrument_id,tag,kind,')).toBe(true);
    const rows = Papa.parse<Record<string, string>>(csv.slice(1), { header: true, skipEmptyLines: true }).data;
    expect(rows.map((r) => [r['tag'], r['as_found_error_si'], r['fitted_to_now']])).toEqual([['PI-7', '3200', 'RX-1'], ['TI-7', '', 'RX-1']]);
    expect(rows[0]!['certificate']).toBe('C-77');
    expect(rows[0]!['next_due']).toMatch(/^2027-05-01T09:00:00/);
    expect(csv.split('\r\n')).toHaveLength(4);
  });
});
