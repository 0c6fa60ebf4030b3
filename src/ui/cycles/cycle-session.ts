// What the Cycle screen composes: the draft (vessel, entry mode, cycle type, units, the live
// cycle), the readings from the live entry or the file, the core's evaluation of them, and saving
// the result as a record of kind "cycle".
import { useMemo, useState } from 'preact/hooks';
import { useDraft } from '../state/drafts.ts';
import { useSettings, useVessels } from '../state/app-state.ts';
import * as repo from '../state/repo.ts';
import { unitsInForce } from '../state/settings-model.ts';
import type { ColumnChoice, FileReadings, RecorderFile } from './cycle-file.ts';
import { defaultCycleFields, evaluateTypedCycle, type CycleOutcome, type CycleTypeFields, type ReadingUnits, type TypedReading } from './cycle-input.ts';
import { cycleRecord, type CycleSource } from './cycle-record.ts';
import { intervalSOf, LIVE_START, typedOfLive, type LiveState } from './live-cycle.ts';

/** The draft key of the Cycle screen's entry. */
export const CYCLE_DRAFT = 'cycle';

export interface CycleDraft {
  vesselId: string;
  mode: 'live' | 'file';
  fields: CycleTypeFields | null;
  units: ReadingUnits | null;
  live: LiveState;
}

const START: CycleDraft = { vesselId: '', mode: 'live', fields: null, units: null, live: LIVE_START };

export function useCycleSession() {
  const draft = useDraft<CycleDraft>(CYCLE_DRAFT, START);
  const d = draft.value;
  const vessels = useVessels();
  const prefs = unitsInForce(useSettings());
  const vessel = vessels.find((v) => v.id === d.vesselId && !v.retired);
  const vesselUnits = vessel?.spec.readingUnits ?? { pressure: prefs.pressure, temperature: prefs.temperature };
  const units: ReadingUnits = d.units ?? { temperature: vesselUnits.temperature, pressure: vesselUnits.pressure, reference: 'gauge' };
  const fields = d.fields ?? defaultCycleFields(units.temperature);
  const [file, setFile] = useState<{ readings: FileReadings | null; file: RecorderFile | null; choice: ColumnChoice } | null>(null);

  const typed: TypedReading[] = d.mode === 'live' ? typedOfLive(d.live) : file?.readings?.kind === 'readings' ? file.readings.readings : [];
  const outcome: CycleOutcome | null = useMemo(
    () => (vessel && typed.length >= 2 ? evaluateTypedCycle(vessel.spec, fields, typed, units) : null),
    [vessel, JSON.stringify(typed), JSON.stringify(fields), JSON.stringify(units)],
  );

  const save = async (technician: string, note: string): Promise<string> => {
    if (!vessel || outcome?.kind !== 'result') throw new Error('there is no evaluated cycle to save');
    const source: CycleSource = d.mode === 'live'
      ? { kind: 'live', intervalS: intervalSOf(d.live.intervalText) }
      : { kind: 'file', fileName: file?.file?.name ?? '', columns: { ...(file?.choice ?? {}) } };
    const startedAtMs = d.mode === 'live' ? d.live.startedAtMs : file?.readings?.kind === 'readings' ? file.readings.startedAtMs : null;
    const record = cycleRecord({
      vesselId: vessel.id, technician, note, startedAt: new Date(startedAtMs ?? Date.now()),
      values: { source, units, cycleTypeTyped: fields, typedReadings: typed, input: outcome.input, evaluation: outcome.evaluation },
    });
    // A live cycle's draft goes with the save, in the same transaction; the cycle type stays for the next.
    const saved = await repo.appendRecord('cycle', record, d.mode === 'live' ? CYCLE_DRAFT : undefined);
    if (d.mode === 'live') draft.set({ ...d, fields, units, live: { ...LIVE_START, intervalText: d.live.intervalText } });
    return saved.id;
  };

  return {
    draft, d, vessels, vessel, units, fields, outcome, typed,
    setFile: (readings: FileReadings | null, f: RecorderFile | null, choice: ColumnChoice) => setFile({ readings, file: f, choice }),
    chooseVessel: (id: string) => {
      const v = vessels.find((x) => x.id === id);
      const u = v?.spec.readingUnits;
      draft.set({ ...d, vesselId: id, units: u ? { temperature: u.temperature, pressure: u.pressure, reference: 'gauge' } : d.units, fields: d.fields ?? (u ? defaultCycleFields(u.temperature) : null) });
    },
    save,
  };
}
