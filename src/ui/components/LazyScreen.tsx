// A screen that is its own chunk: the first visit loads it (from the service worker's cache, which
// holds every chunk of the build), later visits reuse the loaded module. Only the Check screen and
// the shell are in the start-up JavaScript.
import type { ComponentType } from 'preact';
import { useEffect, useState } from 'preact/hooks';

type Loader<P> = () => Promise<ComponentType<P>>;

const loaded = new Map<Loader<never>, ComponentType<never>>();

/** A component that renders the screen `load` resolves to, with a plain status while it loads. */
export function lazyScreen<P extends object>(title: string, load: Loader<P>): ComponentType<P> {
  return function LazyScreen(props: P) {
    const [Screen, setScreen] = useState<ComponentType<P> | undefined>(() => loaded.get(load as Loader<never>) as ComponentType<P> | undefined);
    const [failed, setFailed] = useState(false);
    useEffect(() => {
      if (Screen) return;
      let live = true;
      load().then((s) => {
        loaded.set(load as Loader<never>, s as ComponentType<never>);
        if (live) setScreen(() => s);
      }, () => { if (live) setFailed(true); });
      return () => { live = false; };
    }, []);
    if (failed) {
      return <p class="panel field-error" role="alert">{title} could not be loaded. Reload the app to try again; nothing saved is affected.</p>;
    }
    if (!Screen) return <p class="panel" aria-busy="true" data-screen-state="loading">Opening {title}…</p>;
    return <Screen {...props} />;
  };
}
