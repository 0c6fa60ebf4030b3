// The rules that raise a check's and a fill plan's cautions, each with the threshold that raises
// it; the signal words, kinds and their reasons are in cautions.ts (RULE_CATALOGUE). Wording never
// overclaims: no rule says a vessel is safe, fit to open or approved; a pressure figure beyond
// IF97's 100 MPa is never shown as a value, only as "above 100 MPa".

import { saturationTemperature } from '../steam/index.ts';
import type { Caution, CheckResult, FillPlan } from './check-result.ts';
import { caution, celsius, joined, kelvinDifference, kilograms, kilopascal, say, type CautionWording } from './cautions.ts';
import { gaugeLimitsPa, SITE_ATMOSPHERE_TOLERANCE_PA } from './uncertainty.ts';
import { DEFAULT_RELIEF_SET_TOLERANCE_PERCENT, isSteamHeated, type VesselSpec } from './vessel-spec.ts';

/** Everything of a result the rules read: the result before its cautions are split. */
export type CheckFigures = Omit<CheckResult, 'findings' | 'standing' | 'outcome' | 'cautions'>;

/** Scald threshold, K: 60 °C water gives a full-thickness burn in about 5 s (American Burn Association educator's guide "Scalds: A Burning Issue"; its data go back to Moritz & Henriques 1947, from memory). */
export const SCALD_TEMPERATURE_K = 333.15;

/** Steriliser load temperature below which the door is commonly let open on a fluid cycle, K (80 °C for glass; from memory). */
export const LOAD_OPENING_TEMPERATURE_K = 353.15;

/**
 * Fraction of the relief set pressure at which a reading is flagged: conventional relief valves
 * want the operating pressure about 10 % below set to avoid simmer and premature opening (API RP
 * 521 Fig. 2 shows a 10 % margin, per http://instrumentation.processengineer.info/relief-device-set-pressures.html ;
 * the ~10 % below set for conventional valves per an eng-tips thread on PSV set pressure; flagging
 * at 90 % as the usual operating-margin convention is from memory).
 */
export const NEAR_LIMIT_FRACTION = 0.9;

/** A figure of a hydraulic pressure: its gauge value, or "above 100 MPa" beyond IF97 (never the cap as a value). */
function hydraulicWords(absolutePa: number | null, atmospherePa: number): CautionWording {
  return absolutePa === null ? say`above 100 MPa (beyond IF97)` : say`${kilopascal(absolutePa - atmospherePa)} gauge`;
}

