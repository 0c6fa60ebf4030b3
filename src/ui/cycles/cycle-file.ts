// A chamber recorder's CSV (time, temperature, pressure) read with papaparse, loaded only when a
// file is opened. The person says which column is which, how the time is written and which units
// the numbers are in; nothing is guessed. A row that cannot be read is refused with its line
// number (line 1 is the header), and while any row is refused no reading of the file is taken.
import { parseIsoWithOffset } from '../../store/index.ts';
import { readNumber } from '../state/format.ts';
import type { TypedReading } from './cycle-input.ts';

/** How the time column is written: seconds or minutes from the recorder's start, or ISO 8601 date-times with offset. */
export type TimeFormat = 'seconds' | 'minutes' | 'date-time';

/** Which column holds what (header names as the file has them). */
export interface ColumnChoice {
  time: string;
  temperature: string;
  pressure: string;
  timeFormat: TimeFormat;
}

/** A file as read: its header, its data rows with their line numbers. */
export interface RecorderFile {
  name: string;
  header: string[];
  rows: { line: number; cells: string[] }[];
}

/** The readings of a file, or every refused row with its line and reason. */
export type FileReadings =
  | { kind: 'readings'; readings: TypedReading[]; startedAtMs: number | null }
  | { kind: 'refused'; problems: string[] };

/** At most this many refused rows are listed (the count says how many more). */
const PROBLEMS_SHOWN = 20;

/** Reads a CSV text into header and rows, with papaparse (a well-kept parser, loaded on demand). */
export async function readRecorderFile(name: string, text: string): Promise<RecorderFile> {
  const { default: Papa } = await import('papaparse');
  const parsed = Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), { skipEmptyLines: false });
  const all = parsed.data;
  const header = (all[0] ?? []).map((h) => h.trim());
  const rows: RecorderFile['rows'] = [];
  all.slice(1).forEach((cells, i) => {
    // Blank lines (a trailing newline) are not rows; their line numbers still count.
    if (cells.length === 1 && cells[0]!.trim() === '') return;
    rows.push({ line: i + 2, cells });
  });
  return { name, header, rows };
}

/** The file's rows as readings in the chosen columns; any row that cannot be read refuses them all, listed by line. */
export function readingsOfFile(file: RecorderFile, choice: ColumnChoice): FileReadings {
  const col = (name: string) => file.header.indexOf(name);
  const at = { time: col(choice.time), temperature: col(choice.temperature), pressure: col(choice.pressure) };
  const missing = (Object.keys(at) as (keyof typeof at)[]).filter((k) => at[k] < 0);
  if (missing.length > 0) return { kind: 'refused', problems: missing.map((k) => `The ${k} column is not chosen (the file's columns: ${file.header.join(', ')}).`) };
  if (file.rows.length < 2) return { kind: 'refused', problems: ['The file has fewer than two rows of readings.'] };
  const problems: string[] = [];
  const readings: TypedReading[] = [];
  let startMs: number | null = null;
  let previous = -Infinity;
  for (const { line, cells } of file.rows) {
    const cell = (i: number) => (cells[i] ?? '').trim();
    const timeText = cell(at.time);
    let timeS: number;
    try {
      if (choice.timeFormat === 'date-time') {
        const ms = parseIsoWithOffset(timeText);
        if (ms === null) throw new Error(`time "${timeText}" is not an ISO 8601 date-time with offset (e.g. 2026-12-02T07:00:00+01:00)`);
        startMs ??= ms;
        timeS = (ms - startMs) / 1000;
      } else {
        timeS = readNumber(timeText, 'time') * (choice.timeFormat === 'minutes' ? 60 : 1);
      }
      if (!(timeS > previous)) throw new Error(`time ${timeText} is not after the row before`);
      readNumber(cell(at.temperature), 'temperature');
      readNumber(cell(at.pressure), 'pressure');
    } catch (e) {
      problems.push(`line ${line}: ${e instanceof Error ? e.message : String(e)}`);
      continue;
    }
    previous = timeS;
    readings.push({ timeS, temperature: cell(at.temperature), pressure: cell(at.pressure) });
  }
  if (problems.length > 0) {
    const more = problems.length - PROBLEMS_SHOWN;
    return { kind: 'refused', problems: more > 0 ? [...problems.slice(0, PROBLEMS_SHOWN), `… and ${more} more rows refused.`] : problems };
  }
  // Times from the recorder's first row: the evaluation counts from there.
  const t0 = readings[0]!.timeS;
  return { kind: 'readings', readings: readings.map((r) => ({ ...r, timeS: r.timeS - t0 })), startedAtMs: startMs };
}
