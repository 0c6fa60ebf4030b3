// The page's side of the log workers (log-worker.ts): the store's devices shared between at most
// two workers, whole devices each with about the same number of blocks (a device's records are
// read in order by one worker), their messages relayed, Cancel heard. Where no worker can be made
// (Node, a refused worker) or one fails, the caller does the job on this thread instead.
import type { IDBPDatabase } from 'idb';
import { storeName } from './connection.ts';
import { throwIfAborted, type ChainStatus } from './integrity.ts';
import type { BlockRows, LogJob } from './log-worker.ts';
import type { TanksideDB } from './schema.ts';
import type { Signed } from './verify-pages.ts';

/** Workers at most: a small phone has two cores, and this thread has little left to do. */
const LOG_WORKERS = 2;
/** Blocks per page a worker reads (about 100 records each). */
const WORKER_PAGE = 40;

/** What a worker says when it has finished its devices. */
export interface WorkerDone {
  type: 'done';
  chains?: ChainStatus[];
  signed?: [string, Signed][];
}

/** A worker's messages before it finishes. */
export type WorkerNews = { type: 'progress'; done: number } | { type: 'rows'; blocks: BlockRows[] };

type Key = [deviceId: string, firstSeq: number];

/** Block key ranges of whole devices, at most LOG_WORKERS of them, each about the same number of blocks (keys ascending). */
export function deviceGroups(keys: readonly Key[]): [lower: Key, upper: Key][] {
  const groups: [Key, Key][] = [];
  let start = 0;
  for (let i = 0; i < keys.length; i += 1) {
    const last = i === keys.length - 1;
    const deviceEnds = last || keys[i + 1]![0] !== keys[i]![0];
    if (deviceEnds && (last || (groups.length < LOG_WORKERS - 1 && i + 1 >= (keys.length * (groups.length + 1)) / LOG_WORKERS))) {
      groups.push([keys[start]!, keys[i]!]);
      start = i + 1;
    }
  }
  return groups;
}

/**
 * Runs `job` on the log workers over every block of the store. `hear(news, group)` gets each
 * worker's progress and rows as they come; it returns 'stop' to end every worker (the caller then
 * does the job another way). Resolves with each group's last word, in group order; null when no
 * worker could be made, one failed, or `hear` stopped them.
 * @throws StoreError('cancelled') if `signal` aborts (the workers are ended)
 */
export async function onLogWorkers(
  db: IDBPDatabase<TanksideDB>, job: LogJob['job'], signal: AbortSignal | undefined,
  hear: (news: WorkerNews, group: number) => 'stop' | void,
): Promise<WorkerDone[] | null> {
  if (typeof Worker === 'undefined') return null;
  const groups = deviceGroups(await db.getAllKeys('logBlocks'));
  if (groups.length === 0) return null;
  const workers: Worker[] = [];
  let stopped = false;
  let cancel: () => void = () => {};
  const cancelled = new Promise<never>((_, reject) => {
    cancel = () => reject(new Error('cancelled'));
  });
  cancelled.catch(() => {});
  signal?.addEventListener('abort', cancel, { once: true });
  try {
    const finished = Promise.all(groups.map(([lower, upper], g) => new Promise<WorkerDone | null>((resolve) => {
      let w: Worker;
      try {
        w = new Worker(new URL('./log-worker.ts', import.meta.url));
      } catch {
        resolve(null);
        return;
      }
      workers.push(w);
      w.onmessage = (e: MessageEvent<WorkerNews | WorkerDone | { type: 'failed'; message: string }>) => {
        const m = e.data;
        if (m.type === 'done') resolve(m);
        else if (m.type === 'failed') resolve(null);
        else if (!stopped && hear(m, g) === 'stop') {
          stopped = true;
          resolve(null);
        }
      };
      w.onerror = (e) => {
        e.preventDefault();
        resolve(null);
      };
      const ask: LogJob = { job, dbName: storeName(), lower, upper, page: WORKER_PAGE };
      w.postMessage(ask);
    })));
    const done = await Promise.race([finished, cancelled]).catch(() => null);
    throwIfAborted(signal);
    return done === null || stopped || done.some((d) => d === null) ? null : (done as WorkerDone[]);
  } finally {
    signal?.removeEventListener('abort', cancel);
    for (const w of workers) w.terminate();
  }
}
