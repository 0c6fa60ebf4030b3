// Between the register screens and the core: an instrument's status now (overdue, due soon, out of
// tolerance, none on record, in date) and the order the list shows them in, its figures in its own
// display unit, a drift estimate in words, and the calibration form's text turned into SI with each
// bad field named with its valid range.
import {
  InputError, isPressureUnit, isTemperatureUnit, pressureFromPa, pressureToPa, temperatureDifferenceFromK, temperatureDifferenceToK, temperatureFromK,
} from '../../core/index.ts';
// The instruments room by its files (src/core/instrument/README.md, "Imports"): its index would bring the drift estimator.
import { CALIBRATION_DUE_WORDS, calibrationDue, type CalibrationDue } from '../../core/instrument/calibration-due.ts';
import { instrumentLimit } from '../../core/instrument/instrument-limit.ts';
import { instrumentSpan, validateCalibrations, type InstrumentSpec } from '../../core/instrument/instrument-spec.ts';
import { MS_PER_MONTH } from '../../core/instrument/instrument-kind.ts';
import { calibrationFigures, type InstrumentHistory, type NewCalibration } from '../../store/index.ts';
import { formatNumber, readNumber } from './format.ts';
import { unitLabel } from './unit-labels.ts';
import type { PairDrift } from './pair-drift.ts';

/** What the list sorts by, most pressing first. */
export type InstrumentStatus = 'overdue' | 'due-soon' | 'out-of-tolerance' | 'no-calibration' | 'in-date' | 'retired' | 'unreadable';
export const STATUS_ORDER: readonly InstrumentStatus[] = ['overdue', 'due-soon', 'out-of-tolerance', 'no-calibration', 'in-date', 'retired', 'unreadable'];
export const STATUS_WORDS: Readonly<Record<InstrumentStatus, string>> = {
  ...CALIBRATION_DUE_WORDS, 'out-of-tolerance': 'found out of tolerance', retired: 'retired', unreadable: 'figures not readable by this version',
};

export interface InstrumentState {
  status: InstrumentStatus;
  due: CalibrationDue | null;
  /** The last calibration's as-found error was beyond the class. */
  foundOutOfTolerance: boolean;
}

/** An instrument's state at nowMs. Out of tolerance ranks after overdue and due soon: a due date is the first thing to act on. */
export function instrumentState(h: InstrumentHistory, nowMs: number): InstrumentState {
  if (h.instrument.retired) return { status: 'retired', due: null, foundOutOfTolerance: false };
  try {
    const cals = h.calibrations.filter((c) => c.timeMs <= nowMs).map(calibrationFigures);
    const due = calibrationDue(h.instrument.spec, cals, { nowMs });
    const at = h.instrument.spec.tolerance.kind === 'iec-60751' ? Math.min(Math.max(h.instrument.spec.range.high, 273.16), 2273.15) : undefined;
    const limit = instrumentLimit(h.instrument.spec, cals, at === undefined ? { nowMs } : { nowMs, readingValue: at });
    const foundOutOfTolerance = limit.foundOutOfTolerance;
    const status: InstrumentStatus = due.state === 'overdue' || due.state === 'due-soon' ? due.state : foundOutOfTolerance ? 'out-of-tolerance' : due.state;
    return { status, due, foundOutOfTolerance };
  } catch {
    return { status: 'unreadable', due: null, foundOutOfTolerance: false };
  }
}

/** The register in the list's order: by status (STATUS_ORDER), then the earliest due date, then tag. */
export function sortedRegister(register: readonly InstrumentHistory[], nowMs: number): { history: InstrumentHistory; state: InstrumentState }[] {
  const rank = (s: InstrumentStatus) => STATUS_ORDER.indexOf(s);
  const dueMs = (s: InstrumentState) => (s.due && s.due.state !== 'no-calibration' ? s.due.dueMs : Infinity);
  return register
    .map((history) => ({ history, state: instrumentState(history, nowMs) }))
    .sort((a, b) => rank(a.state.status) - rank(b.state.status) || dueMs(a.state) - dueMs(b.state) || a.history.instrument.tagKey.localeCompare(b.history.instrument.tagKey));
}

const day = (ms: number) => new Date(ms).toISOString().slice(0, 10);

/** "overdue since 2026-11-01", "due soon, on …", "in date, due …", "no calibration on record". */
export function dueTextOf(h: InstrumentHistory, nowMs = Date.now()): string {
  const s = instrumentState(h, nowMs);
  const d = s.due;
  const base = d === null ? STATUS_WORDS[s.status]
    : d.state === 'no-calibration' ? CALIBRATION_DUE_WORDS['no-calibration']
    : d.state === 'overdue' ? `overdue since ${day(d.dueMs)}`
    : `${CALIBRATION_DUE_WORDS[d.state]}, due ${day(d.dueMs)}`;
  return s.foundOutOfTolerance ? `${base}; last found out of tolerance` : base;
}

