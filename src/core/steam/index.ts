// Public surface of the steam engine: IAPWS-IF97 (IAPWS R7-97(2012)), regions 1-4, SI units.
export { IF97, FORMULATION_ID } from './constants.ts';
export type { PhaseState, SaturationState, SteamRegion, VesselState } from './phase-state.ts';
export { SATURATION_PRESSURE_MIN, saturationPressure, saturationTemperature } from './saturation-line.ts';
export { saturation, saturatedLiquidVolume, saturatedVaporVolume } from './saturation.ts';
export { stateTP } from './state-tp.ts';
export { stateTV } from './state-tv.ts';
