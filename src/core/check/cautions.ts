// Cautions: each carries an ISO 3864 / ANSI Z535 signal word, a short message and the rule that
// raised it. The rule catalogue fixes each rule's signal word, what kind of statement it is and
// why it carries that word, so a rule cannot be raised at two levels by accident and the reason
// for every level is written beside it.
//
// Three kinds (our own split, issue 9):
// - finding: what this reading says about the vessel now (gauge and thermometer disagree, gas,
//   at or over a pressure limit, liquid-full, vacuum now, over the design temperature, a stored
//   value contradicted by this reading). Findings decide the check's outcome.
// - standing: hazards of hot contents whatever the reading (flash on release, scald, stored
//   pressure behind a door, vacuum if sealed and cooled ...). Shown once, folded; never the outcome.
// - method: notes on what the check itself can and cannot tell (the saturation check's limits,
//   bulk quality is not steam dryness, the atmosphere was assumed), and the standing note. They
//   describe the method, not the vessel, so they sit with the standing items and never decide the
//   outcome either.
// Fill-plan rules are kind 'plan': they describe a plan, not a vessel.
//
// Signal words by their meaning (ISO 3864-2:2016 §3 and ANSI Z535.4-2011 §4.13, as usually
// summarised; the clause numbers are from memory): DANGER, a hazard that will cause death or
// serious injury if not avoided; WARNING, could cause death or serious injury; CAUTION, could
// cause minor or moderate injury; NOTICE, practices not related to personal injury.

import type { Caution, CautionPart, CautionQuantity, Outcome, SignalWord } from './check-result.ts';
import { STANDING_NOTE_MESSAGE } from './standing-note.ts';

export type { Caution, CautionPart, CautionQuantity, Outcome, SignalWord } from './check-result.ts';

/** A caution's wording both ways: stored text and parts. */
export interface CautionWording {
  message: string;
  parts: CautionPart[];
}

/** The stored text of one quantity: °C, K, kPa or kg, with a true minus sign like the figures. */
export function quantityText(q: CautionQuantity): string {
  switch (q.kind) {
    case 'temperature': return `${fixed(q.K - 273.15, q.decimals ?? 1)} °C`;
    case 'temperature-difference': return `${fixed(q.K, q.decimals ?? 1)} K`;
    case 'pressure': return `${fixed(q.Pa / 1000, q.decimals ?? 1)} kPa`;
    case 'mass': return `${fixed(q.kg, q.decimals ?? 1)} kg`;
  }
}

/** x to d decimals with a true minus sign (a check formats a dozen figures: no regex per figure). */
function fixed(x: number, d: number): string {
  const s = x.toFixed(d);
  return s.charCodeAt(0) === 45 ? '\u2212' + s.slice(1) : s;
}

/** Tagged template for caution wording: interpolate celsius(), kilopascal(), kelvinDifference(), kilograms() or plain text. */
export function say(strings: TemplateStringsArray, ...values: (CautionPart | number)[]): CautionWording {
  // Plain loops: every check words a dozen cautions, and the callbacks showed in its profile.
  const parts: CautionPart[] = [];
  for (let i = 0; i < strings.length; i++) {
    appendPart(parts, strings[i] as string);
    if (i < values.length) {
      const v = values[i] as CautionPart | number;
      appendPart(parts, typeof v === 'number' ? String(v) : v);
    }
  }
  let message = '';
  for (const p of parts) message += typeof p === 'string' ? p : quantityText(p);
  return { message, parts };
}

/** Adds a part, merging neighbouring text so the parts stay short. */
function appendPart(parts: CautionPart[], p: CautionPart): void {
  const last = parts[parts.length - 1];
  if (typeof p === 'string' && typeof last === 'string') parts[parts.length - 1] = last + p;
  else if (p !== '') parts.push(p);
}

/** What kind of statement a rule makes (see the top of this file). */
export type RuleKind = 'finding' | 'standing' | 'method' | 'plan';

export interface RuleEntry {
  signal: SignalWord;
  kind: RuleKind;
}

/**
 * Every rule: its signal word and its kind; why it carries that word is in rule-reasons.ts
 * (RULE_REASONS, one entry per rule, kept apart so the reasons are not shipped in the app's
 * JavaScript), and the thresholds live beside the code that raises each rule
 * (check-rules.ts). A rule added later (an instrument past its calibration date, for one) is one
 * more entry here, one in RULE_REASONS and one more test in test/core/check/rules.test.ts.
 */
