// The supervisors' Review screen is its own chunk: a technician's phone never parses it unless the
// screen is opened. The service worker precaches it with the rest of the build, so it opens offline.
import { useEffect, useState } from 'preact/hooks';

type ReviewModule = typeof import('../review/ReviewScreen.tsx');

export function ReviewRoute() {
  const [loaded, setLoaded] = useState<ReviewModule | null>(null);
  const [failed, setFailed] = useState(false);
  useEffect(() => {
    let live = true;
    import('../review/ReviewScreen.tsx').then(
      (m) => { if (live) setLoaded(m); },
      () => { if (live) setFailed(true); },
    );
    return () => { live = false; };
  }, []);
  if (failed) {
    return <p class="panel field-error" role="alert">The Review screen could not be loaded. Reload the app to try again; nothing saved is affected.</p>;
  }
  if (!loaded) return <p class="panel" aria-busy="true">Opening Review…</p>;
  return <loaded.ReviewScreen />;
}
