// The core states a refused value and its valid range in SI (K, Pa, kg, m), and sometimes in its
// own words with SI figures ("-50000 Pa is at or below zero. Valid range: 611.657 to 22064000 Pa").
// A person who typed "-50" in kPa should read kPa, see what they typed quoted as they typed it, and
// read negative limits with a true minus, so every range message is written here, at the edge, in
// the unit of the field: the value quoted as typed, the range in that unit, and for the few
// refusals that need a reason (a vacuum beyond the atmosphere, a gross weight at the tare) the
// reason in the same unit. Anything else keeps the core's own words.
import {
  InputError, LENGTH_UNITS, MASS_UNITS, PRESSURE_UNITS, TEMPERATURE_UNITS,
  lengthFromM, massFromKg, pressureFromPa, temperatureFromK,
  type LengthUnit, type MassUnit, type PressureUnit, type TemperatureUnit,
} from '../../core/basics.ts';
import { formatNumber } from './format.ts';
import { messageOf } from './atmosphere.ts';

/** The unit a field was typed in. */
export type FieldUnit =
  | { kind: 'temperature'; unit: TemperatureUnit }
  | { kind: 'pressure'; unit: PressureUnit }
  | { kind: 'mass'; unit: MassUnit }
  | { kind: 'length'; unit: LengthUnit };

const SI_UNIT: Record<FieldUnit['kind'], string> = { temperature: 'K', pressure: 'Pa', mass: 'kg', length: 'm' };

/** Longest typed text quoted back; longer is cut with an ellipsis (the same length as the core's parser quotes). */
const QUOTE_MAX = 40;

function fromSi(si: number, u: FieldUnit): number {
  switch (u.kind) {
    case 'temperature': return temperatureFromK(si, u.unit);
    case 'pressure': return pressureFromPa(si, u.unit);
    case 'mass': return massFromKg(si, u.unit);
    case 'length': return lengthFromM(si, u.unit);
  }
}

/** The display symbol of a field's unit. */
export function unitSymbol(u: FieldUnit): string {
  const list: readonly { id: string; label: string }[] =
    u.kind === 'temperature' ? TEMPERATURE_UNITS : u.kind === 'pressure' ? PRESSURE_UNITS : u.kind === 'mass' ? MASS_UNITS : LENGTH_UNITS;
  return list.find((x) => x.id === u.unit)?.label ?? u.unit;
}

/** What the person typed, quoted, cut short if it is long. */
export function quoted(text: string): string {
  const t = text.trim();
  return `"${t.length > QUOTE_MAX ? `${t.slice(0, QUOTE_MAX - 3)}…` : t}"`;
}

/** A limit in the typed unit: six significant digits, no padding zeros, a true minus. */
function limit(si: number, u: FieldUnit): string {
  const v = fromSi(si, u);
  if (Math.abs(v) >= 1e15) return v > 0 ? 'an enormous number' : 'an enormous negative number';
  return withoutTrailingZeros(formatNumber(v, 6));
}

/**
 * The message for an error. An out-of-range or inconsistent InputError whose range is in the SI
 * unit of `typedIn` is written in that unit, quoting `typedText` (what the person typed) when
 * given; otherwise the error's own message.
 */
export function errorText(e: unknown, typedIn?: FieldUnit, typedText?: string): string {
  if (!(e instanceof InputError) || !typedIn || !e.range || e.range.unit !== SI_UNIT[typedIn.kind]) return messageOf(e);
  if (e.problem !== 'out-of-range' && e.problem !== 'inconsistent') return messageOf(e);
  const unit = unitSymbol(typedIn);
  const value = typedText !== undefined && typedText.trim() !== '' ? `${quoted(typedText)} ${unit}`
    : typeof e.value === 'number' ? `${limit(e.value, typedIn)} ${unit}` : quoted(String(e.value));
  const { min, max } = e.range;
  const gauge = e.field.includes('(gauge)') ? ' gauge' : '';
  const span = `${limit(min, typedIn)} to ${limit(max, typedIn)} ${unit}${gauge}`;
  if (e.field === 'gross weight' && e.problem === 'inconsistent') {
    return `gross weight: ${value} is at or below the tare (${limit(min, typedIn)} ${unit}); the vessel would hold no water. Enter a weight above the tare.`;
  }
  if (e.field === 'relief set pressure' && e.problem === 'inconsistent') {
    return `relief set pressure: ${value} is above the MAWP (${limit(max, typedIn)} ${unit}); it must be at most the MAWP.`;
  }
  if (e.problem === 'out-of-range' && gauge && typeof e.value === 'number' && e.value <= min) {
    return `${e.field}: ${value} is a vacuum beyond the atmosphere; the absolute pressure would be at or below zero. Valid range: ${span}.`;
  }
  return `${e.field}: ${value} is outside the valid range, ${span}.`;
}

/** "0.0100000" → "0.01", "426.850" → "426.85", "0.00000" → "0": a range limit needs no padding. */
function withoutTrailingZeros(text: string): string {
  return text.replace(/([.,]\d*?)0+$/, '$1').replace(/[.,]$/, '');
}
