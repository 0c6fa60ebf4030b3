// The vessel report's instruments: those the period's checks used with their state then and now,
// and the drift the vessel's log shows for each gauge–thermometer pair (over all its saturated
// checks since their last calibrations, not only the period's). data-report-instruments="ready" once read.
import { useEffect, useState } from 'preact/hooks';
import { checksForVessel, type VesselRecord } from '../../store/index.ts';
import * as repo from '../state/repo.ts';
import { PairDriftView, ROLE_WORDS } from '../components/VesselInstruments.tsx';
import type { PairDrift } from '../state/pair-drift.ts';
import { instrumentsInPeriod, stateAtChecksText, type InstrumentInPeriod } from './report-instruments.ts';

interface Props { vessel: VesselRecord; fromMs: number | null; toMs: number | null }

export function ReportInstruments({ vessel, fromMs, toMs }: Props) {
  const [data, setData] = useState<{ lines: InstrumentInPeriod[]; pairs: PairDrift[] } | null>(null);
  const [error, setError] = useState('');
  useEffect(() => {
    let live = true;
    setData(null);
    (async () => {
      const [all, fittings, register, { pairDrifts }] = await Promise.all([
        checksForVessel(vessel.id, { limit: 1000 }), repo.fittingsOfVessel(vessel.id), repo.listRegister(), import('../state/pair-drift.ts'),
      ]);
      const byId = new Map(register.map((h) => [h.instrument.id, h]));
      const inPeriod = all.checks.filter((c) => (fromMs === null || c.timeMs >= fromMs) && (toMs === null || c.timeMs <= toMs));
      const now = Date.now();
      return { lines: instrumentsInPeriod(inPeriod, fittings, byId, now), pairs: pairDrifts(all.checks, fittings, byId, now) };
    })().then((d) => live && setData(d), (e: unknown) => live && setError(String(e)));
    return () => { live = false; };
  }, [vessel.id, fromMs, toMs]);
  if (error) return <p class="field-error" role="alert">The instruments could not be read: {error}</p>;
  if (!data) return <p role="status" data-report-instruments="reading">Reading the instruments of {vessel.tag}…</p>;
  return (
    <section aria-labelledby="report-instruments-title" data-report-instruments="ready">
      <h3 id="report-instruments-title">Instruments used in the period</h3>
      {data.lines.length === 0 ? <p>No register instruments are known for these checks.</p> : (
        <ul class="list" aria-label={`Instruments of ${vessel.tag} in the period`}>
          {data.lines.map((l) => (
            <li key={l.instrumentId} data-instrument-tag={l.tag} data-state-at-checks={l.worstAtCheck ?? 'unrecorded'}>
              <strong>{l.tag}</strong> ({(ROLE_WORDS[l.role] ?? l.role).toLowerCase()}): {stateAtChecksText(l)}; now {l.now}.
            </li>
          ))}
        </ul>
      )}
      {data.pairs.map((p) => <PairDriftView key={`${p.gaugeId}-${p.thermometerId}`} pair={p} />)}
    </section>
  );
}
