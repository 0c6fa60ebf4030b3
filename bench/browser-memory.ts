// Peak resident memory of one headless browser's processes, read from /proc (Linux): VmHWM, the
// most each process has held since it started, grouped by Chromium's process type (the browser
// process, where the IndexedDB backend runs; renderers, which run the page and its dedicated
// workers; utility processes).
import { readFileSync, readdirSync } from 'node:fs';

/** Peak resident kB per process type of the browser whose profile is `profileDir`, and the largest single renderer's. */
export function browserPeakKb(profileDir: string): { byType: Record<string, number>; largestRendererKb: number } {
  const parent = new Map<number, number>();
  const info = new Map<number, { type: string; hwmKb: number }>();
  let root = -1;
  for (const pid of readdirSync('/proc').filter((d) => /^\d+$/.test(d))) {
    try {
      const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
      parent.set(Number(pid), Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[1]));
      const cmd = readFileSync(`/proc/${pid}/cmdline`, 'utf8');
      const hwm = /VmHWM:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
      const type = /--type=([a-z-]+)/.exec(cmd)?.[1] ?? 'browser';
      info.set(Number(pid), { type, hwmKb: hwm ? Number(hwm[1]) : 0 });
      if (root < 0 && cmd.includes(`--user-data-dir=${profileDir}`) && !cmd.includes('--type=')) root = Number(pid);
    } catch {
      // The process ended while being read.
    }
  }
  const byType: Record<string, number> = {};
  let largestRendererKb = 0;
  for (const [pid, p] of info) {
    for (let q: number | undefined = pid; q !== undefined && q > 1; q = parent.get(q)) {
      if (q !== root) continue;
      byType[p.type] = (byType[p.type] ?? 0) + p.hwmKb;
      if (p.type === 'renderer') largestRendererKb = Math.max(largestRendererKb, p.hwmKb);
      break;
    }
  }
  return { byType, largestRendererKb };
}
