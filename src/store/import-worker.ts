// The import of a backup file, on a worker: reading the file, parsing and validating it, hashing its
// records, checking signatures, planning and writing the merge, with its own IndexedDB connection.
// The page only passes messages, so it answers taps throughout, and a Cancel is heard even while
// JSON.parse holds this thread: the page ends the worker (import-job.ts), and before the write
// transaction opens the worker asks the page whether it still may.
//
// Messages in: { type: 'start', file, dbName }, then { type: 'write' | 'stop' } (the answer to
// 'may-write' and to 'may-commit') and { type: 'cancel' }. Out: { type: 'progress', done, total },
// { type: 'may-write' } (before the write transaction opens), { type: 'may-commit' } (when only its
// commit is left), { type: 'done', report } or { type: 'failed', error: { code, message, field, refused } }.
import { parseBackupInSteps } from './backup-format.ts';
import { importDocument } from './backup.ts';
import { openStore } from './connection.ts';
import { StoreError } from './errors.ts';

type In = { type: 'start'; file: Blob; dbName: string } | { type: 'write' } | { type: 'stop' } | { type: 'cancel' };

// The DOM lib types `self` as a window; in a dedicated worker it posts to the page that made it.
const scope = globalThis as unknown as { onmessage: ((e: MessageEvent<In>) => void) | null; postMessage(message: unknown): void };

const cancel = new AbortController();
let answer: ((go: boolean) => void) | null = null;

scope.onmessage = (e) => {
  const m = e.data;
  if (m.type === 'start') void run(m.file, m.dbName);
  else if (m.type === 'write' || m.type === 'stop') answer?.(m.type === 'write');
  else if (m.type === 'cancel') {
    cancel.abort();
    answer?.(false);
  }
};

/** Asks the page `question` and waits for its answer ('write' yes, 'stop' or a cancel no). */
async function ask(question: 'may-write' | 'may-commit'): Promise<boolean> {
  if (cancel.signal.aborted) return false;
  const go = await new Promise<boolean>((resolve) => {
    answer = resolve;
    scope.postMessage({ type: question });
  });
  answer = null;
  return go;
}

async function run(file: Blob, dbName: string): Promise<void> {
  try {
    const text = await file.text();
    const doc = await parseBackupInSteps(text, { signal: cancel.signal });
    await openStore({ name: dbName });
    const report = await importDocument(doc, {
      signal: cancel.signal,
      onProgress: (done, total) => scope.postMessage({ type: 'progress', done, total }),
      beforeWrite: async () => {
        if (!(await ask('may-write'))) throw new StoreError('cancelled', 'Import cancelled; nothing was changed.');
      },
      // The page's word on the commit: a Cancel it heard during the write, however late this worker
      // would hear of it, still stops the commit.
      beforeCommit: () => ask('may-commit'),
    });
    scope.postMessage({ type: 'done', report });
  } catch (error) {
    const e = error instanceof StoreError ? error : new StoreError('write-failed', `Importing the backup: ${String(error)}`);
    scope.postMessage({ type: 'failed', error: { code: e.code, message: e.message, field: e.field, refused: e.refused } });
  }
}
