// The supervisor's filter over the check log, and how its form fields read into it. Dates are the
// reviewing device's local calendar days (a supervisor asks "what happened on the 3rd, here").
import type { Outcome, VerdictId } from './record-facts.ts';

export interface ReviewFilter {
  vesselId: string | null;
  /** Inclusive bounds, ms since 1970-01-01T00:00:00Z; null = open. */
  fromMs: number | null;
  toMs: number | null;
  verdict: VerdictId | null;
  /** The outcome (worst signal word among the findings, or 'none'). */
  outcome: Outcome | null;
  /** Part of the technician's name, any case; '' = any. */
  technician: string;
  /** The start of a device id, any case; '' = any. */
  device: string;
}

export const NO_FILTER: ReviewFilter = {
  vesselId: null, fromMs: null, toMs: null, verdict: null, outcome: null, technician: '', device: '',
};

const DAY = /^(\d{4})-(\d{2})-(\d{2})$/;
const MONTH = /^(\d{4})-(\d{2})$/;

/** Local midnight at the start of a "YYYY-MM-DD" day, or null for '' / a malformed day. */
export function dayStartMs(text: string): number | null {
  const m = DAY.exec(text);
  if (!m) return null;
  const d = new Date(Number(m[1]), Number(m[2]) - 1, Number(m[3]));
  return d.getDate() === Number(m[3]) ? d.getTime() : null;
}

/** The last millisecond of a "YYYY-MM-DD" local day, or null. */
export function dayEndMs(text: string): number | null {
  const start = dayStartMs(text);
  if (start === null) return null;
  const d = new Date(start);
  return new Date(d.getFullYear(), d.getMonth(), d.getDate() + 1).getTime() - 1;
}

/** First and last day ("YYYY-MM-DD") of a "YYYY-MM" month, or null. */
export function monthDays(text: string): { from: string; to: string } | null {
  const m = MONTH.exec(text);
  if (!m) return null;
  const month = Number(m[2]);
  if (month < 1 || month > 12) return null;
  const last = new Date(Number(m[1]), month, 0).getDate();
  return { from: `${m[1]}-${m[2]}-01`, to: `${m[1]}-${m[2]}-${String(last).padStart(2, '0')}` };
}

/** The form as typed: every value a string, as the inputs hold them. */
export interface FilterForm {
  vesselId: string;
  from: string;
  to: string;
  verdict: string;
  outcome: string;
  technician: string;
  device: string;
}

export const EMPTY_FORM: FilterForm = { vesselId: '', from: '', to: '', verdict: '', outcome: '', technician: '', device: '' };

export type FilterReading = { ok: true; filter: ReviewFilter } | { ok: false; field: keyof FilterForm; message: string };

/** Reads the form into a filter, or names the field that cannot be read. */
export function readFilterForm(form: FilterForm, verdicts: readonly string[], outcomes: readonly string[]): FilterReading {
  const fromMs = form.from === '' ? null : dayStartMs(form.from);
  if (form.from !== '' && fromMs === null) return { ok: false, field: 'from', message: 'From: expected a date, e.g. 2026-12-01.' };
  const toMs = form.to === '' ? null : dayEndMs(form.to);
  if (form.to !== '' && toMs === null) return { ok: false, field: 'to', message: 'To: expected a date, e.g. 2026-12-31.' };
  if (fromMs !== null && toMs !== null && fromMs > toMs) {
    return { ok: false, field: 'to', message: `To: ${form.to} is before From ${form.from}; pick a later day.` };
  }
  if (form.verdict !== '' && !verdicts.includes(form.verdict)) return { ok: false, field: 'verdict', message: 'Verdict: pick one from the list.' };
  if (form.outcome !== '' && !outcomes.includes(form.outcome)) return { ok: false, field: 'outcome', message: 'Outcome: pick one from the list.' };
  return {
    ok: true,
    filter: {
      vesselId: form.vesselId === '' ? null : form.vesselId,
      fromMs,
      toMs,
      verdict: form.verdict === '' ? null : (form.verdict as VerdictId),
      outcome: form.outcome === '' ? null : (form.outcome as Outcome),
      technician: form.technician,
      device: form.device,
    },
  };
}

/** The "YYYY-MM" month the form's from/to cover exactly, or '' when they are not one whole month. */
export function monthOfForm(form: FilterForm): string {
  const month = form.from.slice(0, 7);
  const days = monthDays(month);
  return days && days.from === form.from && days.to === form.to ? month : '';
}

/** The form with from/to set to a whole "YYYY-MM" month ('' clears both). */
export function withMonth(form: FilterForm, month: string): FilterForm {
  const days = monthDays(month);
  return { ...form, from: days?.from ?? '', to: days?.to ?? '' };
}
