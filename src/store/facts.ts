// The few facts of a check that listing, filtering and totals need, taken from the stored record
// once, when it is written, and kept beside its place in the month buckets (log-layout.ts): a
// filter by verdict, outcome, signal word, technician or device, and the totals, then read no record.
//
// The signal words kept are those of the check's findings (what the reading said about the vessel;
// the outcome is the most severe), not of every caution: a standing hazard such as flash on release
// is on every hot check and would make every check look alike. A result saved since findings
// existed (resultVersion 2) lists its findings; one saved before (release 0.1.0), or any without
// that list, is classified by its cautions' rule ids with STANDING_RULE_IDS below.
import type { CheckRecord, StoredCaution } from './records.ts';

export type Signal = StoredCaution['signal'];
/** Most severe first (ISO 3864 / ANSI Z535 order). */
export const SIGNAL_ORDER: readonly Signal[] = ['DANGER', 'WARNING', 'CAUTION', 'NOTICE'];

/** A check's outcome: the worst signal word among its findings, 'none' when it has none. */
export type StoredOutcome = Signal | 'none';
/** The outcomes, most severe first. */
export const OUTCOME_IDS: readonly StoredOutcome[] = [...SIGNAL_ORDER, 'none'];

/** The saturation verdicts of the check engine's result (src/core/README.md, "Check engine"). */
export const VERDICT_IDS = ['consistent', 'pressure-above-saturation', 'pressure-below-saturation'] as const;
export type StoredVerdict = (typeof VERDICT_IDS)[number];

/** The caution every result ends with; it says nothing about the reading, so it never counts. */
export const STANDING_NOTE_RULE = 'standing-note';

/**
 * The check engine's rule ids that are not findings (standing hazards, notes on the method, the
 * standing note), release 0.1.0's among them. A copy, because the store takes only types from the
 * core; test/store/facts.test.ts holds it equal to the core's STANDING_RULES. A rule not listed
 * counts as a finding, so nothing is hidden.
 */
export const STANDING_RULE_IDS: ReadonlySet<string> = new Set([
  // release 0.1.0
  'flash-on-release', 'vacuum-on-cooling', 'scald', 'saturation-check-limits', 'atmosphere-assumed', 'bulk-quality-not-dryness',
  'plan-assumes-air-removed', STANDING_NOTE_RULE,
  // since findings were told apart (issue 9)
  'do-not-open-under-pressure', 'hot-surface', 'pressure-after-cooling', 'vacuum-on-cooling-protected', 'quench-vacuum', 'water-hammer',
  'freezing', 'boil-over-on-opening', 'quality-undetermined',
]);

/** Whether a rule id never decides a check's outcome (STANDING_RULE_IDS). */
export function isStandingRuleId(rule: string): boolean {
  return STANDING_RULE_IDS.has(rule);
}

function field(value: unknown, key: string): unknown {
  return typeof value === 'object' && value !== null && !Array.isArray(value) ? (value as Record<string, unknown>)[key] : undefined;
}

/** The stored saturation verdict, or null when the record has none the engine defines. */
export function verdictOfResult(result: unknown): StoredVerdict | null {
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

/**
 * Bit i set when the check's findings hold SIGNAL_ORDER[i]: from result.findings when the result
 * is version 2, otherwise from the cautions whose rule is not one of STANDING_RULE_IDS.
 */
export function findingMaskOf(record: { result: unknown; cautions: readonly { signal: string; rule: string }[] }): number {
  const result = record.result;
  const findings = field(result, 'findings');
  if (field(result, 'resultVersion') === 2 && Array.isArray(findings)) {
    let mask = 0;
    for (const f of findings) {
      const i = SIGNAL_ORDER.indexOf(field(f, 'signal') as Signal);
      if (i >= 0) mask |= 1 << i;
    }
    return mask;
  }
  let mask = 0;
  for (const c of record.cautions) {
    if (STANDING_RULE_IDS.has(c.rule)) continue;
    const i = SIGNAL_ORDER.indexOf(c.signal as Signal);
    if (i >= 0) mask |= 1 << i;
  }
  return mask;
}

/**
 * findingMaskOf a record's canonical JSON text. A version 1 record needs only its cautions, which
 * canonical JSON (keys sorted) writes between "cautions": and ,"corrects": near its start; that
 * slice is parsed instead of the whole record (the schema v5 rung reads every stored check). Any
 * other text is parsed whole.
 */
export function findingMaskOfText(text: string): number {
  if (!text.includes('"resultVersion":2')) {
    const start = text.indexOf('"cautions":');
    const end = start < 0 ? -1 : text.indexOf(',"corrects":', start);
    if (start >= 0 && end > start) {
      try {
        const cautions = JSON.parse(text.slice(start + '"cautions":'.length, end)) as unknown;
        if (Array.isArray(cautions)) return findingMaskOf({ result: null, cautions: cautions as StoredCaution[] });
      } catch {
        // Not the shape expected: parse it all below.
      }
    }
  }
  const r = JSON.parse(text) as CheckRecord;
  return findingMaskOf({ result: r.result, cautions: Array.isArray(r.cautions) ? r.cautions : [] });
}

/** The most severe signal word in a mask, or null. */
export function worstSignalOfMask(mask: number): Signal | null {
  for (let i = 0; i < SIGNAL_ORDER.length; i += 1) if (mask & (1 << i)) return SIGNAL_ORDER[i]!;
  return null;
}

/** The outcome a findings mask stands for. */
export function outcomeOfMask(mask: number): StoredOutcome {
  return worstSignalOfMask(mask) ?? 'none';
}

/** A stored check's outcome (what the month buckets keep, read from the record itself). */
export function outcomeOfRecord(record: { result: unknown; cautions: readonly { signal: string; rule: string }[] }): StoredOutcome {
  return outcomeOfMask(findingMaskOf(record));
}

/** The facts of a record as the month buckets keep them: `signals` is the findings' mask. */
export function factsOfRecord(r: CheckRecord): { verdict: StoredVerdict | null; signals: number; technician: string } {
  return { verdict: verdictOfResult(r.result), signals: findingMaskOf(r), technician: r.technician };
}

function finiteOrNull(value: unknown): number | null {
  return typeof value === 'number' && Number.isFinite(value) ? value : null;
}

/**
 * A check's key figures as the month rows keep them (schema v10), SI, each null where the record
 * has none: the temperature read (K), the absolute pressure the engine worked with (Pa, its
 * result's reading; a gauge reading sorts by what it stands for, so gauge and absolute readings
 * sort together; a record without a result has none), and, when
 * the contents were two-phase, the quality (kg/kg) and the liquid mass (kg), as the Review shows them.
 */
export type KeyFigures = [temperatureK: number | null, absolutePressurePa: number | null, quality: number | null, liquidMassKg: number | null];

/** The key figures of a stored check (KeyFigures), read defensively: an older or damaged record gives nulls. */
export function keyFiguresOf(r: { reading: unknown; result: unknown }): KeyFigures {
  const inventory = field(r.result, 'inventory');
  const twoPhase = field(inventory, 'regime') === 'two-phase';
  return [
    finiteOrNull(field(r.reading, 'temperatureK')),
    finiteOrNull(field(field(r.result, 'reading'), 'absolutePressurePa')),
    twoPhase ? finiteOrNull(field(inventory, 'quality')) : null,
    twoPhase ? finiteOrNull(field(inventory, 'liquidMassKg')) : null,
  ];
}
