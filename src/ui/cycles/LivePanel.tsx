// Entering a cycle at the chamber: start, a reading prompted every interval (time from the clock),
// finish. `data-live-state` says where it stands (idle, running, due, finished) and
// `data-live-readings` how many readings are in: browser tests wait on these.
import { durationText } from '../../core/cycle/index.ts';
import { NumberField } from '../components/NumberField.tsx';
import { unitLabel } from '../state/unit-labels.ts';
import { formatIsoWithOffset } from '../../store/index.ts';
import { shortTime } from '../state/format.ts';
import type { ReadingUnits } from './cycle-input.ts';
import { intervalSOf, LIVE_START, useLivePrompt, type LiveState } from './live-cycle.ts';

interface Props { live: LiveState; units: ReadingUnits; onChange: (l: LiveState) => void }

export function LivePanel({ live, units, onChange }: Props) {
  const due = useLivePrompt(live);
  const state = live.startedAtMs === null ? 'idle' : live.finished ? 'finished' : due ? 'due' : 'running';
  let intervalError: string | undefined;
  try {
    intervalSOf(live.intervalText);
  } catch (e) {
    intervalError = e instanceof Error ? e.message : String(e);
  }
  const add = () => {
    if (live.entryTemperature.trim() === '' || live.entryPressure.trim() === '') return;
    onChange({ ...live, readings: [...live.readings, { atMs: Date.now(), temperature: live.entryTemperature, pressure: live.entryPressure }], entryTemperature: '', entryPressure: '' });
  };
  return (
    <section class="panel live-cycle" aria-labelledby="live-h" data-live-state={state} data-live-readings={live.readings.length}>
      <h2 id="live-h">Live at the chamber</h2>
      <NumberField id="live-interval" label="Reading every, s" value={live.intervalText} error={intervalError}
        onInput={(t) => onChange({ ...live, intervalText: t })} />
      {live.startedAtMs === null ? (
        <button type="button" disabled={intervalError !== undefined} onClick={() => onChange({ ...LIVE_START, intervalText: live.intervalText, startedAtMs: Date.now() })}>Start cycle</button>
      ) : (
        <p>Started {shortTime(formatIsoWithOffset(new Date(live.startedAtMs)))}; {live.readings.length} readings.</p>
      )}
      {state === 'due' ? <p class="live-due" role="alert">Reading due: read the thermometer and the gauge now.</p> : null}
      {state === 'running' || state === 'due' ? (
        <>
          <NumberField id="live-temperature" label={`Temperature, ${unitLabel(units.temperature)}`} value={live.entryTemperature}
            onInput={(t) => onChange({ ...live, entryTemperature: t })} />
          <NumberField id="live-pressure" label={`Pressure, ${unitLabel(units.pressure)} ${units.reference}`} value={live.entryPressure}
            onInput={(t) => onChange({ ...live, entryPressure: t })} />
          <button type="button" onClick={add}>Add reading</button>
          <button type="button" class="secondary" onClick={() => onChange({ ...live, finished: true })}>Finish cycle</button>
        </>
      ) : null}
      {live.readings.length > 0 ? (
        <ol class="live-readings">
          {live.readings.map((r) => <li key={r.atMs}>{durationText((r.atMs - (live.startedAtMs ?? r.atMs)) / 1000)} after the start: {r.temperature} {unitLabel(units.temperature)}, {r.pressure} {unitLabel(units.pressure)}</li>)}
        </ol>
      ) : null}
    </section>
  );
}
