// An instrument's calibrations, newest first, figures in its display unit.
import type { InstrumentHistory } from '../../store/index.ts';
import { errorText } from '../state/instrument-view.ts';

export function CalibrationTable({ history }: { history: InstrumentHistory }) {
  const { instrument: i, calibrations } = history;
  if (calibrations.length === 0) return <p>No calibration on record.</p>;
  return (
    <table class="instrument-table" aria-label={`Calibrations of ${i.tag}`}>
      <thead><tr><th>Date</th><th>As found</th><th>As left</th><th>Next due</th><th>By, certificate</th></tr></thead>
      <tbody>
        {[...calibrations].reverse().map((c) => (
          <tr key={c.id} data-calibration={c.id}>
            <td>{c.time.slice(0, 10)}</td>
            <td>{errorText(i.spec, i.displayUnit, c.asFoundError)}</td>
            <td>{c.asLeftError === null ? 'left as found' : errorText(i.spec, i.displayUnit, c.asLeftError)}</td>
            <td>{c.nextDue === null ? 'interval' : c.nextDue.slice(0, 10)}</td>
            <td>{c.who}{c.certificate ? `, ${c.certificate}` : ''}{c.note ? ` (${c.note})` : ''}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
