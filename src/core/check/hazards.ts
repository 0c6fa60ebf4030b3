// Hazard figures for one state of the contents: flash on release to atmosphere, stored energy,
// margins to MAWP and relief set pressure, and the pressure left after cooling to ambient.
// Flash: the enthalpy balance (h₁ − h_f,atm)/h_fg,atm, as in US DOE Steam Tip Sheet #12 "Flash
// High-Pressure Condensate to Regenerate Low-Pressure Steam". Stored energy: the usual vessel-burst
// energy estimate (isentropic expansion; method from memory). Vacuum collapse of a closed vessel as
// its steam condenses: https://technewsources.com/tank-trailer-vacuum-collapse/ and
// https://www.universalengineeringconsultants.com/post/storage-tank-implosion-design-of-storage-tanks .
// Margins: MAWP is the maximum gauge pressure at the top of the vessel, the basis of the relief
// setting (ASME BPVC Section VIII Div. 1 definition).

import { IF97, saturation, saturationPressure, saturationTemperature, stateTP, type SaturationState } from '../steam/index.ts';
import { contentsState } from './inventory.ts';

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

/** Both saturated phases at an atmospheric pressure, Pa: what the flash and the stored energy expand to. */
export function atmosphereSaturation(atmospherePa: number): SaturationState {
  return saturation(saturationTemperature(atmospherePa));
}

/**
 * Flash of liquid with specific enthalpy h₁ (J/kg) and specific volume v₁ (m³/kg) released
 * adiabatically to atmospherePa (Pa, 30–110 kPa). liquidMassKg ≥ 0 or null. atm: atmosphereSaturation(atmospherePa),
 * when the caller has it already.
 */
export function flashOnRelease(h1: number, v1: number, atmospherePa: number, liquidMassKg: number | null, atm = atmosphereSaturation(atmospherePa)): FlashOnRelease {
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
 * vessel-burst energy estimate (method from memory). atmAtm: atmosphereSaturation(atmospherePa), when the
 * caller has it already.
 */
export function expansionWorkPerKgJ(u1: number, s1: number, p1: number, atmospherePa: number, atmAtm?: SaturationState): number {
  if (p1 <= atmospherePa) return 0;
  const atm = atmAtm ?? atmosphereSaturation(atmospherePa);
  const Tb = atm.T;
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
  /**
   * Temperature the sealed contents settle at, K: the vessel's ambient, but not below 273.15 K,
   * where IF97's water ends (`freezes` then says the ambient is colder).
   */
  temperatureK: number;
  /** Settling to ambient cools the contents, warms them (an ambient above the reading), or neither. */
  direction: 'cooling' | 'warming' | 'none';
  /** The contents at that temperature; 'assumed-two-phase' when not weighed (water assumed present). */
  contents: 'two-phase' | 'liquid-full' | 'superheated' | 'assumed-two-phase' | 'beyond-formulation';
  /** Pressure there, Pa absolute; null when liquid-full beyond IF97's 100 MPa (no figure is shown for it). */
  absolutePressurePa: number | null;
  /** The same as gauge, Pa; null with it. */
  gaugePressurePa: number | null;
  /** Part of that pressure from non-condensable gas carried over from the reading, Pa (none when the vessel is liquid-full now: no gas space). */
  noncondensablePartialPressurePa: number;
  belowAtmosphere: boolean;
  /** Liquid-full at that temperature beyond IF97's 100 MPa. */
  aboveFormulationLimit: boolean;
  /** The ambient is below 0 °C: the water would freeze; the figures are for 273.15 K. */
  freezes: boolean;
  vacuumRated: boolean;
  /** A vacuum breaker is fitted. */
  vacuumBreaker: boolean;
  /** Below atmosphere in a vessel neither rated for vacuum nor fitted with a vacuum breaker: it can collapse if sealed as it cools. */
  collapseRisk: boolean;
}

/** IF97's lowest temperature, K (IAPWS R7-97(2012)). */
const T_MIN_K = 273.15;

/**
 * Pressure after the sealed contents settle at ambient, cooling or warming. v: mean specific
 * volume, m³/kg, or null when not weighed (water is then assumed present, so the vapor space sits
 * at p_sat). Non-condensable gas at partial pressure p_gas (Pa) at T (K) is carried to ambient as
 * an ideal gas at constant volume; a vessel liquid-full now has no gas space, so none. A liquid-full
 * fill that goes two-phase on cooling sits at p_sat(ambient); one still full is at its hydraulic
 * pressure there (warming a full vessel raises it steeply).
 */
export function cooledState(args: {
  ambientTemperatureK: number;
  meanSpecificVolumeM3PerKg: number | null;
  noncondensablePartialPressurePa: number;
  /** The contents are liquid-full at the reading. */
  liquidFullNow: boolean;
  temperatureK: number;
  atmospherePa: number;
  vacuumRated: boolean;
  vacuumBreaker: boolean;
}): CooledState {
  const Tc = Math.max(T_MIN_K, args.ambientTemperatureK);
  let waterPa: number | null = saturationPressure(Tc);
  let contents: CooledState['contents'] = 'assumed-two-phase';
  if (args.meanSpecificVolumeM3PerKg !== null) {
    const v = args.meanSpecificVolumeM3PerKg;
    const found = contentsState(Tc, v);
    if (found.kind !== 'state') {
      contents = 'beyond-formulation';
      waterPa = null;
    } else {
      const st = found.state;
      waterPa = st.p;
      contents = st.phase === 'two-phase' ? 'two-phase'
        : st.phase === 'compressed-liquid' || (st.phase === 'supercritical' && v < 1 / IF97.rhoc) ? 'liquid-full' : 'superheated';
    }
  }
  const gasPa = args.liquidFullNow ? 0 : args.noncondensablePartialPressurePa * (Tc / args.temperatureK);
  const absolutePressurePa = waterPa === null ? null : waterPa + gasPa;
  const gaugePressurePa = absolutePressurePa === null ? null : absolutePressurePa - args.atmospherePa;
  const belowAtmosphere = gaugePressurePa !== null && gaugePressurePa < 0;
  return {
    temperatureK: Tc,
    direction: Tc < args.temperatureK ? 'cooling' : Tc > args.temperatureK ? 'warming' : 'none',
    contents,
    absolutePressurePa,
    gaugePressurePa,
    noncondensablePartialPressurePa: gasPa,
    belowAtmosphere,
    aboveFormulationLimit: contents === 'beyond-formulation',
    freezes: args.ambientTemperatureK < T_MIN_K,
    vacuumRated: args.vacuumRated,
    vacuumBreaker: args.vacuumBreaker,
    collapseRisk: belowAtmosphere && !args.vacuumRated && !args.vacuumBreaker,
  };
}
