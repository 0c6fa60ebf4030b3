// What plant-wide sync (src/sync) needs of the store, and nothing of the server: this device's
// records as their stored canonical texts (what is pushed, verbatim), the merge of records pulled
// from other devices (the backup import's own merge, so both apply the same checks), the sync
// state kept in settings, and the plant's vessel versions (which one is applied, which clash).
// On the transfer.ts surface: the sync client is loaded on demand, as the other long jobs are.
import { getDb } from './connection.ts';
import { StoreError, storeErrorFromWrite } from './errors.ts';
import { BACKUP_FORMAT, BACKUP_FORMAT_VERSION, mergeRecords, validateCheck, validateKindRecord, validateVessel, type BackupDocument } from './backup.ts';
import { sealMigratedChecks } from './checks.ts';
import { hashTexts } from './hash-texts.ts';
import { canonicalJson, chainFieldsOfText, contentOfText, kindOfText, throwIfAborted } from './integrity.ts';
import { chainHead, LOG_STORES } from './log-layout.ts';
import { deviceBlocks } from './log-walks.ts';
import { GENESIS_HASH, type LogRecord, type IsoDateTime, type JsonValue, type VesselRecord } from './records.ts';
import { SETTING_SYNC } from './schema.ts';
import { deviceId } from './settings.ts';
import { sha256OfText } from './sha256.ts';
import { formatIsoWithOffset, parseIsoWithOffset } from './time.ts';
import { FORBIDDEN_KEYS, invalid, requireText, requireUuid } from './validate.ts';

const STRICT = { durability: 'strict' } as const;
/** Settings key of this module (and SETTING_SYNC, schema.ts); reserved ("store:"), so putSetting cannot overwrite it. */
const SETTING_PLANT = 'store:plant';

// ---------------------------------------------------------------- this device's chain

/** One of this device's records as stored: its canonical text and the chain fields cut from it. */
export interface OwnRecord {
  /** 'check', or the record's kind (record-kinds.ts): the server document's type. */
  kind: string;
  seq: number;
  id: string;
  hash: string;
  /** The canonical JSON the store holds (the exact text that was hashed). */
  text: string;
  /** The record's chain-head signature (signing.ts), '' where it was saved unsigned. */
  signature: string;
}

/** This device's id and the seq and hash of its last stored record (null before the first). */
export async function ownChainHead(): Promise<{ deviceId: string; head: { seq: number; hash: string } | null }> {
  const db = await getDb();
  await sealMigratedChecks(db);
  const device = await deviceId();
  return { deviceId: device, head: await chainHead(db.transaction(LOG_STORES), device) };
}

/**
 * This device's records with seq from `fromSeq` up to `fromSeq + count − 1` (fewer where the
 * chain ends or has a gap), ascending, read in one snapshot. Texts are not parsed: the id and hash
 * are cut from the canonical text (integrity.ts chainFieldsOfText).
 * @throws StoreError('invalid-record') for a fromSeq below 1 or a count outside 1–10,000
 */
export async function ownRecords(fromSeq: number, count: number): Promise<OwnRecord[]> {
  if (!Number.isSafeInteger(fromSeq) || fromSeq < 1) throw invalid('fromSeq', `${fromSeq}; expected a whole number from 1`);
  if (!Number.isInteger(count) || count < 1 || count > 10_000) throw invalid('count', `${count}; allowed 1 to 10000`);
  const db = await getDb();
  await sealMigratedChecks(db);
  const device = await deviceId();
  const last = fromSeq + count - 1;
  const blocks = await deviceBlocks(db.transaction(LOG_STORES), device, fromSeq, last);
  const out: OwnRecord[] = [];
  for (const block of blocks) {
    block.seqs.forEach((seq, i) => {
      if (seq < fromSeq || seq > last) return;
      const text = block.texts[i]!;
      const cut = chainFieldsOfText(text, seq);
      const { id, hash } = cut ? cut.link : (JSON.parse(text) as LogRecord);
      out.push({ kind: kindOfText(text), seq, id, hash, text, signature: block.sigs?.[i] ?? '' });
    });
  }
  return out;
}

