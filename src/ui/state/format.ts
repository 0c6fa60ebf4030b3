// Display formatting only: numbers for people, never fed back into a calculation.

import { formatNumber as coreFormat } from '../../core/index.ts';

/** A number to `significant` digits for display; a non-finite value shows as a dash. */
export function formatNumber(value: number, significant = 4): string {
  return coreFormat(value, { significant });
}

/** A value with its ± band, e.g. "412.3 ± 1.2". */
export function formatWithBand(value: number, band: number, significant = 4): string {
  return `${formatNumber(value, significant)} ± ${formatNumber(Math.abs(band), 2)}`;
}

/** ISO 8601 local time with offset, e.g. 2026-12-01T14:05:00+01:00 (the form the log stores). */
export function isoWithOffset(date: Date): string {
  const pad = (n: number) => String(Math.trunc(Math.abs(n))).padStart(2, '0');
  const offsetMin = -date.getTimezoneOffset();
  const sign = offsetMin >= 0 ? '+' : '-';
  return (
    `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}` +
    `T${pad(date.getHours())}:${pad(date.getMinutes())}:${pad(date.getSeconds())}` +
    `${sign}${pad(offsetMin / 60)}:${pad(offsetMin % 60)}`
  );
}

/** A stored ISO 8601 time shown briefly, e.g. "2026-12-01 14:05". */
export function shortTime(iso: string): string {
  return iso.slice(0, 16).replace('T', ' ');
}
