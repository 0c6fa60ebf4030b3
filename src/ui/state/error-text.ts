// The core states a refused value and its valid range in SI (K, Pa, kg, m). A person who typed °F or
// psi should read the range in °F or psi, so out-of-range messages are re-stated here, at the edge,
// in the unit of the field they typed into. Anything else — and any message the core wrote for a
// particular case — keeps the core's own words.
import {
  InputError, LENGTH_UNITS, MASS_UNITS, PRESSURE_UNITS, TEMPERATURE_UNITS,
  lengthFromM, massFromKg, pressureFromPa, temperatureFromK,
  type LengthUnit, type MassUnit, type PressureUnit, type TemperatureUnit,
} from '../../core/index.ts';
import { formatNumber } from './format.ts';
import { messageOf } from './atmosphere.ts';

/** The unit a field was typed in. */
export type FieldUnit =
  | { kind: 'temperature'; unit: TemperatureUnit }
  | { kind: 'pressure'; unit: PressureUnit }
  | { kind: 'mass'; unit: MassUnit }
  | { kind: 'length'; unit: LengthUnit };

const SI_UNIT: Record<FieldUnit['kind'], string> = { temperature: 'K', pressure: 'Pa', mass: 'kg', length: 'm' };

function fromSi(si: number, u: FieldUnit): number {
  switch (u.kind) {
    case 'temperature': return temperatureFromK(si, u.unit);
    case 'pressure': return pressureFromPa(si, u.unit);
    case 'mass': return massFromKg(si, u.unit);
    case 'length': return lengthFromM(si, u.unit);
  }
}

function labelOf(u: FieldUnit): string {
  const list: readonly { id: string; label: string }[] =
    u.kind === 'temperature' ? TEMPERATURE_UNITS : u.kind === 'pressure' ? PRESSURE_UNITS : u.kind === 'mass' ? MASS_UNITS : LENGTH_UNITS;
  return list.find((x) => x.id === u.unit)?.label ?? u.unit;
}

/**
 * The message for an error, with an out-of-range value and its valid range shown in `typedIn`
 * when the core's range is in the matching SI unit; otherwise the error's own message.
 */
export function errorText(e: unknown, typedIn?: FieldUnit): string {
  if (!(e instanceof InputError) || !typedIn || e.problem !== 'out-of-range' || !e.range || e.hasCustomMessage) return messageOf(e);
  if (typeof e.value !== 'number' || e.range.unit !== SI_UNIT[typedIn.kind]) return messageOf(e);
  const unit = labelOf(typedIn);
  const show = (si: number) => withoutTrailingZeros(formatNumber(fromSi(si, typedIn), 6));
  return `${e.field}: ${show(e.value)} ${unit} is outside the valid range, ${show(e.range.min)} to ${show(e.range.max)} ${unit}.`;
}

/** "0.0100000" → "0.01", "426.850" → "426.85", "0.00000" → "0": a range limit needs no padding. */
function withoutTrailingZeros(text: string): string {
  return text.replace(/([.,]\d*?)0+$/, '$1').replace(/[.,]$/, '');
}
