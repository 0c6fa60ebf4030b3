// One instrument and its calibrations as the core takes them: plain data in SI, in the unit of the
// instrument's kind (UNIT_OF_KIND), times in ms since the epoch. Who calibrated and the certificate
// belong to the register in the store; the core needs only the figures. Validation names the field
// and its valid range, so bad input never reaches a limit or a due date.

import { InputError, requireInRange } from '../errors.ts';
import { INSTRUMENT_KINDS, MS_PER_YEAR, UNIT_OF_KIND, type DriftAllowance, type InstrumentKind, type KindSettings } from './instrument-kind.ts';

/** Accuracy as stated by a standard's class or the maker. */
export type InstrumentTolerance =
  /** ± percent of span anywhere on the scale: EN 837-1 gauge classes, uniform ASME B40.100 grades, transmitter accuracy. */
  | { kind: 'percent-of-span'; percentOfSpan: number }
  /** IEC 60751 platinum RTD classes (temperature kinds only); the limit grows with |t| (see check/uncertainty.ts). */
  | { kind: 'iec-60751'; sensorClass: 'AA' | 'A' | 'B' }
  /** A stated ± limit in the kind's SI unit. */
  | { kind: 'stated'; plusMinus: number };

/** One instrument: what the limit and the due date depend on. */
export interface InstrumentSpec {
  tag: string;
  kind: InstrumentKind;
  /** Lower and upper range values in the kind's SI unit; span = high − low. */
  range: { low: number; high: number };
  /** The element's (or the whole instrument's) class. */
  tolerance: InstrumentTolerance;
  /** A separate indicator or transmitter reading the element, when there is one. */
  indicatorTolerance?: Exclude<InstrumentTolerance, { kind: 'iec-60751' }>;
  /** Overrides the kind setting for this instrument. */
  driftAllowance?: DriftAllowance;
  /** Overrides the kind's calibration interval, ms. */
  calibrationIntervalMs?: number;
}

/** One calibration's figures. Errors are indication − reference, signed, at the worst point checked, in the kind's SI unit. */
export interface CalibrationRecord {
  /** When it was calibrated, ms since the epoch. */
  timeMs: number;
  asFoundError: number;
  /** After adjustment; absent when the instrument was left as found. */
  asLeftError?: number;
  /** The reference value at the worst point, SI; lets an IEC 60751 class be judged where it was found. */
  referenceValue?: number;
  /** The due date the calibration set, ms; absent: the calibration date plus the interval. */
  nextDueMs?: number;
}

/** Dates the core accepts: those Date can hold (±8.64e15 ms, ECMA-262 §21.4.1.1). */
export const TIME_LIMITS_MS = { min: -8.64e15, max: 8.64e15, unit: 'ms since 1970-01-01T00:00:00Z' } as const;

/** Ranges of an instrument's figures, SI. Temperatures: above 0 K up to 2273.15 K, the top of IAPWS-IF97 (R7-97(2012)). */
export const INSTRUMENT_LIMITS = {
  rangePa: { min: -110e3, max: 100e6, unit: 'Pa' },
  rangeK: { min: 0, max: 2273.15, unit: 'K' },
  rangeKg: { min: 0, max: 1e7, unit: 'kg' },
  percentOfSpan: { min: 0, max: 10, unit: '% of span' },
  percentOfSpanPerYear: { min: 0, max: 10, unit: '% of span per year' },
  calibrationIntervalMs: { min: 1, max: 10 * MS_PER_YEAR, unit: 'ms' },
} as const;

const RANGE_OF_UNIT = { Pa: INSTRUMENT_LIMITS.rangePa, K: INSTRUMENT_LIMITS.rangeK, kg: INSTRUMENT_LIMITS.rangeKg } as const;

/** A time for a message: ISO 8601 (UTC) when Date can hold it, else the number as given. */
export function timeText(ms: number): string {
  return Number.isFinite(ms) && Math.abs(ms) <= TIME_LIMITS_MS.max ? new Date(ms).toISOString() : String(ms);
}

