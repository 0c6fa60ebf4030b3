// A tiny shared value with subscribers, and the hook that follows it.
import { useEffect, useState } from 'preact/hooks';

export interface Shared<T> {
  get(): T;
  set(next: T): void;
  subscribe(listener: (value: T) => void): () => void;
}

export function shared<T>(initial: T): Shared<T> {
  let value = initial;
  const listeners = new Set<(value: T) => void>();
  return {
    get: () => value,
    set(next) {
      value = next;
      for (const l of listeners) l(value);
    },
    subscribe(listener) {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
  };
}

export function useShared<T>(s: Shared<T>): T {
  const [value, setValue] = useState(s.get);
  useEffect(() => {
    setValue(s.get());
    return s.subscribe(setValue);
  }, [s]);
  return value;
}
