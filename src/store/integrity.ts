// Tamper evidence for the check log: a canonical serialisation of each record's content, hashed
// with SHA-256 together with the previous record's hash on the same device. Pure functions; the
// only platform call is WebCrypto's digest.
import { GENESIS_HASH, type CheckRecord, type KindRecord, type LogRecord, type LongWorkOptions } from './records.ts';
import { StoreError } from './errors.ts';

/** A record with or without its hash: what the hash is computed over. */
export type HashableRecord = LogRecord | Omit<CheckRecord, 'hash'> | Omit<KindRecord, 'hash'>;

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
  try {
    return encode(value);
  } catch (error) {
    if (error !== NOT_JSON) throw error;
    // Slow path, only to name the offending field.
    throw new StoreError('invalid-record', describeNotJson(value, ''), firstBadPath(value, '') || undefined);
  }
}

const NOT_JSON = Symbol('not JSON');

// Hot path (every record hashed, exported or cloned). JSON.stringify writes the canonical form of
// any plain-JSON value whose objects list their keys in sorted order: the same string escapes,
// the same number text (Number#toString, −0 as 0), undefined-valued keys left out, keys in
// Object.keys order. So the value is brought into that shape first (subtrees already in it,
// e.g. anything JSON.parse made from canonical text, are reused as they are; others are copied
// with their keys sorted) and handed to the engine in one call. What cannot be put in that shape
// (class instances, keys that look like array indexes, a "__proto__" key, very deep nesting) is
// written key by key instead, with the same result.
function encode(value: unknown): string {
  if (value === null) return 'null';
  switch (typeof value) {
    case 'string':
      return JSON.stringify(value);
    case 'number':
      if (!Number.isFinite(value)) throw NOT_JSON;
      return value === 0 ? '0' : String(value); // -0 === 0, so −0 is written as 0
    case 'boolean':
      return value ? 'true' : 'false';
    case 'object': {
      const shaped = canonicalShape(value, 0, null);
      if (shaped !== KEY_BY_KEY && prototypesUntouched()) return JSON.stringify(shaped);
      if (Array.isArray(value)) {
        let out = '[';
        for (let i = 0; i < value.length; i += 1) {
          const item: unknown = value[i];
          if (item === undefined) throw NOT_JSON;
          out += (i > 0 ? ',' : '') + encode(item);
        }
        return out + ']';
      }
      return encodeMembers(value as Record<string, unknown>, sortedKeys(value), null);
    }
    default:
      throw NOT_JSON;
  }
}

/** `{…}` of the given keys (in that order), skipping undefined values and the key `skip`. */
function encodeMembers(record: Record<string, unknown>, keys: readonly string[], skip: string | null): string {
  let out = '{';
  let first = true;
  for (const key of keys) {
    if (key === skip) continue;
    const item = record[key];
    if (item === undefined) continue;
    out += (first ? '' : ',') + JSON.stringify(key) + ':' + encode(item);
    first = false;
  }
  return out + '}';
}

/** Own enumerable keys in UTF-16 code unit order; sorts only when they are not in order already. */
function sortedKeys(value: object): string[] {
  const keys = Object.keys(value);
  for (let i = 1; i < keys.length; i += 1) {
    if (!(keys[i - 1]! < keys[i]!)) return keys.sort();
  }
  return keys;
}

/** canonicalShape's answer when the value must be written key by key. */
const KEY_BY_KEY = Symbol('key by key');
/** Deeper than this the shaping gives up (the key-by-key writer recurses on its own). */
const SHAPE_DEPTH = 64;

/**
 * `value` itself if JSON.stringify(value) is already its canonical form; otherwise a copy for
 * which it is (keys sorted, `skip` and undefined-valued keys dropped), or KEY_BY_KEY.
 * Throws NOT_JSON for a value the canonical form refuses (NaN, ±Infinity, bigint, function,
 * symbol, undefined in an array).
 */
