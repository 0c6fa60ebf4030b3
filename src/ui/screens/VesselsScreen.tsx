// Vessels: the inventory with what is due today listed first, search by tag, and the editor for one vessel.
import { useState } from 'preact/hooks';
import { TextField } from '../components/TextField.tsx';
import { VesselList } from '../components/VesselList.tsx';
import { VesselEditor } from '../components/VesselEditor.tsx';
import { DemoPlantButton } from '../components/DemoPlantButton.tsx';
import { useVessels } from '../state/app-state.ts';
import { byUrgency, isDueToday, useVesselDues } from '../state/vessel-due.ts';
import { navigate } from '../router.ts';

export function VesselsScreen({ param }: { param?: string | undefined }) {
  const vessels = useVessels();
  const { dues, error } = useVesselDues(vessels);
  const [query, setQuery] = useState('');
  const [showRetired, setShowRetired] = useState(false);
  if (param) {
    const vessel = param === 'new' ? undefined : vessels.find((v) => v.id === param);
    if (param !== 'new' && !vessel) return <p>That vessel is not in the inventory on this device.</p>;
    return <VesselEditor key={param} vessel={vessel} />;
  }
  const q = query.trim().toLowerCase();
  const keep = (v: { retired: boolean; tagKey: string }) => (showRetired || !v.retired) && (!q || v.tagKey.startsWith(q));
  const ordered = dues ? dues.filter((d) => keep(d.vessel)).sort(byUrgency) : null;
  const dueToday = ordered?.filter((d) => !d.vessel.retired && isDueToday(d.due.state)) ?? [];
  const rest = ordered ? ordered.filter((d) => !dueToday.includes(d)) : vessels.filter(keep).map((vessel) => ({ vessel }));
  return (
    <div data-due-ready={dues ? 'true' : 'false'}>
      <div class="row field">
        <button type="button" class="primary" onClick={() => navigate('vessels', 'new')}>Add vessel</button>
        <DemoPlantButton />
      </div>
      <TextField id="vessel-search" label="Search by tag" search value={query} onInput={setQuery} />
      <div class="field">
        <label class="row">
          <input type="checkbox" class="check" checked={showRetired} onChange={(e) => setShowRetired(e.currentTarget.checked)} />
          Show retired vessels
        </label>
      </div>
      {error ? <p class="field-error">Last checks could not be read: {error}</p> : null}
      {dueToday.length > 0 ? (
        <section aria-labelledby="due-today-heading">
          <h2 id="due-today-heading">Due today ({dueToday.length})</h2>
          <VesselList label="Vessels due today" vessels={dueToday} empty="" />
        </section>
      ) : null}
      {dueToday.length > 0 ? <h2>All other vessels</h2> : null}
      <VesselList vessels={rest} empty={vessels.length === 0 ? 'No vessels yet. Add one, or load the demo plant to try the app.' : dueToday.length > 0 ? 'None besides those due today.' : 'No vessel tag starts with that.'} />
    </div>
  );
}
