// An evaluated cycle as the core judged it: the outcome, the hold, the deciding figures, the
// findings, the picture, and the standing cautions folded (each once, the standing note last).
// Wording is the core's; figures are shown in the temperature unit the cycle type was typed in.
import { cycleChart, durationText, type CycleEvaluation, type CycleReading } from '../../core/cycle/index.ts';
import { temperatureFromK, type TemperatureUnit } from '../../core/units/index.ts';
import { CautionList } from '../components/CautionList.tsx';
import { formatNumber } from '../state/format.ts';
import { unitLabel } from '../state/unit-labels.ts';
import { CycleChart } from './CycleChart.tsx';

const HOLD_WORDS = { met: 'Hold met', short: 'Hold short', interrupted: 'Hold interrupted', 'not-reached': 'Band not reached' } as const;

export function CycleResult({ evaluation: e, readings, unit }: { evaluation: CycleEvaluation; readings: readonly CycleReading[]; unit: TemperatureUnit }) {
  const u = unitLabel(unit);
  const temp = (k: number) => `${formatNumber(temperatureFromK(k, unit), 4)} ${u}`;
  const h = e.hold;
  return (
    <section class="panel cycle-result" aria-labelledby="cycle-result-h" data-cycle-outcome={e.outcome} data-hold={h.status}>
      <h2 id="cycle-result-h" tabIndex={-1}>What the readings show</h2>
      <p class="cycle-outcome">
        {e.outcome === 'none' ? <strong>No finding</strong> : <span class={`signal signal-${e.outcome}`}>{e.outcome}</span>}
        {' '}<strong>{HOLD_WORDS[h.status]}</strong>: {durationText(h.achievedS)} at or above {temp(e.band.lowerK)} (hold time {durationText(h.requiredS)}).
      </p>
      <dl class="figures">
        <dt>Readings</dt><dd>{e.readingCount}, over {durationText(e.lastTimeS - e.firstTimeS)}</dd>
        <dt>Band</dt><dd>{temp(e.band.lowerK)} to {temp(e.band.upperK)}</dd>
        <dt>Time in band during the hold</dt><dd>{durationText(e.timeInBandDuringHoldS)}</dd>
        <dt>Largest excursion</dt><dd>{e.largestExcursion ? `${formatNumber(e.largestExcursion.byK, 2)} K ${e.largestExcursion.direction} the band` : 'none: stayed in the band'}</dd>
        <dt>Equilibration lag</dt><dd>{e.equilibration.equilibrationS === null ? 'not found' : durationText(e.equilibration.equilibrationS)}</dd>
        <dt>Saturation agreement in the hold</dt>
        <dd>{e.holdSaturation ? `${e.holdSaturation.outsideLimit} of ${e.holdSaturation.readings} readings beyond ±${formatNumber(e.cycleType.saturationLimitK, 2)} K of T_sat(p)` : 'no hold to judge'}</dd>
        <dt>F-value (T_ref {temp(e.lethality.referenceTemperatureK)}, z {formatNumber(e.lethality.zK, 3)} K)</dt>
        <dd data-f-value={e.lethality.wholeRecordMinutes.toFixed(3)}>{formatNumber(e.lethality.wholeRecordMinutes, 3)} min over the record, {formatNumber(e.lethality.holdMinutes, 3)} min in the hold</dd>
      </dl>
      <CycleChart chart={cycleChart(e, readings)} unit={unit} />
      <h3>Findings</h3>
      <CautionList cautions={e.findings} empty="No finding: the readings stayed within what was entered." label="Findings of this cycle" />
      <StandingCautions standing={e.standing} what="cycle" />
    </section>
  );
}

/** A result's standing cautions: the last (the room's standing note) in view, the others folded. */
export function StandingCautions({ standing, what }: { standing: readonly { signal: string; message: string; rule: string }[]; what: string }) {
  const note = standing[standing.length - 1];
  const rest = standing.slice(0, -1);
  return (
    <>
      {rest.length > 0 ? (
        <details class="standing-hazards">
          <summary>Always with a {what} record ({rest.length})</summary>
          <ul class="cautions" aria-label={`Standing cautions of a ${what}`}>
            {rest.map((c) => (
              <li key={c.rule} data-rule={c.rule}><span class="caution-text"><span class={`signal signal-${c.signal}`}>{c.signal}</span>{c.message}</span></li>
            ))}
          </ul>
        </details>
      ) : null}
      {note ? <p class="standing-note" data-rule={note.rule}><span class={`signal signal-${note.signal}`}>{note.signal}</span> {note.message}</p> : null}
    </>
  );
}
