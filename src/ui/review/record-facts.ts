// What the review needs from one saved check, read defensively from its stored result (the result
// is the check engine's output as plain JSON; an older or damaged record may lack any part of it).
import { shortTime } from '../state/format.ts';
import { SIGNAL_ORDER, signalMaskOf, verdictOfResult, worstSignalOfMask, type CheckRecord, type Signal } from '../../store/index.ts';

export type { Signal };
/** Most severe first (ISO 3864 / ANSI Z535 order). */
export const SIGNALS: readonly Signal[] = SIGNAL_ORDER;

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
  /** The most severe signal word among the record's cautions (standing note left out), or null. */
  worstSignal: Signal | null;
  /** Bulk vapour mass fraction, 0–1, when the contents were two-phase and weighed. */
  quality: number | null;
  liquidMassKg: number | null;
  /** p − p_sat(T), Pa. */
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

/** The most severe signal word among the record's cautions, the standing note left out. */
export function worstSignalOf(record: CheckRecord): Signal | null {
  return worstSignalOfMask(signalMaskOf(record.cautions));
}

/** Whether the record carries a caution with this signal word (standing note left out). */
export function hasSignal(record: CheckRecord, signal: Signal): boolean {
  return (signalMaskOf(record.cautions) & (1 << SIGNALS.indexOf(signal))) !== 0;
}

export function factsOf(record: CheckRecord): RecordFacts {
  const inventory = field(record.result, 'inventory');
  const twoPhase = field(inventory, 'regime') === 'two-phase';
  return {
    verdict: verdictOf(record),
    worstSignal: worstSignalOf(record),
    quality: twoPhase ? finite(field(inventory, 'quality')) : null,
    liquidMassKg: twoPhase ? finite(field(inventory, 'liquidMassKg')) : null,
    pressureDeviationPa: finite(field(field(record.result, 'saturation'), 'pressureDeviationPa')),
  };
}

export function verdictLabel(id: VerdictId, form: 'label' | 'short' = 'label'): string {
  return VERDICTS.find((v) => v.id === id)?.[form] ?? id;
}

/** A stored time as "2026-12-01 14:05 UTC+01:00" (the offset the technician's device stamped), as every screen shows it. */
export function stampText(iso: string): string {
  return shortTime(iso);
}
