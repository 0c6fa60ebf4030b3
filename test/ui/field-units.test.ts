// Units that cannot be mistaken, the outcome adapter, and the editor's live figures. Factors: NIST
// SP 811 (2008) B.8 (psi = 6894.757 Pa, bar = 100 kPa); the 2:1 semi-ellipsoidal head holds πD³/24
// (common practice; Megyesy's Pressure Vessel Handbook tabulates it, from memory). Vessels invented.
import { describe, expect, it } from 'vitest';
import { evaluateCheck, saturationPressure, STANDARD_ATMOSPHERE_PA, type VesselSpec } from '../../src/core/index.ts';
import { emptyCheckDraft, inVesselUnits, vesselUnits } from '../../src/ui/state/check-draft.ts';
import { gaugeSpanError } from '../../src/ui/state/gauge-span.ts';
import { splitOutcome, worstOf } from '../../src/ui/state/outcome.ts';
import { shapePreview, siteCounterpart } from '../../src/ui/state/vessel-preview.ts';
import { emptyVesselForm } from '../../src/ui/state/vessel-form.ts';
import { atmosphereChoices, chosenAtmosphere } from '../../src/ui/state/convert-atmosphere.ts';
import { setDecimalSeparator } from '../../src/ui/state/format.ts';
import { UNIT_PRESETS } from '../../src/ui/state/settings-model.ts';
import type { VesselRecord } from '../../src/store/index.ts';

setDecimalSeparator('.');

const vessel: VesselSpec = {
  tag: 'T-21', description: 'invented', designTemperatureK: 473.15, vacuumRated: false, siteAtmospherePa: 101_325, ambientTemperatureK: 293.15,
  geometry: { shape: 'vertical-cylinder', innerDiameterM: 0.6, straightLengthM: 1.2, head: { kind: 'semi-ellipsoidal-2-1' } },
  tareKg: 420, mawpGaugePa: 300e3, reliefSetGaugePa: 280e3,
  instruments: { pressureGauge: { spanPa: 400e3, accuracyPercentOfSpan: 1 }, temperatureSensor: { kind: 'iec-60751', sensorClass: 'A' }, weightToleranceKg: 1, volumeTolerancePercent: 2, barometerTolerancePa: 0 },
  readingUnits: { pressure: 'kPa', temperature: 'degC', mass: 'kg' },
};

describe('a check starts in the vessel\'s units', () => {
  it('an empty field takes the vessel\'s unit; a field with text keeps the unit it was typed in', () => {
    const last = { ...emptyCheckDraft(UNIT_PRESETS.US, 'T'), pressure: { text: '', unit: 'psi' as const, kind: 'gauge' as const }, temperature: { text: '151', unit: 'degF' as const } };
    const d = inVesselUnits(last, vesselUnits(vessel, UNIT_PRESETS.US));
    expect(d.pressure.unit).toBe('kPa');
    expect(d.gross.unit).toBe('kg');
    expect(d.temperature).toEqual({ text: '151', unit: 'degF' });
    expect(inVesselUnits(d, vesselUnits(vessel, UNIT_PRESETS.US))).toBe(d);
  });

  it('a vessel saved without instrument units falls back to the person\'s preferred units', () => {
    const { readingUnits: _none, ...older } = vessel;
    expect(vesselUnits(older as VesselSpec, UNIT_PRESETS.US)).toEqual({ pressure: 'psi', temperature: 'degF', mass: 'lb' });
  });
});

