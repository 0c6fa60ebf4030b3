// Everything the Check screen composes: the draft (kept as typed), the vessel and its instrument
// units, the engine's evaluation, what the outcome strip says, and the full result — which follows
// the typing a moment later (when the keys pause), so a keystroke repaints only its field and the
// strip.
import { useEffect, useMemo, useState } from 'preact/hooks';
import type { ReadingUnits, VesselSpec } from '../../core/index.ts';
import type { FittedForCheck } from '../../core/instrument/vessel-instruments.ts';
import * as repo from './repo.ts';
import { useSettings, useVessels } from './app-state.ts';
import { useDraft } from './drafts.ts';
import { CHECK_DRAFT_KEY, emptyCheckDraft, inVesselUnits, vesselUnits, type CheckDraft } from './check-draft.ts';
import { siteAtmosphere } from './atmosphere.ts';
import { unitsInForce } from './settings-model.ts';
import { useEngine } from './engine.ts';
import type { Evaluation } from './check-session.ts';
import type { StripView } from '../components/OutcomeStrip.tsx';

/** How long the keys must rest before the full result below follows them, ms (the strip follows every key). */
const DETAILS_AFTER_MS = 120;

/** `value` once it has stayed the same for `delayMs`; `settled` is false while it lags behind. */
export function useSettled<T>(value: T, delayMs: number): { value: T; settled: boolean } {
  const [shown, setShown] = useState(value);
  useEffect(() => {
    if (shown === value) return;
    const t = setTimeout(() => setShown(() => value), delayMs);
    return () => clearTimeout(t);
  }, [value]);
  return { value: shown, settled: shown === value };
}

/**
 * `value` one frame later: set in the first task after the next frame is drawn. The key press's own
 * paint then shows the typed character with nothing else to do; the evaluation and the strip
 * follow in the next frame.
 */
export function useAfterPaint<T>(value: T): T {
  const [shown, setShown] = useState(value);
  useEffect(() => {
    if (shown === value) return;
    let live = true;
    requestAnimationFrame(() => {
      const channel = new MessageChannel();
      channel.port1.onmessage = () => { if (live) setShown(() => value); };
      channel.port2.postMessage(0);
    });
    return () => { live = false; };
  }, [value]);
  return shown;
}

export function stripOf(engineReady: boolean, e: Evaluation | undefined): StripView {
  if (!engineReady || !e) return { kind: 'loading', message: 'Getting the steam tables ready…' };
  if (e.kind === 'incomplete') return { kind: 'incomplete', message: e.message };
  if (e.kind === 'input-error') {
    // A short line: the full message stands under its field, which the strip must not cover.
    const names = { temperature: 'temperature', pressure: 'pressure', gross: 'gross weight' } as const;
    const fields = (Object.keys(e.errors) as (keyof typeof names)[]).map((k) => names[k]);
    return { kind: 'input-error', message: fields.length ? `No result: see the ${fields.join(' and ')} field below.` : (e.general ?? 'No result.') };
  }
  return { kind: 'result', ...e.strip };
}

export function useCheckEntry(routeVesselId: string | undefined) {
  const settings = useSettings();
  const prefs = unitsInForce(settings);
  const vessels = useVessels();
  const draft = useDraft<CheckDraft>(CHECK_DRAFT_KEY, emptyCheckDraft(prefs, settings.technician));
  const d = draft.value;
  const vessel = vessels.find((v) => v.id === d.vesselId && !v.retired);
  const spec = vessel?.spec as VesselSpec | undefined;
  const units: ReadingUnits | undefined = spec ? vesselUnits(spec, prefs) : undefined;

  // A label's link (#/check/<vessel id>) picks its vessel once the draft and the list are read.
  useEffect(() => {
    if (!draft.loaded || !routeVesselId || !vessels.some((v) => v.id === routeVesselId && !v.retired)) return;
    draft.update((x) => (x.vesselId === routeVesselId ? x : { ...x, vesselId: routeVesselId }));
  }, [draft.loaded, routeVesselId, vessels]);
  // Empty fields take the vessel's own units: on launch, on a new vessel, after a save.
  useEffect(() => {
    if (draft.loaded && units) draft.update((x) => inVesselUnits(x, units));
  }, [draft.loaded, vessel?.id, units?.pressure, units?.temperature, units?.mass]);

  // The vessel's register instruments, read again whenever the vessel changes (a calibration entered elsewhere counts at once).
  const [fitted, setFitted] = useState<{ vesselId: string; fitted: FittedForCheck } | undefined>(undefined);
  useEffect(() => {
    if (!vessel) return;
    let live = true;
    const id = vessel.id;
    repo.fittedForCheck(id).then((f) => live && setFitted({ vesselId: id, fitted: f }), () => live && setFitted({ vesselId: id, fitted: {} }));
    return () => { live = false; };
  }, [vessel?.id]);
  const fittedNow = vessel && fitted?.vesselId === vessel.id ? fitted.fitted : undefined;

  const engine = useEngine();
  const atm = useMemo(() => siteAtmosphere(settings.atmosphere), [settings.atmosphere]);
  const measured = settings.atmosphere.mode === 'barometer' && atm.ok ? atm.pressurePa : undefined;
  const typed = useAfterPaint(d);
  const evaluation = useMemo(() => {
    if (!engine) return undefined;
    // A User Timing entry per evaluation: the speed benchmark tells the engine's share of a key press by it.
    const t0 = performance.now();
    const e = engine.evaluateDraft(typed, vessel, measured, prefs, fittedNow);
    performance.measure('tankside: evaluate the check', { start: t0 });
    return e;
  }, [engine, typed, vessel, settings, fittedNow]);
  const strip = useMemo(() => stripOf(engine !== undefined, evaluation), [engine, evaluation]);
  const details = useSettled(evaluation, DETAILS_AFTER_MS);
  const chooseVessel = useMemo(() => (vesselId: string) => draft.update((x) => ({ ...x, vesselId })), [draft.update]);
  const afterSave = () => draft.set(inVesselUnits({ ...emptyCheckDraft(prefs, d.technician), vesselId: d.vesselId }, units ?? vesselUnits(undefined, prefs)));
  return { settings, vessels, draft, vessel, units, atm, evaluation, strip, details, afterSave, chooseVessel };
}
