// The register, most pressing first: overdue, due soon, found out of tolerance, none on record,
// in date, retired. Each row opens the instrument's page; data-status holds its status id.
import { hrefFor } from '../router.ts';
import { useRegister } from './register-state.ts';
import { STATUS_WORDS, dueTextOf, sortedRegister } from '../state/instrument-view.ts';
import { RegisterCsvButton } from './RegisterCsvButton.tsx';

const KIND_WORDS: Record<string, string> = {
  'pressure-gauge': 'pressure gauge', 'pressure-transmitter': 'pressure transmitter', thermometer: 'thermometer', rtd: 'RTD',
  barometer: 'barometer', 'weighing-system': 'weighing system',
};

export function InstrumentList() {
  const r = useRegister();
  const now = Date.now();
  const rows = sortedRegister(r.register, now);
  return (
    <div data-register-state={r.state}>
      <p>Every gauge, thermometer, scale and barometer the checks rest on, with its calibrations. The band of each check uses the instrument's class, its last calibration and a drift allowance growing with time since.</p>
      <p><a class="button" href={hrefFor('instruments', 'new')}>Add an instrument</a></p>
      {r.error ? <p class="field-error">{r.error}</p> : null}
      {r.state === 'ready' && rows.length === 0 ? <p>No instruments yet: a vessel's gauge and thermometer join the register when the vessel is saved.</p> : null}
      <ul class="list" aria-label="Instruments">
        {rows.map(({ history, state }) => (
          <li key={history.instrument.id} data-status={state.status} data-tag={history.instrument.tag}>
            <a class="button list-button" href={hrefFor('instruments', history.instrument.id)}>
              <span class={`status-word status-${state.status}`}>{STATUS_WORDS[state.status]}</span> {history.instrument.tag}
              <span class="muted">{KIND_WORDS[history.instrument.spec.kind] ?? history.instrument.spec.kind} · {dueTextOf(history, now)}</span>
            </a>
          </li>
        ))}
      </ul>
      {r.state === 'ready' && rows.length > 0 ? <RegisterCsvButton /> : null}
    </div>
  );
}

export { KIND_WORDS };
