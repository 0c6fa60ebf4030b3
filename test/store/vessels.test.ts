import { describe, expect, it } from 'vitest';
import { SPEC, sampleCheck, useFreshDatabase, loose } from './fixtures.ts';
import {
  StoreError,
  addVessel,
  appendCheck,
  checksForVessel,
  CHECK_INTERVAL_RANGE_S,
  getVessel,
  listVessels,
  retireVessel,
  updateVessel,
} from '../../src/store/index.ts';
import { validateVessel } from '../../src/store/backup-format.ts';
import { latestChecks } from '../../src/store/desk.ts';
import { CHECK_INTERVAL_MAX_S, CHECK_INTERVAL_MIN_S } from '../../src/core/check/check-due.ts';

useFreshDatabase();

describe('vessels', () => {
  it('adds, reads back and lists by tag, case-insensitively', async () => {
    const a = await addVessel({ tag: ' FT-204 ', description: 'flash tank', spec: SPEC });
    await addVessel({ tag: 'ft-210', spec: SPEC });
    await addVessel({ tag: 'CR-01', spec: SPEC });
    expect(a.tag).toBe('FT-204');
    expect(await getVessel(a.id)).toEqual(a);
    expect((await listVessels()).map((v) => v.tag)).toEqual(['CR-01', 'FT-204', 'ft-210']);
    expect((await listVessels({ tagPrefix: 'fT-2' })).map((v) => v.tag)).toEqual(['FT-204', 'ft-210']);
    expect((await listVessels({ tagPrefix: 'FT-21' })).map((v) => v.tag)).toEqual(['ft-210']);
    expect(await listVessels({ tagPrefix: 'x' })).toEqual([]);
  });

  it('stores the spec as given, detached from the caller', async () => {
    const spec = { ...SPEC, instruments: { gauge: { accuracyPa: 5000 } } };
    const v = await addVessel({ tag: 'AC-1', spec: loose.spec(spec) });
    spec.instruments.gauge.accuracyPa = 1;
    expect((await getVessel(v.id))!.spec).toEqual({ ...SPEC, instruments: { gauge: { accuracyPa: 5000 } } });
  });

  it('updates a vessel; saved checks keep the snapshot they were taken with', async () => {
    const v = await addVessel({ tag: 'JV-7', spec: SPEC });
    const check = await appendCheck(sampleCheck(v.id));
    const updated = await updateVessel(v.id, { tag: 'JV-7A', spec: { ...SPEC, tareKg: 1300 } });
    expect(updated.tag).toBe('JV-7A');
    expect(updated.createdAt).toBe(v.createdAt);
    const [saved] = (await checksForVessel(v.id)).checks;
    expect(saved).toEqual(check);
    expect(saved!.vessel).toEqual({ tag: 'JV-7', spec: SPEC });
  });

  it('retires a vessel: hidden by default, history kept, no new checks', async () => {
    const v = await addVessel({ tag: 'AC-2', spec: SPEC });
    const c = await appendCheck(sampleCheck(v.id));
    const retired = await retireVessel(v.id);
    expect(retired.retired).toBe(true);
    expect(retired.retiredAt).not.toBeNull();
    expect(await listVessels()).toEqual([]);
    expect(await listVessels({ includeRetired: true })).toEqual([retired]);
    expect((await checksForVessel(v.id)).checks).toEqual([c]);
    await expect(appendCheck(sampleCheck(v.id))).rejects.toMatchObject({ code: 'invalid-record', field: 'vesselId' });
    // A correction of an old check on a retired vessel is still possible.
    const fix = await appendCheck(sampleCheck(v.id, { corrects: c.id, reason: 'wrong gauge noted' }));
    expect(fix.corrects).toBe(c.id);
    expect(await retireVessel(v.id)).toEqual(retired);
  });

  it('refuses bad input naming the field and range', async () => {
    await expect(addVessel({ tag: '   ', spec: SPEC })).rejects.toMatchObject({ code: 'invalid-record', field: 'tag' });
    await expect(addVessel({ tag: 'x'.repeat(65), spec: SPEC })).rejects.toThrow(/tag: 65 characters; allowed 1 to 64/);
    await expect(addVessel({ tag: 'A', spec: loose.spec({ volumeM3: Number.NaN }) })).rejects.toMatchObject({ field: 'spec.volumeM3' });
    await expect(addVessel({ tag: 'A', spec: [] as never })).rejects.toMatchObject({ field: 'spec' });
    await expect(updateVessel(crypto.randomUUID(), { tag: 'B' })).rejects.toMatchObject({ code: 'not-found' });
    await expect(updateVessel('not-a-uuid', {})).rejects.toBeInstanceOf(StoreError);
    expect(await listVessels({ includeRetired: true })).toEqual([]);
  });
});

