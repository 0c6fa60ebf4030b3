// Reaching past the store's functions into its log stores (log-layout.ts), as a person with the
// browser's developer tools could: to read every stored record, to change or delete one in
// place, or to add one the way another tab would. For tests that need a damaged or raced store.
import type { IDBPDatabase } from 'idb';
import { getDb } from '../../src/store/connection.ts';
import { canonicalJson } from '../../src/store/integrity.ts';
import { addToLog, LOG_STORES, seqIndex, type LogBlock } from '../../src/store/log-layout.ts';
import type { CheckRecord } from '../../src/store/records.ts';
import type { TanksideDB } from '../../src/store/schema.ts';

/** Every stored record, in the blocks' order (device, then seq). */
export async function storedChecks(): Promise<CheckRecord[]> {
  const blocks = await (await getDb()).getAll('logBlocks');
  return blocks.flatMap((b) => b.texts.map((t) => JSON.parse(t) as CheckRecord));
}

/** The block holding the check with this id (or filed under this device and seq), and its place in it. */
async function find(db: IDBPDatabase<TanksideDB>, where: string | { deviceId: string; seq: number }): Promise<{ block: LogBlock; at: number }> {
  for (const block of await db.getAll('logBlocks')) {
    const at = typeof where === 'string'
      ? block.texts.findIndex((t) => (JSON.parse(t) as CheckRecord).id === where)
      : block.deviceId === where.deviceId ? seqIndex(block.seqs, where.seq) : -1;
    if (at >= 0) return { block, at };
  }
  throw new Error(`no stored check ${JSON.stringify(where)}`);
}

/**
 * Rewrites the stored text of check `where` (an id, or the device and seq it is filed under) with `change(record)` (its canonical JSON), in place:
 * the block keeps the seq it files the text under. `null` deletes the text and its seq from the
 * block (the month and id entries are left pointing at nothing, as a hand edit would leave them).
 */
export async function editStored(
  where: string | { deviceId: string; seq: number },
  change: (r: CheckRecord) => CheckRecord | null,
): Promise<void> {
  const db = await getDb();
  const { block, at } = await find(db, where);
  const next = change(JSON.parse(block.texts[at]!) as CheckRecord);
  if (next === null) {
    block.texts.splice(at, 1);
    block.seqs.splice(at, 1);
  } else {
    block.texts[at] = canonicalJson(next);
  }
  await db.put('logBlocks', block);
}

/** Stores a record as another tab's save would (no checks beyond the log's own), through `db`. */
export async function addRaw(db: IDBPDatabase<TanksideDB>, record: CheckRecord): Promise<void> {
  const tx = db.transaction(LOG_STORES, 'readwrite');
  await Promise.all([addToLog(tx, [{ record, text: canonicalJson(record) }]), tx.done]);
}

/** Whether the block filing (deviceId, seq) holds a text there. */
export async function isStoredAt(deviceId: string, seq: number): Promise<boolean> {
  const blocks = await (await getDb()).getAll('logBlocks');
  return blocks.some((b) => b.deviceId === deviceId && seqIndex(b.seqs, seq) >= 0);
}
