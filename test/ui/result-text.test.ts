// The result card's words and figures for engine results (the physics is the engine's and is
// tested there; this checks the mapping to the screen).
import { describe, expect, it } from 'vitest';
import { evaluateCheck, saturationPressure, saturationTemperature, type VesselSpec } from '../../src/core/index.ts';
import { resultView } from '../../src/ui/state/result-text.ts';
import { formatWithBand } from '../../src/ui/state/format.ts';
import { UNIT_PRESETS } from '../../src/ui/state/settings-model.ts';

const vessel: VesselSpec = {
  tag: 'T-1', description: 'test vessel', designTemperatureK: 473.15, vacuumRated: false, siteAtmospherePa: 101_325,
  ambientTemperatureK: 293.15,
  geometry: { shape: 'vertical-cylinder', innerDiameterM: 0.6, straightLengthM: 1.2, head: { kind: 'semi-ellipsoidal-2-1' } },
  tareKg: 420, mawpGaugePa: 1000e3, reliefSetGaugePa: 950e3,
  instruments: {
    pressureGauge: { spanPa: 1600e3, accuracyPercentOfSpan: 1 }, temperatureSensor: { kind: 'iec-60751', sensorClass: 'B' },
    weightToleranceKg: 1, volumeTolerancePercent: 2, barometerTolerancePa: 0,
  },
};
const time = '2026-12-01T10:00:00+00:00';

describe('resultView', () => {
  it('a reading on the saturation line: agreement, quality and level with bands, both pictures', () => {
    const T = 423.15;
    const r = evaluateCheck(vessel, { time, temperatureK: T, pressure: { reference: 'absolute', pressurePa: saturationPressure(T) }, weight: { kind: 'gross', grossKg: 612 } });
    const v = resultView(r, vessel, UNIT_PRESETS.SI);
    expect(v.verdict.text).toMatch(/agree/);
    const labels = v.figures.map((f) => f.label);
    expect(labels).toEqual(expect.arrayContaining(['Quality (steam mass fraction)', 'Liquid mass', 'Liquid level']));
    for (const l of ['Quality (steam mass fraction)', 'Liquid mass', 'Liquid level']) {
      expect(v.figures.find((f) => f.label === l)?.value).toMatch(/±/);
    }
    expect(v.chart?.curve.length).toBe(41);
    expect(v.sketch?.orientation).toBe('vertical');
    expect(v.sketch!.low).toBeLessThanOrEqual(v.sketch!.level);
    expect(v.sketch!.high).toBeGreaterThanOrEqual(v.sketch!.level);
    expect(v.figures.some((h) => h.label === 'Margin to MAWP')).toBe(true);
    expect(v.outcome).toBe('none');
    expect(v.groups.map((g) => g.id)).toEqual(['saturation', 'contents', 'heating', 'hazards']);
    // Each caution once across the findings and the groups' notes (the standing note is shown on its own).
    const shown = [...v.findings, ...v.groups.flatMap((g) => g.notes)].map((c) => c.rule);
    expect(new Set(shown).size).toBe(shown.length);
    expect(shown.sort()).toEqual(v.cautions.map((c) => c.rule).sort());
    expect(v.cautions.some((c) => c.rule === 'standing-note')).toBe(true);
  });

  it('pressure far above saturation: the gas wording and its partial pressure', () => {
    const T = 393.15;
    const r = evaluateCheck(vessel, { time, temperatureK: T, pressure: { reference: 'absolute', pressurePa: saturationPressure(T) + 100e3 }, weight: { kind: 'not-weighed' } });
    const v = resultView(r, vessel, UNIT_PRESETS.US);
    expect(v.verdict.tone).toBe('bad');
    expect(v.verdict.text).toMatch(/air or other gas/);
    expect(v.figures.find((f) => f.label === 'Gas partial pressure (estimate)')?.value).toMatch(/psi/);
    expect(v.sketch).toBeUndefined();
  });
});

