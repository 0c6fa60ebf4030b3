import { spawnSync } from 'node:child_process';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkDue, CHECK_INTERVAL_MAX_S, CHECK_INTERVAL_MIN_S } from '../../../src/core/check/check-due.ts';
import { InputError } from '../../../src/core/errors.ts';

const HOUR_S = 3_600;
const DAY_S = 86_400;
const at = (iso: string) => Date.parse(iso);

describe('checkDue (issue 14)', () => {
  it('no interval set reads as none, whatever the last check', () => {
    expect(checkDue(null, null, at('2026-12-04T12:00:00Z'))).toEqual({ state: 'no-interval' });
    expect(checkDue(at('2020-01-01T00:00:00Z'), null, at('2026-12-04T12:00:00Z'))).toEqual({ state: 'no-interval' });
  });

  it('an interval and no check on record is due now', () => {
    expect(checkDue(null, 7 * DAY_S, at('2026-12-04T12:00:00Z'))).toEqual({ state: 'never-checked', intervalS: 7 * DAY_S });
  });

  it('weekly: in date, due today, overdue from the due time itself', () => {
    const last = at('2026-11-27T09:30:00Z');
    const weekly = 7 * DAY_S;
    const endOfDay = at('2026-12-05T00:00:00Z');
    expect(checkDue(last, weekly, at('2026-12-03T12:00:00Z'), at('2026-12-04T00:00:00Z')).state).toBe('in-date');
    const today = checkDue(last, weekly, at('2026-12-04T08:00:00Z'), endOfDay);
    expect(today).toMatchObject({ state: 'due-today', dueMs: at('2026-12-04T09:30:00Z'), untilDueMs: 90 * 60_000 });
    expect(checkDue(last, weekly, at('2026-12-04T09:30:00Z'), endOfDay)).toMatchObject({ state: 'overdue', untilDueMs: 0 });
    expect(checkDue(last, weekly, at('2026-12-10T09:30:00Z')).state).toBe('overdue');
  });

  it('without an end of day given, "today" is the next 24 h', () => {
    const now = at('2026-12-04T12:00:00Z');
    expect(checkDue(now - DAY_S * 1000, 2 * DAY_S - 60, now).state).toBe('due-today');
    expect(checkDue(now - DAY_S * 1000, 2 * DAY_S + 60, now).state).toBe('in-date');
  });

  it('due times agree with Python\'s datetime arithmetic (ISO 8601 with offsets; /usr/bin/python3)', () => {
    const cases = [
      { last: '2026-03-28T22:15:00+01:00', days: 1, hours: 6 },
      { last: '2026-10-24T07:00:00-05:00', days: 7, hours: 0 },
      { last: '2024-02-28T23:59:59Z', days: 1, hours: 0 }, // leap day
      { last: '2026-12-31T18:00:00+05:30', days: 30, hours: 12 },
    ];
    const script = [
      'import json, sys, datetime',
      'out = []',
      'for c in json.load(sys.stdin):',
      '    t = datetime.datetime.fromisoformat(c["last"].replace("Z", "+00:00"))',
      '    due = t + datetime.timedelta(days=c["days"], hours=c["hours"])',
      '    out.append(int(due.timestamp() * 1000))',
      'print(json.dumps(out))',
    ].join('\n');
    const r = spawnSync('/usr/bin/python3', ['-c', script], { input: JSON.stringify(cases), encoding: 'utf8' });
    expect(r.status, r.stderr).toBe(0);
    const expected = JSON.parse(r.stdout) as number[];
    cases.forEach((c, i) => {
      const due = checkDue(at(c.last), c.days * DAY_S + c.hours * HOUR_S, at(c.last));
      expect(due.state === 'in-date' || due.state === 'due-today' ? due.dueMs : NaN).toBe(expected[i]);
    });
  });

  it('as time passes the state only moves towards overdue (property)', () => {
    const rank = { 'in-date': 0, 'due-today': 1, overdue: 2 } as const;
    fc.assert(fc.property(
      fc.integer({ min: 0, max: 4e12 }), fc.integer({ min: CHECK_INTERVAL_MIN_S, max: CHECK_INTERVAL_MAX_S }),
      fc.integer({ min: 0, max: 4e9 }), fc.integer({ min: 0, max: 4e9 }),
      (last, interval, a, b) => {
        const s1 = checkDue(last, interval, last + Math.min(a, b));
        const s2 = checkDue(last, interval, last + Math.max(a, b));
        return rank[s1.state as keyof typeof rank] <= rank[s2.state as keyof typeof rank];
      },
    ));
  });

  it('refuses an interval outside 1 h to 1,096 days, and times that are not finite, naming the field', () => {
    const now = at('2026-12-04T12:00:00Z');
    const refusal = (f: () => unknown): InputError => {
      try { f(); } catch (e) { expect(e).toBeInstanceOf(InputError); return e as InputError; }
      throw new Error('expected an InputError');
    };
    expect(refusal(() => checkDue(now, 60, now))).toMatchObject({ field: 'check interval', problem: 'out-of-range', range: { min: 3600, max: 1096 * DAY_S, unit: 's' } });
    expect(refusal(() => checkDue(now, 1097 * DAY_S, now)).field).toBe('check interval');
    expect(refusal(() => checkDue(now, Number.NaN, now)).problem).toBe('not-a-number');
    expect(refusal(() => checkDue(Number.NaN, DAY_S, now)).field).toBe('last check');
    expect(refusal(() => checkDue(now, DAY_S, Number.POSITIVE_INFINITY)).field).toBe('time now');
    expect(refusal(() => checkDue(now, DAY_S, now, now - 1)).field).toBe('end of today');
  });
});
