// A CheckResult (SI) in words and figures for the outcome strip and the full result. Values come
// from the engine; this module picks the units (pressure, temperature and weight in the units the
// reading was typed in, the person's preferred unit beside where it differs), rounds every figure to
// the place its band resolves, and groups the result: findings first, then saturation, contents,
// heating, and the hazards of the contents folded, each caution once.
import {
  LENGTH_UNITS, MASS_UNITS, PRESSURE_UNITS, TEMPERATURE_UNITS, VOLUME_UNITS, lengthFromM, massFromKg, pressureFromPa,
  temperatureDifferenceFromK, temperatureFromK, volumeFromM3, vesselLevelSpanM,
  isCurrentResult, thermometerLimitsK, type MassUnit, type PressureUnit, type StoredCheckResult, type TemperatureUnit, type VesselSpec,
} from '../../core/index.ts';
import type { StoredCaution as Caution } from '../../store/index.ts';
import { CALIBRATION_DUE_WORDS } from '../../core/instrument/calibration-due.ts';
import type { InstrumentUse } from '../../core/instrument/instrument-use.ts';
import { saturationChartData } from './chart-data.ts';
import { inPreferredUnits } from './caution-text.ts';
import { formatNumber, formatToBand, formatWithBand } from './format.ts';
import { isDemo } from './demo-label.ts';
import { splitOutcome } from './outcome.ts';
import type { Figure, ResultGroup, ResultView } from './result-view.ts';
import type { SketchData } from '../components/VesselSketch.tsx';
import type { UnitPrefs } from './settings-model.ts';

const label = (list: readonly { id: string; label: string }[], id: string) => list.find((u) => u.id === id)?.label ?? id;

/** The units a reading was typed in; absent ones are the person's preferred units. */
export interface TypedUnits { pressure?: PressureUnit; temperature?: TemperatureUnit; mass?: MassUnit }

/** Formatters in the typed units, the preferred unit beside where it differs, every value rounded to its band. */
function units(u: UnitPrefs, typed: TypedUnits) {
  const pu = typed.pressure ?? u.pressure, tu = typed.temperature ?? u.temperature, mu = typed.mass ?? u.mass;
  const pl = label(PRESSURE_UNITS, pu), tl = label(TEMPERATURE_UNITS, tu), ml = label(MASS_UNITS, mu);
  const ll = label(LENGTH_UNITS, u.length), vl = label(VOLUME_UNITS, u.volume);
  const beside = (differs: boolean, text: () => string) => (differs ? ` (${text()})` : '');
  const inP = (unit: PressureUnit, pa: number, band: number) => `${formatToBand(pressureFromPa(pa, unit), pressureFromPa(band, unit), 3)} ${label(PRESSURE_UNITS, unit)}`;
  const inT = (unit: TemperatureUnit, k: number, band: number) => `${formatToBand(temperatureFromK(k, unit), temperatureDifferenceFromK(band, unit), 4)} ${label(TEMPERATURE_UNITS, unit)}`;
  const inM = (unit: MassUnit, kg: number, band: number) => `${formatToBand(massFromKg(kg, unit), massFromKg(band, unit), 4)} ${label(MASS_UNITS, unit)}`;
  const dtLabel = tu === 'degC' ? 'K' : tl;
  return {
    pressureUnit: pu,
    p: (pa: number, band: number) => inP(pu, pa, band) + beside(pu !== u.pressure, () => inP(u.pressure, pa, band)),
    pBand: (pa: number, band: number) => `${formatWithBand(pressureFromPa(pa, pu), pressureFromPa(band, pu))} ${pl}` +
      beside(pu !== u.pressure, () => `${formatWithBand(pressureFromPa(pa, u.pressure), pressureFromPa(band, u.pressure))} ${label(PRESSURE_UNITS, u.pressure)}`),
    t: (k: number, band: number) => inT(tu, k, band) + beside(tu !== u.temperature, () => inT(u.temperature, k, band)),
    dt: (k: number, band: number) => `${formatWithBand(temperatureDifferenceFromK(k, tu), temperatureDifferenceFromK(band, tu))} ${dtLabel}`,
    m: (kg: number, band: number) => inM(mu, kg, band) + beside(mu !== u.mass, () => inM(u.mass, kg, band)),
    mBand: (kg: number, band: number) => `${formatWithBand(massFromKg(kg, mu), massFromKg(band, mu))} ${ml}`,
    l: (m: number) => `${formatNumber(lengthFromM(m, u.length), 3)} ${ll}`,
    lBand: (m: number, band: number) => `${formatWithBand(lengthFromM(m, u.length), lengthFromM(band, u.length))} ${ll}`,
    v: (m3: number, band: number) => `${formatToBand(volumeFromM3(m3, u.volume), volumeFromM3(band, u.volume), 3)} ${vl}`,
    pct: (fraction: number, band: number) => `${formatToBand(fraction * 100, band * 100, 2)} %`,
    pctBand: (fraction: number, band: number) => `${formatWithBand(fraction * 100, band * 100)} %`,
  };
}