/**
 * Throws InputError unless min ≤ ms ≤ max (ms since the epoch): not-a-number for NaN or ±Infinity,
 * out-of-range otherwise; the message gives the dates in ISO 8601 and says where (`where`).
 */
export function requireTime(field: string, ms: number, min: number, max: number, where: string): void {
  if (Number.isFinite(ms) && ms >= min && ms <= max) return;
  throw new InputError(field, Number.isFinite(ms) ? 'out-of-range' : 'not-a-number', ms, { min, max, unit: TIME_LIMITS_MS.unit },
    `${field}${where}: ${timeText(ms)} is outside the valid range ${timeText(min)} to ${timeText(max)}.`);
}

/** Span of the instrument, its unit: high − low. */
export function instrumentSpan(instrument: InstrumentSpec): number {
  return instrument.range.high - instrument.range.low;
}

/** Throws InputError naming the first bad field of the instrument: tag, kind, range, tolerances, drift allowance, interval. */
export function validateInstrument(instrument: InstrumentSpec): void {
  if (typeof instrument.tag !== 'string' || instrument.tag.trim() === '') throw new InputError('instrument tag', 'empty', String(instrument.tag ?? ''));
  const tag = instrument.tag;
  if (!(INSTRUMENT_KINDS as readonly string[]).includes(instrument.kind)) {
    throw new InputError('instrument kind', 'out-of-range', String(instrument.kind), undefined,
      `instrument kind (${tag}): "${String(instrument.kind)}" is not one of ${INSTRUMENT_KINDS.join(', ')}.`);
  }
  const unit = UNIT_OF_KIND[instrument.kind];
  const R = RANGE_OF_UNIT[unit];
  requireInRange('range low', instrument.range?.low, R.min, R.max, R.unit);
  requireInRange('range high', instrument.range.high, R.min, R.max, R.unit);
  if (instrument.range.high <= instrument.range.low) {
    throw new InputError('range high', 'inconsistent', instrument.range.high, { min: instrument.range.low, max: R.max, unit },
      `range high (${tag}): ${instrument.range.high} ${unit} must be above the range low (${instrument.range.low} ${unit}).`);
  }
  const span = instrumentSpan(instrument);
  validateTolerance('accuracy class', instrument.tolerance, instrument.kind, span, tag);
  if (instrument.indicatorTolerance !== undefined) {
    if (instrument.indicatorTolerance.kind === ('iec-60751' as string)) {
      throw new InputError('indicator tolerance', 'out-of-range', 'iec-60751', undefined,
        `indicator tolerance (${tag}): an indicator has a percent-of-span or a stated limit, not an RTD class.`);
    }
    validateTolerance('indicator tolerance', instrument.indicatorTolerance, instrument.kind, span, tag);
  }
  if (instrument.driftAllowance !== undefined) validateDriftAllowance(instrument.driftAllowance, span, unit);
  if (instrument.calibrationIntervalMs !== undefined) {
    const I = INSTRUMENT_LIMITS.calibrationIntervalMs;
    requireInRange('calibration interval', instrument.calibrationIntervalMs, I.min, I.max, I.unit);
  }
}

function validateTolerance(field: string, t: InstrumentTolerance, kind: InstrumentKind, span: number, tag: string): void {
  const unit = UNIT_OF_KIND[kind];
  switch (t?.kind) {
    case 'percent-of-span': {
      const P = INSTRUMENT_LIMITS.percentOfSpan;
      requireInRange(field, t.percentOfSpan, P.min, P.max, P.unit);
      return;
    }
    case 'stated':
      requireInRange(field, t.plusMinus, 0, span, unit);
      return;
    case 'iec-60751':
      if (unit !== 'K' || !['AA', 'A', 'B'].includes(t.sensorClass)) {
        throw new InputError(field, 'out-of-range', String(t.sensorClass), undefined,
          `${field} (${tag}): IEC 60751 classes AA, A and B apply to temperature sensors only.`);
      }
      return;
    default:
      throw new InputError(field, 'empty', String((t as { kind?: unknown } | undefined)?.kind ?? ''), undefined,
        `${field} (${tag}): give a percent of span, a stated ± limit${unit === 'K' ? ' or an IEC 60751 class' : ''}.`);
  }
}

