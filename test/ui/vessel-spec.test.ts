// The vessel editor's fields ↔ VesselSpec. Factors: NIST SP 811 (psi, lb, °F).
import { describe, expect, it } from 'vitest';
import { formFromSpec, specFromForm } from '../../src/ui/state/vessel-spec.ts';
import { emptyVesselForm, type VesselForm } from '../../src/ui/state/vessel-form.ts';
import { UNIT_PRESETS } from '../../src/ui/state/settings-model.ts';
import { atmosphereFromElevation } from '../../src/core/index.ts';
import type { VesselSpec } from '../../src/core/check/vessel-spec.ts';

const filled: VesselForm = {
  ...emptyVesselForm(UNIT_PRESETS.SI, { pressureText: '101.325' }),
  tag: 'T-1', description: 'test', diameterM: '1,2', straightLengthM: '2', tare: '800', weightTol: '2',
  mawp: '500', relief: '450', gaugeSpan: '1000', designTemperature: '180', barometerTol: '0,2',
};

describe('vessel form', () => {
  it('builds an SI spec the engine accepts', () => {
    const r = specFromForm(filled);
    if (!r.ok) throw new Error(JSON.stringify(r.errors));
    expect(r.spec.geometry).toEqual({ shape: 'vertical-cylinder', innerDiameterM: 1.2, straightLengthM: 2, head: { kind: 'semi-ellipsoidal-2-1' } });
    expect(r.spec.mawpGaugePa).toBe(500_000);
    expect(r.spec.siteAtmospherePa).toBeCloseTo(101_325, 6);
    expect(r.spec.designTemperatureK).toBeCloseTo(453.15, 10);
    expect(r.spec.instruments.temperatureSensor).toEqual({ kind: 'iec-60751', sensorClass: 'B' });
  });

  it('opens a stored spec in its own instrument units, and one saved without them in the person\'s', () => {
    const r = specFromForm(filled);
    if (!r.ok) throw new Error('spec');
    expect(r.spec.readingUnits).toEqual({ pressure: 'kPa', temperature: 'degC', mass: 'kg' });
    expect(formFromSpec(r.spec, UNIT_PRESETS.US).pressureUnit).toBe('kPa');
    const { readingUnits: _none, ...older } = r.spec;
    expect(formFromSpec(older, UNIT_PRESETS.US).pressureUnit).toBe('psi');
  });

  it('shows a stored spec in US customary units and reads it back', () => {
    const r = specFromForm(filled);
    if (!r.ok) throw new Error('spec');
    const { readingUnits: _none, ...older } = r.spec;
    const us = formFromSpec(older, UNIT_PRESETS.US);
    expect(Number(us.mawp)).toBeCloseTo(72.5189, 3); // 500 kPa / 6.894757 kPa per psi
    expect(Number(us.tare)).toBeCloseTo(1763.698, 2); // 800 kg / 0.45359237
    const back = specFromForm(us);
    if (!back.ok) throw new Error(JSON.stringify(back.errors));
    expect(back.spec.mawpGaugePa).toBeCloseTo(500_000, -1);
    expect(back.spec.tareKg).toBeCloseTo(800, 2);
    expect(back.spec.designTemperatureK).toBeCloseTo(453.15, 3);
  });

  it('names the bad field and keeps the others', () => {
    const r = specFromForm({ ...filled, mawp: 'abc', tare: '' });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors.mawp).toMatch(/MAWP/);
    expect(r.errors.tare).toMatch(/tare/);
    expect(r.errors.relief).toBeUndefined();
  });

  it('passes on the engine refusing a relief set pressure above the MAWP', () => {
    const r = specFromForm({ ...filled, relief: '600' });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors.relief).toMatch(/relief set pressure/);
  });

  it('takes the diameter, straight length and elevation in the chosen length unit and stores metres (ft = 0.3048 m, in = 0.0254 m exactly: NIST SP 811 (2008) B.8)', () => {
    const ft = { diameterUnit: 'ft', straightLengthUnit: 'ft', elevationUnit: 'ft' } as const;
    const r = specFromForm({ ...filled, ...ft, diameterM: '4', straightLengthM: '6,5' });
    if (!r.ok) throw new Error(JSON.stringify(r.errors));
    expect(r.spec.geometry).toEqual({ shape: 'vertical-cylinder', innerDiameterM: 4 * 0.3048, straightLengthM: 6.5 * 0.3048, head: { kind: 'semi-ellipsoidal-2-1' } });
    const mm = specFromForm({ ...filled, diameterUnit: 'mm', straightLengthUnit: 'mm', diameterM: '1200', straightLengthM: '2000' });
    if (!mm.ok) throw new Error(JSON.stringify(mm.errors));
    expect(mm.spec.geometry).toEqual({ shape: 'vertical-cylinder', innerDiameterM: 1.2, straightLengthM: 2, head: { kind: 'semi-ellipsoidal-2-1' } });
    const elevFt = specFromForm({ ...filled, ...ft, diameterM: '4', straightLengthM: '6', atmosphereMode: 'elevation', elevationM: '1000' });
    const elevM = specFromForm({ ...filled, atmosphereMode: 'elevation', elevationM: '304,8' });
    if (!elevFt.ok || !elevM.ok) throw new Error('elevation');
    expect(elevFt.spec.siteAtmospherePa).toBeCloseTo(elevM.spec.siteAtmospherePa, 9);
    // US Standard Atmosphere 1976, geometric 300 m → 97 773 Pa (table value, from memory): 304.8 m is a little lower.
    expect(elevM.spec.siteAtmospherePa).toBeLessThan(97_773);
    expect(elevM.spec.siteAtmospherePa).toBeGreaterThan(97_600);
  });

  it('an elevation beyond the standard atmosphere formula is refused with its range in the unit typed (ft = 0.3048 m exactly, NIST SP 811 (2008) B.8)', () => {
    const r = specFromForm({ ...filled, elevationUnit: 'ft', atmosphereMode: 'elevation', elevationM: '40000' });
    if (r.ok) throw new Error('expected a refusal');
    // Valid range −500 m … 11 000 m = −1640.42 ft … 36 089.2 ft.
    expect(r.errors.elevationM).toMatch(/"40000" ft is outside the valid range, \u22121640\.42 to 36089\.2 ft\.$/);
  });

  it('shows stored metres in the preferred length unit (US customary: ft) and reads them back', () => {
    const r = specFromForm(filled);
    if (!r.ok) throw new Error('spec');
    // A vessel saved before its dimensions kept the units they were typed in.
    const { entryUnits: _none, ...older } = r.spec;
    const us = formFromSpec(older, UNIT_PRESETS.US);
    expect(us.lengthUnit).toBe('ft');
    expect(Number(us.diameterM)).toBeCloseTo(1.2 / 0.3048, 4);
    const back = specFromForm(us);
    if (!back.ok) throw new Error(JSON.stringify(back.errors));
    if (back.spec.geometry.shape === 'stated-volume') throw new Error('cylinder expected');
    expect(back.spec.geometry.innerDiameterM).toBeCloseTo(1.2, 5);
    expect(back.spec.geometry.straightLengthM).toBeCloseTo(2, 5);
  });

  it('a draft saved before the length unit existed was typed in metres', () => {
    const { lengthUnit: _dropped, ...old } = filled;
    const r = specFromForm(old as VesselForm);
    if (!r.ok) throw new Error(JSON.stringify(r.errors));
    expect(r.spec.geometry).toEqual({ shape: 'vertical-cylinder', innerDiameterM: 1.2, straightLengthM: 2, head: { kind: 'semi-ellipsoidal-2-1' } });
  });

  describe('every field round-trips: a stored vessel opened in the editor and saved unchanged is the same vessel', () => {
    // An invented steriliser chamber with every optional field set (demo-style data, not a real vessel).
    const full: VesselSpec = {
      tag: 'RT-9', description: 'invented round-trip vessel',
      geometry: { shape: 'horizontal-cylinder', innerDiameterM: 0.9, straightLengthM: 1.5, head: { kind: 'torispherical', crownRadiusM: 0.85, knuckleRadiusM: 0.09 } },
      tareKg: 850, mawpGaugePa: 300e3, designTemperatureK: 418.15, reliefSetGaugePa: 280e3, vacuumRated: false,
      siteAtmospherePa: atmosphereFromElevation(1600), siteElevationM: 1600, ambientTemperatureK: 291.15,
      instruments: {
        pressureGauge: { spanPa: 400e3, accuracyPercentOfSpan: 1, indicatorPercentOfSpan: 0.5, driftPercentOfSpan: 0.25 },
        temperatureSensor: { kind: 'stated', toleranceK: 0.5 },
        temperatureIndicatorToleranceK: 0.2, temperatureDriftToleranceK: 0.1,
        weightToleranceKg: 2, tare: { kind: 'stated', toleranceKg: 5 }, volumeTolerancePercent: 2, barometerTolerancePa: 0,
      },
      reliefSetTolerancePercent: 5, vacuumBreaker: true, service: 'steriliser', heating: 'steam-jacket',
      readingUnits: { pressure: 'kPa', temperature: 'degC', mass: 'kg' },
      entryUnits: { diameter: 'mm', straightLength: 'm', crownRadius: 'mm', knuckleRadius: 'mm', elevation: 'm', volume: 'L' },
    };

    it('every value, its unit and the site as an elevation come back (formFromSpec → specFromForm)', () => {
      const form = formFromSpec(full, UNIT_PRESETS.US);
      expect(form.diameterM).toBe('900');
      expect(form.diameterUnit).toBe('mm');
      expect(form.crownRadius).toBe('850');
      expect(form.atmosphereMode).toBe('elevation');
      expect(form.elevationM).toBe('1600');
      const back = specFromForm(form, full);
      if (!back.ok) throw new Error(JSON.stringify(back.errors));
      expect(back.spec).toEqual(full);
    });

    it('opened and saved unchanged, a vessel whose gauge reads psi and scale lb keeps every stored figure exactly (the form shows six digits: 300 kPa = 43.5113 psi, NIST SP 811 (2008) B.8)', () => {
      const us: VesselSpec = { ...full, readingUnits: { pressure: 'psi', temperature: 'degF', mass: 'lb' }, tareKg: 850.123456789 };
      const opened = formFromSpec(us, UNIT_PRESETS.US);
      expect(opened.mawp).toBe('43.5113');
      const back = specFromForm(opened, us, opened);
      if (!back.ok) throw new Error(JSON.stringify(back.errors));
      expect(back.spec).toEqual(us);
      // A figure that was changed is read from its text as usual.
      const changed = specFromForm({ ...opened, mawp: '50' }, us, opened);
      if (!changed.ok) throw new Error(JSON.stringify(changed.errors));
      expect(changed.spec.mawpGaugePa).toBeCloseTo(50 * 6894.757293168361, 6); // 1 psi = 6894.757 293 168 Pa (NIST SP 811 (2008) B.8)
      expect(changed.spec.reliefSetGaugePa).toBe(us.reliefSetGaugePa);
    });

    it('keys the editor does not show (added by a later version or by plant sync) are kept', () => {
      const withExtra = { ...full, plantNote: 'kept' } as VesselSpec & { plantNote: string };
      const back = specFromForm(formFromSpec(withExtra, UNIT_PRESETS.SI), withExtra);
      if (!back.ok) throw new Error(JSON.stringify(back.errors));
      expect((back.spec as typeof withExtra).plantNote).toBe('kept');
    });

    it('an older vessel without the optional fields stays without them (the engine\'s defaults apply)', () => {
      const r = specFromForm(filled);
      if (!r.ok) throw new Error('spec');
      const back = specFromForm(formFromSpec(r.spec, UNIT_PRESETS.SI), r.spec);
      if (!back.ok) throw new Error(JSON.stringify(back.errors));
      expect(back.spec.reliefSetTolerancePercent).toBe(3); // the new form's default, ±3 % (common practice)
      expect(back.spec.instruments.pressureGauge.indicatorPercentOfSpan).toBeUndefined();
      expect(back.spec.instruments.tare).toEqual({ kind: 'weighed-like-gross' });
    });
  });
});
