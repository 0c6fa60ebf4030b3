// Fill planning: the form as typed → FillRequest → planFill → what the screen shows.
import { errorText, type FieldUnit } from './error-text.ts';
import { inPreferredUnits } from './caution-text.ts';
import { isDemo } from './demo-label.ts';
import {
  InputError, MASS_UNITS, PRESSURE_UNITS, RULE_CATALOGUE, TEMPERATURE_UNITS, gaugeLimitsPa, massFromKg, planFill, pressureFromPa,
  temperatureDifferenceFromK, thermometerLimitsK, type InstrumentAccuracy,
  temperatureDifferenceToK, temperatureFromK, temperatureToK, type FillPlan, type FillRequest, type FillTarget,
} from '../../core/index.ts';
import type { MassUnit, TemperatureUnit } from '../../core/index.ts';
import type { VesselRecord } from '../../store/index.ts';
import { formatNumber, formatToBand, readNumber } from './format.ts';
import { messageOf } from './atmosphere.ts';
import type { Figure, ResultView } from './result-view.ts';
import { splitOutcome } from './outcome.ts';
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
  'target temperature': 'target', 'start temperature': 'start', quality: 'targetValue', 'vapour-space fraction': 'targetValue',
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
    return { kind: 'plan', plan, view: planView(plan, u, vessel.spec.instruments, isDemo(vessel.spec) || isDemo(vessel)) };
  } catch (e) {
    const field = e instanceof InputError ? ENGINE_FIELDS[e.field] : undefined;
    const typedIn: FieldUnit | undefined = field === 'target' || field === 'start' ? { kind: 'temperature', unit: tu } : undefined;
    return field ? { kind: 'input-error', errors: { [field]: errorText(e, typedIn, field === 'target' ? d.target : field === 'start' ? d.start : undefined) } } : { kind: 'input-error', errors: {}, general: `No plan: ${messageOf(e)}` };
  }
}

/** A caution about the plan itself (as opposed to the standing note and the plan's assumption). */
function isPlanRule(rule: string): boolean {
  return (RULE_CATALOGUE as Record<string, { kind: string }>)[rule]?.kind === 'plan';
}

/**
 * The plan's figures as the vessel's own instruments will check them: a charge and a gross weight
 * to the scale's ± limit, target pressures to the gauge's, temperatures to the thermometer's, each
 * rounded to what that band resolves (formatToBand), so a plan never asks for a digit no
 * instrument on the vessel can show. Shares and estimates keep a few significant digits.
 */
function planView(p: FillPlan, u: UnitPrefs, instruments: InstrumentAccuracy, demo: boolean): ResultView {
  const lab = (list: readonly { id: string; label: string }[], id: string) => list.find((x) => x.id === id)?.label ?? id;
  const massUnit = u.mass as MassUnit;
  const scaleBand = massFromKg(instruments.weightToleranceKg, massUnit);
  const gaugeBand = pressureFromPa(gaugeLimitsPa(instruments).combined, u.pressure);
  const m = (kg: number) => `${formatToBand(massFromKg(kg, massUnit), scaleBand)} ${lab(MASS_UNITS, u.mass)}`;
  const t = (k: number) => `${formatToBand(temperatureFromK(k, u.temperature), temperatureDifferenceFromK(thermometerLimitsK(instruments, k).combined, u.temperature))} ${lab(TEMPERATURE_UNITS, u.temperature)}`;
  const pr = (pa: number) => `${formatToBand(pressureFromPa(pa, u.pressure), gaugeBand)} ${lab(PRESSURE_UNITS, u.pressure)}`;
  const pct = (x: number) => `${formatNumber(x * 100, 3)} %`;
  const most = p.largestTwoPhaseCharge;
  const main: Figure[] = [
    { label: 'Charge this much water', value: m(p.waterMassKg) },
    { label: 'Then the scale reads (gross)', value: m(p.expectedGrossWeightKg) },
    { label: 'At the target the gauge reads', value: `${pr(p.targetGaugePressurePa)} gauge (${pr(p.targetSaturationPressurePa)} absolute)` },
    { label: 'At the target', value: `steam is ${pct(p.atTarget.quality)} of the contents by mass and fills ${pct(p.atTarget.vaporSpaceFraction)} of the space` },
    { label: 'Most water it can take', value: `${m(most.waterMassKg)} (scale ${m(most.expectedGrossWeightKg)}): more would fill it with water before ${t(most.limitTemperatureK)}` },
  ];
  const details: Figure[] = [
    { label: 'Water and steam at the target', value: `${m(p.atTarget.liquidMassKg)} water, ${m(p.atTarget.vaporMassKg)} steam` },
    { label: 'With steam taken as an ideal gas', value: `${m(p.idealGas.waterMassKg)}, ${formatNumber(Math.abs(p.idealGas.errorPercent), 2)} % ${p.idealGas.errorPercent < 0 ? 'less' : 'more'} than the steam tables (IAPWS-IF97) give: why the tables are used` },
  ];
  if (p.heat) {
    details.push({ label: 'Heat to reach the target', value: `${formatNumber(p.heat.totalJ / 1e6, 3)} MJ` +
      (p.heat.heatUpTimeS !== null ? `, about ${formatNumber(p.heat.heatUpTimeS / 60, 2)} min at the heater power given` : '') });
  }
  // The plan's own rules (charge too large, does not fit, target over a limit) are WARNING: they
  // describe a plan not yet charged (issue 9).
  const against = p.cautions.some((c) => isPlanRule(c.rule));
  const cautions = p.cautions.map((c) => inPreferredUnits(c, u));
  const split = splitOutcome({ cautions });
  const verdict = against
    ? { tone: 'bad' as const, text: 'WARNING. Do not charge this plan as it stands: see the cautions below.', short: 'Do not charge this plan' }
    : { tone: 'plan' as const, text: `Plan: charge ${m(p.waterMassKg)} of water; the scale should then read ${m(p.expectedGrossWeightKg)}. Check it against the vessel's procedure before charging.`, short: `Charge ${m(p.waterMassKg)}` };
  return {
    demo,
    outcome: split.outcome,
    verdict,
    keyFigures: main.slice(0, 2),
    findings: split.findings,
    groups: [
      { id: 'contents', title: 'The plan', figures: main, notes: [], folded: false },
      { id: 'hazards', title: 'Details of the plan', figures: details, notes: split.others, folded: true },
    ],
    figures: [...main, ...details],
    hazards: [],
    cautions,
  };
}
