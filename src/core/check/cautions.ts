// Cautions: each carries an ISO 3864 / ANSI Z535 signal word, a short message and the rule that
// raised it. The rule catalogue fixes each rule's signal word, so a rule cannot be raised at two
// levels by accident. Every result ends with the standing note.

import type { CheckResult } from './evaluate-check.ts';
import type { FillPlan } from './plan-fill.ts';
import type { VesselSpec } from './vessel-spec.ts';

export type SignalWord = 'DANGER' | 'WARNING' | 'CAUTION' | 'NOTICE';

export interface Caution {
  signal: SignalWord;
  /** The wording with quantities in °C, K (differences), kPa and kg: what the log stores. */
  message: string;
  /** Rule id from CAUTION_RULES. */
  rule: string;
  /** The same wording as text and SI quantities, so a screen can show the person's own units. */
  parts?: readonly CautionPart[];
}

/** A quantity inside a caution's wording, in SI. `decimals` is for the stored °C/K/kPa/kg text. */
export type CautionQuantity =
  | { kind: 'temperature'; K: number; decimals?: number }
  | { kind: 'temperature-difference'; K: number; decimals?: number }
  | { kind: 'pressure'; Pa: number; decimals?: number }
  | { kind: 'mass'; kg: number; decimals?: number };
export type CautionPart = string | CautionQuantity;

/** A caution's wording both ways: stored text and parts. */
export interface CautionWording {
  message: string;
  parts: CautionPart[];
}

/** The stored text of one quantity: °C, K, kPa or kg, with a true minus sign like the figures. */
export function quantityText(q: CautionQuantity): string {
  const fixed = (x: number, d: number) => x.toFixed(d).replace(/^-/, '\u2212');
  switch (q.kind) {
    case 'temperature': return `${fixed(q.K - 273.15, q.decimals ?? 1)} °C`;
    case 'temperature-difference': return `${fixed(q.K, q.decimals ?? 1)} K`;
    case 'pressure': return `${fixed(q.Pa / 1000, q.decimals ?? 1)} kPa`;
    case 'mass': return `${fixed(q.kg, q.decimals ?? 1)} kg`;
  }
}

/** Tagged template for caution wording: interpolate celsius(), kilopascal(), kelvinDifference(), kilograms() or plain text. */
export function say(strings: TemplateStringsArray, ...values: (CautionPart | number)[]): CautionWording {
  const parts: CautionPart[] = [];
  strings.forEach((text, i) => {
    appendPart(parts, text);
    if (i < values.length) {
      const v = values[i]!;
      appendPart(parts, typeof v === 'number' ? String(v) : v);
    }
  });
  return { message: parts.map((p) => (typeof p === 'string' ? p : quantityText(p))).join(''), parts };
}

/** Adds a part, merging neighbouring text so the parts stay short. */
function appendPart(parts: CautionPart[], p: CautionPart): void {
  const last = parts[parts.length - 1];
  if (typeof p === 'string' && typeof last === 'string') parts[parts.length - 1] = last + p;
  else if (p !== '') parts.push(p);
}

/** Every rule and its signal word. The thresholds live beside the code that raises each rule. */
export const CAUTION_RULES = {
  'liquid-full-now': 'DANGER',
  'pressure-above-mawp': 'DANGER',
  'pressure-at-mawp': 'DANGER',
  'pressure-above-relief-set': 'WARNING',
  'pressure-at-relief-set': 'WARNING',
  'pressure-near-relief-set': 'CAUTION',
  'vacuum-now': 'WARNING',
  'liquid-full-on-heating': 'WARNING',
  'above-design-temperature': 'WARNING',
  'noncondensable-gas': 'WARNING',
  'pressure-below-saturation': 'CAUTION',
  'saturation-check-limits': 'NOTICE',
  'atmosphere-assumed': 'NOTICE',
  'superheated-pressure-mismatch': 'CAUTION',
  'quality-band-reaches-liquid-full': 'CAUTION',
  'bulk-quality-not-dryness': 'NOTICE',
  'flash-on-release': 'WARNING',
  'vacuum-on-cooling': 'WARNING',
  'scald': 'CAUTION',
  'plan-exceeds-safe-charge': 'DANGER',
  'plan-does-not-fit': 'DANGER',
  'plan-target-above-mawp': 'DANGER',
  'plan-target-above-relief-set': 'WARNING',
  'plan-above-design-temperature': 'WARNING',
  'plan-assumes-air-removed': 'NOTICE',
  'standing-note': 'NOTICE',
} as const satisfies Record<string, SignalWord>;

export type CautionRule = keyof typeof CAUTION_RULES;

