// A fixed set of invented checks and fill plans covering every geometry and every regime the
// engine knows (two-phase, liquid-full within and beyond IF97, superheated, not weighed; regions 1,
// 2 and 3; every saturation verdict; gauge and absolute; site and measured atmosphere; every
// pressure limit). engine-outputs.test.ts holds the engine's outputs for them to a stored fixture,
// so speed work can prove its results are byte-identical. The vessels are invented, not plant data.
import type { FillRequest, Reading, VesselSpec } from '../../../src/core/index.ts';
import { saturationPressure } from '../../../src/core/index.ts';
import { testVessel } from './test-vessel.ts';

type Geometry = VesselSpec['geometry'];

const heads = [
  { kind: 'flat' },
  { kind: 'semi-ellipsoidal-2-1' },
  { kind: 'hemispherical' },
  { kind: 'torispherical' },
  { kind: 'torispherical', crownRadiusM: 1.0, knuckleRadiusM: 0.15 },
] as const;

/** Every shape with every head, plus a stated volume. */
export const GEOMETRIES: readonly { name: string; geometry: Geometry }[] = [
  { name: 'stated volume 3.2 m³', geometry: { shape: 'stated-volume', volumeM3: 3.2 } },
  ...(['vertical-cylinder', 'horizontal-cylinder'] as const).flatMap((shape) =>
    heads.map((head) => ({
      name: `${shape}, ${head.kind}${'crownRadiusM' in head ? ' (custom radii)' : ''}`,
      geometry: { shape, innerDiameterM: 1.2, straightLengthM: 2.5, head } as Geometry,
    })),
  ),
];

const sat = (T: number) => saturationPressure(T);
const at = (T: number, over: Partial<Reading> = {}): Reading => ({
  time: '2026-03-14T09:30:00+01:00',
  temperatureK: T,
  pressure: { reference: 'gauge', pressurePa: sat(T) - 101325 },
  weight: { kind: 'net', netKg: 1000 },
  ...over,
});

export interface CheckCase {
  name: string;
  vessel: VesselSpec;
  reading: Reading;
}

export interface PlanCase {
  name: string;
  vessel: VesselSpec;
  request: FillRequest;
}

/** Readings that each land in a different regime or rule, taken on the default test vessel. */
const READINGS: readonly { name: string; vessel?: Partial<VesselSpec>; reading: Reading }[] = [
  { name: 'two-phase, consistent, 121 °C', reading: at(394.15) },
  { name: 'two-phase, gross weight, barometer given', reading: at(407.15, { atmospherePa: 98_700, pressure: { reference: 'gauge', pressurePa: sat(407.15) - 98_700 }, weight: { kind: 'gross', grossKg: 2350 } }) },
  { name: 'air: pressure above saturation', reading: at(388.45, { pressure: { reference: 'absolute', pressurePa: 204.7e3 } }) },
  { name: 'pressure below saturation, not weighed', reading: at(394.15, { pressure: { reference: 'absolute', pressurePa: 150e3 }, weight: { kind: 'not-weighed' } }) },
  { name: 'liquid-full, hydraulic within IF97', reading: at(394.15, { weight: { kind: 'net', netKg: 3640 } }) },
  { name: 'liquid-full in region 3', vessel: { mawpGaugePa: 30e6, reliefSetGaugePa: 25e6, designTemperatureK: 700 }, reading: at(630, { weight: { kind: 'net', netKg: 2400 } }) },
  { name: 'liquid-full beyond 100 MPa', reading: at(394.15, { weight: { kind: 'net', netKg: 3800 } }) },
  { name: 'superheated: little mass, hot', reading: at(423.15, { pressure: { reference: 'absolute', pressurePa: 300e3 }, weight: { kind: 'net', netKg: 1 } }) },
  { name: 'region 3, 630 K', vessel: { mawpGaugePa: 30e6, reliefSetGaugePa: 25e6, designTemperatureK: 700, instruments: { ...testVessel().instruments, pressureGauge: { spanPa: 25e6, accuracyPercentOfSpan: 0.5 } } }, reading: at(630, { weight: { kind: 'net', netKg: 1200 } }) },
  { name: 'region 3, 645 K, near critical', vessel: { mawpGaugePa: 30e6, reliefSetGaugePa: 25e6, designTemperatureK: 700, instruments: { ...testVessel().instruments, pressureGauge: { spanPa: 25e6, accuracyPercentOfSpan: 0.5 } } }, reading: at(645, { weight: { kind: 'net', netKg: 1100 } }) },
  { name: 'cold, vacuum now', reading: at(323.15, { pressure: { reference: 'gauge', pressurePa: -80e3 }, weight: { kind: 'net', netKg: 500 } }) },
  { name: 'near the triple point', reading: at(273.2, { pressure: { reference: 'absolute', pressurePa: sat(273.2) }, weight: { kind: 'net', netKg: 2000 } }) },
  { name: 'at MAWP', reading: at(453.15, { pressure: { reference: 'gauge', pressurePa: 0.995e6 }, weight: { kind: 'net', netKg: 200 } }) },
  { name: 'above MAWP', reading: at(460, { pressure: { reference: 'gauge', pressurePa: 1.05e6 }, weight: { kind: 'net', netKg: 200 } }) },
  { name: 'above relief set', reading: at(456, { pressure: { reference: 'gauge', pressurePa: 0.95e6 }, weight: { kind: 'net', netKg: 200 } }) },
  { name: 'at relief set', reading: at(452, { pressure: { reference: 'gauge', pressurePa: 0.89e6 }, weight: { kind: 'net', netKg: 200 } }) },
  { name: 'near relief set', reading: at(451, { pressure: { reference: 'gauge', pressurePa: 0.85e6 }, weight: { kind: 'net', netKg: 200 } }) },
  { name: 'above design temperature', vessel: { designTemperatureK: 373.15 }, reading: at(394.15) },
  { name: 'vacuum-rated vessel, class B sensor, stated gauge', vessel: { vacuumRated: true, instruments: { ...testVessel().instruments, temperatureSensor: { kind: 'iec-60751', sensorClass: 'B' } } }, reading: at(373.15, { weight: { kind: 'net', netKg: 1500 } }) },
  { name: 'stated thermometer tolerance, AA-free kit, quality band reaching liquid-full', vessel: { instruments: { ...testVessel().instruments, temperatureSensor: { kind: 'stated', toleranceK: 0.8 } } }, reading: at(394.15, { weight: { kind: 'net', netKg: 3610 } }) },
  { name: 'class AA sensor, absolute gauge, goes liquid-full on heating', vessel: { instruments: { ...testVessel().instruments, temperatureSensor: { kind: 'iec-60751', sensorClass: 'AA' } } }, reading: at(293.15, { pressure: { reference: 'absolute', pressurePa: sat(293.15) }, weight: { kind: 'net', netKg: 3600 } }) },
];