describe('a value beyond the gauge\'s span', () => {
  it('"123,5" left in psi on a 0–400 kPa gauge (851 kPa) is refused with the span in psi and the units it would fit', () => {
    const msg = gaugeSpanError(123.5, '123,5', 'psi', 'gauge', vessel, STANDARD_ATMOSPHERE_PA);
    // 400 kPa / 6.894757 kPa per psi = 58.0 psi.
    expect(msg).toMatch(/"123,5" psi is beyond this vessel's gauge, which reads 0 to 58\.0 psi gauge \(0 to 400 kPa on its dial\)/);
    expect(msg).toMatch(/In kPa .*it would fit/);
  });

  it('a value inside the span, gauge or absolute, passes', () => {
    expect(gaugeSpanError(123.5, '123,5', 'kPa', 'gauge', vessel, STANDARD_ATMOSPHERE_PA)).toBeUndefined();
    expect(gaugeSpanError(3.5, '3,5', 'bar', 'absolute', vessel, STANDARD_ATMOSPHERE_PA)).toBeUndefined();
    // 6 bar absolute is 4.99 bar gauge: beyond a 4 bar span.
    expect(gaugeSpanError(6, '6', 'bar', 'absolute', vessel, STANDARD_ATMOSPHERE_PA)).toMatch(/up to 5\.01 bar absolute/);
  });
});

describe('the outcome adapter', () => {
  const time = '2026-12-01T10:00:00+00:00';
  it('a reading that agrees with saturation has no finding: flash, scald and the method notes do not drive it', () => {
    const T = 423.15;
    const r = evaluateCheck({ ...vessel, mawpGaugePa: 1000e3, reliefSetGaugePa: 950e3, instruments: { ...vessel.instruments, pressureGauge: { spanPa: 1600e3, accuracyPercentOfSpan: 1 } } },
      { time, temperatureK: T, pressure: { reference: 'absolute', pressurePa: saturationPressure(T) }, weight: { kind: 'gross', grossKg: 612 } });
    const s = splitOutcome(r);
    expect(r.cautions.some((c) => c.rule === 'flash-on-release')).toBe(true);
    expect(s.outcome).toBe('none');
    expect(s.findings).toEqual([]);
  });

  it('pressure above MAWP is a DANGER finding; each caution lands in exactly one list', () => {
    const r = evaluateCheck(vessel, { time, temperatureK: 420, pressure: { reference: 'gauge', pressurePa: 320e3 }, weight: { kind: 'not-weighed' } });
    const s = splitOutcome(r);
    expect(s.outcome).toBe('DANGER');
    expect(s.findings[0]?.rule).toBe('pressure-above-mawp');
    expect(s.findings.length + s.others.length).toBe(r.cautions.length);
  });

  it('uses the engine\'s own findings and outcome when a result carries them (the contract of issue 9)', () => {
    const finding = { signal: 'CAUTION' as const, rule: 'made-up-finding', message: 'x' };
    const s = splitOutcome({ cautions: [finding, { signal: 'WARNING' as const, rule: 'scald', message: 'y' }], findings: [finding], outcome: 'CAUTION' });
    expect(s.outcome).toBe('CAUTION');
    expect(s.others.map((c) => c.rule)).toEqual(['scald']);
    expect(worstOf([{ signal: 'NOTICE' }, { signal: 'WARNING' }])).toBe('WARNING');
    expect(worstOf([])).toBe('none');
  });
});

describe('the vessel editor\'s live figures', () => {
  it('the inner volume of a vertical cylinder with 2:1 heads: πD²L/4 + 2·πD³/24', () => {
    const f = { ...emptyVesselForm(UNIT_PRESETS.SI, {}), diameterM: '600', diameterUnit: 'mm' as const, straightLengthM: '1.2', straightLengthUnit: 'm' as const };
    const expected = (Math.PI * 0.36 * 1.2) / 4 + (2 * Math.PI * 0.216) / 24; // 0.3393 + 0.0565 = 0.3958 m³
    expect(shapePreview(f, UNIT_PRESETS.SI).volumeText).toBe(`${expected.toFixed(3)} m³ (${(expected * 1000).toFixed(0)} L)`);
  });

  it('an elevation shows its pressure, a pressure its elevation (US Standard Atmosphere 1976: 1600 m is 83.5 kPa, from its table, from memory)', () => {
    const f = { ...emptyVesselForm(UNIT_PRESETS.SI, {}), atmosphereMode: 'elevation' as const, elevationM: '1600' };
    expect(siteCounterpart(f)).toMatch(/83\.5\d? kPa absolute/);
    const p = { ...f, atmosphereMode: 'pressure' as const, atmosphere: '101.325' };
    expect(siteCounterpart(p)).toMatch(/about 0 m above sea level/);
  });
});

describe('Convert\'s atmosphere', () => {
  const rec = (tag: string, pa: number) => ({ id: tag, tag, retired: false, spec: { siteAtmospherePa: pa } }) as unknown as VesselRecord;
  it('defaults to a vessel\'s own site, not the standard atmosphere, when vessels have one; the barometer first when entered', () => {
    const none = { ok: false as const, error: 'x' };
    const choices = atmosphereChoices(none, 'standard', [rec('HIGH-1', 83_500)]);
    expect(chosenAtmosphere(choices, '').id).toBe('vessel:HIGH-1');
    expect(chosenAtmosphere(choices, 'standard').pressurePa).toBe(101_325);
    const baro = atmosphereChoices({ ok: true, pressurePa: 98_000, source: 'barometer reading 980 hPa' }, 'barometer', [rec('HIGH-1', 83_500)]);
    const site = atmosphereChoices({ ok: true, pressurePa: 97_191, source: 'elevation 350 m' }, 'elevation', []);
    expect(chosenAtmosphere(site, '').id).toBe('settings');
    expect(chosenAtmosphere(baro, '').id).toBe('barometer');
  });
});
