// A labelled number entry with an optional unit picker. Numeric keyboard; a decimal comma is
// accepted (the core's parser reads it). The text is kept exactly as typed. `unitNote` says beside
// the field when its unit is not the one the vessel's instrument reads in. Re-renders only when its
// own props change.
import type { ComponentChildren } from 'preact';
import { pure } from './pure.ts';

export interface UnitOption { id: string; label: string }

interface Props {
  id: string;
  label: string;
  value: string;
  onInput: (text: string) => void;
  unit?: string;
  units?: readonly UnitOption[];
  onUnit?: (unit: string) => void;
  error?: string | undefined;
  hint?: ComponentChildren;
  unitNote?: string | undefined;
}

function NumberFieldView({ id, label, value, onInput, unit, units, onUnit, error, hint, unitNote }: Props) {
  const describedBy = [error ? `${id}-error` : '', unitNote ? `${id}-unit-note` : '', hint ? `${id}-hint` : ''].filter(Boolean).join(' ') || undefined;
  const input = (
    <input
      id={id}
      type="text"
      inputMode="decimal"
      autoComplete="off"
      spellcheck={false}
      value={value}
      aria-invalid={error ? 'true' : undefined}
      aria-describedby={describedBy}
      onInput={(e) => onInput(e.currentTarget.value)}
    />
  );
  return (
    <div class="field">
      <label for={id}>{label}</label>
      {units && onUnit ? (
        <div class="field-pair">
          {input}
          <select id={`${id}-unit`} class={unitNote ? 'unit-differs' : undefined} aria-label={`${label}: unit`} value={unit} onChange={(e) => onUnit(e.currentTarget.value)}>
            {units.map((u) => <option key={u.id} value={u.id}>{u.label}</option>)}
          </select>
        </div>
      ) : input}
      {unitNote ? <div id={`${id}-unit-note`} class="unit-note" data-unit-differs="true">{unitNote}</div> : null}
      {hint ? <div id={`${id}-hint`} class="hint">{hint}</div> : null}
      {error ? <div id={`${id}-error`} class="field-error">{error}</div> : null}
    </div>
  );
}

export const NumberField = pure(NumberFieldView);
