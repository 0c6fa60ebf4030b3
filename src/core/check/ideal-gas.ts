// How far the ideal gas law is from IF97 for the vapor in the vessel: Z = p·v/(R·T), with R the
// specific gas constant of IF97 (R = 461.526 J/(kg·K), IAPWS R7-97(2012) Eq. (1); Z = 0.9754 for
// saturated steam at 121 °C, computed with python3-iapws 1.5.2 (IAPWS-IF97)).

import { IF97 } from '../steam/index.ts';

export interface IdealGasComparison {
  temperatureK: number;
  pressurePa: number;
  /** IF97 specific volume of the vapor, m³/kg. */
  specificVolumeM3PerKg: number;
  /** R·T/p, m³/kg. */
  idealGasSpecificVolumeM3PerKg: number;
  /** Compressibility factor Z = p·v/(R·T). */
  compressibilityZ: number;
  /** Error of the ideal-gas specific volume against IF97, % (positive: ideal gas overstates v, understates mass). */
  idealGasErrorPercent: number;
}

/** Z of vapor at T (K, > 0), p (Pa, > 0) and IF97 specific volume v (m³/kg, > 0). */
export function idealGasComparison(temperatureK: number, pressurePa: number, specificVolumeM3PerKg: number): IdealGasComparison {
  const ideal = (IF97.R * temperatureK) / pressurePa;
  return {
    temperatureK,
    pressurePa,
    specificVolumeM3PerKg,
    idealGasSpecificVolumeM3PerKg: ideal,
    compressibilityZ: specificVolumeM3PerKg / ideal,
    idealGasErrorPercent: (ideal / specificVolumeM3PerKg - 1) * 100,
  };
}
