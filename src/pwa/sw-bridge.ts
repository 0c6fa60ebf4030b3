// The only module that touches navigator.serviceWorker.
import { Workbox } from 'workbox-window';

/** Registers the service worker in production builds; a no-op in dev and where unsupported. */
export function startServiceWorker(): Workbox | undefined {
  if (!('serviceWorker' in navigator) || import.meta.env.DEV) return undefined;
  const wb = new Workbox('./sw.js', { scope: './' });
  void wb.register();
  return wb;
}