function canonicalShape(value: object, depth: number, skip: string | null): object | typeof KEY_BY_KEY {
  if (depth > SHAPE_DEPTH) return KEY_BY_KEY;
  if (Array.isArray(value)) {
    if (Object.getPrototypeOf(value) !== Array.prototype) return KEY_BY_KEY;
    let copy: unknown[] | null = null;
    for (let i = 0; i < value.length; i += 1) {
      const item: unknown = value[i];
      let shaped: unknown = item;
      if (typeof item === 'object') {
        if (item !== null) {
          const s = canonicalShape(item, depth + 1, null);
          if (s === KEY_BY_KEY) return s;
          shaped = s;
        }
      } else if (!isPlainScalar(item)) {
        throw NOT_JSON; // undefined (or a hole), NaN, ±Infinity, function, symbol, bigint
      }
      if (copy === null && shaped !== item) copy = value.slice(0, i);
      if (copy !== null) copy.push(shaped);
    }
    return copy ?? value;
  }
  const proto: unknown = Object.getPrototypeOf(value);
  if (proto !== Object.prototype && proto !== null) return KEY_BY_KEY;
  const record = value as Record<string, unknown>;
  const own = Object.keys(record);
  let inOrder = true;
  for (let i = 1; i < own.length && inOrder; i += 1) inOrder = own[i - 1]! < own[i]!;
  const keys = inOrder ? own : own.sort();
  let copy: Record<string, unknown> | null = null;
  let changed = !inOrder;
  const shapedValues: unknown[] = [];
  for (const key of keys) {
    const item = record[key];
    let shaped: unknown = item;
    if (key === skip || item === undefined) {
      shaped = undefined;
      if (key === skip) changed = true;
    } else if (typeof item === 'object') {
      if (item !== null) {
        const s = canonicalShape(item, depth + 1, null);
        if (s === KEY_BY_KEY) return s;
        shaped = s;
        if (s !== item) changed = true;
      }
    } else if (!isPlainScalar(item)) {
      throw NOT_JSON;
    }
    shapedValues.push(shaped);
  }
  if (!changed) return value;
  // A copy lists its keys in insertion order, except that the engine puts keys that look like
  // array indexes first in numeric order, and "__proto__" would set the prototype: not copied.
  copy = {};
  for (let i = 0; i < keys.length; i += 1) {
    const key = keys[i]!;
    const item = shapedValues[i];
    if (item === undefined) continue;
    const c = key.charCodeAt(0);
    if ((c >= 48 && c <= 57) || key === '__proto__') return KEY_BY_KEY;
    copy[key] = item;
  }
  return copy;
}

function isPlainScalar(item: unknown): boolean {
  return typeof item === 'string' || typeof item === 'boolean' || (typeof item === 'number' && Number.isFinite(item));
}

/** JSON.stringify would call an inherited toJSON; the canonical form never does. */
function prototypesUntouched(): boolean {
  return !('toJSON' in Object.prototype) && !('toJSON' in Array.prototype);
}

/** Dotted path of the first value encode() refuses, or '' for the value itself. */
function firstBadPath(value: unknown, path: string): string | null {
  if (value === null || typeof value === 'string' || typeof value === 'boolean') return null;
  if (typeof value === 'number') return Number.isFinite(value) ? null : path;
  if (typeof value !== 'object') return path;
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i += 1) {
      if (value[i] === undefined) return `${path}[${i}]`;
      const bad = firstBadPath(value[i], `${path}[${i}]`);
      if (bad !== null) return bad;
    }
    return null;
  }
  for (const key of Object.keys(value).sort()) {
    const item = (value as Record<string, unknown>)[key];
    if (item === undefined) continue;
    const bad = firstBadPath(item, path ? `${path}.${key}` : key);
    if (bad !== null) return bad;
  }
  return null;
}

function describeNotJson(value: unknown, path: string): string {
  const at = firstBadPath(value, path) ?? '';
  let v: unknown = value;
  for (const part of at.match(/[^.[\]]+/g) ?? []) v = (v as Record<string, unknown>)?.[part];
  const what = typeof v === 'number' ? `${v} is not a finite number` : v === undefined ? 'undefined in an array' : `a ${typeof v} cannot be stored`;
  return `${at || 'value'}: ${what}`;
}

