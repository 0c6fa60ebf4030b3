// A small radio group drawn as large side-by-side buttons (gauge / absolute, SI / US ...).
interface Props<T extends string> {
  name: string;
  legend: string;
  value: T;
  options: readonly { id: T; label: string }[];
  onChange: (value: T) => void;
}

export function Choice<T extends string>({ name, legend, value, options, onChange }: Props<T>) {
  return (
    <fieldset>
      <legend>{legend}</legend>
      <div class="switch">
        {options.map((o) => (
          <label key={o.id}>
            <input type="radio" name={name} value={o.id} checked={o.id === value} onChange={() => onChange(o.id)} />
            {o.label}
          </label>
        ))}
      </div>
    </fieldset>
  );
}
