import { describe, expect, it } from 'vitest';
import { intervalForm, intervalText, readInterval } from '../../src/ui/state/check-interval.ts';
import { byUrgency, vesselDues } from '../../src/ui/state/vessel-due.ts';
import type { VesselRecord } from '../../src/store/index.ts';

const vessel = (tag: string, checkIntervalS?: number): VesselRecord => ({
  id: `00000000-0000-4000-8000-0000000000${tag.slice(-2)}`, tag, tagKey: tag.toLowerCase(), description: '', spec: {} as VesselRecord['spec'],
  retired: false, retiredAt: null, createdAt: '2026-01-01T00:00:00Z', updatedAt: '2026-01-01T00:00:00Z',
  ...(checkIntervalS === undefined ? {} : { checkIntervalS }),
});

describe('the vessel editor\'s check interval (issue 14)', () => {
  it('reads hours, days and weeks with a decimal comma or point; blank is none', () => {
    expect(readInterval('', 'days')).toEqual({ ok: true, intervalS: null });
    expect(readInterval('8', 'hours')).toEqual({ ok: true, intervalS: 28_800 });
    expect(readInterval('1,5', 'days')).toEqual({ ok: true, intervalS: 129_600 });
    expect(readInterval('2', 'weeks')).toEqual({ ok: true, intervalS: 1_209_600 });
  });
  it('refuses what is outside 1 hour to 1,096 days or not a number, naming the field and the range', () => {
    for (const [text, unit] of [['0,5', 'hours'], ['200', 'weeks'], ['weekly', 'days']] as const) {
      const r = readInterval(text, unit);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.message).toMatch(/^Check interval: .*1 hour to 1096 days/);
    }
    expect(readInterval('30', 'hours').ok).toBe(true);
  });
  it('shows a stored interval back in the largest whole unit', () => {
    expect(intervalForm(undefined)).toEqual({ text: '', unit: 'days' });
    expect(intervalForm(604_800)).toEqual({ text: '1', unit: 'weeks' });
    expect(intervalForm(172_800)).toEqual({ text: '2', unit: 'days' });
    expect(intervalForm(28_800)).toEqual({ text: '8', unit: 'hours' });
    expect(intervalText(604_800)).toBe('every 1 week');
    expect(intervalText(28_800)).toBe('every 8 hours');
  });
});

describe('the Vessels screen\'s order (issue 14)', () => {
  it('lists overdue, never checked and due today first, then in date, then vessels with no interval', () => {
    const now = Date.parse('2026-12-04T10:00:00Z');
    const day = 86_400;
    const vs = [vessel('A-01'), vessel('B-02', 7 * day), vessel('C-03', day), vessel('D-04', 30 * day), vessel('E-05', 2 * 3_600)];
    const last = (iso: string) => ({ timeMs: Date.parse(iso) }) as never;
    const dues = vesselDues(vs, [last('2026-12-01T00:00:00Z'), last('2026-11-20T00:00:00Z'), last('2026-12-03T12:00:00Z'), last('2026-12-01T00:00:00Z'), null], now);
    expect(dues.map((d) => d.due.state)).toEqual(['no-interval', 'overdue', 'due-today', 'in-date', 'never-checked']);
    expect(dues.slice().sort(byUrgency).map((d) => d.vessel.tag)).toEqual(['B-02', 'E-05', 'C-03', 'D-04', 'A-01']);
  });
});
