// A vessel as a check uses it once the register knows its instruments: the typed gauge and
// thermometer figures replaced by each fitted instrument's limit at the check's own time (class,
// indicator, last calibration, drift since), the instruments and calibrations named on the copy,
// and a finding for each instrument past its due date. The check engine itself is unchanged: the
// limit parts go into the fields it already combines by root-sum-square (class → accuracy,
// indicator → indicator, calibration and drift → drift), so the band equals the RSS of the
// register limit's parts exactly.
//
// The scale and the barometer have one field each in the engine (weightToleranceKg,
// barometerTolerancePa), so their whole limit goes there: √(max(class, typed)² + indicator² +
// calibration² + drift²). The figure typed for the vessel stays as a floor under the class
// because it is meant to hold the installation's share (a vessel scale's piping restraint and
// tare drift, field-practice.md §3.4, from memory), which no load cell's class includes; taking
// the larger rather than adding both avoids counting the scale's own accuracy twice. So a fitted
// scale or barometer can only widen the band the vessel already had. Each enters only when the
// check uses it: the scale when the reading is weighed, the barometer when a gauge reading is
// converted with a measured atmosphere (the site value has its own allowance, check/uncertainty.ts).

import { InputError } from '../errors.ts';
import { outcomeOf, sortedCautions } from '../check/cautions.ts';
import type { Caution, CheckResult } from '../check/check-result.ts';
import { VESSEL_LIMITS, type TemperatureSensorTolerance, type VesselSpec } from '../check/vessel-spec.ts';
import type { Reading } from '../check/reading.ts';
import { calibrationDue, type InstrumentOptions } from './calibration-due.ts';
import { calibrationFinding } from './instrument-findings.ts';
import { instrumentLimit, type InstrumentLimit } from './instrument-limit.ts';
import { instrumentSpan, type CalibrationRecord, type InstrumentSpec } from './instrument-spec.ts';
import type { InstrumentRole, InstrumentUse } from './instrument-use.ts';

/** One register instrument fitted to the vessel, with its calibrations (any order) and their register ids. */
export interface FittedInstrument {
  instrumentId: string;
  spec: InstrumentSpec;
  calibrations: readonly (CalibrationRecord & { calibrationId: string })[];
}

/** The fitted instruments that may enter a check's band, by the place each takes. */
export type FittedForCheck = Partial<Record<InstrumentRole, FittedInstrument>>;

/** The date of the check, and what of its reading decides whether the scale and the barometer enter its band. */
export interface CheckInstrumentOptions extends InstrumentOptions {
  /** The reading: weighed or not, gauge or absolute, with a measured atmosphere or the site's. Absent: neither the scale nor the barometer enters. */
  reading?: Pick<Reading, 'pressure' | 'weight' | 'atmospherePa'>;
}

export interface VesselForCheck {
  /** The vessel with the register's limits in its instrument figures and `instrumentsUsed` set (the same vessel when none is fitted). */
  vessel: VesselSpec;
  uses: InstrumentUse[];
  /** calibration-overdue for each instrument past its due date at the check's time. */
  findings: Caution[];
}

const PRESSURE_KINDS = ['pressure-gauge', 'pressure-transmitter'];
const TEMPERATURE_KINDS = ['thermometer', 'rtd'];
const WEIGHT_KINDS = ['weighing-system'];
const ATMOSPHERE_KINDS = ['barometer'];

/**
 * The vessel as a check at `options.nowMs` (the check's own time, not the clock) uses it. A
 * calibration dated after the check is left out (a check recomputed later keeps its band). With no
 * calibration on record the drift typed for the vessel stays (nothing is known to replace it).
 * The scale enters when `options.reading` is weighed, the barometer when it is a gauge reading
 * with a measured atmosphere. Throws InputError naming the field for a bad instrument or
 * calibration (the core's validation), ('instrument role') for a kind in the wrong place, and
 * ('instrument limit') when a limit is beyond what the engine takes (10 % of span for a gauge,
 * 50 K for a thermometer, 100 t for a scale, 10 kPa for a barometer).
 */
