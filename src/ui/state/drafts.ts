// Entries in progress are saved as the person types (debounced), so a reload, a closed tab or an
// accepted update never loses them. flushDrafts() writes whatever is pending and resolves when
// the store has committed it; the update flow calls it before reloading.
import { useEffect, useMemo, useRef, useState } from 'preact/hooks';
import * as repo from './repo.ts';
import { reportSaveError } from './app-state.ts';

const SAVE_DELAY_MS = 250;

const pending = new Map<string, unknown>();
let timer: number | undefined;
let inFlight: Promise<void> = Promise.resolve();

/** Says on the page whether every draft is stored: browser tests wait on it (`data-draft-state`). */
function markDrafts(state: 'pending' | 'saved'): void {
  if (typeof document !== 'undefined') document.documentElement.dataset.draftState = state;
}

function schedule(): void {
  markDrafts('pending');
  if (timer !== undefined) window.clearTimeout(timer);
  timer = window.setTimeout(() => void flushDrafts().catch(() => undefined), SAVE_DELAY_MS);
}

/** Writes every pending draft now; rejects (and keeps them pending) if the store refuses. */
export function flushDrafts(): Promise<void> {
  if (timer !== undefined) window.clearTimeout(timer);
  timer = undefined;
  const batch = [...pending.entries()];
  pending.clear();
  inFlight = inFlight.catch(() => undefined).then(async () => {
    try {
      for (const [key, value] of batch) await repo.saveDraft(key, value);
      if (pending.size === 0) markDrafts('saved');
    } catch (e) {
      for (const [key, value] of batch) if (!pending.has(key)) pending.set(key, value);
      reportSaveError(`Entry in progress not saved: ${repo.storageMessage(e)}`);
      throw e;
    }
  });
  return inFlight;
}

/** Forgets a draft (after its entry was saved for good). */
export async function discardDraft(key: string): Promise<void> {
  pending.delete(key);
  await inFlight.catch(() => undefined);
  await repo.clearDraft(key);
}

// A hidden page may be frozen or closed next; write now rather than after the delay.
if (typeof document !== 'undefined') {
  document.addEventListener('visibilitychange', () => {
    if (document.visibilityState === 'hidden') void flushDrafts().catch(() => undefined);
  });
  window.addEventListener('pagehide', () => void flushDrafts().catch(() => undefined));
}

/**
 * A value kept in a draft: starts from `initial`, is replaced by the stored draft once loaded,
 * and every change is saved. `loaded` is false until the stored draft was read.
 */
export function useDraft<T extends object>(key: string, initial: T): {
  value: T; set: (next: T) => void; update: (change: (current: T) => T) => void; loaded: boolean; reset: () => void;
} {
  const [value, setValue] = useState<T>(initial);
  const [loaded, setLoaded] = useState(false);
  const initialRef = useRef(initial);
  useEffect(() => {
    let live = true;
    void repo.loadDraft<T>(key).then((stored) => {
      if (!live) return;
      if (stored !== undefined && !pending.has(key)) setValue({ ...initialRef.current, ...stored });
      setLoaded(true);
    }, () => live && setLoaded(true));
    return () => { live = false; };
  }, [key]);
  const set = (next: T) => {
    setValue(next);
    pending.set(key, next);
    schedule();
  };
  // Stable across renders, so components handed it re-render only when their own props change.
  const update = useMemo(() => (change: (current: T) => T) => {
    setValue((current) => {
      const next = change(current);
      if (next !== current) {
        pending.set(key, next);
        schedule();
      }
      return next;
    });
  }, [key]);
  const reset = () => {
    setValue(initialRef.current);
    void discardDraft(key);
  };
  return { value, set, update, loaded, reset };
}
