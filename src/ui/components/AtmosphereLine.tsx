// One line saying which atmospheric pressure gauge readings are referred to.
import type { AtmosphereResult } from '../state/atmosphere.ts';
import { formatNumber } from '../state/format.ts';
import { hrefFor } from '../router.ts';

export function AtmosphereLine({ atm, link = true }: { atm: AtmosphereResult; link?: boolean }) {
  if (!atm.ok) {
    return (
      <p class="field-error">
        The site atmosphere in Settings is not usable ({atm.error}); 101.325 kPa is used instead.{' '}
        <a href={hrefFor('settings')}>Fix it in Settings</a>
      </p>
    );
  }
  return (
    <p class="hint">
      Site atmosphere {formatNumber(atm.pressurePa / 1000, 5)} kPa absolute, from the {atm.source}.
      {link ? <>{' '}<a href={hrefFor('settings')}>Change</a></> : null}
    </p>
  );
}
