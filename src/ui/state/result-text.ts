// A CheckResult (SI) in words and preferred units for the result card. Values come from the
// engine; this module converts units for display and picks the words.
import {
  LENGTH_UNITS, MASS_UNITS, PRESSURE_UNITS, TEMPERATURE_UNITS, VOLUME_UNITS, findingsOfStoredResult, lengthFromM, massFromKg, pressureFromPa,
  temperatureDifferenceFromK, temperatureFromK, thermometerLimitsK, volumeFromM3, vesselLevelSpanM,
  type StoredCheckResult, type VesselSpec,
} from '../../core/index.ts';
import { saturationChartData } from './chart-data.ts';
import { inPreferredUnits } from './caution-text.ts';
import { formatNumber, formatWithBand } from './format.ts';
import { isDemo } from './demo-label.ts';
import type { Figure, ResultView } from './result-view.ts';
import type { SketchData } from '../components/VesselSketch.tsx';
import type { UnitPrefs } from './settings-model.ts';

const label = (list: readonly { id: string; label: string }[], id: string) => list.find((u) => u.id === id)?.label ?? id;

function units(u: UnitPrefs) {
  const pl = label(PRESSURE_UNITS, u.pressure), tl = label(TEMPERATURE_UNITS, u.temperature);
  const ml = label(MASS_UNITS, u.mass), vl = label(VOLUME_UNITS, u.volume), ll = label(LENGTH_UNITS, u.length);
  return {
    p: (pa: number) => `${formatNumber(pressureFromPa(pa, u.pressure), 5)} ${pl}`,
    pBand: (pa: number, band: number) => `${formatWithBand(pressureFromPa(pa, u.pressure), pressureFromPa(band, u.pressure), 5)} ${pl}`,
    t: (k: number) => `${formatNumber(temperatureFromK(k, u.temperature), 4)} ${tl}`,
    dt: (k: number, band: number) => `${formatWithBand(temperatureDifferenceFromK(k, u.temperature), temperatureDifferenceFromK(band, u.temperature), 3)} ${tl}`,
    m: (kg: number) => `${formatNumber(massFromKg(kg, u.mass), 4)} ${ml}`,
    mBand: (kg: number, band: number) => `${formatWithBand(massFromKg(kg, u.mass), massFromKg(band, u.mass), 5)} ${ml}`,
    l: (m: number) => `${formatNumber(lengthFromM(m, u.length), 4)} ${ll}`,
    lBand: (m: number, band: number) => `${formatWithBand(lengthFromM(m, u.length), lengthFromM(band, u.length), 4)} ${ll}`,
    v: (m3: number) => `${formatNumber(volumeFromM3(m3, u.volume), 4)} ${vl}`,
  };
}

/**
 * The headline: whether the gauge agrees with the thermometer, led by the check's outcome (the
 * worst signal word among its findings; derived from rule ids for a result saved before findings
 * existed). Standing hazards such as a flash on release are folded below, so they do not turn
 * every result red.
 */
export function verdictText(r: StoredCheckResult): { tone: 'ok' | 'bad'; text: string } {
  const { outcome } = findingsOfStoredResult(r);
  const lead = outcome === 'none' ? null : outcome;
  const v = r.saturation.verdict;
  const words =
    r.inventory.regime === 'liquid-full'
      ? v.verdict === 'consistent'
        ? 'By weight the vessel is liquid-full, yet the gauge reads saturation: the weight, tare or volume is wrong, or the vessel really is full of liquid. Treat it as liquid-full until checked.'
        : 'By weight the vessel is liquid-full: pressure follows the hydraulic expansion of the liquid, not saturation.'
    : v.verdict === 'consistent' ? 'Gauge and thermometer agree for saturated steam (within the instrument band).'
    : v.verdict === 'pressure-above-saturation' ? 'Pressure is above saturation for this temperature: air or other gas is likely present, or an instrument is off.'
    : `Pressure is below saturation for this temperature: an instrument or the atmosphere is off, or the vessel is not at equilibrium${v.superheatPossible ? ', or the steam is superheated' : ''}.`;
  const bad = lead !== null || v.verdict !== 'consistent' || r.inventory.regime === 'liquid-full';
  return { tone: bad ? 'bad' : 'ok', text: lead ? `${lead}. ${words}` : words };
}

