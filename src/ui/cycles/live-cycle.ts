// A cycle entered live at the chamber: started on a vessel, a reading due every interval (the
// device vibrates where it can and the screen is kept awake while the cycle runs), each reading
// two numbers with the time taken from the clock. The whole entry is a draft, written as it
// changes, so a running cycle survives a reload and carries on from its stored start.
import { useEffect, useState } from 'preact/hooks';
import { readNumber } from '../state/format.ts';
import type { TypedReading } from './cycle-input.ts';

/** A live cycle as the draft keeps it. */
export interface LiveState {
  /** When Start was pressed (ms since 1970), null before. */
  startedAtMs: number | null;
  intervalText: string;
  /** Readings with the instant each was taken. */
  readings: { atMs: number; temperature: string; pressure: string }[];
  entryTemperature: string;
  entryPressure: string;
  finished: boolean;
}

export const LIVE_START: LiveState = { startedAtMs: null, intervalText: '60', readings: [], entryTemperature: '', entryPressure: '', finished: false };

/** Interval between readings, s: 5 s to 1 h. @throws naming "reading interval" */
export function intervalSOf(text: string): number {
  const s = readNumber(text, 'reading interval');
  if (!(s >= 5 && s <= 3600)) throw new Error(`reading interval: ${text.trim()} s is outside 5 to 3600 s.`);
  return s;
}

/** The live readings as seconds from the start. */
export function typedOfLive(l: LiveState): TypedReading[] {
  return l.readings.map((r) => ({ timeS: (r.atMs - (l.startedAtMs ?? r.atMs)) / 1000, temperature: r.temperature, pressure: r.pressure }));
}

/** Whether a reading is due now: the interval has passed since the last reading (or the start). */
export function readingDue(l: LiveState, nowMs: number): boolean {
  if (l.startedAtMs === null || l.finished) return false;
  let interval: number;
  try {
    interval = intervalSOf(l.intervalText);
  } catch {
    return false;
  }
  const last = l.readings[l.readings.length - 1]?.atMs ?? l.startedAtMs;
  return nowMs - last >= interval * 1000;
}

type WakeLockSentinelLike = { release(): Promise<void> };

/**
 * While `running`: ticks once a second to find a reading due (vibrating once as it falls due,
 * where the device can), and holds a screen Wake Lock, taken again when the page is shown again
 * (the browser lets it go when the page is hidden). Returns whether a reading is due.
 */
export function useLivePrompt(live: LiveState): boolean {
  const running = live.startedAtMs !== null && !live.finished;
  const [due, setDue] = useState(false);
  useEffect(() => {
    if (!running) {
      setDue(false);
      return;
    }
    let was = false;
    const tick = () => {
      const now = readingDue(live, Date.now());
      if (now && !was && typeof navigator.vibrate === 'function') navigator.vibrate([200, 100, 200]);
      was = now;
      setDue(now);
    };
    tick();
    const timer = setInterval(tick, 1000);
    return () => clearInterval(timer);
  }, [running, live.readings.length, live.intervalText, live.startedAtMs]);
  useEffect(() => {
    if (!running) return;
    const nav = navigator as Navigator & { wakeLock?: { request(type: 'screen'): Promise<WakeLockSentinelLike> } };
    let lock: WakeLockSentinelLike | null = null;
    let live = true;
    const take = () => {
      if (!nav.wakeLock || document.visibilityState !== 'visible') return;
      void nav.wakeLock.request('screen').then((l) => {
        if (live) lock = l;
        else void l.release();
      }, () => undefined);
    };
    take();
    document.addEventListener('visibilitychange', take);
    return () => {
      live = false;
      document.removeEventListener('visibilitychange', take);
      void lock?.release().catch(() => undefined);
    };
  }, [running]);
  return due;
}
