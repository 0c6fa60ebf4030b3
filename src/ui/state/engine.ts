// The check engine (IAPWS-IF97, the check rules, the result wording) is its own chunk, loaded as
// soon as the shell has rendered and warmed on invented data while the page is idle, so the start-up
// JavaScript stays small and the first real result still fits in a frame. Every screen that computes
// a check goes through here.
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

/** The engine once loaded; undefined before (the screen shows that it is getting ready). */
export function useEngine(): Engine | undefined {
  const engine = useShared(engineState);
  if (!engine) void loadEngine();
  return engine;
}

type IdleWindow = Window & { requestIdleCallback?: (cb: () => void, opts?: { timeout: number }) => number };

/** Loads the engine now and runs it once on invented data when the page is next idle. */
export function warmEngineWhenIdle(): void {
  void loadEngine().then((m) => {
    const w = window as IdleWindow;
    const run = () => m.warmUp(UNIT_PRESETS.SI);
    if (w.requestIdleCallback) w.requestIdleCallback(run, { timeout: 2000 });
    else setTimeout(run, 0);
  }, () => undefined);
}
