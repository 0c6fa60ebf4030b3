import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { formatIsoWithOffset, parseIsoWithOffset } from '../../src/store/time.ts';

describe('formatIsoWithOffset', () => {
  it('writes local wall-clock time with the offset east of UTC', () => {
    const t = new Date('2026-12-01T21:05:00Z');
    expect(formatIsoWithOffset(t, 60)).toBe('2026-12-01T22:05:00+01:00');
    expect(formatIsoWithOffset(t, 0)).toBe('2026-12-01T21:05:00+00:00');
    expect(formatIsoWithOffset(t, -300)).toBe('2026-12-01T16:05:00-05:00');
    // India +05:30 and Chatham Islands +13:45 (half- and quarter-hour zones; common practice).
    expect(formatIsoWithOffset(t, 330)).toBe('2026-12-02T02:35:00+05:30');
    expect(formatIsoWithOffset(t, 825)).toBe('2026-12-02T10:50:00+13:45');
    expect(formatIsoWithOffset(new Date('2026-12-01T21:05:00.042Z'), -90, true)).toBe('2026-12-01T19:35:00.042-01:30');
  });

  it('refuses invalid dates and offsets', () => {
    expect(() => formatIsoWithOffset(new Date(Number.NaN), 0)).toThrow(RangeError);
    expect(() => formatIsoWithOffset(new Date(), 841)).toThrow(/−840 to \+840/);
    expect(() => formatIsoWithOffset(new Date(), 1.5)).toThrow(RangeError);
  });

  it('reads back to the same instant for any offset (round trip)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: Date.UTC(1971, 0, 1), max: Date.UTC(9998, 0, 1) }),
        fc.integer({ min: -840, max: 840 }),
        (ms, offset) => {
          const text = formatIsoWithOffset(new Date(ms), offset, true);
          expect(parseIsoWithOffset(text)).toBe(ms);
          expect(Date.parse(text)).toBe(ms);
        },
      ),
    );
  });

  it('parse refuses impossible dates, offsets and other forms', () => {
    for (const bad of ['2026-02-30T00:00:00Z', '2026-12-01T24:00:00Z', '2026-12-01T22:05:00+15:00', '2026-12-01 22:05:00Z',
      '2026-12-01T22:05:00', '2026-12-01T22:05Z', '2026-12-01T22:05:00+0100']) {
      expect(parseIsoWithOffset(bad), bad).toBeNull();
    }
    expect(parseIsoWithOffset('2028-02-29T12:00:00-03:00')).toBe(Date.UTC(2028, 1, 29, 15));
  });
});
