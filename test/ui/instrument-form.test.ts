// The form that adds or changes a register instrument: text in the instrument's own unit to the
// store's SI, each bad field named with its valid range in that unit, and an edit that keeps what
// the form does not show. Unit factors are NIST SP 811 Appendix B's (kPa, bar and hPa exact; °C to
// K by the 273.15 offset). Invented test instruments.
import { describe, expect, it } from 'vitest';
import {
  draftOfInstrument, emptyInstrumentDraft, instrumentFromDraft, kindsFor, unitForKind, type InstrumentDraft,
} from '../../src/ui/state/instrument-form.ts';
import type { InstrumentRecord } from '../../src/store/index.ts';

const gauge = (patch: Partial<InstrumentDraft> = {}): InstrumentDraft => ({
  ...emptyInstrumentDraft('pressure-gauge'), tag: 'PI-201', unit: 'bar', low: '0', high: '16', classValue: '1,6', ...patch,
});

describe('the instrument form', () => {
  it('a gauge typed in bar becomes SI: range 0 to 1.6 MPa, class 1.6 % of span (NIST SP 811 B.8: 1 bar = 1e5 Pa exactly)', () => {
    const r = instrumentFromDraft(gauge());
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.instrument).toEqual({
      spec: { tag: 'PI-201', kind: 'pressure-gauge', range: { low: 0, high: 1.6e6 }, tolerance: { kind: 'percent-of-span', percentOfSpan: 1.6 } },
      displayUnit: 'bar', description: '',
    });
  });

  it('a thermometer in °C with a stated ± becomes K and a difference in K; an RTD keeps its IEC 60751 class', () => {
    const t = instrumentFromDraft({ ...emptyInstrumentDraft('thermometer'), tag: 'TI-7', low: '0', high: '200', classBasis: 'stated', classValue: '1' });
    expect(t.ok && t.instrument.spec).toEqual({ tag: 'TI-7', kind: 'thermometer', range: { low: 273.15, high: 473.15 }, tolerance: { kind: 'stated', plusMinus: 1 } });
    const rtd = instrumentFromDraft({ ...emptyInstrumentDraft('rtd'), tag: 'TE-7', low: '0', high: '150', classBasis: 'iec-60751', rtdClass: 'AA' });
    expect(rtd.ok && rtd.instrument.spec.tolerance).toEqual({ kind: 'iec-60751', sensorClass: 'AA' });
  });

  it('bad fields are each named with the valid range in the form\'s unit', () => {
    const r = instrumentFromDraft(gauge({ tag: ' ', low: '5', high: '2', classValue: '12' }));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors.tag).toMatch(/^tag: empty; .*1 to 64 characters/);
    expect(r.errors.high).toBe('range high: 2 bar must be above the range low (5 bar).');
    expect(r.errors.classValue).toBe('accuracy class: 12 % of span is outside the valid range 0 to 10 % of span.');
    const far = instrumentFromDraft(gauge({ high: '5000' }));
    expect(!far.ok && far.errors.high).toBe('range high: 5000 bar is outside the valid range -1.1 to 1000 bar.');
    const stated = instrumentFromDraft(gauge({ classBasis: 'stated', classValue: '20' }));
    expect(!stated.ok && stated.errors.classValue).toBe('stated tolerance: ± 20 bar is outside the valid range 0 to 16 bar (the span).');
    const iec = instrumentFromDraft(gauge({ classBasis: 'iec-60751' }));
    expect(!iec.ok && iec.errors.classValue).toMatch(/temperature sensors only/);
  });

  it('an edit keeps what the form does not show (indicator, drift allowance, interval) and may change the kind only within its unit', () => {
    const record: InstrumentRecord = {
      id: '00000000-0000-4000-8000-000000000001', tag: 'PB-1', tagKey: 'pb-1', displayUnit: 'hPa', description: 'site barometer',
      spec: { tag: 'PB-1', kind: 'barometer', range: { low: 80e3, high: 110e3 }, tolerance: { kind: 'stated', plusMinus: 50 }, indicatorTolerance: { kind: 'stated', plusMinus: 10 }, calibrationIntervalMs: 1e10 },
      origin: { kind: 'entered' }, retired: false, createdAt: '2026-01-01T00:00:00Z', updatedAt: '2026-01-01T00:00:00Z',
    };
    const d = draftOfInstrument(record);
    expect([d.low, d.high, d.classBasis, d.classValue, d.unit]).toEqual(['800', '1100', 'stated', '0.5', 'hPa']);
    const r = instrumentFromDraft({ ...d, tag: 'PB-2' }, record.spec);
    expect(r.ok && r.instrument.spec).toEqual({ ...record.spec, tag: 'PB-2' });
    expect(kindsFor(record.spec)).toEqual(['pressure-gauge', 'pressure-transmitter', 'barometer']);
    expect(instrumentFromDraft({ ...d, kind: 'weighing-system' }, record.spec).ok).toBe(false);
  });

  it('changing the kind keeps a unit that fits, else the family\'s first (a barometer hPa, a scale kg)', () => {
    expect(unitForKind('pressure-transmitter', 'bar')).toBe('bar');
    expect(unitForKind('barometer', 'degC')).toBe('hPa');
    expect(unitForKind('weighing-system', 'bar')).toBe('kg');
    expect(unitForKind('rtd', 'kg')).toBe('degC');
  });
});
