// The Cycle record's edge: a recorder CSV read with papaparse (a general-purpose parser outside the
// project) into readings, bad rows refused by line number with nothing taken; typed readings into
// SI (gauge + site atmosphere = absolute) and judged by the core; the CSV of a saved cycle read
// back with papaparse. Readings are invented test data; their pressures are p_sat(T) from Debian's
// python3-iapws (IAPWS97, x = 1), rounded to 0.1 kPa.
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { evaluateThrottlingDryness } from '../../src/core/index.ts';
import { readRecorderFile, readingsOfFile, type ColumnChoice } from '../../src/ui/cycles/cycle-file.ts';
import { defaultCycleFields, evaluateTypedCycle, readingsOf } from '../../src/ui/cycles/cycle-input.ts';
import { cycleReadingsCsv, cycleRecord } from '../../src/ui/cycles/cycle-record.ts';
import { STEAM_TESTS, evaluateTest } from '../../src/ui/cycles/steam-tests.ts';
import type { KindRecord } from '../../src/store/index.ts';
import type { VesselSpec } from '../../src/core/index.ts';

(globalThis as { __APP_VERSION__?: string }).__APP_VERSION__ = 'test';

const SPEC = {
  tag: 'T-1', geometry: { shape: 'stated-volume', volumeM3: 0.3 }, tareKg: 300, mawpGaugePa: 300e3, reliefSetGaugePa: 280e3,
  designTemperatureK: 473.15, vacuumRated: true, siteAtmospherePa: 101_325, ambientTemperatureK: 293.15,
  instruments: { pressureGauge: { spanPa: 400e3, accuracyPercentOfSpan: 1 }, temperatureSensor: { kind: 'iec-60751', sensorClass: 'A' }, weightToleranceKg: 1, volumeTolerancePercent: 2, barometerTolerancePa: 0 },
} as unknown as VesselSpec;

// 121 °C for 15 min: seconds, °C, kPa absolute.
const ROWS = ['0,90,70.2', '60,105,120.9', '120,115,169.2', '180,119,192.5', '240,121.2,206.3',
  ...Array.from({ length: 16 }, (_, i) => `${300 + 60 * i},121.6,208.9`), '1260,118,186.4'];
const CHOICE: ColumnChoice = { time: 'elapsed_s', temperature: 'T_C', pressure: 'p_kPa', timeFormat: 'seconds' };

describe('a recorder file', () => {
  it('reads the chosen columns; a bad row is refused by its line number and nothing is taken', async () => {
    const bad = ['elapsed_s,T_C,p_kPa', ...ROWS.map((r, i) => (i === 3 ? r.replace('119', '11g') : i === 8 ? r.replace(/^\d+/, '100') : r))].join('\n');
    const file = await readRecorderFile('bad.csv', `\uFEFF${bad}\n`);
    const refused = readingsOfFile(file, CHOICE);
    expect(refused.kind).toBe('refused');
    const problems = refused.kind === 'refused' ? refused.problems : [];
    expect(problems).toHaveLength(2);
    expect(problems[0]).toMatch(/^line 5: temperature/);
    expect(problems[1]).toMatch(/^line 10: time 100 is not after the row before/);
    const good = readingsOfFile(await readRecorderFile('good.csv', ['elapsed_s,T_C,p_kPa', ...ROWS].join('\r\n')), CHOICE);
    expect(good.kind === 'readings' ? good.readings.length : 0).toBe(ROWS.length);
  });

  it('takes ISO 8601 times as seconds from the first row, and refuses a column not chosen', async () => {
    const file = await readRecorderFile('iso.csv', 'when,T,p\n2026-12-02T07:00:00+01:00,120,198.5\n2026-12-02T06:01:30Z,121,205.0\n');
    const r = readingsOfFile(file, { time: 'when', temperature: 'T', pressure: 'p', timeFormat: 'date-time' });
    expect(r).toEqual({ kind: 'readings', startedAtMs: Date.parse('2026-12-02T06:00:00Z'), readings: [
      { timeS: 0, temperature: '120', pressure: '198.5' }, { timeS: 90, temperature: '121', pressure: '205.0' }] });
    expect(readingsOfFile(file, { time: 'when', temperature: '', pressure: 'p', timeFormat: 'date-time' }).kind).toBe('refused');
  });
});