export const RULE_CATALOGUE = {
  // Findings: the vessel now.
  'liquid-full-now': { signal: 'DANGER', kind: 'finding' },
  'liquid-full-within-band': { signal: 'WARNING', kind: 'finding' },
  'pressure-above-mawp': { signal: 'DANGER', kind: 'finding' },
  'pressure-at-mawp': { signal: 'WARNING', kind: 'finding' },
  'pressure-above-relief-set': { signal: 'WARNING', kind: 'finding' },
  'pressure-at-relief-set': { signal: 'WARNING', kind: 'finding' },
  'pressure-near-relief-set': { signal: 'CAUTION', kind: 'finding' },
  'vacuum-now': { signal: 'WARNING', kind: 'finding' },
  'liquid-full-on-heating': { signal: 'WARNING', kind: 'finding' },
  'liquid-full-on-warming': { signal: 'WARNING', kind: 'finding' },
  'above-design-temperature': { signal: 'WARNING', kind: 'finding' },
  'noncondensable-gas': { signal: 'WARNING', kind: 'finding' },
  'pressure-below-saturation': { signal: 'CAUTION', kind: 'finding' },
  'superheated-pressure-mismatch': { signal: 'CAUTION', kind: 'finding' },
  'hydraulic-pressure-mismatch': { signal: 'CAUTION', kind: 'finding' },
  'site-atmosphere-differs': { signal: 'CAUTION', kind: 'finding' },
  // Standing hazards: hot contents whatever the reading.
  'do-not-open-under-pressure': { signal: 'DANGER', kind: 'standing' },
  'flash-on-release': { signal: 'WARNING', kind: 'standing' },
  'scald': { signal: 'WARNING', kind: 'standing' },
  'hot-surface': { signal: 'WARNING', kind: 'standing' },
  'pressure-after-cooling': { signal: 'WARNING', kind: 'standing' },
  'vacuum-on-cooling': { signal: 'WARNING', kind: 'standing' },
  'vacuum-on-cooling-protected': { signal: 'NOTICE', kind: 'standing' },
  'quench-vacuum': { signal: 'WARNING', kind: 'standing' },
  'water-hammer': { signal: 'WARNING', kind: 'standing' },
  'freezing': { signal: 'WARNING', kind: 'standing' },
  'boil-over-on-opening': { signal: 'WARNING', kind: 'standing' },
  // Method notes (and the standing note): what the check itself can tell.
  'saturation-check-limits': { signal: 'NOTICE', kind: 'method' },
  'atmosphere-assumed': { signal: 'NOTICE', kind: 'method' },
  'bulk-quality-not-dryness': { signal: 'NOTICE', kind: 'method' },
  'quality-undetermined': { signal: 'NOTICE', kind: 'method' },
  'standing-note': { signal: 'NOTICE', kind: 'method' },
  // Fill plans: a plan, not the vessel now.
  'plan-exceeds-two-phase-charge': { signal: 'WARNING', kind: 'plan' },
  'plan-does-not-fit': { signal: 'WARNING', kind: 'plan' },
  'plan-target-above-mawp': { signal: 'WARNING', kind: 'plan' },
  'plan-target-above-relief-set': { signal: 'WARNING', kind: 'plan' },
  'plan-above-design-temperature': { signal: 'WARNING', kind: 'plan' },
  'plan-assumes-air-removed': { signal: 'NOTICE', kind: 'method' },
} as const satisfies Record<string, RuleEntry>;

export type CautionRule = keyof typeof RULE_CATALOGUE;

/**
 * Rules that earlier versions raised and this one no longer does, with the kind and signal word
 * they had, so a stored record carrying one is still classified (outcomeOfStoredCautions).
 */
export const RETIRED_RULES = {
  // Replaced by liquid-full-within-band (issue 9: the band reaching liquid-full is its own state).
  'quality-band-reaches-liquid-full': { signal: 'CAUTION', kind: 'finding' },
  // Renamed: "safe" overclaimed (issue 9).
  'plan-exceeds-safe-charge': { signal: 'DANGER', kind: 'plan' },
} as const satisfies Record<string, RuleEntry>;

/** Every rule and its signal word (derived from RULE_CATALOGUE; kept for older readers). */
export const CAUTION_RULES = Object.fromEntries(
  Object.entries(RULE_CATALOGUE).map(([rule, entry]) => [rule, entry.signal]),
) as { readonly [R in CautionRule]: (typeof RULE_CATALOGUE)[R]['signal'] };

/** Rule ids that never decide the outcome: standing hazards, notes on the method, and the standing note. */
export const STANDING_RULES: readonly string[] = [...Object.entries(RULE_CATALOGUE), ...Object.entries(RETIRED_RULES)]
  .filter(([, e]) => e.kind === 'standing' || e.kind === 'method')
  .map(([rule]) => rule);

/** Of those, the notes on the method (and the standing note), which a screen may group apart from the hazards. */
export const METHOD_RULES: readonly string[] = Object.entries(RULE_CATALOGUE).filter(([, e]) => e.kind === 'method').map(([rule]) => rule);

const STANDING = new Set(STANDING_RULES);