/** Everything the result card shows. */
export function resultView(r: StoredCheckResult, spec: VesselSpec, u: UnitPrefs): ResultView {
  const f = units(u);
  const s = r.saturation;
  const figures: Figure[] = [
    { label: 'Absolute pressure', value: f.p(s.absolutePressurePa) },
    { label: 'Saturation pressure at the temperature', value: f.p(s.saturationPressurePa) },
    { label: 'Pressure minus saturation', value: f.pBand(s.pressureDeviationPa, s.pressureBand.plusMinus) },
    { label: 'Band parts (±, root-sum-square)', value: bandParts(s.pressureBand.contributions, f) },
    { label: 'Saturation temperature at the pressure', value: f.t(s.saturationTemperatureK) },
    { label: 'Temperature minus saturation', value: f.dt(s.temperatureDeviationK, s.temperatureBandK.plusMinus) },
    { label: 'Atmosphere used', value: `${f.p(r.reading.atmospherePa)} (${r.reading.atmosphereSource === 'measured' ? 'barometer reading' : "vessel's site value"})` },
  ];
  if (s.verdict.verdict === 'pressure-above-saturation') {
    const g = s.verdict.noncondensableGas;
    figures.push({ label: 'Gas partial pressure (estimate)', value: `${f.p(g.partialPressurePa)}, ${formatNumber(g.moleFraction * 100, 3)} % by moles` });
  }
  const inv = r.inventory;
  let sketch: SketchData | undefined;
  const vertical = spec.geometry.shape !== 'horizontal-cylinder';
  const orientation = vertical ? 'vertical' : 'horizontal';
  switch (inv.regime) {
    case 'not-weighed':
      figures.push({ label: 'Contents', value: 'not weighed (enter the gross weight for mass, quality and level)' });
      break;
    case 'two-phase': {
      const b = r.inventoryBands;
      figures.push(
        { label: 'Net contents', value: f.m(inv.netMassKg) },
        { label: 'Quality (steam mass fraction)', value: b ? `${formatWithBand(inv.quality * 100, b.quality.plusMinus * 100, 3)} %` : `${formatNumber(inv.quality * 100, 3)} %` },
        { label: 'Liquid mass', value: b ? f.mBand(inv.liquidMassKg, b.liquidMassKg.plusMinus) : f.m(inv.liquidMassKg) },
        { label: 'Steam mass', value: f.m(inv.vaporMassKg) },
        { label: 'Liquid volume', value: f.v(inv.liquidVolumeM3) },
      );
      const levelB = b?.liquidLevelM ?? null;
      if (inv.liquidLevel && spec.geometry.shape !== 'stated-volume') {
        const span = vesselLevelSpanM(spec.geometry);
        const pm = levelB ? levelB.plusMinus : 0;
        const low = Math.max(0, inv.liquidLevel.levelM - pm) / span, high = Math.min(span, inv.liquidLevel.levelM + pm) / span;
        // A record saved before the engine gave a level band has none: the level is shown without ±.
        figures.push({ label: 'Liquid level', value: `${levelB ? f.lBand(inv.liquidLevel.levelM, pm) : f.l(inv.liquidLevel.levelM)} (${formatNumber(inv.liquidLevel.levelFraction * 100, 3)} % of inside height)` });
        sketch = { orientation, level: inv.liquidLevel.levelFraction, low, high, caption: `Vessel sketch: liquid at ${formatNumber(inv.liquidLevel.levelFraction * 100, 3)} % of the inside height`, note: 'of inside height' };
      } else {
        const share = 1 - inv.vaporSpaceFraction;
        figures.push({ label: 'Liquid share of the volume', value: `${formatNumber(share * 100, 3)} % (no level: volume only)` });
        sketch = { orientation, level: share, low: share, high: share, caption: `Vessel sketch: liquid is ${formatNumber(share * 100, 3)} % of the volume`, note: 'of the volume' };
      }
      break;
    }
    case 'liquid-full':
      figures.push({ label: 'Contents', value: `${f.m(inv.netMassKg)}, liquid-full: no steam space` });
      if (inv.hydraulic.withinFormulation) figures.push({ label: 'Hydraulic pressure of this fill', value: `${f.p(inv.hydraulic.gaugePressurePa)} gauge` });
      sketch = { orientation, level: 1, low: 1, high: 1, caption: 'Vessel sketch: full of liquid', note: 'of inside height' };
      break;
    case 'superheated':
      figures.push(
        { label: 'Contents', value: `${f.m(inv.netMassKg)}, all steam (superheated)` },
        { label: 'Pressure this mass gives', value: `${f.p(inv.absolutePressurePa)} absolute` },
      );
      sketch = { orientation, level: 0, low: 0, high: 0, caption: 'Vessel sketch: no liquid', note: 'of inside height' };
      break;
  }
  const tolK = thermometerLimitsK(spec.instruments, r.reading.temperatureK).combined;
  const c = s.pressureBand.contributions;
  const split = findingsOfStoredResult(r);
  return {
    demo: isDemo(spec),
    verdict: verdictText(r),
    figures,
    hazards: hazardLines(r, f),
    cautions: r.cautions.map((c) => inPreferredUnits(c, u)),
    findings: split.findings.map((c) => inPreferredUnits(c, u)),
    standing: split.standing.map((c) => inPreferredUnits(c, u)),
    chart: saturationChartData({
      temperatureK: r.reading.temperatureK, absolutePressurePa: s.absolutePressurePa,
      temperatureTolK: tolK, pressureTolPa: Math.hypot(c.pressureGauge, c.atmosphere, 'pressureGaugeIndicator' in c ? c.pressureGaugeIndicator : 0, 'pressureGaugeDrift' in c ? c.pressureGaugeDrift : 0),
    }, u),
    sketch,
  };
}

