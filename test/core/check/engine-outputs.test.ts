// The engine's outputs for a fixed set of invented checks and plans (engine-cases.ts), held to a
// fixture captured before issue 9's second pass: its speed work had to leave every figure
// byte-identical, and its semantic changes may move only the figures listed in CHANGED below, each
// with its reason. Every other leaf of the fixture must be equal, bit for bit; figures the change
// added are not in the fixture and are tested elsewhere. Regenerate only with a commit that says
// exactly why:  TANKSIDE_WRITE_ENGINE_FIXTURE=1 npx vitest run test/core/check/engine-outputs.test.ts
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { evaluateCheck, planFill } from '../../../src/core/index.ts';
import { CHECK_CASES, PLAN_CASES } from './engine-cases.ts';

const FIXTURE = new URL('./fixtures/engine-outputs.json', import.meta.url);

const outputs = {
  checks: Object.fromEntries(CHECK_CASES.map((c) => [c.name, evaluateCheck(c.vessel, c.reading)])),
  plans: Object.fromEntries(PLAN_CASES.map((c) => [c.name, planFill(c.vessel, c.request)])),
};

if (process.env['TANKSIDE_WRITE_ENGINE_FIXTURE'] === '1') writeFileSync(FIXTURE, JSON.stringify(outputs, null, 1) + '\n');

type Json = null | boolean | number | string | Json[] | { [key: string]: Json };
const stored = existsSync(FIXTURE) ? (JSON.parse(readFileSync(FIXTURE, 'utf8')) as { checks: Record<string, Json>; plans: Record<string, Json> }) : null;

/**
 * Figures issue 9 changed on purpose: a path pattern, the cases it applies to (all when absent) and
 * why; with `relative`, the figure is still compared, to within that fraction of its value.
 */
const CHANGED: readonly { path: RegExp; cases?: readonly string[]; why: string; relative?: number }[] = [
  { path: /^cautions(\[|$)/, why: 'signal words by their meaning, findings apart from standing hazards, new rules and wording (issue 9 §1, §2)' },
  { path: /^hazards\.cooled\.(absolutePressurePa|gaugePressurePa|noncondensablePartialPressurePa|belowAtmosphere|collapseRisk|aboveFormulationLimit)$/, cases: ['liquid-full, hydraulic within IF97', 'liquid-full in region 3', 'liquid-full beyond 100 MPa'], why: 'a vessel liquid-full now has no gas space to carry to ambient, and no cap is shown as a figure (§3)' },
  { path: /^inventory\.hydraulic\.exceedsMawp$/, why: 'certain / possible / no instead of a yes or no (§3)' },
  { path: /^saturation\.pressureBand\.contributions$/, why: 'an object with the indicator and drift parts added (each 0 here); its three first parts are compared one by one' },
  { path: /^inventoryBands\.liquidLevelM\.(plusMinus|worstCase|contributions\.temperature)$/, cases: ['near the triple point'], why: 'the temperature limit may now reach down to 273.15 K, IF97\'s lowest (0.00 °C accepted, §3)' },
  { path: /^largestSafeCharge(\.|$)/, why: 'renamed largestTwoPhaseCharge: "safe" overclaimed (§2); compared under the new name' },
  {
    path: /^(inventory\.liquidLevel\.(levelM|levelFraction)|inventoryBands\.liquidLevelM\.(plusMinus|worstCase|contributions\.(weight|temperature|volume)))$/,
    cases: [
      'horizontal-cylinder, torispherical: two-phase 134 °C', 'horizontal-cylinder, torispherical: low fill, 160 °C, air',
      'horizontal-cylinder, torispherical (custom radii): two-phase 134 °C', 'horizontal-cylinder, torispherical (custom radii): low fill, 160 °C, air',
    ],
    why: 'the horizontal torispherical level solve (Newton\'s method, to 1e-13 of the span) returns an exact root when it meets one, where it used to bisect on to a midpoint 1e-13 of the span below it, and the level band\'s six solves start from the check\'s own level (a cubic in the volume) instead of a plain cylinder\'s (§5 speed); where Newton\'s method ends depends on where it starts: levels move by at most 2e-16 of their value, the level band\'s parts (differences of levels) by at most 4e-9 (3.9e-9 measured)',
    relative: 1e-8,
  },
];

/** Every leaf of a JSON value with its path ("a.b[2].c"). */
function leaves(value: Json, path: string, out: Map<string, Json>): Map<string, Json> {
  if (value !== null && typeof value === 'object') {
    if (Array.isArray(value)) value.forEach((v, i) => leaves(v, `${path}[${i}]`, out));
    else for (const [k, v] of Object.entries(value)) leaves(v, path === '' ? k : `${path}.${k}`, out);
    if ((Array.isArray(value) ? value.length : Object.keys(value).length) === 0) out.set(path, value);
  } else out.set(path, value);
  return out;
}

/** The leaves of the fixture that differ from today's output, after the listed renames, less the changes listed. */
function unexpectedChanges(name: string, before: Json, now: unknown): string[] {
  const current = leaves(JSON.parse(JSON.stringify(now)) as Json, '', new Map());
  const problems: string[] = [];
  for (const [path, value] of leaves(before, '', new Map())) {
    const renamed = path.replace(/^largestSafeCharge/, 'largestTwoPhaseCharge');
    const change = CHANGED.find((c) => c.path.test(path) && (c.cases === undefined || c.cases.includes(name)) && !path.startsWith('largestSafeCharge'));
    const got = current.get(renamed);
    if (change?.relative !== undefined) {
      const close = typeof value === 'number' && typeof got === 'number' && Math.abs(got - value) <= change.relative * Math.abs(value);
      if (!close) problems.push(`${path}: fixture ${JSON.stringify(value)}, now ${JSON.stringify(got)} (more than ${change.relative} of it apart)`);
      continue;
    }
    if (change) continue;
    if (!Object.is(got, value)) problems.push(`${path}: fixture ${JSON.stringify(value)}, now ${JSON.stringify(got)}`);
  }
  return problems;
}

describe('engine outputs: every figure the fixture holds is byte-identical, but for the changes listed with their reasons', () => {
  it('the fixture exists and covers every case', () => {
    expect(stored).not.toBeNull();
    expect(Object.keys(stored!.checks)).toEqual(CHECK_CASES.map((c) => c.name));
    expect(Object.keys(stored!.plans)).toEqual(PLAN_CASES.map((c) => c.name));
  });
  for (const c of CHECK_CASES) {
    it(`check: ${c.name}`, () => {
      expect(unexpectedChanges(c.name, stored!.checks[c.name]!, outputs.checks[c.name])).toEqual([]);
    });
  }
  for (const c of PLAN_CASES) {
    it(`plan: ${c.name}`, () => {
      expect(unexpectedChanges(c.name, stored!.plans[c.name]!, outputs.plans[c.name])).toEqual([]);
    });
  }
});
