// The instrument register as CSV: one row per calibration (an instrument with none gets one row with
// the calibration cells empty), instruments by tag, calibrations oldest first. Figures in the SI unit
// of the instrument's kind (the unit column says which); times ISO 8601 as stored. The same cell
// rules as the log's CSV (csv.ts: BOM, RFC 4180 quoting, formula neutralising, CRLF).
import { CSV_BOM, csvCell } from './csv.ts';
import { listRegister } from './instruments.ts';
import { getDb } from './connection.ts';
import type { InstrumentHistory, FittingRecord, CalibrationEntry } from './instrument-records.ts';

type Cell = string | number | boolean | null;

const SI_UNIT = { 'pressure-gauge': 'Pa', 'pressure-transmitter': 'Pa', barometer: 'Pa', thermometer: 'K', rtd: 'K', 'weighing-system': 'kg' } as const;

/** The columns, each with its header and cell. */
export const REGISTER_CSV_COLUMNS: readonly { header: string; cell: (h: InstrumentHistory, c: CalibrationEntry | null, fittedTo: string) => Cell }[] = [
  { header: 'instrument_id', cell: (h) => h.instrument.id },
  { header: 'tag', cell: (h) => h.instrument.tag },
  { header: 'kind', cell: (h) => h.instrument.spec.kind },
  { header: 'si_unit', cell: (h) => SI_UNIT[h.instrument.spec.kind] ?? null },
  { header: 'range_low', cell: (h) => h.instrument.spec.range.low },
  { header: 'range_high', cell: (h) => h.instrument.spec.range.high },
  { header: 'tolerance', cell: (h) => h.instrument.spec.tolerance.kind },
  {
    header: 'tolerance_value', cell: (h) => {
      const t = h.instrument.spec.tolerance;
      return t.kind === 'percent-of-span' ? t.percentOfSpan : t.kind === 'stated' ? t.plusMinus : t.sensorClass;
    },
  },
  { header: 'display_unit', cell: (h) => h.instrument.displayUnit },
  { header: 'retired', cell: (h) => h.instrument.retired },
  { header: 'fitted_to_now', cell: (_h, _c, fittedTo) => fittedTo },
  { header: 'calibration_id', cell: (_h, c) => c?.id ?? null },
  { header: 'calibrated_at', cell: (_h, c) => c?.time ?? null },
  { header: 'as_found_error_si', cell: (_h, c) => c?.asFoundError ?? null },
  { header: 'as_left_error_si', cell: (_h, c) => c?.asLeftError ?? null },
  { header: 'reference_value_si', cell: (_h, c) => c?.referenceValue ?? null },
  { header: 'next_due', cell: (_h, c) => c?.nextDue ?? null },
  { header: 'calibrated_by', cell: (_h, c) => c?.who ?? null },
  { header: 'certificate', cell: (_h, c) => c?.certificate ?? null },
  { header: 'note', cell: (_h, c) => c?.note ?? null },
];

/** Vessel tags each instrument is fitted to now (latest fitting per vessel and role), joined with "; ". */
function fittedNow(fittings: readonly FittingRecord[], tags: ReadonlyMap<string, string>, nowMs: number): Map<string, string> {
  const latest = new Map<string, FittingRecord>();
  for (const f of [...fittings].sort((a, b) => a.fromMs - b.fromMs || (a.enteredAt < b.enteredAt ? -1 : 1))) {
    if (f.fromMs <= nowMs) latest.set(`${f.vesselId}\u0000${f.role}`, f);
  }
  const out = new Map<string, string[]>();
  for (const f of latest.values()) if (f.instrumentId) out.set(f.instrumentId, [...(out.get(f.instrumentId) ?? []), tags.get(f.vesselId) ?? f.vesselId]);
  return new Map([...out].map(([k, v]) => [k, v.sort().join('; ')]));
}

/** The register as CSV text, as of `nowMs` for the fitted-to column. */
export async function exportRegisterCsv(nowMs = Date.now()): Promise<string> {
  const db = await getDb();
  const [register, fittings, vessels] = await Promise.all([listRegister(), db.getAll('fittings'), db.getAll('vessels')]);
  const fitted = fittedNow(fittings, new Map(vessels.map((v) => [v.id, v.tag])), nowMs);
  const rows = [CSV_BOM + REGISTER_CSV_COLUMNS.map((c) => csvCell(c.header)).join(',')];
  for (const h of register) {
    const to = fitted.get(h.instrument.id) ?? '';
    const cals: (CalibrationEntry | null)[] = h.calibrations.length > 0 ? h.calibrations : [null];
    for (const c of cals) rows.push(REGISTER_CSV_COLUMNS.map((col) => csvCell(col.cell(h, c, to))).join(','));
  }
  return rows.join('\r\n') + '\r\n';
}
