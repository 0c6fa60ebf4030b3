import { describe, expect, it } from 'vitest';
import { CAUTION_RULES, STANDING_NOTE, caution, withStandingNote } from '../../../src/core/check/cautions.ts';

describe('cautions', () => {
  it('signal words are the ISO 3864 / ANSI Z535 four', () => {
    for (const signal of Object.values(CAUTION_RULES)) expect(['DANGER', 'WARNING', 'CAUTION', 'NOTICE']).toContain(signal);
  });
  it('the standing note defers to inspection regime, codes, lockout/tagout and licensed practice (issue 3, item 7)', () => {
    expect(STANDING_NOTE.signal).toBe('NOTICE');
    for (const words of ['inspection regime', 'ASME BPVC Section VIII', 'PED 2014/68/EU', 'national rules', 'lockout/tagout', 'licensed practice']) {
      expect(STANDING_NOTE.message).toContain(words);
    }
  });
  it('orders most severe first and ends with the standing note', () => {
    const list = withStandingNote([caution('pressure-near-relief-set', 'a'), caution('liquid-full-now', 'b'), caution('atmosphere-assumed', 'c'), caution('flash-on-release', 'd')]);
    expect(list.map((c) => c.signal)).toEqual(['DANGER', 'WARNING', 'CAUTION', 'NOTICE', 'NOTICE']);
    expect(list.at(-1)).toEqual(STANDING_NOTE);
  });
  it('a rule always carries its catalogued signal word', () => {
    expect(caution('pressure-above-mawp', 'x')).toEqual({ signal: 'DANGER', message: 'x', rule: 'pressure-above-mawp' });
  });
});
