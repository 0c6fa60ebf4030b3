// Tamper evidence for the check log: a canonical serialisation of each record's content, hashed
// with SHA-256 together with the previous record's hash on the same device. Pure functions; the
// only platform call is WebCrypto's digest.
import { GENESIS_HASH, type CheckRecord, type LongWorkOptions } from './records.ts';
import { StoreError } from './errors.ts';

/**
 * Canonical JSON of a value: object keys sorted by UTF-16 code units, no whitespace, strings
 * escaped as JSON.stringify does, numbers written as ECMAScript's Number#toString (the shortest
 * text that reads back as the same double, as RFC 8785 also requires), −0 written as 0. Keys whose
 * value is undefined are left out (as JSON.stringify does), so a record hashes the same before and
 * after a JSON round trip.
 * @throws StoreError('invalid-record') for NaN, ±Infinity, bigint, functions, symbols, or undefined
 *   inside an array
 */
export function canonicalJson(value: unknown): string {
  const parts: string[] = [];
  write(value, parts, '');
  return parts.join('');
}

function write(value: unknown, out: string[], path: string): void {
  if (value === null) {
    out.push('null');
    return;
  }
  switch (typeof value) {
    case 'boolean':
      out.push(value ? 'true' : 'false');
      return;
    case 'number':
      if (!Number.isFinite(value)) {
        throw new StoreError('invalid-record', `${path || 'value'}: ${value} is not a finite number`, path || undefined);
      }
      out.push(Object.is(value, -0) ? '0' : String(value));
      return;
    case 'string':
      out.push(JSON.stringify(value));
      return;
    case 'object': {
      if (Array.isArray(value)) {
        out.push('[');
        value.forEach((item, i) => {
          if (i > 0) out.push(',');
          if (item === undefined) throw new StoreError('invalid-record', `${path}[${i}]: undefined in an array`, `${path}[${i}]`);
          write(item, out, `${path}[${i}]`);
        });
        out.push(']');
        return;
      }
      const record = value as Record<string, unknown>;
      const keys = Object.keys(record).filter((k) => record[k] !== undefined).sort();
      out.push('{');
      keys.forEach((key, i) => {
        if (i > 0) out.push(',');
        out.push(JSON.stringify(key), ':');
        write(record[key], out, path ? `${path}.${key}` : key);
      });
      out.push('}');
      return;
    }
    default:
      throw new StoreError('invalid-record', `${path || 'value'}: a ${typeof value} cannot be stored`, path || undefined);
  }
}

/** The content a check's hash covers: every field except `hash` itself (prevHash included). */
export function hashedContent(record: CheckRecord | Omit<CheckRecord, 'hash'>): string {
  const { hash: _ignored, ...content } = record as CheckRecord;
  return canonicalJson(content);
}

/** SHA-256 of UTF-8 text as 64 lower-case hex digits (WebCrypto). */
export async function sha256Hex(text: string): Promise<string> {
  const digest = await crypto.subtle.digest('SHA-256', new TextEncoder().encode(text));
  let hex = '';
  for (const byte of new Uint8Array(digest)) hex += byte.toString(16).padStart(2, '0');
  return hex;
}

/** The hash a check should carry, from its content (prevHash included). */
export function computeCheckHash(record: CheckRecord | Omit<CheckRecord, 'hash'>): Promise<string> {
  return sha256Hex(hashedContent(record));
}

/** Why a device's chain is not intact at a record. */
export type ChainProblem =
  | 'content-changed' // the record's content does not hash to its stated hash
  | 'link-broken'     // prevHash is not the hash of the record before it (that one changed, or was swapped)
  | 'missing-seq'     // one or more seq numbers before this record are absent
  | 'reordered'       // seq goes backwards or repeats in the order given
  | 'unsealed';       // a migrated record whose hash was never computed

/** Chain status of one device. */
export type ChainStatus =
  | { deviceId: string; status: 'ok'; count: number; headSeq: number; headHash: string }
  | {
      deviceId: string;
      status: 'broken';
      count: number;
      /** The first record at which the chain fails. */
      at: { id: string; seq: number };
      problem: ChainProblem;
      detail: string;
    };

