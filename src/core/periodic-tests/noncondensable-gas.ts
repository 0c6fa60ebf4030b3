// Non-condensable gases in supply steam: a sample of steam is condensed and the gas that comes out
// of it is collected; the test figure is the gas volume per 100 volumes of condensate, i.e.
// mL of gas per 100 mL of condensate, written as a percent by volume (EN 285 test, via HTM 2010;
// secondary sources in field-practice.md §4.3). Both volumes as read on the apparatus at its
// (room) conditions.
//
// This is not a mole fraction in the steam: 3.5 mL of gas per 100 mL of condensate is about 26 ppm
// by mole (field-practice.md §4.3, computed there), far below anything a pressure-temperature
// agreement can see, and the wording never lets the two stand for each other.

import { requireInRange } from '../errors.ts';
import { requireFiniteData } from '../check/finite-data.ts';
import type { Graded } from '../graded-result.ts';
import { gradeTest, STEAM_SAMPLING_HOT, testCaution } from './test-cautions.ts';

/** Valid ranges, m³: up to 10 L of gas and 100 L of condensate, at least 1 mL of condensate. */
export const NONCONDENSABLE_GAS_LIMITS = {
  gasVolumeM3: { min: 0, max: 0.01, unit: 'm³' },
  condensateVolumeM3: { min: 1e-6, max: 0.1, unit: 'm³' },
} as const;

export interface NoncondensableGasReading {
  /** Gas collected, m³ (1 mL = 1e-6 m³). */
  gasVolumeM3: number;
  /** Condensate collected with it, m³. */
  condensateVolumeM3: number;
}

/**
 * Non-condensable gases as percent by volume: 100 × gas volume / condensate volume (= mL of gas
 * per 100 mL of condensate).
 * @throws InputError naming the field: "gas volume" (0–0.01 m³), "condensate volume" (1e-6–0.1 m³)
 */
export function noncondensableGas(reading: NoncondensableGasReading): { percentByVolume: number } {
  const L = NONCONDENSABLE_GAS_LIMITS;
  const gas = requireInRange('gas volume', reading?.gasVolumeM3, L.gasVolumeM3.min, L.gasVolumeM3.max, L.gasVolumeM3.unit);
  const condensate = requireInRange('condensate volume', reading.condensateVolumeM3, L.condensateVolumeM3.min, L.condensateVolumeM3.max, L.condensateVolumeM3.unit);
  return { percentByVolume: (100 * gas) / condensate };
}

/** Highest accepted figure by default: 3.5 mL of gas per 100 mL of condensate (EN 285 via HTM 2010; secondary sources, field-practice.md §4.3). */
export const NONCONDENSABLE_GAS_DEFAULT_MAX_PERCENT = 3.5;

export interface NoncondensableGasEvaluation extends Graded {
  test: 'noncondensable-gas';
  input: NoncondensableGasReading;
  percentByVolume: number;
  limits: { maximumPercentByVolume: number };
}

/** The non-condensable gas test against the highest accepted figure (default 3.5, 0–100). Throws InputError as noncondensableGas, and on "highest accepted non-condensable gas". */
export function evaluateNoncondensableGas(
  reading: NoncondensableGasReading,
  limits: { maximumPercentByVolume?: number } = {},
): NoncondensableGasEvaluation {
  const maximumPercentByVolume = requireInRange('highest accepted non-condensable gas',
    limits.maximumPercentByVolume ?? NONCONDENSABLE_GAS_DEFAULT_MAX_PERCENT, 0, 100, '% by volume');
  const { percentByVolume } = noncondensableGas(reading);
  const findings = percentByVolume > maximumPercentByVolume
    ? [testCaution('noncondensable-gas-above-limit',
      `Non-condensable gases ${percentByVolume.toFixed(2)} mL per 100 mL of condensate, above the highest accepted ${maximumPercentByVolume.toFixed(1)} mL per 100 mL. ` +
        'Gas in the steam can collect in the load where steam condenses and keep steam from its surfaces; look for the source (feedwater treatment and deaeration, air drawn in at the supply).')]
    : [];
  const standing = [
    testCaution('noncondensable-gas-not-saturation-check',
      'This test measures gas collected from condensed steam. Gas at this level cannot be seen by comparing a chamber\'s temperature with the saturation temperature of its pressure, which shows gross air only, at the percent level.'),
    STEAM_SAMPLING_HOT,
  ];
  return requireFiniteData({
    test: 'noncondensable-gas' as const,
    input: { ...reading },
    percentByVolume,
    limits: { maximumPercentByVolume },
    ...gradeTest(findings, standing),
  });
}
