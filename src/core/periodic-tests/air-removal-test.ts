// The air-removal test result as the technician records it: a test pack run through an empty
// chamber, read as pass or fail, with a note and the test pack's batch so the record can be traced.
// The app does not read the pack; it keeps what the person recorded beside the day's cycles.

import { InputError } from '../errors.ts';
import type { Graded } from '../graded-result.ts';
import { gradeTest, testCaution } from './test-cautions.ts';

export interface AirRemovalTestRecord {
  result: 'pass' | 'fail';
  /** Free text, up to 2 000 characters (may be empty). */
  note: string;
  /** The test pack's batch (lot) as printed on it, 1–100 characters. */
  testPackBatch: string;
}

export const AIR_REMOVAL_TEST_LIMITS = { noteChars: 2000, batchChars: 100 } as const;

/** Throws InputError naming the field: "air-removal test result" (pass or fail), "note" (≤ 2 000 characters), "test pack batch" (1–100 characters). */
export function validateAirRemovalTest(record: AirRemovalTestRecord): void {
  const L = AIR_REMOVAL_TEST_LIMITS;
  if (record?.result !== 'pass' && record?.result !== 'fail') {
    throw new InputError('air-removal test result', 'empty', String(record?.result ?? ''), undefined, 'air-removal test result: must be pass or fail.');
  }
  if (typeof record.note !== 'string' || record.note.length > L.noteChars) {
    throw new InputError('note', 'out-of-range', typeof record.note === 'string' ? record.note.length : String(record.note),
      { min: 0, max: L.noteChars, unit: 'characters' }, `note: at most ${L.noteChars} characters.`);
  }
  const batch = typeof record.testPackBatch === 'string' ? record.testPackBatch.trim() : '';
  if (batch === '' || batch.length > L.batchChars) {
    throw new InputError('test pack batch', batch === '' ? 'empty' : 'out-of-range', String(record.testPackBatch ?? ''),
      { min: 1, max: L.batchChars, unit: 'characters' }, `test pack batch: the batch printed on the test pack, 1 to ${L.batchChars} characters.`);
  }
}

export interface AirRemovalTestEvaluation extends Graded {
  test: 'air-removal';
  record: AirRemovalTestRecord;
}

/** The recorded air-removal test with its outcome: a fail is a finding. Throws InputError as validateAirRemovalTest. */
export function evaluateAirRemovalTest(record: AirRemovalTestRecord): AirRemovalTestEvaluation {
  validateAirRemovalTest(record);
  const findings = record.result === 'fail'
    ? [testCaution('air-removal-test-failed',
      'The air-removal test is recorded as a fail: air was left in the test pack, so the chamber\'s air removal or a leak needs attention. ' +
        'The site\'s procedure says what may run until it passes.')]
    : [];
  return {
    test: 'air-removal',
    record: { result: record.result, note: record.note, testPackBatch: record.testPackBatch.trim() },
    ...gradeTest(findings),
  };
}
