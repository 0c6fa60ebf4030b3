// Runs `action`, which must throw an InputError, and returns the error for further checks.
import { expect } from 'vitest';
import { InputError, type InputProblem } from '../../../src/core/errors.ts';

export function expectInputError(action: () => unknown, field: string, problem: InputProblem): InputError {
  let caught: unknown;
  try {
    action();
  } catch (e) {
    caught = e;
  }
  expect(caught, 'expected an InputError to be thrown').toBeInstanceOf(InputError);
  const error = caught as InputError;
  expect(error.field).toBe(field);
  expect(error.problem).toBe(problem);
  expect(error.message).toContain(field);
  return error;
}
