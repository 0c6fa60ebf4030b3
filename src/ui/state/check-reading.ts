// The check entry as typed → the engine's Reading (SI). Each field's parse error names the field.
import { readNumber } from './format.ts';
import { massToKg, pressureToPa, temperatureToK } from '../../core/basics.ts';
import type { Reading } from '../../core/check/reading.ts';
import type { CheckDraft } from './check-draft.ts';
import { messageOf } from './atmosphere.ts';
import { formatIsoWithOffset } from '../../store/index.ts';

export type ReadingField = 'temperature' | 'pressure' | 'gross';

export type ReadingResult =
  | { kind: 'incomplete'; message: string }
  | { kind: 'input-error'; errors: Partial<Record<ReadingField, string>> }
  | { kind: 'reading'; reading: Reading };

/**
 * Reads the draft. `measuredAtmospherePa` is a barometer reading taken today (from Settings);
 * without it the vessel's own site atmosphere applies.
 */
export function readingFromDraft(d: CheckDraft, measuredAtmospherePa: number | undefined, now = new Date()): ReadingResult {
  const missing = [
    d.temperature.text.trim() ? '' : 'temperature',
    d.pressure.text.trim() ? '' : 'pressure',
  ].filter(Boolean);
  const errors: Partial<Record<ReadingField, string>> = {};
  const read = (field: ReadingField, words: string, text: string, convert: (n: number) => number): number => {
    if (text.trim() === '') return NaN;
    try { return convert(readNumber(text, words)); } catch (e) { errors[field] = messageOf(e); return NaN; }
  };
  const temperatureK = read('temperature', 'temperature', d.temperature.text, (n) => temperatureToK(n, d.temperature.unit));
  const pressurePa = read('pressure', 'pressure', d.pressure.text, (n) => pressureToPa(n, d.pressure.unit));
  const grossKg = read('gross', 'gross weight', d.gross.text, (n) => massToKg(n, d.gross.unit));
  if (Object.keys(errors).length) return { kind: 'input-error', errors };
  if (missing.length) return { kind: 'incomplete', message: `Enter the ${missing.join(' and ')} to see the result (the gross weight is optional).` };
  const reading: Reading = {
    time: formatIsoWithOffset(now),
    temperatureK,
    pressure: { reference: d.pressure.kind, pressurePa },
    weight: d.gross.text.trim() === '' ? { kind: 'not-weighed' } : { kind: 'gross', grossKg },
  };
  if (measuredAtmospherePa !== undefined) reading.atmospherePa = measuredAtmospherePa;
  return { kind: 'reading', reading };
}
