// Whether an instrument's calibration is in date, due soon or overdue, from its history, the date
// now and a "due soon" window. The due date is the one the last calibration set, or its date plus
// the interval (the instrument's own, else its kind's setting). Pure: now is always a parameter.

import { requireInRange } from '../errors.ts';
import { DEFAULT_DUE_SOON_WINDOW_MS, DEFAULT_INSTRUMENT_SETTINGS, MS_PER_YEAR, type InstrumentSettings } from './instrument-kind.ts';
import {
  instrumentSpan, lastCalibration, validateCalibrations, validateInstrument, validateKindSettings, validateNow,
  type CalibrationRecord, type InstrumentSpec,
} from './instrument-spec.ts';

/** Ids stored and shown: "in date", "due soon", "overdue", "no calibration on record". */
export type CalibrationDueState = 'in-date' | 'due-soon' | 'overdue' | 'no-calibration';

export type CalibrationDue =
  | { state: 'no-calibration' }
  | {
      state: 'in-date' | 'due-soon' | 'overdue';
      lastCalibrationMs: number;
      dueMs: number;
      /** 'stated': the last calibration's next due date; 'interval': its date plus the interval. */
      dueSource: 'stated' | 'interval';
      /** dueMs − nowMs: negative once overdue. */
      untilDueMs: number;
    };

/** Options shared by the instrument functions. */
export interface InstrumentOptions {
  /** The date now, ms since the epoch (the caller's clock; the core has none). */
  nowMs: number;
  /** Per-kind settings; DEFAULT_INSTRUMENT_SETTINGS when absent. */
  settings?: InstrumentSettings;
  /** How long before the due date "due soon" starts, ms (0 – 1 year); DEFAULT_DUE_SOON_WINDOW_MS when absent. */
  dueSoonWindowMs?: number;
}

/** The words a screen shows for each state. */
export const CALIBRATION_DUE_WORDS: Readonly<Record<CalibrationDueState, string>> = {
  'in-date': 'in date',
  'due-soon': 'due soon',
  overdue: 'overdue',
  'no-calibration': 'no calibration on record',
};

/**
 * The due state of an instrument now. Overdue from the due date itself; due soon within the window
 * before it. Throws InputError naming the field for a bad instrument, calibration, date now, setting or window.
 */
export function calibrationDue(instrument: InstrumentSpec, calibrations: readonly CalibrationRecord[], options: InstrumentOptions): CalibrationDue {
  validateInstrument(instrument);
  validateNow(options.nowMs);
  validateCalibrations(instrument, calibrations, options.nowMs);
  const window = options.dueSoonWindowMs ?? DEFAULT_DUE_SOON_WINDOW_MS;
  requireInRange('due-soon window', window, 0, MS_PER_YEAR, 'ms');
  const last = lastCalibration(calibrations);
  if (last === null) return { state: 'no-calibration' };
  const kindSettings = (options.settings ?? DEFAULT_INSTRUMENT_SETTINGS)[instrument.kind];
  validateKindSettings(kindSettings, instrument.kind, instrumentSpan(instrument));
  const interval = instrument.calibrationIntervalMs ?? kindSettings.calibrationIntervalMs;
  const dueSource = last.nextDueMs === undefined ? 'interval' : 'stated';
  const dueMs = last.nextDueMs ?? last.timeMs + interval;
  const untilDueMs = dueMs - options.nowMs;
  const state = untilDueMs <= 0 ? 'overdue' : untilDueMs <= window ? 'due-soon' : 'in-date';
  return { state, lastCalibrationMs: last.timeMs, dueMs, dueSource, untilDueMs };
}
