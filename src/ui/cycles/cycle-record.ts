// A cycle as the log keeps it (a record of kind "cycle") and as a CSV of its readings. The record
// holds what was typed (texts, units, the cycle type as entered), the SI input the core took and
// its whole evaluation, so a supervisor can see and recompute exactly what was judged.
import type { CycleEvaluation, CycleRecordInput } from '../../core/cycle/index.ts';
import { FORMULATION_ID } from '../../core/steam/constants.ts';
import type { JsonObject, KindRecord, NewKindRecord } from '../../store/index.ts';
import type { CycleTypeFields, ReadingUnits, TypedReading } from './cycle-input.ts';

/** Where the readings came from. */
export type CycleSource = { kind: 'live'; intervalS: number } | { kind: 'file'; fileName: string; columns: JsonObject };

/** What a saved cycle record's `values` hold (plain JSON). */
export interface CycleValues {
  source: CycleSource;
  units: ReadingUnits;
  cycleTypeTyped: CycleTypeFields;
  typedReadings: TypedReading[];
  input: CycleRecordInput;
  evaluation: CycleEvaluation;
}

/** The record to save for an evaluated cycle. */
export function cycleRecord(
  a: { vesselId: string; technician: string; note: string; startedAt: Date; values: CycleValues },
): NewKindRecord {
  return {
    vesselId: a.vesselId,
    technician: a.technician,
    note: a.note,
    takenAt: a.startedAt,
    values: JSON.parse(JSON.stringify(a.values)) as JsonObject,
    cautions: a.values.evaluation.cautions.map(({ signal, message, rule }) => ({ signal, message, rule })),
    appVersion: __APP_VERSION__,
    formulationId: FORMULATION_ID,
  };
}

/** A saved cycle's values, read back (the record's kind says it is a cycle; the shape is ours). */
export function cycleValuesOf(record: KindRecord): CycleValues | null {
  const v = record.values as unknown as Partial<CycleValues>;
  return record.kind === 'cycle' && v.evaluation && v.input && Array.isArray(v.input.readings) ? (v as CycleValues) : null;
}

const cell = (v: string | number) => {
  const t = String(v);
  return /[",\r\n]/.test(t) ? `"${t.replace(/"/g, '""')}"` : t;
};

/** A cycle's readings as CSV (UTF-8 with a byte-order mark): SI at full precision, T_sat(p), and the texts as typed. */
export function cycleReadingsCsv(record: KindRecord): string {
  const v = cycleValuesOf(record);
  if (!v) return '';
  const s = v.evaluation.saturationByReading;
  const typedT = `temperature as typed (${v.units.temperature})`;
  const typedP = `pressure as typed (${v.units.pressure}, ${v.units.reference})`;
  const head = ['cycle id', 'vessel', 'reading', 'time from first reading (s)', 'temperature (K)', 'pressure, absolute (Pa)', 'T_sat(p) (K)', 'T - T_sat(p) (K)', typedT, typedP];
  const rows = v.input.readings.map((r, i) => [
    record.id, record.vessel?.tag ?? '', i + 1, r.timeS - v.input.readings[0]!.timeS, r.temperatureK, r.absolutePressurePa,
    s.saturationTemperatureK[i] ?? '', s.deviationK[i] ?? '', v.typedReadings[i]?.temperature ?? '', v.typedReadings[i]?.pressure ?? '',
  ]);
  return '\uFEFF' + [head, ...rows].map((r) => r.map(cell).join(',')).join('\r\n') + '\r\n';
}
