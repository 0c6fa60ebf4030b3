import { describe, expect, it } from 'vitest';
import { SPEC, loose, sampleCheck, useFreshDatabase } from './fixtures.ts';
import { addVessel, appendCheck, listChecks, outcomeOfRecord, verdictOfResult, type CheckRecord } from '../../src/store/index.ts';
import { sortChecks } from '../../src/store/desk.ts';

useFreshDatabase();

const WORDS = ['DANGER', 'WARNING', 'CAUTION', 'NOTICE', null] as const;
const VERDICTS = ['consistent', 'pressure-above-saturation', 'pressure-below-saturation'] as const;

async function allChecks(): Promise<CheckRecord[]> {
  const out: CheckRecord[] = [];
  let before;
  for (;;) {
    const page = await listChecks({ limit: 1000, ...(before ? { before } : {}) });
    out.push(...page.checks);
    if (!page.next) return out;
    before = page.next;
  }
}

describe('sortChecks: the whole match in any order the month rows give (issue 14)', () => {
  it('orders every matching check, across vessels and months, not only a page', async () => {
    const tags = ['JV-3', 'ac-1', 'FT-2'];
    const vessels = await Promise.all(tags.map((tag) => addVessel({ tag, spec: SPEC })));
    for (let i = 0; i < 120; i += 1) {
      const word = WORDS[(i * 7) % 5]!;
      await appendCheck(sampleCheck(vessels[i % 3]!.id, {
        takenAt: new Date(Date.UTC(2026, i % 4, 1 + (i % 27), 8, i % 60)),
        technician: ['R. Okafor', 'a. lind', 'M. Brandt'][(i * 5) % 3]!,
        cautions: word === null ? [] : [{ signal: word, message: 'A finding made up for the test.', rule: 'test-finding' }],
        result: (i % 4 === 3 ? { quality: 0.01 } : { saturation: { verdict: { verdict: VERDICTS[i % 3] } } }) as never,
      }));
    }
    const every = await allChecks();
    const severity = (r: CheckRecord) => ['DANGER', 'WARNING', 'CAUTION', 'NOTICE', 'none'].indexOf(outcomeOfRecord(r));
    const newest = (a: CheckRecord, b: CheckRecord) => b.timeMs - a.timeMs || (a.id < b.id ? 1 : -1);
    const tagOf = new Map(vessels.map((v) => [v.id, v.tagKey]));

    const byOutcome = await sortChecks({}, { by: 'outcome' });
    expect(byOutcome.total).toBe(120);
    const got = [...(await byOutcome.page(0, 50)), ...(await byOutcome.page(50, 50)), ...(await byOutcome.page(100, 50))];
    expect(got.map((r) => r.id)).toEqual([...every].sort((a, b) => severity(a) - severity(b) || newest(a, b)).map((r) => r.id));

    const byVesselDown = await sortChecks({}, { by: 'vessel', descending: true });
    const v = await byVesselDown.page(0, 1000);
    expect(v.map((r) => r.id)).toEqual([...every].sort((a, b) => -tagOf.get(a.vesselId)!.localeCompare(tagOf.get(b.vesselId)!) || newest(a, b)).map((r) => r.id));

    const tech = await (await sortChecks({}, { by: 'technician' })).page(0, 1000);
    expect(tech.map((r) => r.id)).toEqual([...every].sort((a, b) => a.technician.toLowerCase().localeCompare(b.technician.toLowerCase()) || newest(a, b)).map((r) => r.id));

    const oldest = await (await sortChecks({}, { by: 'time' })).page(0, 1000);
    expect(oldest.map((r) => r.id)).toEqual([...every].reverse().map((r) => r.id));

    const verdictRank = (r: CheckRecord) => { const x = verdictOfResult(r.result); return x === null ? 3 : VERDICTS.indexOf(x); };
    expect(new Set(every.map((r) => verdictOfResult(r.result))).size).toBe(4);
    expect(new Set(every.map(outcomeOfRecord)).size).toBe(5);
    const byVerdict = await (await sortChecks({}, { by: 'verdict' })).page(0, 1000);
    expect(byVerdict.map((r) => r.id)).toEqual([...every].sort((a, b) => verdictRank(a) - verdictRank(b) || newest(a, b)).map((r) => r.id));
  });

  it('sorts the whole match by each key figure (schema v10 rows), checks without it last either way', async () => {
    const v = await addVessel({ tag: 'FT-9', spec: SPEC });
    // Invented test data: temperature, absolute pressure and, when two-phase, quality and liquid mass.
    for (let i = 0; i < 40; i += 1) {
      const twoPhase = i % 5 !== 0;
      await appendCheck(sampleCheck(v.id, {
        takenAt: new Date(Date.UTC(2026, i % 3, 1 + i)),
        reading: loose.reading({ temperatureK: 400 + ((i * 13) % 40), pressure: { pressurePa: 2e5 + ((i * 7) % 40) * 1e3, reference: i % 2 ? 'gauge' : 'absolute' } }),
        result: loose.result(i === 7 ? {} : {
          reading: { absolutePressurePa: 3e5 + ((i * 11) % 40) * 1e3 },
          inventory: twoPhase ? { regime: 'two-phase', quality: ((i * 17) % 40) / 1000, liquidMassKg: 900 + ((i * 3) % 40) } : { regime: 'liquid-full' },
        }),
      }));
    }
    const every = await allChecks();
    const newest = (a: CheckRecord, b: CheckRecord) => b.timeMs - a.timeMs || (a.id < b.id ? 1 : -1);
    type Loose = { reading?: { absolutePressurePa?: number }; inventory?: { regime?: string; quality?: number; liquidMassKg?: number } };
    const res = (r: CheckRecord) => r.result as unknown as Loose;
    const twoPhase = (r: CheckRecord) => res(r).inventory?.regime === 'two-phase';
    const figure = {
      temperature: (r: CheckRecord) => r.reading.temperatureK,
      // The gauge reading sorts by the absolute pressure the engine used; the one without a result by none.
      pressure: (r: CheckRecord) => res(r).reading?.absolutePressurePa ?? null,
      quality: (r: CheckRecord) => (twoPhase(r) ? res(r).inventory!.quality! : null),
      liquid: (r: CheckRecord) => (twoPhase(r) ? res(r).inventory!.liquidMassKg! : null),
    };
    for (const by of ['temperature', 'pressure', 'quality', 'liquid'] as const) {
      for (const descending of [false, true]) {
        const f = figure[by];
        const expected = [...every].sort((a, b) => {
          const x = f(a);
          const y = f(b);
          if (x === null || y === null) return (x === null ? 1 : 0) - (y === null ? 1 : 0) || newest(a, b);
          return (descending ? y - x : x - y) || newest(a, b);
        });
        const got = await (await sortChecks({}, { by, descending })).page(0, 1000);
        expect(got.map((r) => r.id), `${by}${descending ? ' descending' : ''}`).toEqual(expected.map((r) => r.id));
      }
    }
    expect(every.filter((r) => figure.quality(r) === null).length).toBeGreaterThan(5);
  });

  it('sorts only what the filter lets through', async () => {
    const a = await addVessel({ tag: 'A-1', spec: SPEC });
    const b = await addVessel({ tag: 'B-1', spec: SPEC });
    for (let i = 0; i < 10; i += 1) await appendCheck(sampleCheck(i % 2 ? a.id : b.id, { takenAt: new Date(Date.UTC(2026, 10, 1 + i)) }));
    const onlyA = await sortChecks({ vesselId: a.id, from: new Date(Date.UTC(2026, 10, 4)) }, { by: 'time', descending: true });
    expect(onlyA.total).toBe(4);
    expect((await onlyA.page(0, 10)).map((r) => r.time.slice(0, 10))).toEqual(['2026-11-10', '2026-11-08', '2026-11-06', '2026-11-04']);
  });

  it('refuses a sort key, offset or limit it does not know, naming it', async () => {
    await expect(sortChecks({}, { by: 'colour' as never })).rejects.toMatchObject({ code: 'invalid-record', field: 'sort.by' });
    const s = await sortChecks({}, { by: 'time' });
    await expect(s.page(-1, 10)).rejects.toMatchObject({ field: 'offset' });
    await expect(s.page(0, 1001)).rejects.toMatchObject({ field: 'limit' });
  });
});
