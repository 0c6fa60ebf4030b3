// A small radio group drawn as large side-by-side buttons (gauge / absolute, SI / US ...), each a
// full 48 px target with its radio at full size. Re-renders only when its own props change.
import { pure } from './pure.ts';

interface Props<T extends string> {
  name: string;
  legend: string;
  value: T;
  options: readonly { id: T; label: string }[];
  onChange: (value: T) => void;
}

function ChoiceView<T extends string>({ name, legend, value, options, onChange }: Props<T>) {
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

export const Choice = pure(ChoiceView) as <T extends string>(props: Props<T>) => ReturnType<typeof ChoiceView>;