/** The kind's SI unit for an instrument: Pa, K or kg. */
function siUnitOf(spec: InstrumentSpec): 'Pa' | 'K' | 'kg' {
  return spec.kind === 'thermometer' || spec.kind === 'rtd' ? 'K' : spec.kind === 'weighing-system' ? 'kg' : 'Pa';
}

/** An error (a difference) in the instrument's display unit, from SI. */
export function errorInDisplay(spec: InstrumentSpec, displayUnit: string, si: number): number {
  if (siUnitOf(spec) === 'Pa' && isPressureUnit(displayUnit)) return pressureFromPa(si, displayUnit, 'error');
  if (siUnitOf(spec) === 'K' && isTemperatureUnit(displayUnit)) return temperatureDifferenceFromK(si, displayUnit, 'error');
  return si;
}

/** The unit shown beside an instrument's figures (its display unit when it fits its kind, else the SI unit). */
export function shownUnit(spec: InstrumentSpec, displayUnit: string): string {
  const si = siUnitOf(spec);
  if ((si === 'Pa' && isPressureUnit(displayUnit)) || (si === 'K' && isTemperatureUnit(displayUnit))) return displayUnit;
  return si;
}

/** An error as text in the display unit, with its sign: "+4.2 kPa". */
export function errorText(spec: InstrumentSpec, displayUnit: string, si: number): string {
  const v = errorInDisplay(spec, displayUnit, si);
  const unit = shownUnit(spec, displayUnit);
  return `${v > 0 ? '+' : v < 0 ? '−' : ''}${formatNumber(Math.abs(v), 3)} ${unitLabel(unit)}`;
}

/** The range as text in the display unit. */
export function rangeText(spec: InstrumentSpec, displayUnit: string): string {
  const unit = shownUnit(spec, displayUnit);
  const conv = (x: number) => (siUnitOf(spec) === 'Pa' && isPressureUnit(unit) ? pressureFromPa(x, unit) : siUnitOf(spec) === 'K' && isTemperatureUnit(unit) ? temperatureFromK(x, unit) : x);
  return `${formatNumber(conv(spec.range.low), 4)} to ${formatNumber(conv(spec.range.high), 4)} ${unitLabel(unit)}`;
}

/** The class or tolerance in words. */
export function toleranceText(spec: InstrumentSpec, displayUnit: string): string {
  const t = spec.tolerance;
  if (t.kind === 'percent-of-span') return `± ${formatNumber(t.percentOfSpan, 3)} % of span`;
  if (t.kind === 'iec-60751') return `IEC 60751 class ${t.sensorClass}`;
  return `± ${errorText(spec, displayUnit, t.plusMinus).replace(/^[+−]/, '')}`;
}

/** A drift estimate in words: a one-line summary (also when there is no estimate) and the figures. */
export function driftFigures(p: PairDrift): { summary: string; detail: string } {
  const d = p.drift;
  if (d.estimate !== 'made') {
    return { summary: `Drift from the log: ${d.checksUsed} saturated checks since the last calibration, ${d.minimumChecks} needed for an estimate.`, detail: '' };
  }
  const kPa = (pa: number) => formatNumber(pa / 1000, 3);
  const trend = d.trendPaPerS === null ? 'no trend (all at one time)'
    : `trend ${kPa(d.trendPaPerS.value * (MS_PER_MONTH / 1000))} ± ${kPa(d.trendPaPerS.plusMinus * (MS_PER_MONTH / 1000))} kPa a month`;
  const summary = d.findings.length === 0
    ? `Drift from the log: over ${d.checksUsed} saturated checks the gauge and thermometer agree within what the figures can tell.`
    : '';
  const detail = `${d.checksUsed} saturated checks from ${day(d.firstMs)} to ${day(d.lastMs)}${d.outliersSetAside ? ` (${d.outliersSetAside} set aside as outliers)` : ''}: ` +
    `mean offset p − p_sat(T) ${kPa(d.offsetPa.value)} ± ${kPa(d.offsetPa.plusMinus)} kPa (95 %), ` +
    `${formatNumber(d.temperatureOffsetK.value, 2)} ± ${formatNumber(d.temperatureOffsetK.plusMinus, 2)} K in temperature; ${trend}; ` +
    `serial correlation ${formatNumber(d.lag1Autocorrelation, 2)}, about ${formatNumber(d.effectiveCount, 3)} independent readings.`;
  return { summary, detail };
}

/** The calibration form as typed. */
export interface CalibrationDraft {
  date: string;
  asFound: string;
  asLeft: string;
  nextDue: string;
  who: string;
  certificate: string;
  note: string;
}

export const EMPTY_CALIBRATION: CalibrationDraft = { date: '', asFound: '', asLeft: '', nextDue: '', who: '', certificate: '', note: '' };

export type CalibrationField = keyof CalibrationDraft;

