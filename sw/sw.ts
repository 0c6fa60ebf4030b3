/// <reference lib="webworker" />
// Tankside service worker: precaches the whole build so the app opens and works with no network.
// Event wiring first, helpers below. It never calls skipWaiting() on its own: the page asks for it
// only after the user accepts an update (src/pwa), so an entry in progress is never cut off.
import { cleanupOutdatedCaches, createHandlerBoundToURL, precacheAndRoute } from 'workbox-precaching';
import { NavigationRoute, registerRoute } from 'workbox-routing';

declare let self: ServiceWorkerGlobalScope;

cleanupOutdatedCaches();
precacheAndRoute(self.__WB_MANIFEST);
registerRoute(new NavigationRoute(createHandlerBoundToURL('index.html')));

// Take control of pages opened before the first install finished, so a first visit is already
// offline-ready. This only adopts uncontrolled pages; a new version still waits for the person.
self.addEventListener('activate', (event: ExtendableEvent) => {
  event.waitUntil(self.clients.claim());
});

self.addEventListener('message', (event: ExtendableMessageEvent) => {
  if (isSkipWaitingRequest(event.data)) void self.skipWaiting();
});

function isSkipWaitingRequest(data: unknown): boolean {
  return typeof data === 'object' && data !== null && (data as { type?: unknown }).type === 'SKIP_WAITING';
}
