// One check from entry to log: the draft → Reading → evaluateCheck → what the screen shows, and
// the record saved to the log. All computation is the core's.
import { errorText, type FieldUnit } from './error-text.ts';
import { InputError, evaluateCheck, isMassUnit, isPressureUnit, isTemperatureUnit, pressureFromPa, type CheckResult, type VesselSpec } from '../../core/index.ts';
// The instruments room by its file, not through an index (see src/core/instrument/README.md, "Imports").
import { vesselWithInstruments, withInstrumentFindings, type FittedForCheck } from '../../core/instrument/vessel-instruments.ts';
import { gaugeSpanError } from './gauge-span.ts';
import type { Reading } from '../../core/index.ts';
import type { CheckRecord, StoredCaution, TypedInput, VesselRecord } from '../../store/index.ts';
import { splitOutcome, type Outcome } from './outcome.ts';
import * as repo from './repo.ts';
import { CHECK_DRAFT_KEY, type CheckDraft } from './check-draft.ts';
import { settleDraft } from './drafts.ts';
import { readingFromDraft, type ReadingField } from './check-reading.ts';
import { messageOf } from './atmosphere.ts';
import { keyFiguresOf, resultView, verdictText, type TypedUnits } from './result-text.ts';
import { isDemo } from './demo-label.ts';
import type { Figure, ResultView } from './result-view.ts';
import type { UnitPrefs } from './settings-model.ts';

// The full result's card is drawn only from an evaluation, so it loads with the engine (the Check
// screen takes it from here) rather than at start.
export { ResultCard } from '../components/ResultCard.tsx';

export type Evaluation =
  | { kind: 'incomplete'; message: string }
  | { kind: 'input-error'; errors: Partial<Record<ReadingField, string>>; general?: string }
  | {
    kind: 'result'; reading: Reading; result: CheckResult;
    /** The vessel as the check used it: with a register, its instruments' limits at the reading's time and `instrumentsUsed`. */
    vessel: VesselSpec;
    /** What the outcome strip shows: cheap, computed with every keystroke. */
    strip: { outcome: Outcome; verdict: string; figures: readonly Figure[]; demo: boolean };
    /** The full result, worked out on first use (when the keys pause) and kept. */
    view: () => ResultView;
  };

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

function typedText(d: CheckDraft, field: ReadingField): string {
  return field === 'gross' ? d.gross.text : d[field].text;
}

/**
 * Evaluates the entry as typed; `measuredAtmospherePa` is a barometer reading from Settings, if any;
 * `fitted` the vessel's register instruments (undefined while they are being read).
 */
export function evaluateDraft(
  d: CheckDraft, vessel: VesselRecord | undefined, measuredAtmospherePa: number | undefined, prefs: UnitPrefs, fitted?: FittedForCheck,
): Evaluation {
  if (!vessel) return { kind: 'incomplete', message: 'Choose a vessel to see the result.' };
  if (!fitted) return { kind: 'incomplete', message: "Reading the vessel's instruments…" };
  const r = readingFromDraft(d, measuredAtmospherePa);
  if (r.kind !== 'reading') return r;
  const spec = vessel.spec;
  const span = gaugeSpanError(pressureFromPa(r.reading.pressure.pressurePa, d.pressure.unit), d.pressure.text, d.pressure.unit,
    d.pressure.kind, spec, measuredAtmospherePa ?? spec.siteAtmospherePa);
  if (span) return { kind: 'input-error', errors: { pressure: span } };
  try {
    // The band of the reading's own time: a calibration entered later, or one overdue by then, counts as it stood.
    const forCheck = vesselWithInstruments(spec, fitted, { nowMs: Date.parse(r.reading.time), reading: r.reading });
    const result = withInstrumentFindings(evaluateCheck(forCheck.vessel, r.reading), forCheck.findings);
    const typed = { pressure: d.pressure.unit, temperature: d.temperature.unit, mass: d.gross.unit };
    let view: ResultView | undefined;
    const strip = { outcome: splitOutcome(result).outcome, verdict: verdictText(result).short, figures: keyFiguresOf(result, prefs, typed), demo: isDemo(spec) };
    return { kind: 'result', reading: r.reading, result, vessel: forCheck.vessel, strip, view: () => (view ??= resultView(result, forCheck.vessel, prefs, typed)) };
  } catch (e) {
    const field = e instanceof InputError ? ENGINE_FIELDS[e.field] : undefined;
    if (field) return { kind: 'input-error', errors: { [field]: errorText(e, typedUnit(d, field), typedText(d, field)) } };
    return { kind: 'input-error', errors: {}, general: `No result: ${messageOf(e)}` };
  }
}

