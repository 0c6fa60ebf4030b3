// The tab bar: at most five destinations in one row at the bottom of the screen, where a thumb
// reaches them. The current one is marked by more than colour: a bar above it, a filled icon box,
// bold text and aria-current. Screens listed on More mark the More tab.
import { BAR_SCREENS, hrefFor, tabOf, type ScreenId } from '../router.ts';
import { TabIcon } from './TabIcon.tsx';

export function TabBar({ current }: { current: ScreenId }) {
  const tab = tabOf(current);
  return (
    <nav class="tabbar" aria-label="Screens">
      {BAR_SCREENS.map((s) => (
        <a key={s.id} href={hrefFor(s.id)} class="tab" aria-current={s.id === tab ? 'page' : undefined}>
          <TabIcon id={s.id} />
          <span class="tab-label">{s.label}</span>
        </a>
      ))}
    </nav>
  );
}
