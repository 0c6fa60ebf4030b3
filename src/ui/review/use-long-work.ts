// One long job at a time (export, import, verification): its progress, and a cancel that aborts it.
import { useEffect, useRef, useState } from 'preact/hooks';
import type { LongWorkOptions } from '../../store/index.ts';

export interface LongWork {
  running: string | null;
  done: number;
  total: number;
  /** Starts `job` under `label` unless one is running; resolves with its result (or undefined). */
  run<T>(label: string, job: (options: LongWorkOptions) => Promise<T>): Promise<T | undefined>;
  cancel(): void;
}

export function useLongWork(): LongWork {
  const [running, setRunning] = useState<string | null>(null);
  const [progress, setProgress] = useState({ done: 0, total: 0 });
  const controller = useRef<AbortController | null>(null);
  useEffect(() => () => controller.current?.abort(), []);
  return {
    running,
    done: progress.done,
    total: progress.total,
    async run(label, job) {
      if (controller.current) return undefined;
      const c = new AbortController();
      controller.current = c;
      setRunning(label);
      setProgress({ done: 0, total: 0 });
      const start = performance.now();
      try {
        return await job({ signal: c.signal, onProgress: (done, total) => setProgress({ done, total }) });
      } finally {
        // A User Timing entry per job ("tankside: Importing the backup"), for profilers and the benchmark.
        performance.measure(`tankside: ${label}`, { start });
        controller.current = null;
        setRunning(null);
      }
    },
    cancel() {
      controller.current?.abort();
    },
  };
}
