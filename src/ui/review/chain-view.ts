// Chain status per device, in words a supervisor can act on, pointing at the first bad record.
import type { ChainProblem, LongWorkOptions } from '../../store/index.ts';
import { verifyStoredChains, type StoredChainStatus } from '../../store/transfer.ts';

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

export function chainLine(s: StoredChainStatus): ChainLine {
  const base = { deviceId: s.deviceId, deviceShort: s.deviceId.slice(0, 8), count: s.count };
  const sig = s.signature;
  if (s.status !== 'ok') {
    return { ...base, ok: false, text: `broken at seq ${s.at.seq}: ${PROBLEM_TEXT[s.problem]} (${s.detail})`, at: s.at };
  }
  const records = `${s.count} records, seq 1 to ${s.headSeq}`;
  if (sig.state === 'failed') {
    // The links hold, so the records were re-hashed after a change; only the signatures tell.
    return { ...base, ok: false, text: `${records}; signature fails at seq ${sig.at.seq}: ${sig.detail}`, at: sig.at.id ? sig.at : null };
  }
  if (sig.state === 'unsigned') return { ...base, ok: true, text: `${records}; not signed (saved before this device signed its records)`, at: null };
  const tail = sig.throughSeq < sig.headSeq
    ? `, up to seq ${sig.throughSeq}; seq ${sig.throughSeq + 1} to ${sig.headSeq} carry no signature (received without one, as plant sync sends them)`
    : '';
  return { ...base, ok: true, text: `${records}; signed by device ${base.deviceShort} (key fingerprint ${sig.fingerprint})${tail}`, at: null };
}

/** Verifies every device's chain in the store and words the result. */
export async function checkChains(options: LongWorkOptions = {}): Promise<ChainLine[]> {
  return (await verifyStoredChains(options)).map(chainLine);
}