// ---------------------------------------------------------------- records pulled from the server

/** A record as pulled: its canonical text, and a label to report it by (the server's document id). */
export interface PulledRecord {
  label: string;
  text: string;
  /** The record's chain-head signature as the server carries it; '' or absent for none. */
  signature?: string;
  /**
   * JSON.parse(text), when the caller has parsed it already (the pull, for the envelope): taken
   * instead of parsing again. Safe whatever is passed: the record it validates to must still
   * write out as exactly `text` (the canonical form check), or it is refused.
   */
  parsed?: unknown;
}

/** What mergePulledRecords did. */
export interface PullMergeReport {
  /** Ids of the records stored by this merge: checks, and records of the kinds this version keeps. */
  added: string[];
  /** Records already here, identical. */
  skipped: number;
  /** Records not stored, by label, and why (bad hash, broken link, seq taken, not a valid record …). */
  refused: { label: string; why: string }[];
  /** Records stored though the one before them on their device is not here (yet): the gap shows in the chain status. */
  gaps: string[];
}

/**
 * Merges records pulled from the plant server into the log, with the checks the backup import
 * applies (BACKUP-FORMAT.md, Import policy): each text must be a valid check record in canonical
 * form, its content must match its hash, its prevHash must be the hash of its device's previous
 * record (here or in the batch), and its id and seq must not be held by another record. A record
 * failing any of these is refused and reported, the rest is written in one strict transaction;
 * records already here and identical are skipped, so a batch pulled twice changes nothing.
 * @throws StoreError('cancelled' | 'quota-exceeded' | 'write-failed') with nothing written
 */
export async function mergePulledRecords(records: readonly PulledRecord[], options: { signal?: AbortSignal } = {}): Promise<PullMergeReport> {
  const report: PullMergeReport = { added: [], skipped: 0, refused: [], gaps: [] };
  const checks: LogRecord[] = [];
  const texts: string[] = [];
  const labels: string[] = [];
  const signatures: BackupDocument['signatures'] = [];
  const inBatch = new Map<string, string>(); // id -> text
  for (const { label, text, signature, parsed } of records) {
    const why = problemOfPulled(text, parsed);
    if (typeof why === 'string') {
      report.refused.push({ label, why });
      continue;
    }
    const earlier = inBatch.get(why.id);
    if (earlier !== undefined) {
      if (earlier === text) report.skipped += 1;
      else report.refused.push({ label, why: `another record with id ${why.id} is in the same batch` });
      continue;
    }
    inBatch.set(why.id, text);
    if (signature) signatures.push({ deviceId: why.deviceId, seq: why.seq, signature });
    checks.push(why);
    texts.push(text);
    labels.push(label);
  }
  throwIfAborted(options.signal);
  if (checks.length === 0) return report;
  const hashes = await hashTexts(texts.length, (i) => contentOfText(texts[i]!), { signal: options.signal });
  const doc: BackupDocument = {
    format: BACKUP_FORMAT,
    formatVersion: BACKUP_FORMAT_VERSION,
    exportedAt: formatIsoWithOffset(new Date()),
    vessels: [],
    checks,
    // Kinds this version does not keep were left on the server by the pull. Keys come from the
    // devices' key records, learnt before the merge (sync-keys.ts), so no chains are needed here.
    others: [],
    chains: [],
    signatures,
  };
  const merged = await mergeRecords(doc, texts, hashes, { policy: 'record-by-record', ...(options.signal ? { signal: options.signal } : {}) });
  const labelOf = new Map(checks.map((c, i) => [c.id, labels[i]!]));
  report.added = [...merged.checks.added, ...merged.records.added.map((r) => r.id)];
  report.skipped += merged.checks.skipped.length + merged.records.skipped.length;
  for (const r of merged.checks.rejected) report.refused.push({ label: labelOf.get(r.id) ?? r.id, why: r.why });
  report.gaps = merged.warnings;
  return report;
}

