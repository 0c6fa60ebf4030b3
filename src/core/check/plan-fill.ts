// How much water to charge: for a target temperature and a target quality (or vapor-space
// fraction, or just enough for dry saturated steam), the mass, the gross weight to expect, the
// ideal-gas estimate and its error, the heat and heat-up time, and the largest charge that stays
// two-phase up to the relief set pressure's saturation temperature plus a margin.

import { InputError, requireInRange } from '../errors.ts';
import { FORMULATION_ID, IF97, saturation } from '../steam/index.ts';
import type { ChargeState, FillPlan, FillRequest, FillTarget } from './check-result.ts';
import { raisePlanCautions } from './check-rules.ts';
import { withStandingNote } from './cautions.ts';
import { requireFiniteData } from './finite-data.ts';
import { heatUpEnvelope, saturationTemperatureOrNull, type HeatUpEnvelope } from './heat-up-envelope.ts';
import { contentsState } from './inventory.ts';
import { VESSEL_LIMITS, validateVessel, type VesselSpec } from './vessel-spec.ts';
import { vesselVolume } from './vessel-geometry.ts';

export type { ChargeState, FillPlan, FillRequest, FillTarget } from './check-result.ts';

/** IF97's lowest temperature, K (IAPWS R7-97(2012)): a charge may start at 0.00 °C. */
const T_MIN_K = 273.15;

function chargeState(T: number, v: number, V: number): ChargeState {
  const found = contentsState(T, v);
  if (found.kind === 'beyond-100-MPa') return { regime: 'liquid-full', temperatureK: T };
  const s = found.state;
  if (s.phase === 'two-phase') {
    return { regime: 'two-phase', temperatureK: T, absolutePressurePa: s.p, quality: s.x, vaporSpaceFraction: (s.x * (V / v) * s.vapor.v) / V };
  }
  if (s.phase === 'compressed-liquid' || (s.phase === 'supercritical' && v < 1 / IF97.rhoc)) return { regime: 'liquid-full', temperatureK: T };
  return { regime: 'superheated', temperatureK: T, absolutePressurePa: s.p };
}

/**
 * Plans a charge for a vessel (SI throughout). Throws InputError naming the field: the vessel's
 * fields (validateVessel), target temperature, start temperature (not above the target), quality
 * or vapor-space fraction (0–1), vessel heat capacity, heater power, liquid-full margin, atmosphere.
 */
