// A gentle word on the Log screen when the log has not left the device for too long: the browser
// may clear its data, and only a backup kept elsewhere survives that.
import { useEffect, useState } from 'preact/hooks';
import { useSettings } from '../state/app-state.ts';
import { hrefFor } from '../router.ts';
import * as repo from '../state/repo.ts';
import { shortTime } from '../state/format.ts';
import { backupReminder, reminderDays, storageFacts } from '../state/storage-state.ts';
import { useSyncServer } from '../state/sync-status.ts';

export function BackupReminder() {
  const s = useSettings();
  const days = reminderDays(s);
  const server = useSyncServer();
  const [state, setState] = useState<{ due: boolean; daysSince: number | null; last: string | null } | null>(null);
  useEffect(() => {
    void Promise.all([storageFacts(s.lastBackup), repo.hasChecks()]).then(([facts, any]) => {
      setState({ ...backupReminder(facts.lastBackup, any, days, new Date()), last: facts.lastBackup });
    }, () => setState(null));
  }, [days, s.lastBackup]);
  if (!state?.due) return <div hidden data-backup-reminder={state ? 'not-due' : 'reading'} />;
  return (
    <p class="panel notice-panel" role="status" data-backup-reminder="due">
      {state.last ? `Last backup ${state.daysSince} days ago (${shortTime(state.last)}).` : 'No backup yet.'}{' '}
      {server === null
        ? <>The log lives only on this phone: <a href={hrefFor('settings')}>export a backup</a> and keep it elsewhere.</>
        : <>Checks saved since then may be only on this phone: <a href={hrefFor('sync')}>sync with the plant server</a> or <a href={hrefFor('settings')}>export a backup</a>.</>}
    </p>
  );
}
