// Vessels as large tappable rows; a retired or demo vessel says so, and the due state of its routine check when known.
import './vessel-list.css';
import type { VesselRecord } from '../state/repo.ts';
import type { CheckDue } from '../../core/basics.ts';
import { hrefFor } from '../router.ts';
import { isDemoVessel } from '../state/demo-label.ts';
import { dueText } from '../state/vessel-due.ts';

interface Item { vessel: VesselRecord; due?: CheckDue }

export function VesselList({ vessels, empty, label = 'Vessels' }: { vessels: readonly Item[]; empty: string; label?: string }) {
  if (vessels.length === 0) return empty ? <p>{empty}</p> : null;
  return (
    <ul class="list" aria-label={label}>
      {vessels.map(({ vessel: v, due }) => (
        <li key={v.id} data-vessel-tag={v.tag} data-due-state={due?.state}>
          <a class="button list-button" href={hrefFor('vessels', v.id)}>
            <strong>{v.tag}{v.retired ? ' (retired)' : ''}</strong>
            {isDemoVessel(v) ? <span class="demo-tag">DEMO DATA</span> : null} {v.description.replace(/^DEMO DATA: /, '')}
            {due && due.state !== 'no-interval' ? <span class={`due due-${due.state}`}>{dueText(due)}</span> : null}
          </a>
        </li>
      ))}
    </ul>
  );
}
