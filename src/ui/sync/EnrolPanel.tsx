// Enrolment: the server, account, password and role an administrator gives, typed, or read from
// an enrolment link or QR code (or the text the account script prints) into the same form, which
// the person then confirms. Every field's problem is shown beside it; nothing is saved until all are right.
import { useState } from 'preact/hooks';
import { TextField } from '../components/TextField.tsx';
import { Choice } from '../components/Choice.tsx';
import { lazyScreen } from '../components/LazyScreen.tsx';
import { storageMessage } from '../state/repo.ts';
import { checkEnrolment, DEFAULT_SERVER, enrolmentOfText, type EnrolForm, type FormErrors } from './enrolment.ts';
import { enrolDevice } from './sync-facts.ts';

const ScanCode = lazyScreen('The code scanner', () => import('../labels/ScanLabel.tsx').then((m) => m.ScanCode));

const ROLES = [
  { id: 'technician', label: 'Technician' },
  { id: 'supervisor', label: 'Supervisor' },
] as const;

interface Props {
  deviceId: string;
  /** Fields read from an enrolment link the app was opened with. */
  given: Partial<EnrolForm> | null;
  onEnrolled: () => void;
}

export function EnrolPanel({ deviceId, given, onEnrolled }: Props) {
  const [form, setForm] = useState<EnrolForm>({ server: DEFAULT_SERVER, account: deviceId, password: '', role: 'technician', ...given });
  const [errors, setErrors] = useState<FormErrors>({});
  const [pasted, setPasted] = useState('');
  const [message, setMessage] = useState(given ? 'Read from the enrolment link: check the fields, then enrol.' : '');
  const [scanning, setScanning] = useState(false);
  const set = (field: keyof EnrolForm) => (v: string) => setForm({ ...form, [field]: v });
  const take = (text: string) => {
    const fields = enrolmentOfText(text);
    if (!fields) return setMessage('That is not an enrolment link or the account text the administrator prints.');
    setForm({ ...form, ...fields });
    setMessage('Read: check the fields, then enrol.');
  };
  const submit = async (e: Event) => {
    e.preventDefault();
    const checked = checkEnrolment(form, deviceId, location.origin, __SYNC_ORIGIN__);
    if ('errors' in checked) {
      setErrors(checked.errors);
      return setMessage('Not enrolled: correct the fields marked.');
    }
    setErrors({});
    try {
      await enrolDevice(checked.ok);
      onEnrolled();
    } catch (err) {
      setMessage(`Not enrolled: ${storageMessage(err)}`);
    }
  };
  const canScan = typeof (window as { BarcodeDetector?: unknown }).BarcodeDetector === 'function';
  return (
    <section class="panel" aria-labelledby="sync-enrol" data-enrol-form="open">
      <h2 id="sync-enrol">Enrol this device</h2>
      <p>
        The plant's administrator makes an account named by this device's id, <strong class="device-id">{deviceId}</strong>, and
        gives you its password, as a link, a QR code or typed.
      </p>
      <div class="row">
        <TextField id="sync-paste" label="Enrolment link or text" value={pasted} onInput={setPasted} />
        <button type="button" onClick={() => take(pasted)}>Read it</button>
        {canScan ? <button type="button" onClick={() => setScanning(true)}>Scan a code</button> : null}
      </div>
      {scanning ? <ScanCode read={(t) => enrolmentOfText(t) !== null} notOurs="That code is not a Tankside enrolment." typeInstead="Type the fields instead." onText={(t) => { setScanning(false); take(t); }} onClose={() => setScanning(false)} /> : null}
      <form onSubmit={(e) => void submit(e)} noValidate>
        <TextField id="sync-server" label="Server" value={form.server} onInput={set('server')} error={errors.server} />
        <TextField id="sync-account" label="Account (this device's id)" value={form.account} onInput={set('account')} error={errors.account} />
        <div class="field">
          <label for="sync-password">Password</label>
          <input id="sync-password" type="password" autoComplete="off" value={form.password}
            aria-invalid={errors.password ? 'true' : undefined} aria-describedby={errors.password ? 'sync-password-error' : undefined}
            onInput={(e) => set('password')(e.currentTarget.value)} />
          {errors.password ? <div id="sync-password-error" class="field-error">{errors.password}</div> : null}
        </div>
        <Choice name="sync-role" legend="Role" value={form.role} options={ROLES} onChange={(r) => setForm({ ...form, role: r })} />
        {errors.role ? <p class="field-error">{errors.role}</p> : null}
        <button type="submit" class="primary">Enrol this device</button>
      </form>
      <p aria-live="polite" data-enrol-message>{message}</p>
    </section>
  );
}
