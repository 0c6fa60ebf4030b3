// Saving a cycle or a periodic test to the log: technician and note, then the record of its kind
// in the device's chain. `data-save-state` (idle, saving, saved, failed) and `data-saved-id` let a
// browser test wait for the commit. A refused or failed save keeps everything typed.
import { useState } from 'preact/hooks';
import { TextField } from '../components/TextField.tsx';
import { updateSettings, useSettings } from '../state/app-state.ts';
import { storageMessage } from '../state/repo.ts';

interface Props {
  /** Makes and saves the record with the technician and note given; resolves with its id. */
  save: (technician: string, note: string) => Promise<string>;
  label: string;
  idPrefix: string;
}

export function SaveRecordForm({ save, label, idPrefix }: Props) {
  const settings = useSettings();
  const [technician, setTechnician] = useState(settings.technician);
  const [note, setNote] = useState('');
  const [state, setState] = useState<{ s: 'idle' | 'saving' | 'saved' | 'failed'; text: string; id?: string }>({ s: 'idle', text: '' });
  const run = async () => {
    if (technician.trim() === '') {
      setState({ s: 'failed', text: 'Not saved: technician: enter your name.' });
      return;
    }
    setState({ s: 'saving', text: 'Saving…' });
    try {
      const id = await save(technician.trim(), note);
      if (!settings.technician) void updateSettings({ technician: technician.trim() });
      setNote('');
      setState({ s: 'saved', text: 'Saved to the log.', id });
    } catch (e) {
      setState({ s: 'failed', text: `Not saved: ${storageMessage(e)}` });
    }
  };
  return (
    <section class="panel" aria-labelledby={`${idPrefix}-save-h`} data-save-state={state.s} data-saved-id={state.id ?? ''}>
      <h2 id={`${idPrefix}-save-h`}>Save to the log</h2>
      <TextField id={`${idPrefix}-tech`} label="Technician" value={technician} onInput={setTechnician} />
      <TextField id={`${idPrefix}-note`} label="Note" value={note} onInput={setNote} multiline />
      <button type="button" disabled={state.s === 'saving'} onClick={() => void run()}>{label}</button>
      <p role="status" class={state.s === 'failed' ? 'field-error' : undefined}>{state.text}</p>
    </section>
  );
}
