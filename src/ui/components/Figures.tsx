// A list of labelled figures (label: value with unit).
import type { Figure } from '../state/result-view.ts';

export function Figures({ figures }: { figures: readonly Figure[] }) {
  if (figures.length === 0) return null;
  return (
    <dl class="figures">
      {figures.map((f) => [<dt key={`${f.label}-t`}>{f.label}</dt>, <dd key={`${f.label}-d`}>{f.value}</dd>])}
    </dl>
  );
}