export function vesselWithInstruments(vessel: VesselSpec, fitted: FittedForCheck, options: CheckInstrumentOptions): VesselForCheck {
  const reading = options.reading;
  const weighs = fitted.weight !== undefined && reading !== undefined && reading.weight.kind !== 'not-weighed';
  const barometer = fitted.atmosphere !== undefined && reading !== undefined && reading.pressure.reference === 'gauge' && reading.atmospherePa !== undefined;
  if (fitted.pressure === undefined && fitted.temperature === undefined && !weighs && !barometer) return { vessel, uses: [], findings: [] };
  const instruments = { ...vessel.instruments };
  const uses: InstrumentUse[] = [];
  const findings: Caution[] = [];
  const p = fitted.pressure;
  if (p !== undefined) {
    requireKind(p, PRESSURE_KINDS, 'pressure');
    const { limit, use, finding } = useOf('pressure', p, options, undefined);
    const span = instrumentSpan(p.spec);
    const typedDriftPa = ((vessel.instruments.pressureGauge.driftPercentOfSpan ?? 0) / 100) * vessel.instruments.pressureGauge.spanPa;
    const driftPa = limit.lastCalibrationMs === null ? typedDriftPa : Math.hypot(limit.band.contributions.calibration, limit.band.contributions.drift);
    const percent = (part: number, name: string) => {
      const x = (part / span) * 100;
      const max = VESSEL_LIMITS.gaugeAccuracyPercent.max;
      if (x > max) {
        throw new InputError('instrument limit', 'out-of-range', x, { min: 0, max, unit: '% of span' },
          `instrument limit (${p.spec.tag}): its ${name} is ${x.toFixed(1)} % of span, beyond the ${max} % a check takes; calibrate or replace it.`);
      }
      return x;
    };
    instruments.pressureGauge = {
      spanPa: span,
      accuracyPercentOfSpan: percent(limit.band.contributions.class, 'class'),
      indicatorPercentOfSpan: percent(limit.band.contributions.indicator, 'indicator limit'),
      driftPercentOfSpan: percent(driftPa, 'calibration error and drift'),
    };
    if (limit.lastCalibrationMs === null) withTypedDrift(use, typedDriftPa);
    uses.push(use);
    if (finding) findings.push(finding);
  }
  const t = fitted.temperature;
  if (t !== undefined) {
    requireKind(t, TEMPERATURE_KINDS, 'temperature');
    // The class of an RTD grows with |t|: the engine evaluates it at the check's temperature; this limit only needs a point inside the range.
    const at = Math.min(Math.max(t.spec.range.high, 273.16), 2273.15);
    const { limit, use, finding } = useOf('temperature', t, options, at);
    const span = instrumentSpan(t.spec);
    const typedDriftK = vessel.instruments.temperatureDriftToleranceK ?? 0;
    const driftK = limit.lastCalibrationMs === null ? typedDriftK : Math.hypot(limit.band.contributions.calibration, limit.band.contributions.drift);
    const kelvin = (part: number, name: string) => {
      const max = VESSEL_LIMITS.temperatureToleranceK.max;
      if (part > max) {
        throw new InputError('instrument limit', 'out-of-range', part, { min: 0, max, unit: 'K' },
          `instrument limit (${t.spec.tag}): its ${name} is ${part.toFixed(1)} K, beyond the ${max} K a check takes; calibrate or replace it.`);
      }
      return part;
    };
    const tol = t.spec.tolerance;
    const sensor: TemperatureSensorTolerance = tol.kind === 'iec-60751'
      ? { kind: 'iec-60751', sensorClass: tol.sensorClass }
      : { kind: 'stated', toleranceK: kelvin(tol.kind === 'stated' ? tol.plusMinus : (tol.percentOfSpan / 100) * span, 'class') };
    instruments.temperatureSensor = sensor;
    instruments.temperatureIndicatorToleranceK = kelvin(limit.band.contributions.indicator, 'indicator limit');
    instruments.temperatureDriftToleranceK = kelvin(driftK, 'calibration error and drift');
    // An RTD's class part is the engine's to evaluate at the check's temperature; what `use` keeps is its value at the top of range.
    if (limit.lastCalibrationMs === null) withTypedDrift(use, typedDriftK);
    uses.push(use);
    if (finding) findings.push(finding);
  }
  if (weighs) {
    const w = fitted.weight!;
    requireKind(w, WEIGHT_KINDS, 'weight');
    const { limit, use, finding } = useOf('weight', w, options, undefined);
    instruments.weightToleranceKg = flooredLimit(use, limit, vessel.instruments.weightToleranceKg, VESSEL_LIMITS.weightToleranceKg);
    uses.push(use);
    if (finding) findings.push(finding);
  }
  if (barometer) {
    const a = fitted.atmosphere!;
    requireKind(a, ATMOSPHERE_KINDS, 'atmosphere');
    const { limit, use, finding } = useOf('atmosphere', a, options, undefined);
    instruments.barometerTolerancePa = flooredLimit(use, limit, vessel.instruments.barometerTolerancePa, VESSEL_LIMITS.barometerTolerancePa);
    uses.push(use);
    if (finding) findings.push(finding);
  }
  return { vessel: { ...vessel, instruments, instrumentsUsed: uses }, uses, findings };
}