export function planFill(vessel: VesselSpec, request: FillRequest): FillPlan {
  validateVessel(vessel);
  const T2 = requireInRange('target temperature', request.targetTemperatureK, T_MIN_K, IF97.Tc, 'K');
  const T1 = requireInRange('start temperature', request.startTemperatureK, T_MIN_K, IF97.Tc, 'K');
  if (T1 > T2) {
    throw new InputError('start temperature', 'inconsistent', T1, { min: T_MIN_K, max: T2, unit: 'K' },
      `start temperature: ${T1} K is above the target temperature (${T2} K); it must be at most the target.`);
  }
  const C = request.vesselHeatCapacityJPerK === undefined ? 0 : requireInRange('vessel heat capacity', request.vesselHeatCapacityJPerK, 0, 1e9, 'J/K');
  let power: number | null = null;
  if (request.heaterPowerW !== undefined) {
    power = requireInRange('heater power', request.heaterPowerW, 0, 1e8, 'W');
    if (power === 0) throw new InputError('heater power', 'out-of-range', 0, { min: 0, max: 1e8, unit: 'W' }, 'heater power: must be above 0 W (or left out).');
  }
  const margin = requireInRange('liquid-full margin', request.liquidFullMarginK, 0, 100, 'K');
  const A = VESSEL_LIMITS.siteAtmospherePa;
  const atm = request.atmospherePa === undefined ? vessel.siteAtmospherePa : requireInRange('atmospheric pressure', request.atmospherePa, A.min, A.max, A.unit);

  const V = vesselVolume(vessel.geometry);
  const sat = saturation(T2);
  const vf = sat.liquid.v;
  const vg = sat.vapor.v;
  const vIdeal = (IF97.R * T2) / sat.p;
  const requested = request.target;
  let target: FillTarget;
  let m: number;
  let mIdeal: number;
  switch (requested?.kind) {
    case 'quality': {
      const x = requireInRange('quality', requested.quality, 0, 1, '1');
      target = { kind: 'quality', quality: x + 0 }; // + 0 turns −0 into 0, so the echo survives a JSON round trip
      m = V / (vf + x * (vg - vf));
      mIdeal = V / (vf + x * (vIdeal - vf));
      break;
    }
    case 'vapor-space-fraction': {
      const phi = requireInRange('vapour-space fraction', requested.fraction, 0, 1, '1');
      target = { kind: 'vapor-space-fraction', fraction: phi + 0 };
      m = ((1 - phi) * V) / vf + (phi * V) / vg;
      mIdeal = ((1 - phi) * V) / vf + (phi * V) / vIdeal;
      break;
    }
    case 'dry-saturated':
      target = { kind: 'dry-saturated' };
      m = V / vg;
      mIdeal = V / vIdeal;
      break;
    default:
      throw new InputError('fill target', 'empty', String((requested as { kind?: unknown } | undefined)?.kind ?? ''), undefined,
        'fill target: give a quality, a vapour-space fraction, or dry saturated.');
  }
  const x = vg > vf ? Math.min(1, Math.max(0, (V / m - vf) / (vg - vf))) : 1;
  const vaporMassKg = x * m;

  const v = V / m;
  const startState = chargeState(T1, v, V);
  const start = contentsState(T1, v);
  const end = contentsState(T2, v);
  let heat: FillPlan['heat'] = null;
  if (start.kind === 'state' && end.kind === 'state') {
    const contentsJ = m * (end.state.u - start.state.u);
    const vesselJ = C * (T2 - T1);
    const totalJ = contentsJ + vesselJ;
    heat = { contentsJ, vesselJ, totalJ, heatUpTimeS: power === null ? null : totalJ / power };
  }

  const reliefT = saturationTemperatureOrNull(vessel.reliefSetGaugePa + atm);
  const limitTemperatureK = Math.min(IF97.Tc, (reliefT ?? IF97.Tc) + margin);
  const twoPhaseMass = V / saturation(limitTemperatureK).liquid.v;

  const partial: Omit<FillPlan, 'cautions'> = {
    formulationId: FORMULATION_ID,
    internalVolumeM3: V,
    target,
    targetTemperatureK: T2,
    startTemperatureK: T1,
    atmospherePa: atm,
    waterMassKg: m,
    expectedGrossWeightKg: vessel.tareKg + m,
    targetSaturationPressurePa: sat.p,
    targetGaugePressurePa: sat.p - atm,
    atTarget: { quality: x, vaporSpaceFraction: (vaporMassKg * vg) / V, liquidMassKg: m - vaporMassKg, vaporMassKg },
    idealGas: { waterMassKg: mIdeal, errorPercent: ((mIdeal - m) / m) * 100 },
    heat,
    startState,
    largestTwoPhaseCharge: {
      limitTemperatureK,
      waterMassKg: twoPhaseMass,
      expectedGrossWeightKg: vessel.tareKg + twoPhaseMass,
      fillFractionAtStart: (twoPhaseMass * saturation(T1).liquid.v) / V,
    },
    envelope: heatUpEnvelope({
      volumeM3: V,
      massKg: m,
      startTemperatureK: T1,
      reliefSetGaugePa: vessel.reliefSetGaugePa,
      mawpGaugePa: vessel.mawpGaugePa,
      atmospherePa: atm,
    }),
  };
  return requireFiniteData({ ...partial, cautions: withStandingNote(raisePlanCautions(vessel, partial)) });
}
