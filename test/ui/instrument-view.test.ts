// The register screens' state: the list's order (overdue, due soon, found out of tolerance, none on
// record, in date, retired), and the calibration form's text to SI with each bad field named with
// its valid range. Invented test instruments.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { calibrationFromDraft, EMPTY_CALIBRATION, sortedRegister, type CalibrationDraft } from '../../src/ui/state/instrument-view.ts';
import type { CalibrationEntry, InstrumentHistory, InstrumentRecord } from '../../src/store/index.ts';
import type { InstrumentSpec } from '../../src/core/instrument/index.ts';

const NOW = Date.parse('2026-12-01T12:00:00Z');
const DAY = 86_400_000;
let ids = 0;
function instrument(tag: string, spec: Partial<InstrumentSpec> = {}, displayUnit = 'kPa', retired = false): InstrumentRecord {
  const s: InstrumentSpec = { tag, kind: 'pressure-gauge', range: { low: 0, high: 1e6 }, tolerance: { kind: 'percent-of-span', percentOfSpan: 1 }, ...spec };
  return { id: `00000000-0000-4000-8000-${String(++ids).padStart(12, '0')}`, tag, tagKey: tag.toLowerCase(), spec: s, displayUnit, description: '', origin: { kind: 'entered' }, retired, createdAt: '2026-01-01T00:00:00Z', updatedAt: '2026-01-01T00:00:00Z' };
}
function calibration(i: InstrumentRecord, timeMs: number, asFoundError: number, nextDueMs: number | null = null): CalibrationEntry {
  return { id: `c-${i.id}-${timeMs}`, instrumentId: i.id, time: new Date(timeMs).toISOString(), timeMs, asFoundError, asLeftError: null, referenceValue: null, nextDue: nextDueMs === null ? null : new Date(nextDueMs).toISOString(), nextDueMs, who: 'Test Lab', certificate: '', enteredUnit: 'kPa', note: '', enteredAt: '2026-01-01T00:00:00Z' };
}
const h = (instrument: InstrumentRecord, calibrations: CalibrationEntry[] = []): InstrumentHistory => ({ instrument, calibrations });

describe('the Instruments list', () => {
  it('lists overdue, due soon, found out of tolerance, none on record, in date, then retired; by due date within a state', () => {
    const inDate = instrument('A-IN-DATE');
    const noCal = instrument('B-NONE');
    const soon = instrument('C-SOON');
    const late = instrument('D-LATE');
    const later = instrument('E-LATER');
    const oot = instrument('F-OUT');
    const gone = instrument('G-GONE', {}, 'kPa', true);
    const rows = sortedRegister([
      h(inDate, [calibration(inDate, NOW - 10 * DAY, 100)]),
      h(noCal),
      h(soon, [calibration(soon, NOW - 300 * DAY, 100, NOW + 10 * DAY)]),
      h(later, [calibration(later, NOW - 400 * DAY, 100, NOW - 2 * DAY)]),
      h(late, [calibration(late, NOW - 400 * DAY, 100, NOW - 20 * DAY)]),
      // 15 kPa found on a 1 % class of 1 MPa (10 kPa): out of tolerance, in date.
      h(oot, [calibration(oot, NOW - 10 * DAY, 15_000)]),
      h(gone),
    ], NOW);
    expect(rows.map((r) => [r.history.instrument.tag, r.state.status])).toEqual([
      ['D-LATE', 'overdue'], ['E-LATER', 'overdue'], ['C-SOON', 'due-soon'], ['F-OUT', 'out-of-tolerance'], ['B-NONE', 'no-calibration'], ['A-IN-DATE', 'in-date'], ['G-GONE', 'retired'],
    ]);
  });
});

describe('the calibration form', () => {
  const gauge = h(instrument('PI-1'));
  const rtd = h(instrument('TE-1', { kind: 'rtd', range: { low: 273.15, high: 473.15 }, tolerance: { kind: 'iec-60751', sensorClass: 'A' } }, 'degF'));
  const form = (d: Partial<CalibrationDraft>): CalibrationDraft => ({ ...EMPTY_CALIBRATION, date: '2026-11-20', asFound: '1,5', who: 'Test Lab', ...d });

  it('figures typed in the display unit come out in SI (kPa → Pa; °F differences → K, NIST SP 811 B.8: 1 °F = 5/9 K)', () => {
    const g = calibrationFromDraft(gauge, form({ asLeft: '-0.2', nextDue: '2027-11-20' }), NOW);
    expect(g).toMatchObject({ ok: true, calibration: { asFoundError: 1500, asLeftError: -200, who: 'Test Lab', enteredUnit: 'kPa' } });
    if (!g.ok) throw new Error('refused');
    expect(g.calibration.calibratedAt.toISOString()).toBe('2026-11-20T12:00:00.000Z');
    expect(g.calibration.nextDueAt!.toISOString()).toBe('2027-11-20T12:00:00.000Z');
    const t = calibrationFromDraft(rtd, form({ asFound: '0.9' }), NOW);
    expect(t.ok && t.calibration.asFoundError).toBeCloseTo(0.5, 12);
  });

  it('today\'s date counts from now, so a calibration entered this morning is not "in the future"', () => {
    const early = Date.parse('2026-12-01T06:00:00Z');
    const r = calibrationFromDraft(gauge, form({ date: '2026-12-01' }), early);
    expect(r.ok && r.calibration.calibratedAt.getTime()).toBe(early);
  });

  it('each bad field is named with its valid range; nothing comes out', () => {
    const bad = (d: Partial<CalibrationDraft>) => {
      const r = calibrationFromDraft(gauge, form(d), NOW);
      if (r.ok) throw new Error('accepted');
      return r.errors;
    };
    expect(bad({ asFound: '1200' }).asFound).toBe('as-found error: 1200 kPa is outside the valid range −1000 to 1000 kPa (± the span).');
    expect(bad({ asFound: 'abc' }).asFound).toMatch(/^as-found error: "abc" is not a number/);
    expect(bad({ asFound: '' }).asFound).toMatch(/^as-found error: no value entered/);
    expect(bad({ asLeft: '2000' }).asLeft).toMatch(/^as-left error: 2000 kPa is outside the valid range −1000 to 1000 kPa/);
    expect(bad({ date: '2026-13-01' }).date).toMatch(/^calibration date: "2026-13-01" is not a date; give it as YYYY-MM-DD/);
    expect(bad({ date: '2026-12-05' }).date).toMatch(/^calibration date, calibration 1 of 1 \(PI-1\): 2026-12-05T12:00:00.000Z is after the date now/);
    expect(bad({ nextDue: '2026-11-01' }).nextDue).toBe('next due date: 2026-11-01 must be after the calibration date (2026-11-20).');
    expect(bad({ who: '   ' }).who).toMatch(/^calibrated by: give the person or laboratory \(1 to 120 characters\)/);
    expect(bad({ certificate: 'x'.repeat(121) }).certificate).toMatch(/^certificate: 121 characters; allowed 0 to 120/);
  });

  it('any text either gives SI figures within ± the span or names a field (fast-check, the project seed)', () => {
    fc.assert(fc.property(fc.string(), fc.string(), (asFound, asLeft) => {
      const r = calibrationFromDraft(gauge, form({ asFound, asLeft }), NOW);
      if (r.ok) {
        expect(Math.abs(r.calibration.asFoundError)).toBeLessThanOrEqual(1e6);
        expect(Number.isFinite(r.calibration.asFoundError)).toBe(true);
      } else expect(Object.keys(r.errors).length).toBeGreaterThan(0);
    }));
  });
});
