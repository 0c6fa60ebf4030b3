// The supervisor's note on one flagged vessel: who, what was decided; the vessel and the check's
// findings it answers are shown and saved with it. Saved into this device's chain; nothing is
// changed in the check it answers.
import { useState } from 'preact/hooks';
import { TextField } from '../components/TextField.tsx';
import { useSettings } from '../state/app-state.ts';
import { instantText } from '../state/vessel-due.ts';
import { storageMessage } from '../state/repo.ts';
import type { OverviewRow } from './overview-rows.ts';
import { readNoteForm, saveReviewNote, type NoteForm } from './review-notes.ts';

export function ReviewNoteForm({ row, onSaved, onCancel }: { row: OverviewRow; onSaved(): void; onCancel(): void }) {
  const settings = useSettings();
  const [form, setForm] = useState<NoteForm>({ supervisor: settings.technician, decision: '' });
  const [error, setError] = useState<{ field: keyof NoteForm | 'store'; message: string } | null>(null);
  const [state, setState] = useState<'editing' | 'saving'>('editing');
  const latest = row.latest!;
  const save = async (ev: Event) => {
    ev.preventDefault();
    const read = readNoteForm(form);
    if (!read.ok) { setError({ field: read.field, message: read.message }); return; }
    setState('saving');
    try {
      await saveReviewNote(row.vessel, latest, read.supervisor, read.decision);
      onSaved();
    } catch (e) {
      setError({ field: 'store', message: `Not saved: ${storageMessage(e)}` });
      setState('editing');
    }
  };
  return (
    <form class="panel review-note-form" onSubmit={(ev) => void save(ev)} noValidate data-note-state={state} aria-labelledby="note-h">
      <h2 id="note-h">Review note on {row.vessel.tag}</h2>
      <p>Answers the check of {instantText(latest.timeMs)} by {latest.technician}: findings {latest.findingSignals.join(', ')}.
        The note joins this device's log; the check stays as it was saved.</p>
      <TextField id="note-supervisor" label="Supervisor" value={form.supervisor} onInput={(supervisor) => setForm({ ...form, supervisor })}
        error={error?.field === 'supervisor' ? error.message : undefined} />
      <TextField id="note-decision" label="What was decided" multiline value={form.decision} onInput={(decision) => setForm({ ...form, decision })}
        error={error?.field === 'decision' ? error.message : undefined} />
      {error?.field === 'store' ? <p class="field-error" role="alert">{error.message}</p> : null}
      <div class="row">
        <button type="submit" class="primary" disabled={state === 'saving'}>Save review note</button>
        <button type="button" onClick={onCancel}>Cancel</button>
      </div>
    </form>
  );
}
