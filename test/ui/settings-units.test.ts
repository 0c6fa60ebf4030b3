// Preferred length unit and the site elevation in Settings. Factors: NIST SP 811 (2008) B.8
// (ft = 0.3048 m exactly).
import { describe, expect, it } from 'vitest';
import { atmosphereFromElevation } from '../../src/core/index.ts';
import { DEFAULT_SETTINGS, UNIT_PRESETS, atmosphereDefaults, unitsInForce, type AppSettings } from '../../src/ui/state/settings-model.ts';
import { siteAtmosphere } from '../../src/ui/state/atmosphere.ts';
import { isDemo, plainDescription } from '../../src/ui/state/demo-label.ts';

describe('preferred length unit', () => {
  it('SI shows metres, US customary feet', () => {
    expect(UNIT_PRESETS.SI.length).toBe('m');
    expect(UNIT_PRESETS.US.length).toBe('ft');
    expect(unitsInForce({ ...DEFAULT_SETTINGS, unitSystem: 'US' }).length).toBe('ft');
  });

  it('per-quantity units saved before length existed fall back to metres; a chosen one is kept', () => {
    const old = { ...DEFAULT_SETTINGS, unitSystem: 'custom', units: { pressure: 'bar', temperature: 'degC', mass: 'kg', volume: 'L' } } as unknown as AppSettings;
    expect(unitsInForce(old)).toEqual({ pressure: 'bar', temperature: 'degC', mass: 'kg', volume: 'L', length: 'm' });
    expect(unitsInForce({ ...old, units: { ...UNIT_PRESETS.SI, length: 'mm' } }).length).toBe('mm');
  });
});

describe('site elevation in Settings', () => {
  it('in feet: 1000 ft is 304.8 m (NIST SP 811 (2008) B.8) before the US Standard Atmosphere 1976', () => {
    const ft = siteAtmosphere({ mode: 'elevation', text: '1000', unit: 'ft' });
    const m = siteAtmosphere({ mode: 'elevation', text: '304,8', unit: 'm' });
    if (!ft.ok || !m.ok) throw new Error('atmosphere');
    expect(ft.pressurePa).toBeCloseTo(m.pressurePa, 9);
    expect(ft.pressurePa).toBeCloseTo(atmosphereFromElevation(304.8), 9);
    expect(ft.source).toBe('elevation 1000 ft');
  });

  it('a record saved before the unit existed is in metres', () => {
    const old = siteAtmosphere({ mode: 'elevation', text: '1000' });
    if (!old.ok) throw new Error('atmosphere');
    // US Standard Atmosphere 1976, 1000 m geometric: 89 876 Pa (its table).
    expect(old.pressurePa).toBeCloseTo(89_876, -1);
  });

  it('a bad elevation names the field and the range', () => {
    const bad = siteAtmosphere({ mode: 'elevation', text: '40000', unit: 'ft' });
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.error).toMatch(/elevation/);
  });

  it('new vessels start with the elevation shown in the preferred length unit', () => {
    const s: AppSettings = { ...DEFAULT_SETTINGS, atmosphere: { mode: 'elevation', text: '304.8', unit: 'm' } };
    expect(Number(atmosphereDefaults(s, UNIT_PRESETS.US).elevationM)).toBeCloseTo(1000, 6);
    expect(Number(atmosphereDefaults(s, UNIT_PRESETS.SI).elevationM)).toBeCloseTo(304.8, 9);
  });
});

describe('demo labels', () => {
  it('a tag starting DEMO- or a description starting "DEMO DATA:" is demo data; anything else is not', () => {
    expect(isDemo({ tag: 'DEMO-ST-01', description: '' })).toBe(true);
    expect(isDemo({ tag: 'ST-01', description: 'DEMO DATA: invented' })).toBe(true);
    expect(isDemo({ tag: 'ST-01', description: 'steriliser, east wing' })).toBe(false);
    expect(isDemo({ tag: 'XDEMO-1' })).toBe(false);
    expect(isDemo(undefined)).toBe(false);
    expect(plainDescription('DEMO DATA: invented flash tank')).toBe('invented flash tank');
  });
});