/** Every reading on the default vessel, then one two-phase and one liquid-full reading on every geometry. */
export const CHECK_CASES: readonly CheckCase[] = [
  ...READINGS.map((r) => ({ name: r.name, vessel: testVessel(r.vessel ?? {}), reading: r.reading })),
  ...GEOMETRIES.flatMap((g) => [
    { name: `${g.name}: two-phase 134 °C`, vessel: testVessel({ geometry: g.geometry }), reading: at(407.15, { weight: { kind: 'gross', grossKg: 2200 } }) },
    { name: `${g.name}: low fill, 160 °C, air`, vessel: testVessel({ geometry: g.geometry }), reading: at(433.15, { pressure: { reference: 'absolute', pressurePa: sat(433.15) + 40e3 }, weight: { kind: 'net', netKg: 150 } }) },
  ]),
];

const plan = (over: Partial<FillRequest> = {}): FillRequest => ({
  targetTemperatureK: 394.15,
  target: { kind: 'dry-saturated' },
  startTemperatureK: 293.15,
  liquidFullMarginK: 5,
  ...over,
});

export const PLAN_CASES: readonly PlanCase[] = [
  { name: 'dry saturated at 121 °C, heater', vessel: testVessel(), request: plan({ heaterPowerW: 20e3 }) },
  { name: 'quality 0.05 at 134 °C, vessel heat capacity', vessel: testVessel(), request: plan({ targetTemperatureK: 407.15, target: { kind: 'quality', quality: 0.05 }, vesselHeatCapacityJPerK: 4e5 }) },
  { name: 'vapor-space fraction 0.3 at 150 °C, barometer', vessel: testVessel(), request: plan({ targetTemperatureK: 423.15, target: { kind: 'vapor-space-fraction', fraction: 0.3 }, atmospherePa: 95_000 }) },
  { name: 'over-full charge: exceeds the largest charge', vessel: testVessel(), request: plan({ target: { kind: 'vapor-space-fraction', fraction: 0.02 } }) },
  { name: 'does not fit at the start temperature', vessel: testVessel(), request: plan({ target: { kind: 'quality', quality: 0 }, targetTemperatureK: 277.15, startTemperatureK: 273.16 }) },
  { name: 'target above MAWP and design temperature', vessel: testVessel(), request: plan({ targetTemperatureK: 473.15, target: { kind: 'quality', quality: 0.2 } }) },
  { name: 'target above relief set', vessel: testVessel(), request: plan({ targetTemperatureK: 450.5, target: { kind: 'quality', quality: 0.2 } }) },
  { name: 'region 3 target', vessel: testVessel({ mawpGaugePa: 30e6, reliefSetGaugePa: 25e6, designTemperatureK: 700 }), request: plan({ targetTemperatureK: 640, target: { kind: 'quality', quality: 0.5 } }) },
  ...GEOMETRIES.map((g) => ({ name: `${g.name}: quality 0.01 at 140 °C`, vessel: testVessel({ geometry: g.geometry }), request: plan({ targetTemperatureK: 413.15, target: { kind: 'quality', quality: 0.01 }, heaterPowerW: 15e3 }) })),
];
