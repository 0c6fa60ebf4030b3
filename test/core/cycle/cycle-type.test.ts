// Cycle types: the defaults with their sources, and every bad field.
import { describe, expect, it } from 'vitest';
import { COMMON_CYCLE_TYPES, CYCLE_TYPE_DEFAULTS, InputError, resolveCycleType } from '../../../src/core/index.ts';

function fieldOf(f: () => unknown): string {
  try { f(); } catch (e) { if (e instanceof InputError) return e.field; throw e; }
  throw new Error('no InputError');
}

describe('cycle types', () => {
  it('the usual cycles are 121 °C for 15 min and 134 °C for 3 min (Central Sterilising Club, Table 10.2; common practice)', () => {
    const byId = Object.fromEntries(COMMON_CYCLE_TYPES.map((c) => [c.id, c.cycleType]));
    expect(byId['steam-121-15min']!.sterilisingTemperatureK - 273.15).toBeCloseTo(121, 10);
    expect(byId['steam-121-15min']!.holdTimeS).toBe(900);
    expect(byId['steam-134-3min']!.sterilisingTemperatureK - 273.15).toBeCloseTo(134, 10);
    expect(byId['steam-134-3min']!.holdTimeS).toBe(180);
  });
  it('defaults: band +3/−0 K (from memory, EN 285), saturation within 2 K (from memory, EN 285 / EN 13060), F₀ constants', () => {
    expect(CYCLE_TYPE_DEFAULTS).toMatchObject({ bandAboveK: 3, bandBelowK: 0, saturationLimitK: 2 });
    expect(resolveCycleType({ sterilisingTemperatureK: 394.15, holdTimeS: 900 })).toEqual({
      sterilisingTemperatureK: 394.15, bandAboveK: 3, bandBelowK: 0, holdTimeS: 900, saturationLimitK: 2,
      lethality: { referenceTemperatureK: 394.25, zK: 10 },
    });
  });
  it('a site sets its own', () => {
    expect(resolveCycleType({ sterilisingTemperatureK: 400, holdTimeS: 60, bandAboveK: 2, bandBelowK: 1, saturationLimitK: 1.5, lethality: { zK: 12 } }))
      .toEqual({ sterilisingTemperatureK: 400, bandAboveK: 2, bandBelowK: 1, holdTimeS: 60, saturationLimitK: 1.5, lethality: { referenceTemperatureK: 394.25, zK: 12 } });
  });
  const base = { sterilisingTemperatureK: 394.15, holdTimeS: 900 };
  it.each([
    ['cycle type', null],
    ['sterilising temperature', { ...base, sterilisingTemperatureK: 250 }],
    ['sterilising temperature', { ...base, sterilisingTemperatureK: NaN }],
    ['hold time', { ...base, holdTimeS: 0 }],
    ['hold time', { ...base, holdTimeS: 90_000 }],
    ['band above the sterilising temperature', { ...base, bandAboveK: -1 }],
    ['band above the sterilising temperature', { ...base, bandAboveK: 0, bandBelowK: 0 }],
    ['band below the sterilising temperature', { ...base, bandBelowK: 25 }],
    ['saturation limit', { ...base, saturationLimitK: 0 }],
    ['F-value reference temperature', { ...base, lethality: { referenceTemperatureK: 100 } }],
    ['z-value', { ...base, lethality: { zK: 200 } }],
  ])('%s', (field, input) => {
    expect(fieldOf(() => resolveCycleType(input as never))).toBe(field);
  });
});
