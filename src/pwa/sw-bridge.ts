// The only module that touches navigator.serviceWorker. It registers the worker once, tells the
// page when a new version is installed and waiting, and applies it only when the person asks:
// flush the entry in progress, ask the waiting worker to take over (SKIP_WAITING), then reload
// exactly once when it takes control. A page never reloads on its own, so no entry is cut off.
// <html data-worker-state> says where this page stands ("registering", then "current" once the
// registration has settled with this page controlled and no newer worker installing or waiting,
// "update-ready", "reloading"): browser tests wait on it, never on a fixed time.
// workbox-window (2.5 KB gzip) is loaded only when registering: nothing before the first paint needs
// it, and the registration already waits for the store to open.
import type { Workbox } from 'workbox-window';

/** Saves whatever is being typed; must resolve only once it is stored. */
export type FlushBeforeReload = () => Promise<void>;

const UPDATE_POLL_MS = 60 * 60 * 1000;

let workbox: Workbox | undefined;
let starting = false;
let updateReady = false;
let reloadRequested = false;
let flushBeforeReload: FlushBeforeReload = () => Promise.resolve();
const readyListeners = new Set<() => void>();

type WorkerState = 'registering' | 'current' | 'update-ready' | 'reloading';

function setWorkerState(state: WorkerState): void {
  document.documentElement.dataset['workerState'] = state;
}

/** 'current' once nothing newer is on its way; a later 'waiting' event still moves it on. */
function settle(registration: ServiceWorkerRegistration): void {
  const settled = () => {
    if (updateReady || reloadRequested) return;
    if (registration.installing || registration.waiting || !navigator.serviceWorker.controller) return;
    setWorkerState('current');
  };
  settled();
  navigator.serviceWorker.addEventListener('controllerchange', settled);
  registration.addEventListener('updatefound', () => {
    registration.installing?.addEventListener('statechange', settled);
  });
}

/**
 * Registers the service worker in production builds (a no-op in dev and where unsupported).
 * `flush` runs before an accepted update reloads the page.
 */
export function startServiceWorker(flush: FlushBeforeReload): void {
  flushBeforeReload = flush;
  if (starting || !('serviceWorker' in navigator) || import.meta.env.DEV) return;
  starting = true;
  setWorkerState('registering');
  void import('workbox-window').then(({ Workbox }) => register(new Workbox('./sw.js', { scope: './' })), () => undefined);
}

function register(wb: Workbox): void {
  workbox = wb;
  // 'waiting' covers both a worker installed during this visit and one left waiting by an
  // earlier visit or another tab (event.wasWaitingBeforeRegister).
  workbox.addEventListener('waiting', () => {
    updateReady = true;
    setWorkerState('update-ready');
    for (const listener of readyListeners) listener();
  });
  void workbox.register().then((registration) => {
    if (!registration) return;
    settle(registration);
    pollForUpdates(registration);
  }, () => undefined);
}

/** True once a new version is installed and waiting for the person to accept it. */
export function isUpdateReady(): boolean {
  return updateReady;
}

/** Calls `listener` when a new version becomes ready; returns the unsubscribe function. */
export function onUpdateReady(listener: () => void): () => void {
  readyListeners.add(listener);
  return () => readyListeners.delete(listener);
}

/**
 * Applies the waiting version: saves the entry in progress first (if that fails, nothing happens
 * and the error propagates, so the person keeps the page they have), then reloads once.
 */
export async function applyUpdate(): Promise<void> {
  if (!workbox || !updateReady) return;
  await flushBeforeReload();
  navigator.serviceWorker.addEventListener('controllerchange', () => {
    // Guarded: DevTools "update on reload" and repeated skips can fire this more than once.
    if (reloadRequested) return;
    reloadRequested = true;
    setWorkerState('reloading');
    window.location.reload();
  });
  workbox.messageSkipWaiting();
}

/** Long-lived installed apps seldom navigate; look for a new worker now and then when online. */
function pollForUpdates(registration: ServiceWorkerRegistration): void {
  window.setInterval(() => {
    if (navigator.onLine) registration.update().catch(() => undefined);
  }, UPDATE_POLL_MS);
}
