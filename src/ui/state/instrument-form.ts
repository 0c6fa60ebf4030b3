// The form that adds an instrument to the register or changes what it is (tag, kind, unit, range,
// class or stated tolerance, description): text in the instrument's own unit in, the store's
// NewInstrument (SI) out, or each bad field named with its valid range in that unit. What the form
// does not show (indicator, drift allowance, interval of its own) is carried over from the stored
// spec untouched, so an edit never loses it.
import {
  InputError, isPressureUnit, isTemperatureUnit, pressureFromPa, pressureToPa, temperatureDifferenceFromK, temperatureDifferenceToK,
  temperatureFromK, temperatureToK, PRESSURE_UNITS, TEMPERATURE_UNITS,
} from '../../core/index.ts';
import { INSTRUMENT_KINDS, UNIT_OF_KIND, type InstrumentKind } from '../../core/instrument/instrument-kind.ts';
import { INSTRUMENT_LIMITS, validateInstrument, type InstrumentSpec, type InstrumentTolerance } from '../../core/instrument/instrument-spec.ts';
import { INSTRUMENT_TEXT_LIMITS, type InstrumentRecord, type NewInstrument } from '../../store/index.ts';
import { readNumber } from './format.ts';
import { unitLabel } from './unit-labels.ts';

export type ClassBasis = InstrumentTolerance['kind'];

/** The form as typed. */
export interface InstrumentDraft {
  tag: string;
  kind: InstrumentKind;
  unit: string;
  low: string;
  high: string;
  classBasis: ClassBasis;
  /** % of span, or ± in `unit`. */
  classValue: string;
  rtdClass: 'AA' | 'A' | 'B';
  description: string;
}
export type InstrumentField = 'tag' | 'kind' | 'unit' | 'low' | 'high' | 'classValue' | 'description';

/** The units a kind's figures may be shown in: its family's picker list (a scale reads in kg). */
export function unitsOfKind(kind: InstrumentKind): readonly { id: string; label: string }[] {
  const si = UNIT_OF_KIND[kind];
  return si === 'Pa' ? PRESSURE_UNITS : si === 'K' ? TEMPERATURE_UNITS : [{ id: 'kg', label: 'kg' }];
}

/** A draft's unit after the kind changed: kept when it fits the new kind, else the family's first. */
export function unitForKind(kind: InstrumentKind, unit: string): string {
  const units = unitsOfKind(kind);
  return units.some((u) => u.id === unit) ? unit : kind === 'barometer' ? 'hPa' : units[0]!.id;
}

/** The class bases a kind may take: an IEC 60751 class only for temperature sensors. */
export function classBasesOf(kind: InstrumentKind): readonly ClassBasis[] {
  return UNIT_OF_KIND[kind] === 'K' ? ['percent-of-span', 'stated', 'iec-60751'] : ['percent-of-span', 'stated'];
}

export function emptyInstrumentDraft(kind: InstrumentKind = 'pressure-gauge'): InstrumentDraft {
  return { tag: '', kind, unit: unitForKind(kind, ''), low: '', high: '', classBasis: 'percent-of-span', classValue: '', rtdClass: 'A', description: '' };
}

/** The kinds an existing instrument may change to: those measuring in its unit (its calibrations are in it). */
export function kindsFor(existing: InstrumentSpec | undefined): readonly InstrumentKind[] {
  return existing ? INSTRUMENT_KINDS.filter((k) => UNIT_OF_KIND[k] === UNIT_OF_KIND[existing.kind]) : INSTRUMENT_KINDS;
}

/** A figure as plain text to 6 significant digits (1100, not 1100.00): the form's own figures and the limits it names. */
const plain = (x: number) => String(Number(x.toPrecision(6)));

interface Converter { value: (si: number) => number; toSi: (x: number) => number; diff: (si: number) => number; diffToSi: (x: number) => number }

function converterOf(kind: InstrumentKind, unit: string): Converter {
  const si = UNIT_OF_KIND[kind];
  if (si === 'Pa' && isPressureUnit(unit)) {
    return { value: (x) => pressureFromPa(x, unit), toSi: (x) => pressureToPa(x, unit), diff: (x) => pressureFromPa(x, unit), diffToSi: (x) => pressureToPa(x, unit) };
  }
  if (si === 'K' && isTemperatureUnit(unit)) {
    return { value: (x) => temperatureFromK(x, unit), toSi: (x) => temperatureToK(x, unit), diff: (x) => temperatureDifferenceFromK(x, unit), diffToSi: (x) => temperatureDifferenceToK(x, unit) };
  }
  const same = (x: number) => x;
  return { value: same, toSi: same, diff: same, diffToSi: same };
}

/** The stored instrument as the form shows it, figures in its display unit. */
export function draftOfInstrument(r: InstrumentRecord): InstrumentDraft {
  const unit = unitForKind(r.spec.kind, r.displayUnit);
  const c = converterOf(r.spec.kind, unit);
  const t = r.spec.tolerance;
  const n = plain;
  return {
    tag: r.tag, kind: r.spec.kind, unit, low: n(c.value(r.spec.range.low)), high: n(c.value(r.spec.range.high)), classBasis: t.kind,
    classValue: t.kind === 'percent-of-span' ? n(t.percentOfSpan) : t.kind === 'stated' ? n(c.diff(t.plusMinus)) : '',
    rtdClass: t.kind === 'iec-60751' ? t.sensorClass : 'A', description: r.description,
  };
}

