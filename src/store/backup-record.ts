// Recording that the log left the device whole (a backup export, a plant-wide consolidation), for
// the storage panel and the backup reminder (settings.ts backupState reads it). Apart from
// settings.ts so the code that writes it loads with the long jobs, not at start-up.
import { getDb } from './connection.ts';
import { storeErrorFromWrite } from './errors.ts';
import type { IsoDateTime } from './records.ts';
import { SETTING_LAST_BACKUP } from './schema.ts';
import { backupStateIn, type BackupState } from './settings.ts';

const STRICT = { durability: 'strict' } as const;

/**
 * Records that the log was exported whole ('export', backup.ts does it when a backup is made) or
 * consolidated ('consolidation'), at `at`.
 * @throws StoreError('quota-exceeded' | 'write-failed')
 */
export async function recordBackup(kind: 'export' | 'consolidation', at: IsoDateTime): Promise<void> {
  const db = await getDb();
  const tx = db.transaction('settings', 'readwrite', STRICT);
  const write = async () => {
    const now = await backupStateIn(tx.store.get(SETTING_LAST_BACKUP));
    const next: BackupState = kind === 'export' ? { ...now, exportedAt: at } : { ...now, consolidatedAt: at };
    await tx.store.put({ ...next }, SETTING_LAST_BACKUP);
  };
  try {
    await Promise.all([write(), tx.done]);
  } catch (error) {
    throw storeErrorFromWrite(error, 'Recording the backup');
  }
}

