// One saved check in full: inputs exactly as typed with their units, results, cautions,
// who, when, and the app and formulation versions it was computed with.
import type { CheckRecord } from '../state/repo.ts';
import { Figures } from './Figures.tsx';
import { ResultCard } from './ResultCard.tsx';
import { CautionList } from './CautionList.tsx';
import { StandingNote } from './StandingNote.tsx';
import { hrefFor } from '../router.ts';
import { viewOfRecord } from '../state/check-session.ts';
import { useSettings } from '../state/app-state.ts';
import { unitsInForce } from '../state/settings-model.ts';
import { unitLabel } from '../state/unit-labels.ts';
import { shortTime } from '../state/format.ts';
import { DEMO_RESULT_NOTICE, isDemo } from '../state/demo-label.ts';

const INPUT_NAMES: Record<string, string> = { temperature: 'Temperature', pressure: 'Pressure', grossWeight: 'Gross weight' };

export function CheckRecordView({ record: r }: { record: CheckRecord }) {
  const prefs = unitsInForce(useSettings());
  const view = viewOfRecord(r, prefs);
  const demo = isDemo(r.vessel) || isDemo(r.vessel.spec);
  const inputs = Object.entries(r.inputs).map(([k, v]) => ({
    label: INPUT_NAMES[k] ?? k,
    value: `${v.text} ${unitLabel(v.unit)}${v.reference ? ` (${v.reference})` : ''}`,
  }));
  return (
    <div>
      <p><a href={hrefFor('log')}>Back to the log</a></p>
      <section class="panel" aria-labelledby="rec-h">
        <h2 id="rec-h">Check of {r.vessel.tag}{demo ? <> <span class="demo-tag">DEMO DATA</span></> : null}</h2>
        {demo ? <p class="demo-notice" role="note">{DEMO_RESULT_NOTICE}</p> : null}
        <Figures figures={[
          { label: 'Taken', value: `${shortTime(r.time)} (${r.time})` },
          { label: 'Technician', value: r.technician },
          ...(r.note ? [{ label: 'Note', value: r.note }] : []),
          ...(r.corrects ? [{ label: 'Corrects', value: `${r.corrects} (${r.reason ?? ''})` }] : []),
        ]} />
        <h3>Inputs as typed</h3>
        <Figures figures={inputs} />
      </section>
      {view ? <ResultCard view={{ ...view, demo: view.demo || demo }} heading="Result as saved" /> : (
        <section class="panel" aria-labelledby="rec-old">
          <h2 id="rec-old">Result as saved</h2>
          <p>This record was saved by app version {r.appVersion}, whose result layout this version cannot show. Its cautions:</p>
          <CautionList cautions={r.cautions} />
          <StandingNote />
        </section>
      )}
      <section class="panel" aria-labelledby="rec-ver">
        <h2 id="rec-ver">Versions</h2>
        <Figures figures={[
          { label: 'App', value: r.appVersion },
          { label: 'Formulation', value: r.formulationId },
          { label: 'Record id', value: r.id },
        ]} />
      </section>
    </div>
  );
}
