// CSV export of the check log: one row per check, SI units in the header, ISO 8601 times, text
// cells neutralised against spreadsheet formula injection.
import { StoreError } from './errors.ts';
import type { LongWorkOptions } from './records.ts';

/**
 * The whole log (or one vessel's) as CSV text, oldest first.
 * @throws StoreError('cancelled') if options.signal aborts
 */
export async function exportCsv(_options: LongWorkOptions & { vesselId?: string } = {}): Promise<string> {
  throw new StoreError('write-failed', 'exportCsv is not implemented yet');
}
