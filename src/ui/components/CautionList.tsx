// Cautions with their ISO 3864 / ANSI Z535 signal words, most severe first, each once. The
// standing note is shown on its own beside every result, so it is left out here.
import type { StoredCaution as Caution } from '../../store/index.ts';

const STANDING_RULE = 'standing-note';
const ORDER = { DANGER: 0, WARNING: 1, CAUTION: 2, NOTICE: 3 } as const;

interface Props { cautions: readonly Caution[]; empty?: string; label?: string }

export function CautionList({ cautions, empty = 'No cautions apply to these inputs.', label = 'Cautions' }: Props) {
  const seen = new Set<string>();
  const sorted = cautions
    .filter((c) => c.rule !== STANDING_RULE && !seen.has(`${c.rule}:${c.message}`) && seen.add(`${c.rule}:${c.message}`))
    .sort((a, b) => ORDER[a.signal] - ORDER[b.signal]);
  if (sorted.length === 0) return <p>{empty}</p>;
  return (
    <ul class="cautions" aria-label={label}>
      {sorted.map((c) => (
        <li key={`${c.rule}:${c.message}`} data-rule={c.rule}>
          <span class="caution-text">
            <span class={`signal signal-${c.signal}`}>{c.signal}</span>
            {c.message}
          </span>
        </li>
      ))}
    </ul>
  );
}
