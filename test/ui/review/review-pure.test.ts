// The review's pure pieces: reading a stored result, the filter form, the trend geometry, row order.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { CheckRecord } from '../../../src/store/index.ts';
import { factsOf, outcomeOf, verdictOf } from '../../../src/ui/review/record-facts.ts';
import { dayEndMs, dayStartMs, EMPTY_FORM, monthDays, monthOfForm, readFilterForm, withMonth } from '../../../src/ui/review/review-filter.ts';
import { niceTicks, trendGeometry, type TrendPoint } from '../../../src/ui/review/trend-data.ts';
import { ROW_ORDERS, sortOfOrder } from '../../../src/ui/review/row-view.ts';
import { chainLine } from '../../../src/ui/review/chain-view.ts';

/** A record carrying a result shaped as src/core/README.md documents CheckResult (invented values). */
function record(result: unknown, cautions: CheckRecord['cautions'] = []): CheckRecord {
  return { result, cautions } as unknown as CheckRecord;
}

describe('record facts', () => {
  const NO_BANDS = { quality: null, liquidMassKg: null, pressureDeviationPa: null };

  it('reads verdict, quality, liquid mass and pressure deviation from a two-phase result', () => {
    const r = record(
      {
        saturation: { pressureDeviationPa: 1520.5, verdict: { verdict: 'pressure-above-saturation', noncondensableGas: {} } },
        inventory: { regime: 'two-phase', quality: 0.0123, liquidMassKg: 812.4 },
      },
      [
        { signal: 'NOTICE', message: 'n', rule: 'standing-note' },
        { signal: 'CAUTION', message: 'c', rule: 'x' },
        { signal: 'WARNING', message: 'w', rule: 'y' },
      ],
    );
    expect(factsOf(r)).toEqual({ verdict: 'pressure-above-saturation', outcome: 'WARNING', quality: 0.0123, liquidMassKg: 812.4, pressureDeviationPa: 1520.5, bands: NO_BANDS });
  });

  it('judges a record by its findings: standing hazards and notes never make the outcome (a v1 record by its rule ids, a v2 one by its findings)', () => {
    const v1 = record({}, [
      { signal: 'WARNING', message: 'flash', rule: 'flash-on-release' },
      { signal: 'WARNING', message: 'vacuum', rule: 'vacuum-on-cooling' },
      { signal: 'CAUTION', message: 'scald', rule: 'scald' },
      { signal: 'NOTICE', message: 'limits', rule: 'saturation-check-limits' },
      { signal: 'NOTICE', message: 'n', rule: 'standing-note' },
    ]);
    expect(outcomeOf(v1)).toBe('none');
    const v2 = record({ resultVersion: 2, findings: [{ signal: 'CAUTION', message: 'below', rule: 'pressure-below-saturation' }] }, [
      { signal: 'DANGER', message: 'door', rule: 'do-not-open-under-pressure' },
      { signal: 'CAUTION', message: 'below', rule: 'pressure-below-saturation' },
    ]);
    expect(outcomeOf(v2)).toBe('CAUTION');
  });

  it('gives nulls, not NaN, for other regimes and for damaged results', () => {
    expect(factsOf(record({ inventory: { regime: 'liquid-full', quality: 0.5 } }))).toMatchObject({ quality: null, liquidMassKg: null, verdict: 'none' });
    for (const bad of [null, 3, 'x', [], { saturation: { verdict: 'consistent', pressureDeviationPa: 'NaN' } }]) {
      const f = factsOf(record(bad));
      expect(f).toEqual({ verdict: 'none', outcome: 'none', quality: null, liquidMassKg: null, pressureDeviationPa: null, bands: NO_BANDS });
    }
    expect(verdictOf(record({ saturation: { verdict: { verdict: 'made-up' } } }))).toBe('none');
    expect(outcomeOf(record({}, [{ signal: 'NOTICE', message: 'n', rule: 'standing-note' }]))).toBe('none');
  });
});

describe('filter form', () => {
  it('reads local days and whole months (Gregorian calendar: 2028 is a leap year, 2026 is not)', () => {
    expect(monthDays('2026-02')).toEqual({ from: '2026-02-01', to: '2026-02-28' });
    expect(monthDays('2028-02')).toEqual({ from: '2028-02-01', to: '2028-02-29' });
    expect(monthDays('2026-13')).toBeNull();
    expect(dayStartMs('2026-02-30')).toBeNull();
    expect(dayStartMs('2026-12-01')).toBe(new Date(2026, 11, 1).getTime());
    expect(dayEndMs('2026-12-31')).toBe(new Date(2027, 0, 1).getTime() - 1);
    const form = withMonth(EMPTY_FORM, '2026-11');
    expect(form).toMatchObject({ from: '2026-11-01', to: '2026-11-30' });
    expect(monthOfForm(form)).toBe('2026-11');
    expect(monthOfForm({ ...form, to: '2026-11-29' })).toBe('');
  });

  it('names the field that cannot be read', () => {
    const v = ['consistent'];
    const s = ['DANGER', 'none'];
    expect(readFilterForm({ ...EMPTY_FORM, from: '2026-12-05', to: '2026-12-01' }, v, s)).toMatchObject({ ok: false, field: 'to' });
    expect(readFilterForm({ ...EMPTY_FORM, from: 'yesterday' }, v, s)).toMatchObject({ ok: false, field: 'from' });
    expect(readFilterForm({ ...EMPTY_FORM, verdict: 'fine' }, v, s)).toMatchObject({ ok: false, field: 'verdict' });
    expect(readFilterForm({ ...EMPTY_FORM, outcome: 'ALERT' }, v, s)).toMatchObject({ ok: false, field: 'outcome' });
    expect(readFilterForm({ ...EMPTY_FORM, from: '2026-12-01', to: '2026-12-01', outcome: 'DANGER' }, v, s)).toMatchObject({
      ok: true,
      filter: { fromMs: dayStartMs('2026-12-01'), toMs: dayEndMs('2026-12-01'), outcome: 'DANGER', vesselId: null },
    });
    expect(readFilterForm({ ...EMPTY_FORM, outcome: 'none' }, v, s)).toMatchObject({ ok: true, filter: { outcome: 'none' } });
  });
});