/** The pulled text (`parsed`: its JSON.parse, when known) as a check or a record of a kind this version keeps, or why it cannot be one. */
function problemOfPulled(text: string, parsed?: unknown): LogRecord | string {
  if (typeof text !== 'string') return 'the text is not a string';
  let value: unknown = parsed;
  if (value === undefined) {
    try {
      value = JSON.parse(text);
    } catch {
      return 'the text is not JSON';
    }
  }
  let record: LogRecord;
  try {
    const kinded = typeof value === 'object' && value !== null && !Array.isArray(value) && 'kind' in value;
    record = kinded ? validateKindRecord('record', value) : validateCheck('record', value);
  } catch (error) {
    return problemOf(error);
  }
  if (hasForbiddenKey(value)) return 'the text holds a key named __proto__, constructor or prototype';
  // The text is stored and hashed as it came; one that is not canonical was re-serialised or edited.
  if (canonicalJson(record) !== text) return 'the text is not in canonical form (re-serialised or edited after it was saved)';
  return record;
}

function hasForbiddenKey(value: unknown, depth = 0): boolean {
  if (typeof value !== 'object' || value === null || depth > 20) return false;
  for (const key of Object.keys(value)) {
    if (FORBIDDEN_KEYS.has(key) || hasForbiddenKey((value as Record<string, unknown>)[key], depth + 1)) return true;
  }
  return false;
}

/** A validator's message without the backup wording ("Backup file not imported …"). */
function problemOf(error: unknown): string {
  if (error instanceof StoreError) return error.message.replace(/^Backup file not imported, nothing changed\. /, '');
  throw error;
}

/** Where a device's chain is not whole, in the ranges linksAround looked at. */
export interface LinkProblem {
  deviceId: string;
  /** The first record after the problem. */
  seq: number;
  /** 'gap': seq − 1 (and maybe more) is not here; 'broken': its prevHash is not the hash of seq − 1 here. */
  problem: 'gap' | 'broken';
  detail: string;
}

/**
 * Checks the links of each device's stored records over [fromSeq, toSeq] and one record either
 * side (prevHash of each equal to the hash of the one before). Records pulled out of seq order
 * (the server's feed follows its own write order, which a batch re-sent after a crash may break)
 * are each merged before the one they point to is here, so the links around them are checked
 * again once the pull is over. Contents were checked against their hashes by the merge; this
 * reads only the chain fields.
 */
export async function linksAround(ranges: readonly { deviceId: string; fromSeq: number; toSeq: number }[]): Promise<LinkProblem[]> {
  const db = await getDb();
  const tx = db.transaction(LOG_STORES);
  const problems: LinkProblem[] = [];
  await Promise.all(
    ranges.map(async ({ deviceId: device, fromSeq, toSeq }) => {
      const low = Math.max(1, fromSeq - 1);
      const blocks = await deviceBlocks(tx, device, low, toSeq + 1);
      let prev: { seq: number; hash: string } | null = null;
      for (const block of blocks) {
        for (let i = 0; i < block.seqs.length; i += 1) {
          const seq = block.seqs[i]!;
          if (seq < low || seq > toSeq + 1) continue;
          const text = block.texts[i]!;
          const link = chainFieldsOfText(text, seq)?.link ?? (JSON.parse(text) as LogRecord);
          if (seq >= fromSeq) {
            const linked = prev !== null && prev.seq === seq - 1;
            if (seq === 1 ? link.prevHash !== GENESIS_HASH : linked && link.prevHash !== prev!.hash) {
              problems.push({ deviceId: device, seq, problem: 'broken', detail: `seq ${seq}: prevHash is not the hash of seq ${seq - 1}` });
            } else if (seq > 1 && !linked) {
              const missing = prev && prev.seq + 1 < seq - 1 ? `seq ${prev.seq + 1} to ${seq - 1}` : `seq ${seq - 1}`;
              problems.push({ deviceId: device, seq, problem: 'gap', detail: `${missing} missing before seq ${seq}` });
            }
          }
          prev = { seq, hash: link.hash };
        }
      }
    }),
  );
  return problems.sort((x, y) => (x.deviceId < y.deviceId ? -1 : x.deviceId > y.deviceId ? 1 : x.seq - y.seq));
}

