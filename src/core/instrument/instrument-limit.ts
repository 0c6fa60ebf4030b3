// The ± limit an instrument contributes to a check now, from four independent parts, each kept
// so a band breakdown can show it:
// - class: the element's class or stated tolerance (what the instrument is allowed by its standard);
// - indicator: a separate indicator or transmitter reading the element, if any;
// - calibration: the error the last calibration left in it, |as-left| (|as-found| when it was not
//   adjusted): known at the last calibration, unknown in sign to the check;
// - drift: the allowance per year times the years since that calibration. The rate is the
//   instrument's own setting, else its kind's, raised to the rate its last interval showed,
//   |as-found now − as-left before| / time between, when that is higher: history beats a default.
// Combined by root-sum-square like the check's own band (check/uncertainty.ts), with the worst case
// beside it. RSS of class and calibration counts the calibration error twice when it is part of
// what the class allows; it stays because the two are known separately and the excess is at most
// √2 of the larger.

import { InputError } from '../errors.ts';
import { combineBand, temperatureToleranceK, type Band } from '../check/uncertainty.ts';
import { DEFAULT_INSTRUMENT_SETTINGS, MS_PER_YEAR, UNIT_OF_KIND, type DriftAllowance, type InstrumentKind, type InstrumentUnit } from './instrument-kind.ts';
import {
  instrumentSpan, lastCalibration, validateCalibrations, validateInstrument, validateKindSettings, validateNow,
  type CalibrationRecord, type InstrumentSpec, type InstrumentTolerance,
} from './instrument-spec.ts';
import type { InstrumentOptions } from './calibration-due.ts';

/** The parts of an instrument's limit, in the order a band breakdown lists them. */
export const LIMIT_PARTS = ['class', 'indicator', 'calibration', 'drift'] as const;
export type LimitPart = (typeof LIMIT_PARTS)[number];

/** An instrument's limit now, in its kind's SI unit. */
export interface InstrumentLimit {
  tag: string;
  kind: InstrumentKind;
  unit: InstrumentUnit;
  /** plusMinus (RSS, what a check uses), worstCase, and each part, all in `unit`. */
  band: Band<LimitPart>;
  /** Which error of the last calibration the calibration part uses; 'none' with no calibration on record. */
  calibrationBasis: 'as-left' | 'as-found' | 'none';
  /** The last calibration's date, or null; nowMs − that date, or null. */
  lastCalibrationMs: number | null;
  sinceCalibrationMs: number | null;
  /** The drift rate used, `unit` per year, and where it came from. */
  driftPerYear: number;
  driftSource: 'kind-setting' | 'instrument-setting' | 'last-interval';
  /** The last calibration's as-found error was beyond the class (and indicator) limit at its point. */
  foundOutOfTolerance: boolean;
}

/** Options for a limit: the date now and settings, and the reading the limit is for. */
export interface LimitOptions extends InstrumentOptions {
  /**
   * The reading, in the kind's SI unit: an IEC 60751 class grows with |t|, so a temperature
   * sensor with a class needs it (273.16 K … 2273.15 K is accepted; the class tables stop at 850 °C).
   */
  readingValue?: number;
}

/**
 * The ± limit an instrument contributes now. Throws InputError naming the field for a bad
 * instrument, calibration, date now or setting, and ('reading') when an IEC 60751 class has no
 * reading to be evaluated at. With no calibration on record, the calibration and drift parts are 0
 * (nothing is known to grow from); the due state says so.
 */
