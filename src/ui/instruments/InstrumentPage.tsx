// One instrument: what it is, its status, where it has been fitted, its calibrations, a chart of
// its as-found errors and the offset the log shows for each pair it belongs to, the drift found,
// the calibration form, and what can be done to it (change, fit or swap, retire).
// data-instrument-state="ready" once all of it is read.
import { useEffect, useState } from 'preact/hooks';
import * as repo from '../state/repo.ts';
import { useVessels } from '../state/app-state.ts';
import { hrefFor } from '../router.ts';
import type { PairDrift } from '../state/pair-drift.ts';
import { STATUS_WORDS, dueTextOf, instrumentState } from '../state/instrument-view.ts';
import { PairDriftView } from '../components/VesselInstruments.tsx';
import type { FittingRecord, InstrumentHistory } from '../../store/index.ts';
import { InstrumentFacts } from './InstrumentFacts.tsx';
import { CalibrationTable } from './CalibrationTable.tsx';
import { ErrorChart } from './ErrorChart.tsx';
import { CalibrationForm } from './CalibrationForm.tsx';
import { InstrumentActions } from './InstrumentActions.tsx';

interface Loaded { history: InstrumentHistory; fittings: FittingRecord[]; pairs: PairDrift[] }

export function InstrumentPage({ instrumentId }: { instrumentId: string }) {
  const vessels = useVessels();
  const [loaded, setLoaded] = useState<Loaded | null | undefined>(undefined);
  const [error, setError] = useState('');
  const [version, setVersion] = useState(0);
  useEffect(() => {
    let live = true;
    (async () => {
      const page = await repo.instrumentPage(instrumentId);
      if (!page) return null;
      const { pairDrifts } = await import('../state/pair-drift.ts');
      const now = Date.now();
      const pairs: PairDrift[] = [];
      for (const vesselId of new Set(page.fittings.map((f) => f.vesselId))) {
        const { checks, fittings, register } = await repo.driftInputs(vesselId);
        pairs.push(...pairDrifts(checks, fittings, register, now).filter((p) => p.gaugeId === instrumentId || p.thermometerId === instrumentId));
      }
      return { ...page, pairs };
    })().then((l) => live && setLoaded(l), (e: unknown) => live && setError(repo.storageMessage(e)));
    return () => { live = false; };
  }, [instrumentId, version]);
  if (error) return <p class="field-error">{error}</p>;
  if (loaded === undefined) return <p data-instrument-state="reading">Reading the instrument…</p>;
  if (loaded === null) return <p data-instrument-state="missing">That instrument is not in the register on this device.</p>;
  const { history, fittings, pairs } = loaded;
  const state = instrumentState(history, Date.now());
  const tagOf = (id: string) => vessels.find((v) => v.id === id)?.tag ?? id;
  return (
    <div data-instrument-state="ready" data-status={state.status}>
      <p><a href={hrefFor('instruments')}>All instruments</a></p>
      <h2>{history.instrument.tag}</h2>
      <p><strong class={`status-word status-${state.status}`}>{STATUS_WORDS[state.status]}</strong> · {dueTextOf(history)}</p>
      <InstrumentFacts history={history} />
      <section class="panel" aria-labelledby="fit-h">
        <h2 id="fit-h">Fitted to</h2>
        {fittings.length === 0 ? <p>Not fitted to any vessel.</p> : (
          <ul class="list">
            {fittings.map((f) => <li key={f.id}><a href={hrefFor('vessels', f.vesselId)}>{tagOf(f.vesselId)}</a> from {f.from.slice(0, 10)}{f.reason ? ` (${f.reason})` : ''}</li>)}
          </ul>
        )}
      </section>
      <section class="panel" aria-labelledby="cal-h">
        <h2 id="cal-h">Calibrations</h2>
        <ErrorChart history={history} pairs={pairs} />
        <CalibrationTable history={history} />
      </section>
      {pairs.length > 0 ? (
        <section class="panel" aria-labelledby="drift-h">
          <h2 id="drift-h">Drift from the log</h2>
          {pairs.map((p) => <PairDriftView key={`${p.gaugeId}-${p.thermometerId}`} pair={p} />)}
        </section>
      ) : null}
      <CalibrationForm history={history} onSaved={() => setVersion((v) => v + 1)} />
      <InstrumentActions key={history.instrument.updatedAt} instrument={history.instrument} onChanged={() => setVersion((v) => v + 1)} />
    </div>
  );
}
