// The CSV's rows: one row per check, SI units in the header, ISO 8601 times, text cells
// neutralised against spreadsheet formula injection, RFC 4180 quoting. Pure (no IndexedDB), so the
// page and the exporting workers (log-worker.ts) write every row with the same code.
import { outcomeOfRecord, signalMaskOf, worstSignalOfMask } from './facts.ts';
import type { CheckRecord } from './records.ts';

type Cell = string | number | boolean | null;

/** Reads a value at a path (keys) inside plain JSON, or undefined (a stored record may be older or damaged: nothing is assumed of its shape). */
function at(value: unknown, path: readonly string[]): unknown {
  let v: unknown = value;
  for (const key of path) {
    if (v === null || typeof v !== 'object' || Array.isArray(v) || !Object.hasOwn(v, key)) return undefined;
    v = (v as Record<string, unknown>)[key];
  }
  return v;
}

/** A scalar from the record's JSON, or null (empty cell) for anything else or nothing. */
function scalar(value: unknown): Cell {
  return typeof value === 'number' || typeof value === 'string' || typeof value === 'boolean' ? value : null;
}

/** A cell reading a dotted path of the record's reading or result (the path split once, not per row). */
function fromReading(path: string): (r: CheckRecord) => Cell {
  const keys = path.split('.');
  return (r) => scalar(at(r.reading, keys));
}
function fromResult(path: string): (r: CheckRecord) => Cell {
  const keys = path.split('.');
  return (r) => scalar(at(r.result, keys));
}

/**
 * Decimals that show a ± band to one or two significant digits (two when it starts with 1 or 2):
 * the screen's rule (src/ui/state/format.ts decimalsForBand; a test keeps the two equal), kept
 * here because the store takes nothing but types from the rest of the app.
 */
function decimalsForBand(band: number): number {
  const [mantissa, exponent] = Math.abs(band).toExponential(1).split('e') as [string, string];
  return Math.min(12, Math.max(0, (Number(mantissa) < 3 ? 2 : 1) - 1 - Number(exponent)));
}

/** `value` × `scale` rounded to the place its band resolves, as the screen shows it; 4 significant digits without a band. */
export function roundedAsShown(value: number | null, band: number | null, scale = 1, offset = 0): number | null {
  if (value === null || !Number.isFinite(value)) return null;
  const v = value * scale + offset;
  if (band === null || !Number.isFinite(band) || band === 0) return Number(v.toPrecision(4));
  return Number(v.toFixed(decimalsForBand(band * scale))) || 0;
}

function num(value: unknown): number | null {
  return typeof value === 'number' && Number.isFinite(value) ? value : null;
}

/** A rounded column: the record's value at `path` (SI) shown as on screen, with the band found by `band`. */
function shownFromResult(path: string, band: (r: CheckRecord) => number | null, scale = 1, offset = 0): (r: CheckRecord) => Cell {
  const keys = path.split('.');
  return (r) => roundedAsShown(num(at(r.result, keys)), band(r), scale, offset);
}

const bandAt = (path: string) => {
  const keys = path.split('.');
  return (r: CheckRecord) => num(at(r.result, keys));
};
/** The thermometer's ± limit, K: its contribution to the pressure band over the saturation slope. */
const temperatureBandK = (r: CheckRecord): number | null => {
  const c = num(at(r.result, ['saturation', 'pressureBand', 'contributions', 'temperatureSensor']));
  const slope = num(at(r.result, ['saturation', 'saturationSlopePaPerK']));
  return c !== null && slope !== null && slope > 0 ? c / slope : null;
};
/** The gauge and atmosphere limits on the absolute pressure, Pa. */
const absoluteBandPa = (r: CheckRecord): number | null => {
  const g = num(at(r.result, ['saturation', 'pressureBand', 'contributions', 'pressureGauge']));
  const a = num(at(r.result, ['saturation', 'pressureBand', 'contributions', 'atmosphere']));
  return g === null ? null : Math.hypot(g, a ?? 0);
};
/** The atmosphere's part of the band, else the vessel's barometer limit, Pa (as the screen's "Atmosphere used"). */
const atmosphereBandPa = (r: CheckRecord): number | null =>
  num(at(r.result, ['saturation', 'pressureBand', 'contributions', 'atmosphere'])) || num(at(r.vessel.spec, ['instruments', 'barometerTolerancePa']));
function highestSignal(r: CheckRecord): Cell {
  return worstSignalOfMask(signalMaskOf(r.cautions));
}

/**
 * The columns, in order. Result paths follow the check engine's CheckResult (src/core/README.md);
 * a path a record does not have gives an empty cell, so older records export too.
 */
