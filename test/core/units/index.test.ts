// The core's public entry carries the units API that the screens code against; a missing
// export here would otherwise only show up when the app is built.
import { describe, expect, it } from 'vitest';
import * as core from '../../../src/core/index.ts';

describe('src/core/index.ts exports the units API', () => {
  it.each([
    'pressureToPa', 'pressureFromPa', 'absoluteFromGauge', 'gaugeFromAbsolute', 'atmosphereFromElevation',
    'atmosphereFromGeopotentialAltitude', 'elevationFromAtmosphere',
    'temperatureToK', 'temperatureFromK', 'temperatureDifferenceToK', 'temperatureDifferenceFromK',
    'massToKg', 'massFromKg', 'lengthToM', 'lengthFromM', 'isLengthUnit', 'volumeToM3', 'volumeFromM3', 'specificVolumeToM3PerKg', 'specificVolumeFromM3PerKg',
    'parseDecimal', 'formatNumber', 'isPressureUnit', 'isTemperatureUnit', 'isMassUnit', 'isVolumeUnit', 'isSpecificVolumeUnit',
  ])('%s is a function', (name) => {
    expect(typeof (core as Record<string, unknown>)[name]).toBe('function');
  });

  it('with the unit lists for pickers and the standard atmosphere', () => {
    expect(core.STANDARD_ATMOSPHERE_PA).toBe(101325);
    for (const list of [core.PRESSURE_UNITS, core.TEMPERATURE_UNITS, core.MASS_UNITS, core.VOLUME_UNITS, core.SPECIFIC_VOLUME_UNITS, core.LENGTH_UNITS]) {
      expect(list.length).toBeGreaterThan(2);
      for (const u of list) expect(typeof u.id === 'string' && typeof u.label === 'string').toBe(true);
    }
    expect(core.PRESSURE_UNITS.map((u) => u.id)).toEqual(expect.arrayContaining(
      ['Pa', 'kPa', 'MPa', 'bar', 'mbar', 'psi', 'kgf/cm2', 'atm', 'mmHg', 'torr', 'inHg@32F', 'inHg@60F', 'inH2O@39.2F', 'inH2O@60F']));
    expect(core.VOLUME_UNITS.map((u) => u.id)).toEqual(expect.arrayContaining(['m3', 'L', 'gal(US)', 'gal(UK)', 'ft3']));
    expect(core.LENGTH_UNITS.map((u) => u.id)).toEqual(expect.arrayContaining(['m', 'mm', 'cm', 'ft', 'in']));
    expect(core.SPECIFIC_VOLUME_UNITS.map((u) => u.id)).toEqual(expect.arrayContaining(['m3/kg', 'L/kg', 'ft3/lb']));
  });
});