describe('typed readings, judged by the core', () => {
  it('gauge readings are the absolute pressure less the vessel\'s site atmosphere', () => {
    const [r] = readingsOf([{ timeS: 0, temperature: '134', pressure: '202.9' }], { temperature: 'degC', pressure: 'kPa', reference: 'gauge' }, 101_325);
    expect(r!.temperatureK).toBeCloseTo(407.15, 9);
    expect(r!.absolutePressurePa).toBeCloseTo(304_225, 6);
  });

  it('a saturated 121 °C cycle held 17 min meets a 15 min hold; its CSV reads back row for row', async () => {
    const file = await readRecorderFile('good.csv', ['elapsed_s,T_C,p_kPa', ...ROWS].join('\n'));
    const got = readingsOfFile(file, CHOICE);
    if (got.kind !== 'readings') throw new Error('not read');
    const units = { temperature: 'degC', pressure: 'kPa', reference: 'absolute' } as const;
    const out = evaluateTypedCycle(SPEC, { ...defaultCycleFields('degC'), temperatureText: '121' }, got.readings, units);
    if (out.kind !== 'result') throw new Error(out.message);
    expect(out.evaluation.hold.status).toBe('met');
    const record = cycleRecord({ vesselId: '6f0c8a52-3c1d-4e8a-9b2f-0d7e5a1c4b93', technician: 'T', note: '', startedAt: new Date(0), values: {
      source: { kind: 'file', fileName: 'good.csv', columns: { ...CHOICE } }, units, cycleTypeTyped: defaultCycleFields('degC'), typedReadings: got.readings,
      input: out.input, evaluation: out.evaluation } });
    expect(record.cautions.length).toBe(out.evaluation.cautions.length);
    const csv = cycleReadingsCsv({ ...record, kind: 'cycle', id: 'x', vessel: { tag: 'T-1' } } as unknown as KindRecord);
    const rows = Papa.parse<Record<string, unknown>>(csv.replace(/^\uFEFF/, ''), { header: true, dynamicTyping: true, skipEmptyLines: true });
    expect(rows.errors).toEqual([]);
    expect(rows.data).toHaveLength(ROWS.length);
    expect(rows.data[4]!['pressure, absolute (Pa)']).toBeCloseTo(206_300, 6);
  });

  it('a reading that cannot be read refuses the evaluation, naming it', () => {
    const out = evaluateTypedCycle(SPEC, defaultCycleFields('degC'), [{ timeS: 0, temperature: '120', pressure: '100' }, { timeS: 10, temperature: 'x', pressure: '100' }],
      { temperature: 'degC', pressure: 'kPa', reference: 'gauge' });
    expect(out.kind === 'error' ? out.message : '').toMatch(/reading 2 temperature/);
  });
});

describe('the periodic tests as the screen reads them', () => {
  it('the throttling form gives the core\'s figure for the same SI input', () => {
    const def = STEAM_TESTS.find((t) => t.id === 'throttling-dryness')!;
    const shown = evaluateTest(def, { line: '300', calP: '101.325', calT: '110', min: '0.97' }, { pressure: 'kPa', temperature: 'degC' });
    const direct = evaluateThrottlingDryness({ linePressurePa: 300e3, calorimeterPressurePa: 101_325, calorimeterTemperatureK: 383.15 }, { minimumDryness: 0.97 });
    expect(shown.kind === 'result' ? (shown.graded as unknown as { dryness: number }).dryness : NaN).toBe(direct.dryness);
  });

  it('the dryness value says it approximates the dryness fraction and is not the same quantity', () => {
    const def = STEAM_TESTS.find((t) => t.id === 'dryness-value')!;
    expect(def.about).toMatch(/approximates the dryness fraction; it is not the same quantity/);
  });
});