/** The cautions one evaluated check raises, in no particular order (cautions.ts sorts and splits them). */
export function raiseCheckCautions(vessel: VesselSpec, result: CheckFigures): Caution[] {
  const out: Caution[] = [];
  const r = result.reading;
  const T = r.temperatureK;
  const gauge = r.gaugePressurePa;
  const inv = result.inventory;
  const atm = r.atmospherePa;
  const cooled = result.hazards.cooled;

  // Liquid-full now, certain or within the weighing band.
  if (inv.regime === 'liquid-full') {
    const h = inv.hydraulic;
    const range = joined(hydraulicWords(h.band.lowAbsolutePa, atm), say` to `, hydraulicWords(h.band.highAbsolutePa, atm));
    if (inv.withinWeighingBand) {
      out.push(caution('liquid-full-within-band', joined(
        say`By weight the vessel is liquid-full at ${celsius(T)}, but within the weight, volume and temperature limits it could still hold a little vapour space. `,
        say`Treat it as liquid-full: this fill would be at `, range, say` (MAWP ${kilopascal(vessel.mawpGaugePa)} gauge). Stop heating and check the weight.`)));
    } else {
      out.push(caution('liquid-full-now', joined(
        say`The vessel is liquid-full at ${celsius(T)}: no vapour space is left, and within the limits this fill would be at `, range,
        say` (MAWP ${kilopascal(vessel.mawpGaugePa)} gauge). Pressure rises by several bar per kelvin of further heating and no longer follows saturation. Stop heating and check the weight.`)));
    }
  } else if (inv.regime === 'two-phase' && inv.liquidFullWithinBand) {
    out.push(caution('liquid-full-within-band', joined(
      say`Within the weight, temperature and volume limits the contents could be liquid-full at ${celsius(T)} (quality ${(100 * inv.quality).toFixed(2)} %, `,
      say`its band reaching 0). Treat the vessel as liquid-full until the weight is checked: do not heat it further.`)));
  }

  // Pressure limits, judged with the gauge's own band (class, indicator, drift) and, at the relief
  // set pressure, the valve's set-pressure tolerance as well (root-sum-square, like the verdicts).
  const gaugeBandPa = gaugeLimitsPa(vessel.instruments).combined;
  const set = vessel.reliefSetGaugePa;
  const setTolerancePa = ((vessel.reliefSetTolerancePercent ?? DEFAULT_RELIEF_SET_TOLERANCE_PERCENT) / 100) * set;
  const reliefBandPa = Math.hypot(gaugeBandPa, setTolerancePa);
  const within = say`within the gauge's accuracy (±${kilopascal(gaugeBandPa)})`;
  if (gauge > vessel.mawpGaugePa) {
    out.push(caution('pressure-above-mawp', say`Gauge pressure ${kilopascal(gauge)} is above the MAWP (${kilopascal(vessel.mawpGaugePa)} gauge). Reduce the heat input now and follow the overpressure procedure.`));
  } else if (gauge >= vessel.mawpGaugePa - gaugeBandPa) {
    out.push(caution('pressure-at-mawp', joined(
      say`Gauge pressure ${kilopascal(gauge)} is at the MAWP (${kilopascal(vessel.mawpGaugePa)} gauge) `, within,
      set < vessel.mawpGaugePa ? say`, above the relief set pressure (${kilopascal(set)} gauge): the relief valve should be discharging.` : say`: the relief valve, set at the MAWP, may be relieving.`,
      say` Reduce the heat input now.`)));
  } else if (gauge > set + reliefBandPa) {
    out.push(caution('pressure-above-relief-set', joined(
      say`Gauge pressure ${kilopascal(gauge)} is above the relief set pressure (${kilopascal(set)} gauge) by more than the gauge's accuracy and the valve's set tolerance `,
      say`together (±${kilopascal(reliefBandPa)}): the relief valve should be discharging. Check that it is, and reduce the heat input.`)));
  } else if (gauge >= set - gaugeBandPa) {
    out.push(caution('pressure-at-relief-set', joined(
      say`Gauge pressure ${kilopascal(gauge)} is at the relief set pressure (${kilopascal(set)} gauge) within the gauge's accuracy and the valve's set tolerance `,
      say`(±${kilopascal(reliefBandPa)} together): the relief valve may be lifting or simmering.`)));
  } else if (gauge >= NEAR_LIMIT_FRACTION * set) {
    out.push(caution('pressure-near-relief-set', joined(
      say`Gauge pressure ${kilopascal(gauge)} is ${(100 * gauge / set).toFixed(0)} % of the relief set pressure (${kilopascal(set)} gauge); `,
      say`readings from ${(100 * NEAR_LIMIT_FRACTION).toFixed(0)} % up are flagged.`)));
  }
  if (!vessel.vacuumRated && gauge < -gaugeBandPa) {
    out.push(caution('vacuum-now', vessel.vacuumBreaker
      ? say`Gauge pressure ${kilopascal(gauge)}: the vessel is below atmosphere now and is not rated for vacuum; its vacuum breaker should have opened. Vent it or stop cooling, and check the breaker.`
      : say`Gauge pressure ${kilopascal(gauge)}: the vessel is below atmosphere now and is not rated for vacuum. Open a vent or stop cooling before it buckles.`));
  }
  const env = result.envelope;
  if (env && env.first.event === 'liquid-full' && inv.regime !== 'liquid-full') {
    out.push(caution('liquid-full-on-heating', joined(
      say`This fill goes liquid-full at ${celsius(env.first.temperatureK)}, before the steam reaches the relief set pressure`,
      env.reliefSetTemperatureK === null ? say`` : say` (${celsius(env.reliefSetTemperatureK)})`,
      say`. Heating past it gives hydraulic overpressure.`)));
  }
  if (cooled.direction === 'warming' && inv.regime !== 'liquid-full' && (cooled.contents === 'liquid-full' || cooled.contents === 'beyond-formulation')) {
    out.push(caution('liquid-full-on-warming', joined(
      say`Left sealed, this fill warms to its ambient ${celsius(cooled.temperatureK)} and goes liquid-full: it would reach `,
      hydraulicWords(cooled.absolutePressurePa, atm), say` (MAWP ${kilopascal(vessel.mawpGaugePa)} gauge). Keep a vent or relief path open, or draw off water.`)));
  }
  if (T > vessel.designTemperatureK) {
    out.push(caution('above-design-temperature', say`Temperature ${celsius(T)} is above the design temperature (${celsius(vessel.designTemperatureK)}).`));
  }

  // What the gauge and thermometer say together.
  const sat = result.saturation;
  const v = sat.verdict;
  if (inv.regime === 'liquid-full') {
    // Pressure above saturation is what a liquid-full vessel does; reading it as air would mislead.
    // Instead the gauge is held to the hydraulic band.
    const b = inv.hydraulic.band;
    const c = sat.pressureBand.contributions;
    const instrumentPa = Math.hypot(c.pressureGauge, c.atmosphere, c.pressureGaugeIndicator, c.pressureGaugeDrift);
    const p = r.absolutePressurePa;
    const below = b.lowAbsolutePa !== null && p < b.lowAbsolutePa - instrumentPa;
    const above = b.highAbsolutePa !== null && p > b.highAbsolutePa + instrumentPa;
    if (below || above) {
      out.push(caution('hydraulic-pressure-mismatch', joined(
        say`By weight the vessel is liquid-full, so it would be at `, hydraulicWords(b.lowAbsolutePa, atm), say` to `, hydraulicWords(b.highAbsolutePa, atm),
        say`, not the ${kilopascal(gauge)} gauge read. Check the tare, the weight and the volume.`)));
    }
  } else if (v.verdict === 'pressure-above-saturation') {
    const g = v.noncondensableGas;
    out.push(caution('noncondensable-gas', joined(
      say`Pressure is ${kilopascal(g.partialPressurePa)} above saturation for ${celsius(T)}: air or another non-condensable gas is likely `,
      say`(about ${(100 * g.moleFraction).toFixed(1)} % by mole), or the thermometer reads low. The steam is ${kelvinDifference(g.temperatureShortfallK)} `,
      say`colder than the gauge implies; for sterilisation, the load may not reach temperature.`)));
  } else if (v.verdict === 'pressure-below-saturation') {
    out.push(caution('pressure-below-saturation', joined(
      say`Pressure is ${kilopascal(-sat.pressureDeviationPa)} below saturation for ${celsius(T)}: suspect a gauge or thermometer fault, `,
      say`a wrong atmospheric pressure, or a vessel not at equilibrium${v.superheatPossible ? '; with no liquid present it can be superheated vapour' : ''}.`)));
  } else {
    out.push(caution('saturation-check-limits', joined(
      say`Pressure and temperature agree with saturated steam within ±${kelvinDifference(sat.temperatureBandK.plusMinus, 2)} (root-sum-square of the instrument limits). `,
      say`At this reading the band can hide about ${(100 * sat.airDetectionLimit).toFixed(1)} % air or other gas by mole: agreement means less than that, not none, `,
      say`and does not replace an air-removal or non-condensable gas test.`)));
  }
  const a = result.atmosphere;
  const elevation = a.siteElevationM === null ? 'outside the standard atmosphere\'s range' : `the standard atmosphere at about ${Math.round(a.siteElevationM)} m elevation`;
  if (r.atmosphereSource === 'site' && sat.pressureBand.contributions.atmosphere > 0) {
    out.push(caution('atmosphere-assumed', joined(
      say`Gauge pressure was converted with the stored site atmosphere, ${kilopascal(a.sitePa)} (${elevation}); weather moves it by a few kPa. `,
      say`A barometer reading narrows the band.`)));
  }
  if (a.differencePa !== null && a.measuredPa !== null && Math.abs(a.differencePa) > a.weatherBandPa) {
    out.push(caution('site-atmosphere-differs', joined(
      say`The barometer reads ${kilopascal(a.measuredPa)} but the vessel's stored site atmosphere is ${kilopascal(a.sitePa)} (${elevation}): `,
      say`they differ by ${kilopascal(Math.abs(a.differencePa))}, more than weather moves it (±${kilopascal(SITE_ATMOSPHERE_TOLERANCE_PA)}). `,
      say`Correct the stored value: checks without a barometer are converted with it.`)));
  }

  if (inv.regime === 'superheated') {
    if (Math.abs(inv.differenceFromReadingPa) > inv.differenceBandPa) {
      out.push(caution('superheated-pressure-mismatch',
        say`By weight there is no liquid: this mass of vapour would be at ${kilopascal(inv.absolutePressurePa)} absolute, not the ${kilopascal(r.absolutePressurePa)} read. Check the tare, the weight and the volume.`));
    }
  }
  if (inv.regime === 'two-phase') {
    const q = result.inventoryBands?.quality;
    if (q?.undetermined) {
      const why = { 'near-critical-point': 'near the critical point, where liquid and vapour become alike', 'weight-tolerance-exceeds-contents': 'the weight tolerance is as large as the contents', 'band-spans-regime': 'the tolerances together span the whole two-phase range' }[q.undetermined.reason];
      out.push(caution('quality-undetermined', `Within the tolerances the quality could be anywhere from 0 to 100 % (${why}): the weighing says little about the split of liquid and steam here.`));
    }
    out.push(caution('bulk-quality-not-dryness', 'Quality here is the bulk vapour mass fraction of the vessel contents, not the dryness of supply steam (EN 285 dryness value).'));
  }

  raiseStandingHazards(vessel, result, gaugeBandPa, out);
  return out;
}

