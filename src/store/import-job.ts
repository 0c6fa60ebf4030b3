// The page's side of an import (import-worker.ts does the work): starts the worker, passes its
// progress on, and turns Cancel into the right thing for where the import stands. Until the worker
// asks to write, nothing of the file is in the store, so Cancel ends the worker at once, even in
// the middle of JSON.parse; once it writes, Cancel aborts its one transaction and the worker says
// whether the abort or the commit came first; and when only its commit is left, the worker asks the
// page once more, so a Cancel heard while the write went on is always in time. Where no worker can be made (Node, a refused
// worker), the import runs on this thread instead (importBackup).
import { importBackup, type ImportReport } from './backup.ts';
import { storeName } from './connection.ts';
import { StoreError, type RefusedRecord, type StoreErrorCode } from './errors.ts';
import type { LongWorkOptions } from './records.ts';

type Out =
  | { type: 'progress'; done: number; total: number }
  | { type: 'may-write' }
  | { type: 'may-commit' }
  | { type: 'done'; report: ImportReport }
  | { type: 'failed'; error: { code: StoreErrorCode; message: string; field?: string; refused: RefusedRecord[] } };

const cancelled = () => new StoreError('cancelled', 'Import cancelled; nothing was changed.');

/**
 * Imports a backup file (a File or Blob) as importBackup does, on a worker with its own connection
 * to the database, so the page stays free to answer while a large file is read, parsed, hashed and
 * written. Same report, same errors, same all-or-nothing write.
 * @throws StoreError as importBackup
 */
export function importBackupFile(file: Blob, options: LongWorkOptions = {}): Promise<ImportReport> {
  let worker: Worker | null = null;
  try {
    worker = typeof Worker === 'undefined' ? null : new Worker(new URL('./import-worker.ts', import.meta.url));
  } catch {
    worker = null;
  }
  if (!worker) return file.text().then((text) => importBackup(text, options));
  const w = worker;
  const { signal } = options;
  return new Promise<ImportReport>((resolve, reject) => {
    let writing = false;
    let heard = false;
    const finish = (settle: () => void) => {
      signal?.removeEventListener('abort', onAbort);
      w.terminate();
      settle();
    };
    const onAbort = () => {
      // Before the write nothing is stored: end the worker where it stands. During the write the
      // worker aborts its transaction and reports which came first.
      if (writing) w.postMessage({ type: 'cancel' });
      else finish(() => reject(cancelled()));
    };
    if (signal?.aborted) {
      finish(() => reject(cancelled()));
      return;
    }
    signal?.addEventListener('abort', onAbort);
    w.onmessage = (e: MessageEvent<Out>) => {
      heard = true;
      const m = e.data;
      if (m.type === 'progress') options.onProgress?.(m.done, m.total);
      else if (m.type === 'may-write') {
        // Decided here, on the page's one thread: a Cancel either came before (stop) or is sent after (abort).
        writing = !signal?.aborted;
        w.postMessage({ type: writing ? 'write' : 'stop' });
      } else if (m.type === 'may-commit') {
        // The same for the commit: a Cancel heard while the write went on stops it here.
        w.postMessage({ type: signal?.aborted ? 'stop' : 'write' });
      } else if (m.type === 'done') finish(() => resolve(m.report));
      else {
        const { code, message, field, refused } = m.error;
        finish(() => reject(new StoreError(code, message, field, { refused })));
      }
    };
    w.onerror = (e) => {
      e.preventDefault();
      // A worker that never started (its script not loadable) leaves the import to this thread.
      if (!heard && !writing) {
        signal?.removeEventListener('abort', onAbort);
        w.terminate();
        file.text().then((text) => importBackup(text, options)).then(resolve, reject);
        return;
      }
      finish(() => reject(new StoreError('write-failed', `Importing the backup stopped before it reported (${e.message || 'worker error'}). Its one write either landed whole or not at all: look at the totals.`)));
    };
    w.postMessage({ type: 'start', file, dbName: storeName() });
  });
}
