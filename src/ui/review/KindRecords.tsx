// Cycles and periodic tests beside the checks: the records of those kinds for the filter's vessel
// and period (or every vessel), newest first, filtered by kind; each with its outcome and its
// summary, a cycle with its picture and a CSV of its readings. In the vessel report it prints.
// `data-kind-records` counts the rows shown once read (browser tests wait on it).
import { useEffect, useState } from 'preact/hooks';
import { listRecords, type KindRecord } from '../../store/index.ts';
import { cycleChart } from '../../core/cycle/index.ts';
import { CycleChart } from '../cycles/CycleChart.tsx';
import { cycleReadingsCsv, cycleValuesOf } from '../cycles/cycle-record.ts';
import { SelectField } from '../components/SelectField.tsx';
import { shortTime } from '../state/format.ts';

type KindChoice = 'all' | 'cycle' | 'periodic-test';
const CHOICES: readonly { id: KindChoice; label: string }[] = [
  { id: 'all', label: 'cycles and periodic tests' }, { id: 'cycle', label: 'cycles' }, { id: 'periodic-test', label: 'periodic tests' },
];
const HOLD = { met: 'hold met', short: 'hold short', interrupted: 'hold interrupted', 'not-reached': 'band not reached' } as const;

interface Props { vesselId: string | null; fromMs: number | null; toMs: number | null; idPrefix: string; title: string }

/** What one record says in one line. */
function summaryOf(r: KindRecord): string {
  const c = cycleValuesOf(r);
  if (c) {
    const e = c.evaluation;
    return `Cycle: ${HOLD[e.hold.status]}, ${e.readingCount} readings, F-value ${e.lethality.wholeRecordMinutes.toFixed(1)} min.`;
  }
  const s = r.values['summary'];
  const label = r.values['label'];
  return `${typeof label === 'string' ? label : 'Periodic test'}: ${typeof s === 'string' ? s : ''}`;
}

function outcomeOf(r: KindRecord): string {
  const e = r.values['evaluation'];
  const o = e && typeof e === 'object' && !Array.isArray(e) ? e['outcome'] : undefined;
  return typeof o === 'string' ? o : 'none';
}

function download(r: KindRecord) {
  const url = URL.createObjectURL(new Blob([cycleReadingsCsv(r)], { type: 'text/csv' }));
  const a = document.createElement('a');
  a.href = url;
  a.download = `tankside-cycle-${r.vessel?.tag ?? 'vessel'}-${r.time.slice(0, 10)}.csv`;
  a.click();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

export function KindRecords({ vesselId, fromMs, toMs, idPrefix, title }: Props) {
  const [kind, setKind] = useState<KindChoice>('all');
  const [records, setRecords] = useState<KindRecord[] | null>(null);
  const [error, setError] = useState('');
  useEffect(() => {
    let live = true;
    setRecords(null);
    const window = { ...(vesselId ? { vesselId } : {}), ...(fromMs !== null ? { from: new Date(fromMs) } : {}), ...(toMs !== null ? { to: new Date(toMs) } : {}) };
    const kinds = kind === 'all' ? (['cycle', 'periodic-test'] as const) : [kind];
    Promise.all(kinds.map((k) => listRecords({ kind: k, limit: 100, ...window }))).then((pages) => {
      if (!live) return;
      setRecords(pages.flatMap((p) => p.records).sort((a, b) => b.timeMs - a.timeMs || (a.id < b.id ? 1 : -1)));
    }, (e: unknown) => live && setError(String(e)));
    return () => { live = false; };
  }, [vesselId, fromMs, toMs, kind]);
  return (
    <section class="panel kind-records" aria-labelledby={`${idPrefix}-h`} data-kind-records={records === null ? '' : String(records.length)}>
      <h3 id={`${idPrefix}-h`}>{title}</h3>
      <div class="no-print"><SelectField id={`${idPrefix}-kind`} label="Show" value={kind} options={CHOICES} onChange={setKind} /></div>
      {error ? <p class="field-error" role="alert">Not read: {error}</p> : null}
      {records?.length === 0 ? <p>None in this period.</p> : null}
      <ul class="kind-record-list">
        {(records ?? []).map((r) => {
          const c = cycleValuesOf(r);
          const outcome = outcomeOf(r);
          return (
            <li key={r.id} data-kind={r.kind} data-record-id={r.id} data-outcome={outcome}>
              <p>
                <strong>{shortTime(r.time)}</strong> · {r.vessel?.tag ?? 'no vessel'} · {outcome === 'none' ? 'no finding' : <span class={`signal signal-${outcome}`}>{outcome}</span>}
                {' '}{summaryOf(r)} <span class="muted">By {r.technician}.</span>
              </p>
              {c ? <CycleChart chart={cycleChart(c.evaluation, c.input.readings)} unit={c.cycleTypeTyped.temperatureUnit} /> : null}
              {c ? <button type="button" class="no-print" onClick={() => download(r)}>Readings as CSV</button> : null}
            </li>
          );
        })}
      </ul>
      <p class="hint">Each record keeps its cautions; the cycle and test figures report what was read and defer to the site's validated procedures.</p>
    </section>
  );
}
