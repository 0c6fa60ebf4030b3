// The check engine (IAPWS-IF97, the check rules, the result wording) is its own chunk, loaded when
// the page is first idle after the first screen has rendered (at most half a second later) and
// warmed on invented data, so the start-up JavaScript stays small, the first screen is not held up
// by compiling the engine, and the first real result still fits in a frame. Every screen that
// computes a check goes through here.
import { shared, useShared } from './observable.ts';
import { UNIT_PRESETS } from './settings-model.ts';

export type Engine = typeof import('./check-session.ts');

const engineState = shared<Engine | undefined>(undefined);
let loading: Promise<Engine> | undefined;

/** Loads the engine chunk once (the service worker holds it, so this works offline). */
export function loadEngine(): Promise<Engine> {
  loading ??= import('./check-session.ts').then((m) => {
    engineState.set(m);
    return m;
  });
  return loading;
}

type IdleWindow = Window & { requestIdleCallback?: (cb: () => void, opts?: { timeout: number }) => number };

/** Runs `job` when the page is next idle, and at the latest after `timeoutMs`. */
function whenIdle(job: () => void, timeoutMs: number): void {
  const w = window as IdleWindow;
  if (w.requestIdleCallback) w.requestIdleCallback(job, { timeout: timeoutMs });
  else setTimeout(job, 0);
}

let warming = false;

/** Loads the engine when the page is next idle, then runs it once on invented data when idle again. */
export function warmEngineWhenIdle(): void {
  if (warming) return;
  warming = true;
  whenIdle(() => {
    void loadEngine().then((m) => whenIdle(() => m.warmUp(UNIT_PRESETS.SI), 2000), () => undefined);
  }, 500);
}

/** The engine once loaded; undefined before (the screen shows that it is getting ready, and asks for it when idle). */
export function useEngine(): Engine | undefined {
  const engine = useShared(engineState);
  if (!engine) warmEngineWhenIdle();
  return engine;
}