/** A YYYY-MM-DD date as noon UTC of that day (a calendar date, the same day in every zone the plant is likely in). */
function dateOf(text: string, field: string): Date {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(text.trim());
  const d = m ? new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]), 12)) : null;
  if (!d || d.toISOString().slice(0, 10) !== text.trim()) throw new InputError(field, 'not-a-number', text, undefined, `${field}: "${text}" is not a date; give it as YYYY-MM-DD (ISO 8601).`);
  return d;
}

/**
 * The calibration form in SI, checked by the core against the instrument and its history (a date
 * not after today, errors within ± its span, next due after the calibration), or the errors by
 * field, each naming the field and its valid range.
 */
export function calibrationFromDraft(h: InstrumentHistory, d: CalibrationDraft, nowMs: number):
  | { ok: true; calibration: NewCalibration }
  | { ok: false; errors: Partial<Record<CalibrationField, string>> } {
  const spec = h.instrument.spec;
  const unit = shownUnit(spec, h.instrument.displayUnit);
  const span = instrumentSpan(spec);
  const toSi = (x: number) => (siUnitOf(spec) === 'Pa' && isPressureUnit(unit) ? pressureToPa(x, unit) : siUnitOf(spec) === 'K' && isTemperatureUnit(unit) ? temperatureDifferenceToK(x, unit) : x);
  const spanShown = Math.abs(errorInDisplay(spec, h.instrument.displayUnit, span));
  const errors: Partial<Record<CalibrationField, string>> = {};
  const attempt = <T>(field: CalibrationField, f: () => T): T | undefined => {
    try {
      return f();
    } catch (e) {
      errors[field] = e instanceof Error ? e.message : String(e);
      return undefined;
    }
  };
  // Today's date is taken as now, so a calibration entered today counts at once; another day at noon UTC.
  const date = attempt('date', () => {
    const at = dateOf(d.date, 'calibration date');
    return at.toISOString().slice(0, 10) === new Date(nowMs).toISOString().slice(0, 10) ? new Date(Math.min(at.getTime(), nowMs)) : at;
  });
  const errorField = (field: 'asFound' | 'asLeft', name: string) => attempt(field, () => {
    const v = readNumber(d[field], name);
    // The span as a plain number (400, not 400.0): it bounds what may be typed, it is not a measured figure.
    const limit = String(Number(spanShown.toPrecision(6)));
    if (Math.abs(v) > spanShown) throw new InputError(name, 'out-of-range', v, { min: -spanShown, max: spanShown, unit }, `${name}: ${d[field].trim()} ${unitLabel(unit)} is outside the valid range −${limit} to ${limit} ${unitLabel(unit)} (± the span).`);
    return toSi(v);
  });
  const asFound = errorField('asFound', 'as-found error');
  const asLeft = d.asLeft.trim() === '' ? undefined : errorField('asLeft', 'as-left error');
  const nextDue = d.nextDue.trim() === '' ? undefined : attempt('nextDue', () => dateOf(d.nextDue, 'next due date'));
  if (d.who.trim() === '') errors.who = 'calibrated by: give the person or laboratory (1 to 120 characters).';
  else if (d.who.trim().length > 120) errors.who = `calibrated by: ${d.who.trim().length} characters; allowed 1 to 120.`;
  if (d.certificate.trim().length > 120) errors.certificate = `certificate: ${d.certificate.trim().length} characters; allowed 0 to 120.`;
  if (d.note.length > 500) errors.note = `note: ${d.note.length} characters; allowed 0 to 500.`;
  if (date && nextDue && nextDue.getTime() <= date.getTime()) errors.nextDue = `next due date: ${d.nextDue} must be after the calibration date (${d.date}).`;
  if (Object.keys(errors).length > 0 || date === undefined || asFound === undefined) return { ok: false, errors };
  const figures = { timeMs: date.getTime(), asFoundError: asFound, ...(asLeft === undefined ? {} : { asLeftError: asLeft }), ...(nextDue === undefined ? {} : { nextDueMs: nextDue.getTime() }) };
  try {
    validateCalibrations(spec, [...h.calibrations.filter((c) => c.timeMs <= nowMs).map(calibrationFigures), figures], nowMs);
  } catch (e) {
    const field: CalibrationField = e instanceof InputError ? ({ 'calibration date': 'date', 'as-found error': 'asFound', 'as-left error': 'asLeft', 'next due date': 'nextDue' } as const)[e.field as 'calibration date'] ?? 'date' : 'date';
    return { ok: false, errors: { [field]: e instanceof Error ? e.message : String(e) } };
  }
  const calibration: NewCalibration = {
    instrumentId: h.instrument.id, calibratedAt: date, asFoundError: asFound, who: d.who.trim(), certificate: d.certificate.trim(), enteredUnit: unit, note: d.note,
  };
  if (asLeft !== undefined) calibration.asLeftError = asLeft;
  if (nextDue !== undefined) calibration.nextDueAt = nextDue;
  return { ok: true, calibration };
}
