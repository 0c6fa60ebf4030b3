import { describe, expect, it } from 'vitest';
import { validateVessel, type VesselSpec } from '../../../src/core/check/vessel-spec.ts';
import { InputError } from '../../../src/core/errors.ts';
import { testVessel } from './test-vessel.ts';

function refusal(spec: VesselSpec): InputError {
  try {
    validateVessel(spec);
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return e as InputError;
  }
  throw new Error('expected an InputError');
}

describe('validateVessel (issue 3, bad input)', () => {
  it('accepts the test vessel', () => {
    expect(() => validateVessel(testVessel())).not.toThrow();
  });
  const ins = testVessel().instruments;
  const cases: [string, Partial<VesselSpec>, string][] = [
    ['empty tag', { tag: '  ' }, 'tag'],
    ['zero volume', { geometry: { shape: 'stated-volume', volumeM3: 0 } }, 'internal volume'],
    ['negative volume', { geometry: { shape: 'stated-volume', volumeM3: -2 } }, 'internal volume'],
    ['geometry that does not close', { geometry: { shape: 'vertical-cylinder', innerDiameterM: 1, straightLengthM: 1, head: { kind: 'torispherical', knuckleRadiusM: 0.7 } } }, 'knuckle radius'],
    ['negative tare', { tareKg: -1 }, 'tare weight'],
    ['zero MAWP', { mawpGaugePa: 0 }, 'MAWP'],
    ['relief set pressure above MAWP', { reliefSetGaugePa: 1.1e6 }, 'relief set pressure'],
    ['zero relief set pressure', { reliefSetGaugePa: 0 }, 'relief set pressure'],
    ['design temperature below the triple point', { designTemperatureK: 250 }, 'design temperature'],
    ['site atmosphere at zero', { siteAtmospherePa: 0 }, 'site atmospheric pressure'],
    ['ambient NaN', { ambientTemperatureK: Number.NaN }, 'ambient temperature'],
    ['gauge span zero', { instruments: { ...ins, pressureGauge: { spanPa: 0, accuracyPercentOfSpan: 1 } } }, 'pressure gauge span'],
    ['gauge accuracy negative', { instruments: { ...ins, pressureGauge: { spanPa: 1e6, accuracyPercentOfSpan: -1 } } }, 'pressure gauge accuracy'],
    ['temperature tolerance negative', { instruments: { ...ins, temperatureSensor: { kind: 'stated', toleranceK: -0.1 } } }, 'temperature sensor tolerance'],
    ['weight tolerance negative', { instruments: { ...ins, weightToleranceKg: -1 } }, 'weight tolerance'],
    ['volume tolerance above 50 %', { instruments: { ...ins, volumeTolerancePercent: 60 } }, 'volume tolerance'],
    ['a dimension unit the app does not have', { entryUnits: { diameter: 'furlong' as 'm' } }, 'dimension units'],
    // US Standard Atmosphere 1976's troposphere formula, as units/atmosphere.ts uses it: −500 m to 11 000 m.
    ['a site elevation above the troposphere formula', { siteElevationM: 12_000 }, 'site elevation'],
  ];
  for (const [what, change, field] of cases) {
    it(`refuses ${what}, naming "${field}" and the valid range`, () => {
      const e = refusal(testVessel(change));
      expect(e.field).toBe(field);
      if (field !== 'tag') expect(e.message).toMatch(/range|must/);
    });
  }
  it('the relief-above-MAWP refusal gives the MAWP as the range maximum (ASME BPVC Section VIII Div. 1 UG-134(a))', () => {
    const e = refusal(testVessel({ reliefSetGaugePa: 1.1e6 }));
    expect(e.problem).toBe('inconsistent');
    expect(e.range).toEqual({ min: 0, max: 1e6, unit: 'Pa' });
  });
});
