import { describe, expect, it } from 'vitest';
import { saturationPressure, type CautionQuantity } from '../../../src/core/index.ts';
import { INSTRUMENT_RULES, MS_PER_DAY, calibrationFinding, driftFromLog, type SaturatedCheck } from '../../../src/core/instrument/index.ts';

const START = Date.parse('2026-06-01T08:00:00Z');
// Invented checks on an invented chamber at 121 °C, offsets in Pa (test data).
const log = (offsets: number[]): SaturatedCheck[] =>
  offsets.map((o, i) => ({ timeMs: START + i * MS_PER_DAY, temperatureK: 394.15, absolutePressurePa: saturationPressure(394.15) + o }));
const wobble = (i: number) => 400 * Math.sin(i * 2.3);

describe('instrument findings', () => {
  it('the rules and their signal words (ours; CAUTION where a verdict\'s instruments are in doubt, NOTICE for information)', () => {
    expect(INSTRUMENT_RULES).toEqual({
      'instrument-pair-offset': 'CAUTION', 'instrument-pair-drift': 'CAUTION', 'calibration-overdue': 'CAUTION',
      'calibration-due-soon': 'NOTICE', 'no-calibration-on-record': 'NOTICE',
    });
  });
  it('pressure above saturation: names both instruments, the figures, and gas as one cause; parts carry SI', () => {
    const d = driftFromLog(log(Array.from({ length: 40 }, (_, i) => 6000 + wobble(i))), { gaugeTag: 'PG-7', thermometerTag: 'TE-7' });
    const [f] = d.findings;
    expect(f!.signal).toBe('CAUTION');
    expect(f!.message).toMatch(/^Over the last 40 checks gauge PG-7 reads 6\.0 kPa ± 0\.\d kPa above saturation for the reading of thermometer TE-7 \(0\.9\d K in temperature\): one of them has drifted, the atmosphere used for gauge readings is off, or gas is present\./);
    const quantities = f!.parts!.filter((p): p is CautionQuantity => typeof p !== 'string');
    expect(quantities[0]).toMatchObject({ kind: 'pressure' });
    expect(Math.abs((quantities[0] as { Pa: number }).Pa - 6000)).toBeLessThan(100);
    expect(quantities[2]).toMatchObject({ kind: 'temperature-difference' });
  });
  it('pressure below saturation: gas is ruled out as the cause (Dalton: gas adds to the pressure)', () => {
    const d = driftFromLog(log(Array.from({ length: 30 }, (_, i) => -5000 + wobble(i))));
    expect(d.findings[0]!.message).toMatch(/the gauge reads 5\.0 kPa ± 0\.\d kPa below saturation for the reading of the thermometer/);
    expect(d.findings[0]!.message).toContain('gas raises the pressure, it cannot lower it');
  });
  it('a trend towards the band: rate a month, the band, the dates (ISO 8601)', () => {
    const perDay = 1000 / 30.4375;
    const d = driftFromLog(log(Array.from({ length: 40 }, (_, i) => i * perDay + wobble(i) / 4)), {
      pressureBandPa: 9000, nextCalibrationDueMs: Date.parse('2027-06-01T00:00:00Z'),
    });
    const drift = d.findings.find((f) => f.rule === 'instrument-pair-drift')!;
    expect(drift.signal).toBe('CAUTION');
    // 9 kPa at 1 kPa a month from about zero on 2026-06-01: about nine months on
    expect(drift.message).toMatch(/^Over the last 40 checks the pressure less the saturation pressure \(the gauge against the thermometer\) is rising by 1\.0 kPa ± 0\.\d kPa a month; the check's band is ± 9\.0 kPa and it leaves that band about 2027-0[23]-\d\d, before the next calibration due 2027-06-01\./);
  });
  it('no finding inside the noise', () => {
    expect(driftFromLog(log(Array.from({ length: 30 }, (_, i) => wobble(i)))).findings).toEqual([]);
  });
  it('calibration findings: overdue, due soon, none on record; nothing when in date', () => {
    const due = Date.parse('2026-11-30T00:00:00Z');
    const base = { lastCalibrationMs: due - 365 * MS_PER_DAY, dueMs: due, dueSource: 'interval' as const };
    expect(calibrationFinding('PG-7', { state: 'overdue', ...base, untilDueMs: -1 })).toMatchObject({ signal: 'CAUTION', rule: 'calibration-overdue', message: expect.stringContaining('PG-7: calibration overdue since 2026-11-30') });
    expect(calibrationFinding('PG-7', { state: 'due-soon', ...base, untilDueMs: 1 })).toMatchObject({ signal: 'NOTICE', rule: 'calibration-due-soon', message: 'PG-7: calibration due soon, on 2026-11-30.' });
    expect(calibrationFinding('PG-7', { state: 'no-calibration' })).toMatchObject({ signal: 'NOTICE', rule: 'no-calibration-on-record' });
    expect(calibrationFinding('PG-7', { state: 'in-date', ...base, untilDueMs: 9e9 })).toBeNull();
  });
});
