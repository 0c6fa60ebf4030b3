// ISO 8601 timestamps with an explicit UTC offset. A check is stamped with the offset the device
// had when it was taken, so a supervisor in another zone still sees the technician's wall clock.

/** Matches the form formatIsoWithOffset writes (and the backup accepts): seconds, optional milliseconds, Z or ±hh:mm. */
export const ISO_WITH_OFFSET = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2}):(\d{2})(\.\d{3})?(Z|[+-]\d{2}:\d{2})$/;

function pad(n: number, width = 2): string {
  return String(n).padStart(width, '0');
}

/**
 * Formats `date` as ISO 8601 local time with its UTC offset, e.g. "2026-12-01T22:05:00+01:00".
 * @param date any valid Date
 * @param offsetMinutes minutes east of UTC, −840 to +840; defaults to the runtime's offset at `date`
 *   (note the sign: Date#getTimezoneOffset counts minutes west)
 * @param withMilliseconds append ".sss" (default false)
 * @throws RangeError for an invalid Date or offset
 */
export function formatIsoWithOffset(date: Date, offsetMinutes = -date.getTimezoneOffset(), withMilliseconds = false): string {
  const ms = date.getTime();
  if (!Number.isFinite(ms)) throw new RangeError('formatIsoWithOffset: invalid Date');
  if (!Number.isInteger(offsetMinutes) || Math.abs(offsetMinutes) > 840) {
    throw new RangeError(`formatIsoWithOffset: offset ${offsetMinutes} min is outside −840 to +840`);
  }
  // Shift by the offset and read the UTC fields: the runtime's own zone plays no part.
  const local = new Date(ms + offsetMinutes * 60_000);
  const year = local.getUTCFullYear();
  if (year < 0 || year > 9999) throw new RangeError(`formatIsoWithOffset: year ${year} is outside 0000–9999`);
  const sign = offsetMinutes < 0 ? '-' : '+';
  const abs = Math.abs(offsetMinutes);
  return (
    `${pad(year, 4)}-${pad(local.getUTCMonth() + 1)}-${pad(local.getUTCDate())}` +
    `T${pad(local.getUTCHours())}:${pad(local.getUTCMinutes())}:${pad(local.getUTCSeconds())}` +
    (withMilliseconds ? `.${pad(local.getUTCMilliseconds(), 3)}` : '') +
    `${sign}${pad(Math.floor(abs / 60))}:${pad(abs % 60)}`
  );
}

/**
 * Milliseconds since 1970-01-01T00:00:00Z for a string of the ISO_WITH_OFFSET form, or null if
 * it is not of that form or names an impossible date (2026-02-30) or offset (+15:00).
 */
export function parseIsoWithOffset(text: string): number | null {
  const m = ISO_WITH_OFFSET.exec(text);
  if (!m) return null;
  const [, y, mo, d, h, mi, s, frac, zone] = m as unknown as [string, string, string, string, string, string, string, string | undefined, string];
  const year = Number(y), month = Number(mo), day = Number(d), hour = Number(h), minute = Number(mi), second = Number(s);
  if (month < 1 || month > 12 || hour > 23 || minute > 59 || second > 59) return null;
  const daysInMonth = new Date(Date.UTC(year, month, 0)).getUTCDate();
  if (day < 1 || day > daysInMonth) return null;
  let offset = 0;
  if (zone !== 'Z') {
    const oh = Number(zone.slice(1, 3)), om = Number(zone.slice(4, 6));
    if (oh > 14 || om > 59) return null;
    offset = (zone[0] === '-' ? -1 : 1) * (oh * 60 + om);
    if (Math.abs(offset) > 840) return null;
  }
  const utc = Date.UTC(year, month - 1, day, hour, minute, second, frac ? Number(frac.slice(1)) : 0);
  // Date.UTC maps years 0–99 to 1900–1999.
  const fixed = year < 100 ? new Date(utc).setUTCFullYear(year) : utc;
  return fixed - offset * 60_000;
}
