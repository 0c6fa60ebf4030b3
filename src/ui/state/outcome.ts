// The one adapter between the check engine's result and the screens' outcome. Every result since
// the engine's second pass (issue 9) carries `findings`, `standing` and `outcome`, used as they are;
// for a record saved before, they are derived from the cautions' rule ids with the engine's own
// classification (the store's copy of the engine's STANDING_RULES, held equal to it by
// test/store/facts.test.ts; taken from the store because the start-up script holds the store but
// not the engine, which loads on demand): findings are what this reading says about the vessel
// now; standing hazards of hot contents and notes about the method never drive the outcome.
import type { Outcome, SignalWord } from '../../core/index.ts';
import { isStandingRuleId } from '../../store/index.ts';

export type { Outcome };

interface CautionLike { signal: string; rule: string; message: string }

const ORDER: Record<string, number> = { DANGER: 0, WARNING: 1, CAUTION: 2, NOTICE: 3 };

/** True for a rule that never drives the outcome (the engine's standing hazards, method notes and standing note). */
export function isStandingOrNote(rule: string): boolean {
  return isStandingRuleId(rule);
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
