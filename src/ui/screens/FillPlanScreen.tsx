// Fill plan: how much water to charge for a target condition, and the largest charge that stays two-phase.
import { useMemo } from 'preact/hooks';
import { TEMPERATURE_UNITS, type TemperatureUnit } from '../../core/index.ts';
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
  { id: 'quality', label: 'Quality' },
  { id: 'vapor-space-fraction', label: 'Steam space' },
  { id: 'dry-saturated', label: 'Dry steam' },
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
  return (
    <div>
      <form class="fill-plan" onSubmit={(e) => e.preventDefault()} noValidate>
        <VesselPicker id="fill-vessel" vessels={vessels} value={vessel ? d.vesselId : ''} onChange={(vesselId) => set({ vesselId })} />
        <NumberField id="fill-target" label="Target temperature" value={d.target} onInput={(target) => set({ target })}
          unit={d.temperatureUnit} units={TEMPERATURE_UNITS} onUnit={(u) => set({ temperatureUnit: u as TemperatureUnit })} error={err.target} />
        <Choice name="fill-kind" legend="At the target, aim for" value={d.targetKind} options={TARGETS} onChange={(targetKind) => set({ targetKind })} />
        {d.targetKind === 'dry-saturated' ? null : (
          <NumberField id="fill-value" label={d.targetKind === 'quality' ? 'Quality (% steam by mass)' : 'Steam space (% of volume)'}
            value={d.targetValue} onInput={(targetValue) => set({ targetValue })} error={err.targetValue} />
        )}
        <NumberField id="fill-start" label={`Start temperature of the charge (${tu})`} value={d.start} onInput={(start) => set({ start })} error={err.start} />
        <NumberField id="fill-margin" label={`Liquid-full margin above the relief temperature (${tu} difference)`} value={d.margin}
          onInput={(margin) => set({ margin })} error={err.margin} />
        <NumberField id="fill-power" label="Heater power reaching the contents (kW, optional)" value={d.powerKW} onInput={(powerKW) => set({ powerKW })} error={err.power} />
        <NumberField id="fill-cap" label="Heat capacity of the vessel (kJ/K, optional)" value={d.heatCapacityKJPerK}
          onInput={(heatCapacityKJPerK) => set({ heatCapacityKJPerK })} error={err.heatCapacity} />
      </form>
      <div aria-live="polite" aria-atomic="true" class="field">
        {ev.kind === 'plan' ? <p class="visually-hidden">{ev.view.verdict.text}</p> : null}
        {ev.kind === 'incomplete' ? <p>{ev.message}</p> : null}
        {ev.kind === 'input-error' && ev.general ? <p class="field-error">{ev.general}</p> : null}
      </div>
      {ev.kind === 'plan' ? <ResultCard view={ev.view} heading="Plan" /> : <StandingNote />}
    </div>
  );
}
