// Composition root: open the store, load settings and vessels, render, register the worker.
import { render } from 'preact';
import './ui/styles.css';
import { App } from './ui/App.tsx';
import { startServiceWorker } from './pwa/sw-bridge.ts';
import { loadAppState, reportSaveError } from './ui/state/app-state.ts';
import { flushDrafts } from './ui/state/drafts.ts';
import { openAppStore, storageMessage } from './ui/state/repo.ts';

async function start(): Promise<void> {
  const root = document.getElementById('app');
  try {
    await openAppStore(reportSaveError);
    await loadAppState();
  } catch (e) {
    reportSaveError(`Storage is not available, so nothing can be saved: ${storageMessage(e)}`);
  }
  if (root) render(<App />, root);
  startServiceWorker(flushDrafts);
}

void start();