// ---------------------------------------------------------------- sync state (settings)

/** Where the last sync ended. */
export interface LastSync {
  at: IsoDateTime;
  outcome: 'ok' | 'failed' | 'cancelled';
  pushed: number;
  pulled: number;
  /** Plain words for the user: what was done, or what went wrong. */
  message: string;
  /**
   * The seq of this device's last record the server was known to hold after this sync (the pending
   * count is the local head less this); absent before the first sync that got that far.
   */
  serverHead?: number;
}

/** The sync settings of this device. */
export interface SyncState {
  /** Where the server's databases are: an absolute URL or a path on the app's own origin (e.g. "/db/"). */
  server: string | null;
  /** The CouchDB account (this device's id). */
  account: string | null;
  /** The account's password, given by the administrator at enrolment. */
  password: string | null;
  /** A technician's device pushes its checks and pulls the plant; a supervisor's also pulls every check. */
  role: 'technician' | 'supervisor' | null;
  /** Per database, the server's last_seq after the last pulled batch that committed here (opaque). */
  checkpoints: Record<string, JsonValue>;
  lastSync: LastSync | null;
}

const EMPTY_STATE: SyncState = { server: null, account: null, password: null, role: null, checkpoints: {}, lastSync: null };

/** The sync settings; all null until a device is enrolled. */
export async function getSyncState(): Promise<SyncState> {
  const stored = await (await getDb()).get('settings', SETTING_SYNC);
  return { ...EMPTY_STATE, ...(typeof stored === 'object' && stored !== null && !Array.isArray(stored) ? (stored as Partial<SyncState>) : {}) };
}

/**
 * Changes some sync settings (read and written in one strict transaction, so two tabs do not lose
 * each other's checkpoint). Each field is checked first; nothing is saved if one is wrong.
 * @throws StoreError('invalid-record') naming the field and its range; ('quota-exceeded' | 'write-failed')
 */
export async function updateSyncState(patch: Partial<SyncState>): Promise<SyncState> {
  requireSyncPatch(patch);
  const db = await getDb();
  const tx = db.transaction('settings', 'readwrite', STRICT);
  const write = async () => {
    const stored = (await tx.store.get(SETTING_SYNC)) as Partial<SyncState> | undefined;
    const next: SyncState = { ...EMPTY_STATE, ...(stored ?? {}), ...patch };
    if (patch.checkpoints) next.checkpoints = { ...(stored?.checkpoints ?? {}), ...patch.checkpoints };
    await tx.store.put(next as unknown as JsonValue, SETTING_SYNC);
    return next;
  };
  try {
    const [next] = await Promise.all([write(), tx.done]);
    return next;
  } catch (error) {
    throw storeErrorFromWrite(error, 'Saving the sync settings');
  }
}

