// When a vessel's next check falls due: its last check, the check interval the plant set on it, and
// the time now. How often a vessel is checked is the plant's decision under its inspection regime and
// local codes; the app only keeps the interval and counts from the last check (common practice for
// a routine round: the next check is due one interval after the last one). Pure: now is a parameter.

import { requireInRange } from '../errors.ts';

/** The shortest interval a vessel may be given: one hour (a check every shift is the shortest usual round; common practice). */
export const CHECK_INTERVAL_MIN_S = 3_600;
/** The longest: 1,096 days, three years (longer than a routine round; a longer one is an inspection, not a check). */
export const CHECK_INTERVAL_MAX_S = 1_096 * 86_400;

const MS_PER_DAY = 86_400_000;

/** Ids of the states: no interval set, never checked (due now), in date, due today, overdue. */
export type CheckDueState = 'no-interval' | 'never-checked' | 'in-date' | 'due-today' | 'overdue';

export type CheckDue =
  | { state: 'no-interval' }
  | { state: 'never-checked'; intervalS: number }
  | {
      state: 'in-date' | 'due-today' | 'overdue';
      intervalS: number;
      lastCheckMs: number;
      /** lastCheckMs + interval. */
      dueMs: number;
      /** dueMs − nowMs: zero or negative once overdue. */
      untilDueMs: number;
    };

/**
 * The due state of a vessel's routine check. `lastCheckMs`: its latest check, ms since the epoch, or
 * null for none; `intervalS`: its check interval in s (CHECK_INTERVAL_MIN_S to CHECK_INTERVAL_MAX_S),
 * or null for none set; `nowMs`: the time now; `todayEndMs`: the end of the person's day (nowMs to
 * nowMs + 25 h, a day with a clock change; nowMs + 24 h when absent). Overdue from the due time
 * itself; due today when it falls at or before `todayEndMs`.
 * @throws InputError naming the field for a value that is not finite or outside its range
 */
export function checkDue(lastCheckMs: number | null, intervalS: number | null, nowMs: number, todayEndMs?: number): CheckDue {
  requireInRange('time now', nowMs, -8.64e15, 8.64e15, 'ms');
  const dayEnd = todayEndMs ?? nowMs + MS_PER_DAY;
  requireInRange('end of today', dayEnd, nowMs, nowMs + 25 * 3_600_000, 'ms');
  if (intervalS === null) return { state: 'no-interval' };
  requireInRange('check interval', intervalS, CHECK_INTERVAL_MIN_S, CHECK_INTERVAL_MAX_S, 's');
  if (lastCheckMs === null) return { state: 'never-checked', intervalS };
  requireInRange('last check', lastCheckMs, -8.64e15, 8.64e15, 'ms');
  const dueMs = lastCheckMs + intervalS * 1000;
  const untilDueMs = dueMs - nowMs;
  const state = untilDueMs <= 0 ? 'overdue' : dueMs <= dayEnd ? 'due-today' : 'in-date';
  return { state, intervalS, lastCheckMs, dueMs, untilDueMs };
}

/** How urgent each state is, most urgent first (a list of vessels sorts by it). */
export const CHECK_DUE_ORDER: readonly CheckDueState[] = ['overdue', 'never-checked', 'due-today', 'in-date', 'no-interval'];
