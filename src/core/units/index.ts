// Units: conversions between the units people read and type and the SI units inside the core,
// gauge ↔ absolute with an explicit atmosphere, the standard atmosphere by elevation, reading typed
// numbers and writing them back. Sources are named beside every factor.
export type { UnitInfo } from './unit-info.ts';
export {
  TEMPERATURE_SCALE,
  TEMPERATURE_UNITS,
  isTemperatureUnit,
  temperatureToK,
  temperatureFromK,
  temperatureDifferenceToK,
  temperatureDifferenceFromK,
} from './temperature.ts';
export type { TemperatureUnit } from './temperature.ts';
export { PASCALS_PER_PRESSURE_UNIT, PRESSURE_UNITS, isPressureUnit, pressureToPa, pressureFromPa } from './pressure.ts';
export type { PressureUnit } from './pressure.ts';
export {
  STANDARD_ATMOSPHERE_PA,
  ATMOSPHERE_RANGE_PA,
  ELEVATION_RANGE_M,
  GEOPOTENTIAL_ALTITUDE_RANGE_M,
  US_STANDARD_ATMOSPHERE_1976,
  atmosphereFromElevation,
  atmosphereFromGeopotentialAltitude,
  elevationFromAtmosphere,
  absoluteFromGauge,
  gaugeFromAbsolute,
} from './atmosphere.ts';
export { KILOGRAMS_PER_MASS_UNIT, MASS_UNITS, isMassUnit, massToKg, massFromKg } from './mass.ts';
export type { MassUnit } from './mass.ts';
export { METRES_PER_LENGTH_UNIT, LENGTH_UNITS, isLengthUnit, lengthToM, lengthFromM } from './length.ts';
export type { LengthUnit } from './length.ts';
export { CUBIC_METRES_PER_VOLUME_UNIT, VOLUME_UNITS, isVolumeUnit, volumeToM3, volumeFromM3 } from './volume.ts';
export type { VolumeUnit } from './volume.ts';
export {
  CUBIC_METRES_PER_KG_PER_UNIT,
  SPECIFIC_VOLUME_UNITS,
  isSpecificVolumeUnit,
  specificVolumeToM3PerKg,
  specificVolumeFromM3PerKg,
} from './specific-volume.ts';
export type { SpecificVolumeUnit } from './specific-volume.ts';
export { parseDecimal } from './parse-decimal.ts';
export type { DecimalSeparator, ParseDecimalOptions } from './parse-decimal.ts';
export { formatNumber, NO_NUMBER_TEXT, GROUP_SEPARATOR } from './format.ts';
export type { FormatNumberOptions } from './format.ts';
