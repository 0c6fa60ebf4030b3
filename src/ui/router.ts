// Hash routes (#/check, #/log/<id>, ...): the service worker serves one shell for every path,
// and a hash never leaves the page, so routes work offline and in an installed app alike.
//
// Every destination is one entry of SCREENS. At most five sit in the tab bar (the thumb's row);
// every other one is listed on the More screen under its group, one tap further. A new
// destination (a cycle log, an instrument register, a plant overview, a sync screen ...) is one
// more entry with `place: 'more'` and a group: neither the bar nor the More screen changes.
import { useEffect, useState } from 'preact/hooks';

export type ScreenId = 'check' | 'vessels' | 'log' | 'convert' | 'more' | 'fill' | 'review' | 'labels' | 'instruments' | 'settings' | 'sync' | 'cycles' | 'steam-tests' | 'overview';

/** Groups of the More screen, in the order it lists them. */
export const MORE_GROUPS = ['Plan and review', 'Plant records', 'This device'] as const;
export type MoreGroup = (typeof MORE_GROUPS)[number];

export interface ScreenEntry {
  id: ScreenId;
  /** The tab or list label. */
  label: string;
  /** The heading and the document title. */
  title: string;
  place: 'bar' | 'more';
  /** Where the More screen lists it (entries of the bar have none). */
  group?: MoreGroup;
  /** One line under its name on the More screen. */
  summary?: string;
}

export const SCREENS: readonly ScreenEntry[] = [
  { id: 'check', label: 'Check', title: 'New check', place: 'bar' },
  { id: 'vessels', label: 'Vessels', title: 'Vessels', place: 'bar' },
  { id: 'log', label: 'Log', title: 'Log', place: 'bar' },
  { id: 'convert', label: 'Convert', title: 'Convert', place: 'bar' },
  { id: 'more', label: 'More', title: 'More', place: 'bar' },
  { id: 'overview', label: 'Plant overview', title: 'Plant overview', place: 'more', group: 'Plan and review', summary: 'Each vessel\'s latest outcome, checks due and open findings.' },
  { id: 'fill', label: 'Fill plan', title: 'Fill plan', place: 'more', group: 'Plan and review', summary: 'How much water to charge for a target condition.' },
  { id: 'review', label: 'Review', title: 'Review', place: 'more', group: 'Plan and review', summary: 'Filter, count, chart and print the log; export and import.' },
  { id: 'cycles', label: 'Cycle record', title: 'Cycle record', place: 'more', group: 'Plant records', summary: 'A sterilising cycle, live or from a recorder file.' },
  { id: 'steam-tests', label: 'Steam and chamber tests', title: 'Steam and chamber tests', place: 'more', group: 'Plant records', summary: 'Supply steam, air leakage, air-removal test.' },
  { id: 'labels', label: 'Vessel labels', title: 'Vessel labels', place: 'more', group: 'Plant records', summary: 'Print a sheet of QR labels that open each vessel\'s new check.' },
  { id: 'instruments', label: 'Instruments', title: 'Instruments', place: 'more', group: 'Plant records', summary: 'Gauges and thermometers: calibrations, due dates, drift found in the log.' },
  { id: 'sync', label: 'Plant sync', title: 'Plant sync', place: 'more', group: 'This device', summary: 'Send this device\'s checks to the plant server and receive the vessel inventory.' },
  { id: 'settings', label: 'Settings', title: 'Settings', place: 'more', group: 'This device', summary: 'Your name, units, site atmosphere, storage and backup.' },
];

/** The tab bar's entries, in order (at most five: a test holds the bar to one row of them). */
export const BAR_SCREENS: readonly ScreenEntry[] = SCREENS.filter((s) => s.place === 'bar');

export interface Route { screen: ScreenId; param?: string }

export function parseRoute(hash: string): Route {
  const [screen, ...rest] = hash.replace(/^#\/?/, '').split('/');
  const known = SCREENS.find((s) => s.id === screen);
  if (!known) return { screen: 'check' };
  const param = rest.length ? decodeURIComponent(rest.join('/')) : undefined;
  return param ? { screen: known.id, param } : { screen: known.id };
}

/** Display width from which the plant overview is the first screen (a supervisor's desk), CSS px. */
export const WIDE_MIN_PX = 1024;

/**
 * The route to open with: the hash's own, or with no hash the plant overview on a display at least
 * WIDE_MIN_PX wide (a supervisor's desk) and the new check elsewhere (a technician's phone).
 */
export function openingRoute(hash: string, widthPx: number): Route {
  if (hash.replace(/^#\/?/, '') === '' && widthPx >= WIDE_MIN_PX) return { screen: 'overview' };
  return parseRoute(hash);
}

export function hrefFor(screen: ScreenId, param?: string): string {
  return `#/${screen}${param ? '/' + encodeURIComponent(param) : ''}`;
}

export function navigate(screen: ScreenId, param?: string): void {
  window.location.hash = hrefFor(screen, param);
}

/** The tab that is current for a route: its own, or More for a screen listed there. */
export function tabOf(screen: ScreenId): ScreenId {
  return SCREENS.find((s) => s.id === screen)?.place === 'more' ? 'more' : screen;
}

/** The current route, following hash changes. */
export function useRoute(): Route {
  const [route, setRoute] = useState(() => openingRoute(window.location.hash, window.innerWidth));
  useEffect(() => {
    const onHash = () => setRoute(openingRoute(window.location.hash, window.innerWidth));
    window.addEventListener('hashchange', onHash);
    // A hash that changed between the first render and this effect (a tap on the menu as the app
    // opens) fired its event before anyone listened: read it again now.
    onHash();
    return () => window.removeEventListener('hashchange', onHash);
  }, []);
  return route;
}
