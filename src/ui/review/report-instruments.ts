// The instruments a vessel's checks in a period rested on: each one, how many checks used it, the
// worst calibration state any of them was taken in (as the check recorded it; a check saved before
// the register counts the instrument fitted at its time, its state then unknown), and its state now.
import type { VesselSpec } from '../../core/index.ts';
import type { CalibrationDueState } from '../../core/instrument/calibration-due.ts';
import { fittedAt, type CheckRecord, type FittingRecord, type InstrumentHistory } from '../../store/index.ts';
import { STATUS_WORDS, dueTextOf } from '../state/instrument-view.ts';

export interface InstrumentInPeriod {
  instrumentId: string;
  tag: string;
  role: string;
  checks: number;
  /** The worst state a check in the period recorded; null when no check recorded one (saved before the register). */
  worstAtCheck: CalibrationDueState | null;
  /** Checks that recorded no state. */
  unrecorded: number;
  now: string;
}

const SEVERITY: Record<CalibrationDueState, number> = { overdue: 3, 'due-soon': 2, 'no-calibration': 1, 'in-date': 0 };

/** One line per instrument the checks used, by tag. */
export function instrumentsInPeriod(checks: readonly CheckRecord[], fittings: readonly FittingRecord[], register: ReadonlyMap<string, InstrumentHistory>, nowMs: number): InstrumentInPeriod[] {
  const found = new Map<string, InstrumentInPeriod>();
  const count = (instrumentId: string, role: string, tagAtCheck: string | undefined, state: CalibrationDueState | null) => {
    const h = register.get(instrumentId);
    const line = found.get(instrumentId) ?? {
      instrumentId, role, tag: h?.instrument.tag ?? tagAtCheck ?? instrumentId, checks: 0, worstAtCheck: null, unrecorded: 0,
      now: h ? dueTextOf(h, nowMs) : 'not in the register on this device',
    };
    line.checks += 1;
    if (state === null) line.unrecorded += 1;
    else if (line.worstAtCheck === null || SEVERITY[state] > SEVERITY[line.worstAtCheck]) line.worstAtCheck = state;
    found.set(instrumentId, line);
  };
  for (const c of checks) {
    const used = (c.vessel.spec as VesselSpec).instrumentsUsed;
    if (Array.isArray(used)) {
      for (const u of used) count(u.instrumentId, u.role, u.tag, u.due);
      continue;
    }
    for (const [role, f] of Object.entries(fittedAt(fittings, c.timeMs))) if (f?.instrumentId) count(f.instrumentId, role, undefined, null);
  }
  return [...found.values()].sort((a, b) => a.tag.localeCompare(b.tag));
}

/** "overdue at 3 of 12 checks"-style words for a line's state at its checks. */
export function stateAtChecksText(line: InstrumentInPeriod): string {
  const recorded = line.checks - line.unrecorded;
  const worst = line.worstAtCheck === null ? 'not recorded (checks saved before the register)' : `worst ${STATUS_WORDS[line.worstAtCheck]}`;
  return `${line.checks} ${line.checks === 1 ? 'check' : 'checks'}; state at the checks: ${worst}${line.unrecorded > 0 && recorded > 0 ? ` (${line.unrecorded} not recorded)` : ''}`;
}
