// Add or edit one vessel; retire it (it keeps its history and drops out of new checks).
import { useState } from 'preact/hooks';
import { discardDraft, useDraft } from '../state/drafts.ts';
import { VesselFields } from './VesselFields.tsx';
import { VesselHistory } from './VesselHistory.tsx';
import { VesselInstruments } from './VesselInstruments.tsx';
import { navigate } from '../router.ts';
import * as repo from '../state/repo.ts';
import type { VesselRecord } from '../state/repo.ts';
import { refreshVessels, useSettings } from '../state/app-state.ts';
import { atmosphereDefaults, unitsInForce } from '../state/settings-model.ts';
import { emptyVesselForm, type FormField, type VesselForm } from '../state/vessel-form.ts';
import { formFromSpec, specFromForm } from '../state/vessel-spec.ts';
import { isDemoVessel } from '../state/demo-label.ts';
import { shortTime } from '../state/format.ts';
import { CheckIntervalField } from './CheckIntervalField.tsx';
import { intervalForm, readInterval } from '../state/check-interval.ts';

export function VesselEditor({ vessel }: { vessel?: VesselRecord | undefined }) {
  const settings = useSettings();
  const prefs = unitsInForce(settings);
  // Kept as a draft like the check form: a reload, a closed tab or an update keeps what was typed.
  const draftKey = `vessel:${vessel ? vessel.id : 'new'}`;
  const stored = intervalForm(vessel?.checkIntervalS);
  const draft = useDraft<VesselForm>(draftKey, {
    ...(vessel ? formFromSpec(vessel.spec, prefs) : emptyVesselForm(prefs, atmosphereDefaults(settings, prefs))),
    checkEvery: stored.text, checkEveryUnit: stored.unit,
  });
  const form = draft.value;
  const [intervalError, setIntervalError] = useState<string | undefined>(undefined);
  const setForm = draft.set;
  const [errors, setErrors] = useState<Partial<Record<FormField, string>>>({});
  const [status, setStatus] = useState('');
  const [confirmRetire, setConfirmRetire] = useState(false);
  const set = (change: Partial<VesselForm>) => setForm({ ...form, ...change });

  const save = async (ev: Event) => {
    ev.preventDefault();
    const built = specFromForm(form, vessel?.spec, vessel ? formFromSpec(vessel.spec, prefs) : undefined);
    const interval = readInterval(form.checkEvery ?? stored.text, form.checkEveryUnit ?? stored.unit);
    setIntervalError(interval.ok ? undefined : interval.message);
    if (!built.ok || !interval.ok) {
      setErrors(built.ok ? {} : built.errors);
      setStatus(`Not saved: ${built.ok ? '' : Object.values(built.errors)[0] ?? 'check the fields'}${!interval.ok ? (built.ok ? '' : ' ') + interval.message : ''}`);
      return;
    }
    setErrors({});
    try {
      if (vessel) await repo.updateVessel(vessel.id, built.spec.tag, built.spec.description, built.spec, interval.intervalS);
      else await repo.addVessel(built.spec.tag, built.spec.description, built.spec, interval.intervalS);
      await discardDraft(draftKey);
      await refreshVessels();
      navigate('vessels');
    } catch (e) {
      setStatus(`Not saved: ${repo.storageMessage(e)}`);
    }
  };

  const retire = async () => {
    if (!vessel) return;
    if (!confirmRetire) { setConfirmRetire(true); return; }
    try {
      await repo.retireVessel(vessel.id);
      await refreshVessels();
      navigate('vessels');
    } catch (e) {
      setStatus(`Not retired: ${repo.storageMessage(e)}`);
    }
  };

  return (
    <>
    <form onSubmit={(ev) => void save(ev)} noValidate data-draft={draft.loaded ? 'loaded' : 'loading'}>
      <h2>{vessel ? `Vessel ${vessel.tag}` : 'New vessel'}</h2>
      {vessel && isDemoVessel(vessel) ? <p><span class="demo-tag">DEMO DATA</span> An invented vessel for trying the app.</p> : null}
      {vessel?.retired ? <p>Retired {vessel.retiredAt ? shortTime(vessel.retiredAt) : ''}. Its checks stay in the log.</p> : null}
      <VesselFields form={form} set={set} errors={errors} prefs={prefs} />
      {/* Set once the vessel is saved: the new vessel's form stays within about two phone screens (field.test). */}
      {vessel ? <CheckIntervalField text={form.checkEvery ?? stored.text} unit={form.checkEveryUnit ?? stored.unit} error={intervalError}
        onChange={(checkEvery, checkEveryUnit) => set({ checkEvery, checkEveryUnit })} /> : null}
      <p aria-live="polite" class={status ? 'field-error' : ''}>{status}</p>
      <div class="row">
        {vessel?.retired ? null : <button type="submit" class="primary">Save vessel</button>}
        <button type="button" onClick={() => navigate('vessels')}>Back (entry kept)</button>
        <button type="button" onClick={() => { draft.reset(); setStatus(''); }}>Start over</button>
        {vessel && !vessel.retired ? (
          <button type="button" class="danger" onClick={() => void retire()}>
            {confirmRetire ? 'Tap again to retire' : 'Retire vessel'}
          </button>
        ) : null}
      </div>
    </form>
    {vessel ? <VesselInstruments vesselId={vessel.id} /> : null}
    {vessel ? <VesselHistory vesselId={vessel.id} /> : null}
    </>
  );
}
