import { describe, expect, it } from 'vitest';
import { hrefFor, parseRoute } from '../../src/ui/router.ts';

describe('hash routes', () => {
  it('round-trips every screen and a parameter', () => {
    for (const screen of ['vessels', 'check', 'fill', 'log', 'convert', 'settings'] as const) {
      expect(parseRoute(hrefFor(screen))).toEqual({ screen });
      expect(parseRoute(hrefFor(screen, 'a b/c'))).toEqual({ screen, param: 'a b/c' });
    }
  });
  it('falls back to the check screen for an unknown or empty hash', () => {
    expect(parseRoute('')).toEqual({ screen: 'check' });
    expect(parseRoute('#/nowhere')).toEqual({ screen: 'check' });
  });
});
