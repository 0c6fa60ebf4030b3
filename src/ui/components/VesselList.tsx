// Vessels as large tappable rows; a retired or demo vessel says so.
import type { VesselRecord } from '../state/repo.ts';
import { hrefFor } from '../router.ts';
import { isDemoVessel } from '../state/demo-label.ts';

export function VesselList({ vessels, empty }: { vessels: readonly VesselRecord[]; empty: string }) {
  if (vessels.length === 0) return <p>{empty}</p>;
  return (
    <ul class="list" aria-label="Vessels">
      {vessels.map((v) => (
        <li key={v.id}>
          <a class="button list-button" href={hrefFor('vessels', v.id)}>
            <strong>{v.tag}{v.retired ? ' (retired)' : ''}</strong>
            {isDemoVessel(v) ? <span class="demo-tag">DEMO DATA</span> : null} {v.description.replace(/^DEMO DATA: /, '')}
          </a>
        </li>
      ))}
    </ul>
  );
}