/** Each instrument's part of the saturation band (a part that is 0 left out; a result saved before indicator and drift parts existed has only the first three). */
function bandParts(c: Partial<Record<string, number>>, f: ReturnType<typeof units>): string {
  const names: [string, string][] = [
    ['pressureGauge', 'gauge class'], ['pressureGaugeIndicator', 'gauge indicator'], ['pressureGaugeDrift', 'gauge drift'],
    ['atmosphere', 'atmosphere'], ['temperatureSensor', 'thermometer element'], ['temperatureIndicator', 'thermometer indicator'],
    ['temperatureDrift', 'thermometer drift'],
  ];
  return names.filter(([key]) => (c[key] ?? 0) > 0).map(([key, name]) => `${name} ${f.p(c[key]!)}`).join('; ') || 'none';
}

function hazardLines(r: StoredCheckResult, f: ReturnType<typeof units>): string[] {
  const h = r.hazards;
  const out = [
    `Margin to MAWP: ${f.p(h.mawpMargin.marginPa)} (at ${formatNumber(h.mawpMargin.fractionOfLimit * 100, 3)} % of MAWP).`,
    `Margin to the relief set pressure: ${f.p(h.reliefSetMargin.marginPa)} (at ${formatNumber(h.reliefSetMargin.fractionOfLimit * 100, 3)} %).`,
  ];
  if (h.flash && h.flash.flashFraction <= 0) {
    out.push('If liquid escapes, none of it flashes: it is below the boiling point at atmospheric pressure (it still scalds).');
  } else if (h.flash) {
    out.push(`If liquid escapes, ${formatNumber(h.flash.flashFraction * 100, 3)} % of it flashes to steam (${formatNumber(h.flash.volumeRatio, 3)} times its volume)` +
      (h.flash.totalFlashSteamVolumeM3 !== null ? `; all of it would make ${f.v(h.flash.totalFlashSteamVolumeM3)} of steam.` : '.'));
  }
  if (h.storedEnergy) out.push(`Stored expansion energy ${formatNumber(h.storedEnergy.expansionWorkJ / 1e6, 3)} MJ (about ${formatNumber(h.storedEnergy.tntEquivalentKg, 2)} kg TNT equivalent; an indicator, not a blast prediction).`);
  const cooledPa = h.cooled.absolutePressurePa;
  const settles = 'direction' in h.cooled && h.cooled.direction === 'warming' ? 'Sealed and warmed to' : 'Sealed and cooled to';
  out.push(cooledPa === null
    ? `${settles} ${f.t(h.cooled.temperatureK)}: still liquid-full, above 100 MPa (beyond IF97).`
    : `${settles} ${f.t(h.cooled.temperatureK)}: ${f.p(cooledPa)} absolute` +
      (h.cooled.collapseRisk ? ', below atmosphere in an unprotected vessel.' : h.cooled.belowAtmosphere ? ', below atmosphere (rated for vacuum or with a vacuum breaker).' : '.'));
  const e = r.envelope;
  if (e && e.first.event !== 'none') {
    const what = { 'liquid-full': 'goes liquid-full', 'all-vapor': 'becomes all steam', 'relief-set-pressure': 'reaches the relief set pressure', mawp: 'reaches MAWP' }[e.first.event];
    out.push(e.first.alreadyReached ? `On heating this fill already ${what}.` : `On heating, this fill first ${what} at ${f.t(e.first.temperatureK)}.`);
  }
  return out;
}
