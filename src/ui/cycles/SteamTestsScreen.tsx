// Steam and chamber tests: one small form per periodic test on the chosen vessel, its limit
// configurable, the core's evaluation with its findings and standing cautions, saved to the log as
// a record of kind "periodic-test". The entry is a draft until it is saved.
import { CautionList } from '../components/CautionList.tsx';
import { Choice } from '../components/Choice.tsx';
import { NumberField } from '../components/NumberField.tsx';
import { SelectField } from '../components/SelectField.tsx';
import { TextField } from '../components/TextField.tsx';
import { VesselPicker } from '../components/VesselPicker.tsx';
import { StandingCautions } from './CycleResult.tsx';
import { SaveRecordForm } from './SaveRecordForm.tsx';
import { useSteamTest } from './steam-test-session.ts';
import { STEAM_TESTS, type TestField } from './steam-tests.ts';
import './cycles.css';

function Field({ f, value, onInput }: { f: TestField; value: string; onInput: (v: string) => void }) {
  const id = `st-${f.id}`;
  if (f.kind === 'choice') return <Choice name={id} legend={f.label} value={value} options={f.options ?? []} onChange={onInput} />;
  if (f.kind === 'text') return <TextField id={id} label={f.label} value={value} onInput={onInput} />;
  if (f.kind === 'lines') return <TextField id={id} label={f.label} value={value} onInput={onInput} multiline />;
  return <NumberField id={id} label={f.label} value={value} onInput={onInput} />;
}

export function SteamTestsScreen() {
  const s = useSteamTest();
  const r = s.result;
  return (
    <div class="steam-tests-screen" data-draft={s.loaded ? 'loaded' : 'loading'}>
      <VesselPicker id="test-vessel" vessels={s.vessels} value={s.vessel ? s.vessel.id : ''} onChange={s.chooseVessel} />
      <SelectField id="test-kind" label="Test" value={s.def.id} options={STEAM_TESTS.map((t) => ({ id: t.id, label: t.label }))} onChange={s.chooseTest} />
      <p class="test-about" data-test-about={s.def.id}>{s.def.about}</p>
      <section class="panel" aria-label={s.def.label}>
        {s.fields.map((f) => <Field key={`${s.def.id}-${f.id}`} f={f} value={s.values[f.id] ?? ''} onInput={(v) => s.setValue(f.id, v)} />)}
      </section>
      {r?.kind === 'error' ? <p class="field-error" role="alert" data-test-error="true">Not evaluated: {r.message}</p> : null}
      {r?.kind === 'result' ? (
        <section class="panel" aria-labelledby="test-result-h" data-test-outcome={r.graded.outcome} data-test={s.def.id}>
          <h2 id="test-result-h">What the test shows</h2>
          <p>{r.graded.outcome === 'none' ? <strong>No finding</strong> : <span class={`signal signal-${r.graded.outcome}`}>{r.graded.outcome}</span>} {r.graded.summary}</p>
          <CautionList cautions={r.graded.findings} empty="No finding against the limit entered." label="Findings of this test" />
          <StandingCautions standing={r.graded.standing} what="test" />
        </section>
      ) : null}
      {s.vessel ? <SaveRecordForm idPrefix="test" label="Save test" save={s.save} /> : null}
    </div>
  );
}
