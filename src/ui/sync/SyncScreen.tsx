// Plant sync: enrol this device with the plant's server, see where it stands, sync now. Composes
// the facts (sync-facts.ts) and the two panels; the run itself belongs to the shell's sync state,
// so it goes on when the person leaves this screen.
import { useEffect, useMemo, useState } from 'preact/hooks';
import { storageMessage } from '../state/repo.ts';
import { requestSync, useSyncRun } from '../state/sync-status.ts';
import { navigate } from '../router.ts';
import { EnrolPanel } from './EnrolPanel.tsx';
import { SyncStatusPanel } from './SyncStatusPanel.tsx';
import { enrolmentOfText } from './enrolment.ts';
import { leaveSync, readSyncFacts, type SyncFacts } from './sync-facts.ts';

export function SyncScreen({ param }: { param?: string | undefined }) {
  const [facts, setFacts] = useState<SyncFacts | null>(null);
  const [error, setError] = useState('');
  const run = useSyncRun();
  // A link's fields, read from the address as given (its values stay percent-encoded there), each
  // time the app is sent to one (a link opened while this screen shows is a hash change, not a load).
  const given = useMemo(() => (param?.startsWith('enrol') ? enrolmentOfText(location.hash) : null), [param]);
  const reload = () => readSyncFacts().then(setFacts, (e: unknown) => setError(storageMessage(e)));
  useEffect(() => {
    // The password is in the link: off the address once read.
    if (given) history.replaceState(null, '', '#/sync');
  }, [given]);
  useEffect(() => void reload(), [run.state]);
  if (error) return <p class="panel field-error" role="alert">The sync settings could not be read: {error}</p>;
  if (!facts) return <p class="panel" aria-busy="true" data-screen-state="loading">Reading the sync settings…</p>;
  const enrolled = facts.server !== null && facts.account !== null;
  return (
    <div class="sync-screen" data-sync-enrolment={enrolled ? 'enrolled' : 'none'}>
      {enrolled ? (
        <SyncStatusPanel facts={facts} onLeave={() => void leaveSync().then(reload, (e: unknown) => setError(storageMessage(e)))} />
      ) : (
        <EnrolPanel key={param ?? ''} deviceId={facts.deviceId} given={given} onEnrolled={() => { void reload(); void requestSync(); navigate('sync'); }} />
      )}
      <section class="panel" aria-labelledby="sync-about">
        <h2 id="sync-about">What plant sync does</h2>
        <p>
          When online, this device sends its saved checks, oldest first, to the plant's server, and receives the plant's vessel
          inventory; a supervisor's device also receives every device's checks. Checks are saved here first and never wait
          for the server. The server refuses any change to a check once stored. What a check shows still defers to local codes,
          the vessel's inspection regime and licensed practice.
        </p>
      </section>
    </div>
  );
}