export const CSV_COLUMNS: readonly { header: string; cell: (r: CheckRecord) => Cell }[] = [
  { header: 'time (ISO 8601)', cell: (r) => r.time },
  { header: 'vessel tag', cell: (r) => r.vessel.tag },
  { header: 'technician', cell: (r) => r.technician },
  { header: 'verdict', cell: fromResult('saturation.verdict.verdict') },
  { header: 'highest signal word (standing note left out)', cell: highestSignal },
  { header: 'temperature (K)', cell: fromReading('temperatureK') },
  { header: 'temperature (°C, as shown)', cell: (r) => roundedAsShown(num(at(r.reading, ['temperatureK'])), temperatureBandK(r), 1, -273.15) },
  { header: 'pressure as entered (Pa)', cell: fromReading('pressure.pressurePa') },
  { header: 'pressure reference', cell: fromReading('pressure.reference') },
  { header: 'absolute pressure (Pa)', cell: fromResult('reading.absolutePressurePa') },
  { header: 'absolute pressure (kPa, as shown)', cell: shownFromResult('reading.absolutePressurePa', absoluteBandPa, 1e-3) },
  { header: 'atmosphere (Pa)', cell: fromResult('reading.atmospherePa') },
  { header: 'saturation pressure at temperature (Pa)', cell: fromResult('saturation.saturationPressurePa') },
  { header: 'saturation pressure at temperature (kPa, as shown)', cell: shownFromResult('saturation.saturationPressurePa', bandAt('saturation.pressureBand.contributions.temperatureSensor'), 1e-3) },
  { header: 'pressure deviation from saturation (Pa)', cell: fromResult('saturation.pressureDeviationPa') },
  { header: 'pressure deviation from saturation (kPa, as shown)', cell: shownFromResult('saturation.pressureDeviationPa', bandAt('saturation.pressureBand.plusMinus'), 1e-3) },
  { header: 'pressure band plus/minus (Pa)', cell: fromResult('saturation.pressureBand.plusMinus') },
  { header: 'net mass (kg)', cell: fromResult('reading.netMassKg') },
  { header: 'regime', cell: fromResult('inventory.regime') },
  { header: 'quality (kg/kg)', cell: fromResult('inventory.quality') },
  { header: 'quality (%, as shown)', cell: shownFromResult('inventory.quality', bandAt('inventoryBands.quality.plusMinus'), 100) },
  { header: 'liquid mass (kg)', cell: fromResult('inventory.liquidMassKg') },
  { header: 'liquid mass (kg, as shown)', cell: shownFromResult('inventory.liquidMassKg', bandAt('inventoryBands.liquidMassKg.plusMinus')) },
  { header: 'vapour mass (kg)', cell: fromResult('inventory.vaporMassKg') },
  { header: 'liquid level (m)', cell: fromResult('inventory.liquidLevel.levelM') },
  { header: 'liquid level (m, as shown)', cell: shownFromResult('inventory.liquidLevel.levelM', bandAt('inventoryBands.liquidLevelM.plusMinus')) },
  {
    header: 'inputs as typed',
    cell: (r) =>
      Object.entries(r.inputs)
        .map(([name, i]) => `${name}=${i.text} ${i.unit}${i.reference ? ` ${i.reference}` : ''}`)
        .join('; '),
  },
  { header: 'cautions', cell: (r) => r.cautions.map((c) => `${c.signal}: ${c.message}`).join(' | ') },
  { header: 'note', cell: (r) => r.note },
  { header: 'corrects check id', cell: (r) => r.corrects },
  { header: 'correction reason', cell: (r) => r.reason },
  { header: 'check id', cell: (r) => r.id },
  { header: 'vessel id', cell: (r) => r.vesselId },
  { header: 'device id', cell: (r) => r.deviceId },
  { header: 'seq', cell: (r) => r.seq },
  { header: 'app version', cell: (r) => r.appVersion },
  { header: 'formulation', cell: (r) => r.formulationId },
  { header: 'hash (SHA-256)', cell: (r) => r.hash },
  // Added after the first release, at the end so every earlier column keeps its place.
  { header: 'outcome (worst signal word among the findings; none when none)', cell: (r) => outcomeOfRecord(r) },
  // Rounded beside the SI columns above, as the check screen shows them (its bands: the gauge and
  // atmosphere on the gauge reading, the scale on the net contents, the liquid mass's band on the
  // vapour mass, the barometer's on the atmosphere).
  { header: 'gauge pressure (kPa, as shown)', cell: shownFromResult('reading.gaugePressurePa', absoluteBandPa, 1e-3) },
  { header: 'atmosphere (kPa, as shown)', cell: shownFromResult('reading.atmospherePa', atmosphereBandPa, 1e-3) },
  { header: 'net mass (kg, as shown)', cell: shownFromResult('reading.netMassKg', (r) => num(at(r.vessel.spec, ['instruments', 'weightToleranceKg']))) },
  { header: 'vapour mass (kg, as shown)', cell: shownFromResult('inventory.vaporMassKg', bandAt('inventoryBands.liquidMassKg.plusMinus')) },
];

/**
 * One CSV cell. Numbers are written as numbers (ECMAScript shortest form, which general CSV
 * readers parse back exactly); text beginning with = + - @, tab or CR gets a leading apostrophe so
 * a spreadsheet shows it instead of running it as a formula (common practice, OWASP "CSV
 * injection"); text with a comma, quote or line break is quoted, quotes doubled (RFC 4180).
 */
export function csvCell(value: Cell): string {
  if (value === null) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? (Object.is(value, -0) ? '0' : String(value)) : '';
  if (typeof value === 'boolean') return value ? 'true' : 'false';
  if (value === '') return '';
  const text = FORMULA_START.test(value) ? `'${value}` : value;
  return NEEDS_QUOTES.test(text) || text !== text.trim() ? `"${text.replace(/"/g, '""')}"` : text;
}

const FORMULA_START = /^[=+\-@\t\r]/;
const NEEDS_QUOTES = /[",\r\n]/;

/** One row of cells, without its line end. */
export function csvRow(r: CheckRecord): string {
  let row = '';
  for (let i = 0; i < CSV_COLUMNS.length; i += 1) row += (i > 0 ? ',' : '') + csvCell(CSV_COLUMNS[i]!.cell(r));
  return row;
}

/**
 * The UTF-8 byte-order mark the file starts with: without it some spreadsheets read the file as
 * their local 8-bit code page and garble "°" and "−" (common practice).
 */
export const CSV_BOM = '\uFEFF';

/** CSV text (byte-order mark, header, one row per record) for records already in hand. */
export function csvFromChecks(records: Iterable<CheckRecord>): string {
  const rows = [CSV_BOM + CSV_COLUMNS.map((c) => csvCell(c.header)).join(',')];
  for (const r of records) rows.push(csvRow(r));
  return rows.join('\r\n') + '\r\n';
}
