// One check from entry to log: the draft → Reading → evaluateCheck → what the screen shows, and
// the record saved to the log. All computation is the core's.
import { errorText, type FieldUnit } from './error-text.ts';
import { InputError, evaluateCheck, type CheckResult } from '../../core/index.ts';
import type { Reading } from '../../core/index.ts';
import type { CheckRecord, TypedInput, VesselRecord } from '../../store/index.ts';
import * as repo from './repo.ts';
import type { CheckDraft } from './check-draft.ts';
import { readingFromDraft, type ReadingField } from './check-reading.ts';
import { messageOf } from './atmosphere.ts';
import { resultView, verdictText } from './result-text.ts';
import type { ResultView } from './result-view.ts';
import type { UnitPrefs } from './settings-model.ts';

export type Evaluation =
  | { kind: 'incomplete'; message: string }
  | { kind: 'input-error'; errors: Partial<Record<ReadingField, string>>; general?: string }
  | { kind: 'result'; view: ResultView; reading: Reading; result: CheckResult };

const ENGINE_FIELDS: Record<string, ReadingField> = {
  temperature: 'temperature', pressure: 'pressure', 'pressure (gauge)': 'pressure', 'pressure (absolute)': 'pressure',
  'gross weight': 'gross', 'net weight': 'gross',
};

function typedUnit(d: CheckDraft, field: ReadingField): FieldUnit {
  switch (field) {
    case 'temperature': return { kind: 'temperature', unit: d.temperature.unit };
    case 'pressure': return { kind: 'pressure', unit: d.pressure.unit };
    case 'gross': return { kind: 'mass', unit: d.gross.unit };
  }
}

/** Evaluates the entry as typed; `measuredAtmospherePa` is a barometer reading from Settings, if any. */
export function evaluateDraft(
  d: CheckDraft, vessel: VesselRecord | undefined, measuredAtmospherePa: number | undefined, prefs: UnitPrefs,
): Evaluation {
  if (!vessel) return { kind: 'incomplete', message: 'Choose a vessel to see the result.' };
  const r = readingFromDraft(d, measuredAtmospherePa);
  if (r.kind !== 'reading') return r;
  const spec = vessel.spec;
  try {
    const result = evaluateCheck(spec, r.reading);
    return { kind: 'result', view: resultView(result, spec, prefs), reading: r.reading, result };
  } catch (e) {
    const field = e instanceof InputError ? ENGINE_FIELDS[e.field] : undefined;
    if (field) return { kind: 'input-error', errors: { [field]: errorText(e, typedUnit(d, field)) } };
    return { kind: 'input-error', errors: {}, general: `No result: ${messageOf(e)}` };
  }
}

/** Appends the check to the log; resolves once the store has committed it. */
export function saveCheck(d: CheckDraft, vessel: VesselRecord, e: Extract<Evaluation, { kind: 'result' }>): Promise<CheckRecord> {
  const inputs: Record<string, TypedInput> = {
    temperature: { text: d.temperature.text, unit: d.temperature.unit },
    pressure: { text: d.pressure.text, unit: d.pressure.unit, reference: d.pressure.kind },
  };
  if (d.gross.text.trim() !== '') inputs.grossWeight = { text: d.gross.text, unit: d.gross.unit };
  return repo.appendCheck({
    vesselId: vessel.id,
    technician: d.technician.trim(),
    note: d.note,
    takenAt: new Date(e.reading.time),
    inputs,
    reading: e.reading,
    result: e.result,
    // The log keeps each caution's stored wording (°C, K, kPa, kg); its parts stay in the result.
    cautions: e.result.cautions.map(({ signal, message, rule }) => ({ signal, message, rule })),
    appVersion: __APP_VERSION__,
    formulationId: e.result.formulationId,
  });
}

/**
 * The saved result as the screen shows it, from the stored result and vessel snapshot (nothing
 * recomputed); undefined if this version cannot read a result saved by another version.
 */
export function viewOfRecord(r: CheckRecord, prefs: UnitPrefs): ResultView | undefined {
  try {
    return resultView(r.result, r.vessel.spec, prefs);
  } catch {
    return undefined;
  }
}

/** A one-line verdict for the log list. */
export function verdictOfRecord(r: CheckRecord): string {
  try {
    return verdictText(r.result).text;
  } catch {
    return 'Result saved by another app version';
  }
}
