// Composition root: render the shell, then register the service worker.
import { render } from 'preact';
import { App } from './ui/App.tsx';
import { startServiceWorker } from './pwa/sw-bridge.ts';

const root = document.getElementById('app');
if (root) render(<App />, root);
startServiceWorker();
