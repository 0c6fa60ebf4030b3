// The instrument register's records: instruments, their calibrations (append-only) and which
// instrument sits on which vessel (append-only fittings, so a swap keeps both histories). Plain
// JSON like every record here (null, never undefined), SI inside the instrument's spec and the
// calibration's figures, times as ISO 8601 with the device's offset plus their ms for sorting.
import type { CalibrationRecord, InstrumentKind, InstrumentSpec } from '../core/instrument/index.ts';
import type { IsoDateTime } from './records.ts';

/** The kinds the register accepts, as stored (the core's INSTRUMENT_KINDS; a test holds the two equal). */
export const INSTRUMENT_KIND_IDS = [
  'pressure-gauge', 'pressure-transmitter', 'thermometer', 'rtd', 'barometer', 'weighing-system',
] as const satisfies readonly InstrumentKind[];

/** Text limits of the register's fields, characters. */
export const INSTRUMENT_TEXT_LIMITS = { tag: 64, description: 2000, displayUnit: 16, who: 120, certificate: 120, note: 500, reason: 500 } as const;

/** The place an instrument takes on a vessel: its gauge (or transmitter), its thermometer (or RTD), its scale, the barometer its gauge readings are converted with. */
export const INSTRUMENT_ROLES = ['pressure', 'temperature', 'weight', 'atmosphere'] as const;
export type InstrumentRole = (typeof INSTRUMENT_ROLES)[number];

/** The kinds that may take each role. */
export const KINDS_OF_ROLE: Readonly<Record<InstrumentRole, readonly InstrumentKind[]>> = {
  pressure: ['pressure-gauge', 'pressure-transmitter'],
  temperature: ['thermometer', 'rtd'],
  weight: ['weighing-system'],
  atmosphere: ['barometer'],
};

/** Where a register entry came from. */
export type InstrumentOrigin =
  | { kind: 'entered' }
  /** Made by the schema upgrade from the accuracies typed into a vessel (its tag and what was assumed). */
  | { kind: 'from-vessel'; vesselId: string; vesselTag: string; note: string };

/** One instrument in the register. Editable (its class, range, description) and retirable, never deleted. */
export interface InstrumentRecord {
  /** UUID. */
  id: string;
  /** The plant's tag for it, 1–64 characters (spec.tag holds the same). */
  tag: string;
  tagKey: string;
  /** The core's InstrumentSpec, SI in the unit of its kind. */
  spec: InstrumentSpec;
  /** The unit its dial or display reads in (a pressure or temperature unit id, or "kg"): how the screens show its figures. */
  displayUnit: string;
  description: string;
  origin: InstrumentOrigin;
  retired: boolean;
  createdAt: IsoDateTime;
  updatedAt: IsoDateTime;
}

/** One calibration of one instrument. Append-only: a wrong entry is followed by a new one, never edited. */
export interface CalibrationEntry {
  /** UUID. */
  id: string;
  instrumentId: string;
  /** When it was calibrated. */
  time: IsoDateTime;
  timeMs: number;
  /** Indication − reference at the worst point, before adjustment, in the kind's SI unit. */
  asFoundError: number;
  /** After adjustment; null when left as found. */
  asLeftError: number | null;
  /** The reference value at that point, SI; null when not recorded. */
  referenceValue: number | null;
  /** The due date the calibration set; null: its date plus the interval. */
  nextDue: IsoDateTime | null;
  nextDueMs: number | null;
  /** Who calibrated it (a person or a laboratory), 1–120 characters. */
  who: string;
  /** The certificate's reference, 0–120 characters. */
  certificate: string;
  /** The unit the figures were typed in. */
  enteredUnit: string;
  note: string;
  enteredAt: IsoDateTime;
}

/** From `from` on, `instrumentId` is the vessel's instrument in `role` (null: none fitted). Append-only. */
export interface FittingRecord {
  /** UUID. */
  id: string;
  vesselId: string;
  role: InstrumentRole;
  instrumentId: string | null;
  from: IsoDateTime;
  fromMs: number;
  /** Why (a swap, a repair, the schema upgrade), 0–500 characters. */
  reason: string;
  enteredAt: IsoDateTime;
}

/** What the UI passes to add an instrument. */
export interface NewInstrument {
  spec: InstrumentSpec;
  displayUnit: string;
  description?: string;
}

/** What the UI passes to record a calibration (figures in the kind's SI unit). */
export interface NewCalibration {
  instrumentId: string;
  calibratedAt: Date;
  asFoundError: number;
  asLeftError?: number;
  referenceValue?: number;
  nextDueAt?: Date;
  who: string;
  certificate?: string;
  enteredUnit: string;
  note?: string;
}

/** An instrument with its calibrations, oldest first. */
export interface InstrumentHistory {
  instrument: InstrumentRecord;
  calibrations: CalibrationEntry[];
}

/** A calibration entry as the core takes it. */
export function calibrationFigures(c: CalibrationEntry): CalibrationRecord {
  const out: CalibrationRecord = { timeMs: c.timeMs, asFoundError: c.asFoundError };
  if (c.asLeftError !== null) out.asLeftError = c.asLeftError;
  if (c.referenceValue !== null) out.referenceValue = c.referenceValue;
  if (c.nextDueMs !== null) out.nextDueMs = c.nextDueMs;
  return out;
}

/** Fittings oldest first: by their from time, later entered last on a tie. */
export function byFrom(a: FittingRecord, b: FittingRecord): number {
  return a.fromMs - b.fromMs || (a.enteredAt < b.enteredAt ? -1 : a.enteredAt > b.enteredAt ? 1 : 0);
}

/** Of a vessel's fittings, the one in force for each role at `atMs`: the latest from at or before it, later entered winning a tie. */
export function fittedAt(fittings: readonly FittingRecord[], atMs: number): Partial<Record<InstrumentRole, FittingRecord>> {
  const out: Partial<Record<InstrumentRole, FittingRecord>> = {};
  const ordered = [...fittings].sort(byFrom);
  for (const f of ordered) if (f.fromMs <= atMs) out[f.role] = f;
  return out;
}
