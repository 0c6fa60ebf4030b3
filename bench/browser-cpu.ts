// CPU seconds of one headless browser and all its child processes, read from /proc (Linux).
// On a shared machine wall time depends on what else runs; this counts only the browser's own work
// (the browser process, where Chromium's IndexedDB backend runs, its utility processes, the renderers).
import { readFileSync, readdirSync } from 'node:fs';

/** CPU seconds so far of the browser whose profile is `profileDir` and all its child processes (Linux /proc). */
export function browserCpuS(profileDir: string): number {
  return browserCpuSplit(profileDir).total;
}

/**
 * As browserCpuS, and how much of it the renderers used (the page's thread and its workers; the
 * rest is the browser process, where IndexedDB's backend runs, and the utility processes).
 */
export function browserCpuSplit(profileDir: string): { total: number; renderers: number } {
  const renderer = new Set<number>();
  const parent = new Map<number, number>();
  const ticks = new Map<number, number>();
  let root = -1;
  for (const pid of readdirSync('/proc').filter((d) => /^\d+$/.test(d))) {
    try {
      const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
      const f = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
      parent.set(Number(pid), Number(f[1]));
      ticks.set(Number(pid), Number(f[11]) + Number(f[12]));
      const cmd = readFileSync(`/proc/${pid}/cmdline`, 'utf8');
      if (root < 0 && cmd.includes(`--user-data-dir=${profileDir}`) && !cmd.includes('--type=')) root = Number(pid);
      if (cmd.includes('--type=renderer')) renderer.add(Number(pid));
    } catch {
      // The process ended while being read.
    }
  }
  let total = 0;
  let renderers = 0;
  for (const [pid, t] of ticks) {
    for (let p: number | undefined = pid; p !== undefined && p > 1; p = parent.get(p)) {
      if (p === root) {
        total += t;
        if (renderer.has(pid)) renderers += t;
        break;
      }
    }
  }
  return { total: total / 100, renderers: renderers / 100 }; // USER_HZ
}
