// The vessel editor's check interval: typed as a number of hours, days or weeks, stored in seconds,
// blank for none. The range is the core's (check-due.ts); the message names the field and the range.
import { CHECK_INTERVAL_MAX_S, CHECK_INTERVAL_MIN_S, InputError, parseDecimal } from '../../core/basics.ts';

export type IntervalUnit = 'hours' | 'days' | 'weeks';
export const INTERVAL_UNITS: readonly { id: IntervalUnit; label: string }[] = [
  { id: 'hours', label: 'hours' }, { id: 'days', label: 'days' }, { id: 'weeks', label: 'weeks' },
];
const SECONDS: Readonly<Record<IntervalUnit, number>> = { hours: 3_600, days: 86_400, weeks: 604_800 };

/** The editor's text and unit for a stored interval (none: blank, in days). */
export function intervalForm(intervalS: number | null | undefined): { text: string; unit: IntervalUnit } {
  if (intervalS === null || intervalS === undefined) return { text: '', unit: 'days' };
  const unit: IntervalUnit = intervalS % SECONDS.weeks === 0 ? 'weeks' : intervalS % SECONDS.days === 0 ? 'days' : 'hours';
  return { text: String(Math.round((intervalS / SECONDS[unit]) * 1000) / 1000), unit };
}

/** The interval typed, in seconds (null when blank), or the message to show under the field. */
export function readInterval(text: string, unit: IntervalUnit): { ok: true; intervalS: number | null } | { ok: false; message: string } {
  if (text.trim() === '') return { ok: true, intervalS: null };
  const range = `from 1 hour to ${CHECK_INTERVAL_MAX_S / SECONDS.days} days (${Math.round(CHECK_INTERVAL_MAX_S / SECONDS.weeks * 10) / 10} weeks); leave it blank for none`;
  try {
    const intervalS = Math.round(parseDecimal(text, 'check interval') * SECONDS[unit]);
    if (intervalS < CHECK_INTERVAL_MIN_S || intervalS > CHECK_INTERVAL_MAX_S) return { ok: false, message: `Check interval: ${text.trim()} ${unit} is outside the range, ${range}.` };
    return { ok: true, intervalS };
  } catch (e) {
    if (e instanceof InputError) return { ok: false, message: `Check interval: "${text.trim()}" is not a number; give one ${range}.` };
    throw e;
  }
}

/** "every 7 days", "every 8 hours". */
export function intervalText(intervalS: number): string {
  const { text, unit } = intervalForm(intervalS);
  return `every ${text} ${text === '1' ? unit.slice(0, -1) : unit}`;
}
