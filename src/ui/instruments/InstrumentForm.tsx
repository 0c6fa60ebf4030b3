// Adds an instrument to the register, or changes what a stored one is: tag, kind, the unit it reads
// in, its range and its class or stated tolerance, a description. A bad field is named with its
// valid range under it and nothing is saved; data-instrument-save says where the save is (tests
// wait on "saved"). An edit can change the kind only within its unit: its calibrations are in it.
import { useState } from 'preact/hooks';
import * as repo from '../state/repo.ts';
import * as registerRepo from '../state/register-repo.ts';
import { TextField } from '../components/TextField.tsx';
import { NumberField } from '../components/NumberField.tsx';
import { SelectField } from '../components/SelectField.tsx';
import { Choice } from '../components/Choice.tsx';
import type { InstrumentRecord } from '../../store/index.ts';
import type { InstrumentKind } from '../../core/instrument/instrument-kind.ts';
import {
  classBasesOf, draftOfInstrument, emptyInstrumentDraft, instrumentFromDraft, kindsFor, unitForKind, unitsOfKind,
  type ClassBasis, type InstrumentDraft, type InstrumentField,
} from '../state/instrument-form.ts';
import { unitLabel } from '../state/unit-labels.ts';
import { KIND_WORDS } from './InstrumentList.tsx';

type SaveState = 'idle' | 'saving' | 'saved' | 'refused' | 'failed';

const BASIS_WORDS: Record<ClassBasis, string> = { 'percent-of-span': '% of span', stated: 'stated ±', 'iec-60751': 'IEC 60751 class' };
const RTD_CLASSES = [{ id: 'AA', label: 'AA' }, { id: 'A', label: 'A' }, { id: 'B', label: 'B' }] as const;

export function InstrumentForm({ existing, onSaved }: { existing?: InstrumentRecord; onSaved: (saved: InstrumentRecord) => void }) {
  const [d, setD] = useState<InstrumentDraft>(() => (existing ? draftOfInstrument(existing) : emptyInstrumentDraft()));
  const [errors, setErrors] = useState<Partial<Record<InstrumentField, string>>>({});
  const [save, setSave] = useState<SaveState>('idle');
  const [message, setMessage] = useState('');
  const edit = (patch: Partial<InstrumentDraft>) => { setD((x) => ({ ...x, ...patch })); setSave('idle'); };
  const setKind = (kind: InstrumentKind) => edit({
    kind, unit: unitForKind(kind, d.unit), classBasis: classBasesOf(kind).includes(d.classBasis) ? d.classBasis : 'percent-of-span',
  });
  const unit = unitLabel(d.unit);
  const submit = async (e: Event) => {
    e.preventDefault();
    const parsed = instrumentFromDraft(d, existing?.spec);
    if (!parsed.ok) {
      setErrors(parsed.errors);
      setSave('refused');
      setMessage('Not saved: see the fields marked below.');
      return;
    }
    setErrors({});
    setSave('saving');
    try {
      const saved = existing
        ? await registerRepo.updateInstrument(existing.id, parsed.instrument)
        : await registerRepo.addInstrument(parsed.instrument);
      setSave('saved');
      setMessage(`${saved.tag} saved.`);
      onSaved(saved);
    } catch (x) {
      setSave('failed');
      setMessage(`Not saved: ${repo.storageMessage(x)}`);
    }
  };
  return (
    <form class="panel" aria-labelledby="instform-h" onSubmit={submit} data-instrument-save={save} noValidate>
      <h2 id="instform-h">{existing ? `What ${existing.tag} is` : 'A new instrument'}</h2>
      {existing ? <p>Saved checks keep the limits they were taken with; the next check uses what is saved here.</p> : null}
      <TextField id="inst-tag" label="Tag" value={d.tag} error={errors.tag} onInput={(tag) => edit({ tag })} />
      <SelectField id="inst-kind" label="Kind" value={d.kind} options={kindsFor(existing?.spec).map((k) => ({ id: k, label: KIND_WORDS[k] ?? k }))} onChange={setKind} />
      {errors.kind ? <p class="field-error">{errors.kind}</p> : null}
      <SelectField id="inst-unit" label="Reads in" value={d.unit} options={unitsOfKind(d.kind)} onChange={(u) => edit({ unit: u })} />
      {errors.unit ? <p class="field-error">{errors.unit}</p> : null}
      <NumberField id="inst-low" label={`Range from (${unit})`} value={d.low} error={errors.low} onInput={(low) => edit({ low })} />
      <NumberField id="inst-high" label={`Range to (${unit})`} value={d.high} error={errors.high} onInput={(high) => edit({ high })} />
      <Choice name="inst-basis" legend="Accuracy given as" value={d.classBasis}
        options={classBasesOf(d.kind).map((b) => ({ id: b, label: BASIS_WORDS[b] }))} onChange={(classBasis) => edit({ classBasis })} />
      {d.classBasis === 'iec-60751'
        ? <Choice name="inst-rtd" legend="IEC 60751 class" value={d.rtdClass} options={RTD_CLASSES} onChange={(rtdClass) => edit({ rtdClass })} />
        : <NumberField id="inst-class" label={d.classBasis === 'stated' ? `Stated tolerance (± ${unit})` : 'Accuracy class (± % of span)'} value={d.classValue} error={errors.classValue} onInput={(classValue) => edit({ classValue })} />}
      {d.classBasis === 'iec-60751' && errors.classValue ? <p class="field-error">{errors.classValue}</p> : null}
      <TextField id="inst-description" label="Description (optional)" value={d.description} error={errors.description} multiline onInput={(description) => edit({ description })} />
      <div class="row field"><button type="submit" class="primary" disabled={save === 'saving'}>{existing ? 'Save changes' : 'Add to the register'}</button></div>
      {message ? <p role="status" class={save === 'saved' ? '' : 'field-error'}>{message}</p> : null}
    </form>
  );
}
