// What a saved check records about each register instrument it rested on: which one, which
// calibration, its due state at the check's time and the limit parts the band took from it. Types
// only, so the vessel spec (check/vessel-spec.ts) can name them without importing this room's code.
import type { CalibrationDueState } from './calibration-due.ts';
import type { InstrumentKind } from './instrument-kind.ts';

/** The place an instrument takes on a vessel (stored ids): its gauge, its thermometer, its scale, the barometer its gauge readings are converted with. */
export type InstrumentRole = 'pressure' | 'temperature' | 'weight' | 'atmosphere';

export interface InstrumentUse {
  role: InstrumentRole;
  /** The register's id of the instrument (a UUID), and its tag and kind at the check. */
  instrumentId: string;
  tag: string;
  kind: InstrumentKind;
  /** The register's id of the last calibration on or before the check, and its date (ms); null with none on record. */
  calibrationId: string | null;
  calibratedMs: number | null;
  /** The due state at the check's time, and the due date (ms) when there is one. */
  due: CalibrationDueState;
  dueMs: number | null;
  /**
   * The limit parts the band used, in the kind's SI unit (Pa, K or kg); `plusMinus` is their
   * root-sum-square. For a weighing system or a barometer `class` is the larger of its class and
   * the figure typed for the vessel (that figure may hold the installation's share; see vessel-instruments.ts).
   */
  limit: { class: number; indicator: number; calibration: number; drift: number; plusMinus: number };
  /** Where the drift part came from: the rate of the kind or the instrument, the last interval's, or (no calibration on record) the drift typed for the vessel. */
  driftSource: 'kind-setting' | 'instrument-setting' | 'last-interval' | 'vessel';
  /** The last calibration's as-found error was beyond the instrument's class. */
  foundOutOfTolerance: boolean;
}
