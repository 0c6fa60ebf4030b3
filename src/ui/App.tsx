// The app shell: title, the screen menu, the update prompt, and the current screen.
import { useEffect, useRef } from 'preact/hooks';
import { SCREENS, hrefFor, useRoute, type Route } from './router.ts';
import { UpdateBanner } from './components/UpdateBanner.tsx';
import { useSaveError } from './state/app-state.ts';
import { VesselsScreen } from './screens/VesselsScreen.tsx';
import { CheckScreen } from './screens/CheckScreen.tsx';
import { FillPlanScreen } from './screens/FillPlanScreen.tsx';
import { LogScreen } from './screens/LogScreen.tsx';
import { ConvertScreen } from './screens/ConvertScreen.tsx';
import { SettingsScreen } from './screens/SettingsScreen.tsx';
import { ReviewRoute } from './components/ReviewRoute.tsx';

export function App() {
  const route = useRoute();
  const saveError = useSaveError();
  const heading = useRef<HTMLHeadingElement>(null);
  const title = SCREENS.find((s) => s.id === route.screen)?.title ?? '';
  useEffect(() => {
    document.title = `${title} · Tankside`;
    heading.current?.focus({ preventScroll: true });
  }, [route.screen, route.param]);
  return (
    <>
      <UpdateBanner />
      <header class="top">
        <div class="top-title">
          <strong>Tankside</strong>
          <small>closed-vessel steam checks</small>
        </div>
        <nav class="nav" aria-label="Screens">
          {SCREENS.map((s) => (
            <a key={s.id} href={hrefFor(s.id)} aria-current={s.id === route.screen ? 'page' : undefined}>{s.label}</a>
          ))}
        </nav>
      </header>
      <main>
        {saveError ? <p class="panel field-error" role="alert">{saveError}</p> : null}
        <h1 ref={heading} tabIndex={-1}>{title}</h1>
        <Screen route={route} />
      </main>
      <footer class="app-footer"><span class="app-version">Tankside {__APP_VERSION__}</span> · works offline · no data leaves this device</footer>
    </>
  );
}

function Screen({ route }: { route: Route }) {
  switch (route.screen) {
    case 'vessels': return <VesselsScreen param={route.param} />;
    case 'check': return <CheckScreen />;
    case 'fill': return <FillPlanScreen />;
    case 'log': return <LogScreen param={route.param} />;
    case 'review': return <ReviewRoute />;
    case 'convert': return <ConvertScreen />;
    case 'settings': return <SettingsScreen />;
  }
}
