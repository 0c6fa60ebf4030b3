// The full JSON backup ("tankside-backup", formatVersion 1; see BACKUP-FORMAT.md): export,
// validation and all-or-nothing import-and-merge.
import { StoreError } from './errors.ts';
import type { ChainStatus } from './integrity.ts';
import type { LongWorkOptions } from './records.ts';

/** What importBackup did, record by record. Nothing is written unless the file passes validation. */
export interface ImportReport {
  vessels: { added: string[]; updated: string[]; skipped: { id: string; why: string }[] };
  checks: {
    added: string[];
    skipped: { id: string; why: string }[];
    rejected: { id: string; why: string }[];
  };
  /** Chain status per device after the merge, over the records now in the store. */
  chains: ChainStatus[];
}

/**
 * Exports every vessel and check as a "tankside-backup" formatVersion 1 document (JSON text).
 * Deterministic: the same store content gives the same text apart from `exportedAt`.
 * @throws StoreError('cancelled') if options.signal aborts
 */
export async function exportBackup(_options: LongWorkOptions = {}): Promise<string> {
  throw new StoreError('write-failed', 'exportBackup is not implemented yet');
}

/**
 * Validates a backup completely, then merges it in one transaction (all or nothing).
 * @throws StoreError('invalid-backup') naming the first bad field, with nothing written;
 *   ('cancelled' | 'quota-exceeded' | 'write-failed') with nothing written
 */
export async function importBackup(_text: string, _options: LongWorkOptions = {}): Promise<ImportReport> {
  throw new StoreError('write-failed', 'importBackup is not implemented yet');
}