/**
 * Rules that describe the vessel as it is now and call for action now, as opposed to what would
 * happen if something were done (a release flashes, a sealed vessel cooling pulls a vacuum). A
 * result headline leads with these, so a standing "if" hazard does not turn every result red.
 */
export const ACT_NOW_RULES: readonly CautionRule[] = [
  'liquid-full-now', 'pressure-above-mawp', 'pressure-at-mawp', 'pressure-above-relief-set', 'pressure-at-relief-set',
  'vacuum-now', 'liquid-full-on-heating', 'above-design-temperature', 'noncondensable-gas',
];

/** A caution for a catalogued rule; wording from `say` also carries its parts. */
export function caution(rule: CautionRule, wording: string | CautionWording): Caution {
  return typeof wording === 'string'
    ? { signal: CAUTION_RULES[rule], message: wording, rule }
    : { signal: CAUTION_RULES[rule], message: wording.message, rule, parts: wording.parts };
}

/** The note every result carries (issue 3, item 7; wording ours). */
export const STANDING_NOTE: Caution = caution(
  'standing-note',
  'Advisory figures only. This app does not replace the vessel\'s inspection regime, local codes ' +
    '(such as ASME BPVC Section VIII, PED 2014/68/EU and national rules), lockout/tagout procedures ' +
    'or licensed practice. Nameplate limits and the competent person\'s instructions take precedence.',
);

const ORDER: Record<SignalWord, number> = { DANGER: 0, WARNING: 1, CAUTION: 2, NOTICE: 3 };

/** Cautions most severe first (stable within a level), the standing note last. */
export function withStandingNote(list: Caution[]): Caution[] {
  const sorted = list
    .map((c, i) => ({ c, i }))
    .sort((a, b) => ORDER[a.c.signal] - ORDER[b.c.signal] || a.i - b.i)
    .map(({ c }) => c);
  return [...sorted, STANDING_NOTE];
}

/** A temperature inside a caution's wording. T in K. */
export function celsius(temperatureK: number): CautionQuantity {
  return { kind: 'temperature', K: temperatureK };
}

/** A pressure (gauge or absolute, as the wording says) inside a caution's wording. p in Pa. */
export function kilopascal(pressurePa: number): CautionQuantity {
  return { kind: 'pressure', Pa: pressurePa };
}

/** A temperature difference inside a caution's wording. ΔT in K. */
export function kelvinDifference(differenceK: number, decimals = 1): CautionQuantity {
  return { kind: 'temperature-difference', K: differenceK, decimals };
}

/** A mass inside a caution's wording. m in kg. */
export function kilograms(massKg: number, decimals = 1): CautionQuantity {
  return { kind: 'mass', kg: massKg, decimals };
}

/** Scald threshold, K: 60 °C water gives a full-thickness burn in about 5 s (American Burn Association educator's guide "Scalds: A Burning Issue"; its data go back to Moritz & Henriques 1947, from memory). */
export const SCALD_TEMPERATURE_K = 333.15;

/**
 * Fraction of the relief set pressure at which a reading is flagged: conventional relief valves
 * want the operating pressure about 10 % below set to avoid simmer and premature opening (API RP
 * 521 Fig. 2 shows a 10 % margin, per http://instrumentation.processengineer.info/relief-device-set-pressures.html ;
 * the ~10 % below set for conventional valves per an eng-tips thread on PSV set pressure; flagging
 * at 90 % as the usual operating-margin convention is from memory).
 */
export const NEAR_LIMIT_FRACTION = 0.9;

/** Several pieces of wording as one. */
function joined(...pieces: CautionWording[]): CautionWording {
  const parts: CautionPart[] = [];
  for (const w of pieces) for (const p of w.parts) appendPart(parts, p);
  return { message: pieces.map((w) => w.message).join(''), parts };
}

