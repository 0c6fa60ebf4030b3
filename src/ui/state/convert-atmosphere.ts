// Which atmosphere Convert refers gauge readings to: today's barometer reading (from Settings), the
// stored site atmosphere of a chosen vessel, or the standard atmosphere — the last only when chosen.
// The default is the barometer when one is entered, otherwise the first vessel in service, otherwise
// the site elevation given in Settings.
import { STANDARD_ATMOSPHERE_PA } from '../../core/basics.ts';
import type { VesselSpec } from '../../core/index.ts';
import type { AtmosphereResult } from './atmosphere.ts';
import type { VesselRecord } from './repo.ts';

export interface AtmosphereChoice { id: string; label: string; pressurePa: number; source: string }

/** The choices, barometer first when there is one, then each vessel in service, then the standard atmosphere. */
export function atmosphereChoices(settingsAtm: AtmosphereResult, mode: 'standard' | 'barometer' | 'elevation', vessels: readonly VesselRecord[]): AtmosphereChoice[] {
  const barometer = mode === 'barometer';
  const out: AtmosphereChoice[] = [];
  if (barometer && settingsAtm.ok) out.push({ id: 'barometer', label: "Today's barometer", pressurePa: settingsAtm.pressurePa, source: `today's ${settingsAtm.source}` });
  for (const v of vessels) {
    if (v.retired) continue;
    const pa = (v.spec as Partial<VesselSpec>).siteAtmospherePa;
    if (typeof pa === 'number' && Number.isFinite(pa)) out.push({ id: `vessel:${v.id}`, label: `Site of ${v.tag}`, pressurePa: pa, source: `the stored site atmosphere of ${v.tag}` });
  }
  if (mode === 'elevation' && settingsAtm.ok) out.push({ id: 'settings', label: 'Site in Settings', pressurePa: settingsAtm.pressurePa, source: `the site in Settings (${settingsAtm.source})` });
  out.push({ id: 'standard', label: 'Standard atmosphere', pressurePa: STANDARD_ATMOSPHERE_PA, source: 'the standard atmosphere (101.325 kPa), chosen' });
  return out;
}

/** The chosen entry, or the default when nothing (or something no longer there) was chosen. */
export function chosenAtmosphere(choices: readonly AtmosphereChoice[], id: string): AtmosphereChoice {
  return choices.find((c) => c.id === id) ?? choices[0]!;
}
