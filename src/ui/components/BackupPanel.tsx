// Storage state and the backup reminder: the browser may clear site data, so export is the real backup.
import { useEffect, useState } from 'preact/hooks';
import * as repo from '../state/repo.ts';
import { updateSettings, useSettings } from '../state/app-state.ts';
import { shortTime } from '../state/format.ts';
import { formatIsoWithOffset } from '../../store/index.ts';

export function BackupPanel() {
  const s = useSettings();
  const [persisted, setPersisted] = useState<string>('checking…');
  const [message, setMessage] = useState('');
  useEffect(() => { void repo.persistenceLabel().then(setPersisted); }, []);
  const exportNow = async (kind: 'backup' | 'csv') => {
    try {
      const file = await repo.exportFile(kind);
      const url = URL.createObjectURL(file.blob);
      const a = document.createElement('a');
      a.href = url;
      a.download = file.name;
      a.click();
      setTimeout(() => URL.revokeObjectURL(url), 10_000);
      if (kind === 'backup') await updateSettings({ lastBackup: formatIsoWithOffset(new Date()) });
      setMessage(`Exported ${file.name}. Keep it somewhere other than this phone.`);
    } catch (e) {
      setMessage(`Export failed: ${repo.storageMessage(e)}`);
    }
  };
  return (
    <section class="panel" aria-labelledby="set-store">
      <h2 id="set-store">Storage and backup</h2>
      <p>Storage on this device: <strong>{persisted}</strong></p>
      <p>
        Last backup: <strong>{s.lastBackup ? shortTime(s.lastBackup) : 'never'}</strong>. The log lives only on
        this device until you export it; clearing the browser's site data deletes it. Export at the end of each shift.
      </p>
      <div class="row">
        <button type="button" class="primary" onClick={() => void exportNow('backup')}>Export full backup (JSON)</button>
        <button type="button" onClick={() => void exportNow('csv')}>Export log for spreadsheets (CSV)</button>
      </div>
      <p aria-live="polite">{message}</p>
    </section>
  );
}
