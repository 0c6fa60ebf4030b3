// A supervisor's review note: who, when, what was decided, on which vessel and which check's
// findings. Saved as a record of kind 'review-note' in this device's append-only chain (the same
// seq, hash and signature as a check), so it is verified, exported and synced with the log. The
// overview reads only each vessel's newest note's time, from the store's kind rows.
import { appendRecord, type KindRecord, type VesselRecord } from '../../store/index.ts';
import { latestOfKind, type LatestCheck } from '../../store/desk.ts';
import type { NoteMark } from './overview-rows.ts';

export const REVIEW_NOTE_KIND = 'review-note';
const NAME_MAX = 100;
const DECISION_MAX = 4000;

/** The newest note's time per vessel (vessels without one are left out). */
export async function noteMarks(vesselIds: readonly string[]): Promise<NoteMark[]> {
  const latest = await latestOfKind(REVIEW_NOTE_KIND, vesselIds);
  return latest.flatMap((n, i) => (n ? [{ vesselId: vesselIds[i]!, timeMs: n.timeMs }] : []));
}

export interface NoteForm { supervisor: string; decision: string }

/** The form read, or the field that cannot be and why (with the allowed range). */
export function readNoteForm(f: NoteForm): { ok: true; supervisor: string; decision: string } | { ok: false; field: keyof NoteForm; message: string } {
  const supervisor = f.supervisor.trim();
  const decision = f.decision.trim();
  if (supervisor.length < 1 || supervisor.length > NAME_MAX) return { ok: false, field: 'supervisor', message: `Supervisor: give your name, 1 to ${NAME_MAX} characters.` };
  if (decision.length < 1 || decision.length > DECISION_MAX) return { ok: false, field: 'decision', message: `What was decided: 1 to ${DECISION_MAX} characters (now ${decision.length}).` };
  return { ok: true, supervisor, decision };
}

/**
 * Saves the note on `vessel` about its newest check `latest`; it counts from now, so it clears the
 * flag of that check and of none after it.
 * @throws StoreError naming the field, with nothing saved
 */
export function saveReviewNote(vessel: VesselRecord, latest: LatestCheck, supervisor: string, decision: string): Promise<KindRecord> {
  return appendRecord(REVIEW_NOTE_KIND, {
    vesselId: vessel.id,
    technician: supervisor,
    note: decision,
    values: { checkId: latest.id, checkTimeMs: latest.timeMs, outcome: latest.outcome, findingSignals: [...latest.findingSignals] },
    cautions: [],
    appVersion: __APP_VERSION__,
    // Nothing is computed in a note; the field names that plainly.
    formulationId: 'none (a supervisor\'s note; nothing computed)',
  });
}
