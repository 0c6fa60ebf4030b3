// The calibration entry form: date, as-found and as-left error in the instrument's display unit,
// next due date, who, certificate, note. A bad field is named with its valid range under it, and
// nothing is saved; data-calibration-save says where the save is (tests wait on "saved").
import { useState } from 'preact/hooks';
import * as repo from '../state/repo.ts';
import { TextField } from '../components/TextField.tsx';
import type { InstrumentHistory } from '../../store/index.ts';
import { EMPTY_CALIBRATION, calibrationFromDraft, shownUnit, type CalibrationDraft, type CalibrationField } from '../state/instrument-view.ts';
import { unitLabel } from '../state/unit-labels.ts';

type SaveState = 'idle' | 'saving' | 'saved' | 'refused' | 'failed';

export function CalibrationForm({ history, onSaved }: { history: InstrumentHistory; onSaved: () => void }) {
  const [d, setD] = useState<CalibrationDraft>(EMPTY_CALIBRATION);
  const [errors, setErrors] = useState<Partial<Record<CalibrationField, string>>>({});
  const [save, setSave] = useState<SaveState>('idle');
  const [message, setMessage] = useState('');
  const unit = unitLabel(shownUnit(history.instrument.spec, history.instrument.displayUnit));
  const field = (key: CalibrationField, label: string, multiline = false) => (
    <TextField id={`cal-${key}`} label={label} value={d[key]} error={errors[key]} multiline={multiline}
      onInput={(text) => { setD((x) => ({ ...x, [key]: text })); setSave('idle'); }} />
  );
  const submit = async (e: Event) => {
    e.preventDefault();
    const parsed = calibrationFromDraft(history, d, Date.now());
    if (!parsed.ok) {
      setErrors(parsed.errors);
      setSave('refused');
      setMessage('Not saved: see the fields marked below.');
      return;
    }
    setErrors({});
    setSave('saving');
    try {
      await repo.addCalibration(parsed.calibration);
      setD(EMPTY_CALIBRATION);
      setSave('saved');
      setMessage(`Calibration of ${history.instrument.tag} saved.`);
      onSaved();
    } catch (x) {
      setSave('failed');
      setMessage(`Not saved: ${repo.storageMessage(x)}`);
    }
  };
  return (
    <form class="panel" aria-labelledby="calform-h" onSubmit={submit} data-calibration-save={save} noValidate>
      <h2 id="calform-h">Record a calibration</h2>
      <p>Errors are indication − reference at the worst point checked, in {unit}. Leave "as left" empty when the instrument was not adjusted, and "next due" empty to use the interval.</p>
      {field('date', 'Calibration date (YYYY-MM-DD)')}
      {field('asFound', `As-found error (${unit})`)}
      {field('asLeft', `As-left error (${unit}, optional)`)}
      {field('nextDue', 'Next due date (YYYY-MM-DD, optional)')}
      {field('who', 'Calibrated by')}
      {field('certificate', 'Certificate reference (optional)')}
      {field('note', 'Note (optional)', true)}
      <div class="row field"><button type="submit" class="primary" disabled={save === 'saving'}>Save calibration</button></div>
      {message ? <p role="status" class={save === 'saved' ? '' : 'field-error'}>{message}</p> : null}
    </form>
  );
}