export function instrumentLimit(instrument: InstrumentSpec, calibrations: readonly CalibrationRecord[], options: LimitOptions): InstrumentLimit {
  validateInstrument(instrument);
  validateNow(options.nowMs);
  validateCalibrations(instrument, calibrations, options.nowMs);
  const span = instrumentSpan(instrument);
  const kindSettings = (options.settings ?? DEFAULT_INSTRUMENT_SETTINGS)[instrument.kind];
  validateKindSettings(kindSettings, instrument.kind, span);
  const unit = UNIT_OF_KIND[instrument.kind];
  if (instrument.tolerance.kind === 'iec-60751' && options.readingValue === undefined) {
    throw new InputError('reading', 'empty', '', { min: 273.16, max: 2273.15, unit: 'K' },
      `reading (${instrument.tag}): an IEC 60751 class depends on the temperature; give the reading the limit is for.`);
  }
  if (options.readingValue !== undefined && unit === 'K' && instrument.tolerance.kind === 'iec-60751') {
    if (!Number.isFinite(options.readingValue) || options.readingValue < 273.16 || options.readingValue > 2273.15) {
      throw new InputError('reading', Number.isFinite(options.readingValue) ? 'out-of-range' : 'not-a-number', options.readingValue,
        { min: 273.16, max: 2273.15, unit: 'K' });
    }
  }
  const at = options.readingValue ?? instrument.range.high;
  const classLimit = toleranceAt(instrument.tolerance, span, at);
  const indicator = instrument.indicatorTolerance === undefined ? 0 : toleranceAt(instrument.indicatorTolerance, span, at);

  const ordered = [...calibrations].sort((a, b) => a.timeMs - b.timeMs);
  const last = lastCalibration(calibrations);
  const own = instrument.driftAllowance;
  const allowance = own ?? kindSettings.driftAllowance;
  let driftPerYear = driftRatePerYear(allowance, span);
  let driftSource: InstrumentLimit['driftSource'] = own === undefined ? 'kind-setting' : 'instrument-setting';
  const before = ordered.length >= 2 ? ordered[ordered.length - 2]! : null;
  if (last !== null && before !== null && last.timeMs > before.timeMs) {
    const seen = (Math.abs(last.asFoundError - (before.asLeftError ?? before.asFoundError)) / (last.timeMs - before.timeMs)) * MS_PER_YEAR;
    if (seen > driftPerYear) {
      driftPerYear = seen;
      driftSource = 'last-interval';
    }
  }
  const sinceCalibrationMs = last === null ? null : options.nowMs - last.timeMs;
  const band = combineBand<LimitPart>({
    class: classLimit,
    indicator,
    calibration: last === null ? 0 : Math.abs(last.asLeftError ?? last.asFoundError),
    drift: sinceCalibrationMs === null ? 0 : (driftPerYear * sinceCalibrationMs) / MS_PER_YEAR,
  });
  let foundOutOfTolerance = false;
  if (last !== null) {
    const point = last.referenceValue ?? at;
    const allowed = Math.hypot(
      toleranceAt(instrument.tolerance, span, point),
      instrument.indicatorTolerance === undefined ? 0 : toleranceAt(instrument.indicatorTolerance, span, point),
    );
    foundOutOfTolerance = Math.abs(last.asFoundError) > allowed;
  }
  return {
    tag: instrument.tag,
    kind: instrument.kind,
    unit,
    band,
    calibrationBasis: last === null ? 'none' : last.asLeftError === undefined ? 'as-found' : 'as-left',
    lastCalibrationMs: last?.timeMs ?? null,
    sinceCalibrationMs,
    driftPerYear,
    driftSource,
    foundOutOfTolerance,
  };
}

/** A tolerance's ± limit at a value, in the instrument's unit (an IEC 60751 class in K at a temperature in K). */
function toleranceAt(t: InstrumentTolerance, span: number, value: number): number {
  switch (t.kind) {
    case 'percent-of-span':
      return (t.percentOfSpan / 100) * span;
    case 'stated':
      return t.plusMinus;
    case 'iec-60751':
      return temperatureToleranceK(t, value);
  }
}

/** A drift allowance as an amount per year in the instrument's unit. */
function driftRatePerYear(d: DriftAllowance, span: number): number {
  return d.basis === 'percent-of-span' ? (d.percentOfSpanPerYear / 100) * span : d.siUnitsPerYear;
}