/** Throws InputError ('drift allowance') unless the allowance is 0–10 % of span per year, or 0 to one span per year. */
export function validateDriftAllowance(d: DriftAllowance, span: number, unit: string): void {
  if (d?.basis === 'percent-of-span') {
    const P = INSTRUMENT_LIMITS.percentOfSpanPerYear;
    requireInRange('drift allowance', d.percentOfSpanPerYear, P.min, P.max, P.unit);
  } else if (d?.basis === 'absolute') requireInRange('drift allowance', d.siUnitsPerYear, 0, span, `${unit} per year`);
  else throw new InputError('drift allowance', 'empty', String((d as { basis?: unknown } | undefined)?.basis ?? ''), undefined,
    'drift allowance: give a percent of span per year or an amount per year.');
}

/** Throws InputError ('calibration interval' or 'drift allowance') unless a kind's settings are in range. */
export function validateKindSettings(settings: KindSettings, kind: InstrumentKind, span: number): void {
  const I = INSTRUMENT_LIMITS.calibrationIntervalMs;
  requireInRange('calibration interval', settings?.calibrationIntervalMs, I.min, I.max, I.unit);
  validateDriftAllowance(settings.driftAllowance, span, UNIT_OF_KIND[kind]);
}

/**
 * Throws InputError naming the first bad field of a calibration history: calibration date (a date,
 * not after nowMs), as-found and as-left error (within ± the span), reference value (within the
 * kind's range), next due date (after the calibration date).
 */
export function validateCalibrations(instrument: InstrumentSpec, calibrations: readonly CalibrationRecord[], nowMs: number): void {
  const span = instrumentSpan(instrument);
  const unit = UNIT_OF_KIND[instrument.kind];
  const T = TIME_LIMITS_MS;
  calibrations.forEach((c, i) => {
    const which = `calibration ${i + 1} of ${calibrations.length} (${instrument.tag})`;
    const within = (field: string, value: number, min: number, max: number, u: string) => {
      if (!Number.isFinite(value) || value < min || value > max) {
        throw new InputError(field, Number.isFinite(value) ? 'out-of-range' : 'not-a-number', value, { min, max, unit: u },
          `${field}, ${which}: ${String(value)} ${u} is outside the valid range ${min} to ${max} ${u}.`);
      }
    };
    if (Number.isFinite(c.timeMs) && c.timeMs > nowMs && c.timeMs <= T.max) {
      throw new InputError('calibration date', 'inconsistent', c.timeMs, { min: T.min, max: nowMs, unit: T.unit },
        `calibration date, ${which}: ${timeText(c.timeMs)} is after the date now (${timeText(nowMs)}); ` +
          'a calibration cannot be in the future (check the date entered and the device clock).');
    }
    requireTime('calibration date', c.timeMs, T.min, nowMs, `, ${which}`);
    within('as-found error', c.asFoundError, -span, span, unit);
    if (c.asLeftError !== undefined) within('as-left error', c.asLeftError, -span, span, unit);
    if (c.referenceValue !== undefined) {
      const R = RANGE_OF_UNIT[unit];
      within('reference value', c.referenceValue, R.min, R.max, unit);
    }
    if (c.nextDueMs !== undefined) requireTime('next due date', c.nextDueMs, c.timeMs + 1, T.max, `, ${which} (after its calibration date)`);
  });
}

/** Throws InputError ('date now') unless nowMs is a date Date can hold. */
export function validateNow(nowMs: number): void {
  requireTime('date now', nowMs, TIME_LIMITS_MS.min, TIME_LIMITS_MS.max, '');
}

/** The calibration with the latest date (the later in the list on a tie), or null for an empty history. */
export function lastCalibration(calibrations: readonly CalibrationRecord[]): CalibrationRecord | null {
  let last: CalibrationRecord | null = null;
  for (const c of calibrations) if (last === null || c.timeMs >= last.timeMs) last = c;
  return last;
}
