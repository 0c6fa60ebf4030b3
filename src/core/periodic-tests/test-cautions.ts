// The cautions of the periodic steam and chamber tests. Each rule has one signal word. Findings say
// what this test's figures show against its limit; standing cautions apply to every such test; the
// standing note comes last.
//
// Two quantities are kept apart in every wording: the dryness fraction from a throttling
// calorimeter, and the dryness value of the vacuum-flask method, a test value that only
// approximates it. So are the non-condensable gas test (gas collected per volume of condensate)
// and what a pressure-temperature agreement can see (gross air, at the percent level).

import type { Caution, CautionWording } from '../check/cautions.ts';
import { catalogueCaution, grade, type Graded } from '../graded-result.ts';

/** Every periodic-test rule and its signal word. */
export const PERIODIC_TEST_CAUTION_RULES = {
  'throttling-dryness-below-limit': 'WARNING',
  'expansion-superheat-above-limit': 'WARNING',
  'expansion-not-to-atmosphere': 'NOTICE',
  'expansion-below-saturation': 'NOTICE',
  'noncondensable-gas-above-limit': 'WARNING',
  'vacuum-leak-above-limit': 'WARNING',
  'vacuum-leak-band-reaches-limit': 'CAUTION',
  'vacuum-pressure-falling': 'CAUTION',
  'vacuum-leak-band-not-estimated': 'NOTICE',
  'dryness-value-below-limit': 'WARNING',
  'dryness-value-above-one': 'CAUTION',
  'air-removal-test-failed': 'WARNING',
  'throttling-result-is-dryness-fraction': 'NOTICE',
  'dryness-value-is-test-value': 'NOTICE',
  'noncondensable-gas-not-saturation-check': 'NOTICE',
  'steam-sampling-hot': 'CAUTION',
  'periodic-test-standing-note': 'NOTICE',
} as const satisfies Record<string, Caution['signal']>;

export type PeriodicTestCautionRule = keyof typeof PERIODIC_TEST_CAUTION_RULES;

/** Rules that hold for every test of their kind whatever its figures (never part of the outcome). */
export const PERIODIC_TEST_STANDING_RULES: readonly PeriodicTestCautionRule[] = [
  'throttling-result-is-dryness-fraction', 'dryness-value-is-test-value', 'noncondensable-gas-not-saturation-check',
  'steam-sampling-hot', 'periodic-test-standing-note',
];

/** A caution for a catalogued periodic-test rule. */
export function testCaution(rule: PeriodicTestCautionRule, wording: string | CautionWording): Caution {
  return catalogueCaution(PERIODIC_TEST_CAUTION_RULES, rule, wording);
}

/** The note every periodic test carries (wording ours). Names only the standard the default limits come from. */
// Marked pure (this and the next) so a build that does not use the tests leaves their wording out of the start-up JavaScript.
export const PERIODIC_TEST_STANDING_NOTE: Caution = /* @__PURE__ */ testCaution('periodic-test-standing-note',
  'This record reports what the test readings show against the limits entered. The test methods, the limits and whether the ' +
    'steriliser may be used are set by the site\'s validated procedures, the standards they follow (such as EN 285) and licensed practice.');

/** Live steam at the sampling point: every steam-sampling test carries it. Practice as for autoclave work (field-practice.md §6.4). */
export const STEAM_SAMPLING_HOT: Caution = /* @__PURE__ */ testCaution('steam-sampling-hot',
  'Sampling live steam: the sampling valve, pipework and test apparatus scald on contact, and a connection that slips releases a steam jet. ' +
    'Wear face, eye and heat-resistant hand protection and open the sampling valve slowly.');

/** Grades a periodic test: its findings, any standing cautions of its kind, and the standing note last. */
export function gradeTest(findings: Caution[], standing: Caution[] = []): Graded {
  return grade(findings, standing, PERIODIC_TEST_STANDING_NOTE);
}