const CORE_FIELDS: Record<string, InstrumentField> = {
  'instrument tag': 'tag', 'instrument kind': 'kind', 'range low': 'low', 'range high': 'high', 'accuracy class': 'classValue',
};

/**
 * The form in SI as the store takes it, checked against the core's limits (tag 1–64 characters,
 * range inside the kind's, high above low, class 0–10 % of span or a stated ± from 0 to the span),
 * or the errors by field, each naming the field and its valid range in the form's unit.
 * `existing`: the stored spec an edit starts from (its other members are kept).
 */
export function instrumentFromDraft(d: InstrumentDraft, existing?: InstrumentSpec):
  | { ok: true; instrument: NewInstrument }
  | { ok: false; errors: Partial<Record<InstrumentField, string>> } {
  const errors: Partial<Record<InstrumentField, string>> = {};
  const tag = d.tag.trim();
  if (tag === '' || tag.length > INSTRUMENT_TEXT_LIMITS.tag) errors.tag = `tag: ${tag === '' ? 'empty' : `${tag.length} characters`}; give the plant's tag, 1 to ${INSTRUMENT_TEXT_LIMITS.tag} characters.`;
  if (!kindsFor(existing).includes(d.kind)) errors.kind = `kind: expected one of ${kindsFor(existing).join(', ')} (an instrument's kind changes only to one measuring in the same unit).`;
  if (!unitsOfKind(d.kind).some((u) => u.id === d.unit)) errors.unit = `unit: "${d.unit}" is not a unit for a ${d.kind}; choose one from the list.`;
  if (d.description.length > INSTRUMENT_TEXT_LIMITS.description) errors.description = `description: ${d.description.length} characters; allowed 0 to ${INSTRUMENT_TEXT_LIMITS.description}.`;
  if (errors.kind || errors.unit) return { ok: false, errors };
  const c = converterOf(d.kind, d.unit);
  const si = UNIT_OF_KIND[d.kind];
  const R = si === 'Pa' ? INSTRUMENT_LIMITS.rangePa : si === 'K' ? INSTRUMENT_LIMITS.rangeK : INSTRUMENT_LIMITS.rangeKg;
  const shown = unitLabel(d.unit);
  const lim = (x: number) => plain(c.value(x));
  const number = (field: 'low' | 'high', name: string): number | undefined => {
    try {
      const v = c.toSi(readNumber(d[field], name));
      if (v < R.min || v > R.max) errors[field] = `${name}: ${d[field].trim()} ${shown} is outside the valid range ${lim(R.min)} to ${lim(R.max)} ${shown}.`;
      return v;
    } catch (e) {
      errors[field] = e instanceof Error ? e.message : String(e);
      return undefined;
    }
  };
  const low = number('low', 'range low');
  const high = number('high', 'range high');
  if (low !== undefined && high !== undefined && !errors.low && !errors.high && high <= low) {
    errors.high = `range high: ${d.high.trim()} ${shown} must be above the range low (${d.low.trim()} ${shown}).`;
  }
  const span = low !== undefined && high !== undefined && high > low ? high - low : undefined;
  let tolerance: InstrumentTolerance | undefined;
  if (d.classBasis === 'iec-60751') {
    if (si !== 'K') errors.classValue = 'accuracy class: IEC 60751 classes AA, A and B apply to temperature sensors only.';
    else tolerance = { kind: 'iec-60751', sensorClass: d.rtdClass };
  } else {
    try {
      const v = readNumber(d.classValue, 'accuracy class');
      if (d.classBasis === 'percent-of-span') {
        const P = INSTRUMENT_LIMITS.percentOfSpan;
        if (v < P.min || v > P.max) errors.classValue = `accuracy class: ${d.classValue.trim()} % of span is outside the valid range ${P.min} to ${P.max} % of span.`;
        tolerance = { kind: 'percent-of-span', percentOfSpan: v };
      } else {
        const plusMinus = c.diffToSi(v);
        if (span !== undefined && (plusMinus < 0 || plusMinus > span)) {
          errors.classValue = `stated tolerance: ± ${d.classValue.trim()} ${shown} is outside the valid range 0 to ${plain(c.diff(span))} ${shown} (the span).`;
        }
        tolerance = { kind: 'stated', plusMinus };
      }
    } catch (e) {
      errors.classValue = e instanceof Error ? e.message : String(e);
    }
  }
  if (Object.keys(errors).length > 0 || low === undefined || high === undefined || tolerance === undefined) return { ok: false, errors };
  const spec: InstrumentSpec = { ...(existing ?? {}), tag, kind: d.kind, range: { low, high }, tolerance };
  // What the form does not show must still fit the new range (a stated indicator limit within the span).
  try {
    validateInstrument(spec);
  } catch (e) {
    const field = e instanceof InputError ? CORE_FIELDS[e.field] ?? 'classValue' : 'classValue';
    return { ok: false, errors: { [field]: e instanceof Error ? e.message : String(e) } };
  }
  return { ok: true, instrument: { spec, displayUnit: d.unit, description: d.description } };
}
