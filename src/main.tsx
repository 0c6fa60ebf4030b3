// Composition root: render the shell at once, then open the store, load settings and vessels, and
// register the worker. Nothing waits for IndexedDB before the first paint; the screens that need
// the store say so until it is open.
import { render } from 'preact';
import './ui/styles.css';
import { App } from './ui/App.tsx';
import { startServiceWorker } from './pwa/sw-bridge.ts';
import { loadAppState, reportSaveError, reportStoreFailed } from './ui/state/app-state.ts';
import { flushDrafts } from './ui/state/drafts.ts';
import { openAppStore, storageMessage } from './ui/state/repo.ts';
import { warmEngineWhenIdle } from './ui/state/engine.ts';

async function start(): Promise<void> {
  const root = document.getElementById('app');
  if (root) render(<App />, root);
  warmEngineWhenIdle();
  try {
    await openAppStore(reportSaveError);
    await loadAppState();
  } catch (e) {
    reportStoreFailed();
    reportSaveError(`Storage is not available, so nothing can be saved: ${storageMessage(e)}`);
  }
  startServiceWorker(flushDrafts);
}

void start();
