// The few facts of a check that listing, filtering and totals need, taken from the stored record
// once, when it is written, and kept beside its place in the month buckets (log-layout.ts): a
// filter by verdict, signal word, technician or device, and the totals, then read no record.
import type { CheckRecord, JsonValue, StoredCaution } from './records.ts';

export type Signal = StoredCaution['signal'];
/** Most severe first (ISO 3864 / ANSI Z535 order). */
export const SIGNAL_ORDER: readonly Signal[] = ['DANGER', 'WARNING', 'CAUTION', 'NOTICE'];

/** The saturation verdicts of the check engine's result (src/core/README.md, "Check engine"). */
export const VERDICT_IDS = ['consistent', 'pressure-above-saturation', 'pressure-below-saturation'] as const;
export type StoredVerdict = (typeof VERDICT_IDS)[number];

/** The caution every result ends with; it says nothing about the reading, so it never counts. */
export const STANDING_NOTE_RULE = 'standing-note';

function field(value: JsonValue | undefined, key: string): JsonValue | undefined {
  return typeof value === 'object' && value !== null && !Array.isArray(value) ? value[key] : undefined;
}

/** The stored saturation verdict, or null when the record has none the engine defines. */
export function verdictOfResult(result: JsonValue): StoredVerdict | null {
  const v = field(field(field(result, 'saturation'), 'verdict'), 'verdict');
  return (VERDICT_IDS as readonly unknown[]).includes(v) ? (v as StoredVerdict) : null;
}

/** Bit i set when the cautions (standing note left out) hold SIGNAL_ORDER[i]. */
export function signalMaskOf(cautions: readonly StoredCaution[]): number {
  let mask = 0;
  for (const c of cautions) {
    if (c.rule === STANDING_NOTE_RULE) continue;
    const i = SIGNAL_ORDER.indexOf(c.signal);
    if (i >= 0) mask |= 1 << i;
  }
  return mask;
}

/** The most severe signal word in a mask, or null. */
export function worstSignalOfMask(mask: number): Signal | null {
  for (let i = 0; i < SIGNAL_ORDER.length; i += 1) if (mask & (1 << i)) return SIGNAL_ORDER[i]!;
  return null;
}

/** The facts of a record as the month buckets keep them. */
export function factsOfRecord(r: CheckRecord): { verdict: StoredVerdict | null; signals: number; technician: string } {
  return { verdict: verdictOfResult(r.result), signals: signalMaskOf(r.cautions), technician: r.technician };
}
