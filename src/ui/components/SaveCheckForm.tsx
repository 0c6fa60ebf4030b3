// Save the check to the append-only log with the technician's name and a note.
import { useState } from 'preact/hooks';
import { TextField } from './TextField.tsx';
import type { CheckDraft } from '../state/check-draft.ts';
import type { Evaluation } from '../state/check-session.ts';
import { loadEngine } from '../state/engine.ts';
import type { VesselRecord } from '../state/repo.ts';
import { storageMessage } from '../state/repo.ts';
import { hrefFor } from '../router.ts';
import { shortTime } from '../state/format.ts';
import { updateSettings, useSettings } from '../state/app-state.ts';

interface Props {
  draft: CheckDraft;
  onChange: (next: CheckDraft) => void;
  evaluation: Evaluation | undefined;
  vessel: VesselRecord | undefined;
  onSaved: () => void;
}

export function SaveCheckForm({ draft, onChange, evaluation, vessel, onSaved }: Props) {
  const [status, setStatus] = useState<{ text: string; id?: string; error?: boolean }>({ text: '' });
  const [busy, setBusy] = useState(false);
  const settings = useSettings();
  const ready = evaluation?.kind === 'result' && vessel !== undefined;
  const save = async (ev: Event) => {
    ev.preventDefault();
    if (evaluation?.kind !== 'result' || !vessel) return;
    if (draft.technician.trim() === '') {
      setStatus({ text: 'Not saved: technician: enter your name.', error: true });
      return;
    }
    setBusy(true);
    try {
      const record = await (await loadEngine()).saveCheck(draft, vessel, evaluation);
      onSaved();
      // The first name typed becomes the default for later checks.
      if (!settings.technician) void updateSettings({ technician: draft.technician.trim() });
      setStatus({ text: `Saved to the log (${shortTime(record.time)}).`, id: record.id });
    } catch (e) {
      setStatus({ text: `Not saved, your entry is kept: ${storageMessage(e)}`, error: true });
    } finally {
      setBusy(false);
    }
  };
  return (
    <form class="panel" onSubmit={(ev) => void save(ev)} noValidate aria-labelledby="save-h">
      <h2 id="save-h">Save to the log</h2>
      <TextField id="chk-tech" label="Technician" value={draft.technician} onInput={(technician) => onChange({ ...draft, technician })} />
      <TextField id="chk-note" label="Note (optional)" multiline value={draft.note} onInput={(note) => onChange({ ...draft, note })} />
      <button type="submit" class="primary" disabled={!ready || busy}>Save check</button>
      <p aria-live="polite" class={status.error ? 'field-error' : ''} data-save-state={status.id ? 'saved' : status.error ? 'failed' : busy ? 'saving' : 'idle'}>
        {status.text} {status.id ? <a href={hrefFor('log', status.id)}>Open the record</a> : null}
      </p>
    </form>
  );
}
