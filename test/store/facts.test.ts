// The facts the month buckets keep: a check's findings (its outcome), for records of every release.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { evaluateCheck, isStandingRule, outcomeOfStoredCautions, saturationPressure, STANDING_RULES } from '../../src/core/index.ts';
import { findingMaskOf, findingMaskOfText, outcomeOfMask, outcomeOfRecord, STANDING_RULE_IDS } from '../../src/store/facts.ts';
import { canonicalJson } from '../../src/store/integrity.ts';
import { testVessel } from '../core/check/test-vessel.ts';

describe('the store\'s copy of the standing rules', () => {
  it('is exactly the check engine\'s STANDING_RULES (the store takes only types from the core, so it keeps a copy)', () => {
    expect([...STANDING_RULE_IDS].sort()).toEqual([...STANDING_RULES].sort());
  });
});

describe('findings mask and outcome of stored records', () => {
  const reading = (T: number, p: number) => ({ time: '2026-12-01T10:00:00+01:00', temperatureK: T, pressure: { reference: 'absolute' as const, pressurePa: p }, weight: { kind: 'net' as const, netKg: 1000 } });
  it('a version 2 result: the outcome it was saved with, from its findings', () => {
    for (const [T, factor] of [[394.15, 1], [388.45, 1.3], [460, 1]] as const) {
      const result = evaluateCheck(testVessel(), reading(T, saturationPressure(T) * factor));
      const record = { result, cautions: result.cautions.map(({ signal, message, rule }) => ({ signal, message, rule })) };
      expect(outcomeOfRecord(record)).toBe(result.outcome);
      expect(outcomeOfStoredCautions(record.cautions)).toBe(result.outcome);
    }
  });
  it('a version 1 result: classified by rule ids, as the core classifies them (fast-check over rule mixes)', () => {
    const rules = [...STANDING_RULES, 'noncondensable-gas', 'pressure-at-mawp', 'vacuum-now', 'an-unknown-rule'];
    fc.assert(
      fc.property(fc.array(fc.record({ signal: fc.constantFrom('DANGER', 'WARNING', 'CAUTION', 'NOTICE' as const), rule: fc.constantFrom(...rules) }), { maxLength: 8 }), (cautions) => {
        const stored = cautions.map((c) => ({ ...c, message: 'm' }));
        const record = { result: { saturation: {} }, cautions: stored };
        expect(outcomeOfRecord(record)).toBe(outcomeOfStoredCautions(stored));
        for (const c of stored) if (!isStandingRule(c.rule)) expect(findingMaskOf(record)).toBeGreaterThan(0);
      }),
    );
  });
  it('findingMaskOfText reads the same mask from a record\'s canonical text as from the parsed record, v1 and v2 alike (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.record({ signal: fc.constantFrom('DANGER', 'WARNING', 'CAUTION', 'NOTICE' as const), rule: fc.constantFrom(...STANDING_RULES, 'noncondensable-gas', 'x'), message: fc.string() }), { maxLength: 6 }),
        fc.boolean(),
        (cautions, v2) => {
          const result = v2 ? { resultVersion: 2, findings: cautions.filter((c) => !isStandingRule(c.rule)) } : { saturation: { verdict: { verdict: 'consistent' } } };
          const record = { appVersion: '0.1.0', cautions, corrects: null, id: 'x', result, seq: 1 };
          const text = canonicalJson(record);
          expect(findingMaskOfText(text)).toBe(findingMaskOf(record));
          expect(outcomeOfMask(findingMaskOfText(text))).toBe(outcomeOfRecord(record));
        },
      ),
    );
  });
});
