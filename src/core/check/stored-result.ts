// Results as the log holds them. A saved result is never rewritten, so the log holds every shape
// the engine has returned: version 1 (before findings were told apart from standing hazards) and
// version 2 (CheckResult, today's). This module names both and reads either, once, at the edge
// where a stored result is used; nothing is recomputed.
import type { FORMULATION_ID } from '../steam/index.ts';
import type { Caution, CheckResult, Hazards, Outcome } from './check-result.ts';
import { isStandingRule, METHOD_RULES, outcomeOfStoredCautions } from './cautions.ts';
import type { CooledState } from './hazards.ts';
import type { Inventory } from './inventory.ts';
import type { SaturationCheck } from './saturation-consistency.ts';
import type { Band, InventoryBands } from './uncertainty.ts';
import type { ResolvedReading } from './reading.ts';
import type { HeatUpEnvelope } from './heat-up-envelope.ts';
import type { IdealGasComparison } from './ideal-gas.ts';

type TwoPhase = Extract<Inventory, { regime: 'two-phase' }>;
type Superheated = Extract<Inventory, { regime: 'superheated' }>;

/** A version 1 result (release 0.1.0): the same figures, without the parts version 2 added or changed. */
export interface CheckResultV1 {
  resultVersion?: undefined;
  formulationId: typeof FORMULATION_ID | string;
  reading: ResolvedReading;
  internalVolumeM3: number;
  saturation: Omit<SaturationCheck, 'airDetectionLimit' | 'pressureBand'> & { pressureBand: Band<'pressureGauge' | 'atmosphere' | 'temperatureSensor'> };
  inventory:
    | Omit<TwoPhase, 'liquidFullWithinBand'>
    | {
        regime: 'liquid-full';
        netMassKg: number;
        meanSpecificVolumeM3PerKg: number;
        hydraulic:
          | { withinFormulation: true; absolutePressurePa: number; gaugePressurePa: number; exceedsMawp: boolean }
          | { withinFormulation: false; aboveAbsolutePressurePa: number; exceedsMawp: true };
      }
    | Superheated
    | { regime: 'not-weighed' };
  inventoryBands: { quality: Band<'weight' | 'temperature' | 'volume'>; liquidMassKg: Band<'weight' | 'temperature' | 'volume'>; liquidLevelM: InventoryBands['liquidLevelM'] } | null;
  envelope: HeatUpEnvelope | null;
  hazards: Omit<Hazards, 'cooled'> & {
    cooled: Pick<CooledState, 'temperatureK' | 'noncondensablePartialPressurePa' | 'belowAtmosphere' | 'aboveFormulationLimit' | 'vacuumRated' | 'collapseRisk'> & {
      absolutePressurePa: number;
      gaugePressurePa: number;
    };
  };
  idealGas: IdealGasComparison;
  cautions: Caution[];
}

/** Any result the log can hold. */
export type StoredCheckResult = CheckResult | CheckResultV1;

/** Whether a stored result is today's shape. */
export function isCurrentResult(result: StoredCheckResult): result is CheckResult {
  return result.resultVersion === 2;
}

/**
 * A stored result's findings, standing items and outcome: as saved (version 2), or derived from
 * its cautions' rule ids (version 1: outcomeOfStoredCautions), never rewritten.
 */
export function findingsOfStoredResult(result: StoredCheckResult): { findings: Caution[]; standing: Caution[]; outcome: Outcome } {
  if (isCurrentResult(result)) return { findings: result.findings, standing: result.standing, outcome: result.outcome };
  const findings = result.cautions.filter((c) => !isStandingRule(c.rule));
  const hazards = result.cautions.filter((c) => isStandingRule(c.rule) && !METHOD_RULES.includes(c.rule));
  const notes = result.cautions.filter((c) => METHOD_RULES.includes(c.rule));
  return { findings, standing: [...hazards, ...notes], outcome: outcomeOfStoredCautions(result.cautions) };
}
