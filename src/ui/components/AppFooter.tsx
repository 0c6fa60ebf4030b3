// The footer's promise, kept true: "no data leaves this device" only while plant sync is off; with
// sync on it names the server the checks go to instead.
import { serverLabel, useSyncServer } from '../state/sync-status.ts';

export function AppFooter() {
  const server = useSyncServer();
  return (
    <footer class="app-footer" data-sync-promise={server === null ? 'local' : 'server'}>
      <span class="app-version">Tankside {__APP_VERSION__}</span> · works offline ·{' '}
      {server === null ? 'no data leaves this device' : `checks are sent to ${serverLabel(server)} when online`}
    </footer>
  );
}