/** An invented vessel and reading (test data, never shown) for warming the engine. */
const WARM_SPEC: VesselSpec = {
  tag: 'WARM-UP', description: 'invented, never shown', designTemperatureK: 473.15, vacuumRated: false, siteAtmospherePa: 101_325,
  ambientTemperatureK: 293.15, tareKg: 500, mawpGaugePa: 500e3, reliefSetGaugePa: 450e3,
  geometry: { shape: 'horizontal-cylinder', innerDiameterM: 1, straightLengthM: 2, head: { kind: 'torispherical' } },
  instruments: {
    pressureGauge: { spanPa: 1e6, accuracyPercentOfSpan: 1 }, temperatureSensor: { kind: 'iec-60751', sensorClass: 'B' },
    weightToleranceKg: 1, volumeTolerancePercent: 2, barometerTolerancePa: 0,
  },
};

/**
 * Runs the engine and the result view once on invented data: the first call in a page builds the
 * steam engine's tables and compiles the hot paths, so doing it while the page is idle makes the
 * person's first result fit in a frame.
 */
export function warmUp(prefs: UnitPrefs): void {
  for (const [T, p] of [[400, 150e3], [430, 560e3]] as const) {
    const result = evaluateCheck(WARM_SPEC, { time: '2026-01-01T00:00:00Z', temperatureK: T, pressure: { reference: 'absolute', pressurePa: p }, weight: { kind: 'gross', grossKg: 900 } });
    resultView(result, WARM_SPEC, prefs);
  }
}

/**
 * Appends the check to the log; resolves once the store has committed it, and with it the deletion
 * of the entry's draft (one transaction: a close at any moment leaves either the entry unsaved in
 * the form, or the check saved and the form empty, never a saved check still in the form).
 */
export async function saveCheck(d: CheckDraft, vessel: VesselRecord, e: Extract<Evaluation, { kind: 'result' }>): Promise<CheckRecord> {
  const inputs: Record<string, TypedInput> = {
    temperature: { text: d.temperature.text, unit: d.temperature.unit },
    pressure: { text: d.pressure.text, unit: d.pressure.unit, reference: d.pressure.kind },
  };
  if (d.gross.text.trim() !== '') inputs.grossWeight = { text: d.gross.text, unit: d.gross.unit };
  // A draft write still on its way could otherwise land after the deletion and bring the entry back.
  await settleDraft(CHECK_DRAFT_KEY);
  return repo.appendCheck({
    vesselId: vessel.id,
    technician: d.technician.trim(),
    note: d.note,
    takenAt: new Date(e.reading.time),
    inputs,
    reading: e.reading,
    result: e.result,
    vesselSpec: e.vessel,
    // The log keeps each caution's stored wording (°C, K, kPa, kg); its parts stay in the result.
    cautions: e.result.cautions.map(({ signal, message, rule }) => ({ signal, message, rule })),
    appVersion: __APP_VERSION__,
    formulationId: e.result.formulationId,
  }, CHECK_DRAFT_KEY);
}

/**
 * The saved result as the screen shows it, from the stored result and vessel snapshot (nothing
 * recomputed); undefined if this version cannot read a result saved by another version.
 */
export function viewOfRecord(r: CheckRecord, prefs: UnitPrefs): ResultView | undefined {
  try {
    const unit = <U extends string>(name: string, ok: (u: unknown) => u is U): U | undefined => {
      const u = r.inputs[name]?.unit;
      return ok(u) ? u : undefined;
    };
    const typed: TypedUnits = {};
    const p = unit('pressure', isPressureUnit), t = unit('temperature', isTemperatureUnit), m = unit('grossWeight', isMassUnit);
    if (p) typed.pressure = p;
    if (t) typed.temperature = t;
    if (m) typed.mass = m;
    return resultView(r.result, r.vessel.spec, prefs, typed);
  } catch {
    return undefined;
  }
}

/** A one-line verdict for the log list. */
export function verdictOfRecord(r: CheckRecord): string {
  try {
    return verdictText(r.result).short;
  } catch {
    return 'Result saved by another app version';
  }
}

/** A saved check's outcome: the engine's when stored, otherwise derived from its cautions' rules. */
export function outcomeOfRecord(r: CheckRecord): Outcome {
  const own = r.result as { outcome?: unknown; findings?: unknown };
  return splitOutcome(typeof own.outcome === 'string' && Array.isArray(own.findings)
    ? { cautions: r.cautions, findings: own.findings as StoredCaution[], outcome: own.outcome }
    : { cautions: r.cautions }).outcome;
}
