// Puts this instrument in a vessel's place from now: a vessel, the place (the ones its kind can
// take), why. When another instrument holds that place the button says it is a swap; both keep
// their histories (the fitting is a new record; nothing is overwritten). data-fit-state says where
// the save is ("saved" once it is in), data-place-holder the tag now in the chosen place.
import { useEffect, useState } from 'preact/hooks';
import * as repo from '../state/repo.ts';
import * as registerRepo from '../state/register-repo.ts';
import { useVessels } from '../state/app-state.ts';
import { SelectField } from '../components/SelectField.tsx';
import { TextField } from '../components/TextField.tsx';
import { KINDS_OF_ROLE, INSTRUMENT_ROLES, type InstrumentRecord, type InstrumentRole } from '../../store/index.ts';
import { ROLE_WORDS } from '../components/VesselInstruments.tsx';

type FitState = 'idle' | 'reading' | 'saving' | 'saved' | 'refused' | 'failed';

export function FitPanel({ instrument, onSaved }: { instrument: InstrumentRecord; onSaved: () => void }) {
  const vessels = useVessels().filter((v) => !v.retired);
  const roles = INSTRUMENT_ROLES.filter((r) => KINDS_OF_ROLE[r].includes(instrument.spec.kind));
  const [vesselId, setVesselId] = useState('');
  const [role, setRole] = useState<InstrumentRole>(roles[0] ?? 'pressure');
  const [reason, setReason] = useState('');
  const [holder, setHolder] = useState<InstrumentRecord | null | undefined>(undefined);
  const [state, setState] = useState<FitState>('idle');
  const [message, setMessage] = useState('');
  useEffect(() => {
    if (!vesselId) return setHolder(undefined);
    let live = true;
    setHolder(undefined);
    registerRepo.placeHolder(vesselId, role).then((h) => live && setHolder(h), () => live && setHolder(null));
    return () => { live = false; };
  }, [vesselId, role, state === 'saved']);
  if (roles.length === 0) return null;
  const vesselTag = vessels.find((v) => v.id === vesselId)?.tag ?? '';
  const already = holder?.id === instrument.id;
  const fit = async () => {
    if (!vesselId) {
      setState('refused');
      setMessage(`vessel: choose one of the ${vessels.length} vessels in the inventory.`);
      return;
    }
    if (reason.length > 500) {
      setState('refused');
      setMessage(`reason: ${reason.length} characters; allowed 0 to 500.`);
      return;
    }
    setState('saving');
    try {
      const why = reason.trim() || (holder ? `swapped for ${holder.tag}` : 'fitted');
      await registerRepo.fitInstrument(vesselId, role, instrument.id, why);
      setState('saved');
      setMessage(holder ? `${instrument.tag} now takes the ${ROLE_WORDS[role]?.toLowerCase()} place of ${vesselTag}; ${holder.tag} keeps its history in the register.` : `${instrument.tag} fitted to ${vesselTag}.`);
      setReason('');
      onSaved();
    } catch (e) {
      setState('failed');
      setMessage(`Not saved: ${repo.storageMessage(e)}`);
    }
  };
  return (
    <section class="panel" aria-labelledby="fitp-h" data-fit-state={state} data-place-holder={holder === undefined ? '' : holder?.tag ?? 'none'}>
      <h2 id="fitp-h">Fit or swap</h2>
      <SelectField id="fit-vessel" label="Vessel" value={vesselId}
        options={[{ id: '', label: 'Choose a vessel' }, ...vessels.map((v) => ({ id: v.id, label: v.tag }))]} onChange={(v) => { setVesselId(v); setState('idle'); }} />
      {roles.length > 1 ? <SelectField id="fit-role" label="Place" value={role} options={roles.map((r) => ({ id: r, label: ROLE_WORDS[r] ?? r }))} onChange={(r) => { setRole(r); setState('idle'); }} /> : null}
      {vesselId && holder !== undefined ? (
        <p>{already ? `${instrument.tag} already holds this place.` : holder ? `Now fitted there: ${holder.tag}. Fitting this one is a swap: ${holder.tag} stays in the register with its calibrations, and the vessel keeps the record of both.` : 'Nothing is fitted in this place now.'}</p>
      ) : null}
      <TextField id="fit-reason" label="Why (optional)" value={reason} onInput={setReason} />
      <div class="row field">
        <button type="button" class="primary" disabled={state === 'saving' || already} onClick={() => void fit()}>
          {holder && !already ? `Swap in for ${holder.tag}` : 'Fit to this vessel'}
        </button>
      </div>
      {message ? <p role="status" class={state === 'saved' ? '' : 'field-error'}>{message}</p> : null}
    </section>
  );
}
