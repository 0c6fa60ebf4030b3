// Hazard figures for one state of the contents: flash on release to atmosphere, stored energy,
// margins to MAWP and relief set pressure, and the pressure left after cooling to ambient.
// Flash: the enthalpy balance (h₁ − h_f,atm)/h_fg,atm, as in US DOE Steam Tip Sheet #12 "Flash
// High-Pressure Condensate to Regenerate Low-Pressure Steam". Stored energy: the usual vessel-burst
// energy estimate (isentropic expansion; method from memory). Vacuum collapse of a closed vessel as
// its steam condenses: https://technewsources.com/tank-trailer-vacuum-collapse/ and
// https://www.universalengineeringconsultants.com/post/storage-tank-implosion-design-of-storage-tanks .
// Margins: MAWP is the maximum gauge pressure at the top of the vessel, the basis of the relief
// setting (ASME BPVC Section VIII Div. 1 definition).

import { saturation, saturationPressure, saturationTemperature, stateTP } from '../steam/index.ts';
import { contentsState, IF97_MAX_PRESSURE_PA } from './inventory.ts';

/** Energy of TNT used for equivalence, J/kg (4.184 MJ/kg, the conventional figure; common practice). */
export const TNT_ENERGY_J_PER_KG = 4.184e6;

export interface FlashOnRelease {
  /** Mass fraction of the liquid that flashes to steam, (h₁ − h_f,atm)/h_fg,atm, ≥ 0. */
  flashFraction: number;
  /** Flash steam at atmospheric pressure per kg of liquid released, m³/kg. */
  flashSteamVolumePerKgM3: number;
  /** Flash steam volume per volume of liquid released. */
  volumeRatio: number;
  /** Flash steam volume if all the liquid in the vessel were released, m³; null when not weighed. */
  totalFlashSteamVolumeM3: number | null;
}

/**
 * Flash of liquid with specific enthalpy h₁ (J/kg) and specific volume v₁ (m³/kg) released
 * adiabatically to atmospherePa (Pa, 30–110 kPa). liquidMassKg ≥ 0 or null.
 */
export function flashOnRelease(h1: number, v1: number, atmospherePa: number, liquidMassKg: number | null): FlashOnRelease {
  const atm = saturation(saturationTemperature(atmospherePa));
  const flashFraction = Math.max(0, (h1 - atm.liquid.h) / (atm.vapor.h - atm.liquid.h));
  const perKg = flashFraction * atm.vapor.v;
  return {
    flashFraction,
    flashSteamVolumePerKgM3: perKg,
    volumeRatio: perKg / v1,
    totalFlashSteamVolumeM3: liquidMassKg === null ? null : liquidMassKg * perKg,
  };
}

/**
 * Work of an isentropic expansion to atmosphere of 1 kg with internal energy u₁ (J/kg), entropy
 * s₁ (J/(kg·K)) and pressure p₁ (Pa): u₁ − u₂(s₁, p_atm), ≥ 0 (0 when p₁ ≤ p_atm). The usual
 * vessel-burst energy estimate (method from memory).
 */
export function expansionWorkPerKgJ(u1: number, s1: number, p1: number, atmospherePa: number): number {
  if (p1 <= atmospherePa) return 0;
  const Tb = saturationTemperature(atmospherePa);
  const atm = saturation(Tb);
  let u2: number;
  if (s1 >= atm.liquid.s && s1 <= atm.vapor.s) {
    const x = (s1 - atm.liquid.s) / (atm.vapor.s - atm.liquid.s);
    u2 = atm.liquid.u + x * (atm.vapor.u - atm.liquid.u);
  } else if (s1 < atm.liquid.s) {
    u2 = stateAtEntropy(s1, atmospherePa, 273.16, Tb - 1e-6).u;
  } else {
    u2 = stateAtEntropy(s1, atmospherePa, Tb + 1e-6, 1073.15).u;
  }
  return Math.max(0, u1 - u2);
}

/** Single-phase state at pressure p with entropy s, by bisection in T on [lo, hi] (s rises with T at fixed p); clamped at the ends. */
function stateAtEntropy(s: number, p: number, lo: number, hi: number) {
  if (stateTP(lo, p).s >= s) return stateTP(lo, p);
  if (stateTP(hi, p).s <= s) return stateTP(hi, p);
  for (let i = 0; i < 60; i++) {
    const mid = 0.5 * (lo + hi);
    if (stateTP(mid, p).s < s) lo = mid;
    else hi = mid;
  }
  return stateTP(0.5 * (lo + hi), p);
}

export interface PressureMargin {
  /** Limit minus the measured gauge pressure, Pa (negative when above the limit). */
  marginPa: number;
  /** Measured gauge pressure / limit. */
  fractionOfLimit: number;
}

/** Margin of a gauge pressure (Pa) to a gauge limit (Pa, > 0). */
export function pressureMargin(gaugePressurePa: number, limitGaugePa: number): PressureMargin {
  return { marginPa: limitGaugePa - gaugePressurePa, fractionOfLimit: gaugePressurePa / limitGaugePa };
}

export interface CooledState {
  /** Temperature the contents cool to, K (ambient, but not below 273.16 K where IF97 water ends). */
  temperatureK: number;
  absolutePressurePa: number;
  gaugePressurePa: number;
  /** Part of that pressure from non-condensable gas carried over from the reading, Pa. */
  noncondensablePartialPressurePa: number;
  belowAtmosphere: boolean;
  /** Liquid-full even when cold beyond IF97's 100 MPa: the pressure fields then hold that limit, a lower bound. */
  aboveFormulationLimit: boolean;
  vacuumRated: boolean;
  /** Below atmosphere in a vessel not rated for vacuum: it can collapse if sealed as it cools. */
  collapseRisk: boolean;
}

/**
 * Pressure after the sealed contents cool to ambient. v: mean specific volume, m³/kg, or null when
 * not weighed (water is then assumed present, so the vapor space sits at p_sat). Non-condensable
 * gas at partial pressure p_gas (Pa) at T (K) is carried down as an ideal gas at constant volume.
 */
export function cooledState(args: {
  ambientTemperatureK: number;
  meanSpecificVolumeM3PerKg: number | null;
  noncondensablePartialPressurePa: number;
  temperatureK: number;
  atmospherePa: number;
  vacuumRated: boolean;
}): CooledState {
  const Tc = Math.max(273.16, args.ambientTemperatureK);
  let waterPa = saturationPressure(Tc);
  let aboveFormulationLimit = false;
  if (args.meanSpecificVolumeM3PerKg !== null) {
    const found = contentsState(Tc, args.meanSpecificVolumeM3PerKg);
    aboveFormulationLimit = found.kind !== 'state';
    waterPa = found.kind === 'state' ? found.state.p : IF97_MAX_PRESSURE_PA;
  }
  const gasPa = args.noncondensablePartialPressurePa * (Tc / args.temperatureK);
  const absolutePressurePa = waterPa + gasPa;
  const gaugePressurePa = absolutePressurePa - args.atmospherePa;
  const belowAtmosphere = gaugePressurePa < 0;
  return {
    temperatureK: Tc,
    absolutePressurePa,
    gaugePressurePa,
    noncondensablePartialPressurePa: gasPa,
    belowAtmosphere,
    aboveFormulationLimit,
    vacuumRated: args.vacuumRated,
    collapseRisk: belowAtmosphere && !args.vacuumRated,
  };
}
