// A cycle type: the temperature band a sterilising hold must stay in, for how long, how closely the
// measured temperature must agree with the saturation temperature of the chamber pressure, and the
// F-value constants. Every site sets its own from its validated procedure; the defaults here are
// the usual ones and are marked with where they come from.

import { InputError, requireInRange } from '../errors.ts';
import { LETHALITY_DEFAULTS, LETHALITY_LIMITS } from './lethality.ts';

/** One cycle type, SI. The band runs from sterilisingTemperatureK − bandBelowK to sterilisingTemperatureK + bandAboveK. */
export interface CycleType {
  /** Sterilising temperature, K: the band's reference. */
  sterilisingTemperatureK: number;
  /** How far the band reaches above the sterilising temperature, K. */
  bandAboveK: number;
  /** How far the band reaches below the sterilising temperature, K (0 for a band of +3/−0 K). */
  bandBelowK: number;
  /** Hold time: how long the temperature must stay at or above the band's lower limit, s. */
  holdTimeS: number;
  /** Largest accepted |T − T_sat(p)| during the hold, K: the measured-against-theoretical temperature limit. */
  saturationLimitK: number;
  /** F-value constants: reference temperature K and z-value K. */
  lethality: { referenceTemperatureK: number; zK: number };
}

/** What a site enters: the sterilising temperature and hold time, anything else from the defaults. */
export type CycleTypeInput = Pick<CycleType, 'sterilisingTemperatureK' | 'holdTimeS'> &
  Partial<Omit<CycleType, 'sterilisingTemperatureK' | 'holdTimeS' | 'lethality'>> & {
    lethality?: Partial<CycleType['lethality']>;
  };

/**
 * Defaults for what a site does not set.
 * - Band +3/−0 K: from memory (EN 285 / ISO 17665-2 / HTM 01-01 Part C), corroborated by the
 *   121–124 °C band quoted as EN 285/HTM 2010 practice (shared/reference/field-practice.md §4.3).
 * - Measured against theoretical temperature within 2 K during the hold: from memory (EN 285 and
 *   EN 13060; field-practice.md §4.3).
 * - F₀ constants: see lethality.ts (from memory).
 */
export const CYCLE_TYPE_DEFAULTS = {
  bandAboveK: 3,
  bandBelowK: 0,
  saturationLimitK: 2,
  lethality: LETHALITY_DEFAULTS,
} as const;

/**
 * The two usual steam cycles: 121 °C for 15 min and 134 °C for 3 min (Central Sterilising Club,
 * *Principles of Medical Device Decontamination*, Table 10.2, via field-practice.md §4.1; common
 * practice). Every site sets its own.
 */
export const COMMON_CYCLE_TYPES = [
  { id: 'steam-121-15min', cycleType: /* @__PURE__ */ withDefaults(394.15, 15 * 60) },
  { id: 'steam-134-3min', cycleType: /* @__PURE__ */ withDefaults(407.15, 3 * 60) },
] as const satisfies readonly { id: string; cycleType: CycleType }[];

// A call marked pure rather than an object spread, so a build that never uses the list drops it.
function withDefaults(sterilisingTemperatureK: number, holdTimeS: number): CycleType {
  const { lethality, ...rest } = CYCLE_TYPE_DEFAULTS;
  return { sterilisingTemperatureK, holdTimeS, ...rest, lethality: { ...lethality } };
}

/** Valid ranges, SI. The sterilising temperature may be anywhere on IF97's saturation line. */
export const CYCLE_TYPE_LIMITS = {
  sterilisingTemperatureK: { min: 273.16, max: 647.096, unit: 'K' },
  bandAboveK: { min: 0, max: 20, unit: 'K' },
  bandBelowK: { min: 0, max: 20, unit: 'K' },
  holdTimeS: { min: 1, max: 86_400, unit: 's' },
  saturationLimitK: { min: 0.01, max: 20, unit: 'K' },
} as const;

/**
 * A complete cycle type from what was entered, defaults filled in. Throws InputError naming the
 * field: "sterilising temperature" (273.16–647.096 K), "band above the sterilising temperature" and
 * "band below the sterilising temperature" (0–20 K each, together above 0), "hold time"
 * (1–86 400 s), "saturation limit" (0.01–20 K), "F-value reference temperature" (273.16–647.096 K),
 * "z-value" (1–100 K).
 */
export function resolveCycleType(input: CycleTypeInput): CycleType {
  const L = CYCLE_TYPE_LIMITS;
  const D = CYCLE_TYPE_DEFAULTS;
  const inRange = (field: string, value: number, r: { min: number; max: number; unit: string }) =>
    requireInRange(field, value, r.min, r.max, r.unit);
  if (input === null || typeof input !== 'object') {
    throw new InputError('cycle type', 'empty', String(input), undefined, 'cycle type: no cycle type was given.');
  }
  const sterilisingTemperatureK = inRange('sterilising temperature', input.sterilisingTemperatureK, L.sterilisingTemperatureK);
  const bandAboveK = inRange('band above the sterilising temperature', input.bandAboveK ?? D.bandAboveK, L.bandAboveK);
  const bandBelowK = inRange('band below the sterilising temperature', input.bandBelowK ?? D.bandBelowK, L.bandBelowK);
  if (bandAboveK + bandBelowK <= 0) {
    throw new InputError('band above the sterilising temperature', 'inconsistent', bandAboveK, L.bandAboveK,
      'band above the sterilising temperature: the band has no width; above and below together must be more than 0 K.');
  }
  const holdTimeS = inRange('hold time', input.holdTimeS, L.holdTimeS);
  const saturationLimitK = inRange('saturation limit', input.saturationLimitK ?? D.saturationLimitK, L.saturationLimitK);
  const F = LETHALITY_LIMITS;
  const referenceTemperatureK = inRange('F-value reference temperature',
    input.lethality?.referenceTemperatureK ?? D.lethality.referenceTemperatureK, F.referenceTemperatureK);
  const zK = inRange('z-value', input.lethality?.zK ?? D.lethality.zK, F.zK);
  return { sterilisingTemperatureK, bandAboveK, bandBelowK, holdTimeS, saturationLimitK, lethality: { referenceTemperatureK, zK } };
}
