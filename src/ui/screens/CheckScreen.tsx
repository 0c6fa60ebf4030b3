// New check: pick a vessel, type the readings; the result updates as the person types and the
// entry is kept as a draft until it is saved to the log.
import { useMemo } from 'preact/hooks';
import { ReadingInputs } from '../components/ReadingInputs.tsx';
import { ResultCard } from '../components/ResultCard.tsx';
import { SaveCheckForm } from '../components/SaveCheckForm.tsx';
import { VesselPicker } from '../components/VesselPicker.tsx';
import { StandingNote } from '../components/StandingNote.tsx';
import { AtmosphereLine } from '../components/AtmosphereLine.tsx';
import { useSettings, useVessels } from '../state/app-state.ts';
import { useDraft } from '../state/drafts.ts';
import { CHECK_DRAFT_KEY, emptyCheckDraft } from '../state/check-draft.ts';
import { evaluateDraft } from '../state/check-session.ts';
import { siteAtmosphere } from '../state/atmosphere.ts';
import { unitsInForce } from '../state/settings-model.ts';
import { hrefFor } from '../router.ts';
import { isDemoVessel } from '../state/demo-plant.ts';
import { DEMO_RESULT_NOTICE } from '../state/demo-label.ts';

export function CheckScreen() {
  const settings = useSettings();
  const prefs = unitsInForce(settings);
  const vessels = useVessels();
  const draft = useDraft(CHECK_DRAFT_KEY, emptyCheckDraft(prefs, settings.technician));
  const d = draft.value;
  const vessel = vessels.find((v) => v.id === d.vesselId && !v.retired);
  const atm = siteAtmosphere(settings.atmosphere);
  const measured = settings.atmosphere.mode === 'barometer' && atm.ok ? atm.pressurePa : undefined;
  const evaluation = useMemo(() => evaluateDraft(d, vessel, measured, prefs), [d, vessel, settings]);
  return (
    <div data-draft={draft.loaded ? 'loaded' : 'loading'}>
      <VesselPicker vessels={vessels} value={vessel ? d.vesselId : ''} onChange={(vesselId) => draft.set({ ...d, vesselId })} />
      {vessel && isDemoVessel(vessel) ? <p class="demo-notice" role="note"><span class="demo-tag">DEMO DATA</span> {DEMO_RESULT_NOTICE}</p> : null}
      {settings.atmosphere.mode === 'barometer' ? <AtmosphereLine atm={atm} /> : (
        <p class="hint">Gauge readings are referred to the vessel's own site atmosphere. Enter today's barometer reading in <a href={hrefFor('settings')}>Settings</a> to use it instead.</p>
      )}
      <ReadingInputs draft={d} onChange={draft.set} errors={evaluation.kind === 'input-error' ? evaluation.errors : {}} />
      <div aria-live="polite" aria-atomic="true" class="field">
        {evaluation.kind === 'result' ? <p class="visually-hidden">{evaluation.view.verdict.text}</p> : null}
        {evaluation.kind === 'incomplete' ? <p>{evaluation.message}</p> : null}
        {evaluation.kind === 'input-error' && evaluation.general ? <p class="field-error">{evaluation.general}</p> : null}
      </div>
      {evaluation.kind === 'result' ? <ResultCard view={evaluation.view} /> : <StandingNote />}
      <SaveCheckForm draft={d} onChange={draft.set} evaluation={evaluation} vessel={vessel}
        onSaved={() => draft.set({ ...emptyCheckDraft(prefs, d.technician), vesselId: d.vesselId })} />
    </div>
  );
}