function requireSyncPatch(patch: Partial<SyncState>): void {
  if (typeof patch !== 'object' || patch === null) throw invalid('sync settings', 'expected an object');
  for (const key of Object.keys(patch)) {
    if (!(key in EMPTY_STATE)) throw invalid(key, `unknown sync setting; expected one of ${Object.keys(EMPTY_STATE).join(', ')}`);
  }
  const optionalText = (field: 'server' | 'account' | 'password', max: number) => {
    const v = patch[field];
    if (v !== undefined && v !== null) requireText(field, v, 1, max);
  };
  optionalText('server', 2000);
  optionalText('account', 200);
  optionalText('password', 200);
  if (patch.role !== undefined && patch.role !== null && patch.role !== 'technician' && patch.role !== 'supervisor') {
    throw invalid('role', 'expected "technician" or "supervisor"');
  }
  if (patch.checkpoints !== undefined) {
    if (typeof patch.checkpoints !== 'object' || patch.checkpoints === null) throw invalid('checkpoints', 'expected an object');
    for (const [db, seq] of Object.entries(patch.checkpoints)) {
      requireText('checkpoints database name', db, 1, 256);
      if (typeof seq !== 'string' && typeof seq !== 'number' && seq !== null) throw invalid(`checkpoints.${db}`, 'expected the server\'s last_seq');
    }
  }
  const last = patch.lastSync;
  if (last !== undefined && last !== null) {
    if (parseIsoWithOffset(last.at) === null) throw invalid('lastSync.at', 'expected an ISO 8601 date-time with offset');
    if (!['ok', 'failed', 'cancelled'].includes(last.outcome)) throw invalid('lastSync.outcome', 'expected ok, failed or cancelled');
    for (const n of ['pushed', 'pulled'] as const) {
      if (!Number.isSafeInteger(last[n]) || last[n] < 0) throw invalid(`lastSync.${n}`, `${last[n]}; expected a whole number from 0`);
    }
    requireText('lastSync.message', last.message, 0, 2000);
    if (last.serverHead !== undefined && (!Number.isSafeInteger(last.serverHead) || last.serverHead < 0)) {
      throw invalid('lastSync.serverHead', `${last.serverHead}; expected a whole number from 0`);
    }
  }
}

// ---------------------------------------------------------------- the plant's vessel versions

/**
 * One version of a vessel definition in the plant inventory: the whole vessel record as a
 * supervisor saved it, which version it is, who saved it and which version it was based on.
 */
export interface VesselVersion {
  kind: 'vessel';
  vesselId: string;
  /** 1, 2, 3 …: the newest number wins. */
  version: number;
  /** The account (device id) that saved it. */
  author: string;
  /** The person's name as typed on that device (may be empty). */
  authorName: string;
  /** The label of the version this one was made from; null for version 1. */
  basedOn: string | null;
  savedAt: IsoDateTime;
  vessel: VesselRecord;
}

/** A version as the server holds it: a label (the server's document id) and the version's canonical text. */
export interface PulledVersion {
  label: string;
  text: string;
}

/** Two supervisors' edits of one version, or a pulled version that would replace an edit made on this device. */
export type PlantConflict =
  | { kind: 'two-edits'; vesselId: string; tag: string; version: number; labels: string[] }
  | { kind: 'local-edit'; vesselId: string; tag: string; version: number; label: string };

/** What applyVesselVersions did. */
export interface PlantReport {
  applied: { vesselId: string; tag: string; version: number; label: string }[];
  /** Versions already known here. */
  skipped: number;
  refused: { label: string; why: string }[];
  /** Never resolved here: a supervisor saves a new version (or the edit here is published or undone). */
  conflicts: PlantConflict[];
}

interface PlantVessel {
  /** The version this device's vessel record was last set from (or published as). */
  applied: { version: number; label: string; vesselHash: string } | null;
  /** The highest version seen, and every label seen at it (more than one: two edits of one version). */
  top: { version: number; labels: string[] };
  /** The newest single version, when it could not be applied over an edit made here. */
  held: { label: string; version: number; vessel: VesselRecord } | null;
}
type PlantState = Record<string, PlantVessel>;

function vesselHash(v: VesselRecord): string {
  return sha256OfText(canonicalJson(v));
}

