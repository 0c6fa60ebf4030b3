// Issue 11: one test per bug the field trial found that a unit test can show. Each was written
// against the code as it stood and failed there (the commit that added this file says which).
// Factors: NIST SP 811 (2008) Appendix B.8 (psi 6894.757 Pa, ft 0.3048 m); °C = K − 273.15 (SI
// Brochure, 9th ed., 2.3.1). Test vessels are invented.
import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { InputError, evaluateCheck, saturationPressure, type VesselSpec } from '../../src/core/index.ts';
import { resultView } from '../../src/ui/state/result-text.ts';
import { formatWithBand, setDecimalSeparator, shortTime } from '../../src/ui/state/format.ts';
import { errorText } from '../../src/ui/state/error-text.ts';
import { UNIT_PRESETS } from '../../src/ui/state/settings-model.ts';
import { specFromForm } from '../../src/ui/state/vessel-spec.ts';
import { emptyVesselForm, type VesselForm } from '../../src/ui/state/vessel-form.ts';
import { trendGeometry, type TrendPoint } from '../../src/ui/review/trend-data.ts';
import { csvFromChecks } from '../../src/store/csv.ts';
import type { CheckRecord } from '../../src/store/index.ts';

setDecimalSeparator('.');

const vessel: VesselSpec = {
  tag: 'T-11', description: 'invented test vessel', designTemperatureK: 473.15, vacuumRated: false, siteAtmospherePa: 101_325,
  ambientTemperatureK: 293.15,
  geometry: { shape: 'horizontal-cylinder', innerDiameterM: 0.9, straightLengthM: 1.5, head: { kind: 'torispherical' } },
  tareKg: 850, mawpGaugePa: 300e3, reliefSetGaugePa: 280e3,
  instruments: {
    pressureGauge: { spanPa: 400e3, accuracyPercentOfSpan: 1 }, temperatureSensor: { kind: 'iec-60751', sensorClass: 'A' },
    weightToleranceKg: 2, volumeTolerancePercent: 2, barometerTolerancePa: 0,
  },
};
const time = '2026-12-01T10:00:00+00:00';

describe('digits a floor reading deserves', () => {
  it('"0.19687 ± 0.00073 m": the ± part to one or two significant digits, the value to the same place', () => {
    // Uncertainties to at most two significant digits: JCGM 100:2008 (GUM) 7.2.6 (from memory);
    // one digit when the leading digit is 3 to 9 is common practice.
    expect(formatWithBand(0.19687, 0.00073)).toBe('0.1969 ± 0.0007');
    expect(formatWithBand(412.34, 1.23)).toBe('412.3 ± 1.2');
  });

  it('"3.7828 kPa": no figure of a result carries more digits than its band resolves', () => {
    const T = 393.15;
    const r = evaluateCheck(vessel, { time, temperatureK: T, pressure: { reference: 'absolute', pressurePa: saturationPressure(T) + 3782.8 }, weight: { kind: 'not-weighed' } });
    const v = resultView(r, vessel, UNIT_PRESETS.SI);
    const all = v.figures.map((f) => f.value).join(' | ');
    // The pressure band here is about ±4 kPa (gauge 1 % of 400 kPa, atmosphere ±3 kPa): tenths of a kPa at most.
    expect(all).not.toMatch(/\d\.\d{2,} kPa/);
  });
});

describe('results in the unit the reading was typed in', () => {
  it('a reading typed in psi shows its pressures in psi, the preferred kPa beside them', () => {
    const T = 403.15;
    const r = evaluateCheck(vessel, { time, temperatureK: T, pressure: { reference: 'gauge', pressurePa: saturationPressure(T) - 101_325 }, weight: { kind: 'not-weighed' } });
    const v = (resultView as unknown as (...a: unknown[]) => ReturnType<typeof resultView>)(r, vessel, UNIT_PRESETS.SI, { pressure: 'psi' });
    const abs = v.figures.find((f) => /^(Absolute pressure|Pressure)$/.test(f.label))?.value ?? '';
    expect(abs).toMatch(/psi/);
    expect(abs).toMatch(/kPa/);
  });
});

describe('range messages', () => {
  it('"-50000 Pa … 611.657 to 22064000 Pa" for −50 typed in kPa: the unit typed, a true minus, the text quoted as typed', () => {
    let error: unknown;
    try {
      evaluateCheck(vessel, { time, temperatureK: 373.15, pressure: { reference: 'absolute', pressurePa: -50_000 }, weight: { kind: 'not-weighed' } });
    } catch (e) { error = e; }
    expect(error).toBeInstanceOf(InputError);
    const text = (errorText as unknown as (...a: unknown[]) => string)(error, { kind: 'pressure', unit: 'kPa' }, '-50');
    expect(text).toContain('"-50" kPa');
    expect(text).not.toMatch(/\bPa\b/);
    // p_s(273.15 K) = 611.213 Pa, the lowest pressure on IF97's saturation line, up to the critical pressure.
    expect(text).toMatch(/0\.611213 to 22 ?064 kPa/);
    // Any negative figure the message writes itself uses the minus sign U+2212.
    expect(text.replace('"-50"', '')).not.toMatch(/-\d/);
  });

  it('300 typed digits are quoted as typed (cut short), never "1e+300"', () => {
    const typed = '1' + '0'.repeat(299);
    const e = new InputError('pressure (absolute)', 'out-of-range', 1e300 * 1000, { min: 611.657, max: 22.064e6, unit: 'Pa' });
    const text = (errorText as unknown as (...a: unknown[]) => string)(e, { kind: 'pressure', unit: 'kPa' }, typed);
    expect(text).not.toMatch(/e\+/);
    expect(text).toContain('"1000000000');
  });
});

