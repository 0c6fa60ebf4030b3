// What the review needs from one saved check, read defensively from its stored result (the result
// is the check engine's output as plain JSON; an older or damaged record may lack any part of it).
// A check is judged by its outcome, the worst signal word among its findings, not by every caution:
// standing hazards (flash on release, scald …) are on every hot check.
import { OUTCOME_IDS, SIGNAL_ORDER, outcomeOfRecord, verdictOfResult, type CheckRecord, type Signal, type StoredOutcome } from '../../store/index.ts';
import { shortTime } from '../state/format.ts';

export type { Signal };
export type Outcome = StoredOutcome;
/** Most severe first (ISO 3864 / ANSI Z535 order). */
export const SIGNALS: readonly Signal[] = SIGNAL_ORDER;
/** A check's outcome (the worst signal word among its findings), most severe first, then none. */
export const OUTCOMES: readonly Outcome[] = OUTCOME_IDS;

/** How an outcome reads in lists and totals. */
export function outcomeLabel(o: Outcome): string {
  return o === 'none' ? 'none (no findings)' : o;
}

export type VerdictId = 'consistent' | 'pressure-above-saturation' | 'pressure-below-saturation' | 'none';
/** `short` is for tables on a phone. */
export const VERDICTS: readonly { id: VerdictId; label: string; short: string }[] = [
  { id: 'consistent', label: 'Gauge agrees with saturation', short: 'agrees' },
  { id: 'pressure-above-saturation', label: 'Pressure above saturation', short: 'p above' },
  { id: 'pressure-below-saturation', label: 'Pressure below saturation', short: 'p below' },
  { id: 'none', label: 'No verdict stored', short: 'none' },
];

export interface RecordFacts {
  verdict: VerdictId;
  /** The worst signal word among the record's findings, 'none' when it has none (derived from rule ids for a record saved before findings existed). */
  outcome: Outcome;
  /** Bulk vapour mass fraction, 0–1, when the contents were two-phase and weighed. */
  quality: number | null;
  liquidMassKg: number | null;
  /** p − p_sat(T), Pa. */
  pressureDeviationPa: number | null;
  /** The ± bands the engine gave those figures (same units; null where the record has none), so a report rounds them as the screen did. */
  bands: FigureBands;
}

export interface FigureBands {
  quality: number | null;
  liquidMassKg: number | null;
  pressureDeviationPa: number | null;
}

function field(value: unknown, key: string): unknown {
  return typeof value === 'object' && value !== null && !Array.isArray(value) ? (value as Record<string, unknown>)[key] : undefined;
}

function finite(value: unknown): number | null {
  return typeof value === 'number' && Number.isFinite(value) ? value : null;
}

/** The stored saturation verdict (the store's definition, which its filters use too). */
export function verdictOf(record: CheckRecord): VerdictId {
  return verdictOfResult(record.result) ?? 'none';
}

/** The record's outcome, as the store's filters and totals count it. */
export function outcomeOf(record: CheckRecord): Outcome {
  return outcomeOfRecord(record);
}

export function factsOf(record: CheckRecord): RecordFacts {
  const inventory = field(record.result, 'inventory');
  const twoPhase = field(inventory, 'regime') === 'two-phase';
  return {
    verdict: verdictOf(record),
    outcome: outcomeOf(record),
    quality: twoPhase ? finite(field(inventory, 'quality')) : null,
    liquidMassKg: twoPhase ? finite(field(inventory, 'liquidMassKg')) : null,
    pressureDeviationPa: finite(field(field(record.result, 'saturation'), 'pressureDeviationPa')),
    bands: {
      quality: finite(field(field(field(record.result, 'inventoryBands'), 'quality'), 'plusMinus')),
      liquidMassKg: finite(field(field(field(record.result, 'inventoryBands'), 'liquidMassKg'), 'plusMinus')),
      pressureDeviationPa: finite(field(field(field(record.result, 'saturation'), 'pressureBand'), 'plusMinus')),
    },
  };
}

export function verdictLabel(id: VerdictId, form: 'label' | 'short' = 'label'): string {
  return VERDICTS.find((v) => v.id === id)?.[form] ?? id;
}

/** A stored time as "2026-12-01 14:05 UTC+01:00" (the offset the technician's device stamped), as every screen shows it. */
export function stampText(iso: string): string {
  return shortTime(iso);
}
