// An invented plant for trying the app. Every vessel here is made up (tag prefix DEMO-, and the
// description says so); none describes a real vessel, maker or site.
import * as repo from './repo.ts';
import type { VesselRecord } from './repo.ts';
import { validateVessel, type VesselSpec } from '../../core/check/vessel-spec.ts';


export { DEMO_TAG_PREFIX, isDemoVessel } from './demo-label.ts';

const COMMON = {
  designTemperatureK: 473.15,
  vacuumRated: false,
  siteAtmospherePa: 101_325,
  ambientTemperatureK: 293.15,
  readingUnits: { pressure: 'kPa', temperature: 'degC', mass: 'kg' },
} as const;

export const DEMO_PLANT: readonly VesselSpec[] = [
  {
    ...COMMON,
    tag: 'DEMO-ST-01',
    description: 'DEMO DATA: invented steriliser chamber, horizontal, dished ends',
    geometry: { shape: 'horizontal-cylinder', innerDiameterM: 0.9, straightLengthM: 1.5, head: { kind: 'torispherical' } },
    tareKg: 850, mawpGaugePa: 300e3, reliefSetGaugePa: 280e3, vacuumRated: true,
    instruments: {
      pressureGauge: { spanPa: 400e3, accuracyPercentOfSpan: 1 }, temperatureSensor: { kind: 'iec-60751', sensorClass: 'A' },
      weightToleranceKg: 2, volumeTolerancePercent: 2, barometerTolerancePa: 0,
    },
  },
  {
    ...COMMON,
    tag: 'DEMO-FT-02',
    description: 'DEMO DATA: invented flash tank, vertical, 2:1 heads',
    geometry: { shape: 'vertical-cylinder', innerDiameterM: 0.6, straightLengthM: 1.2, head: { kind: 'semi-ellipsoidal-2-1' } },
    tareKg: 420, mawpGaugePa: 1000e3, reliefSetGaugePa: 950e3,
    instruments: {
      pressureGauge: { spanPa: 1600e3, accuracyPercentOfSpan: 1 }, temperatureSensor: { kind: 'iec-60751', sensorClass: 'B' },
      weightToleranceKg: 1, volumeTolerancePercent: 2, barometerTolerancePa: 0,
    },
  },
  {
    ...COMMON,
    tag: 'DEMO-CR-03',
    description: 'DEMO DATA: invented condensate receiver, horizontal, 2:1 heads',
    geometry: { shape: 'horizontal-cylinder', innerDiameterM: 0.8, straightLengthM: 2, head: { kind: 'semi-ellipsoidal-2-1' } },
    tareKg: 600, mawpGaugePa: 350e3, reliefSetGaugePa: 345e3,
    // An invented receiver whose gauge, thermometer and scale read US customary units.
    readingUnits: { pressure: 'psi', temperature: 'degF', mass: 'lb' },
    instruments: {
      pressureGauge: { spanPa: 600e3, accuracyPercentOfSpan: 1.6 }, temperatureSensor: { kind: 'stated', toleranceK: 1 },
      weightToleranceKg: 3, volumeTolerancePercent: 3, barometerTolerancePa: 0,
    },
  },
  {
    ...COMMON,
    tag: 'DEMO-JK-04',
    description: 'DEMO DATA: invented jacketed kettle, jacket space of stated volume',
    geometry: { shape: 'stated-volume', volumeM3: 0.25 },
    tareKg: 300, mawpGaugePa: 600e3, reliefSetGaugePa: 550e3,
    instruments: {
      pressureGauge: { spanPa: 1000e3, accuracyPercentOfSpan: 1 }, temperatureSensor: { kind: 'iec-60751', sensorClass: 'B' },
      weightToleranceKg: 1, volumeTolerancePercent: 5, barometerTolerancePa: 0,
    },
  },
];


/** Adds the demo vessels that are not in the inventory yet; returns how many were added. */
export async function loadDemoPlant(existing: readonly VesselRecord[]): Promise<number> {
  let added = 0;
  for (const spec of DEMO_PLANT) {
    if (existing.some((v) => v.tag === spec.tag)) continue;
    validateVessel(spec);
    await repo.addVessel(spec.tag, spec.description, spec);
    added += 1;
  }
  return added;
}
