// "A new version is ready": the person chooses when to reload; the entry in progress is saved first.
import { useEffect, useState } from 'preact/hooks';
import { applyUpdate, isUpdateReady, onUpdateReady } from '../../pwa/sw-bridge.ts';

export function UpdateBanner() {
  const [ready, setReady] = useState(isUpdateReady);
  const [later, setLater] = useState(false);
  const [error, setError] = useState('');
  useEffect(() => onUpdateReady(() => setReady(true)), []);
  if (!ready || later) return null;
  const reload = () => {
    setError('');
    applyUpdate().catch((e: unknown) => setError(`Could not save the entry in progress, so the app did not reload: ${String(e)}`));
  };
  return (
    <div class="update-banner" role="status">
      <p>A new version of Tankside is ready. Anything you are typing is kept.</p>
      <div class="row">
        <button type="button" class="primary" onClick={reload}>Reload now</button>
        <button type="button" onClick={() => setLater(true)}>Later</button>
      </div>
      {error ? <p>{error}</p> : null}
    </div>
  );
}
