// Fill planning: the form as typed → FillRequest → planFill → what the screen shows.
import { errorText, type FieldUnit } from './error-text.ts';
import { inPreferredUnits } from './caution-text.ts';
import { isDemo } from './demo-label.ts';
import {
  InputError, MASS_UNITS, PRESSURE_UNITS, RULE_CATALOGUE, TEMPERATURE_UNITS, massFromKg, planFill, pressureFromPa,
  temperatureDifferenceToK, temperatureFromK, temperatureToK, type FillPlan, type FillRequest, type FillTarget,
} from '../../core/index.ts';
import type { MassUnit, TemperatureUnit } from '../../core/index.ts';
import type { VesselRecord } from '../../store/index.ts';
import { formatNumber, readNumber } from './format.ts';
import { messageOf } from './atmosphere.ts';
import type { Figure, ResultView } from './result-view.ts';
import type { UnitPrefs } from './settings-model.ts';

export type FillField = 'target' | 'targetValue' | 'start' | 'margin' | 'power' | 'heatCapacity';

export interface FillDraft {
  vesselId: string;
  temperatureUnit: TemperatureUnit;
  target: string;
  targetKind: FillTarget['kind'];
  targetValue: string;
  start: string;
  margin: string;
  powerKW: string;
  heatCapacityKJPerK: string;
}

export function emptyFillDraft(u: UnitPrefs): FillDraft {
  return { vesselId: '', temperatureUnit: u.temperature, target: '', targetKind: 'quality', targetValue: '', start: '', margin: '10', powerKW: '', heatCapacityKJPerK: '' };
}

export type FillEvaluation =
  | { kind: 'incomplete'; message: string }
  | { kind: 'input-error'; errors: Partial<Record<FillField, string>>; general?: string }
  | { kind: 'plan'; plan: FillPlan; view: ResultView };

const ENGINE_FIELDS: Record<string, FillField> = {
  'target temperature': 'target', 'start temperature': 'start', quality: 'targetValue', 'vapor-space fraction': 'targetValue',
  'liquid-full margin': 'margin', 'heater power': 'power', 'vessel heat capacity': 'heatCapacity',
};

export function evaluateFill(d: FillDraft, vessel: VesselRecord | undefined, u: UnitPrefs): FillEvaluation {
  if (!vessel) return { kind: 'incomplete', message: 'Choose a vessel to plan a fill.' };
  const needed = [d.target, d.start, d.margin, d.targetKind === 'dry-saturated' ? 'x' : d.targetValue];
  if (needed.some((t) => t.trim() === '')) return { kind: 'incomplete', message: 'Enter the target, start temperature and margin to see the plan.' };
  const errors: Partial<Record<FillField, string>> = {};
  const read = (field: FillField, words: string, text: string, conv: (n: number) => number) => {
    try { return conv(readNumber(text, words)); } catch (e) { errors[field] = messageOf(e); return NaN; }
  };
  const tu = d.temperatureUnit;
  const request: FillRequest = {
    targetTemperatureK: read('target', 'target temperature', d.target, (n) => temperatureToK(n, tu)),
    startTemperatureK: read('start', 'start temperature', d.start, (n) => temperatureToK(n, tu)),
    liquidFullMarginK: read('margin', 'liquid-full margin', d.margin, (n) => temperatureDifferenceToK(n, tu)),
    target: d.targetKind === 'dry-saturated' ? { kind: 'dry-saturated' }
      : d.targetKind === 'quality' ? { kind: 'quality', quality: read('targetValue', 'quality', d.targetValue, (n) => n / 100) }
      : { kind: 'vapor-space-fraction', fraction: read('targetValue', 'steam space', d.targetValue, (n) => n / 100) },
  };
  if (d.powerKW.trim()) request.heaterPowerW = read('power', 'heater power', d.powerKW, (n) => n * 1000);
  if (d.heatCapacityKJPerK.trim()) request.vesselHeatCapacityJPerK = read('heatCapacity', 'vessel heat capacity', d.heatCapacityKJPerK, (n) => n * 1000);
  if (Object.keys(errors).length) return { kind: 'input-error', errors };
  try {
    const plan = planFill(vessel.spec, request);
    return { kind: 'plan', plan, view: planView(plan, u, isDemo(vessel.spec) || isDemo(vessel)) };
  } catch (e) {
    const field = e instanceof InputError ? ENGINE_FIELDS[e.field] : undefined;
    const typedIn: FieldUnit | undefined = field === 'target' || field === 'start' ? { kind: 'temperature', unit: tu } : undefined;
    return field ? { kind: 'input-error', errors: { [field]: errorText(e, typedIn) } } : { kind: 'input-error', errors: {}, general: `No plan: ${messageOf(e)}` };
  }
}

/** A caution about the plan itself (as opposed to the standing note and the plan's assumption). */
function isPlanRule(rule: string): boolean {
  return (RULE_CATALOGUE as Record<string, { kind: string }>)[rule]?.kind === 'plan';
}

function planView(p: FillPlan, u: UnitPrefs, demo: boolean): ResultView {
  const lab = (list: readonly { id: string; label: string }[], id: string) => list.find((x) => x.id === id)?.label ?? id;
  const m = (kg: number) => `${formatNumber(massFromKg(kg, u.mass as MassUnit), 5)} ${lab(MASS_UNITS, u.mass)}`;
  const t = (k: number) => `${formatNumber(temperatureFromK(k, u.temperature), 5)} ${lab(TEMPERATURE_UNITS, u.temperature)}`;
  const pr = (pa: number) => `${formatNumber(pressureFromPa(pa, u.pressure), 5)} ${lab(PRESSURE_UNITS, u.pressure)}`;
  const pct = (x: number) => `${formatNumber(x * 100, 3)} %`;
  const largest = p.largestTwoPhaseCharge;
  const figures: Figure[] = [
    { label: 'Water to charge', value: m(p.waterMassKg) },
    { label: 'Scale should read (gross)', value: m(p.expectedGrossWeightKg) },
    { label: 'Pressure at the target', value: `${pr(p.targetSaturationPressurePa)} absolute, ${pr(p.targetGaugePressurePa)} gauge` },
    { label: 'At the target', value: `quality ${pct(p.atTarget.quality)}, steam space ${pct(p.atTarget.vaporSpaceFraction)}` },
    { label: 'Liquid / steam at the target', value: `${m(p.atTarget.liquidMassKg)} / ${m(p.atTarget.vaporMassKg)}` },
    { label: 'Ideal-gas estimate', value: `${m(p.idealGas.waterMassKg)} (${formatNumber(p.idealGas.errorPercent, 3)} % off IF97)` },
    { label: 'Largest charge still two-phase', value: `${m(largest.waterMassKg)} (gross ${m(largest.expectedGrossWeightKg)}), two-phase up to ${t(largest.limitTemperatureK)}` },
  ];
  if (p.heat) {
    figures.push({ label: 'Heat to the target', value: `${formatNumber(p.heat.totalJ / 1e6, 4)} MJ` +
      (p.heat.heatUpTimeS !== null ? `, about ${formatNumber(p.heat.heatUpTimeS / 60, 3)} min` : '') });
  }
  return {
    demo,
    verdict: p.cautions.some((c) => isPlanRule(c.rule))
      ? { tone: 'bad', text: 'WARNING. Do not charge this plan as it stands: see the cautions below.' }
      : { tone: 'ok', text: `Charge ${m(p.waterMassKg)} of water; the scale should then read ${m(p.expectedGrossWeightKg)}.` },
    figures,
    hazards: [],
    cautions: p.cautions.map((c) => inPreferredUnits(c, u)),
  };
}
