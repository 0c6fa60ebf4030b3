// From one reading on one vessel to a verdict, an inventory with ± bands, the heat-up envelope,
// the hazard figures, and the cautions that apply: the findings about the vessel now (which give
// the outcome) apart from the standing hazards. Pure, SI, plain serialisable data out.

import { InputError } from '../errors.ts';
import { FORMULATION_ID, saturation } from '../steam/index.ts';
import { elevationFromAtmosphere } from '../units/atmosphere.ts';
import type { AtmosphereCheck, CheckResult, Hazards } from './check-result.ts';
import { raiseCheckCautions, type CheckFigures } from './check-rules.ts';
import { outcomeOf, sortedCautions } from './cautions.ts';
import { heatUpEnvelope } from './heat-up-envelope.ts';
import { atmosphereSaturation, cooledState, expansionWorkPerKgJ, flashOnRelease, pressureMargin, TNT_ENERGY_J_PER_KG, type FlashOnRelease } from './hazards.ts';
import { idealGasComparison } from './ideal-gas.ts';
import { contentsState, inventoryOf } from './inventory.ts';
import { resolveReading, type Reading, type ResolvedReading } from './reading.ts';
import { checkSaturation, type SaturationCheck } from './saturation-consistency.ts';
import { gaugeLimitsPa, inventoryBands, netMassToleranceKg, pressureTolerancesPa, SITE_ATMOSPHERE_TOLERANCE_PA, thermometerLimitsK } from './uncertainty.ts';
import { requireFiniteData } from './finite-data.ts';
import { levelSolver, vesselVolume } from './vessel-geometry.ts';
import { validateVessel, type VesselSpec } from './vessel-spec.ts';

export type { CheckResult, Hazards } from './check-result.ts';

/** Largest v = V/m the steam engine's stateTV accepts, m³/kg (its documented range). */
const MAX_SPECIFIC_VOLUME_M3_PER_KG = 1e9;

/**
 * Evaluates one reading on one vessel (all SI: K, Pa, kg, m³). Validates both first; throws
 * InputError naming the field and its valid range (see validateVessel and resolveReading).
 */
export function evaluateCheck(vessel: VesselSpec, reading: Reading): CheckResult {
  validateVessel(vessel);
  const r = resolveReading(vessel, reading);
  const V = vesselVolume(vessel.geometry);
  if (r.netMassKg !== null && V / r.netMassKg > MAX_SPECIFIC_VOLUME_M3_PER_KG) {
    // Milligrams in a vessel: below what stateTV accepts, and far below any scale's resolution.
    const field = reading.weight.kind === 'gross' ? 'gross weight' : 'net weight';
    const minNet = V / MAX_SPECIFIC_VOLUME_M3_PER_KG;
    const min = reading.weight.kind === 'gross' ? vessel.tareKg + minNet : minNet;
    throw new InputError(field, 'out-of-range', reading.weight.kind === 'gross' ? reading.weight.grossKg : r.netMassKg,
      { min, max: 1e7, unit: 'kg' }, `${field}: the contents are too light to evaluate; the net weight must be at least ${minNet} kg.`);
  }
  const T = r.temperatureK;
  const sat = saturation(T);
  const pTol = pressureTolerancesPa(vessel, r, reading.pressure.reference);
  const temperatureLimitK = thermometerLimitsK(vessel.instruments, T).combined;
  const massToleranceKg = reading.weight.kind === 'not-weighed' ? 0 : netMassToleranceKg(vessel, reading.weight.kind);

  // One level solver for the check's level and the level band's six: each solve starts from the last.
  const levelAt = vessel.geometry.shape === 'stated-volume' ? undefined : levelSolver(vessel.geometry);
  const inventory: CheckResult['inventory'] =
    r.netMassKg === null
      ? { regime: 'not-weighed' }
      : inventoryOf({
          geometry: vessel.geometry,
          volumeM3: V,
          netMassKg: r.netMassKg,
          temperatureK: T,
          atmospherePa: r.atmospherePa,
          mawpGaugePa: vessel.mawpGaugePa,
          measuredAbsolutePressurePa: r.absolutePressurePa,
          // The gauge's own limits combined first: with no indicator or drift that is its class alone, exactly.
          measuredPressureBandPa: Math.hypot(gaugeLimitsPa(vessel.instruments).combined, pTol.atmosphere),
          massRelativeTolerance: massToleranceKg / r.netMassKg,
          volumeRelativeTolerance: vessel.instruments.volumeTolerancePercent / 100,
          temperatureToleranceK: temperatureLimitK,
          levelAt,
        });
  const liquidPresent = inventory.regime === 'not-weighed' ? null : inventory.regime !== 'superheated';
  const saturationCheck = checkSaturation(vessel, r, reading.pressure.reference, liquidPresent);

  const bands =
    inventory.regime === 'two-phase' && reading.weight.kind !== 'not-weighed'
      ? inventoryBands({
          geometry: vessel.geometry,
          temperatureK: T,
          massKg: inventory.netMassKg,
          volumeM3: V,
          massToleranceKg,
          temperatureToleranceK: temperatureLimitK,
          volumeToleranceM3: (vessel.instruments.volumeTolerancePercent / 100) * V,
          levelAt,
        })
      : null;
  if (inventory.regime === 'two-phase' && bands) inventory.liquidFullWithinBand = bands.quality.low <= 0;

  const envelope =
    r.netMassKg === null
      ? null
      : heatUpEnvelope({
          volumeM3: V,
          massKg: r.netMassKg,
          startTemperatureK: T,
          reliefSetGaugePa: vessel.reliefSetGaugePa,
          mawpGaugePa: vessel.mawpGaugePa,
          atmospherePa: r.atmospherePa,
        });

  const hazards = hazardsOf(vessel, r, inventory, sat, saturationCheck, V);
  const vapor =
    inventory.regime === 'superheated'
      ? idealGasComparison(T, inventory.absolutePressurePa, inventory.meanSpecificVolumeM3PerKg)
      : idealGasComparison(T, sat.p, sat.vapor.v);

  const figures: CheckFigures = {
    resultVersion: 2,
    formulationId: FORMULATION_ID,
    reading: r,
    internalVolumeM3: V,
    saturation: saturationCheck,
    inventory,
    inventoryBands: bands,
    envelope,
    hazards,
    idealGas: vapor,
    atmosphere: atmosphereCheck(vessel, r),
  };
  const { findings, standing, cautions } = sortedCautions(raiseCheckCautions(vessel, figures));
  // `cautions` holds the very objects of `findings` and `standing`, so it is not walked again.
  const checked = requireFiniteData({ ...figures, findings, standing });
  return { ...checked, outcome: outcomeOf(findings), cautions };
}

