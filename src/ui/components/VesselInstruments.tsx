// A vessel's instruments: which gauge and thermometer are fitted (each a link to its page, with its
// calibration due state), and what the log says about each pair: the drift estimate's findings and
// figures. data-drift-state says when the estimate is in ("ready") for tests and benchmarks.
import { useEffect, useState } from 'preact/hooks';
import * as repo from '../state/repo.ts';
import { hrefFor } from '../router.ts';
import { CautionList } from './CautionList.tsx';
import type { PairDrift } from '../state/pair-drift.ts';
import { fittedAt, type FittingRecord, type InstrumentHistory } from '../../store/index.ts';
import { dueTextOf, driftFigures } from '../state/instrument-view.ts';

/** Each place's word on the vessel page (and the fitting panel). */
export const ROLE_WORDS: Readonly<Record<string, string>> = { pressure: 'Pressure', temperature: 'Temperature', weight: 'Weight', atmosphere: 'Barometer' };

interface Loaded { fitted: { role: string; history: InstrumentHistory }[]; pairs: PairDrift[] }

export function VesselInstruments({ vesselId }: { vesselId: string }) {
  const [loaded, setLoaded] = useState<Loaded | null>(null);
  const [error, setError] = useState('');
  useEffect(() => {
    let live = true;
    // The estimator (statistics, the saturation line) is its own chunk, read only where a drift is shown.
    Promise.all([repo.driftInputs(vesselId), import('../state/pair-drift.ts')]).then(([{ checks, fittings, register }, { pairDrifts }]) => {
      if (!live) return;
      const now = Date.now();
      setLoaded({ fitted: fittedList(fittings, register, now), pairs: pairDrifts(checks, fittings, register, now) });
    }, (e: unknown) => live && setError(repo.storageMessage(e)));
    return () => { live = false; };
  }, [vesselId]);
  return (
    <section class="panel" aria-labelledby="vi-h" data-drift-state={loaded ? 'ready' : error ? 'failed' : 'reading'}>
      <h2 id="vi-h">Instruments of this vessel</h2>
      {error ? <p class="field-error">{error}</p> : null}
      {loaded && loaded.fitted.length === 0 ? <p>No register instruments fitted: checks use the gauge and thermometer figures typed above.</p> : null}
      {loaded && loaded.fitted.length > 0 ? <p class="hint">Checks take the gauge's and thermometer's limits from these register entries (class, last calibration, drift since), not from the figures typed above; record calibrations on each instrument's page.</p> : null}
      {loaded ? (
        <ul class="list">
          {loaded.fitted.map(({ role, history }) => (
            <li key={role}>
              <a class="button list-button" href={hrefFor('instruments', history.instrument.id)}>
                {ROLE_WORDS[role] ?? role}: {history.instrument.tag} · {dueTextOf(history)}
              </a>
            </li>
          ))}
        </ul>
      ) : null}
      {loaded?.pairs.map((p) => <PairDriftView key={`${p.gaugeId}-${p.thermometerId}`} pair={p} />)}
    </section>
  );
}

function fittedList(fittings: readonly FittingRecord[], register: ReadonlyMap<string, InstrumentHistory>, nowMs: number) {
  return Object.entries(fittedAt(fittings, nowMs)).flatMap(([role, f]) => {
    const history = f?.instrumentId ? register.get(f.instrumentId) : undefined;
    return history ? [{ role, history }] : [];
  });
}

/** One pair's drift: its findings, else what the estimate found, with its figures. */
export function PairDriftView({ pair }: { pair: PairDrift }) {
  return (
    <div class="field" data-pair={`${pair.gaugeTag} / ${pair.thermometerTag}`}>
      <h3>{pair.gaugeTag} against {pair.thermometerTag}</h3>
      <CautionList cautions={pair.findings} label={`Drift findings, ${pair.gaugeTag} and ${pair.thermometerTag}`} empty={driftFigures(pair).summary} />
      {pair.drift.estimate === 'made' ? <p class="muted" data-drift-figures>{driftFigures(pair).detail}</p> : null}
    </div>
  );
}
