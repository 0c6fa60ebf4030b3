// What the Steam and chamber tests screen composes: the draft (vessel, test, typed values), the
// core's evaluation of them, and saving it as a record of kind "periodic-test".
import { useMemo } from 'preact/hooks';
import { FORMULATION_ID } from '../../core/steam/constants.ts';
import type { JsonObject } from '../../store/index.ts';
import { useSettings, useVessels } from '../state/app-state.ts';
import { useDraft } from '../state/drafts.ts';
import * as repo from '../state/repo.ts';
import { unitsInForce } from '../state/settings-model.ts';
import { evaluateTest, initialValues, STEAM_TESTS, type SteamTestId, type TestUnits } from './steam-tests.ts';

const DRAFT = 'steam-test';

interface TestDraft { vesselId: string; test: SteamTestId; values: Record<string, string> | null }

export function useSteamTest() {
  const draft = useDraft<TestDraft>(DRAFT, { vesselId: '', test: 'throttling-dryness', values: null });
  const d = draft.value;
  const vessels = useVessels();
  const prefs = unitsInForce(useSettings());
  const units: TestUnits = { pressure: prefs.pressure, temperature: prefs.temperature };
  const def = STEAM_TESTS.find((t) => t.id === d.test) ?? STEAM_TESTS[0]!;
  const values = d.values ?? initialValues(def, units);
  const vessel = vessels.find((v) => v.id === d.vesselId && !v.retired);
  const touched = Object.entries(values).some(([k, v]) => v !== (initialValues(def, units)[k] ?? ''));
  const result = useMemo(() => (touched ? evaluateTest(def, values, units) : null), [def, JSON.stringify(values), units.pressure, units.temperature]);

  const save = async (technician: string, note: string): Promise<string> => {
    if (!vessel || result?.kind !== 'result') throw new Error('there is no evaluated test to save');
    const { summary, ...evaluation } = result.graded;
    const saved = await repo.appendRecord('periodic-test', {
      vesselId: vessel.id, technician, note,
      values: JSON.parse(JSON.stringify({ test: def.id, label: def.label, summary, units, typed: values, evaluation })) as JsonObject,
      cautions: result.graded.cautions.map(({ signal, message, rule }) => ({ signal, message, rule })),
      appVersion: __APP_VERSION__, formulationId: FORMULATION_ID,
    }, DRAFT);
    draft.set({ vesselId: vessel.id, test: def.id, values: null });
    return saved.id;
  };

  return {
    loaded: draft.loaded, vessels, vessel, def, values, result, fields: def.fields(units), save,
    chooseVessel: (vesselId: string) => draft.set({ ...d, vesselId }),
    chooseTest: (test: SteamTestId) => draft.set({ ...d, test, values: null }),
    setValue: (id: string, v: string) => draft.update((cur) => ({ ...cur, values: { ...(cur.values ?? initialValues(def, units)), [id]: v } })),
  };
}