describe('trend geometry', () => {
  it('nice ticks cover the range in equal steps of 1, 2 or 5 × 10^n', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), fc.double({ min: 0, max: 1e6, noNaN: true }), (a, w) => {
        const ticks = niceTicks(a, a + w);
        expect(ticks[0]!).toBeLessThanOrEqual(a);
        expect(ticks[ticks.length - 1]!).toBeGreaterThanOrEqual(a + w);
        const step = ticks[1]! - ticks[0]!;
        const mantissa = step / 10 ** Math.floor(Math.log10(step));
        expect([1, 2, 5, 10].some((m) => Math.abs(m - mantissa) < 1e-6)).toBe(true);
        expect(ticks.length).toBeLessThanOrEqual(12);
      }),
    );
  });

  it('keeps every point and mark inside the plot and marks each check with findings (by its outcome)', () => {
    const point = fc.record({
      timeMs: fc.integer({ min: 0, max: 1e11 }),
      quality: fc.option(fc.double({ min: 0, max: 1, noNaN: true }), { nil: null }),
      liquidMassKg: fc.option(fc.double({ min: 0, max: 1e5, noNaN: true }), { nil: null }),
      pressureDeviationPa: fc.option(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { nil: null }),
      outcome: fc.constantFrom('none', 'DANGER', 'WARNING', 'CAUTION', 'NOTICE' as const),
    });
    fc.assert(
      fc.property(fc.array(point, { minLength: 1, maxLength: 40 }), (raw) => {
        const points = raw
          .sort((a, b) => a.timeMs - b.timeMs)
          .map((p, i): TrendPoint => ({ ...p, id: `c${i}`, verdict: 'consistent', technician: 't', time: '' }));
        const g = trendGeometry(points);
        for (const panel of g.panels) {
          const numbers = [...panel.path.matchAll(/[ML](-?[\d.]+) (-?[\d.]+)/g)].map((m) => [Number(m[1]), Number(m[2])] as const);
          expect(numbers.length).toBe(panel.count);
          for (const [x, y] of [...numbers, ...panel.marks.map((m) => [m.x, m.y] as const)]) {
            expect(x).toBeGreaterThanOrEqual(g.plot.left - 0.05);
            expect(x).toBeLessThanOrEqual(g.plot.right + 0.05);
            expect(y).toBeGreaterThanOrEqual(g.plot.top - 0.05);
            expect(y).toBeLessThanOrEqual(g.plot.bottom + 0.05);
          }
          expect(panel.marks.length).toBe(points.filter((p) => p.outcome !== 'none').length);
        }
      }),
    );
  });
});

describe('rows and chains', () => {
  it('every phone order is a store order over the whole match, each once', () => {
    expect(ROW_ORDERS.map((o) => `${o.sort.by}${o.sort.descending ? '↓' : '↑'}`)).toEqual(['time↓', 'time↑', 'outcome↑', 'verdict↑', 'vessel↑', 'technician↑', 'device↑', 'temperature↓', 'pressure↓', 'quality↓', 'liquid↑']);
    expect(sortOfOrder('severity')).toEqual({ by: 'outcome', descending: false });
    expect(sortOfOrder('nonsense' as never)).toEqual({ by: 'time', descending: true });
  });
  it('points a broken chain at its first bad record', () => {
    const line = chainLine({ deviceId: 'abcdef0123', status: 'broken', count: 9, at: { id: 'rec-5', seq: 5 }, problem: 'content-changed', detail: 'seq 5: content does not match its hash', signature: { state: 'unsigned' } });
    expect(line).toMatchObject({ ok: false, deviceShort: 'abcdef01', at: { id: 'rec-5', seq: 5 } });
    expect(line.text).toContain('seq 5');
    expect(line.text).toContain('changed');
  });
  it('says who signed an intact chain, and points a chain whose signatures fail at the first record they no longer vouch for', () => {
    const ok = { deviceId: 'abcdef0123', status: 'ok', count: 9, headSeq: 9, headHash: 'h' } as const;
    expect(chainLine({ ...ok, signature: { state: 'signed', fingerprint: 'FP-1', throughSeq: 9, headSeq: 9 } })).toMatchObject({
      ok: true, at: null, text: '9 records, seq 1 to 9; signed by device abcdef01 (key fingerprint FP-1)',
    });
    // Records received without signatures after the signed ones (plant sync): said, not called broken.
    expect(chainLine({ ...ok, signature: { state: 'signed', fingerprint: 'FP-1', throughSeq: 6, headSeq: 9 } })).toMatchObject({
      ok: true, text: expect.stringMatching(/up to seq 6; seq 7 to 9 carry no signature/),
    });
    expect(chainLine({ ...ok, signature: { state: 'unsigned' } }).text).toMatch(/not signed/);
    const failed = chainLine({ ...ok, signature: { state: 'failed', fingerprint: 'FP-1', throughSeq: 4, at: { id: 'rec-5', seq: 5 }, detail: 'seq 5: its signature does not verify' } });
    expect(failed).toMatchObject({ ok: false, at: { id: 'rec-5', seq: 5 } });
    expect(failed.text).toContain('signature fails at seq 5');
  });
});
