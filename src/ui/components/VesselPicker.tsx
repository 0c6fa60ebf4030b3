// Choose the vessel for a check or a fill plan (retired vessels take no new checks).
import type { VesselRecord } from '../state/repo.ts';
import { hrefFor } from '../router.ts';
import { isDemoVessel } from '../state/demo-label.ts';

interface Props { vessels: readonly VesselRecord[]; value: string; onChange: (id: string) => void; id?: string }

export function VesselPicker({ vessels, value, onChange, id = 'pick-vessel' }: Props) {
  const active = vessels.filter((v) => !v.retired);
  if (active.length === 0) {
    return <p class="panel">No vessels yet. <a href={hrefFor('vessels')}>Add a vessel or load the demo plant</a> first.</p>;
  }
  return (
    <div class="field">
      <label for={id}>Vessel</label>
      <select id={id} value={value} onChange={(e) => onChange(e.currentTarget.value)}>
        <option value="">Choose a vessel…</option>
        {active.map((v) => (
          <option key={v.id} value={v.id}>{v.tag}{isDemoVessel(v) ? ' (DEMO DATA)' : ''} {v.description ? `— ${v.description.replace(/^DEMO DATA: /, '')}` : ''}</option>
        ))}
      </select>
    </div>
  );
}