/** Hazards of hot contents whatever the reading says. */
function raiseStandingHazards(vessel: VesselSpec, result: CheckFigures, gaugeBandPa: number, out: Caution[]): void {
  const r = result.reading;
  const T = r.temperatureK;
  const gauge = r.gaugePressurePa;
  const inv = result.inventory;
  const cooled = result.hazards.cooled;
  if (gauge + gaugeBandPa > 0) {
    out.push(caution('do-not-open-under-pressure', gauge > 0
      ? say`The gauge reads ${kilopascal(gauge)} above atmosphere: opening a door, cover or fitting now releases that pressure at once. Keep it closed until the pressure is relieved and the opening procedure (lockout/tagout) allows it.`
      : say`The gauge reads ${kilopascal(gauge)}, within its accuracy (±${kilopascal(gaugeBandPa)}) of atmosphere: some pressure may remain. Vent to atmosphere before opening a door, cover or fitting, as the opening procedure (lockout/tagout) says.`));
  }
  const flash = result.hazards.flash;
  if (flash && flash.flashFraction > 0) {
    out.push(caution('flash-on-release',
      `Liquid released to atmosphere flashes: ${(100 * flash.flashFraction).toFixed(1)} % turns to steam, about ${Math.round(flash.volumeRatio)} times the liquid volume. ` +
      'Opening a drain, vent, sight-glass cock or door makes a scalding jet.'));
  }
  if (cooled.direction === 'cooling' && cooled.noncondensablePartialPressurePa > 0 && cooled.gaugePressurePa !== null && cooled.gaugePressurePa > 0) {
    out.push(caution('pressure-after-cooling',
      say`Cooled to ${celsius(cooled.temperatureK)} the gauge would still read ${kilopascal(cooled.gaugePressurePa)}: the gas keeps the vessel above atmosphere. A cold vessel is not a depressurised one.`));
  }
  if (cooled.belowAtmosphere && cooled.gaugePressurePa !== null) {
    if (cooled.collapseRisk) {
      out.push(caution('vacuum-on-cooling', joined(
        say`Cooled to ${celsius(cooled.temperatureK)} the vessel falls to ${kilopascal(cooled.gaugePressurePa)} gauge and it is neither rated for vacuum nor fitted with a vacuum breaker: `,
        say`keep a vent open before it cools sealed.`)));
    } else {
      out.push(caution('vacuum-on-cooling-protected', joined(
        say`Cooled to ${celsius(cooled.temperatureK)} the vessel falls to ${kilopascal(cooled.gaugePressurePa)} gauge; `,
        cooled.vacuumRated ? say`it is rated for vacuum.` : say`its vacuum breaker must open to protect it: keep the breaker free and working.`)));
    }
  }
  const steamSpace = inv.regime === 'two-phase' || inv.regime === 'superheated' || inv.regime === 'not-weighed';
  if (steamSpace && !vessel.vacuumRated && T > saturationTemperature(r.atmospherePa)) {
    out.push(caution('quench-vacuum',
      'Cold water sprayed or run into the vessel now condenses its steam faster than a vent or vacuum breaker admits air: the pressure can fall below atmosphere in seconds and collapse a vessel not rated for vacuum.'));
  }
  if (isSteamHeated(vessel) || vessel.service === 'flash-tank' || vessel.service === 'condensate-receiver') {
    out.push(caution('water-hammer',
      'Admitting steam to a flooded or cold line, coil or jacket drives slugs of condensate (water hammer): drain the condensate first and open steam valves slowly.'));
  }
  if (isSteamHeated(vessel)) {
    out.push(caution('hot-surface',
      say`Jacket, coil and steam-heated surfaces run at the steam's temperature, at least ${celsius(T)} here: bare metal burns on contact. Keep lagging in place and wear heat-resistant gloves.`));
  }
  if (T >= SCALD_TEMPERATURE_K) {
    out.push(caution('scald', say`Contents at ${celsius(T)}: contact scalds within seconds. Wear face, eye and hand protection.`));
  }
  if (cooled.freezes) {
    out.push(caution('freezing', joined(
      say`The vessel's ambient is below 0 °C: idle water freezes, which can burst the vessel or its lines and block relief, drain and instrument connections. `,
      say`Drain it or keep it heated, and thaw slowly with the vents open.`)));
  }
  if (vessel.service === 'steriliser' && T >= LOAD_OPENING_TEMPERATURE_K) {
    out.push(caution('boil-over-on-opening', joined(
      say`Sealed liquids in the load stay hotter than the chamber reads and above their boiling point after the pressure falls: `,
      say`opening the door early can make bottles burst or boil over. Wait for the cycle's load cooling and the door interlock; wear face and hand protection.`)));
  }
}

/** The cautions one fill plan raises, in no particular order. */
export function raisePlanCautions(vessel: VesselSpec, plan: Omit<FillPlan, 'cautions'>): Caution[] {
  const out: Caution[] = [];
  if (plan.startState.regime === 'liquid-full') {
    out.push(caution('plan-does-not-fit', say`The charge does not fit: at the start temperature ${celsius(plan.startTemperatureK)} it would already fill the vessel with liquid.`));
  }
  const largest = plan.largestTwoPhaseCharge;
  if (plan.waterMassKg > largest.waterMassKg) {
    out.push(caution('plan-exceeds-two-phase-charge', joined(
      say`The charge (${kilograms(plan.waterMassKg)}) is more than the largest charge that stays two-phase up to ${celsius(largest.limitTemperatureK)} (${kilograms(largest.waterMassKg)}): `,
      plan.envelope.liquidFullTemperatureK === null ? say`it goes liquid-full at no temperature, ` : say`it goes liquid-full at ${celsius(plan.envelope.liquidFullTemperatureK)}, `,
      say`inside the margin above the relief set pressure's saturation temperature.`)));
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
  return out;
}