/** The content a check's hash covers: every field except `hash` itself (prevHash included). */
export function hashedContent(record: HashableRecord): string {
  const value: unknown = record;
  if (typeof value !== 'object' || value === null || Array.isArray(value)) return canonicalJson(value);
  try {
    // The same text as canonicalJson of the record with `hash` removed.
    const shaped = canonicalShape(value, 0, 'hash');
    if (shaped !== KEY_BY_KEY && prototypesUntouched()) return JSON.stringify(shaped);
    return encodeMembers(value as Record<string, unknown>, sortedKeys(value), 'hash');
  } catch (error) {
    if (error !== NOT_JSON) throw error;
    const { hash: _ignored, ...content } = record as CheckRecord;
    return canonicalJson(content); // names the bad field
  }
}

/** SHA-256 of UTF-8 text as 64 lower-case hex digits (WebCrypto). */
export async function sha256Hex(text: string): Promise<string> {
  const digest = new Uint8Array(await crypto.subtle.digest('SHA-256', UTF8.encode(text)));
  let hex = '';
  for (let i = 0; i < digest.length; i += 1) hex += HEX_BYTE[digest[i]!]!;
  return hex;
}

const UTF8 = new TextEncoder();
const HEX_BYTE: readonly string[] = Array.from({ length: 256 }, (_, b) => b.toString(16).padStart(2, '0'));

/** The hash a check (or a record of another kind) should carry, from its content (prevHash included). */
export function computeCheckHash(record: HashableRecord): Promise<string> {
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
  throwIfAborted(options.signal);
  const verifier = new ChainVerifier();
  const every = progressStep(total);
  let done = 0;
  let reported = 0;
  for (const deviceId of [...byDevice.keys()].sort()) {
    const list = byDevice.get(deviceId)!;
    for (let start = 0; start < list.length; start += VERIFY_CHUNK) {
      const chunk = list.slice(start, start + VERIFY_CHUNK);
      await verifier.pushBatch(chunk, options.signal);
      done += chunk.length;
      if (done - reported >= every || done === total) {
        reported = done;
        options.onProgress?.(done, total);
      }
    }
  }
  return verifier.results();
}

/** Records verifyChains hashes between progress reports and cancel checks. */
const VERIFY_CHUNK = 4096;

/**
 * Digests kept in flight at once while hashing many records. WebCrypto's digest is asynchronous
 * (the work runs off the main thread), so issuing one and waiting for it before the next leaves
 * both threads idle most of the time; a few hundred in flight keep them busy, and the bound keeps
 * the texts waiting to be hashed to a few hundred kilobytes.
 */
export const HASH_IN_FLIGHT = 256;

/**
 * Content hashes (as computeCheckHash gives them) of `records`, in the same order, with at most
 * HASH_IN_FLIGHT digests outstanding: the canonical text of the next group is built while the
 * previous group is being digested. `onProgress(done)` follows each finished group.
 * @throws StoreError('cancelled') if `signal` aborts (checked before each group is issued); the
 *   digests already issued are left to finish unobserved, and nothing is returned
 */
export function computeCheckHashes(
  records: readonly (CheckRecord | Omit<CheckRecord, 'hash'>)[],
  options: { signal?: AbortSignal | undefined; onProgress?: ((done: number) => void) | undefined } = {},
): Promise<string[]> {
  return digestMany(records.length, (i) => hashedContent(records[i]!), options);
}

