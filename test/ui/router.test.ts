import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { BAR_SCREENS, MORE_GROUPS, SCREENS, hrefFor, openingRoute, parseRoute, tabOf } from '../../src/ui/router.ts';

describe('hash routes', () => {
  it('round-trips every screen and a parameter', () => {
    for (const { id: screen } of SCREENS) {
      expect(parseRoute(hrefFor(screen))).toEqual({ screen });
      expect(parseRoute(hrefFor(screen, 'a b/c'))).toEqual({ screen, param: 'a b/c' });
    }
  });
  it('falls back to the check screen for an unknown or empty hash', () => {
    expect(parseRoute('')).toEqual({ screen: 'check' });
    expect(parseRoute('#/nowhere')).toEqual({ screen: 'check' });
  });
});

describe('the opening screen (issue 14)', () => {
  it('is the plant overview on a display 1024 px or wider with no hash, the new check on a phone; a hash always wins', () => {
    expect(openingRoute('', 1440)).toEqual({ screen: 'overview' });
    expect(openingRoute('#/', 1024)).toEqual({ screen: 'overview' });
    expect(openingRoute('', 1023)).toEqual({ screen: 'check' });
    expect(openingRoute('', 390)).toEqual({ screen: 'check' });
    expect(openingRoute('#/log', 1440)).toEqual({ screen: 'log' });
  });
});

describe('navigation that leaves room for work', () => {
  it('at most five destinations in the tab bar, every other one on More under a group', () => {
    expect(BAR_SCREENS.length).toBeLessThanOrEqual(5);
    expect(BAR_SCREENS.map((s) => s.id)).toContain('more');
    for (const s of SCREENS.filter((x) => x.place === 'more')) {
      expect(MORE_GROUPS).toContain(s.group);
      expect(tabOf(s.id)).toBe('more');
    }
    for (const s of BAR_SCREENS) expect(tabOf(s.id)).toBe(s.id);
  });

  it('the web app manifest has shortcuts for a new check and the converter, on routes the app knows', () => {
    const manifest = JSON.parse(readFileSync(new URL('../../manifest.webmanifest', import.meta.url), 'utf8')) as { shortcuts: { name: string; url: string }[] };
    const urls = manifest.shortcuts.map((s) => s.url);
    expect(urls).toEqual(['./#/check', './#/convert']);
    expect(urls.map((u) => parseRoute(u.slice(2)).screen)).toEqual(['check', 'convert']);
  });
});