type Fmt = ReturnType<typeof units>;

const SHORT: Record<string, string> = {
  'liquid-full-now': 'Liquid-full now',
  'pressure-above-mawp': 'Above MAWP',
  'pressure-at-mawp': 'At MAWP',
  'pressure-above-relief-set': 'Above the relief set pressure',
  'pressure-at-relief-set': 'At the relief set pressure',
  'pressure-near-relief-set': 'Near the relief set pressure',
  'vacuum-now': 'Vacuum now, not rated for it',
  'liquid-full-on-heating': 'Goes liquid-full on heating',
  'above-design-temperature': 'Above the design temperature',
  'noncondensable-gas': 'Gas likely: pressure above saturation',
  'pressure-below-saturation': 'Pressure below saturation',
  'superheated-pressure-mismatch': 'Weight and pressure disagree',
  'quality-band-reaches-liquid-full': 'May be liquid-full within the tolerances',
};

/**
 * The headline: whether the gauge agrees with the thermometer, led by the outcome's signal word
 * (the worst finding). Standing hazards such as a flash on release stay folded below, so they do
 * not turn every result red.
 */
export function verdictText(r: StoredCheckResult): { tone: 'ok' | 'bad'; text: string; short: string } {
  const { outcome, findings } = splitOutcome(r);
  const lead = outcome === 'DANGER' || outcome === 'WARNING' ? outcome : null;
  const v = r.saturation.verdict;
  const liquidFull = r.inventory.regime === 'liquid-full';
  const words =
    liquidFull
      ? v.verdict === 'consistent'
        ? 'By weight the vessel is liquid-full, yet the gauge reads saturation: the weight, tare or volume is wrong, or the vessel really is full of liquid. Treat it as liquid-full until checked.'
        : 'By weight the vessel is liquid-full: pressure follows the hydraulic expansion of the liquid, not saturation.'
    : v.verdict === 'consistent' ? 'Gauge and thermometer agree for saturated steam (within the instrument band).'
    : v.verdict === 'pressure-above-saturation' ? 'Pressure is above saturation for this temperature: air or other gas is likely present, or an instrument is off.'
    : `Pressure is below saturation for this temperature: an instrument or the atmosphere is off, or the vessel is not at equilibrium${v.superheatPossible ? ', or the steam is superheated' : ''}.`;
  const first = findings[0];
  const short = first ? (SHORT[first.rule] ?? first.message.split('.')[0]!)
    : liquidFull ? 'Liquid-full by weight' : v.verdict === 'consistent' ? 'Gauge and thermometer agree' : 'Pressure below saturation';
  const bad = outcome !== 'none' || v.verdict !== 'consistent' || liquidFull;
  return { tone: bad ? 'bad' : 'ok', text: lead ? `${lead}. ${words}` : words, short };
}

/** Which group a caution that is not a finding belongs to. */
const NOTE_GROUP: Record<string, ResultGroup['id']> = {
  'saturation-check-limits': 'saturation', 'atmosphere-assumed': 'saturation', 'bulk-quality-not-dryness': 'contents', 'quality-undetermined': 'contents',
};

/** Each instrument's part of the saturation band (a part that is 0 left out; a result saved before indicator and drift parts existed has only the first three). */
function bandParts(c: Partial<Record<string, number>>, f: Fmt): string {
  const names: [string, string][] = [
    ['pressureGauge', 'gauge class'], ['pressureGaugeIndicator', 'gauge indicator'], ['pressureGaugeDrift', 'gauge drift'],
    ['atmosphere', 'atmosphere'], ['temperatureSensor', 'thermometer element'], ['temperatureIndicator', 'thermometer indicator'],
    ['temperatureDrift', 'thermometer drift'],
  ];
  return names.filter(([key]) => (c[key] ?? 0) > 0).map(([key, name]) => `${name} ${f.p(c[key]!, c[key]!)}`).join('; ') || 'none';
}

/** One instrument a check used: its tag, its due state then, and the calibration it rested on. */
export function instrumentUseText(use: InstrumentUse): string {
  const day = (ms: number) => new Date(ms).toISOString().slice(0, 10);
  const cal = use.calibratedMs === null ? '' : `, calibration of ${day(use.calibratedMs)}`;
  const due = use.dueMs === null ? '' : use.due === 'overdue' ? ` since ${day(use.dueMs)}` : `, due ${day(use.dueMs)}`;
  return `${use.tag}: ${CALIBRATION_DUE_WORDS[use.due]}${due}${cal}`;
}

