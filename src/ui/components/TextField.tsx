// A labelled text entry (names, tags, notes).
interface Props {
  id: string;
  label: string;
  value: string;
  onInput: (text: string) => void;
  multiline?: boolean;
  search?: boolean;
  error?: string | undefined;
}

export function TextField({ id, label, value, onInput, multiline, search, error }: Props) {
  const invalid = error ? ('true' as const) : undefined;
  const described = error ? `${id}-error` : undefined;
  const onText = (e: { currentTarget: { value: string } }) => onInput(e.currentTarget.value);
  return (
    <div class="field">
      <label for={id}>{label}</label>
      {multiline ? (
        <textarea id={id} value={value} aria-invalid={invalid} aria-describedby={described} onInput={onText} />
      ) : search ? (
        <input id={id} type="search" value={value} aria-invalid={invalid} aria-describedby={described} onInput={onText} />
      ) : (
        <input id={id} type="text" value={value} aria-invalid={invalid} aria-describedby={described} onInput={onText} />
      )}
      {error ? <div id={`${id}-error`} class="field-error">{error}</div> : null}
    </div>
  );
}
