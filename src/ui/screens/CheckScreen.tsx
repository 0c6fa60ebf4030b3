// New check: pick a vessel (or scan its label), type the readings; the outcome strip pinned above
// the fields follows every key, the full result below follows when the keys pause, and the entry
// is kept as a draft until it is saved to the log.
import { ReadingInputs } from '../components/ReadingInputs.tsx';
import { SaveCheckForm } from '../components/SaveCheckForm.tsx';
import { VesselChooser } from '../components/VesselChooser.tsx';
import { StandingNote } from '../components/StandingNote.tsx';
import { OutcomeStrip } from '../components/OutcomeStrip.tsx';
import { CheckAtmosphere } from '../components/CheckAtmosphere.tsx';
import { useCheckEntry } from '../state/check-entry.ts';
import { useEngine } from '../state/engine.ts';

function openResult(): void {
  const heading = document.getElementById('result-h');
  heading?.scrollIntoView({ block: 'start', behavior: 'smooth' });
  heading?.focus({ preventScroll: true });
}

export function CheckScreen({ param }: { param?: string | undefined }) {
  const c = useCheckEntry(param);
  const d = c.draft.value;
  const e = c.evaluation;
  const shown = c.details.value;
  // The full result's card (with its chart and sketch) travels with the engine: it is drawn only
  // once the engine has worked out a result, so it need not be parsed before the first paint.
  const ResultCard = useEngine()?.ResultCard;
  return (
    <div class="check-screen" data-draft={c.draft.loaded ? 'loaded' : 'loading'}>
      <VesselChooser vessels={c.vessels} value={c.vessel ? d.vesselId : ''} onChange={c.chooseVessel} />
      <OutcomeStrip view={c.strip} onOpen={openResult} />
      <ReadingInputs draft={d} update={c.draft.update} errors={e?.kind === 'input-error' ? e.errors : {}} vesselUnits={c.units} />
      <CheckAtmosphere settings={c.settings} atm={c.atm} vessel={c.vessel} />
      <div aria-live="polite" aria-atomic="true" class="visually-hidden">{e?.kind === 'result' ? e.strip.verdict : ''}</div>
      {shown?.kind === 'result' && ResultCard ? <ResultCard view={shown.view()} verdict={false} settled={c.details.settled} /> : <StandingNote />}
      <SaveCheckForm draft={d} onChange={c.draft.set} evaluation={e} vessel={c.vessel} onSaved={c.afterSave} />
    </div>
  );
}
