// The id buckets of the log (logIds, schema v9): where each record id is stored and which checks
// correct it, in 256 values keyed by the id's last two hex digits (log-layout.ts idBucketOf).
//
// Why this shape: until v8 a bucket was one object with a member per id ({ at: [deviceId, seq],
// by }), so reading one back made an object, an array and a copy of the device id per id, and
// writing it walked them all again. A merge of pulled records touches every bucket (random ids
// spread over all 256), so each batch of a supervisor's first pull read and rewrote every id the
// log held: a quarter of the page's CPU samples were IndexedDB handing such values back, and 12 %
// garbage collection (bench/sync-browser.bench-run.ts, 110,000 checks). Here a bucket is a few
// flat arrays: the ids ascending, beside them the index of their device in a short list of the
// bucket's devices and their seq, and apart the few ids some check corrects. Structured clone
// copies a flat array of strings or numbers in one pass, lookups are a binary search, and a
// write merges the new ids into the sorted list.
//
// Pure: no IndexedDB here (log-layout.ts reads and writes the values); every function leaves the
// bucket it is given unchanged and returns a new one.

/** The ids that end in one pair of hex digits, with where each is stored (schema v9). */
export interface IdBucket {
  /** Ids stored in the log, ascending (code unit order). */
  ids: string[];
  /** Per id of `ids`, the index of its device in `devices`. */
  device: number[];
  /** Per id of `ids`, its seq on that device. */
  seqs: number[];
  /** The devices of this bucket's ids, each once. */
  devices: string[];
  /** Ids some stored check corrects (stored here or not yet), each once. */
  corrected: string[];
  /** Per id of `corrected`, the ids of the checks that correct it, in the order they were added. */
  by: string[][];
}

/** Where a check id is stored (`at`), and the ids of checks that correct it (`by`), either may be absent. */
export interface IdEntry {
  at?: [deviceId: string, seq: number];
  by?: string[];
}

/** A bucket with no ids. */
export function emptyIdBucket(): IdBucket {
  return { ids: [], device: [], seqs: [], devices: [], corrected: [], by: [] };
}

/** Index of `id` in ascending `ids`, or −1. */
function idIndex(ids: readonly string[], id: string): number {
  let lo = 0;
  let hi = ids.length - 1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    const v = ids[mid]!;
    if (v === id) return mid;
    if (v < id) lo = mid + 1;
    else hi = mid - 1;
  }
  return -1;
}

/** What `bucket` says of `id`; undefined when it neither is stored nor is corrected. */
export function idEntryOf(bucket: IdBucket, id: string): IdEntry | undefined {
  const at = idIndex(bucket.ids, id);
  const c = bucket.corrected.indexOf(id);
  if (at < 0 && c < 0) return undefined;
  const entry: IdEntry = {};
  if (at >= 0) entry.at = [bucket.devices[bucket.device[at]!]!, bucket.seqs[at]!];
  if (c >= 0) entry.by = bucket.by[c]!.slice();
  return entry;
}

/** Every id of `bucket` with what it says of it (for tests and the upgrade). */
export function idEntriesOf(bucket: IdBucket): Map<string, IdEntry> {
  const out = new Map<string, IdEntry>();
  for (const id of bucket.ids) out.set(id, idEntryOf(bucket, id)!);
  for (const id of bucket.corrected) if (!out.has(id)) out.set(id, idEntryOf(bucket, id)!);
  return out;
}

/** An id a write would store twice. */
export class DuplicateId extends Error {
  constructor(readonly id: string) {
    super(`check ${id} is already stored`);
  }
}

/**
 * `bucket` with the ids of `adds` stored at their places and the corrections of `corrections`
 * ([corrected id, correcting id], in the order they are added) noted. Throws DuplicateId for an
 * id already in the bucket or twice in `adds`; nothing is changed then.
 */
export function withIds(
  bucket: IdBucket,
  adds: readonly { id: string; deviceId: string; seq: number }[],
  corrections: readonly (readonly [corrected: string, by: string])[] = [],
): IdBucket {
  const devices = bucket.devices.slice();
  const deviceIndex = new Map(devices.map((d, i) => [d, i]));
  const fresh = adds.map((a) => {
    let d = deviceIndex.get(a.deviceId);
    if (d === undefined) {
      d = devices.push(a.deviceId) - 1;
      deviceIndex.set(a.deviceId, d);
    }
    return { id: a.id, device: d, seq: a.seq };
  }).sort((x, y) => (x.id < y.id ? -1 : x.id > y.id ? 1 : 0));
  const n = bucket.ids.length + fresh.length;
  const ids = new Array<string>(n);
  const device = new Array<number>(n);
  const seqs = new Array<number>(n);
  let i = 0;
  let j = 0;
  for (let k = 0; k < n; k += 1) {
    const old = bucket.ids[i];
    const add = fresh[j];
    if (add !== undefined && (add.id === old || (k > 0 && add.id === ids[k - 1]))) throw new DuplicateId(add.id);
    if (add === undefined || (old !== undefined && old < add.id)) {
      ids[k] = old!;
      device[k] = bucket.device[i]!;
      seqs[k] = bucket.seqs[i]!;
      i += 1;
    } else {
      ids[k] = add.id;
      device[k] = add.device;
      seqs[k] = add.seq;
      j += 1;
    }
  }
  const corrected = bucket.corrected.slice();
  const by = bucket.by.map((list) => list);
  for (const [target, fix] of corrections) {
    const c = corrected.indexOf(target);
    if (c < 0) {
      corrected.push(target);
      by.push([fix]);
    } else by[c] = [...by[c]!, fix];
  }
  return { ids, device, seqs, devices, corrected, by };
}

/** A bucket as v4 to v8 kept it: one member per id. */
export type V8IdBucket = Record<string, { at?: [string, number]; by?: string[] }>;

/** Whether a stored value is a bucket of this shape (the v9 rung leaves those as they are). */
export function isIdBucket(value: unknown): value is IdBucket {
  return typeof value === 'object' && value !== null && Array.isArray((value as { ids?: unknown }).ids);
}

/** A v8 bucket in the v9 shape: the same ids, places and corrections. */
export function idBucketFromV8(old: V8IdBucket): IdBucket {
  const adds: { id: string; deviceId: string; seq: number }[] = [];
  const corrections: [string, string][] = [];
  for (const [id, entry] of Object.entries(old)) {
    if (entry.at) adds.push({ id, deviceId: entry.at[0], seq: entry.at[1] });
    for (const fix of entry.by ?? []) corrections.push([id, fix]);
  }
  return withIds(emptyIdBucket(), adds, corrections);
}
