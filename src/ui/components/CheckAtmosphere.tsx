// One line under the readings: which atmosphere a gauge reading is referred to, with its figure.
import type { AtmosphereResult } from '../state/atmosphere.ts';
import type { AppSettings } from '../state/settings-model.ts';
import type { VesselRecord } from '../state/repo.ts';
import type { VesselSpec } from '../../core/index.ts';
import { formatNumber } from '../state/format.ts';
import { hrefFor } from '../router.ts';
import { AtmosphereLine } from './AtmosphereLine.tsx';
import { pure } from './pure.ts';

interface Props { settings: AppSettings; atm: AtmosphereResult; vessel: VesselRecord | undefined }

function CheckAtmosphereView({ settings, atm, vessel }: Props) {
  if (settings.atmosphere.mode === 'barometer') return <AtmosphereLine atm={atm} link={false} />;
  const site = (vessel?.spec as VesselSpec | undefined)?.siteAtmospherePa;
  return (
    <p class="hint">
      Gauge readings are referred to {site !== undefined ? <>this vessel's site atmosphere, {formatNumber(site / 1000, 4)} kPa</> : "the vessel's own site atmosphere"}.
      {' '}A barometer reading taken today, entered in <a href={hrefFor('settings')}>Settings</a>, is used instead.
    </p>
  );
}

export const CheckAtmosphere = pure(CheckAtmosphereView);