/** SHA-256 hex of `count` texts, `textAt(i)` built just before it is digested; as computeCheckHashes. */
export async function digestMany(
  count: number,
  textAt: (i: number) => string,
  options: { signal?: AbortSignal | undefined; onProgress?: ((done: number) => void) | undefined } = {},
): Promise<string[]> {
  const hashes = new Array<string>(count);
  const group = HASH_IN_FLIGHT / 2;
  let waiting: { start: number; digests: Promise<string[]> } | null = null;
  for (let start = 0; ; start += group) {
    let issued: { start: number; digests: Promise<string[]> } | null = null;
    if (start < count) {
      await breathe();
      throwIfAborted(options.signal);
      const texts: Promise<string>[] = [];
      for (let i = start; i < Math.min(count, start + group); i += 1) texts.push(sha256Hex(textAt(i)));
      const digests = Promise.all(texts);
      digests.catch(() => {}); // observed below, or abandoned on cancel
      issued = { start, digests };
    }
    if (waiting) {
      const done = await waiting.digests;
      for (let i = 0; i < done.length; i += 1) hashes[waiting.start + i] = done[i]!;
      options.onProgress?.(waiting.start + done.length);
    }
    if (!issued) break;
    waiting = issued;
  }
  return hashes;
}

const HASH_MEMBER = ',"hash":"';

/** What chain verification reads of a record. */
export type ChainLink = Pick<CheckRecord, 'id' | 'deviceId' | 'seq' | 'hash' | 'prevHash'>;

const DEVICE_MEMBER = ',"deviceId":"';
const ID_MEMBER = ',"id":"';
const KIND_MEMBER = ',"kind":"';
const PREV_MEMBER = ',"prevHash":"';

/**
 * The chain fields of a check filed under `seq`, and its hashed content, read from its canonical
 * JSON text without parsing it; null when the text is not in the shape the store writes (the
 * caller then parses it). Exact for the same reason contentOfText is: every member before
 * "prevHash" holds strings, null, cautions of {message, rule, signal} or inputs of {text, unit,
 * reference} objects, so the first `,"deviceId":"`, `,"hash":"` and `,"prevHash":"` (with the
 * opening quote of a string value) are the top-level ones, and "id" follows "hash" directly. The
 * seq sits after free-form members (result), so it is taken from where the record is filed and
 * the text is only checked to hold it; a record filed under another seq breaks the chain's links
 * anyway, since its hash covers its real seq.
 */
export function chainFieldsOfText(text: string, seq: number): { link: ChainLink; content: string } | null {
  const d = text.indexOf(DEVICE_MEMBER);
  if (d < 0) return null;
  const dEnd = text.indexOf('"', d + DEVICE_MEMBER.length);
  const h = text.indexOf(HASH_MEMBER, dEnd);
  if (dEnd < 0 || h < 0) return null;
  const hEnd = text.indexOf('"', h + HASH_MEMBER.length);
  if (hEnd < 0 || !text.startsWith(ID_MEMBER, hEnd + 1)) return null;
  const iStart = hEnd + 1 + ID_MEMBER.length;
  const iEnd = text.indexOf('"', iStart);
  const p = text.indexOf(PREV_MEMBER, iEnd);
  if (iEnd < 0 || p < 0) return null;
  const pEnd = text.indexOf('"', p + PREV_MEMBER.length);
  if (pEnd < 0 || !text.includes(`,"seq":${seq},"technician":"`, pEnd)) return null;
  return {
    link: {
      deviceId: text.slice(d + DEVICE_MEMBER.length, dEnd),
      hash: text.slice(h + HASH_MEMBER.length, hEnd),
      id: text.slice(iStart, iEnd),
      prevHash: text.slice(p + PREV_MEMBER.length, pEnd),
      seq,
    },
    content: text.slice(0, h) + text.slice(hEnd + 1),
  };
}

/**
 * The kind of a stored record from its canonical text: 'check' for a check (no `kind` member), or
 * the kind it names. In canonical JSON "kind" follows "id" directly in a record of another kind
 * (records.ts KindRecord), and "inputs" does in a check; the first `,"hash":"` is the top-level one
 * (see contentOfText), so the member after the id is found without parsing. A text not in the
 * store's shape is parsed instead.
 */
