// Vessels: the inventory list with search by tag, and the editor for one vessel.
import { useState } from 'preact/hooks';
import { TextField } from '../components/TextField.tsx';
import { VesselList } from '../components/VesselList.tsx';
import { VesselEditor } from '../components/VesselEditor.tsx';
import { DemoPlantButton } from '../components/DemoPlantButton.tsx';
import { useVessels } from '../state/app-state.ts';
import { navigate } from '../router.ts';

export function VesselsScreen({ param }: { param?: string | undefined }) {
  const vessels = useVessels();
  const [query, setQuery] = useState('');
  const [showRetired, setShowRetired] = useState(false);
  if (param) {
    const vessel = param === 'new' ? undefined : vessels.find((v) => v.id === param);
    if (param !== 'new' && !vessel) return <p>That vessel is not in the inventory on this device.</p>;
    return <VesselEditor key={param} vessel={vessel} />;
  }
  const q = query.trim().toLowerCase();
  const shown = vessels.filter((v) => (showRetired || !v.retired) && (!q || v.tagKey.startsWith(q)));
  return (
    <div>
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
      <VesselList vessels={shown} empty={vessels.length === 0 ? 'No vessels yet. Add one, or load the demo plant to try the app.' : 'No vessel tag starts with that.'} />
    </div>
  );
}
