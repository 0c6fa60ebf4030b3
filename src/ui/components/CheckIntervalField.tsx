// The vessel's check interval: how often the plant wants it checked, blank for none. The Vessels
// screen and the plant overview count from the last check to say what is due today or overdue.
import './vessel-list.css';
import { NumberField } from './NumberField.tsx';
import { INTERVAL_UNITS, type IntervalUnit } from '../state/check-interval.ts';

interface Props {
  text: string;
  unit: IntervalUnit;
  error: string | undefined;
  onChange: (text: string, unit: IntervalUnit) => void;
}

export function CheckIntervalField({ text, unit, error, onChange }: Props) {
  return (
    // Folded unless set or wrong: the usual new vessel still fits on about two phone screens.
    <details class="check-interval" open={text.trim() !== '' || error !== undefined}>
      <summary>Routine checks: {text.trim() === '' ? 'no check interval' : `every ${text.trim()} ${unit}`}</summary>
      <NumberField id="v-check-every" label="Check interval (blank for none)" value={text} error={error}
        unit={unit} units={INTERVAL_UNITS} onInput={(t) => onChange(t, unit)} onUnit={(u) => onChange(text, u as IntervalUnit)}
        hint="Set by the plant's inspection regime and local codes; the app counts from the last check." />
    </details>
  );
}