/**
 * A scale's or barometer's whole limit for the engine's one field: the larger of its class and the
 * figure typed for the vessel, RSS with its indicator, calibration and drift parts (the file's
 * header says why). The use records the class part so taken. Throws InputError ('instrument limit')
 * beyond what the engine takes.
 */
function flooredLimit(use: InstrumentUse, limit: InstrumentLimit, typed: number, max: { max: number; unit: string }): number {
  const parts = limit.band.contributions;
  const classPart = Math.max(parts.class, typed);
  const plusMinus = Math.hypot(classPart, parts.indicator, parts.calibration, parts.drift);
  if (plusMinus > max.max) {
    throw new InputError('instrument limit', 'out-of-range', plusMinus, { min: 0, max: max.max, unit: max.unit },
      `instrument limit (${use.tag}): its limit is ${plusMinus.toPrecision(4)} ${max.unit}, beyond the ${max.max} ${max.unit} a check takes; calibrate or replace it.`);
  }
  use.limit = { ...use.limit, class: classPart, plusMinus };
  return plusMinus;
}

/** With no calibration on record the drift typed for the vessel is the drift part (nothing known replaces it). */
function withTypedDrift(use: InstrumentUse, typedDrift: number): void {
  const l = use.limit;
  use.limit = { ...l, calibration: 0, drift: typedDrift, plusMinus: Math.hypot(l.class, l.indicator, typedDrift) };
  use.driftSource = 'vessel';
}

function requireKind(f: FittedInstrument, kinds: readonly string[], role: InstrumentRole): void {
  if (!kinds.includes(f.spec.kind)) {
    throw new InputError('instrument role', 'inconsistent', f.spec.kind, undefined,
      `instrument role (${f.spec.tag}): a ${f.spec.kind} cannot take the ${role} place; it takes ${kinds.join(' or ')}.`);
  }
}

function useOf(role: InstrumentRole, f: FittedInstrument, options: InstrumentOptions, readingValue: number | undefined): { limit: InstrumentLimit; use: InstrumentUse; finding: Caution | null } {
  const known = f.calibrations.filter((c) => c.timeMs <= options.nowMs);
  const limit = instrumentLimit(f.spec, known, readingValue === undefined ? options : { ...options, readingValue });
  const due = calibrationDue(f.spec, known, options);
  let last: (typeof known)[number] | null = null;
  for (const c of known) if (last === null || c.timeMs >= last.timeMs) last = c;
  const parts = limit.band.contributions;
  const use: InstrumentUse = {
    role,
    instrumentId: f.instrumentId,
    tag: f.spec.tag,
    kind: f.spec.kind,
    calibrationId: last?.calibrationId ?? null,
    calibratedMs: last?.timeMs ?? null,
    due: due.state,
    dueMs: due.state === 'no-calibration' ? null : due.dueMs,
    limit: { class: parts.class, indicator: parts.indicator, calibration: parts.calibration, drift: parts.drift, plusMinus: limit.band.plusMinus },
    driftSource: limit.driftSource,
    foundOutOfTolerance: limit.foundOutOfTolerance,
  };
  // Only an instrument past its due date is a finding about the check; due soon and none on record are its status (the screens show it).
  const finding = due.state === 'overdue' ? calibrationFinding(f.spec.tag, due) : null;
  return { limit, use, finding };
}

/** The result with the instrument findings added: findings re-sorted most severe first, the outcome and the cautions list with them. */
export function withInstrumentFindings(result: CheckResult, findings: readonly Caution[]): CheckResult {
  if (findings.length === 0) return result;
  const raised = [...result.findings, ...result.standing.filter((c) => c.rule !== 'standing-note'), ...findings];
  const sorted = sortedCautions(raised);
  return { ...result, findings: sorted.findings, standing: sorted.standing, cautions: sorted.cautions, outcome: outcomeOf(sorted.findings) };
}
