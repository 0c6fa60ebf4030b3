// The site's atmospheric pressure, from the settings record, for gauge ↔ absolute conversions.
import { readNumber } from './format.ts';
import {
  InputError,
  ATMOSPHERE_RANGE_PA,
  STANDARD_ATMOSPHERE_PA,
  atmosphereFromElevation,
  lengthToM,
  LENGTH_UNITS,
  pressureToPa,
} from '../../core/basics.ts';
import type { SiteAtmosphere } from './settings-model.ts';

export type AtmosphereResult =
  | { ok: true; pressurePa: number; source: string }
  | { ok: false; error: string };

/** Resolves the site atmosphere to Pa; a bad entry becomes a message naming the field. */
export function siteAtmosphere(a: SiteAtmosphere): AtmosphereResult {
  try {
    switch (a.mode) {
      case 'standard':
        return { ok: true, pressurePa: STANDARD_ATMOSPHERE_PA, source: 'standard atmosphere (101.325 kPa)' };
      case 'barometer': {
        const pa = pressureToPa(readNumber(a.text, 'barometer reading'), a.unit);
        const { min, max } = ATMOSPHERE_RANGE_PA;
        if (!(pa >= min && pa <= max)) throw new InputError('barometer reading', 'out-of-range', a.text, { min, max, unit: 'Pa' });
        return { ok: true, pressurePa: pa, source: `barometer reading ${a.text} ${a.unit}` };
      }
      case 'elevation': {
        const unit = a.unit ?? 'm';
        const m = lengthToM(readNumber(a.text, 'elevation'), unit, 'elevation');
        const label = LENGTH_UNITS.find((u) => u.id === unit)?.label ?? unit;
        return { ok: true, pressurePa: atmosphereFromElevation(m), source: `elevation ${a.text} ${label}` };
      }
    }
  } catch (e) {
    return { ok: false, error: messageOf(e) };
  }
}

/** A person-readable message from anything thrown by the core or the store. */
export function messageOf(e: unknown): string {
  if (e instanceof Error) return e.message;
  return String(e);
}
