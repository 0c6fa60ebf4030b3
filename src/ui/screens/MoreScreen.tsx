// More: every destination that is not in the tab bar, under its group, one tap away. New
// destinations join by their entry in router.ts (place 'more' and a group); nothing here changes.
import { MORE_GROUPS, SCREENS, hrefFor } from '../router.ts';

export function MoreScreen() {
  return (
    <div class="more-screen">
      {MORE_GROUPS.map((group) => {
        const entries = SCREENS.filter((s) => s.place === 'more' && s.group === group);
        if (entries.length === 0) return null;
        return (
          <section key={group} class="more-group" aria-labelledby={`more-${group.replace(/\W+/g, '-')}`}>
            <h2 id={`more-${group.replace(/\W+/g, '-')}`}>{group}</h2>
            <ul class="list">
              {entries.map((s) => (
                <li key={s.id}>
                  <a class="button list-button" href={hrefFor(s.id)}>
                    <strong>{s.label}</strong>
                    {s.summary ? <span class="muted">{s.summary}</span> : null}
                  </a>
                </li>
              ))}
            </ul>
          </section>
        );
      })}
    </div>
  );
}
