// What the Settings storage panel and the Log screen's backup reminder show: whether the browser
// keeps the data, how much is used, when the log last left the device whole, and whether it is
// time to say so.
import * as repo from './repo.ts';
import { BACKUP_REMINDER, type AppSettings } from './settings-model.ts';

export interface StorageFacts {
  persistence: string;
  /** e.g. "2.4 MB used of 1,024 MB the browser offers"; null where the browser does not say. */
  usage: string | null;
  /** The last backup export or consolidation, ISO 8601, whichever is later; null if never. */
  lastBackup: string | null;
  /** Which it was. */
  lastBackupKind: 'export' | 'consolidation' | null;
}

const MB = 1_000_000;

function megabytes(bytes: number): string {
  return `${(bytes / MB).toLocaleString('en-GB', { maximumFractionDigits: bytes < 10 * MB ? 1 : 0 })} MB`;
}

/** The facts, read from the store and the browser. `legacyBackup` is the time older versions kept in the app settings. */
export async function storageFacts(legacyBackup: string | undefined): Promise<StorageFacts> {
  const [persistence, use, state] = await Promise.all([repo.persistenceLabel(), repo.storageUsage(), repo.backupState()]);
  const usage = use.usageBytes === null ? null : `${megabytes(use.usageBytes)} used${use.quotaBytes === null ? '' : ` of ${megabytes(use.quotaBytes)} the browser offers`}`;
  const candidates: [string, 'export' | 'consolidation'][] = [];
  if (state.exportedAt) candidates.push([state.exportedAt, 'export']);
  if (legacyBackup) candidates.push([legacyBackup, 'export']);
  if (state.consolidatedAt) candidates.push([state.consolidatedAt, 'consolidation']);
  candidates.sort((a, b) => Date.parse(b[0]) - Date.parse(a[0]));
  const [latest] = candidates;
  return { persistence, usage, lastBackup: latest?.[0] ?? null, lastBackupKind: latest?.[1] ?? null };
}

/** The days after which the reminder shows, as the settings hold them (the default when unset). */
export function reminderDays(s: AppSettings): number {
  return s.backupReminderDays ?? BACKUP_REMINDER.defaultDays;
}

/**
 * Reads the reminder field as typed: whole days within the range, or a message naming the field and the range.
 */
export function readReminderDays(text: string): { days: number } | { error: string } {
  const t = text.trim();
  const n = /^\d{1,3}$/.test(t) ? Number(t) : NaN;
  if (!Number.isInteger(n) || n < BACKUP_REMINDER.minDays || n > BACKUP_REMINDER.maxDays) {
    return { error: `Backup reminder: "${t}" is not a whole number of days from ${BACKUP_REMINDER.minDays} to ${BACKUP_REMINDER.maxDays}.` };
  }
  return { days: n };
}

/**
 * Whether to remind: some checks are saved and the log never left the device, or last left it
 * `days` or more days before `now`. Returns how many whole days it has been (null: never).
 */
export function backupReminder(lastBackup: string | null, hasChecks: boolean, days: number, now: Date): { due: boolean; daysSince: number | null } {
  if (!hasChecks) return { due: false, daysSince: null };
  if (lastBackup === null) return { due: true, daysSince: null };
  const since = Math.floor((now.getTime() - Date.parse(lastBackup)) / 86_400_000);
  return { due: since >= days, daysSince: since };
}