/** The pulled version, validated, or why it is refused. */
function problemOfVersion(text: string): VesselVersion | string {
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    return 'the text is not JSON';
  }
  if (typeof value !== 'object' || value === null || Array.isArray(value)) return 'the text is not a JSON object';
  if (hasForbiddenKey(value)) return 'the text holds a key named __proto__, constructor or prototype';
  const v = value as Record<string, unknown>;
  const keys = ['author', 'authorName', 'basedOn', 'kind', 'savedAt', 'vessel', 'vesselId', 'version'];
  for (const key of Object.keys(v)) if (!keys.includes(key)) return `${key}: unknown field`;
  try {
    if (v['kind'] !== 'vessel') return 'kind: expected "vessel"';
    requireUuid('vesselId', v['vesselId']);
    if (!Number.isInteger(v['version']) || (v['version'] as number) < 1 || (v['version'] as number) > 999_999) return 'version: expected a whole number from 1 to 999999';
    requireText('author', v['author'], 1, 200);
    requireText('authorName', v['authorName'], 0, 100);
    if (v['basedOn'] !== null) requireText('basedOn', v['basedOn'], 1, 400);
    if (parseIsoWithOffset(v['savedAt'] as string) === null) return 'savedAt: expected an ISO 8601 date-time with offset';
    validateVessel('vessel', v['vessel']);
  } catch (error) {
    return problemOf(error);
  }
  if ((v['vessel'] as VesselRecord).id !== v['vesselId']) return 'vessel.id: differs from vesselId';
  if (canonicalJson(value) !== text) return 'the text is not in canonical form (re-serialised or edited after it was saved)';
  return value as VesselVersion;
}

/**
 * Applies vessel versions pulled from the plant database. Per vessel the newest version number
 * wins; two versions with the same number from different authors are a conflict, reported and not
 * applied (the vessel stays as it is until a supervisor saves a newer version); a version that
 * would replace an edit made on this device since the last applied version is held and reported,
 * never applied over it. Vessels and the plant state are written in one strict transaction.
 * @throws StoreError('quota-exceeded' | 'write-failed') with nothing written
 */
export async function applyVesselVersions(pulled: readonly PulledVersion[]): Promise<PlantReport> {
  const report: PlantReport = { applied: [], skipped: 0, refused: [], conflicts: [] };
  const versions: { label: string; entry: VesselVersion }[] = [];
  for (const { label, text } of pulled) {
    const entry = problemOfVersion(text);
    if (typeof entry === 'string') report.refused.push({ label, why: entry });
    else versions.push({ label, entry });
  }
  if (versions.length === 0) return report;
  const db = await getDb();
  const tx = db.transaction(['vessels', 'settings'] as const, 'readwrite', STRICT);
  const work = async () => {
    const state = ((await tx.objectStore('settings').get(SETTING_PLANT)) ?? {}) as unknown as PlantState;
    const touched = [...new Set(versions.map((v) => v.entry.vesselId))];
    const locals = await Promise.all(touched.map((id) => tx.objectStore('vessels').get(id)));
    const newest = new Map<string, { label: string; entry: VesselVersion }>();
    for (const v of versions) {
      const id = v.entry.vesselId;
      const s = (state[id] ??= { applied: null, top: { version: 0, labels: [] }, held: null });
      if (v.entry.version > s.top.version) s.top = { version: v.entry.version, labels: [v.label] };
      else if (v.entry.version === s.top.version && !s.top.labels.includes(v.label)) s.top.labels.push(v.label);
      else {
        report.skipped += 1;
        continue;
      }
      if (v.entry.version === s.top.version) newest.set(id, v);
    }
    const writes: Promise<unknown>[] = [];
    touched.forEach((id, i) => {
      const s = state[id]!;
      const local = locals[i];
      const tag = local?.tag ?? newest.get(id)?.entry.vessel.tag ?? s.held?.vessel.tag ?? id;
      if (s.top.labels.length > 1) {
        report.conflicts.push({ kind: 'two-edits', vesselId: id, tag, version: s.top.version, labels: [...s.top.labels].sort() });
        return;
      }
      if (s.applied && s.applied.version >= s.top.version) return;
      const fresh = newest.get(id);
      const candidate = fresh ? { label: fresh.label, vessel: fresh.entry.vessel } : s.held?.version === s.top.version ? s.held : null;
      if (!candidate) return;
      const incoming = candidate.vessel;
      const editedHere = local !== undefined && (s.applied ? vesselHash(local) !== s.applied.vesselHash : canonicalJson(local) !== canonicalJson(incoming));
      if (editedHere) {
        s.held = { label: candidate.label, version: s.top.version, vessel: incoming };
        report.conflicts.push({ kind: 'local-edit', vesselId: id, tag, version: s.top.version, label: candidate.label });
        return;
      }
      writes.push(tx.objectStore('vessels').put(incoming));
      s.applied = { version: s.top.version, label: candidate.label, vesselHash: vesselHash(incoming) };
      s.held = null;
      report.applied.push({ vesselId: id, tag: incoming.tag, version: s.top.version, label: candidate.label });
    });
    writes.push(tx.objectStore('settings').put(state as unknown as JsonValue, SETTING_PLANT));
    await Promise.all(writes);
  };
  try {
    await Promise.all([work(), tx.done]);
  } catch (error) {
    throw storeErrorFromWrite(error, 'Saving the plant inventory');
  }
  return report;
}

