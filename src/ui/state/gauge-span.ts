// A gauge cannot show more than its span: a typed pressure beyond it was read in another unit, or
// mistyped. "123,5" left in psi from an earlier check is 851 kPa on a 0–400 kPa gauge, and read as
// psi it gave DANGER above MAWP. Such a value is refused before the engine sees it, with the span
// in the unit typed and the units in which the same number would fit.
import { PRESSURE_UNITS, pressureFromPa, pressureToPa, type PressureUnit } from '../../core/basics.ts';
import type { VesselSpec } from '../../core/index.ts';
import { formatNumber } from './format.ts';
import { quoted } from './error-text.ts';

/** Units offered as a suggestion, the vessel's gauge unit first: the ones gauges are commonly made in (common practice). */
const SUGGESTED: readonly PressureUnit[] = ['kPa', 'bar', 'psi', 'MPa', 'kgf/cm2', 'mbar', 'inHg', 'inH2O'];

const label = (u: PressureUnit) => PRESSURE_UNITS.find((x) => x.id === u)?.label ?? u;

/**
 * A message when `value` (typed as `text` in `unit`, gauge or absolute) lies above the vessel's
 * gauge span; undefined when it fits. A value below zero absolute is the engine's to refuse (its
 * range message says why). atmospherePa: the atmosphere the reading is referred to.
 */
export function gaugeSpanError(
  value: number, text: string, unit: PressureUnit, kind: 'gauge' | 'absolute', spec: VesselSpec, atmospherePa: number,
): string | undefined {
  const span = spec.instruments.pressureGauge.spanPa;
  const gaugePa = (v: number, u: PressureUnit) => (kind === 'gauge' ? pressureToPa(v, u) : pressureToPa(v, u) - atmospherePa);
  const fits = (v: number, u: PressureUnit) => gaugePa(v, u) <= span;
  if (fits(value, unit)) return undefined;
  const gaugeUnit = spec.readingUnits?.pressure;
  const shown = (pa: number, u: PressureUnit) => formatNumber(pressureFromPa(pa, u), 3);
  const range = kind === 'gauge'
    ? `0 to ${shown(span, unit)} ${label(unit)} gauge`
    : `up to ${shown(span + atmospherePa, unit)} ${label(unit)} absolute`;
  const own = gaugeUnit && gaugeUnit !== unit ? ` (0 to ${shown(span, gaugeUnit)} ${label(gaugeUnit)} on its dial)` : '';
  const candidates = [...(gaugeUnit ? [gaugeUnit] : []), ...SUGGESTED].filter((u, i, all) => u !== unit && all.indexOf(u) === i);
  const fit = candidates.filter((u) => fits(value, u)).slice(0, 2);
  const suggestion = fit.length ? ` In ${fit.map(label).join(' or ')} it would fit: pick the unit the gauge reads in.` : ' Check the reading and its unit.';
  return `pressure: ${quoted(text)} ${label(unit)} is beyond this vessel's gauge, which reads ${range}${own}.${suggestion}`;
}
