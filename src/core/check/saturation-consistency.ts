// Does the pressure agree with the temperature for saturated steam? Compares the absolute pressure
// with p_sat(T) and the temperature with T_sat(p), inside a band propagated from the instruments.
// The verdicts are our own rule on the band from uncertainty.ts: inside it, consistent; above it, air
// or a low-reading thermometer; below it, an instrument, atmosphere or equilibrium error, or superheat
// only when no liquid is present (that reading of the sign is from memory). The gas estimate is
// Dalton's law of partial pressures, p = p_steam + p_gas (common practice).

import { IF97, saturationPressure, saturationTemperature } from '../steam/index.ts';
import type { ResolvedReading } from './reading.ts';
import { combineBandWithAdded, pressureTolerancesPa, thermometerLimitsK, type Band } from './uncertainty.ts';
import type { VesselSpec } from './vessel-spec.ts';

/** IF97's lowest temperature, K (IAPWS R7-97(2012) Eq. (30) holds from 273.15 K). */
const T_MIN_K = 273.15;

/** Verdict of the saturation check. */
export type SaturationVerdict =
  | { verdict: 'consistent' }
  | {
      verdict: 'pressure-above-saturation';
      /** Dalton's law estimate, assuming liquid present at equilibrium and the temperature right. */
      noncondensableGas: {
        /** p_abs − p_sat(T), Pa. */
        partialPressurePa: number;
        /** (p_abs − p_sat(T)) / p_abs. */
        moleFraction: number;
        /** T_sat(p_abs) − T, K: how far the steam is below the temperature the gauge implies. */
        temperatureShortfallK: number;
      };
    }
  | {
      verdict: 'pressure-below-saturation';
      /** An instrument or atmosphere error, non-equilibrium, or (only with no liquid present) superheated vapor. */
      superheatPossible: boolean;
    };

export interface SaturationCheck {
  absolutePressurePa: number;
  /** p_sat at the measured temperature, Pa. */
  saturationPressurePa: number;
  /** T_sat at the measured absolute pressure, K. */
  saturationTemperatureK: number;
  /** p_abs − p_sat(T), Pa. */
  pressureDeviationPa: number;
  /** T − T_sat(p_abs), K. */
  temperatureDeviationK: number;
  /** dp_sat/dT at the measured temperature, Pa/K. */
  saturationSlopePaPerK: number;
  /** Band on p_abs − p_sat(T), Pa, with each instrument's part (gauge class, indicator and drift; atmosphere; thermometer element, indicator and drift, as pressure). */
  pressureBand: Band<PressureBandPart>;
  /** The same band as temperature, K (pressure band ÷ slope). */
  temperatureBandK: { plusMinus: number; worstCase: number };
  /**
   * Mole fraction of non-condensable gas the band can hide at this reading: a gas partial pressure
   * up to the band passes as "consistent", so (band ÷ p_abs) by Dalton's law. Agreement means less
   * gas than this, not none.
   */
  airDetectionLimit: number;
  verdict: SaturationVerdict;
}

/** The parts of the saturation check's pressure band. */
export type PressureBandPart =
  | 'pressureGauge' | 'atmosphere' | 'temperatureSensor'
  | 'pressureGaugeIndicator' | 'pressureGaugeDrift' | 'temperatureIndicator' | 'temperatureDrift';

/** Slope of the saturation line, Pa/K, by a central difference kept inside 273.15–647.096 K (no 0/0 at the critical point). */
export function saturationSlopePaPerK(temperatureK: number): number {
  const dT = 0.005;
  const lo = Math.max(T_MIN_K, temperatureK - dT);
  const hi = Math.min(IF97.Tc, temperatureK + dT);
  return (saturationPressure(hi) - saturationPressure(lo)) / (hi - lo);
}

/**
 * The saturation check for a resolved reading. liquidPresent: true if the inventory shows liquid,
 * false if it shows none, null if not weighed. Throws InputError only through the steam engine's ranges.
 */
export function checkSaturation(
  vessel: VesselSpec,
  reading: ResolvedReading,
  pressureReference: 'gauge' | 'absolute',
  liquidPresent: boolean | null,
): SaturationCheck {
  const T = reading.temperatureK;
  const p = reading.absolutePressurePa;
  const pSat = saturationPressure(T);
  const tSat = saturationTemperature(p);
  const slope = saturationSlopePaPerK(T);
  const pTol = pressureTolerancesPa(vessel, reading, pressureReference);
  const tTol = thermometerLimitsK(vessel.instruments, T);
  const pressureBand: Band<PressureBandPart> = combineBandWithAdded(
    { pressureGauge: pTol.pressureGauge, atmosphere: pTol.atmosphere, temperatureSensor: slope * tTol.element },
    {
      pressureGaugeIndicator: pTol.pressureGaugeIndicator,
      pressureGaugeDrift: pTol.pressureGaugeDrift,
      temperatureIndicator: slope * tTol.indicator,
      temperatureDrift: slope * tTol.drift,
    },
  );
  // Floor at rounding level so a reading exactly at saturation stays consistent at zero tolerance
  // after gauge ↔ absolute arithmetic.
  const floor = 1e-9 * p;
  const U = Math.max(pressureBand.plusMinus, floor);
  const deviation = p - pSat;
  let verdict: SaturationVerdict;
  if (Math.abs(deviation) <= U) verdict = { verdict: 'consistent' };
  else if (deviation > 0) {
    verdict = {
      verdict: 'pressure-above-saturation',
      noncondensableGas: { partialPressurePa: deviation, moleFraction: deviation / p, temperatureShortfallK: tSat - T },
    };
  } else verdict = { verdict: 'pressure-below-saturation', superheatPossible: liquidPresent !== true };
  return {
    absolutePressurePa: p,
    saturationPressurePa: pSat,
    saturationTemperatureK: tSat,
    pressureDeviationPa: deviation,
    temperatureDeviationK: T - tSat,
    saturationSlopePaPerK: slope,
    pressureBand: { ...pressureBand, plusMinus: U },
    temperatureBandK: { plusMinus: U / slope, worstCase: pressureBand.worstCase / slope },
    airDetectionLimit: U / p,
    verdict,
  };
}
