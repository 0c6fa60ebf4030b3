import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { resolveReading, type Reading } from '../../../src/core/check/reading.ts';
import { InputError } from '../../../src/core/errors.ts';
import { testVessel } from './test-vessel.ts';

const base: Reading = {
  time: '2026-03-14T09:30:00+01:00',
  temperatureK: 394.15,
  pressure: { reference: 'gauge', pressurePa: 103.7e3 },
  weight: { kind: 'gross', grossKg: 2500 },
};

function refusal(reading: Reading): InputError {
  try {
    resolveReading(testVessel(), reading);
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return e as InputError;
  }
  throw new Error('expected an InputError');
}

describe('resolveReading', () => {
  it('gauge + site atmosphere = absolute; gross − tare = net (definitions)', () => {
    const r = resolveReading(testVessel(), base);
    expect(r.absolutePressurePa).toBe(103.7e3 + 101325);
    expect(r.atmosphereSource).toBe('site');
    expect(r.netMassKg).toBe(1000);
  });
  it('a measured atmosphere overrides the site value', () => {
    const r = resolveReading(testVessel(), { ...base, atmospherePa: 95e3 });
    expect(r.absolutePressurePa).toBe(103.7e3 + 95e3);
    expect(r.atmosphereSource).toBe('measured');
  });
  it('absolute readings pass through; a net weight is used as given; not weighed gives null', () => {
    const r = resolveReading(testVessel(), { ...base, pressure: { reference: 'absolute', pressurePa: 2e5 }, weight: { kind: 'net', netKg: 12 } });
    expect(r.absolutePressurePa).toBe(2e5);
    expect(r.gaugePressurePa).toBe(2e5 - 101325);
    expect(r.netMassKg).toBe(12);
    expect(resolveReading(testVessel(), { ...base, weight: { kind: 'not-weighed' } }).netMassKg).toBeNull();
  });

  const cases: [string, Partial<Reading>, string][] = [
    ['temperature below 0.00 °C', { temperatureK: 273.14 }, 'temperature'],
    ['temperature above 373.946 °C', { temperatureK: 647.1 }, 'temperature'],
    ['temperature NaN', { temperatureK: Number.NaN }, 'temperature'],
    ['absolute pressure zero', { pressure: { reference: 'absolute', pressurePa: 0 } }, 'pressure (absolute)'],
    ['absolute pressure negative', { pressure: { reference: 'absolute', pressurePa: -5 } }, 'pressure (absolute)'],
    ['a gauge vacuum beyond the atmosphere', { pressure: { reference: 'gauge', pressurePa: -102e3 } }, 'pressure (gauge)'],
    ['a gauge vacuum equal to the atmosphere', { pressure: { reference: 'gauge', pressurePa: -101325 } }, 'pressure (gauge)'],
    ['tare above gross', { weight: { kind: 'gross', grossKg: 1400 } }, 'gross weight'],
    ['tare equal to gross', { weight: { kind: 'gross', grossKg: 1500 } }, 'gross weight'],
    ['zero net weight', { weight: { kind: 'net', netKg: 0 } }, 'net weight'],
    ['an atmosphere reading of zero', { atmospherePa: 0 }, 'atmospheric pressure'],
    ['a time without offset', { time: '2026-03-14T09:30:00' }, 'time'],
    ['an empty time', { time: '' }, 'time'],
  ];
  for (const [what, change, field] of cases) {
    it(`refuses ${what}, naming "${field}"`, () => {
      const e = refusal({ ...base, ...change });
      expect(e.field).toBe(field);
      expect(e.message).toMatch(/range|must|ISO 8601/);
    });
  }
  it('the gauge-vacuum refusal says the vacuum is beyond the atmosphere', () => {
    expect(refusal({ ...base, pressure: { reference: 'gauge', pressurePa: -150e3 } }).message).toMatch(/beyond the atmosphere/);
  });
  it('the tare refusal names the tare as the range minimum', () => {
    expect(refusal({ ...base, weight: { kind: 'gross', grossKg: 1000 } }).range?.min).toBe(1500);
  });
  it('any finite gauge reading either resolves to a positive absolute pressure or throws InputError (fast-check)', () => {
    fc.assert(
      fc.property(fc.double({ min: -2e5, max: 3e7, noNaN: true }), (g) => {
        try {
          const r = resolveReading(testVessel(), { ...base, pressure: { reference: 'gauge', pressurePa: g } });
          return r.absolutePressurePa > 0;
        } catch (e) {
          return e instanceof InputError && e.field === 'pressure (gauge)';
        }
      }),
    );
  });
});