/** Everything the outcome strip and the full result show. `typed`: the units the reading was typed in. */
export function resultView(r: StoredCheckResult, spec: VesselSpec, u: UnitPrefs, typed: TypedUnits = {}): ResultView {
  const f = units(u, typed);
  const s = r.saturation;
  const c = s.pressureBand.contributions;
  const tolK = thermometerLimitsK(spec.instruments, r.reading.temperatureK).combined;
  // The gauge's own limits: its class, and its indicator and drift when the vessel states them (a result saved before those parts existed has only the class).
  const gaugeBand = 'pressureGaugeIndicator' in c ? Math.hypot(c.pressureGauge, c.pressureGaugeIndicator, c.pressureGaugeDrift) : c.pressureGauge;
  const absBand = Math.hypot(gaugeBand, c.atmosphere);
  const saturation: Figure[] = [
    { label: 'Pressure', value: `${f.p(r.reading.gaugePressurePa, absBand)} gauge, ${f.p(s.absolutePressurePa, absBand)} absolute` },
    { label: 'Saturation pressure at the temperature', value: `${f.p(s.saturationPressurePa, c.temperatureSensor)} absolute` },
    { label: 'Pressure minus saturation', value: f.pBand(s.pressureDeviationPa, s.pressureBand.plusMinus) },
    { label: 'Band parts (±, root-sum-square)', value: bandParts(c, f) },
    { label: 'Temperature', value: f.t(r.reading.temperatureK, tolK) },
    { label: 'Saturation temperature at the pressure', value: f.t(s.saturationTemperatureK, absBand / s.saturationSlopePaPerK) },
    { label: 'Temperature minus saturation', value: f.dt(s.temperatureDeviationK, s.temperatureBandK.plusMinus) },
    { label: 'Atmosphere used', value: `${f.p(r.reading.atmospherePa, c.atmosphere || spec.instruments.barometerTolerancePa)} (${r.reading.atmosphereSource === 'measured' ? 'barometer reading' : "vessel's site value"})` },
  ];
  // The register's instruments the band came from (checks saved before the register, or on a vessel without one, have none).
  if (spec.instrumentsUsed && spec.instrumentsUsed.length > 0) {
    saturation.push({ label: 'Instruments used', value: spec.instrumentsUsed.map(instrumentUseText).join('; ') });
  }
  if (s.verdict.verdict === 'pressure-above-saturation') {
    const g = s.verdict.noncondensableGas;
    saturation.push({ label: 'Gas partial pressure (estimate)', value: `${f.p(g.partialPressurePa, s.pressureBand.plusMinus)}, ${f.pct(g.moleFraction, s.pressureBand.plusMinus / s.absolutePressurePa)} by moles` });
  }
  const { contents, sketch, keyContents } = contentsFigures(r, spec, f);
  const heating = heatingFigures(r, f, gaugeBand, tolK);
  const hazards = hazardLines(r, f, tolK);
  const all = r.cautions.map((x) => inPreferredUnits(x, u));
  // The engine's own findings and outcome (issue 9); derived from the cautions' rule ids for a result saved before them.
  const split = splitOutcome<Caution>(isCurrentResult(r)
    ? { cautions: all, findings: r.findings.map((x) => inPreferredUnits(x, u)), outcome: r.outcome }
    : { cautions: all });
  const notes = (id: ResultGroup['id']) => split.others.filter((x) => (NOTE_GROUP[x.rule] ?? 'hazards') === id);
  const groups: ResultGroup[] = [
    { id: 'saturation', title: 'Saturation', figures: saturation, notes: notes('saturation'), folded: false },
    { id: 'contents', title: 'Contents', figures: contents, notes: notes('contents'), folded: false },
    { id: 'heating', title: 'Heating and limits', figures: heating, notes: notes('heating'), folded: false },
    { id: 'hazards', title: 'Hazards of the contents', figures: hazards.map((h) => ({ label: h.label, value: h.value })), notes: notes('hazards'), folded: true },
  ];
  const c0 = s.pressureBand.contributions;
  return {
    demo: isDemo(spec),
    outcome: split.outcome,
    verdict: verdictText(r),
    keyFigures: keyFiguresOf(r, u, typed, keyContents),
    findings: split.findings,
    groups,
    figures: [...saturation, ...contents, ...heating],
    hazards: hazards.map((h) => `${h.label}: ${h.value}`),
    cautions: all,
    chart: saturationChartData({
      temperatureK: r.reading.temperatureK, absolutePressurePa: s.absolutePressurePa,
      temperatureTolK: tolK, pressureTolPa: Math.hypot(gaugeBand, c0.atmosphere),
    }, { ...u, pressure: f.pressureUnit, temperature: typed.temperature ?? u.temperature }),
    sketch,
  };
}