/**
 * Verifies each device's chain. Records are taken per device in the order given (a backup and the
 * store both give them in seq order); each device's chain must start at seq 1 from 64 zeros.
 * Reports, per device (sorted by deviceId), ok or the first broken record and why.
 * @throws StoreError('cancelled') if options.signal aborts
 */
export async function verifyChains(records: Iterable<CheckRecord>, options: LongWorkOptions = {}): Promise<ChainStatus[]> {
  const byDevice = new Map<string, CheckRecord[]>();
  let total = 0;
  for (const r of records) {
    let list = byDevice.get(r.deviceId);
    if (!list) byDevice.set(r.deviceId, (list = []));
    list.push(r);
    total += 1;
  }
  const verifier = new ChainVerifier();
  let done = 0;
  for (const deviceId of [...byDevice.keys()].sort()) {
    for (const r of byDevice.get(deviceId)!) {
      throwIfAborted(options.signal);
      await verifier.push(r);
      done += 1;
      if (done % progressStep(total) === 0 || done === total) options.onProgress?.(done, total);
    }
  }
  return verifier.results();
}

/**
 * Incremental chain verification, one record at a time, so the store can verify a large log in
 * pages without loading it all. Feed each device's records in seq order.
 */
export class ChainVerifier {
  private readonly state = new Map<
    string,
    { count: number; expectedSeq: number; prevHash: string; broken?: Extract<ChainStatus, { status: 'broken' }> }
  >();

  /** Checks one record against its device's chain so far. */
  async push(r: CheckRecord): Promise<void> {
    // Unsealed and out-of-sequence records are judged without hashing them.
    this.pushHashed(r, r.hash === '' ? '' : await computeCheckHash(r));
  }

  /** As push, with the record's content hash already computed by the caller. */
  pushHashed(r: CheckRecord, computedHash: string): void {
    let s = this.state.get(r.deviceId);
    if (!s) this.state.set(r.deviceId, (s = { count: 0, expectedSeq: 1, prevHash: GENESIS_HASH }));
    s.count += 1;
    if (s.broken) return;
    const fail = (problem: ChainProblem, detail: string) => {
      s.broken = { deviceId: r.deviceId, status: 'broken', count: 0, at: { id: r.id, seq: r.seq }, problem, detail };
    };
    if (r.hash === '') return fail('unsealed', `seq ${r.seq}: migrated record was never hashed`);
    if (r.seq < s.expectedSeq) return fail('reordered', `seq ${r.seq} comes after seq ${s.expectedSeq - 1}`);
    if (r.seq > s.expectedSeq) {
      const missing = r.seq - s.expectedSeq === 1 ? `seq ${s.expectedSeq}` : `seq ${s.expectedSeq} to ${r.seq - 1}`;
      return fail('missing-seq', `${missing} missing before seq ${r.seq}`);
    }
    if (computedHash !== r.hash) return fail('content-changed', `seq ${r.seq}: content does not match its hash`);
    if (r.prevHash !== s.prevHash) {
      return fail('link-broken', `seq ${r.seq}: prevHash is not the hash of seq ${r.seq - 1}`);
    }
    s.expectedSeq = r.seq + 1;
    s.prevHash = r.hash;
  }

  /** Status per device seen so far, sorted by deviceId. */
  results(): ChainStatus[] {
    return [...this.state.entries()]
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))
      .map(([deviceId, s]) =>
        s.broken
          ? { ...s.broken, count: s.count }
          : { deviceId, status: 'ok' as const, count: s.count, headSeq: s.expectedSeq - 1, headHash: s.prevHash },
      );
  }
}

/** Report progress about 200 times over a job of `total` steps, however large. */
export function progressStep(total: number): number {
  return Math.max(1, Math.floor(total / 200));
}

export function throwIfAborted(signal: AbortSignal | undefined): void {
  if (signal?.aborted) throw new StoreError('cancelled', 'Cancelled; nothing was changed.');
}