export function kindOfText(text: string): string {
  const h = text.indexOf(HASH_MEMBER);
  const hEnd = h < 0 ? -1 : text.indexOf('"', h + HASH_MEMBER.length);
  const iEnd = hEnd < 0 || !text.startsWith(ID_MEMBER, hEnd + 1) ? -1 : text.indexOf('"', hEnd + 1 + ID_MEMBER.length);
  if (iEnd >= 0 && text.startsWith(KIND_MEMBER, iEnd + 1)) return text.slice(iEnd + 1 + KIND_MEMBER.length, text.indexOf('"', iEnd + 1 + KIND_MEMBER.length));
  if (iEnd >= 0 && text.startsWith(',"inputs":', iEnd + 1)) return 'check';
  const parsed = JSON.parse(text) as { kind?: unknown };
  return typeof parsed.kind === 'string' ? parsed.kind : 'check';
}

/**
 * The hashed content of a check from its canonical JSON text: the text without its top-level
 * `"hash":"…"` member, which is hashedContent(record) without building it again. Exact for any
 * record the store accepts: in canonical JSON keys are sorted, and the members before "hash"
 * (appVersion, cautions, corrects, deviceId, formulationId) hold strings, null and cautions of
 * {message, rule, signal}, none of which can show that sequence (a quote inside a string is
 * always escaped). A text that is not canonical gives a content that no longer matches its hash.
 */
export function contentOfText(text: string): string {
  const at = text.indexOf(HASH_MEMBER);
  if (at < 0) return text;
  const end = text.indexOf('"', at + HASH_MEMBER.length);
  return end < 0 ? text : text.slice(0, at) + text.slice(end + 1);
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

  /**
   * As push for each record in turn, with the hashes computed concurrently (computeCheckHashes).
   * Unsealed records are not hashed. On cancel nothing of the batch has been pushed.
   * @throws StoreError('cancelled') if `signal` aborts
   */
  async pushBatch(records: readonly CheckRecord[], signal?: AbortSignal): Promise<void> {
    const sealed = records.filter((r) => r.hash !== '');
    const hashes = await computeCheckHashes(sealed, { signal });
    throwIfAborted(signal);
    let next = 0;
    for (const r of records) this.pushHashed(r, r.hash === '' ? '' : hashes[next++]!);
  }

  /**
   * Counts a record found where its own fields say it is not (another device's run, or a seq
   * other than the one it is filed under): its device's chain is broken there, as 'reordered'.
   */
  pushMisplaced(r: ChainLink, detail: string): void {
    let s = this.state.get(r.deviceId);
    if (!s) this.state.set(r.deviceId, (s = { count: 0, expectedSeq: 1, prevHash: GENESIS_HASH }));
    s.count += 1;
    if (!s.broken) s.broken = { deviceId: r.deviceId, status: 'broken', count: 0, at: { id: r.id, seq: r.seq }, problem: 'reordered', detail };
  }

  /** As push, with the record's content hash already computed by the caller. */
  pushHashed(r: ChainLink, computedHash: string): void {
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

/** When the page last had a turn: long work gives it one every BREATH_MS or so. */
let lastBreath = 0;
const BREATH_MS = 40;

/**
 * Lets the page paint and handle input (a tap on Cancel) if this work has held the thread for
 * BREATH_MS: the rest of the work continues in a new task (a message to itself, which unlike a
 * timer is not held back to 4 ms). Never call it inside an IndexedDB transaction that must stay
 * open: the transaction commits once its task ends with no request pending.
 */
export async function breathe(): Promise<void> {
  const now = performance.now();
  if (now - lastBreath < BREATH_MS) return;
  await new Promise<void>((resolve) => {
    const channel = new MessageChannel();
    channel.port1.onmessage = () => {
      channel.port1.close();
      resolve();
    };
    channel.port2.postMessage(null);
  });
  lastBreath = performance.now();
}

/** Report progress about 200 times over a job of `total` steps, however large. */
export function progressStep(total: number): number {
  return Math.max(1, Math.floor(total / 200));
}

export function throwIfAborted(signal: AbortSignal | undefined): void {
  if (signal?.aborted) throw new StoreError('cancelled', 'Cancelled; nothing was changed.');
}
