// The one adapter between the check engine's result and the screens' outcome. The engine's second
// pass (issue 9) gives every result `findings`, `standing` and `outcome`; until a result carries
// them — and for every record saved before — they are derived here from the cautions' rule ids, the
// way that contract defines them: findings are what this reading says about the vessel now; standing
// hazards of hot contents and notes about the method never drive the outcome. When the engine's own
// fields are present they are used as they are, so this module is the only place that changes when
// they land.
import type { SignalWord } from '../../core/index.ts';

export type Outcome = SignalWord | 'none';

interface CautionLike { signal: string; rule: string; message: string }

/** Hazards of hot contents whatever the reading, and the standing note (the contract's standing list, as rules exist today). */
const STANDING_RULES: readonly string[] = ['flash-on-release', 'vacuum-on-cooling', 'scald', 'standing-note'];
/** Notes about the check's method, not about the vessel: shown with their figures, folded with the standing hazards' kind. */
const METHOD_NOTES: readonly string[] = ['saturation-check-limits', 'atmosphere-assumed', 'bulk-quality-not-dryness', 'plan-assumes-air-removed'];

const ORDER: Record<string, number> = { DANGER: 0, WARNING: 1, CAUTION: 2, NOTICE: 3 };

/** True for a rule that never drives the outcome. */
export function isStandingOrNote(rule: string): boolean {
  return STANDING_RULES.includes(rule) || METHOD_NOTES.includes(rule);
}

/** The worst signal word among `findings`, 'none' when there are none. */
export function worstOf(findings: readonly { signal: string }[]): Outcome {
  let best: Outcome = 'none';
  for (const f of findings) if (f.signal in ORDER && (best === 'none' || ORDER[f.signal]! < ORDER[best]!)) best = f.signal as SignalWord;
  return best;
}

export interface OutcomeSplit<C extends CautionLike> {
  outcome: Outcome;
  /** What this reading says about the vessel now, most severe first. */
  findings: C[];
  /** Everything else (standing hazards, method notes, the standing note), each once. */
  others: C[];
}

/**
 * A result's (or a stored record's) outcome and its cautions split once: the engine's `findings`
 * and `outcome` when it gave them, otherwise derived from the rule ids of `cautions`.
 */
export function splitOutcome<C extends CautionLike>(result: { cautions: readonly C[]; findings?: readonly C[]; outcome?: string }): OutcomeSplit<C> {
  const cautions = [...result.cautions];
  if (Array.isArray(result.findings) && typeof result.outcome === 'string') {
    const ids = new Set(result.findings.map((f) => `${f.rule}:${f.message}`));
    return { outcome: result.outcome as Outcome, findings: [...result.findings], others: cautions.filter((c) => !ids.has(`${c.rule}:${c.message}`)) };
  }
  const byOrder = (a: C, b: C) => (ORDER[a.signal] ?? 9) - (ORDER[b.signal] ?? 9);
  const findings = cautions.filter((c) => !isStandingOrNote(c.rule)).sort(byOrder);
  return { outcome: worstOf(findings), findings, others: cautions.filter((c) => isStandingOrNote(c.rule)) };
}

/** The word a person reads for an outcome. */
export function outcomeLabel(o: Outcome): string {
  return o === 'none' ? 'No finding' : o;
}
