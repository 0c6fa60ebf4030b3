// The checks saved for one vessel, newest first; they stay after the vessel is retired.
import { useEffect, useState } from 'preact/hooks';
import * as repo from '../state/repo.ts';
import type { CheckRecord } from '../state/repo.ts';
import { hrefFor } from '../router.ts';
import { shortTime } from '../state/format.ts';

export function VesselHistory({ vesselId }: { vesselId: string }) {
  const [checks, setChecks] = useState<CheckRecord[] | null>(null);
  const [error, setError] = useState('');
  useEffect(() => {
    repo.checksOfVessel(vesselId).then(setChecks, (e: unknown) => setError(repo.storageMessage(e)));
  }, [vesselId]);
  return (
    <section class="panel" aria-labelledby="hist-h">
      <h2 id="hist-h">Checks of this vessel</h2>
      {error ? <p class="field-error">{error}</p> : null}
      {checks && checks.length === 0 ? <p>No checks saved for this vessel yet.</p> : null}
      {checks && checks.length > 0 ? (
        <ul class="list">
          {checks.map((c) => (
            <li key={c.id}><a class="button list-button" href={hrefFor('log', c.id)}>{shortTime(c.time)} · {c.technician}</a></li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}