/**
 * The two or three figures that decide the outcome, for the strip: p − p_sat with its band, T_sat,
 * and the quality (or what the contents are). Cheap enough for every keystroke.
 */
export function keyFiguresOf(r: StoredCheckResult, u: UnitPrefs, typed: TypedUnits = {}, contents?: readonly Figure[]): Figure[] {
  const f = units({ ...u, pressure: typed.pressure ?? u.pressure, temperature: typed.temperature ?? u.temperature, mass: typed.mass ?? u.mass }, typed);
  const s = r.saturation;
  const c = s.pressureBand.contributions;
  const inv = r.inventory;
  const b = r.inventoryBands;
  const third = contents ?? (inv.regime === 'two-phase'
    ? [{ label: 'x', value: b ? f.pctBand(inv.quality, b.quality.plusMinus) : f.pct(inv.quality, 0) }]
    : inv.regime === 'liquid-full' ? [{ label: 'Contents', value: 'liquid-full' }]
    : inv.regime === 'superheated' ? [{ label: 'Contents', value: 'all steam' }] : []);
  return [
    { label: 'p − p_sat', value: f.pBand(s.pressureDeviationPa, s.pressureBand.plusMinus) },
    { label: 'T_sat', value: f.t(s.saturationTemperatureK, Math.hypot(c.pressureGauge, c.atmosphere) / s.saturationSlopePaPerK) },
    ...third,
  ].slice(0, 3);
}

function contentsFigures(r: StoredCheckResult, spec: VesselSpec, f: Fmt): { contents: Figure[]; sketch: SketchData | undefined; keyContents: Figure[] } {
  const inv = r.inventory;
  const contents: Figure[] = [];
  const keyContents: Figure[] = [];
  let sketch: SketchData | undefined;
  const orientation = spec.geometry.shape !== 'horizontal-cylinder' ? 'vertical' : 'horizontal';
  const weightBand = spec.instruments.weightToleranceKg;
  switch (inv.regime) {
    case 'not-weighed':
      contents.push({ label: 'Contents', value: 'not weighed (enter the gross weight for mass, quality and level)' });
      break;
    case 'two-phase': {
      const b = r.inventoryBands;
      const liquidBand = b?.liquidMassKg.plusMinus ?? weightBand;
      const quality = b ? f.pctBand(inv.quality, b.quality.plusMinus) : f.pct(inv.quality, 0);
      contents.push(
        { label: 'Net contents', value: f.m(inv.netMassKg, weightBand) },
        { label: 'Quality (steam mass fraction)', value: quality },
        { label: 'Liquid mass', value: f.mBand(inv.liquidMassKg, liquidBand) },
        { label: 'Steam mass', value: f.m(inv.vaporMassKg, liquidBand) },
        { label: 'Liquid volume', value: f.v(inv.liquidVolumeM3, inv.liquidVolumeM3 * (liquidBand / Math.max(inv.liquidMassKg, 1e-9))) },
      );
      keyContents.push({ label: 'x', value: quality });
      const levelB = b?.liquidLevelM ?? null;
      if (inv.liquidLevel && spec.geometry.shape !== 'stated-volume') {
        const span = vesselLevelSpanM(spec.geometry);
        const pm = levelB ? levelB.plusMinus : 0;
        const low = Math.max(0, inv.liquidLevel.levelM - pm) / span, high = Math.min(span, inv.liquidLevel.levelM + pm) / span;
        const share = formatToBand(inv.liquidLevel.levelFraction * 100, (pm / span) * 100, 2);
        // A record saved before the engine gave a level band has none: the level is shown without ±.
        contents.push({ label: 'Liquid level', value: `${levelB ? f.lBand(inv.liquidLevel.levelM, pm) : f.l(inv.liquidLevel.levelM)} (${share} % of inside height)` });
        sketch = { orientation, level: inv.liquidLevel.levelFraction, low, high, caption: `Vessel sketch: liquid at ${share} % of the inside height`, note: 'of inside height' };
      } else {
        const share = 1 - inv.vaporSpaceFraction;
        contents.push({ label: 'Liquid share of the volume', value: `${formatNumber(share * 100, 2)} % (no level: volume only)` });
        sketch = { orientation, level: share, low: share, high: share, caption: `Vessel sketch: liquid is ${formatNumber(share * 100, 2)} % of the volume`, note: 'of the volume' };
      }
      break;
    }
    case 'liquid-full':
      contents.push({ label: 'Contents', value: `${f.m(inv.netMassKg, weightBand)}, liquid-full: no steam space` });
      if (inv.hydraulic.withinFormulation) contents.push({ label: 'Hydraulic pressure of this fill', value: `${f.p(inv.hydraulic.gaugePressurePa, inv.hydraulic.gaugePressurePa / 10)} gauge (an estimate: it changes steeply with the weight)` });
      keyContents.push({ label: 'Contents', value: 'liquid-full' });
      sketch = { orientation, level: 1, low: 1, high: 1, caption: 'Vessel sketch: full of liquid', note: 'of inside height' };
      break;
    case 'superheated':
      contents.push(
        { label: 'Contents', value: `${f.m(inv.netMassKg, weightBand)}, all steam (superheated)` },
        { label: 'Pressure this mass gives', value: `${f.p(inv.absolutePressurePa, inv.differenceBandPa)} absolute` },
      );
      keyContents.push({ label: 'Contents', value: 'all steam' });
      sketch = { orientation, level: 0, low: 0, high: 0, caption: 'Vessel sketch: no liquid', note: 'of inside height' };
      break;
  }
  return { contents, sketch, keyContents };
}