function atmosphereCheck(vessel: VesselSpec, r: ResolvedReading): AtmosphereCheck {
  const sitePa = vessel.siteAtmospherePa;
  const measuredPa = r.atmosphereSource === 'measured' ? r.atmospherePa : null;
  return {
    sitePa,
    siteElevationM: impliedElevationM(sitePa),
    measuredPa,
    differencePa: measuredPa === null ? null : measuredPa - sitePa,
    weatherBandPa: SITE_ATMOSPHERE_TOLERANCE_PA,
  };
}

/** The US Standard Atmosphere 1976 elevation of a pressure, m, or null outside its troposphere (−500 to 11 000 m; a stored 108 kPa is below it). */
function impliedElevationM(atmospherePa: number): number | null {
  try {
    return elevationFromAtmosphere(atmospherePa);
  } catch (e) {
    if (e instanceof InputError) return null;
    throw e;
  }
}

function hazardsOf(
  vessel: VesselSpec,
  r: ResolvedReading,
  inventory: CheckResult['inventory'],
  sat: ReturnType<typeof saturation>,
  check: SaturationCheck,
  V: number,
): Hazards {
  const T = r.temperatureK;
  let flash: FlashOnRelease | null = null;
  let storedEnergy: Hazards['storedEnergy'] = null;
  // The flash and the stored energy both expand to the same atmosphere: its saturation once.
  let atmSat: ReturnType<typeof saturation> | undefined;
  const atm = () => (atmSat ??= atmosphereSaturation(r.atmospherePa));
  const energy = (workPerKg: number, m: number) => ({ expansionWorkJ: workPerKg * m, tntEquivalentKg: (workPerKg * m) / TNT_ENERGY_J_PER_KG });
  switch (inventory.regime) {
    case 'not-weighed':
      // Liquid assumed present at T: the flash figure per kg still holds.
      flash = flashOnRelease(sat.liquid.h, sat.liquid.v, r.atmospherePa, null, atm());
      break;
    case 'two-phase': {
      flash = flashOnRelease(sat.liquid.h, sat.liquid.v, r.atmospherePa, inventory.liquidMassKg, atm());
      const x = inventory.quality;
      const u = sat.liquid.u + x * (sat.vapor.u - sat.liquid.u);
      const s = sat.liquid.s + x * (sat.vapor.s - sat.liquid.s);
      storedEnergy = energy(expansionWorkPerKgJ(u, s, sat.p, r.atmospherePa, atm()), inventory.netMassKg);
      break;
    }
    case 'liquid-full': {
      const found = contentsState(T, inventory.meanSpecificVolumeM3PerKg);
      if (found.kind === 'state' && found.state.phase !== 'two-phase') {
        const st = found.state;
        flash = flashOnRelease(st.h, st.v, r.atmospherePa, inventory.netMassKg, atm());
        storedEnergy = energy(expansionWorkPerKgJ(st.u, st.s, st.p, r.atmospherePa, atm()), inventory.netMassKg);
      }
      break;
    }
    case 'superheated': {
      const found = contentsState(T, inventory.meanSpecificVolumeM3PerKg);
      if (found.kind === 'state' && found.state.phase !== 'two-phase') {
        const st = found.state;
        storedEnergy = energy(expansionWorkPerKgJ(st.u, st.s, st.p, r.atmospherePa, atm()), inventory.netMassKg);
      }
      break;
    }
  }
  const gas = check.verdict.verdict === 'pressure-above-saturation' ? check.verdict.noncondensableGas.partialPressurePa : 0;
  const cooled = cooledState({
    ambientTemperatureK: vessel.ambientTemperatureK,
    meanSpecificVolumeM3PerKg: inventory.regime === 'not-weighed' ? null : V / inventory.netMassKg,
    noncondensablePartialPressurePa: gas,
    liquidFullNow: inventory.regime === 'liquid-full',
    temperatureK: T,
    atmospherePa: r.atmospherePa,
    vacuumRated: vessel.vacuumRated,
    vacuumBreaker: vessel.vacuumBreaker ?? false,
  });
  return {
    flash,
    storedEnergy,
    mawpMargin: pressureMargin(r.gaugePressurePa, vessel.mawpGaugePa),
    reliefSetMargin: pressureMargin(r.gaugePressurePa, vessel.reliefSetGaugePa),
    cooled,
  };
}
