// The air-removal test record: pass/fail, note and test pack batch, validated; a fail is a finding.
import { describe, expect, it } from 'vitest';
import { evaluateAirRemovalTest, InputError } from '../../../src/core/index.ts';

function errorOf(f: () => unknown): InputError {
  try { f(); } catch (e) { if (e instanceof InputError) return e; throw e; }
  throw new Error('no InputError');
}

describe('air-removal test record', () => {
  it('a pass has no findings; a fail is a WARNING; the batch is kept trimmed', () => {
    const pass = evaluateAirRemovalTest({ result: 'pass', note: 'uniform change', testPackBatch: ' LOT-0412 ' });
    expect(pass.outcome).toBe('none');
    expect(pass.record.testPackBatch).toBe('LOT-0412');
    const fail = evaluateAirRemovalTest({ result: 'fail', note: 'paler centre', testPackBatch: 'LOT-0412' });
    expect(fail.findings.map((f) => f.rule)).toEqual(['air-removal-test-failed']);
    expect(fail.outcome).toBe('WARNING');
    expect(JSON.parse(JSON.stringify(fail))).toEqual(fail);
  });
  it.each([
    ['air-removal test result', { result: 'ok', note: '', testPackBatch: 'A' }],
    ['note', { result: 'pass', note: 'x'.repeat(2001), testPackBatch: 'A' }],
    ['note', { result: 'pass', note: undefined, testPackBatch: 'A' }],
    ['test pack batch', { result: 'pass', note: '', testPackBatch: '   ' }],
    ['test pack batch', { result: 'pass', note: '', testPackBatch: 'B'.repeat(101) }],
  ])('bad input: %s', (field, record) => {
    expect(errorOf(() => evaluateAirRemovalTest(record as never)).field).toBe(field);
  });
});
