// The app shell: the tab bar (five destinations within the thumb's reach at the bottom; the rest on
// More), the update prompt, storage errors, the current screen's heading and the screen. Only the
// shell and the Check screen are in the start-up chunk; every other screen loads on demand.
import { useEffect, useRef } from 'preact/hooks';
import { SCREENS, useRoute, type Route } from './router.ts';
import { UpdateBanner } from './components/UpdateBanner.tsx';
import { TabBar } from './components/TabBar.tsx';
import { AppFooter } from './components/AppFooter.tsx';
import { lazyScreen } from './components/LazyScreen.tsx';
import { useAppReady, useSaveError } from './state/app-state.ts';
import { CheckScreen } from './screens/CheckScreen.tsx';

const VesselsScreen = lazyScreen('Vessels', () => import('./screens/VesselsScreen.tsx').then((m) => m.VesselsScreen));
const FillPlanScreen = lazyScreen('Fill plan', () => import('./screens/FillPlanScreen.tsx').then((m) => m.FillPlanScreen));
const LogScreen = lazyScreen('Log', () => import('./screens/LogScreen.tsx').then((m) => m.LogScreen));
const ConvertScreen = lazyScreen('Convert', () => import('./screens/ConvertScreen.tsx').then((m) => m.ConvertScreen));
const SettingsScreen = lazyScreen('Settings', () => import('./screens/SettingsScreen.tsx').then((m) => m.SettingsScreen));
const MoreScreen = lazyScreen('More', () => import('./screens/MoreScreen.tsx').then((m) => m.MoreScreen));
const LabelsScreen = lazyScreen('Vessel labels', () => import('./labels/LabelsScreen.tsx').then((m) => m.LabelsScreen));
const CyclesScreen = lazyScreen('Cycle record', () => import('./cycles/CyclesScreen.tsx').then((m) => m.CyclesScreen));
const SteamTestsScreen = lazyScreen('Steam and chamber tests', () => import('./cycles/SteamTestsScreen.tsx').then((m) => m.SteamTestsScreen));
const InstrumentsScreen = lazyScreen('Instruments', () => import('./instruments/InstrumentsScreen.tsx').then((m) => m.InstrumentsScreen));
const SyncScreen = lazyScreen('Plant sync', () => import('./sync/SyncScreen.tsx').then((m) => m.SyncScreen));
const ReviewScreen = lazyScreen('Review', () => import('./review/ReviewScreen.tsx').then((m) => m.ReviewScreen));
const OverviewScreen = lazyScreen('Plant overview', () => import('./desk/OverviewScreen.tsx').then((m) => m.OverviewScreen));

export function App() {
  const route = useRoute();
  const saveError = useSaveError();
  const ready = useAppReady();
  const heading = useRef<HTMLHeadingElement>(null);
  const title = SCREENS.find((s) => s.id === route.screen)?.title ?? '';
  useEffect(() => {
    document.title = `${title} · Tankside`;
    heading.current?.focus({ preventScroll: true });
  }, [route.screen, route.param]);
  return (
    <>
      <UpdateBanner />
      <TabBar current={route.screen} />
      <header class="top">
        <h1 ref={heading} tabIndex={-1}>{title}</h1>
        <span class="top-brand">Tankside</span>
      </header>
      <main data-app-state={ready} data-screen={route.screen}>
        {saveError ? <p class="panel field-error" role="alert">{saveError}</p> : null}
        {ready === 'opening' ? <p class="panel" aria-busy="true">Opening this device's records…</p> : <Screen route={route} />}
      </main>
      <AppFooter />
    </>
  );
}

function Screen({ route }: { route: Route }) {
  switch (route.screen) {
    case 'check': return <CheckScreen param={route.param} />;
    case 'vessels': return <VesselsScreen param={route.param} />;
    case 'fill': return <FillPlanScreen />;
    case 'log': return <LogScreen param={route.param} />;
    case 'review': return <ReviewScreen key={route.param ?? ''} param={route.param} />;
    case 'overview': return <OverviewScreen />;
    case 'convert': return <ConvertScreen />;
    case 'settings': return <SettingsScreen />;
    case 'more': return <MoreScreen />;
    case 'labels': return <LabelsScreen />;
    case 'cycles': return <CyclesScreen />;
    case 'steam-tests': return <SteamTestsScreen />;
    case 'instruments': return <InstrumentsScreen param={route.param} />;
    case 'sync': return <SyncScreen param={route.param} />;
  }
}
