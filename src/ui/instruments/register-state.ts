// The register as the Instruments screens read it: loaded once per visit, read again after a
// calibration is saved. `state` is what data-register-state shows (tests wait on it).
import { useEffect, useState } from 'preact/hooks';
import * as repo from '../state/repo.ts';
import type { InstrumentHistory } from '../../store/index.ts';

export interface RegisterState {
  state: 'reading' | 'ready' | 'failed';
  register: InstrumentHistory[];
  error: string;
  reload: () => void;
}

export function useRegister(): RegisterState {
  const [version, setVersion] = useState(0);
  const [s, setS] = useState<Omit<RegisterState, 'reload'>>({ state: 'reading', register: [], error: '' });
  useEffect(() => {
    let live = true;
    repo.listRegister().then(
      (register) => live && setS({ state: 'ready', register, error: '' }),
      (e: unknown) => live && setS({ state: 'failed', register: [], error: repo.storageMessage(e) }),
    );
    return () => { live = false; };
  }, [version]);
  return { ...s, reload: () => setVersion((v) => v + 1) };
}