/** The cautions for one evaluated check (the standing note last). */
export function cautionsForCheck(vessel: VesselSpec, result: Omit<CheckResult, 'cautions'>): Caution[] {
  const out: Caution[] = [];
  const r = result.reading;
  const T = r.temperatureK;
  const gauge = r.gaugePressurePa;
  const inv = result.inventory;

  if (inv.regime === 'liquid-full') {
    const h = inv.hydraulic;
    out.push(caution('liquid-full-now', h.withinFormulation
      ? joined(
        say`The vessel is liquid-full at ${celsius(T)}: no vapour space is left, and this fill would reach ${kilopascal(h.gaugePressurePa)} gauge `,
        say`(MAWP ${kilopascal(vessel.mawpGaugePa)} gauge). Pressure rises by several bar per kelvin of further heating and no longer follows saturation. Stop heating and check the weight.`)
      : say`The vessel is liquid-full at ${celsius(T)}: this fill would exceed 100 MPa, far above the MAWP. Stop heating and check the weight.`));
  }
  // A reading within the gauge's own accuracy of a limit may already be at it: the gauge band
  // (class % of span) decides "at", so a reading exactly at MAWP is never shown as below it.
  const gaugeBandPa = (vessel.instruments.pressureGauge.spanPa * vessel.instruments.pressureGauge.accuracyPercentOfSpan) / 100;
  const within = say`within the gauge's accuracy (±${kilopascal(gaugeBandPa)})`;
  if (gauge > vessel.mawpGaugePa) {
    out.push(caution('pressure-above-mawp', say`Gauge pressure ${kilopascal(gauge)} is above the MAWP (${kilopascal(vessel.mawpGaugePa)} gauge).`));
  } else if (gauge >= vessel.mawpGaugePa - gaugeBandPa) {
    out.push(caution('pressure-at-mawp', joined(
      say`Gauge pressure ${kilopascal(gauge)} is at the MAWP (${kilopascal(vessel.mawpGaugePa)} gauge) `, within, say`. Reduce the heat input now.`)));
  } else if (gauge > vessel.reliefSetGaugePa) {
    out.push(caution('pressure-above-relief-set',
      say`Gauge pressure ${kilopascal(gauge)} is above the relief set pressure (${kilopascal(vessel.reliefSetGaugePa)} gauge) but the relief device has not relieved it.`));
  } else if (gauge >= vessel.reliefSetGaugePa - gaugeBandPa) {
    out.push(caution('pressure-at-relief-set', joined(
      say`Gauge pressure ${kilopascal(gauge)} is at the relief set pressure (${kilopascal(vessel.reliefSetGaugePa)} gauge) `, within,
      say`: the relief device may be lifting or simmering.`)));
  } else if (gauge >= NEAR_LIMIT_FRACTION * vessel.reliefSetGaugePa) {
    out.push(caution('pressure-near-relief-set', joined(
      say`Gauge pressure ${kilopascal(gauge)} is ${(100 * gauge / vessel.reliefSetGaugePa).toFixed(0)} % of the relief set pressure (${kilopascal(vessel.reliefSetGaugePa)} gauge); `,
      say`readings from ${(100 * NEAR_LIMIT_FRACTION).toFixed(0)} % up are flagged.`)));
  }
  if (!vessel.vacuumRated && gauge < -gaugeBandPa) {
    out.push(caution('vacuum-now',
      say`Gauge pressure ${kilopascal(gauge)}: the vessel is below atmosphere now and is not rated for vacuum. Open the vacuum breaker or vent, or stop cooling, before it buckles.`));
  }
  const env = result.envelope;
  if (env && env.first.event === 'liquid-full' && inv.regime !== 'liquid-full') {
    out.push(caution('liquid-full-on-heating', joined(
      say`This fill goes liquid-full at ${celsius(env.first.temperatureK)}, before the steam reaches the relief set pressure`,
      env.reliefSetTemperatureK === null ? say`` : say` (${celsius(env.reliefSetTemperatureK)})`,
      say`. Heating past it gives hydraulic overpressure.`)));
  }
  if (T > vessel.designTemperatureK) {
    out.push(caution('above-design-temperature', say`Temperature ${celsius(T)} is above the design temperature (${celsius(vessel.designTemperatureK)}).`));
  }

  const v = result.saturation.verdict;
  if (inv.regime === 'liquid-full') {
    // Pressure above saturation is what a liquid-full vessel does; reading it as air would mislead.
  } else if (v.verdict === 'pressure-above-saturation') {
    const g = v.noncondensableGas;
    out.push(caution('noncondensable-gas', joined(
      say`Pressure is ${kilopascal(g.partialPressurePa)} above saturation for ${celsius(T)}: air or another non-condensable gas is likely `,
      say`(about ${(100 * g.moleFraction).toFixed(1)} % by mole), or the thermometer reads low. The steam is ${kelvinDifference(g.temperatureShortfallK)} `,
      say`colder than the gauge implies; for sterilisation, the load may not reach temperature.`)));
  } else if (v.verdict === 'pressure-below-saturation') {
    out.push(caution('pressure-below-saturation', joined(
      say`Pressure is ${kilopascal(-result.saturation.pressureDeviationPa)} below saturation for ${celsius(T)}: suspect a gauge or thermometer fault, `,
      say`a wrong atmospheric pressure, or a vessel not at equilibrium${v.superheatPossible ? '; with no liquid present it can be superheated vapour' : ''}.`)));
  } else {
    out.push(caution('saturation-check-limits', joined(
      say`Pressure and temperature agree with saturated steam within ±${kelvinDifference(result.saturation.temperatureBandK.plusMinus, 2)} (root-sum-square of the instrument limits). `,
      say`Agreement cannot show air below a few percent and does not replace an air-removal or non-condensable gas test.`)));
  }
  if (r.atmosphereSource === 'site' && result.saturation.pressureBand.contributions.atmosphere > 0) {
    out.push(caution('atmosphere-assumed', 'Gauge pressure was converted with the stored site atmosphere; weather moves it by a few kPa. A barometer reading narrows the band.'));
  }

  if (inv.regime === 'superheated') {
    if (Math.abs(inv.differenceFromReadingPa) > inv.differenceBandPa) {
      out.push(caution('superheated-pressure-mismatch',
        say`By weight there is no liquid: this mass of vapour would be at ${kilopascal(inv.absolutePressurePa)} absolute, not the ${kilopascal(r.absolutePressurePa)} read. Check the tare, the weight and the volume.`));
    }
  }
  if (inv.regime === 'two-phase') {
    if (result.inventoryBands && inv.quality - result.inventoryBands.quality.plusMinus <= 0) {
      out.push(caution('quality-band-reaches-liquid-full', 'Within the weight, temperature and volume tolerances the contents could be liquid-full.'));
    }
    out.push(caution('bulk-quality-not-dryness', 'Quality here is the bulk vapour mass fraction of the vessel contents, not the dryness of supply steam (EN 285 dryness value).'));
  }

  const flash = result.hazards.flash;
  if (flash && flash.flashFraction > 0) {
    out.push(caution('flash-on-release',
      `Liquid released to atmosphere flashes: ${(100 * flash.flashFraction).toFixed(1)} % turns to steam, about ${Math.round(flash.volumeRatio)} times the liquid volume. ` +
      'Opening a drain, vent, sight-glass cock or door makes a scalding jet.'));
  }
  const cooled = result.hazards.cooled;
  if (cooled.collapseRisk) {
    out.push(caution('vacuum-on-cooling', joined(
      say`Cooled to ${celsius(cooled.temperatureK)} the vessel falls to ${kilopascal(cooled.gaugePressurePa)} gauge and it is not rated for vacuum: `,
      say`keep the vacuum breaker or vent working before it cools sealed.`)));
  }
  if (T >= SCALD_TEMPERATURE_K) {
    out.push(caution('scald', say`Contents at ${celsius(T)}: contact scalds within seconds. Wear face, eye and hand protection.`));
  }
  return withStandingNote(out);
}

