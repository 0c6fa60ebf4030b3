// Composition root: render the shell at once, then open the store, load settings and vessels, and
// register the worker. Nothing waits for IndexedDB before the first paint; the screens that need
// the store say so until it is open.
import { render } from 'preact';
import styles from './ui/styles.css?inline';
import { App } from './ui/App.tsx';
import { startServiceWorker } from './pwa/sw-bridge.ts';
import { loadAppState, reportSaveError, reportStoreFailed } from './ui/state/app-state.ts';
import { flushDrafts } from './ui/state/drafts.ts';
import { openAppStore, storageMessage } from './ui/state/repo.ts';
import { warmEngineWhenIdle } from './ui/state/engine.ts';
import { startSyncTriggers } from './ui/state/sync-status.ts';

// The stylesheet travels inside this script and is adopted before the first render: no stylesheet
// request holds up the first paint, and the shell is never drawn unstyled. A constructed sheet is
// not an inline style, so the page's CSP (style-src 'self') stays as strict as it is.
const sheet = new CSSStyleSheet();
sheet.replaceSync(styles);
document.adoptedStyleSheets = [...document.adoptedStyleSheets, sheet];

async function start(): Promise<void> {
  const root = document.getElementById('app');
  if (root) render(<App />, root);
  try {
    await openAppStore(reportSaveError);
    await loadAppState();
    warmEngineWhenIdle();
    // Sync never holds up the app: the triggers start once the store is open, and a failure to
    // read the sync settings only leaves sync off.
    void startSyncTriggers().catch(() => undefined);
  } catch (e) {
    reportStoreFailed();
    reportSaveError(`Storage is not available, so nothing can be saved: ${storageMessage(e)}`);
  }
  startServiceWorker(flushDrafts);
}

void start();
