// What the vessel editor shows live while dimensions are typed: the inner volume the shape implies
// (the core's vessel geometry) and the proportions of its outline, and the site atmosphere both
// ways — an elevation with the pressure it gives, a stored pressure with the elevation it implies
// (both by the US Standard Atmosphere 1976, the core's units/atmosphere.ts).
import {
  atmosphereFromElevation, elevationFromAtmosphere, headDepthM, lengthFromM, lengthToM, pressureFromPa, pressureToPa,
  vesselVolume, volumeFromM3, volumeToM3, LENGTH_UNITS, PRESSURE_UNITS, VOLUME_UNITS,
} from '../../core/index.ts';
import type { HeadSpec } from '../../core/check/vessel-geometry.ts';
import { formatFixed, formatNumber, readNumber } from './format.ts';
import { lengthUnitOf, type VesselForm } from './vessel-form.ts';
import type { UnitPrefs } from './settings-model.ts';

const label = (list: readonly { id: string; label: string }[], id: string) => list.find((u) => u.id === id)?.label ?? id;
const tryRead = (text: string): number | undefined => { try { return readNumber(text, 'value'); } catch { return undefined; } };

export interface ShapePreview {
  /** "0.982 m³ (982 L)", or why there is none yet. */
  volumeText: string;
  /** Outline proportions for the sketch: overall length and diameter, and the head depth, m. */
  outline?: { orientation: 'vertical' | 'horizontal'; diameterM: number; straightM: number; headM: number; flat: boolean };
}

export function shapePreview(f: VesselForm, u: UnitPrefs): ShapePreview {
  try {
    if (f.shape === 'stated-volume') {
      const v = tryRead(f.volume);
      if (v === undefined) return { volumeText: 'Enter the internal volume.' };
      const m3 = volumeToM3(v, f.volumeUnit);
      return { volumeText: volumeText(m3, u) };
    }
    const d = tryRead(f.diameterM), l = tryRead(f.straightLengthM);
    if (d === undefined || l === undefined) return { volumeText: 'Enter the diameter and the straight length to see the inner volume.' };
    const D = lengthToM(d, lengthUnitOf(f, 'diameterM')), L = lengthToM(l, lengthUnitOf(f, 'straightLengthM'));
    // A torispherical head's own radii where typed (blank or not yet readable: standard F&D).
    const radius = (field: 'crownRadius' | 'knuckleRadius') => {
      const x = f.head === 'torispherical' ? tryRead(f[field] ?? '') : undefined;
      return x === undefined ? undefined : lengthToM(x, lengthUnitOf(f, field));
    };
    const crownRadiusM = radius('crownRadius'), knuckleRadiusM = radius('knuckleRadius');
    const head: HeadSpec = f.head === 'torispherical'
      ? { kind: 'torispherical', ...(crownRadiusM === undefined ? {} : { crownRadiusM }), ...(knuckleRadiusM === undefined ? {} : { knuckleRadiusM }) }
      : { kind: f.head };
    const m3 = vesselVolume({ shape: f.shape, innerDiameterM: D, straightLengthM: L, head });
    return {
      volumeText: volumeText(m3, u),
      outline: { orientation: f.shape === 'horizontal-cylinder' ? 'horizontal' : 'vertical', diameterM: D, straightM: L, headM: headDepthM(head, D), flat: f.head === 'flat' },
    };
  } catch (e) {
    return { volumeText: `No volume yet: ${e instanceof Error ? e.message : String(e)}` };
  }
}

function volumeText(m3: number, u: UnitPrefs): string {
  const main = `${formatNumber(m3, 3)} m³`;
  return u.volume === 'm3' ? main : `${main} (${formatNumber(volumeFromM3(m3, u.volume), 3)} ${label(VOLUME_UNITS, u.volume)})`;
}

/** The other half of the site atmosphere: the pressure an elevation gives, or the elevation a pressure implies. */
export function siteCounterpart(f: VesselForm): string {
  try {
    if (f.atmosphereMode === 'elevation') {
      const e = tryRead(f.elevationM);
      if (e === undefined) return '';
      const pa = atmosphereFromElevation(lengthToM(e, lengthUnitOf(f, 'elevationM')));
      return `That elevation gives ${formatNumber(pressureFromPa(pa, f.pressureUnit), 4)} ${label(PRESSURE_UNITS, f.pressureUnit)} absolute on an average day (US Standard Atmosphere 1976).`;
    }
    const p = tryRead(f.atmosphere);
    if (p === undefined) return '';
    const m = elevationFromAtmosphere(pressureToPa(p, f.pressureUnit));
    const unit = lengthUnitOf(f, 'elevationM');
    return `That pressure is an average day at about ${formatFixed(lengthFromM(m, unit), 0)} ${label(LENGTH_UNITS, unit)} above sea level (US Standard Atmosphere 1976); if the site is far from that, check the value.`;
  } catch (e) {
    return e instanceof Error ? e.message : String(e);
  }
}
