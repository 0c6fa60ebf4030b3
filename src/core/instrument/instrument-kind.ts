// The kinds of instrument a vessel's checks rest on, the SI unit each measures in, and the per-kind
// settings the limits and due dates start from (a site replaces them with its own figures). Time
// here is ms since 1970-01-01T00:00:00Z, as Date.parse gives it; the core never reads a clock.

/** Kinds of instrument, ids stored in records (never renamed). */
export const INSTRUMENT_KINDS = ['pressure-gauge', 'pressure-transmitter', 'thermometer', 'rtd', 'barometer', 'weighing-system'] as const;
export type InstrumentKind = (typeof INSTRUMENT_KINDS)[number];

/** The SI unit an instrument's range, tolerances and errors are in. */
export type InstrumentUnit = 'Pa' | 'K' | 'kg';

/** What each kind measures, in SI: gauge and transmitter pressure in their own reference (gauge or absolute), a barometer absolute. */
export const UNIT_OF_KIND = {
  'pressure-gauge': 'Pa',
  'pressure-transmitter': 'Pa',
  thermometer: 'K',
  rtd: 'K',
  barometer: 'Pa',
  'weighing-system': 'kg',
} as const satisfies Record<InstrumentKind, InstrumentUnit>;

export const MS_PER_DAY = 86_400_000;
/** A year of 365.25 days (the Julian year). Intervals are set in months and years; the 0.07 % between year lengths is far inside any drift allowance. */
export const MS_PER_YEAR = 365.25 * MS_PER_DAY;
/** A twelfth of MS_PER_YEAR: the month that drift rates are shown in. */
export const MS_PER_MONTH = MS_PER_YEAR / 12;

/** How far an instrument may wander per year since its last calibration, on top of its class. */
export type DriftAllowance =
  | { basis: 'percent-of-span'; percentOfSpanPerYear: number }
  /** In the kind's SI unit (Pa, K or kg) per year. */
  | { basis: 'absolute'; siUnitsPerYear: number };

/** Per-kind settings: the interval used when a calibration states no next due date, and the drift allowance. */
export interface KindSettings {
  calibrationIntervalMs: number;
  driftAllowance: DriftAllowance;
}
export type InstrumentSettings = Readonly<Record<InstrumentKind, KindSettings>>;

/**
 * Starting values, to be replaced by a site's own calibration history. Interval: one year for every
 * kind (common practice where no history exists yet). Drift allowances, all common practice or from
 * memory as marked, none from a standard:
 * - pressure gauge 0.5 % of span per year: our choice, so a gauge of the usual classes (1.0, 1.6)
 *   stays near its class between annual calibrations (common practice);
 * - pressure transmitter 0.1 % of span per year: the order of the long-term stability electronic
 *   transmitters are usually specified with (from memory);
 * - thermometer (dial, bimetal, filled) 0.5 K per year: our choice (common practice);
 * - RTD 0.1 K per year: the order of drift of an industrial Pt100 in clean service below 200 °C (from memory);
 * - barometer 100 Pa (1 hPa) per year: the order of drift of an aneroid barometer (from memory);
 * - weighing system 0.1 % of span per year: our choice; tare drift and piping restraint usually
 *   dominate a vessel scale (field-practice.md §3.4, from memory) and belong in its tolerance.
 */
export const DEFAULT_INSTRUMENT_SETTINGS: InstrumentSettings = {
  'pressure-gauge': { calibrationIntervalMs: MS_PER_YEAR, driftAllowance: { basis: 'percent-of-span', percentOfSpanPerYear: 0.5 } },
  'pressure-transmitter': { calibrationIntervalMs: MS_PER_YEAR, driftAllowance: { basis: 'percent-of-span', percentOfSpanPerYear: 0.1 } },
  thermometer: { calibrationIntervalMs: MS_PER_YEAR, driftAllowance: { basis: 'absolute', siUnitsPerYear: 0.5 } },
  rtd: { calibrationIntervalMs: MS_PER_YEAR, driftAllowance: { basis: 'absolute', siUnitsPerYear: 0.1 } },
  barometer: { calibrationIntervalMs: MS_PER_YEAR, driftAllowance: { basis: 'absolute', siUnitsPerYear: 100 } },
  'weighing-system': { calibrationIntervalMs: MS_PER_YEAR, driftAllowance: { basis: 'percent-of-span', percentOfSpanPerYear: 0.1 } },
};

/** "Due soon" starts this long before the due date: 30 days, our choice (time to book a calibration). */
export const DEFAULT_DUE_SOON_WINDOW_MS = 30 * MS_PER_DAY;
