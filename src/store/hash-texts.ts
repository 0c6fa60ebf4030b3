// SHA-256 of many texts for the long jobs (verifying the stored log, hashing an import), computed
// on this thread with sha256OfText: about 6 µs per 1 KB record where WebCrypto's digest costs 9–11
// µs with hundreds in flight (bench/sha256.bench-run.ts), and the same digests
// (test/store/sha256.test.ts checks them against WebCrypto and Node's crypto). A record's own
// hash, when it is saved, is still WebCrypto's (integrity.ts). Kept apart from integrity.ts so the
// hash code loads with the long jobs, not at start-up.
import { breathe, throwIfAborted } from './integrity.ts';
import { sha256OfText } from './sha256.ts';

/** Texts hashed between turns given to the page and checks for a cancel. */
const GROUP = 256;

/**
 * SHA-256 hex of `count` texts, in order, `textAt(i)` built just before it is hashed. Gives the
 * page a turn every 40 ms or so (integrity.ts `breathe`), so it paints progress and hears a cancel.
 * `onProgress(done)` follows each group.
 * @throws StoreError('cancelled') if `signal` aborts (checked before each group); nothing is returned
 */
export async function hashTexts(
  count: number,
  textAt: (i: number) => string,
  options: { signal?: AbortSignal | undefined; onProgress?: ((done: number) => void) | undefined } = {},
): Promise<string[]> {
  const hashes = new Array<string>(count);
  for (let start = 0; start < count; start += GROUP) {
    await breathe();
    throwIfAborted(options.signal);
    const end = Math.min(count, start + GROUP);
    for (let i = start; i < end; i += 1) hashes[i] = sha256OfText(textAt(i));
    options.onProgress?.(end);
  }
  return hashes;
}

/** The hashing worker, made on first use; null where workers are missing or refused (then this thread hashes). */
let worker: Worker | null | undefined;
let asked = 0;
const waiting = new Map<number, (hashes: string[]) => void>();

function hashWorker(): Worker | null {
  if (worker !== undefined) return worker;
  try {
    worker = typeof Worker === 'undefined' ? null : new Worker(new URL('./hash-worker.ts', import.meta.url));
  } catch {
    worker = null;
  }
  if (worker) {
    worker.onmessage = (e: MessageEvent<{ id: number; hashes: string[] }>) => {
      waiting.get(e.data.id)?.(e.data.hashes);
      waiting.delete(e.data.id);
    };
    worker.onerror = () => {
      // A worker that fails (not loadable offline, say) is not asked again; what it held is hashed here.
      const lost = worker;
      worker = null;
      lost?.terminate();
      for (const done of waiting.values()) done([]);
      waiting.clear();
    };
  }
  return worker;
}

/**
 * SHA-256 hex of each text, on the hashing worker when there is one (another core), else on this
 * thread in groups with turns for the page (hashTexts). Same digests either way.
 */
export async function hashTextsAside(texts: string[]): Promise<string[]> {
  const w = hashWorker();
  if (w) {
    const id = (asked += 1);
    const hashes = await new Promise<string[]>((resolve) => {
      waiting.set(id, resolve);
      w.postMessage({ id, texts });
    });
    if (hashes.length === texts.length) return hashes;
  }
  return hashTexts(texts.length, (i) => texts[i]!);
}
