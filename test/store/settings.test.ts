import { describe, expect, it } from 'vitest';
import { useFreshDatabase } from './fixtures.ts';
import { clearDraft, closeStore, deviceId, getSetting, loadDraft, openStore, putSetting, saveDraft } from '../../src/store/index.ts';

useFreshDatabase();

describe('drafts', () => {
  it('save as the user types; the last one is what a reload finds', async () => {
    await saveDraft('new-check', { temperature: '1' });
    await saveDraft('new-check', { temperature: '15' });
    await saveDraft('new-check', { temperature: '151,8', pressureUnit: 'bar' });
    // A reload: the page's connection goes away and a new one opens on the same database.
    await closeStore();
    await openStore();
    const draft = await loadDraft('new-check');
    expect(draft?.value).toEqual({ temperature: '151,8', pressureUnit: 'bar' });
    expect(draft?.savedAt).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}(Z|[+-]\d\d:\d\d)$/);
    await clearDraft('new-check');
    expect(await loadDraft('new-check')).toBeUndefined();
  });

  it('keeps drafts under different keys apart and refuses what is not JSON', async () => {
    await saveDraft('new-check', 'a');
    await saveDraft('fill-plan', 'b');
    expect((await loadDraft('fill-plan'))?.value).toBe('b');
    await expect(saveDraft('new-check', { t: Number.NaN })).rejects.toMatchObject({ field: 'draft new-check.t' });
    await expect(saveDraft('', 'x')).rejects.toMatchObject({ field: 'draft key' });
    expect((await loadDraft('new-check'))?.value).toBe('a');
  });
});

describe('settings', () => {
  it('round-trips JSON values and keeps store-internal keys out of reach', async () => {
    expect(await getSetting('technicianName')).toBeUndefined();
    await putSetting('technicianName', 'R. Okafor');
    await putSetting('units', { pressure: 'bar', temperature: 'degC' });
    expect(await getSetting('technicianName')).toBe('R. Okafor');
    expect(await getSetting('units')).toEqual({ pressure: 'bar', temperature: 'degC' });
    await expect(putSetting('store:deviceId', 'x')).rejects.toMatchObject({ code: 'invalid-record', field: 'setting key' });
    await expect(getSetting('store:deviceId')).rejects.toMatchObject({ field: 'setting key' });
  });

  it('gives one stable device id per install', async () => {
    const [a, b] = await Promise.all([deviceId(), deviceId()]);
    expect(a).toBe(b);
    await closeStore();
    await openStore();
    expect(await deviceId()).toBe(a);
  });
});

describe('when the log last left the device', () => {
  it('records exports and consolidations apart, and an export of a backup records itself', async () => {
    const { backupState } = await import('../../src/store/settings.ts');
    const { recordBackup } = await import('../../src/store/backup-record.ts');
    const { exportBackup } = await import('../../src/store/transfer.ts');
    expect(await backupState()).toEqual({ exportedAt: null, consolidatedAt: null });
    await recordBackup('consolidation', '2026-12-01T08:00:00+01:00');
    expect(await backupState()).toEqual({ exportedAt: null, consolidatedAt: '2026-12-01T08:00:00+01:00' });
    const t0 = Math.floor(Date.now() / 1000) * 1000;
    await exportBackup();
    const t1 = Date.now();
    const state = await backupState();
    expect(state.consolidatedAt).toBe('2026-12-01T08:00:00+01:00');
    // Stamped to the second, between the export's start and its end.
    expect(Date.parse(state.exportedAt!)).toBeGreaterThanOrEqual(t0);
    expect(Date.parse(state.exportedAt!)).toBeLessThanOrEqual(t1);
  });
});
