// A computed result: verdict, figures with their ± bands, hazards, the findings about the vessel
// (then the standing hazards and notes, folded), the standing note and the two pictures. The live
// region announces the verdict as the readings change.
import type { ResultView } from '../state/result-view.ts';
import { DEMO_RESULT_NOTICE } from '../state/demo-label.ts';
import { CautionList } from './CautionList.tsx';
import { Figures } from './Figures.tsx';
import { SaturationChart } from './SaturationChart.tsx';
import { StandingNote } from './StandingNote.tsx';
import { VesselSketch } from './VesselSketch.tsx';

export function ResultCard({ view, heading = 'Result' }: { view: ResultView; heading?: string }) {
  return (
    <section class="panel" aria-labelledby="result-h">
      <h2 id="result-h">{heading}{view.demo ? <> <span class="demo-tag">DEMO DATA</span></> : null}</h2>
      {view.demo ? <p class="demo-notice" role="note">{DEMO_RESULT_NOTICE}</p> : null}
      <p class={`verdict verdict-${view.verdict.tone}`}>{view.verdict.text}</p>
      <Figures figures={view.figures} />
      {view.hazards.length ? (
        <>
          <h3>Hazards</h3>
          <ul>{view.hazards.map((h) => <li key={h}>{h}</li>)}</ul>
        </>
      ) : null}
      {view.findings ? (
        <>
          <h3>Findings</h3>
          <CautionList cautions={view.findings} label="Findings" empty="No findings: this reading shows nothing wrong with the vessel. The standing hazards below still apply." />
          <details class="standing-hazards">
            <summary>Standing hazards and notes ({(view.standing ?? []).filter((c) => c.rule !== 'standing-note').length})</summary>
            <CautionList cautions={view.standing ?? []} label="Standing hazards and notes" />
          </details>
        </>
      ) : (
        <>
          <h3>Cautions</h3>
          <CautionList cautions={view.cautions} />
        </>
      )}
      {view.chart || view.sketch ? (
        <div class="pictures">
          {view.chart ? <SaturationChart data={view.chart} /> : null}
          {view.sketch ? <VesselSketch data={view.sketch} /> : null}
        </div>
      ) : null}
      <StandingNote />
    </section>
  );
}
