// Retires an instrument in two taps (the second says what follows): it stays in the register with
// its calibrations and fittings, and is taken off the places it holds now. data-retire-state says
// where it is ("retired" once saved).
import { useState } from 'preact/hooks';
import * as repo from '../state/repo.ts';
import * as registerRepo from '../state/register-repo.ts';
import type { InstrumentRecord } from '../../store/index.ts';

type RetireState = 'idle' | 'asking' | 'saving' | 'retired' | 'failed';

export function RetirePanel({ instrument, onRetired }: { instrument: InstrumentRecord; onRetired: () => void }) {
  const [state, setState] = useState<RetireState>('idle');
  const [message, setMessage] = useState('');
  const retire = async () => {
    setState('saving');
    try {
      await registerRepo.retireInstrument(instrument.id);
      setState('retired');
      onRetired();
    } catch (e) {
      setState('failed');
      setMessage(`Not retired: ${repo.storageMessage(e)}`);
    }
  };
  return (
    <section class="panel" aria-labelledby="ret-h" data-retire-state={state}>
      <h2 id="ret-h">Out of service</h2>
      {state === 'asking' ? (
        <>
          <p>Retire {instrument.tag}? It stays in the register with its calibrations and where it was fitted, and comes off every vessel it is fitted to now: their next checks use the figures typed for the vessel until another instrument is fitted.</p>
          <div class="row field">
            <button type="button" class="primary" onClick={() => void retire()}>Retire {instrument.tag}</button>
            <button type="button" onClick={() => setState('idle')}>Keep it in service</button>
          </div>
        </>
      ) : (
        <div class="row field"><button type="button" onClick={() => setState('asking')} disabled={state === 'saving'}>Retire this instrument…</button></div>
      )}
      {message ? <p role="status" class="field-error">{message}</p> : null}
    </section>
  );
}