/** Whether a rule id is a standing item (hazard, method note or the standing note): never part of the outcome. An unknown id is not. */
export function isStandingRule(rule: string): boolean {
  return STANDING.has(rule);
}

/**
 * Rules about the vessel as it is now: the findings (kept under its first name for older readers;
 * a headline leads with these, so a standing "if" hazard does not turn every result red).
 */
export const ACT_NOW_RULES: readonly CautionRule[] = (Object.keys(RULE_CATALOGUE) as CautionRule[]).filter((r) => RULE_CATALOGUE[r].kind === 'finding');

const ORDER: Record<SignalWord, number> = { DANGER: 0, WARNING: 1, CAUTION: 2, NOTICE: 3 };
const WORDS: readonly SignalWord[] = ['DANGER', 'WARNING', 'CAUTION', 'NOTICE'];

/** The worst signal word among findings, 'none' when there are none. */
export function outcomeOf(findings: readonly { signal: SignalWord }[]): Outcome {
  let worst = WORDS.length;
  for (const f of findings) worst = Math.min(worst, ORDER[f.signal] ?? WORDS.length);
  return worst < WORDS.length ? WORDS[worst]! : 'none';
}

/**
 * For records saved before findings existed: the outcome from stored cautions by their rule ids
 * (the worst signal word among those that are not standing items, as stored; an unknown rule
 * counts, so nothing is hidden). Never rewrites the record.
 */
export function outcomeOfStoredCautions(cautions: readonly { signal: string; rule: string }[]): Outcome {
  let worst = WORDS.length;
  for (const c of cautions) {
    if (isStandingRule(c.rule)) continue;
    const i = WORDS.indexOf(c.signal as SignalWord);
    if (i >= 0 && i < worst) worst = i;
  }
  return worst < WORDS.length ? WORDS[worst]! : 'none';
}

/** A caution for a catalogued rule; wording from `say` also carries its parts. */
export function caution(rule: CautionRule, wording: string | CautionWording): Caution {
  const signal = RULE_CATALOGUE[rule].signal;
  return typeof wording === 'string'
    ? { signal, message: wording, rule }
    : { signal, message: wording.message, rule, parts: wording.parts };
}

/** The note every result carries, worded in standing-note.ts. */
export const STANDING_NOTE: Caution = caution('standing-note', STANDING_NOTE_MESSAGE);

/** Most severe first, stable within a level. */
function bySeverity(list: readonly Caution[]): Caution[] {
  return list
    .map((c, i) => ({ c, i }))
    .sort((a, b) => ORDER[a.c.signal] - ORDER[b.c.signal] || a.i - b.i)
    .map(({ c }) => c);
}

/** Cautions most severe first (stable within a level), the standing note last. */
export function withStandingNote(list: Caution[]): Caution[] {
  return [...bySeverity(list), STANDING_NOTE];
}

/** A temperature inside a caution's wording. T in K. */
export function celsius(temperatureK: number): CautionQuantity {
  return { kind: 'temperature', K: temperatureK };
}

/** A pressure (gauge or absolute, as the wording says) inside a caution's wording. p in Pa. */
export function kilopascal(pressurePa: number): CautionQuantity {
  return { kind: 'pressure', Pa: pressurePa };
}

/** A temperature difference inside a caution's wording. ΔT in K. */
export function kelvinDifference(differenceK: number, decimals = 1): CautionQuantity {
  return { kind: 'temperature-difference', K: differenceK, decimals };
}

/** A mass inside a caution's wording. m in kg. */
export function kilograms(massKg: number, decimals = 1): CautionQuantity {
  return { kind: 'mass', kg: massKg, decimals };
}

/** Several pieces of wording as one. */
export function joined(...pieces: CautionWording[]): CautionWording {
  const parts: CautionPart[] = [];
  for (const w of pieces) for (const p of w.parts) appendPart(parts, p);
  return { message: pieces.map((w) => w.message).join(''), parts };
}

/** The findings of one evaluated check, most severe first, and its standing items (hazards, then method notes, the standing note last). */
export interface CheckCautions {
  findings: Caution[];
  standing: Caution[];
}

/** Splits raised cautions by their rule's kind and orders each list. */
export function sortedCautions(raised: readonly Caution[]): CheckCautions & { cautions: Caution[] } {
  const findings = bySeverity(raised.filter((c) => !isStandingRule(c.rule)));
  const hazards = bySeverity(raised.filter((c) => isStandingRule(c.rule) && !METHOD_RULES.includes(c.rule)));
  const notes = bySeverity(raised.filter((c) => METHOD_RULES.includes(c.rule)));
  return {
    findings,
    standing: [...hazards, ...notes, STANDING_NOTE],
    cautions: withStandingNote([...findings, ...hazards, ...notes]),
  };
}

