// What the overview reads: each vessel's newest check (month rows) and newest review note (kind
// rows), read again when `generation` changes (a note was saved).
import { useEffect, useState } from 'preact/hooks';
import type { VesselRecord } from '../../store/index.ts';
import { latestChecks } from '../../store/desk.ts';
import { storageMessage } from '../state/repo.ts';
import { vesselDues } from '../state/vessel-due.ts';
import { overviewRows, type OverviewRow } from './overview-rows.ts';
import { noteMarks } from './review-notes.ts';

export function useOverview(vessels: readonly VesselRecord[], generation: number): { rows: OverviewRow[] | null; error: string } {
  const [state, setState] = useState<{ rows: OverviewRow[] | null; error: string }>({ rows: null, error: '' });
  useEffect(() => {
    let live = true;
    const ids = vessels.map((v) => v.id);
    Promise.all([latestChecks(ids), noteMarks(ids)]).then(
      ([latest, notes]) => { if (live) setState({ rows: overviewRows(vesselDues(vessels, latest, Date.now()), notes), error: '' }); },
      (e: unknown) => { if (live) setState({ rows: null, error: storageMessage(e) }); },
    );
    return () => { live = false; };
  }, [vessels, generation]);
  return state;
}
