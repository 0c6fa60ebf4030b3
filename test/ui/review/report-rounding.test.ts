// The printed report's figures to what their bands resolve, as the check screen shows them (issue
// 11 §4): the band to one or two significant digits (JCGM 100:2008 7.2.6 for two, from memory;
// one from a leading 3 up, common practice), the value to the same place. Invented figures.
import { describe, expect, it } from 'vitest';
import { reportRow } from '../../../src/ui/review/report-data.ts';
import type { TrendPoint } from '../../../src/ui/review/trend-data.ts';

const point = (over: Partial<TrendPoint>): TrendPoint => ({
  id: 'c1', timeMs: 0, quality: 0.19687, liquidMassKg: 208.456, pressureDeviationPa: -3782.8,
  outcome: 'none', verdict: 'consistent', technician: 'T', time: '2026-12-01T14:05:00Z', ...over,
});

describe('report rows round each figure to its band', () => {
  it('quality ± 0.073 % → 19.69 %, liquid mass ± 0.03 kg → 208.46 kg, deviation ± 2.4 kPa → −3.8 kPa', () => {
    const row = reportRow(point({ bands: { quality: 0.00073, liquidMassKg: 0.03, pressureDeviationPa: 2400 } }));
    expect(row.quality).toBe('19.69 %');
    expect(row.liquidMass).toBe('208.46 kg');
    expect(row.deviation).toMatch(/^[\u2212-]3\.8 kPa$/);
  });

  it('wide bands show fewer digits: quality ± 4 % → 20 %, deviation ± 40 kPa → −4 kPa', () => {
    const row = reportRow(point({ bands: { quality: 0.04, liquidMassKg: 12, pressureDeviationPa: 40_000 } }));
    expect(row.quality).toBe('20 %');
    expect(row.liquidMass).toBe('208 kg');
    expect(row.deviation).toMatch(/^[\u2212-]4 kPa$/);
  });

  it('a record without bands keeps a few significant digits', () => {
    expect(reportRow(point({})).quality).toBe('19.7 %');
  });
});