describe('resultView: the liquid level and its band come from the engine', () => {
  const T = 423.15;
  const reading = { time, temperatureK: T, pressure: { reference: 'absolute' as const, pressurePa: saturationPressure(T) }, weight: { kind: 'gross' as const, grossKg: 612 } };

  it('shows the engine\'s level and ± band in the preferred length unit (m for SI, ft for US customary: 0.3048 m exactly, NIST SP 811 (2008) B.8)', () => {
    const r = evaluateCheck(vessel, reading);
    const band = r.inventoryBands!.liquidLevelM!;
    if (r.inventory.regime !== 'two-phase' || !r.inventory.liquidLevel) throw new Error('two-phase expected');
    const level = r.inventory.liquidLevel.levelM;
    const si = resultView(r, vessel, UNIT_PRESETS.SI).figures.find((f) => f.label === 'Liquid level')!.value;
    expect(si.startsWith(`${formatWithBand(level, band.plusMinus, 4)} m `)).toBe(true);
    const us = resultView(r, vessel, UNIT_PRESETS.US).figures.find((f) => f.label === 'Liquid level')!.value;
    expect(us.startsWith(`${formatWithBand(level / 0.3048, band.plusMinus / 0.3048, 4)} ft `)).toBe(true);
    const mm = resultView(r, vessel, { ...UNIT_PRESETS.SI, length: 'mm' }).figures.find((f) => f.label === 'Liquid level')!.value;
    expect(mm.startsWith(`${formatWithBand(level * 1000, band.plusMinus * 1000, 4)} mm `)).toBe(true);
  });

  it('the sketch band is the level ± the engine band, as fractions of the inside height', () => {
    const r = evaluateCheck(vessel, reading);
    if (r.inventory.regime !== 'two-phase' || !r.inventory.liquidLevel) throw new Error('two-phase expected');
    const pm = r.inventoryBands!.liquidLevelM!.plusMinus;
    const span = r.inventory.liquidLevel.levelM / r.inventory.liquidLevel.levelFraction;
    const v = resultView(r, vessel, UNIT_PRESETS.SI);
    expect(v.sketch!.low).toBeCloseTo((r.inventory.liquidLevel.levelM - pm) / span, 12);
    expect(v.sketch!.high).toBeCloseTo((r.inventory.liquidLevel.levelM + pm) / span, 12);
  });

  it('a record saved before the engine gave a level band shows the level without a band', () => {
    const r = evaluateCheck(vessel, reading);
    const old = { ...r, inventoryBands: { quality: r.inventoryBands!.quality, liquidMassKg: r.inventoryBands!.liquidMassKg } } as unknown as typeof r;
    const value = resultView(old, vessel, UNIT_PRESETS.SI).figures.find((f) => f.label === 'Liquid level')!.value;
    expect(value).not.toMatch(/±/);
    expect(value).toMatch(/ m \(/);
  });

  it('a demo vessel (tag DEMO- or description "DEMO DATA:") marks the view as demo; a real one does not', () => {
    const r = evaluateCheck(vessel, reading);
    expect(resultView(r, vessel, UNIT_PRESETS.SI).demo).toBe(false);
    expect(resultView(r, { ...vessel, tag: 'DEMO-FT-02' }, UNIT_PRESETS.SI).demo).toBe(true);
    expect(resultView(r, { ...vessel, description: 'DEMO DATA: invented flash tank' }, UNIT_PRESETS.SI).demo).toBe(true);
  });
});

describe('formatWithBand', () => {
  // Two significant digits in the band when it starts with 1 or 2, one otherwise: at most two is
  // JCGM 100:2008 (GUM) 7.2.6 (from memory), the split at 3 is common practice.
  it('rounds the value to the band, the band to one or two significant digits', () => {
    expect(formatWithBand(1.8058, 21)).toBe('2 ± 21');
    expect(formatWithBand(0.259, 0.0131)).toBe('0.259 ± 0.013');
    expect(formatWithBand(790.04, 5.5)).toBe('790 ± 6');
    expect(formatWithBand(790.04, 0.36)).toBe('790.0 ± 0.4');
    expect(formatWithBand(-0.136, 1.62)).toBe('\u22120.1 ± 1.6');
    expect(formatWithBand(12.34, 0.96)).toBe('12.3 ± 1.0'); // 0.96 rounds up to 1.0, which starts with 1
  });
});

describe('the headline leads with what needs action now', () => {
  const at = (over: Partial<Parameters<typeof evaluateCheck>[1]>) =>
    resultView(evaluateCheck(vessel, { time, temperatureK: 450, pressure: { reference: 'gauge', pressurePa: 500e3 }, weight: { kind: 'not-weighed' }, ...over }), vessel, UNIT_PRESETS.SI).verdict;

  it('a gauge exactly at the MAWP leads with WARNING, never a green agreement (test vessel MAWP 1000 kPa gauge; at MAWP within the gauge band is normal relieving, ASME BPVC VIII-1 UG-125(c), from memory)', () => {
    // The thermometer at T_sat of the reading, so the saturation check alone would say "agree".
    const v = at({ temperatureK: saturationTemperature(1000e3 + 101_325), pressure: { reference: 'gauge', pressurePa: 1000e3 } });
    expect(v.text).toMatch(/agree/);
    expect(v.text).toMatch(/^WARNING\. /);
    expect(v.tone).toBe('bad');
  });

  it('a flash-on-release or cool-down hazard alone does not turn an ordinary reading red', () => {
    const T = 423.15;
    const v = at({ temperatureK: T, pressure: { reference: 'absolute', pressurePa: saturationPressure(T) } });
    expect(v.tone).toBe('ok');
    expect(v.text).toMatch(/^Gauge and thermometer agree/);
  });

  it('liquid-full by weight while the gauge reads saturation: the headline says the readings contradict, not that they agree', () => {
    const T = 423.15;
    // 0.6 m × 1.2 m with 2:1 heads is about 0.396 m³; 600 kg of water at 150 °C cannot fit as two-phase.
    const v = at({ temperatureK: T, pressure: { reference: 'absolute', pressurePa: saturationPressure(T) }, weight: { kind: 'net', netKg: 600 } });
    expect(v.text).toMatch(/^DANGER\. By weight the vessel is liquid-full, yet the gauge reads saturation/);
    expect(v.tone).toBe('bad');
  });
});
