// Where this device stands with the plant server: server, account, role, the last sync and what
// is still waiting to go (pending = this device's head − the server's head), "Sync now" with its
// progress and cancel, and the last failure in plain words with what to do about it.
import { shortTime } from '../state/format.ts';
import { cancelSync, requestSync, serverLabel, useSyncRun, type SyncRun } from '../state/sync-status.ts';
import type { SyncFacts } from './sync-facts.ts';

const STEP_WORDS: Record<string, string> = {
  'sign-in': 'Signing in',
  push: 'Sending this device\'s checks',
  publish: 'Sending vessel edits',
  'pull-plant': 'Receiving the vessel inventory',
  'pull-checks': 'Receiving every device\'s checks',
};

/** What to do about each kind of failure, after the client's own words. */
const NEXT_STEP: Record<string, string> = {
  offline: 'It tries again when the phone is back online, and after the next save.',
  refused: 'Show this message to the administrator.',
  'chain-differs': 'Nothing was sent. Export a backup (Settings) and give it to the administrator with this message.',
  server: 'It tries again at the next sync; if it goes on, tell the administrator.',
  'not-enrolled': 'Enrol this device first.',
};

export function SyncStatusPanel({ facts, onLeave }: { facts: SyncFacts; onLeave: () => void }) {
  const run = useSyncRun();
  const last = facts.lastSync;
  return (
    <section class="panel" aria-labelledby="sync-status" data-sync-state={run.state} data-sync-pending={facts.pending ?? ''}>
      <h2 id="sync-status">This device and the plant server</h2>
      <dl class="facts">
        <dt>Server</dt><dd data-sync-server>{serverLabel(facts.server ?? '')}</dd>
        <dt>Account</dt><dd class="device-id">{facts.account}</dd>
        <dt>Role</dt><dd>{facts.role === 'supervisor' ? 'Supervisor: sends its checks and vessel edits, receives every device\'s checks' : 'Technician: sends its checks, receives the vessel inventory'}</dd>
        <dt>Last sync</dt><dd data-last-sync={last?.outcome ?? 'never'}>{last ? `${shortTime(last.at)}: ${outcomeWords(last.outcome)}` : 'never'}</dd>
        <dt>Waiting to go</dt>
        <dd data-pending-count={facts.pending ?? ''}>
          {facts.pending === null ? `${facts.localHead} check${facts.localHead === 1 ? '' : 's'} saved here; the server's count is read at the next sync` : `${facts.pending} of ${facts.localHead} check${facts.localHead === 1 ? '' : 's'} saved here`}
        </dd>
        {last ? <><dt>Received</dt><dd>{last.pulled} check{last.pulled === 1 ? '' : 's'} at the last sync</dd></> : null}
      </dl>
      {/* The last outcome in words, unless this page's own run is saying it below. */}
      {last && (run.state === 'idle' || (run.state === 'ok' && last.outcome === 'ok')) ? <p class="muted" data-last-message>{last.message}</p> : null}
      <RunLine run={run} />
      <div class="row">
        {run.state === 'running'
          ? <button type="button" class="danger" onClick={cancelSync}>Cancel sync</button>
          : <button type="button" class="primary" onClick={() => void requestSync()}>Sync now</button>}
        <button type="button" onClick={onLeave} disabled={run.state === 'running'}>Stop syncing on this device</button>
      </div>
    </section>
  );
}

function outcomeWords(outcome: 'ok' | 'failed' | 'cancelled'): string {
  return outcome === 'ok' ? 'finished' : outcome === 'failed' ? 'stopped with an error' : 'cancelled';
}

function RunLine({ run }: { run: SyncRun }) {
  if (run.state === 'running') {
    const known = run.total !== null && run.total > 0;
    return (
      <div class="work-progress" role="status" data-sync-step={run.step} data-sync-done={run.done}>
        <label class="label" for="sync-progress">{STEP_WORDS[run.step]}{known ? `: ${run.done.toLocaleString('en-GB')} of ${run.total!.toLocaleString('en-GB')}` : '…'}</label>
        {known ? <progress id="sync-progress" max={run.total!} value={run.done} /> : <progress id="sync-progress" />}
      </div>
    );
  }
  if (run.state === 'failed') {
    return (
      <div class="field-error" role="alert" data-sync-error={run.kind}>
        <p>{run.message}</p>
        {NEXT_STEP[run.kind] ? <p>{NEXT_STEP[run.kind]}</p> : null}
      </div>
    );
  }
  if (run.state === 'cancelled') return <p role="status" data-sync-result="cancelled">{run.message}</p>;
  return null;
}
