import { describe, expect, it } from 'vitest';
import { chosenColumns, COLUMNS } from '../../../src/ui/review/review-columns.ts';
import { UNIT_PRESETS } from '../../../src/ui/state/settings-model.ts';
import { setDecimalSeparator } from '../../../src/ui/state/format.ts';
import type { CheckRecord } from '../../../src/store/index.ts';

// One stored check (invented figures) as the wide review's cells show it.
const record = {
  id: '00000000-0000-4000-8000-000000000001', deviceId: 'abcdef12-0000-4000-8000-000000000001', time: '2026-12-01T14:05:00+01:00',
  vessel: { tag: 'FT-204' }, technician: 'R. Okafor', cautions: [],
  reading: { temperatureK: 420, pressure: { reference: 'gauge', pressurePa: 450_000 } },
  result: { saturation: { verdict: { verdict: 'consistent' } }, inventory: { regime: 'two-phase', quality: 0.0123, liquidMassKg: 1000 } },
} as unknown as CheckRecord;

const cell = (id: string, units = UNIT_PRESETS.SI) => COLUMNS.find((c) => c.id === id)!.text(record, units);

describe("the wide review's columns (issue 14)", () => {
  setDecimalSeparator('.');
  it('show the time with its zone and the key figures in the person\'s units', () => {
    expect(cell('time')).toBe('2026-12-01 14:05 UTC+01:00');
    expect(cell('temperature')).toBe('146.9 °C'); // 420 K − 273.15
    expect(cell('pressure')).toBe('450.0 kPa gauge');
    // NIST SP 811 (2008) B.8: 1 psi = 6 894.757 Pa, 1 lb = 0.453 592 37 kg; °F = K × 9/5 − 459.67.
    expect(cell('temperature', UNIT_PRESETS.US)).toBe('296.3 °F');
    expect(cell('pressure', UNIT_PRESETS.US)).toBe('65.27 psi gauge');
    expect(cell('liquid', UNIT_PRESETS.US)).toBe('2205 lb');
    expect(cell('quality')).toBe('1.23 %');
    expect(cell('verdict')).toBe('agrees');
    expect(cell('device')).toBe('abcdef12');
  });
  it('the time column always stays; unknown ids are dropped; every column sorts the whole match, the figures too (schema v10)', () => {
    expect(chosenColumns(['vessel', 'nonsense']).map((c) => c.id)).toEqual(['time', 'vessel']);
    expect(COLUMNS.filter((c) => c.sort === undefined).map((c) => c.id)).toEqual([]);
    expect(COLUMNS.map((c) => c.sort)).toEqual(['time', 'vessel', 'outcome', 'verdict', 'temperature', 'pressure', 'quality', 'liquid', 'technician', 'device']);
  });
});
