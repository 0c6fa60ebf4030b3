// The tab bar's pictures: simple line drawings of our own on a 24-unit grid, drawn in the text
// colour so they follow the light and dark schemes. Decorative: each tab has its word beside it.
import type { ScreenId } from '../router.ts';

const PATHS: Partial<Record<ScreenId, string>> = {
  // A gauge dial with its needle.
  check: 'M12 4a8 8 0 1 0 0.01 0M12 12l4-4M7 16h10',
  // A vertical vessel with dished ends.
  vessels: 'M8 5q4-3 8 0v14q-4 3-8 0zM8 10h8',
  // Lines of a log.
  log: 'M6 5h12M6 10h12M6 15h12M6 20h8',
  // Two arrows, one each way.
  convert: 'M5 8h13l-3-3M19 16H6l3 3',
  // Three dots.
  more: 'M6 12h0.01M12 12h0.01M18 12h0.01',
};

export function TabIcon({ id }: { id: ScreenId }) {
  return (
    <svg class="tab-icon" viewBox="0 0 24 24" width="24" height="24" aria-hidden="true" focusable="false">
      <path d={PATHS[id] ?? PATHS.more} />
    </svg>
  );
}