/** A vessel edited on this (supervisor's) device, ready to be published as the next version. */
export interface VesselEdit {
  entry: VesselVersion;
  /** canonicalJson(entry): the exact text to send. */
  text: string;
}

/**
 * The vessels whose record here differs from the version last applied or published, each as the
 * next version (newest seen + 1, based on the one applied here). A vessel whose newer version from
 * someone else is not applied here yet is left out and listed in `blocked`: pull and resolve first.
 * @throws StoreError('invalid-record') for a bad author or authorName
 */
export async function vesselEditsToPublish(author: string, authorName: string): Promise<{ edits: VesselEdit[]; blocked: PlantConflict[] }> {
  requireText('author', author, 1, 200);
  requireText('authorName', authorName, 0, 100);
  const db = await getDb();
  const tx = db.transaction(['vessels', 'settings'] as const);
  const [vessels, stored] = await Promise.all([tx.objectStore('vessels').getAll(), tx.objectStore('settings').get(SETTING_PLANT), tx.done]);
  const state = (stored ?? {}) as unknown as PlantState;
  const edits: VesselEdit[] = [];
  const blocked: PlantConflict[] = [];
  const savedAt = formatIsoWithOffset(new Date());
  for (const vessel of vessels) {
    const s = state[vessel.id];
    if (s?.applied && s.applied.vesselHash === vesselHash(vessel)) continue;
    const top = s?.top.version ?? 0;
    if (top > (s?.applied?.version ?? 0)) {
      blocked.push({ kind: 'local-edit', vesselId: vessel.id, tag: vessel.tag, version: top, label: s?.held?.label ?? s!.top.labels[0]! });
      continue;
    }
    const entry: VesselVersion = {
      kind: 'vessel',
      vesselId: vessel.id,
      version: top + 1,
      author,
      authorName,
      basedOn: s?.applied?.label ?? null,
      savedAt,
      vessel,
    };
    edits.push({ entry, text: canonicalJson(entry) });
  }
  return { edits, blocked };
}

/**
 * Records versions this device published (the server stored them under `label`), so they count
 * as applied here and a pull of them changes nothing.
 * @throws StoreError('quota-exceeded' | 'write-failed')
 */
export async function recordPublished(published: readonly { label: string; entry: VesselVersion }[]): Promise<void> {
  if (published.length === 0) return;
  const db = await getDb();
  const tx = db.transaction('settings', 'readwrite', STRICT);
  const work = async () => {
    const state = ((await tx.store.get(SETTING_PLANT)) ?? {}) as unknown as PlantState;
    for (const { label, entry } of published) {
      const s = (state[entry.vesselId] ??= { applied: null, top: { version: 0, labels: [] }, held: null });
      s.applied = { version: entry.version, label, vesselHash: vesselHash(entry.vessel) };
      if (entry.version > s.top.version) s.top = { version: entry.version, labels: [label] };
      else if (entry.version === s.top.version && !s.top.labels.includes(label)) s.top.labels.push(label);
    }
    await tx.store.put(state as unknown as JsonValue, SETTING_PLANT);
  };
  try {
    await Promise.all([work(), tx.done]);
  } catch (error) {
    throw storeErrorFromWrite(error, 'Saving the plant inventory');
  }
}
