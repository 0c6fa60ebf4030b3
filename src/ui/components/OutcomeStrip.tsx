// The outcome strip: pinned to the top of the Check screen while the readings are typed, it says
// the outcome's signal word, the verdict in one line and the two or three figures that decide it.
// `data-outcome` carries the outcome (DANGER, WARNING, CAUTION, NOTICE or none) once there is a
// result; `data-check-state` says what the strip shows (engine loading, incomplete, input error,
// result). Tapping it opens the full result below.
import type { Outcome } from '../state/outcome.ts';
import { outcomeLabel } from '../state/outcome.ts';
import type { Figure } from '../state/result-view.ts';

export type StripView =
  | { kind: 'loading' | 'incomplete' | 'input-error'; message: string }
  | { kind: 'result'; outcome: Outcome; verdict: string; figures: readonly Figure[]; demo: boolean };

export function OutcomeStrip({ view, onOpen }: { view: StripView; onOpen: () => void }) {
  if (view.kind !== 'result') {
    return (
      <div class={`outcome-strip outcome-strip-${view.kind}`} data-check-state={view.kind} role="status">
        <span class="outcome-word outcome-word-pending">{view.kind === 'input-error' ? 'CHECK INPUT' : 'NO RESULT YET'}</span>
        <span class="outcome-line">{view.message}</span>
      </div>
    );
  }
  return (
    <button type="button" class={`outcome-strip outcome-strip-result outcome-${view.outcome}`} data-check-state="result"
      data-outcome={view.outcome} aria-controls="result" aria-describedby="outcome-hint" onClick={onOpen}>
      <span class={`outcome-word signal-${view.outcome === 'none' ? 'none' : view.outcome}`}>{outcomeLabel(view.outcome)}</span>
      <span class="outcome-line">{view.demo ? 'DEMO DATA · ' : ''}{view.verdict}</span>
      <span class="outcome-figures">
        {view.figures.map((f) => <span key={f.label} class="outcome-figure"><span class="outcome-figure-label">{f.label}</span> {f.value}</span>)}
      </span>
      <span id="outcome-hint" class="visually-hidden">Opens the full result below.</span>
    </button>
  );
}