/** The cautions for one fill plan (the standing note last). */
export function cautionsForPlan(vessel: VesselSpec, plan: Omit<FillPlan, 'cautions'>): Caution[] {
  const out: Caution[] = [];
  if (plan.startState.regime === 'liquid-full') {
    out.push(caution('plan-does-not-fit', say`The charge does not fit: at the start temperature ${celsius(plan.startTemperatureK)} it would already fill the vessel with liquid.`));
  }
  if (plan.waterMassKg > plan.largestSafeCharge.waterMassKg) {
    out.push(caution('plan-exceeds-safe-charge', joined(
      say`The charge (${kilograms(plan.waterMassKg)}) is more than the largest safe charge (${kilograms(plan.largestSafeCharge.waterMassKg)}): `,
      plan.envelope.liquidFullTemperatureK === null ? say`it goes liquid-full at no temperature, ` : say`it goes liquid-full at ${celsius(plan.envelope.liquidFullTemperatureK)}, `,
      say`inside the margin below the relief set pressure's saturation temperature.`)));
  }
  if (plan.targetGaugePressurePa > vessel.mawpGaugePa) {
    out.push(caution('plan-target-above-mawp',
      say`At ${celsius(plan.targetTemperatureK)} saturated steam is at ${kilopascal(plan.targetGaugePressurePa)} gauge, above the MAWP (${kilopascal(vessel.mawpGaugePa)} gauge).`));
  } else if (plan.targetGaugePressurePa > vessel.reliefSetGaugePa) {
    out.push(caution('plan-target-above-relief-set',
      say`At ${celsius(plan.targetTemperatureK)} saturated steam is at ${kilopascal(plan.targetGaugePressurePa)} gauge, above the relief set pressure (${kilopascal(vessel.reliefSetGaugePa)} gauge).`));
  }
  if (plan.targetTemperatureK > vessel.designTemperatureK) {
    out.push(caution('plan-above-design-temperature', say`The target ${celsius(plan.targetTemperatureK)} is above the design temperature (${celsius(vessel.designTemperatureK)}).`));
  }
  out.push(caution('plan-assumes-air-removed', 'The plan assumes the air is removed before sealing; air left in raises the pressure above saturation and lowers the steam temperature.'));
  return withStandingNote(out);
}
