// The engine's outputs for a fixed set of invented checks and plans (engine-cases.ts), held to a
// fixture captured from the engine before its speed work: every figure must be byte-identical.
// Regenerate only with a commit that says exactly why:
//   TANKSIDE_WRITE_ENGINE_FIXTURE=1 npx vitest run test/core/check/engine-outputs.test.ts
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

const stored = existsSync(FIXTURE) ? (JSON.parse(readFileSync(FIXTURE, 'utf8')) as typeof outputs) : null;

describe('engine outputs are byte-identical to the stored fixture', () => {
  it('the fixture exists and covers every case', () => {
    expect(stored).not.toBeNull();
    expect(Object.keys(stored!.checks)).toEqual(CHECK_CASES.map((c) => c.name));
    expect(Object.keys(stored!.plans)).toEqual(PLAN_CASES.map((c) => c.name));
  });
  for (const c of CHECK_CASES) {
    it(`check: ${c.name}`, () => {
      expect(JSON.stringify(outputs.checks[c.name])).toBe(JSON.stringify(stored!.checks[c.name]));
    });
  }
  for (const c of PLAN_CASES) {
    it(`plan: ${c.name}`, () => {
      expect(JSON.stringify(outputs.plans[c.name])).toBe(JSON.stringify(stored!.plans[c.name]));
    });
  }
});
