import { describe, expect, it } from 'vitest';
import { CALIBRATION_DUE_WORDS, DEFAULT_DUE_SOON_WINDOW_MS, MS_PER_DAY, MS_PER_YEAR, calibrationDue, type InstrumentSpec } from '../../../src/core/instrument/index.ts';
import { expectInputError } from '../units/expect-input-error.ts';

const NOW = Date.parse('2026-12-04T09:00:00Z');
const gauge: InstrumentSpec = { tag: 'PG-7', kind: 'pressure-gauge', range: { low: 0, high: 4e5 }, tolerance: { kind: 'percent-of-span', percentOfSpan: 1.6 } };

describe('calibration due state', () => {
  it('no calibration on record', () => {
    expect(calibrationDue(gauge, [], { nowMs: NOW })).toEqual({ state: 'no-calibration' });
  });
  it('the due date a calibration states wins over the interval', () => {
    const d = calibrationDue(gauge, [{ timeMs: NOW - 10 * MS_PER_DAY, asFoundError: 0, nextDueMs: NOW + 90 * MS_PER_DAY }], { nowMs: NOW });
    expect(d).toMatchObject({ state: 'in-date', dueMs: NOW + 90 * MS_PER_DAY, dueSource: 'stated', untilDueMs: 90 * MS_PER_DAY });
  });
  it('otherwise the date plus the interval: one year by default (common practice), or the instrument\'s own', () => {
    const last = NOW - 200 * MS_PER_DAY;
    expect(calibrationDue(gauge, [{ timeMs: last, asFoundError: 0 }], { nowMs: NOW })).toMatchObject({ dueMs: last + MS_PER_YEAR, dueSource: 'interval' });
    expect(calibrationDue({ ...gauge, calibrationIntervalMs: 180 * MS_PER_DAY }, [{ timeMs: last, asFoundError: 0 }], { nowMs: NOW }).state).toBe('overdue');
  });
  it('the boundaries: overdue from the due instant, due soon within the window (30 days by default, our choice)', () => {
    expect(DEFAULT_DUE_SOON_WINDOW_MS).toBe(30 * MS_PER_DAY);
    const state = (untilDueMs: number, window?: number) =>
      calibrationDue(gauge, [{ timeMs: NOW - 10 * MS_PER_DAY, asFoundError: 0, nextDueMs: NOW + untilDueMs }], { nowMs: NOW, ...(window === undefined ? {} : { dueSoonWindowMs: window }) }).state;
    expect(state(0)).toBe('overdue');
    expect(state(1)).toBe('due-soon');
    expect(state(30 * MS_PER_DAY)).toBe('due-soon');
    expect(state(30 * MS_PER_DAY + 1)).toBe('in-date');
    expect(calibrationDue(gauge, [{ timeMs: NOW - 800 * MS_PER_DAY, asFoundError: 0, nextDueMs: NOW - 400 * MS_PER_DAY }], { nowMs: NOW }).state).toBe('overdue');
    expect(state(5 * MS_PER_DAY, 0)).toBe('in-date');
  });
  it('the latest calibration decides, whatever the order', () => {
    const old = { timeMs: NOW - 900 * MS_PER_DAY, asFoundError: 0 };
    const recent = { timeMs: NOW - 20 * MS_PER_DAY, asFoundError: 0 };
    expect(calibrationDue(gauge, [recent, old], { nowMs: NOW }).state).toBe('in-date');
    expect(calibrationDue(gauge, [old, recent], { nowMs: NOW }).state).toBe('in-date');
  });
  it('every state has a plain word', () => {
    expect(CALIBRATION_DUE_WORDS).toEqual({ 'in-date': 'in date', 'due-soon': 'due soon', overdue: 'overdue', 'no-calibration': 'no calibration on record' });
  });
  it('bad input names the field', () => {
    expectInputError(() => calibrationDue(gauge, [], { nowMs: 1e16 }), 'date now', 'out-of-range');
    expectInputError(() => calibrationDue(gauge, [], { nowMs: NOW, dueSoonWindowMs: -1 }), 'due-soon window', 'out-of-range');
    expectInputError(() => calibrationDue(gauge, [{ timeMs: NOW + MS_PER_DAY, asFoundError: 0 }], { nowMs: NOW }), 'calibration date', 'inconsistent');
    expectInputError(() => calibrationDue({ ...gauge, tag: '' }, [], { nowMs: NOW }), 'instrument tag', 'empty');
    const e = expectInputError(() => calibrationDue(gauge, [{ timeMs: NOW - 9 * MS_PER_DAY, asFoundError: 0, nextDueMs: NOW - 10 * MS_PER_DAY }], { nowMs: NOW }), 'next due date', 'out-of-range');
    expect(e.message).toContain('2026-11-24T09:00:00.000Z');
  });
});
