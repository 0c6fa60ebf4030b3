// The fill plan's figures to what the vessel's instruments resolve (issue 11 §4): the charge and
// the gross weight to the scale's ± limit, the target gauge reading to the gauge's class limit
// (span × class %), each rounded by the app's one rule (formatToBand: the band to one or two
// significant digits, the value to the same place). The vessel is invented test data.
import { describe, expect, it } from 'vitest';
import { emptyFillDraft, evaluateFill } from '../../src/ui/state/fill-session.ts';
import { UNIT_PRESETS } from '../../src/ui/state/settings-model.ts';
import type { VesselRecord } from '../../src/store/index.ts';
import { testVessel } from '../core/check/test-vessel.ts';

function planFigures(weightToleranceKg: number, gauge: { spanPa: number; accuracyPercentOfSpan: number }): Map<string, string> {
  const spec = testVessel({ instruments: { ...testVessel().instruments, weightToleranceKg, pressureGauge: gauge } });
  const vessel = { id: 'v1', tag: spec.tag, description: spec.description, spec } as unknown as VesselRecord;
  const d = { ...emptyFillDraft(UNIT_PRESETS.SI), vesselId: 'v1', target: '150', targetKind: 'vapor-space-fraction' as const, targetValue: '40', start: '20' };
  const ev = evaluateFill(d, vessel, UNIT_PRESETS.SI);
  if (ev.kind !== 'plan') throw new Error(JSON.stringify(ev));
  return new Map(ev.view.groups.flatMap((g) => g.figures).map((f) => [f.label, f.value]));
}

describe('fill plan: digits the instruments resolve', () => {
  it('a ±1 kg scale shows the charge to 0.1 kg; a ±5 kg scale to the kilogram', () => {
    expect(planFigures(1, { spanPa: 1.6e6, accuracyPercentOfSpan: 1 }).get('Charge this much water')).toMatch(/^\d+\.\d kg$/);
    expect(planFigures(5, { spanPa: 1.6e6, accuracyPercentOfSpan: 1 }).get('Charge this much water')).toMatch(/^\d+ kg$/);
  });

  it('a 1600 kPa class 1 gauge (±16 kPa) shows the target gauge reading to the whole kPa; a 400 kPa class 0.25 one (±1 kPa) to 0.1 kPa', () => {
    expect(planFigures(1, { spanPa: 1.6e6, accuracyPercentOfSpan: 1 }).get('At the target the gauge reads')).toMatch(/^\d+ kPa gauge/);
    expect(planFigures(1, { spanPa: 0.4e6, accuracyPercentOfSpan: 0.25 }).get('At the target the gauge reads')).toMatch(/^\d+\.\d kPa gauge/);
  });
});
