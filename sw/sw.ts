/// <reference lib="webworker" />
// Tankside service worker: precaches the whole build so the app opens and works with no network.
// Event wiring first, helpers below. It never calls skipWaiting() on its own: the page asks for it
// only after the user accepts an update (src/pwa), so an entry in progress is never cut off.
import { cleanupOutdatedCaches, matchPrecache, precacheAndRoute } from 'workbox-precaching';
import { NavigationRoute, registerRoute } from 'workbox-routing';

declare let self: ServiceWorkerGlobalScope;

cleanupOutdatedCaches();
precacheAndRoute(self.__WB_MANIFEST);
// Navigations the precache does not answer (any path under the scope but the shell's own).
registerRoute(new NavigationRoute(shellAt));

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

/**
 * The app shell for a navigation to any path under the scope (a bookmark of /some/deep/path, say).
 * The shell links its assets relatively ("./assets/…", so the build works under any folder); under
 * a deeper path they would resolve there, where nothing is cached, and the page would stay blank
 * offline. A <base> naming the scope makes them resolve where the precache holds them; it goes
 * first in <head>, before any link it must govern (the page's CSP allows a same-origin base).
 */
async function shellAt(): Promise<Response> {
  const shell = await matchPrecache('index.html');
  if (!shell) return Response.error();
  const html = (await shell.text()).replace(/<head>/i, `<head><base href="${escapeAttribute(self.registration.scope)}">`);
  return new Response(html, { status: 200, headers: shell.headers });
}

function escapeAttribute(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/"/g, '&quot;').replace(/</g, '&lt;');
}
