// The overview's filter: start of the tag, latest outcome, and what needs attention.
import { TextField } from '../components/TextField.tsx';
import { SelectField } from '../components/SelectField.tsx';
import { OUTCOMES, outcomeLabel } from '../review/record-facts.ts';
import type { OverviewFilter } from './overview-rows.ts';

const OUTCOME_OPTIONS = [
  { id: '', label: 'Any' },
  ...OUTCOMES.map((o) => ({ id: o, label: outcomeLabel(o) })),
  { id: 'not-checked', label: 'no check on record' },
] as const;
const ATTENTION = [
  { id: '', label: 'Every vessel' },
  { id: 'flagged', label: 'Flagged: a finding not yet cleared' },
  { id: 'due', label: 'Overdue or due today' },
] as const;

export function OverviewFilters({ filter, onChange }: { filter: OverviewFilter; onChange(f: OverviewFilter): void }) {
  return (
    <div class="overview-filters" role="group" aria-label="Filter the vessels">
      <TextField id="ov-tag" label="Tag starts with" search value={filter.tag} onInput={(tag) => onChange({ ...filter, tag })} />
      <SelectField id="ov-outcome" label="Latest outcome" value={filter.outcome} options={OUTCOME_OPTIONS}
        onChange={(outcome) => onChange({ ...filter, outcome })} />
      <SelectField id="ov-attention" label="Show" value={filter.attention} options={ATTENTION}
        onChange={(attention) => onChange({ ...filter, attention })} />
    </div>
  );
}
