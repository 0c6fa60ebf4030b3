// Cautions with their ISO 3864 / ANSI Z535 signal words, most severe first.
import type { StoredCaution as Caution } from '../../store/index.ts';

const STANDING_RULE = 'standing-note';
const ORDER = { DANGER: 0, WARNING: 1, CAUTION: 2, NOTICE: 3 } as const;

export function CautionList({ cautions, label = 'Cautions', empty = 'No cautions apply to these inputs.' }: { cautions: readonly Caution[]; label?: string; empty?: string }) {
  // The standing note is shown on its own beside every result.
  const sorted = cautions.filter((c) => c.rule !== STANDING_RULE).sort((a, b) => ORDER[a.signal] - ORDER[b.signal]);
  if (sorted.length === 0) return <p>{empty}</p>;
  return (
    <ul class="cautions" aria-label={label}>
      {sorted.map((c) => (
        <li key={`${c.rule}:${c.message}`}>
          <span class="caution-text">
            <span class={`signal signal-${c.signal}`}>{c.signal}</span>
            {c.message}
          </span>
        </li>
      ))}
    </ul>
  );
}
