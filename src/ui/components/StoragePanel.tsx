// Storage that lasts: whether the browser keeps Tankside's data, how much it uses, when the log
// last left the device whole, and after how many days the Log screen reminds the person to back up.
import { useEffect, useState } from 'preact/hooks';
import { TextField } from './TextField.tsx';
import { updateSettings, useSettings } from '../state/app-state.ts';
import { shortTime } from '../state/format.ts';
import { readReminderDays, reminderDays, storageFacts, type StorageFacts } from '../state/storage-state.ts';

export function StoragePanel() {
  const s = useSettings();
  const [facts, setFacts] = useState<StorageFacts | null>(null);
  const [days, setDays] = useState(String(reminderDays(s)));
  const [error, setError] = useState<string | undefined>(undefined);
  // Read again after an export made here (it writes the settings' lastBackup too).
  useEffect(() => { void storageFacts(s.lastBackup).then(setFacts); }, [s.lastBackup]);
  const onDays = (text: string) => {
    setDays(text);
    const read = readReminderDays(text);
    if ('error' in read) setError(read.error);
    else {
      setError(undefined);
      void updateSettings({ backupReminderDays: read.days });
    }
  };
  const last = facts?.lastBackup ? `${shortTime(facts.lastBackup)} (${facts.lastBackupKind === 'consolidation' ? 'consolidated' : 'exported'})` : 'never';
  return (
    <section class="panel" aria-labelledby="set-storage" data-storage={facts ? 'ready' : 'reading'}>
      <h2 id="set-storage">Storage on this device</h2>
      <p>Kept: <strong>{facts?.persistence ?? 'checking…'}</strong></p>
      <p>Used: <strong>{facts ? facts.usage ?? 'the browser does not say' : 'checking…'}</strong></p>
      <p>Last backup: <strong data-last-backup={facts?.lastBackup ?? ''}>{facts ? last : 'checking…'}</strong></p>
      <TextField id="set-reminder" label="Backup reminder on the Log screen after (days, 1 to 60)" value={days} onInput={onDays} error={error} />
    </section>
  );
}
