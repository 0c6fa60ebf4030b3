// Chain status per device, in words a supervisor can act on, pointing at the first bad record.
import type { ChainProblem, ChainStatus, LongWorkOptions } from '../../store/index.ts';
import { verifyStoredChains } from '../../store/transfer.ts';

export interface ChainLine {
  deviceId: string;
  /** The first 8 characters of the device id, as the screen shows it. */
  deviceShort: string;
  ok: boolean;
  count: number;
  text: string;
  /** The record the chain first fails at (open it from the log), when broken. */
  at: { id: string; seq: number } | null;
}

const PROBLEM_TEXT: Record<ChainProblem, string> = {
  'content-changed': 'a record was changed after it was saved',
  'link-broken': 'the record before it was changed or swapped',
  'missing-seq': 'one or more records are missing',
  'reordered': 'records are out of order',
  'unsealed': 'a record moved from an older version was never sealed',
};

export function chainLine(s: ChainStatus): ChainLine {
  const base = { deviceId: s.deviceId, deviceShort: s.deviceId.slice(0, 8), count: s.count };
  if (s.status === 'ok') {
    return { ...base, ok: true, text: `${s.count} records, seq 1 to ${s.headSeq}`, at: null };
  }
  return { ...base, ok: false, text: `broken at seq ${s.at.seq}: ${PROBLEM_TEXT[s.problem]} (${s.detail})`, at: s.at };
}

/** Verifies every device's chain in the store and words the result. */
export async function checkChains(options: LongWorkOptions = {}): Promise<ChainLine[]> {
  return (await verifyStoredChains(options)).map(chainLine);
}
