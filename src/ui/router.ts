// Hash routes (#/check, #/log/<id>, ...): the service worker serves one shell for every path,
// and a hash never leaves the page, so routes work offline and in an installed app alike.
import { useEffect, useState } from 'preact/hooks';

export type ScreenId = 'vessels' | 'check' | 'fill' | 'log' | 'review' | 'convert' | 'settings';

export interface Route { screen: ScreenId; param?: string }

export const SCREENS: readonly { id: ScreenId; label: string; title: string }[] = [
  { id: 'vessels', label: 'Vessels', title: 'Vessels' },
  { id: 'check', label: 'Check', title: 'New check' },
  { id: 'fill', label: 'Fill', title: 'Fill plan' },
  { id: 'log', label: 'Log', title: 'Log' },
  { id: 'review', label: 'Review', title: 'Review' },
  { id: 'convert', label: 'Convert', title: 'Convert' },
  { id: 'settings', label: 'Settings', title: 'Settings' },
];

export function parseRoute(hash: string): Route {
  const [screen, ...rest] = hash.replace(/^#\/?/, '').split('/');
  const known = SCREENS.find((s) => s.id === screen);
  if (!known) return { screen: 'check' };
  const param = rest.length ? decodeURIComponent(rest.join('/')) : undefined;
  return param ? { screen: known.id, param } : { screen: known.id };
}

export function hrefFor(screen: ScreenId, param?: string): string {
  return `#/${screen}${param ? '/' + encodeURIComponent(param) : ''}`;
}

export function navigate(screen: ScreenId, param?: string): void {
  window.location.hash = hrefFor(screen, param);
}

/** The current route, following hash changes. */
export function useRoute(): Route {
  const [route, setRoute] = useState(() => parseRoute(window.location.hash));
  useEffect(() => {
    const onHash = () => setRoute(parseRoute(window.location.hash));
    window.addEventListener('hashchange', onHash);
    // A hash that changed between the first render and this effect (a tap on the menu as the app
    // opens) fired its event before anyone listened: read it again now.
    onHash();
    return () => window.removeEventListener('hashchange', onHash);
  }, []);
  return route;
}
