// What the register upgrade makes of one vessel: its typed gauge and thermometer accuracies become
// register entries fitted to it, and the vessel record stays exactly as it was (checks and older
// readers keep using its embedded figures). The mapping is the one src/core/instrument/README.md
// ("Today's vessels") gives, so with no calibration on record a check's band is what it was.
// Plain data in, plain data out: it runs inside the upgrade transaction, so nothing is awaited.
import type { InstrumentSpec } from '../core/instrument/index.ts';
import type { FittingRecord, InstrumentRecord, InstrumentRole } from './instrument-records.ts';
import type { IsoDateTime, VesselRecord } from './records.ts';

/** The lowest top of range a migrated thermometer gets, K: a stated tolerance (≤ 50 K by the vessel form) must fit in its span. */
const THERMOMETER_MIN_TOP_K = 373.15;

export interface VesselRegister {
  instruments: InstrumentRecord[];
  fittings: FittingRecord[];
}

const finite = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x);
const isObject = (x: unknown): x is Record<string, unknown> => typeof x === 'object' && x !== null && !Array.isArray(x);

/**
 * The register entries and fittings for one stored vessel; none for a spec without readable
 * instruments (a damaged or test vessel keeps its record and simply gets no entries). `newId`
 * makes the UUIDs (crypto.randomUUID in the app; fixed in tests).
 */
export function registerFromVessel(vessel: VesselRecord, now: IsoDateTime, newId: () => string): VesselRegister {
  // Read as unknown: a vessel saved long ago, or damaged, need not hold today's spec.
  const stored: unknown = vessel.spec;
  const spec = isObject(stored) ? stored : {};
  const instruments = spec['instruments'];
  if (!isObject(instruments)) return { instruments: [], fittings: [] };
  const units = isObject(spec['readingUnits']) ? spec['readingUnits'] : {};
  const fromMs = Date.parse(vessel.createdAt);
  const out: VesselRegister = { instruments: [], fittings: [] };
  const add = (role: InstrumentRole, suffix: string, built: { spec: Omit<InstrumentSpec, 'tag'>; displayUnit: string; note: string } | null) => {
    if (built === null) return;
    // ISA-5.1 letters for the indicator a reading comes from: PI pressure, TI temperature.
    const tag = `${vessel.tag} ${suffix}`.slice(0, 64);
    const id = newId();
    out.instruments.push({
      id, tag, tagKey: tag.trim().toLowerCase(), spec: { tag, ...built.spec }, displayUnit: built.displayUnit,
      description: '',
      origin: { kind: 'from-vessel', vesselId: vessel.id, vesselTag: vessel.tag, note: built.note },
      retired: false, createdAt: now, updatedAt: now,
    });
    out.fittings.push({
      id: newId(), vesselId: vessel.id, role, instrumentId: id, from: vessel.createdAt,
      fromMs: Number.isFinite(fromMs) ? fromMs : 0, reason: 'from the vessel\'s typed instruments', enteredAt: now,
    });
  };
  add('pressure', 'PI', gaugeOf(instruments['pressureGauge'], typeof units['pressure'] === 'string' ? units['pressure'] : 'kPa'));
  add('temperature', 'TI', thermometerOf(instruments, spec['designTemperatureK'], typeof units['temperature'] === 'string' ? units['temperature'] : 'degC'));
  return out;
}

function gaugeOf(g: unknown, displayUnit: string): { spec: Omit<InstrumentSpec, 'tag'>; displayUnit: string; note: string } | null {
  if (!isObject(g)) return null;
  const gauge: { spanPa?: unknown; accuracyPercentOfSpan?: unknown; indicatorPercentOfSpan?: unknown } = g;
  if (!finite(gauge.spanPa) || gauge.spanPa <= 0 || !finite(gauge.accuracyPercentOfSpan)) return null;
  const spec: Omit<InstrumentSpec, 'tag'> = {
    kind: 'pressure-gauge',
    range: { low: 0, high: gauge.spanPa },
    tolerance: { kind: 'percent-of-span', percentOfSpan: gauge.accuracyPercentOfSpan },
  };
  if (finite(gauge.indicatorPercentOfSpan) && gauge.indicatorPercentOfSpan > 0) {
    spec.indicatorTolerance = { kind: 'percent-of-span', percentOfSpan: gauge.indicatorPercentOfSpan };
  }
  return { spec, displayUnit, note: 'range 0 to the typed span assumed' };
}

function thermometerOf(instruments: Record<string, unknown>, designK: unknown, displayUnit: string): { spec: Omit<InstrumentSpec, 'tag'>; displayUnit: string; note: string } | null {
  const found = instruments['temperatureSensor'];
  if (!isObject(found)) return null;
  const sensor: { kind?: unknown; sensorClass?: unknown; toleranceK?: unknown } = found;
  const top = Math.max(finite(designK) ? designK : 0, THERMOMETER_MIN_TOP_K);
  const range = { low: 273.15, high: top };
  let spec: Omit<InstrumentSpec, 'tag'>;
  if (sensor.kind === 'iec-60751' && (sensor.sensorClass === 'AA' || sensor.sensorClass === 'A' || sensor.sensorClass === 'B')) {
    spec = { kind: 'rtd', range, tolerance: { kind: 'iec-60751', sensorClass: sensor.sensorClass } };
  } else if (sensor.kind === 'stated' && finite(sensor.toleranceK) && sensor.toleranceK >= 0) {
    spec = { kind: 'thermometer', range, tolerance: { kind: 'stated', plusMinus: sensor.toleranceK } };
  } else return null;
  const indicator = instruments['temperatureIndicatorToleranceK'];
  if (finite(indicator) && indicator > 0) spec.indicatorTolerance = { kind: 'stated', plusMinus: indicator };
  // The range is not typed for a vessel: 0 °C to its design temperature (at least 100 °C) is assumed, and said.
  return { spec, displayUnit, note: 'range 0 °C to the design temperature assumed' };
}
