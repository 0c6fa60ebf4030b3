// Entries in progress are written to the store on every change, with no delay: a reload, a closed
// tab or an accepted update straight after a keystroke still finds it (the store asks for the
// commit within the same task; test/e2e/faults.test.ts closes the browser at 0 ms to prove it).
// A draft is a few hundred bytes, so one small transaction per keystroke costs nothing a person
// notices. flushDrafts() resolves once every write issued so far has committed (retrying any that
// failed); the update flow calls it before reloading.
//
// <html data-draft-state="pending" | "saved" | "failed"> says where the writes stand: browser tests wait on it.
import { useEffect, useMemo, useRef, useState } from 'preact/hooks';
import * as repo from './repo.ts';
import { reportSaveError } from './app-state.ts';

/** The latest write issued per key. */
const writing = new Map<string, Promise<void>>();
/** Values whose latest write failed; written again by flushDrafts. */
const failed = new Map<string, unknown>();

function showState(): void {
  if (typeof document === 'undefined') return;
  document.documentElement.dataset['draftState'] = writing.size > 0 ? 'pending' : failed.size > 0 ? 'failed' : 'saved';
}

function write(key: string, value: unknown): Promise<void> {
  failed.delete(key);
  const w: Promise<void> = repo.saveDraft(key, value).then(
    () => {
      if (writing.get(key) === w) writing.delete(key);
      showState();
    },
    (e: unknown) => {
      // Only the latest value matters: an older write that failed is covered by the newer one.
      if (writing.get(key) === w) {
        writing.delete(key);
        failed.set(key, value);
        reportSaveError(`Entry in progress not saved: ${repo.storageMessage(e)}`);
      }
      showState();
      throw e;
    },
  );
  w.catch(() => undefined);
  writing.set(key, w);
  showState();
  return w;
}

/** Resolves once every draft written so far is stored; rejects (keeping it for the next try) if the store refuses one. */
export async function flushDrafts(): Promise<void> {
  for (const [key, value] of [...failed]) void write(key, value);
  await Promise.all([...writing.values()]);
}

/**
 * Waits for the writes already issued for `key` and stops retrying a failed one: call it before a
 * save that deletes the draft in its own transaction (repo.appendCheck), so no older write of the
 * entry can land after it.
 */
export async function settleDraft(key: string): Promise<void> {
  failed.delete(key);
  await writing.get(key)?.catch(() => undefined);
  showState();
}

/** Forgets a draft (the user discarded the entry). */
export async function discardDraft(key: string): Promise<void> {
  await settleDraft(key);
  await repo.clearDraft(key);
}

// A hidden page may be frozen or closed next: try again now whatever failed.
if (typeof document !== 'undefined') {
  document.addEventListener('visibilitychange', () => {
    if (document.visibilityState === 'hidden') void flushDrafts().catch(() => undefined);
  });
}

/**
 * A value kept in a draft: starts from `initial`, is replaced by the stored draft once loaded
 * (unless the person already changed it), and every change is written at once. `loaded` is false
 * until the stored draft was read.
 */
export function useDraft<T extends object>(key: string, initial: T): {
  value: T; set: (next: T) => void; update: (change: (current: T) => T) => void; loaded: boolean; reset: () => void;
} {
  const [value, setValue] = useState<T>(initial);
  const [loaded, setLoaded] = useState(false);
  const initialRef = useRef(initial);
  const touched = useRef(false);
  useEffect(() => {
    let live = true;
    touched.current = false;
    void repo.loadDraft<T>(key).then((stored) => {
      if (!live) return;
      if (stored !== undefined && !touched.current) setValue({ ...initialRef.current, ...stored });
      setLoaded(true);
    }, () => live && setLoaded(true));
    return () => { live = false; };
  }, [key]);
  const set = (next: T) => {
    touched.current = true;
    setValue(next);
    void write(key, next);
  };
  // Stable across renders, so components handed it re-render only when their own props change.
  const update = useMemo(() => (change: (current: T) => T) => {
    touched.current = true;
    setValue((current) => {
      const next = change(current);
      if (next !== current) void write(key, next);
      return next;
    });
  }, [key]);
  const reset = () => {
    touched.current = true;
    setValue(initialRef.current);
    void discardDraft(key);
  };
  return { value, set, update, loaded, reset };
}
