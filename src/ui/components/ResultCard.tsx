// A computed result in full: findings first (each caution once, with its signal word), then the
// groups — saturation with its chart, contents with the vessel sketch, heating and limits — and the
// hazards of the contents folded, the standing note last. On the Check screen the outcome strip
// carries the verdict, so the card leaves it out (`verdict={false}`).
import type { ResultView } from '../state/result-view.ts';
import { DEMO_RESULT_NOTICE } from '../state/demo-label.ts';
import { CautionList } from './CautionList.tsx';
import { Figures } from './Figures.tsx';
import { SaturationChart } from './SaturationChart.tsx';
import { StandingNote } from './StandingNote.tsx';
import { VesselSketch } from './VesselSketch.tsx';
import { pure } from './pure.ts';

interface Props { view: ResultView; heading?: string; verdict?: boolean; settled?: boolean; findingsTitle?: string }

function ResultCardView({ view, heading = 'Result', verdict = true, settled = true, findingsTitle = 'Findings' }: Props) {
  return (
    <section class="panel result" id="result" aria-labelledby="result-h" data-settled={settled ? 'true' : 'false'}>
      <h2 id="result-h" tabIndex={-1}>{heading}{view.demo ? <> <span class="demo-tag">DEMO DATA</span></> : null}</h2>
      {view.demo ? <p class="demo-notice" role="note">{DEMO_RESULT_NOTICE}</p> : null}
      {verdict ? <p class={`verdict verdict-${view.verdict.tone}`}>{view.verdict.text}</p> : null}
      <h3>{findingsTitle}</h3>
      <CautionList cautions={view.findings} label={findingsTitle} empty={findingsTitle === 'Findings' ? 'No finding: nothing in this reading calls for action now.' : 'None.'} />
      {view.groups.map((g) => {
        const body = (
          <>
            {g.id === 'saturation' && !verdict ? <p>{view.verdict.text}</p> : null}
            <Figures figures={g.figures} />
            {g.notes.length ? <CautionList cautions={g.notes} label={`${g.title}: notes`} /> : null}
            {g.id === 'saturation' && view.chart ? <SaturationChart data={view.chart} /> : null}
            {g.id === 'contents' && view.sketch ? <VesselSketch data={view.sketch} /> : null}
          </>
        );
        return g.folded ? (
          <details key={g.id} class="result-group result-folded" data-group={g.id}>
            <summary>{g.title}</summary>
            {body}
          </details>
        ) : (
          <section key={g.id} class="result-group" data-group={g.id} aria-label={g.title}>
            <h3>{g.title}</h3>
            {body}
          </section>
        );
      })}
      <StandingNote />
    </section>
  );
}

/** Re-renders only for a new view (a keystroke that leaves the shown result alone costs nothing here). */
export const ResultCard = pure(ResultCardView);
