// The filter form: vessel, period, verdict, outcome, technician and device. Every change
// applies at once (text fields when they are left or Enter is pressed).
import type { VesselRecord } from '../../store/index.ts';
import { EMPTY_FORM, monthOfForm, withMonth, type FilterForm } from './review-filter.ts';
import { OUTCOMES, VERDICTS, outcomeLabel } from './record-facts.ts';

interface Props {
  form: FilterForm;
  vessels: readonly VesselRecord[];
  error: { field: keyof FilterForm; message: string } | null;
  onChange(next: FilterForm): void;
}

export function ReviewFilters({ form, vessels, error, onChange }: Props) {
  const set = (key: keyof FilterForm) => (e: Event) => onChange({ ...form, [key]: (e.currentTarget as HTMLInputElement).value });
  const setMonth = (e: Event) => onChange(withMonth(form, (e.currentTarget as HTMLInputElement).value));
  const invalid = (key: keyof FilterForm) => (error?.field === key ? { 'aria-invalid': true, 'aria-describedby': 'review-filter-error' } : {});
  return (
    <form class="panel review-filters" aria-labelledby="review-filter-title" onSubmit={(e) => e.preventDefault()}>
      <h2 id="review-filter-title">Filter</h2>
      <div class="review-grid">
        <div class="field review-wide">
          <label for="rf-vessel">Vessel</label>
          <select id="rf-vessel" value={form.vesselId} onChange={set('vesselId')}>
            <option value="">All vessels</option>
            {vessels.map((v) => <option key={v.id} value={v.id}>{v.tag}{v.retired ? ' (retired)' : ''}</option>)}
          </select>
        </div>
        <div class="field review-wide">
          <label for="rf-month">Month</label>
          <input id="rf-month" type="month" value={monthOfForm(form)} onChange={setMonth} />
        </div>
        <div class="field">
          <label for="rf-from">From day</label>
          <input id="rf-from" type="date" value={form.from} onChange={set('from')} {...invalid('from')} />
        </div>
        <div class="field">
          <label for="rf-to">To day</label>
          <input id="rf-to" type="date" value={form.to} onChange={set('to')} {...invalid('to')} />
        </div>
        <div class="field">
          <label for="rf-verdict">Verdict</label>
          <select id="rf-verdict" value={form.verdict} onChange={set('verdict')}>
            <option value="">Any verdict</option>
            {VERDICTS.map((v) => <option key={v.id} value={v.id}>{v.label}</option>)}
          </select>
        </div>
        <div class="field">
          <label for="rf-outcome">Outcome</label>
          <select id="rf-outcome" value={form.outcome} onChange={set('outcome')}>
            <option value="">Any</option>
            {OUTCOMES.map((o) => <option key={o} value={o}>{outcomeLabel(o)}</option>)}
          </select>
        </div>
        <div class="field">
          <label for="rf-tech">Technician</label>
          <input id="rf-tech" type="search" value={form.technician} onChange={set('technician')} autocomplete="off" />
        </div>
        <div class="field">
          <label for="rf-device">Device id starts with</label>
          <input id="rf-device" type="search" value={form.device} onChange={set('device')} autocomplete="off" />
        </div>
      </div>
      {error ? <p id="review-filter-error" class="field-error" role="alert">{error.message}</p> : null}
      <button type="button" onClick={() => onChange(EMPTY_FORM)}>Clear filter</button>
    </form>
  );
}
