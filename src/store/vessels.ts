// The vessel inventory. Vessels may be edited and retired (never deleted): checks keep a snapshot
// of the vessel as it was, and a retired vessel keeps its history.
import { getDb } from './connection.ts';
import { StoreError, storeErrorFromWrite } from './errors.ts';
import type { NewVessel, VesselPatch, VesselRecord } from './records.ts';
import { formatIsoWithOffset } from './time.ts';
import { registerFromVessel } from './instrument-upgrade.ts';
import { cloneJson, invalid, requireJsonObject, requireText, requireUuid } from './validate.ts';

const STRICT = { durability: 'strict' } as const;
export const TAG_MAX = 64;
export const DESCRIPTION_MAX = 2000;
/**
 * The check interval's range, s: a copy of the core's CHECK_INTERVAL_MIN_S and CHECK_INTERVAL_MAX_S
 * (the store takes only types from the core; test/store/vessels.test.ts holds the copies equal).
 */
export const CHECK_INTERVAL_RANGE_S = { min: 3_600, max: 1_096 * 86_400 } as const;

/** A check interval as stored: a number of seconds in range, or null for none. */
export function requireCheckInterval(field: string, value: unknown): number | null {
  if (value === null) return null;
  const { min, max } = CHECK_INTERVAL_RANGE_S;
  if (typeof value !== 'number' || !Number.isFinite(value) || value < min || value > max) {
    throw invalid(field, `expected ${min} (1 hour) to ${max} s (1,096 days), or null for none`);
  }
  return value;
}

/** The record with its interval set, or without the key when none (so a vessel without one stays as older versions wrote it). */
function withInterval(record: VesselRecord, intervalS: number | null): VesselRecord {
  const { checkIntervalS: _old, ...rest } = record;
  return intervalS === null ? rest : { ...rest, checkIntervalS: intervalS };
}

/** The key the by-tag index holds: case folded the same way on every device. */
export function tagKeyOf(tag: string): string {
  return tag.trim().toLowerCase();
}

function requireTag(tag: unknown): string {
  const text = requireText('tag', typeof tag === 'string' ? tag.trim() : tag, 1, TAG_MAX);
  return text;
}

async function putVessel(record: VesselRecord, what: string): Promise<VesselRecord> {
  const db = await getDb();
  const tx = db.transaction('vessels', 'readwrite', STRICT);
  try {
    await Promise.all([tx.store.put(record), tx.done]);
  } catch (error) {
    throw storeErrorFromWrite(error, what);
  }
  return record;
}

/**
 * Adds a vessel. `tag` is trimmed, 1–64 characters; `description` up to 2000; `spec` is the check
 * engine's VesselSpec as plain JSON (stored as-is; only its instruments are read, to make their
 * register entries and fit them, see instrument-upgrade.ts); `checkIntervalS` 3,600 s to 1,096 days,
 * or null / absent for none.
 * @throws StoreError('invalid-record' | 'quota-exceeded' | 'write-failed')
 */
export async function addVessel(input: NewVessel): Promise<VesselRecord> {
  const tag = requireTag(input.tag);
  const description = requireText('description', input.description ?? '', 0, DESCRIPTION_MAX);
  requireJsonObject('spec', input.spec);
  const interval = requireCheckInterval('checkIntervalS', input.checkIntervalS ?? null);
  const spec = cloneJson(input.spec);
  const now = formatIsoWithOffset(new Date(), undefined, true);
  const record: VesselRecord = {
    id: crypto.randomUUID(),
    tag,
    tagKey: tagKeyOf(tag),
    description,
    spec,
    retired: false,
    retiredAt: null,
    createdAt: now,
    updatedAt: now,
  };
  // Its typed gauge and thermometer join the register in the same transaction, as the upgrade
  // did for the vessels before it, so every vessel's checks can name their instruments.
  const stored = withInterval(record, interval);
  const register = registerFromVessel(stored, now, () => crypto.randomUUID());
  const db = await getDb();
  const tx = db.transaction(['vessels', 'instruments', 'fittings'], 'readwrite', STRICT);
  try {
    await Promise.all([
      tx.objectStore('vessels').put(stored),
      ...register.instruments.map((i) => tx.objectStore('instruments').put(i)),
      ...register.fittings.map((f) => tx.objectStore('fittings').put(f)),
      tx.done,
    ]);
  } catch (error) {
    throw storeErrorFromWrite(error, `Saving vessel ${tag}`);
  }
  return stored;
}

/**
 * Changes a vessel's tag, description, spec or check interval (null clears it). Saved checks keep the snapshot they were taken with.
 * @throws StoreError('not-found' | 'invalid-record' | 'quota-exceeded' | 'write-failed')
 */
export async function updateVessel(id: string, patch: VesselPatch): Promise<VesselRecord> {
  const existing = await requireVessel(id);
  const tag = patch.tag === undefined ? existing.tag : requireTag(patch.tag);
  const description =
    patch.description === undefined ? existing.description : requireText('description', patch.description, 0, DESCRIPTION_MAX);
  if (patch.spec !== undefined) requireJsonObject('spec', patch.spec);
  const interval = patch.checkIntervalS === undefined ? existing.checkIntervalS ?? null : requireCheckInterval('checkIntervalS', patch.checkIntervalS);
  const spec = patch.spec === undefined ? existing.spec : cloneJson(patch.spec);
  const record: VesselRecord = {
    ...existing,
    tag,
    tagKey: tagKeyOf(tag),
    description,
    spec,
    updatedAt: formatIsoWithOffset(new Date(), undefined, true),
  };
  return putVessel(withInterval(record, interval), `Saving vessel ${tag}`);
}

/**
 * Retires a vessel: it drops out of listVessels() by default and cannot get new checks, but its
 * checks stay. Retiring a retired vessel changes nothing.
 * @throws StoreError('not-found' | 'quota-exceeded' | 'write-failed')
 */
export async function retireVessel(id: string): Promise<VesselRecord> {
  const existing = await requireVessel(id);
  if (existing.retired) return existing;
  const now = formatIsoWithOffset(new Date(), undefined, true);
  return putVessel({ ...existing, retired: true, retiredAt: now, updatedAt: now }, `Retiring vessel ${existing.tag}`);
}

/** One vessel, or undefined. */
export async function getVessel(id: string): Promise<VesselRecord | undefined> {
  return (await getDb()).get('vessels', id);
}

async function requireVessel(id: string): Promise<VesselRecord> {
  requireUuid('vessel id', id);
  const found = await getVessel(id);
  if (!found) throw new StoreError('not-found', `No vessel with id ${id}.`, 'vessel id');
  return found;
}

/**
 * Vessels sorted by tag (case-insensitive). `tagPrefix` keeps those whose tag starts with it,
 * ignoring case and surrounding spaces; retired vessels are left out unless `includeRetired`.
 */
export async function listVessels(options: { tagPrefix?: string; includeRetired?: boolean } = {}): Promise<VesselRecord[]> {
  const db = await getDb();
  const prefix = tagKeyOf(options.tagPrefix ?? '');
  // '\uffff' sorts after every character a tag can hold, so [prefix, prefix+'\uffff'] is "starts with".
  const range = prefix ? IDBKeyRange.bound(prefix, prefix + '\uffff') : undefined;
  const all = await db.getAllFromIndex('vessels', 'by-tag', range);
  return options.includeRetired ? all : all.filter((v) => !v.retired);
}
