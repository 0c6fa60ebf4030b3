// Cycle record: a sterilising cycle on one vessel, entered live at the chamber or read from a
// recorder's file, judged by the core against the site's cycle type, and saved to the log.
import { Choice } from '../components/Choice.tsx';
import { StandingNote } from '../components/StandingNote.tsx';
import { VesselPicker } from '../components/VesselPicker.tsx';
import { isDemoVessel } from '../state/demo-label.ts';
import { CycleResult } from './CycleResult.tsx';
import { CycleTypeForm } from './CycleTypeForm.tsx';
import { FilePanel } from './FilePanel.tsx';
import { LivePanel } from './LivePanel.tsx';
import { ReadingUnitsForm } from './ReadingUnitsForm.tsx';
import { SaveRecordForm } from './SaveRecordForm.tsx';
import { useCycleSession } from './cycle-session.ts';
import './cycles.css';

export function CyclesScreen() {
  const c = useCycleSession();
  const { d, outcome } = c;
  const set = c.draft.set;
  return (
    <div class="cycles-screen" data-draft={c.draft.loaded ? 'loaded' : 'loading'}>
      <VesselPicker id="cycle-vessel" vessels={c.vessels} value={c.vessel ? d.vesselId : ''} onChange={c.chooseVessel} />
      {c.vessel && isDemoVessel(c.vessel) ? <p class="demo-note">DEMO DATA: an invented vessel.</p> : null}
      {c.vessel ? (
        <>
          <CycleTypeForm fields={c.fields} onChange={(fields) => set({ ...d, fields })} />
          <ReadingUnitsForm units={c.units} onChange={(units) => set({ ...d, units })} />
          <Choice name="cycle-mode" legend="Readings" value={d.mode}
            options={[{ id: 'live', label: 'live at the chamber' }, { id: 'file', label: 'from a recorder file' }]}
            onChange={(mode) => set({ ...d, mode })} />
          {d.mode === 'live'
            ? <LivePanel live={d.live} units={c.units} onChange={(live) => c.draft.update((cur) => ({ ...cur, live }))} />
            : <FilePanel onReadings={c.setFile} />}
        </>
      ) : null}
      {outcome?.kind === 'error' ? <p class="field-error" role="alert" data-cycle-error="true">Not evaluated: {outcome.message}</p> : null}
      {outcome?.kind === 'result'
        ? <CycleResult evaluation={outcome.evaluation} readings={outcome.input.readings} unit={c.fields.temperatureUnit} />
        : <StandingNote />}
      {/* Kept in place after a save (which clears a live entry), so its word on the save stays in view. */}
      {c.vessel ? <SaveRecordForm idPrefix="cycle" label="Save cycle" save={c.save} /> : null}
    </div>
  );
}
