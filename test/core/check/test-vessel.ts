// A vessel for the check-engine tests. Its dimensions and ratings are invented; what the tests
// compare against are the outside values each test names.
import type { VesselSpec } from '../../../src/core/check/vessel-spec.ts';

export function testVessel(overrides: Partial<VesselSpec> = {}): VesselSpec {
  return {
    tag: 'TEST-1',
    description: 'test vessel',
    geometry: { shape: 'horizontal-cylinder', innerDiameterM: 1.2, straightLengthM: 3, head: { kind: 'semi-ellipsoidal-2-1' } },
    tareKg: 1500,
    mawpGaugePa: 1.0e6,
    designTemperatureK: 473.15,
    reliefSetGaugePa: 0.9e6,
    vacuumRated: false,
    siteAtmospherePa: 101325,
    ambientTemperatureK: 293.15,
    instruments: {
      pressureGauge: { spanPa: 1.6e6, accuracyPercentOfSpan: 1.0 },
      temperatureSensor: { kind: 'iec-60751', sensorClass: 'A' },
      weightToleranceKg: 2,
      volumeTolerancePercent: 1,
      barometerTolerancePa: 100,
    },
    ...overrides,
  };
}

/** Shorthand: the same instruments with every tolerance set to zero. */
export function exactInstruments(): VesselSpec['instruments'] {
  return {
    pressureGauge: { spanPa: 1.6e6, accuracyPercentOfSpan: 0 },
    temperatureSensor: { kind: 'stated', toleranceK: 0 },
    weightToleranceKg: 0,
    volumeTolerancePercent: 0,
    barometerTolerancePa: 0,
  };
}
