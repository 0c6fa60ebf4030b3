// Whether the display is wide enough for the desk layouts (WIDE_MIN_PX and up), following resizes.
import { useEffect, useState } from 'preact/hooks';
import { WIDE_MIN_PX } from '../router.ts';

export function useWide(): boolean {
  const query = `(min-width: ${WIDE_MIN_PX}px)`;
  const [wide, setWide] = useState(() => window.matchMedia(query).matches);
  useEffect(() => {
    const list = window.matchMedia(query);
    const on = () => setWide(list.matches);
    list.addEventListener('change', on);
    on();
    return () => list.removeEventListener('change', on);
  }, []);
  return wide;
}