describe('check interval (issue 14)', () => {
  it('is none by default: a new vessel is written without the key, as before', async () => {
    const v = await addVessel({ tag: 'ST-1', spec: SPEC });
    expect('checkIntervalS' in v).toBe(false);
    expect((await getVessel(v.id))!.checkIntervalS ?? null).toBeNull();
  });

  it('is set, kept across other edits, and cleared with null', async () => {
    const v = await addVessel({ tag: 'ST-2', spec: SPEC, checkIntervalS: 7 * 86_400 });
    expect(v.checkIntervalS).toBe(604_800);
    const renamed = await updateVessel(v.id, { tag: 'ST-2A' });
    expect(renamed.checkIntervalS).toBe(604_800);
    const cleared = await updateVessel(v.id, { checkIntervalS: null });
    expect('checkIntervalS' in cleared).toBe(false);
    expect((await getVessel(v.id))!.tag).toBe('ST-2A');
  });

  it('refuses an interval outside 1 hour to 1,096 days, naming the field, and changes nothing saved', async () => {
    const v = await addVessel({ tag: 'ST-3', spec: SPEC, checkIntervalS: 86_400 });
    for (const bad of [59, 1097 * 86_400, Number.NaN, '7' as unknown as number]) {
      await expect(updateVessel(v.id, { checkIntervalS: bad })).rejects.toMatchObject({ code: 'invalid-record', field: 'checkIntervalS' });
    }
    await expect(addVessel({ tag: 'ST-4', spec: SPEC, checkIntervalS: 0 })).rejects.toMatchObject({ field: 'checkIntervalS' });
    expect(await getVessel(v.id)).toEqual(v);
    expect((await listVessels()).map((x) => x.tag)).toEqual(['ST-3']);
  });

  it("the store's copy of the range equals the core's", () => {
    expect(CHECK_INTERVAL_RANGE_S).toEqual({ min: CHECK_INTERVAL_MIN_S, max: CHECK_INTERVAL_MAX_S });
  });
});

describe('latestChecks (issue 14)', () => {
  it("gives each vessel's newest check from the month buckets, across months, null for none", async () => {
    const a = await addVessel({ tag: 'FT-1', spec: SPEC });
    const b = await addVessel({ tag: 'FT-2', spec: SPEC });
    const c = await addVessel({ tag: 'FT-3', spec: SPEC });
    await appendCheck(sampleCheck(a.id, { takenAt: new Date('2026-10-03T08:00:00Z'), technician: 'A. One' }));
    const newest = await appendCheck(sampleCheck(a.id, {
      takenAt: new Date('2026-11-30T08:00:00Z'), technician: 'B. Two',
      cautions: [{ signal: 'WARNING', message: 'Gauge and thermometer disagree.', rule: 'test-finding' }],
    }));
    // Saved later, taken earlier: the newest by time taken wins, not by save order.
    await appendCheck(sampleCheck(a.id, { takenAt: new Date('2026-11-02T08:00:00Z') }));
    await appendCheck(sampleCheck(b.id, { takenAt: new Date('2026-12-01T10:00:00Z') }));
    const [la, lb, lc] = await latestChecks([a.id, b.id, c.id]);
    expect(la).toMatchObject({ vesselId: a.id, id: newest.id, timeMs: newest.timeMs, technician: 'B. Two', outcome: 'WARNING', findingSignals: ['WARNING'] });
    expect(lb).toMatchObject({ vesselId: b.id, outcome: 'CAUTION', timeMs: Date.parse('2026-12-01T10:00:00Z') });
    expect(lc).toBeNull();
    await expect(latestChecks(['not-a-uuid'])).rejects.toMatchObject({ code: 'invalid-record', field: 'vesselIds[0]' });
  });
});

describe('a backup or plant sync vessel with a check interval (issue 14)', () => {
  it('is taken with one in range and refused with one outside, naming the field', async () => {
    const v = await addVessel({ tag: 'ST-9', spec: SPEC, checkIntervalS: 3_600 });
    expect(validateVessel('vessels[0]', JSON.parse(JSON.stringify(v)))).toEqual(v);
    expect(() => validateVessel('vessels[0]', { ...v, checkIntervalS: 10 })).toThrow(/vessels\[0\]\.checkIntervalS/);
    const none = await addVessel({ tag: 'ST-10', spec: SPEC });
    expect(validateVessel('vessels[1]', JSON.parse(JSON.stringify(none)))).toEqual(none);
  });
});
