import { describe, expect, it } from 'vitest';
import { SPEC, sampleCheck, useFreshDatabase, loose } from './fixtures.ts';
import {
  StoreError,
  addVessel,
  appendCheck,
  checksForVessel,
  getVessel,
  listVessels,
  retireVessel,
  updateVessel,
} from '../../src/store/index.ts';

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
