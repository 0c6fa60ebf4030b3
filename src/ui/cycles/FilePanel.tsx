// A cycle from a recorder's CSV: the file opened, its columns and their units chosen by the
// person; rows that cannot be read are listed by line number and no reading is taken until the
// file reads cleanly. `data-file-state` says where it stands (none, reading, refused, read).
import { useState } from 'preact/hooks';
import { SelectField } from '../components/SelectField.tsx';
import { readRecorderFile, readingsOfFile, type ColumnChoice, type FileReadings, type RecorderFile, type TimeFormat } from './cycle-file.ts';

interface Props { onReadings: (r: FileReadings | null, file: RecorderFile | null, choice: ColumnChoice) => void }

const TIME_FORMATS: readonly { id: TimeFormat; label: string }[] = [
  { id: 'seconds', label: 'seconds from the start' },
  { id: 'minutes', label: 'minutes from the start' },
  { id: 'date-time', label: 'ISO 8601 date-time with offset' },
];

/** A column the header names, by a word it holds, or the n-th column. */
function guessless(header: string[], n: number): string {
  return header[n] ?? '';
}

export function FilePanel({ onReadings }: Props) {
  const [file, setFile] = useState<RecorderFile | null>(null);
  const [choice, setChoice] = useState<ColumnChoice>({ time: '', temperature: '', pressure: '', timeFormat: 'seconds' });
  const [state, setState] = useState<'none' | 'reading' | 'refused' | 'read'>('none');
  const [result, setResult] = useState<FileReadings | null>(null);
  const apply = (f: RecorderFile | null, c: ColumnChoice) => {
    const r = f ? readingsOfFile(f, c) : null;
    setResult(r);
    setState(r === null ? 'none' : r.kind === 'refused' ? 'refused' : 'read');
    onReadings(r, f, c);
  };
  const open = async (input: HTMLInputElement) => {
    const picked = input.files?.[0];
    if (!picked) return;
    setState('reading');
    const f = await readRecorderFile(picked.name, await picked.text());
    // The columns start in the file's own order, shown for the person to confirm or change.
    const c = { ...choice, time: guessless(f.header, 0), temperature: guessless(f.header, 1), pressure: guessless(f.header, 2) };
    setFile(f);
    setChoice(c);
    apply(f, c);
  };
  const options = (file?.header ?? []).map((h) => ({ id: h, label: h }));
  const set = (k: keyof ColumnChoice) => (v: string) => {
    const c = { ...choice, [k]: v };
    setChoice(c);
    apply(file, c);
  };
  return (
    <section class="panel cycle-file" aria-labelledby="file-h" data-file-state={state}>
      <h2 id="file-h">From a recorder file</h2>
      <div class="field">
        <label for="cycle-file">CSV file (header row, then one reading per row)</label>
        <input id="cycle-file" type="file" accept=".csv,text/csv" onChange={(e) => void open(e.currentTarget)} />
      </div>
      {file ? (
        <>
          <p>{file.name}: {file.rows.length} rows. Say which column is which:</p>
          <SelectField id="cf-time" label="Time column" value={choice.time} options={options} onChange={set('time')} />
          <SelectField id="cf-time-format" label="Time is written as" value={choice.timeFormat} options={TIME_FORMATS} onChange={(v) => set('timeFormat')(v)} />
          <SelectField id="cf-temperature" label="Temperature column" value={choice.temperature} options={options} onChange={set('temperature')} />
          <SelectField id="cf-pressure" label="Pressure column" value={choice.pressure} options={options} onChange={set('pressure')} />
        </>
      ) : null}
      {result?.kind === 'refused' ? (
        <div class="field-error" role="alert" data-file-refused={result.problems.length}>
          <p>Not taken: fix these rows in the file and open it again (nothing is guessed).</p>
          <ul>{result.problems.map((p) => <li key={p}>{p}</li>)}</ul>
        </div>
      ) : null}
      {result?.kind === 'readings' ? <p data-file-readings={result.readings.length}>{result.readings.length} readings taken from the file.</p> : null}
    </section>
  );
}
