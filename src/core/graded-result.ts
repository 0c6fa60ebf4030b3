// How a cycle or a periodic test is graded, the same way as a check (issue 9's outcome contract):
// `findings` are what these readings show, `standing` what applies whatever they show (the standing
// note last), `outcome` the worst signal word among the findings alone, and `cautions` the union,
// most severe first with the standing note last, for readers that know only one list.
//
// The outcome is the check engine's own (outcomeOf, cautions.ts): this module keeps the names the
// cycle and periodic-test rooms use (worstSignal, GradedOutcome) and delegates to it.

import { outcomeOf, type Caution, type CautionWording, type Outcome, type SignalWord } from './check/cautions.ts';

/** Worst signal word among the findings, or 'none': the check engine's Outcome. */
export type GradedOutcome = Outcome;

/** The four lists every graded result carries. */
export interface Graded {
  findings: Caution[];
  standing: Caution[];
  outcome: GradedOutcome;
  cautions: Caution[];
}

const ORDER: Record<SignalWord, number> = { DANGER: 0, WARNING: 1, CAUTION: 2, NOTICE: 3 };

/** Worst signal word among the findings; 'none' when there are none (outcomeOf). */
export function worstSignal(findings: readonly { signal: SignalWord }[]): GradedOutcome {
  return outcomeOf(findings);
}

/**
 * Grades a result. `standingNote` goes last in both `standing` and `cautions`; every other caution
 * is ordered most severe first, keeping the order given within a signal word.
 */
export function grade(findings: Caution[], standing: Caution[], standingNote: Caution): Graded {
  const bySeverity = (list: Caution[]) =>
    list.map((c, i) => ({ c, i })).sort((a, b) => ORDER[a.c.signal] - ORDER[b.c.signal] || a.i - b.i).map(({ c }) => c);
  const orderedFindings = bySeverity(findings);
  return {
    findings: orderedFindings,
    standing: [...bySeverity(standing), standingNote],
    outcome: worstSignal(orderedFindings),
    cautions: [...bySeverity([...orderedFindings, ...standing]), standingNote],
  };
}

/** A caution for a rule of a catalogue that fixes each rule's signal word (like CAUTION_RULES). */
export function catalogueCaution<R extends string>(
  catalogue: Readonly<Record<R, SignalWord>>,
  rule: R,
  wording: string | CautionWording,
): Caution {
  return typeof wording === 'string'
    ? { signal: catalogue[rule], message: wording, rule }
    : { signal: catalogue[rule], message: wording.message, rule, parts: wording.parts };
}
