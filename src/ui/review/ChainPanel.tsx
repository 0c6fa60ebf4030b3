// Chain status of every device whose records are here; a broken chain points at its first bad record.
import { useState } from 'preact/hooks';
import { StoreError } from '../../store/index.ts';
import { hrefFor } from '../router.ts';
import { checkChains, type ChainLine } from './chain-view.ts';
import { useLongWork } from './use-long-work.ts';
import { WorkProgress } from './WorkProgress.tsx';

export function ChainPanel() {
  const work = useLongWork();
  const [lines, setLines] = useState<ChainLine[] | null>(null);
  const [message, setMessage] = useState('');
  const [cancelled, setCancelled] = useState(false);
  // The last run's end, as a data attribute: what a test or benchmark waits on (never a fixed time).
  const [ended, setEnded] = useState<'done' | 'cancelled' | 'failed' | null>(null);
  // Runs ended so far, so a waiter can tell this run's end from the last one's.
  const [runs, setRuns] = useState(0);
  const verify = async () => {
    setMessage('');
    setCancelled(false);
    setEnded(null);
    // A new run replaces the last result: kept up, it would read as the answer of a run that was
    // cancelled, or stand for a log that an import has changed since.
    setLines(null);
    try {
      const result = await work.run('Verifying chains', (o) => checkChains(o));
      if (result) setLines(result);
      setEnded(result ? 'done' : null);
      setRuns((n) => n + 1);
    } catch (e) {
      setRuns((n) => n + 1);
      // Cancelling is the user's choice, not a fault: said plainly, not as an error.
      if (e instanceof StoreError && e.code === 'cancelled') {
        setCancelled(true);
        setEnded('cancelled');
      } else {
        setMessage(e instanceof Error ? e.message : String(e));
        setEnded('failed');
      }
    }
  };
  const state = work.running !== null ? 'running' : ended ?? 'idle';
  return (
    <section class="panel" aria-labelledby="review-chain-title" data-chain-state={state} data-chain-runs={runs}>
      <h2 id="review-chain-title">Record integrity</h2>
      <p class="muted">Each device chains its records by SHA-256; a changed, reordered or missing record breaks its chain.</p>
      <button type="button" class="primary" onClick={() => void verify()} disabled={work.running !== null}>Verify chains</button>
      <WorkProgress work={work} id="chain-progress" />
      {message ? <p class="field-error" role="alert">{message}</p> : null}
      {cancelled ? <p class="muted" role="status" data-chain-result="cancelled">Verification cancelled before the end; no result.</p> : null}
      {lines ? (
        <ul class="review-chains" aria-label="Chain status per device">
          {lines.length === 0 ? <li>No records on this device yet.</li> : null}
          {lines.map((l) => (
            <li key={l.deviceId} class={l.ok ? 'chain-ok' : 'chain-broken'} data-chain={l.ok ? 'ok' : 'broken'}>
              <strong>{l.ok ? 'Intact' : 'BROKEN'}</strong> device {l.deviceShort}: {l.text}
              {l.at ? <> <a href={hrefFor('log', l.at.id)}>Open record seq {l.at.seq}</a></> : null}
            </li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}
