// The check entry as typed → the engine's Reading. Conversions: NIST SP 811 (1 kPa = 1000 Pa;
// 1 psi = 6894.757 Pa; 0 °C = 273.15 K; 1 lb = 0.45359237 kg).
import { describe, expect, it } from 'vitest';
import { readingFromDraft } from '../../src/ui/state/check-reading.ts';
import { emptyCheckDraft } from '../../src/ui/state/check-draft.ts';
import { UNIT_PRESETS } from '../../src/ui/state/settings-model.ts';

const base = emptyCheckDraft(UNIT_PRESETS.SI, 'T. Tech');
const now = new Date('2026-12-01T10:00:00Z');

describe('readingFromDraft', () => {
  it('reads a decimal comma and converts to SI (NIST SP 811 factors)', () => {
    const r = readingFromDraft({
      ...base,
      temperature: { text: '120,5', unit: 'degC' },
      pressure: { text: '97,3', unit: 'kPa', kind: 'gauge' },
      gross: { text: '1 400', unit: 'kg' },
    }, undefined, now);
    expect(r.kind).toBe('reading');
    if (r.kind !== 'reading') return;
    expect(r.reading.temperatureK).toBeCloseTo(393.65, 10);
    expect(r.reading.pressure).toEqual({ reference: 'gauge', pressurePa: 97_300 });
    expect(r.reading.weight).toEqual({ kind: 'gross', grossKg: 1400 });
    expect(r.reading.atmospherePa).toBeUndefined();
    expect(r.reading.time).toMatch(/^2026-12-01T\d\d:00:00(Z|[+-]\d\d:\d\d)$/);
  });

  it('converts US customary units (NIST SP 811: psi, °F, lb)', () => {
    const r = readingFromDraft({
      ...base,
      temperature: { text: '250', unit: 'degF' },
      pressure: { text: '15', unit: 'psi', kind: 'absolute' },
      gross: { text: '1000', unit: 'lb' },
    }, 100_000, now);
    if (r.kind !== 'reading') throw new Error(r.kind);
    expect(r.reading.temperatureK).toBeCloseTo(394.261, 3);
    expect(r.reading.pressure.pressurePa).toBeCloseTo(103_421.4, 1);
    expect(r.reading.weight).toEqual({ kind: 'gross', grossKg: 453.59237 });
    expect(r.reading.atmospherePa).toBe(100_000);
  });

  it('treats an empty gross weight as not weighed', () => {
    const r = readingFromDraft({ ...base, temperature: { text: '100', unit: 'degC' }, pressure: { text: '0', unit: 'kPa', kind: 'gauge' } }, undefined, now);
    if (r.kind !== 'reading') throw new Error(r.kind);
    expect(r.reading.weight).toEqual({ kind: 'not-weighed' });
  });

  it('asks for the missing fields', () => {
    const r = readingFromDraft({ ...base, temperature: { text: '100', unit: 'degC' } }, undefined, now);
    expect(r).toEqual({ kind: 'incomplete', message: expect.stringContaining('pressure') });
  });

  it('names each field it cannot read', () => {
    const r = readingFromDraft({
      ...base,
      temperature: { text: '15a', unit: 'degC' },
      pressure: { text: '1.2.3', unit: 'kPa', kind: 'gauge' },
      gross: { text: '-x', unit: 'kg' },
    }, undefined, now);
    expect(r.kind).toBe('input-error');
    if (r.kind !== 'input-error') return;
    expect(r.errors.temperature).toMatch(/^temperature/);
    expect(r.errors.pressure).toMatch(/^pressure/);
    expect(r.errors.gross).toMatch(/^gross weight/);
  });
});
