// IAPWS-IF97 constants and the validity limits the steam engine enforces.
// Source: IAPWS R7-97(2012), Eqs. (1)-(4) (R, Tc, pc, rhoc) and Section 3 (ranges of validity);
// the triple point (273.16 K, 611.657 Pa) is the one IF97 uses for its reference state.

/** IAPWS-IF97 constants in SI base units: R J/(kg·K), Tc K, pc Pa, rhoc kg/m³, Tt K, pt Pa. */
export const IF97 = {
  R: 461.526,
  Tc: 647.096,
  pc: 22.064e6,
  rhoc: 322,
  Tt: 273.16,
  pt: 611.657,
} as const;

/** The formulation every saved result records, so a supervisor can recompute it. */
export const FORMULATION_ID = 'IAPWS-IF97 (R7-97(2012))';

/** Lowest temperature of IF97 (K). Note: 273.15 K, not the triple point 273.16 K. */
export const T_MIN = 273.15;
/** Highest temperature this engine covers (K): the top of region 2; region 5 is not implemented. */
export const T_MAX = 1073.15;
/** Upper pressure limit of IF97 regions 1-3 (Pa). */
export const P_MAX = 100e6;
/** Boundary temperature between regions 1 and 3 (and where region 4 meets B23), K. */
export const T_13 = 623.15;
/** Temperature where B23 reaches 100 MPa (K); above it region 2 covers every pressure. */
export const T_B23_MAX = 863.15;
/**
 * Lowest pressure stateTP accepts (Pa). IF97 region 2 is valid for 0 < p; the floor only keeps
 * v = R·T/p comfortably finite in double precision (no vessel is ever near it).
 */
export const P_MIN = 1e-6;
