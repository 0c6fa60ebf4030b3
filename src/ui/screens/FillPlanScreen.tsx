// Fill plan: how much water to charge for a target condition, and the most water the vessel can
// take. The plan is shown in a neutral box (green belongs to an agreeing check), every line in plain
// words, the details folded.
import { useMemo } from 'preact/hooks';
import { TEMPERATURE_UNITS, type TemperatureUnit } from '../../core/basics.ts';
import { VesselPicker } from '../components/VesselPicker.tsx';
import { NumberField } from '../components/NumberField.tsx';
import { Choice } from '../components/Choice.tsx';
import { ResultCard } from '../components/ResultCard.tsx';
import { StandingNote } from '../components/StandingNote.tsx';
import { useSettings, useVessels } from '../state/app-state.ts';
import { useDraft } from '../state/drafts.ts';
import { emptyFillDraft, evaluateFill, type FillDraft } from '../state/fill-session.ts';
import { unitsInForce } from '../state/settings-model.ts';

const TARGETS = [
  { id: 'quality', label: 'Steam share by mass' },
  { id: 'vapor-space-fraction', label: 'Steam share of the space' },
  { id: 'dry-saturated', label: 'Only dry steam, no water' },
] as const;

export function FillPlanScreen() {
  const settings = useSettings();
  const prefs = unitsInForce(settings);
  const vessels = useVessels();
  const draft = useDraft<FillDraft>('fill-plan', emptyFillDraft(prefs));
  const d = draft.value;
  const set = (change: Partial<FillDraft>) => draft.set({ ...d, ...change });
  const vessel = vessels.find((v) => v.id === d.vesselId && !v.retired);
  const ev = useMemo(() => evaluateFill(d, vessel, prefs), [d, vessel, settings]);
  const err = ev.kind === 'input-error' ? ev.errors : {};
  const tu = TEMPERATURE_UNITS.find((u) => u.id === d.temperatureUnit)?.label ?? d.temperatureUnit;
  const du = d.temperatureUnit === 'degC' ? 'K' : tu;
  return (
    <div>
      <form class="fill-plan" onSubmit={(e) => e.preventDefault()} noValidate>
        <VesselPicker id="fill-vessel" vessels={vessels} value={vessel ? d.vesselId : ''} onChange={(vesselId) => set({ vesselId })} />
        <NumberField id="fill-target" label="Temperature to heat to" value={d.target} onInput={(target) => set({ target })}
          unit={d.temperatureUnit} units={TEMPERATURE_UNITS} onUnit={(u) => set({ temperatureUnit: u as TemperatureUnit })} error={err.target} />
        <Choice name="fill-kind" legend="At that temperature, aim for" value={d.targetKind} options={TARGETS} onChange={(targetKind) => set({ targetKind })} />
        {d.targetKind === 'dry-saturated' ? null : (
          <NumberField id="fill-value" label={d.targetKind === 'quality' ? 'Steam, % of the contents by mass' : 'Steam, % of the space inside'}
            value={d.targetValue} onInput={(targetValue) => set({ targetValue })} error={err.targetValue} />
        )}
        <NumberField id="fill-start" label={`Temperature of the water you charge (${tu})`} value={d.start} onInput={(start) => set({ start })} error={err.start} />
        <NumberField id="fill-margin" label={`Safety margin before it could fill with water (${du})`} value={d.margin}
          onInput={(margin) => set({ margin })} error={err.margin}
          hint={`The most water it can take still leaves steam space at this many ${du} above the temperature where its steam reaches the relief set pressure.`} />
        <details class="result-folded">
          <summary>Heating time (optional)</summary>
          <NumberField id="fill-power" label="Heater power reaching the contents (kW)" value={d.powerKW} onInput={(powerKW) => set({ powerKW })} error={err.power} />
          <NumberField id="fill-cap" label="Heat the empty vessel takes per degree (kJ/K)" value={d.heatCapacityKJPerK}
            onInput={(heatCapacityKJPerK) => set({ heatCapacityKJPerK })} error={err.heatCapacity} />
        </details>
      </form>
      <div aria-live="polite" aria-atomic="true" class="field" data-plan-state={ev.kind}>
        {ev.kind === 'plan' ? <p class="visually-hidden">{ev.view.verdict.text}</p> : null}
        {ev.kind === 'incomplete' ? <p>{ev.message}</p> : null}
        {ev.kind === 'input-error' && ev.general ? <p class="field-error">{ev.general}</p> : null}
      </div>
      {ev.kind === 'plan' ? <ResultCard view={ev.view} heading="Plan" findingsTitle="Cautions for this plan" /> : <StandingNote />}
    </div>
  );
}