function heatingFigures(r: StoredCheckResult, f: Fmt, gaugeBandPa: number, tolK: number): Figure[] {
  const h = r.hazards;
  const pct = (x: number) => `${formatNumber(Math.round(x * 100), 3)} %`;
  const out: Figure[] = [
    { label: 'Margin to MAWP', value: `${f.p(h.mawpMargin.marginPa, gaugeBandPa)} (the reading is ${pct(h.mawpMargin.fractionOfLimit)} of MAWP)` },
    { label: 'Margin to the relief set pressure', value: `${f.p(h.reliefSetMargin.marginPa, gaugeBandPa)} (${pct(h.reliefSetMargin.fractionOfLimit)} of it)` },
  ];
  const e = r.envelope;
  if (e && e.first.event !== 'none') {
    const what = { 'liquid-full': 'goes liquid-full', 'all-vapor': 'becomes all steam', 'relief-set-pressure': 'reaches the relief set pressure', mawp: 'reaches MAWP' }[e.first.event];
    out.push({ label: 'On heating', value: e.first.alreadyReached ? `this fill already ${what}` : `this fill first ${what} at ${f.t(e.first.temperatureK, tolK)}` });
  } else if (!e) {
    out.push({ label: 'On heating', value: 'not worked out: the vessel was not weighed' });
  }
  return out;
}

function hazardLines(r: StoredCheckResult, f: Fmt, tolK: number): Figure[] {
  const h = r.hazards;
  const out: Figure[] = [];
  if (h.flash && h.flash.flashFraction <= 0) {
    out.push({ label: 'Liquid released', value: 'none of it flashes: it is below the boiling point at atmospheric pressure (it still scalds)' });
  } else if (h.flash) {
    out.push({ label: 'Liquid released', value: `${formatNumber(h.flash.flashFraction * 100, 2)} % of it flashes to steam (${formatNumber(h.flash.volumeRatio, 2)} times its volume)` +
      (h.flash.totalFlashSteamVolumeM3 !== null ? `; all of it would make ${f.v(h.flash.totalFlashSteamVolumeM3, h.flash.totalFlashSteamVolumeM3 / 20)} of steam` : '') });
  }
  if (h.storedEnergy) out.push({ label: 'Stored expansion energy', value: `${formatNumber(h.storedEnergy.expansionWorkJ / 1e6, 2)} MJ (about ${formatNumber(h.storedEnergy.tntEquivalentKg, 2)} kg TNT equivalent; an indicator, not a blast prediction)` });
  const cooledPa = h.cooled.absolutePressurePa;
  const settles = 'direction' in h.cooled && h.cooled.direction === 'warming' ? 'Sealed and warmed to' : 'Sealed and cooled to';
  out.push({ label: `${settles} ${f.t(h.cooled.temperatureK, tolK)}`, value: cooledPa === null ? 'still liquid-full, above 100 MPa (beyond IF97)'
    : `${f.p(cooledPa, cooledPa / 50)} absolute` +
      (h.cooled.collapseRisk ? ', below atmosphere in a vessel neither rated for vacuum nor fitted with a vacuum breaker' : h.cooled.belowAtmosphere ? ', below atmosphere (rated for vacuum or with a vacuum breaker)' : '') });
  return out;
}
