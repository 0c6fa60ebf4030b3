// What a person can do to an instrument in service: change what it is, fit or swap it onto a
// vessel, retire it. A retired one shows none of these (its history stays on the page above).
import { useState } from 'preact/hooks';
import type { InstrumentRecord } from '../../store/index.ts';
import { InstrumentForm } from './InstrumentForm.tsx';
import { FitPanel } from './FitPanel.tsx';
import { RetirePanel } from './RetirePanel.tsx';

export function InstrumentActions({ instrument, onChanged }: { instrument: InstrumentRecord; onChanged: () => void }) {
  const [editing, setEditing] = useState(false);
  if (instrument.retired) return <p>Retired {instrument.updatedAt.slice(0, 10)}: kept in the register with its history; no vessel's check uses it.</p>;
  return (
    <>
      {editing
        ? <InstrumentForm existing={instrument} onSaved={() => { setEditing(false); onChanged(); }} />
        : <div class="row field"><button type="button" onClick={() => setEditing(true)}>Change tag, kind, range or class…</button></div>}
      <FitPanel instrument={instrument} onSaved={onChanged} />
      <RetirePanel instrument={instrument} onRetired={onChanged} />
    </>
  );
}
