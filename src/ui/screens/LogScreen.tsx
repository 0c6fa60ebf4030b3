// Log: saved checks, newest first; each opens its full record.
import { useEffect, useState } from 'preact/hooks';
import * as repo from '../state/repo.ts';
import type { CheckRecord } from '../state/repo.ts';
import { hrefFor } from '../router.ts';
import { shortTime } from '../state/format.ts';
import { CheckRecordView } from '../components/CheckRecordView.tsx';
import { outcomeOfRecord, verdictOfRecord } from '../state/check-session.ts';
import { outcomeLabel } from '../state/outcome.ts';
import { isDemo } from '../state/demo-label.ts';
import { BackupReminder } from '../components/BackupReminder.tsx';

export function LogScreen({ param }: { param?: string | undefined }) {
  return param ? <OneRecord id={param} /> : <><BackupReminder /><LogList /></>;
}

function LogList() {
  const [checks, setChecks] = useState<CheckRecord[] | null>(null);
  const [error, setError] = useState('');
  useEffect(() => {
    repo.recentChecks().then(setChecks, (e: unknown) => setError(repo.storageMessage(e)));
  }, []);
  if (error) return <p class="field-error">The log could not be read: {error}</p>;
  if (!checks) return <p>Reading the log…</p>;
  if (checks.length === 0) return <p>No checks saved on this device yet.</p>;
  return (
    <ul class="list" aria-label="Saved checks, newest first">
      {checks.map((c) => (
        <li key={c.id}>
          <a class="button list-button" href={hrefFor('log', c.id)}>
            <strong>{c.vessel.tag} · {shortTime(c.time)}</strong>
            {isDemo(c.vessel) || isDemo(c.vessel.spec) ? <><span class="demo-tag">DEMO DATA</span> </> : null}
            <span class={`signal signal-${outcomeOfRecord(c)}`}>{outcomeLabel(outcomeOfRecord(c))}</span> {verdictOfRecord(c)} · {c.technician}
          </a>
        </li>
      ))}
    </ul>
  );
}

function OneRecord({ id }: { id: string }) {
  const [record, setRecord] = useState<CheckRecord | null | undefined>(undefined);
  const [error, setError] = useState('');
  useEffect(() => {
    repo.getCheck(id).then((r) => setRecord(r ?? null), (e: unknown) => setError(repo.storageMessage(e)));
  }, [id]);
  if (error) return <p class="field-error">The record could not be read: {error}</p>;
  if (record === undefined) return <p>Reading the record…</p>;
  if (record === null) return <p>No saved check with that id on this device. <a href={hrefFor('log')}>Back to the log</a></p>;
  return <CheckRecordView record={record} />;
}
