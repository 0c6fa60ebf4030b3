// Export: the browser may clear site data, so a file kept elsewhere is the real backup (the storage
// state and the last backup are in StoragePanel).
import { useState } from 'preact/hooks';
import * as repo from '../state/repo.ts';
import { downloadFile } from './download.ts';
import { updateSettings } from '../state/app-state.ts';
import { formatIsoWithOffset } from '../../store/index.ts';
import { serverLabel, useSyncServer } from '../state/sync-status.ts';

export function BackupPanel() {
  const [message, setMessage] = useState('');
  const server = useSyncServer();
  const exportNow = async (kind: 'backup' | 'csv') => {
    try {
      const file = await repo.exportFile(kind);
      downloadFile(file);
      if (kind === 'backup') await updateSettings({ lastBackup: formatIsoWithOffset(new Date()) });
      setMessage(`Exported ${file.name}. Keep it somewhere other than this phone.`);
    } catch (e) {
      setMessage(`Export failed: ${repo.storageMessage(e)}`);
    }
  };
  return (
    <section class="panel" aria-labelledby="set-store">
      <h2 id="set-store">Backup</h2>
      {server === null ? (
        <p>
          The log lives only on this device until you export it; clearing the browser's site data deletes it. Export
          at the end of each shift.
        </p>
      ) : (
        <p>
          Plant sync sends this device's checks to {serverLabel(server)} when online (see Plant sync for what is still
          waiting); clearing the browser's site data deletes what has not gone yet. An export is a copy of your own.
        </p>
      )}
      <div class="row">
        <button type="button" class="primary" onClick={() => void exportNow('backup')}>Export full backup (JSON)</button>
        <button type="button" onClick={() => void exportNow('csv')}>Export log for spreadsheets (CSV)</button>
      </div>
      <p aria-live="polite">{message}</p>
    </section>
  );
}