describe('times with their zone', () => {
  it('the log shows a stored time with its UTC offset', () => {
    expect(shortTime('2026-12-01T14:05:00+01:00')).toMatch(/14:05.*\+01:00/);
    expect(shortTime('2026-12-01T14:05:00+00:00')).toMatch(/14:05 UTC$/);
  });
});

describe('trend ticks that suit the span', () => {
  it('a one-day trend does not repeat the date on every tick', () => {
    const base = Date.parse('2026-12-01T06:00:00Z');
    const points: TrendPoint[] = [0, 4, 8, 12].map((h, i) => ({
      id: `c${i}`, timeMs: base + h * 3_600_000, quality: 0.01 * (i + 1), liquidMassKg: 100 + i, pressureDeviationPa: 100 * i,
      outcome: 'none', verdict: 'consistent', technician: 'T', time: new Date(base + h * 3_600_000).toISOString(),
    }));
    const labels = trendGeometry(points).xTicks.map((t) => t.label);
    const dated = labels.filter((l) => /\d{4}-\d{2}-\d{2}/.test(l));
    expect(dated.length).toBeLessThanOrEqual(1);
    expect(new Set(labels).size).toBe(labels.length);
  });
});

describe('one spelling', () => {
  it('cautions say "vapour" (British, as the rest of the app), never "vapor"', () => {
    const T = 423.15;
    const words: string[] = [];
    for (const grossKg of [900, 1400, 2000]) {
      for (const dp of [-20e3, 0, 40e3]) {
        try {
          const r = evaluateCheck(vessel, { time, temperatureK: T, pressure: { reference: 'absolute', pressurePa: saturationPressure(T) + dp }, weight: { kind: 'gross', grossKg } });
          words.push(...r.cautions.map((c) => c.message));
        } catch { /* an invented combination outside the engine's range */ }
      }
    }
    expect(words.length).toBeGreaterThan(5);
    expect(words.join(' ')).not.toMatch(/\bvapor/i);
  });
});

describe('the vessel editor: one unit per length field', () => {
  it('picking mm for the diameter leaves the straight length and the elevation in their own units', () => {
    const form = {
      ...emptyVesselForm(UNIT_PRESETS.SI, { elevationM: '350' }),
      tag: 'T-12', diameterM: '900', straightLengthM: '1,5', tare: '850', weightTol: '2', mawp: '300', relief: '280',
      gaugeSpan: '400', designTemperature: '200',
      diameterUnit: 'mm', straightLengthUnit: 'm', elevationUnit: 'm',
    } as VesselForm & Record<string, string>;
    (form as Record<string, unknown>).lengthUnit = 'mm';
    const r = specFromForm(form);
    if (!r.ok) throw new Error(JSON.stringify(r.errors));
    expect(r.spec.geometry).toMatchObject({ innerDiameterM: 0.9, straightLengthM: 1.5 });
    // 350 m by US Standard Atmosphere 1976: 97.23 kPa (its table, from memory; the core's own test checks the formula).
    expect(r.spec.siteAtmospherePa).toBeGreaterThan(97_000);
  });
});

describe('CSV for spreadsheets', () => {
  const record = {
    id: 'c1', vesselId: 'v1', deviceId: 'd1', seq: 1, time: '2026-12-01T10:00:00+00:00', timeMs: 0, technician: 'T', note: '',
    corrects: null, reason: null, appVersion: '0', formulationId: 'IAPWS-IF97', hash: 'h', prevHash: 'p',
    vessel: { tag: 'T-13', description: '', spec: {} },
    inputs: { temperature: { text: '123,4', unit: 'degC' } },
    reading: { temperatureK: 123.4 + 273.15, pressure: { reference: 'gauge', pressurePa: 120_000 } },
    result: {
      reading: { absolutePressurePa: 221_325, atmospherePa: 101_325, netMassKg: 500 },
      saturation: { saturationPressurePa: 219_000.123, pressureDeviationPa: 2_324.877, pressureBand: { plusMinus: 4_100 }, verdict: { verdict: 'consistent' } },
      inventory: { regime: 'two-phase', quality: 0.0123456, liquidMassKg: 493.8271, vaporMassKg: 6.1729 },
    },
    cautions: [{ signal: 'NOTICE', message: 'Contents at 123.4 °C.', rule: 'scald' }],
  } as unknown as CheckRecord;

  it('starts with a UTF-8 byte-order mark so a spreadsheet reads "°" right', () => {
    const text = csvFromChecks([record]);
    expect(text.charCodeAt(0)).toBe(0xfeff);
  });

  it('carries rounded columns beside the SI ones: no float noise like 396.54999999999995', () => {
    const text = csvFromChecks([record]);
    const rows = Papa.parse<Record<string, unknown>>(text.replace(/^\uFEFF/, ''), { header: true, dynamicTyping: true, skipEmptyLines: true }).data;
    const headers = Object.keys(rows[0]!);
    const shown = headers.find((h) => /temperature.*°C/.test(h));
    expect(shown).toBeDefined();
    expect(rows[0]![shown!]).toBe(123.4);
  });
});
