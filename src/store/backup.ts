// The full JSON backup ("tankside-backup", formatVersion 1; BACKUP-FORMAT.md is its reference):
// export, validation, and all-or-nothing import-and-merge.
//
// Import policy: any schema failure rejects the whole file (nothing is written, the error names
// the first bad field). A file that passes the schema is merged record by record: a check already
// here and identical is skipped; a check whose content does not match its hash, whose link to the
// previous record fails, or that collides with a different record here is rejected with its
// reason; everything else is added, all in one transaction.
import type { IDBPDatabase } from 'idb';
import { getDb } from './connection.ts';
import { StoreError, storeErrorFromWrite } from './errors.ts';
import { requireCautions, requireInputs, sealMigratedChecks, TEXT_LIMITS } from './checks.ts';
import { hashTexts } from './hash-texts.ts';
import { deviceBlocks } from './log-walks.ts';
import { breathe, canonicalJson, ChainVerifier, contentOfText, progressStep, throwIfAborted, type ChainStatus } from './integrity.ts';
import {
  addToLog,
  blockPages,
  countChecks,
  locateIds,
  LOG_STORES,
  readRecords,
  settle,
  type LogBlock,
  type NewLogEntry,
} from './log-layout.ts';
import { GENESIS_HASH, type CheckRecord, type IsoDateTime, type LongWorkOptions, type VesselRecord } from './records.ts';
import type { TanksideDB } from './schema.ts';
import { formatIsoWithOffset, parseIsoWithOffset } from './time.ts';
import { FORBIDDEN_KEYS, HEX64, requireJson, requireJsonObject, requireText, requireUuid } from './validate.ts';
import { DESCRIPTION_MAX, TAG_MAX, tagKeyOf } from './vessels.ts';

export const BACKUP_FORMAT = 'tankside-backup';
export const BACKUP_FORMAT_VERSION = 1;
/** Refused before parsing: a file longer than maxChars (UTF-16 code units), or holding more records. */
export interface BackupLimits {
  maxChars: number;
  maxVessels: number;
  maxChecks: number;
}
export const BACKUP_LIMITS: Readonly<BackupLimits> = { maxChars: 300_000_000, maxVessels: 100_000, maxChecks: 1_000_000 };

/** Where each device's chain ended when the backup was made. */
export interface ChainHead {
  deviceId: string;
  count: number;
  headSeq: number;
  headHash: string;
}

/** A parsed, validated backup. */
export interface BackupDocument {
  format: typeof BACKUP_FORMAT;
  formatVersion: typeof BACKUP_FORMAT_VERSION;
  exportedAt: IsoDateTime;
  vessels: VesselRecord[];
  checks: CheckRecord[];
  chains: ChainHead[];
}

/** What importBackup did, record by record. */
export interface ImportReport {
  vessels: { added: string[]; updated: string[]; skipped: { id: string; why: string }[] };
  checks: { added: string[]; skipped: { id: string; why: string }[]; rejected: { id: string; why: string }[] };
  /** Chain status of each device's records as they stand in the file. */
  fileChains: ChainStatus[];
  /** Things worth telling the user that reject nothing (e.g. the file ends before the chain head it names). */
  warnings: string[];
}

const STRICT = { durability: 'strict' } as const;

// ---------------------------------------------------------------- export

/**
 * Exports every vessel and check as a "tankside-backup" formatVersion 1 document (JSON text), read
 * from one consistent snapshot. Deterministic: the same store content gives the same text apart
 * from `exportedAt` (vessels by id, checks by device then seq, each record as canonical JSON).
 * @throws StoreError('cancelled') if options.signal aborts
 */
export async function exportBackup(options: LongWorkOptions = {}): Promise<string> {
  return (await exportBackupParts(options)).join('');
}

/**
 * As exportBackup, as pieces whose concatenation is the document: a Blob or File made from them
 * skips building one string of the whole file (hundreds of megabytes for a large log).
 */
export async function exportBackupParts(options: LongWorkOptions = {}): Promise<string[]> {
  const db = await getDb();
  await sealMigratedChecks(db);
  throwIfAborted(options.signal);
  const tx = db.transaction(['vessels', ...LOG_STORES] as const);
  const vessels = await tx.objectStore('vessels').getAll();
  const total = await countChecks(tx);
  // Blocks come in device-then-seq order, and hold each record's canonical JSON already: the
  // file's check lines are the stored texts, in the order read, one piece per page of blocks.
  // Only each device's last record is parsed, for its chain head.
  const checkParts: string[] = [];
  const heads: ChainHead[] = [];
  let device: { id: string; count: number; last: string } | null = null;
  const closeDevice = () => {
    if (!device) return;
    const last = JSON.parse(device.last) as CheckRecord;
    heads.push({ deviceId: device.id, count: device.count, headSeq: last.seq, headHash: last.hash });
  };
  let done = 0;
  for await (const page of blockPages(tx)) {
    throwIfAborted(options.signal);
    const texts: string[] = [];
    for (const block of page) {
      if (block.texts.length === 0) continue;
      if (!device || device.id !== block.deviceId) {
        closeDevice();
        device = { id: block.deviceId, count: 0, last: '' };
      }
      for (const text of block.texts) texts.push(text);
      device.count += block.texts.length;
      device.last = block.texts[block.texts.length - 1]!;
    }
    if (texts.length > 0) checkParts.push(texts.join(',\n'));
    done += texts.length;
    options.onProgress?.(done, total);
  }
  closeDevice();
  await tx.done;
  const exportedAt = formatIsoWithOffset(new Date());
  const checkLines: string[] = [];
  checkParts.forEach((part, i) => checkLines.push(i === 0 ? '\n' : ',\n', part));
  if (checkLines.length > 0) checkLines.push('\n');
  return [
    `{"format":${JSON.stringify(BACKUP_FORMAT)},"formatVersion":${BACKUP_FORMAT_VERSION},"exportedAt":${JSON.stringify(exportedAt)},\n`,
    `"vessels":[${lines(vessels.map((v) => canonicalJson(v)))}],\n`,
    '"checks":[',
    ...checkLines,
    '],\n',
    `"chains":[${lines(heads.map((h) => canonicalJson(h)))}]}\n`,
  ];
}

function lines(items: string[]): string {
  return items.length === 0 ? '' : `\n${items.join(',\n')}\n`;
}

// ---------------------------------------------------------------- validation

function bad(field: string, problem: string): StoreError {
  return new StoreError('invalid-backup', `Backup file not imported, nothing changed. ${field}: ${problem}`, field);
}

/** Runs a validator from validate.ts / checks.ts and re-labels its error as a backup error. */
function within<T>(fn: () => T): T {
  try {
    return fn();
  } catch (error) {
    if (error instanceof StoreError && error.code === 'invalid-record') {
      throw bad(error.field ?? 'file', error.message.replace(/^[^:]*: /, ''));
    }
    throw error;
  }
}

function requireObject(field: string, value: unknown): Record<string, unknown> {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) throw bad(field, 'expected an object');
  return value as Record<string, unknown>;
}

/** Exactly these keys: none missing, none unknown. */
function requireKeys(field: string, value: Record<string, unknown>, keys: readonly string[]): void {
  for (const key of Object.keys(value)) if (!keys.includes(key)) throw bad(`${field}.${key}`, 'unknown field');
  for (const key of keys) if (!(key in value)) throw bad(`${field}.${key}`, 'missing');
}

function requireIso(field: string, value: unknown): number {
  const ms = typeof value === 'string' ? parseIsoWithOffset(value) : null;
  if (ms === null) throw bad(field, 'expected an ISO 8601 date-time with offset, e.g. 2026-12-01T22:05:00+01:00');
  return ms;
}

function requireHex64(field: string, value: unknown): string {
  if (typeof value !== 'string' || !HEX64.test(value)) throw bad(field, 'expected 64 lower-case hex digits');
  return value;
}

function requireSeq(field: string, value: unknown): number {
  if (typeof value !== 'number' || !Number.isSafeInteger(value) || value < 1) throw bad(field, 'expected a whole number from 1 to 2^53 − 1');
  return value;
}

const VESSEL_KEYS = ['id', 'tag', 'tagKey', 'description', 'spec', 'retired', 'retiredAt', 'createdAt', 'updatedAt'] as const;
const CHECK_KEYS = [
  'id', 'deviceId', 'seq', 'time', 'timeMs', 'technician', 'note', 'vesselId', 'vessel', 'inputs', 'reading',
  'result', 'cautions', 'appVersion', 'formulationId', 'corrects', 'reason', 'prevHash', 'hash',
] as const;
const CHAIN_KEYS = ['deviceId', 'count', 'headSeq', 'headHash'] as const;
const TOP_KEYS = ['format', 'formatVersion', 'exportedAt', 'vessels', 'checks', 'chains'] as const;

/** One vessel record as BACKUP-FORMAT.md defines it. @throws StoreError('invalid-backup') naming the first bad field */
export function validateVessel(field: string, value: unknown): VesselRecord {
  const v = requireObject(field, value);
  requireKeys(field, v, VESSEL_KEYS);
  within(() => {
    requireUuid(`${field}.id`, v['id']);
    requireText(`${field}.tag`, v['tag'], 1, TAG_MAX);
    requireText(`${field}.description`, v['description'], 0, DESCRIPTION_MAX);
    requireJsonObject(`${field}.spec`, v['spec']);
  });
  const tag = v['tag'] as string;
  if (tag.trim() !== tag) throw bad(`${field}.tag`, 'has spaces at the start or end');
  if (v['tagKey'] !== tagKeyOf(tag)) throw bad(`${field}.tagKey`, 'does not match the tag');
  if (typeof v['retired'] !== 'boolean') throw bad(`${field}.retired`, 'expected true or false');
  if (v['retired']) requireIso(`${field}.retiredAt`, v['retiredAt']);
  else if (v['retiredAt'] !== null) throw bad(`${field}.retiredAt`, 'expected null for a vessel in service');
  requireIso(`${field}.createdAt`, v['createdAt']);
  requireIso(`${field}.updatedAt`, v['updatedAt']);
  return v as unknown as VesselRecord;
}

/** One check record as BACKUP-FORMAT.md defines it. @throws StoreError('invalid-backup') naming the first bad field */
export function validateCheck(field: string, value: unknown): CheckRecord {
  const c = requireObject(field, value);
  requireKeys(field, c, CHECK_KEYS);
  within(() => {
    requireUuid(`${field}.id`, c['id']);
    requireUuid(`${field}.deviceId`, c['deviceId']);
    requireUuid(`${field}.vesselId`, c['vesselId']);
    requireText(`${field}.technician`, c['technician'], 1, TEXT_LIMITS.technician);
    requireText(`${field}.note`, c['note'], 0, TEXT_LIMITS.note);
    requireInputs(`${field}.inputs`, c['inputs']);
    requireJsonObject(`${field}.reading`, c['reading']);
    requireJson(`${field}.result`, c['result']);
    requireCautions(`${field}.cautions`, c['cautions']);
    requireText(`${field}.appVersion`, c['appVersion'], 1, TEXT_LIMITS.version);
    requireText(`${field}.formulationId`, c['formulationId'], 1, TEXT_LIMITS.version);
  });
  requireSeq(`${field}.seq`, c['seq']);
  const ms = requireIso(`${field}.time`, c['time']);
  if (c['timeMs'] !== ms) throw bad(`${field}.timeMs`, 'does not match time');
  const vessel = requireObject(`${field}.vessel`, c['vessel']);
  requireKeys(`${field}.vessel`, vessel, ['tag', 'spec']);
  within(() => {
    requireText(`${field}.vessel.tag`, vessel['tag'], 1, TAG_MAX);
    requireJsonObject(`${field}.vessel.spec`, vessel['spec']);
  });
  if (c['corrects'] === null) {
    if (c['reason'] !== null) throw bad(`${field}.reason`, 'expected null when corrects is null');
  } else {
    within(() => {
      requireUuid(`${field}.corrects`, c['corrects']);
      requireText(`${field}.reason`, c['reason'], 1, TEXT_LIMITS.reason);
    });
  }
  requireHex64(`${field}.prevHash`, c['prevHash']);
  requireHex64(`${field}.hash`, c['hash']);
  return c as unknown as CheckRecord;
}

function requireList(field: string, value: unknown, max: number): unknown[] {
  if (!Array.isArray(value)) throw bad(field, 'expected a list');
  if (value.length > max) throw bad(field, `${value.length} entries; at most ${max}`);
  return value;
}

/**
 * Parses and validates a backup without touching the store. Refuses (whole file): more than
 * BACKUP_LIMITS, text that is not JSON, any `__proto__` / `constructor` / `prototype` key, another
 * format or formatVersion, unknown or missing fields, wrong types or ranges, duplicate ids.
 * @throws StoreError('invalid-backup') naming the first bad field
 */
export function parseBackup(text: string, limits: Readonly<BackupLimits> = BACKUP_LIMITS): BackupDocument {
  const steps = parsingSteps(text, limits);
  for (;;) {
    const step = steps.next();
    if (step.done) return step.value;
  }
}

/**
 * As parseBackup, giving the page a turn (integrity.ts `breathe`) between groups of records while
 * it validates them, and stopping on a cancel. The parse of the text itself is one step.
 * @throws StoreError('invalid-backup') as parseBackup; ('cancelled') if `signal` aborts
 */
export async function parseBackupInSteps(
  text: string,
  options: { signal?: AbortSignal | undefined; limits?: Readonly<BackupLimits> } = {},
): Promise<BackupDocument> {
  const steps = parsingSteps(text, options.limits ?? BACKUP_LIMITS);
  for (;;) {
    const step = steps.next();
    if (step.done) return step.value;
    await breathe();
    throwIfAborted(options.signal);
  }
}

/** Records validated between the pauses of parsingSteps. */
const VALIDATE_GROUP = 2000;

/** parseBackup's work, pausing (yielding) after the parse and every VALIDATE_GROUP records. */
function* parsingSteps(text: string, limits: Readonly<BackupLimits>): Generator<void, BackupDocument, undefined> {
  if (typeof text !== 'string') throw bad('file', 'expected text');
  if (text.length > limits.maxChars) throw bad('file', `${text.length} characters; at most ${limits.maxChars}`);
  let raw: unknown;
  try {
    // JSON.parse makes "__proto__" an own property (no prototype change), but a consumer that
    // later copies records with Object.assign or a spread could still be steered; refuse them all.
    // A key can spell a forbidden name only literally or through a \u escape (the names are
    // letters and underscores): text with neither cannot hold one, and skips the reviver, which
    // makes parsing several times slower.
    raw = mayHoldForbiddenKey(text)
      ? JSON.parse(text, (key, value: unknown) => {
          if (FORBIDDEN_KEYS.has(key)) throw new ForbiddenKey(key);
          return value;
        })
      : JSON.parse(text);
  } catch (error) {
    if (error instanceof ForbiddenKey) throw bad('file', `the key "${error.key}" is not allowed anywhere in a backup`);
    // Includes nesting too deep for the parser (a RangeError from the engine).
    throw bad('file', 'not valid JSON');
  }
  yield;
  const top = requireObject('file', raw);
  if (top['format'] !== BACKUP_FORMAT) throw bad('format', `expected "${BACKUP_FORMAT}"`);
  if (typeof top['formatVersion'] === 'number' && top['formatVersion'] > BACKUP_FORMAT_VERSION) {
    throw bad('formatVersion', `${top['formatVersion']} was written by a newer Tankside; update the app, then import`);
  }
  if (top['formatVersion'] !== BACKUP_FORMAT_VERSION) throw bad('formatVersion', `expected ${BACKUP_FORMAT_VERSION}`);
  requireKeys('file', top, TOP_KEYS);
  requireIso('exportedAt', top['exportedAt']);
  const vessels = requireList('vessels', top['vessels'], limits.maxVessels).map((v, i) => validateVessel(`vessels[${i}]`, v));
  const listed = requireList('checks', top['checks'], limits.maxChecks);
  const checks: CheckRecord[] = [];
  for (let i = 0; i < listed.length; i += 1) {
    if (i % VALIDATE_GROUP === 0) yield;
    checks.push(validateCheck(`checks[${i}]`, listed[i]));
  }
  const chains = requireList('chains', top['chains'], limits.maxChecks).map((h, i) => {
    const head = requireObject(`chains[${i}]`, h);
    requireKeys(`chains[${i}]`, head, CHAIN_KEYS);
    within(() => requireUuid(`chains[${i}].deviceId`, head['deviceId']));
    requireSeq(`chains[${i}].count`, head['count']);
    requireSeq(`chains[${i}].headSeq`, head['headSeq']);
    requireHex64(`chains[${i}].headHash`, head['headHash']);
    return head as unknown as ChainHead;
  });
  requireUnique('vessels', vessels.map((v) => v.id));
  requireUnique('checks', checks.map((c) => c.id));
  requireUnique('chains', chains.map((h) => h.deviceId));
  return {
    format: BACKUP_FORMAT,
    formatVersion: BACKUP_FORMAT_VERSION,
    exportedAt: top['exportedAt'] as string,
    vessels,
    checks,
    chains,
  };
}

/** False only when no key in `text` can be one of FORBIDDEN_KEYS once parsed. */
export function mayHoldForbiddenKey(text: string): boolean {
  if (text.includes('\\u')) return true;
  for (const name of FORBIDDEN_KEYS) if (text.includes(name)) return true;
  return false;
}

class ForbiddenKey extends Error {
  constructor(readonly key: string) {
    super(key);
  }
}

function requireUnique(field: string, ids: string[]): void {
  const seen = new Set<string>();
  ids.forEach((id, i) => {
    if (seen.has(id)) throw bad(`${field}[${i}]`, `id ${id} appears twice in the file`);
    seen.add(id);
  });
}

// ---------------------------------------------------------------- merge

interface MergePlan {
  vesselWrites: VesselRecord[];
  checkAdds: NewLogEntry[];
  report: ImportReport;
}

function byInstant(a: string, b: string): number {
  return (parseIsoWithOffset(a) ?? 0) - (parseIsoWithOffset(b) ?? 0);
}

/** Stored records of one device by seq, each parsed only when asked for. */
class StoredSeqs {
  private readonly texts = new Map<number, string>();
  private readonly parsed = new Map<number, CheckRecord>();
  constructor(blocks: readonly LogBlock[]) {
    for (const b of blocks) b.seqs.forEach((seq, i) => this.texts.set(seq, b.texts[i]!));
  }
  get(seq: number): CheckRecord | undefined {
    let r = this.parsed.get(seq);
    if (r) return r;
    const text = this.texts.get(seq);
    if (text === undefined) return undefined;
    this.parsed.set(seq, (r = JSON.parse(text) as CheckRecord));
    return r;
  }
}

/** Reads what the store holds for the file's records (one read-only transaction), then decides. */
async function planMerge(db: IDBPDatabase<TanksideDB>, doc: BackupDocument, texts: string[], hashes: string[]): Promise<MergePlan> {
  const tx = db.transaction(['vessels', ...LOG_STORES] as const);
  const vesselStore = tx.objectStore('vessels');
  const devices = new Map<string, number[]>(); // deviceId -> indexes into doc.checks
  doc.checks.forEach((c, i) => {
    let list = devices.get(c.deviceId);
    if (!list) devices.set(c.deviceId, (list = []));
    list.push(i);
  });
  const deviceIds = [...devices.keys()].sort();
  // One read snapshot with nothing but IndexedDB requests awaited inside it.
  const [existingVessels, existingById, existingRanges] = await Promise.all([
    Promise.all(doc.vessels.map((v) => vesselStore.get(v.id))),
    (async () => {
      const places = await locateIds(tx, doc.checks.map((c) => c.id));
      const hits = doc.checks.filter((c) => places.get(c.id)?.at !== undefined);
      const found = await readRecords(tx, hits.map((c) => {
        const at = places.get(c.id)!.at!;
        return { deviceId: at[0], seq: at[1] };
      }));
      const records = new Map(hits.map((c, i) => [c.id, found[i]] as const));
      return doc.checks.map((c) => records.get(c.id));
    })(),
    Promise.all(
      deviceIds.map(async (d) => {
        let lo = Infinity;
        let hi = 0;
        for (const i of devices.get(d)!) {
          lo = Math.min(lo, doc.checks[i]!.seq);
          hi = Math.max(hi, doc.checks[i]!.seq);
        }
        return new StoredSeqs(await deviceBlocks(tx, d, Math.max(1, lo - 1), hi));
      }),
    ),
    tx.done,
  ]);

  const report: ImportReport = {
    vessels: { added: [], updated: [], skipped: [] },
    checks: { added: [], skipped: [], rejected: [] },
    fileChains: [],
    warnings: [],
  };
  const vesselWrites: VesselRecord[] = [];
  doc.vessels.forEach((v, i) => {
    const here = existingVessels[i];
    if (!here) {
      vesselWrites.push(v);
      report.vessels.added.push(v.id);
    } else if (canonicalJson(here) === canonicalJson(v)) {
      report.vessels.skipped.push({ id: v.id, why: 'already here, identical' });
    } else if (byInstant(v.updatedAt, here.updatedAt) > 0) {
      vesselWrites.push(v);
      report.vessels.updated.push(v.id);
    } else {
      report.vessels.skipped.push({ id: v.id, why: 'the vessel here was edited at the same time or later; kept it' });
    }
  });

  const checkAdds: NewLogEntry[] = [];
  const verifier = new ChainVerifier();
  deviceIds.forEach((d, deviceIndex) => {
    const order = devices.get(d)!.slice().sort((a, b) => doc.checks[a]!.seq - doc.checks[b]!.seq || a - b);
    const here = existingRanges[deviceIndex]!;
    const fileBySeq = new Map<number, CheckRecord>();
    for (const i of order) {
      const r = doc.checks[i]!;
      if (!fileBySeq.has(r.seq)) fileBySeq.set(r.seq, r);
    }
    const taken = new Set<number>();
    for (const i of order) {
      const r = doc.checks[i]!;
      verifier.pushHashed(r, hashes[i]!);
      const reject = (why: string) => report.checks.rejected.push({ id: r.id, why });
      const same = existingById[i];
      if (same) {
        if (canonicalJson(same) === texts[i]) report.checks.skipped.push({ id: r.id, why: 'already here, identical' });
        else reject('a different check with this id is already here');
        continue;
      }
      if (hashes[i] !== r.hash) {
        reject(`seq ${r.seq}: content does not match its hash (changed after it was saved)`);
        continue;
      }
      const occupant = here.get(r.seq);
      if (occupant || taken.has(r.seq)) {
        reject(`seq ${r.seq} of device ${d} is already taken by check ${occupant ? occupant.id : 'earlier in this file'}`);
        continue;
      }
      const prev = r.seq === 1 ? GENESIS_HASH : (here.get(r.seq - 1) ?? fileBySeq.get(r.seq - 1))?.hash;
      if (prev !== undefined && prev !== r.prevHash) {
        reject(`seq ${r.seq}: prevHash is not the hash of seq ${r.seq - 1} (a record was changed or swapped)`);
        continue;
      }
      if (prev === undefined) report.warnings.push(`Device ${d}: seq ${r.seq - 1} is missing, so seq ${r.seq} could not be linked.`);
      taken.add(r.seq);
      checkAdds.push({ record: r, text: texts[i]! });
      report.checks.added.push(r.id);
    }
  });
  report.fileChains = verifier.results();
  for (const head of doc.chains) {
    let lastInFile = 0;
    for (const i of devices.get(head.deviceId) ?? []) lastInFile = Math.max(lastInFile, doc.checks[i]!.seq);
    if (lastInFile < head.headSeq) {
      report.warnings.push(
        `Device ${head.deviceId}: the file was exported up to seq ${head.headSeq} but holds records only up to seq ${lastInFile}.`,
      );
    }
  }
  return { vesselWrites, checkAdds, report };
}

/** Writes the plan in one strict transaction: all of it, or (on any failure or a cancel) none. */
async function writePlan(db: IDBPDatabase<TanksideDB>, plan: MergePlan, options: LongWorkOptions, base: number, total: number): Promise<void> {
  const tx = db.transaction(['vessels', ...LOG_STORES] as const, 'readwrite', STRICT);
  let cancelled = false;
  const onAbort = () => {
    try {
      tx.abort();
      cancelled = true;
    } catch {
      // Already committed: the import finished before the cancel arrived.
    }
  };
  options.signal?.addEventListener('abort', onAbort);
  const work = async () => {
    const vessels = tx.objectStore('vessels');
    let done = base;
    const step = (n: number) => {
      done += n;
      // The last step is the commit: a full bar would say "done" while a cancel could still undo it all.
      if (!cancelled) options.onProgress?.(Math.min(done, total - 1), total);
    };
    await Promise.all([
      ...plan.vesselWrites.map((v) => vessels.put(v).then(() => step(1))),
      addToLog(tx, plan.checkAdds, step),
    ]);
  };
  try {
    await settle(tx, work());
  } catch (error) {
    if (cancelled || options.signal?.aborted) throw new StoreError('cancelled', 'Import cancelled; nothing was changed.');
    if ((error as { name?: unknown }).name === 'ConstraintError') throw error;
    throw storeErrorFromWrite(error, 'Importing the backup');
  } finally {
    options.signal?.removeEventListener('abort', onAbort);
  }
}

/**
 * Validates a backup completely, then merges it into the store in one strict transaction: all of
 * it lands or none of it does. Returns what was added, skipped and rejected, and why.
 * Progress counts hashing the file's checks, then writing.
 * @throws StoreError('invalid-backup') naming the first bad field, with nothing written;
 *   ('cancelled' | 'quota-exceeded' | 'write-failed') with nothing written
 */
export async function importBackup(text: string, options: LongWorkOptions = {}): Promise<ImportReport> {
  const doc = await parseBackupInSteps(text, { signal: options.signal });
  throwIfAborted(options.signal);
  const db = await getDb();
  await sealMigratedChecks(db);
  const total = doc.checks.length * 2 + doc.vessels.length;
  // Each record's canonical text is what the store keeps; its content (the text without the
  // hash) is what the hash covers. Hashed before any transaction opens (a transaction would
  // commit while the hashing gives the page its turns).
  const texts = new Array<string>(doc.checks.length);
  const every = progressStep(total);
  let reported = 0;
  const hashes = await hashTexts(texts.length, (i) => contentOfText((texts[i] = canonicalJson(doc.checks[i]!))), {
    signal: options.signal,
    onProgress: (done) => {
      if (done - reported < every) return;
      reported = done;
      options.onProgress?.(done, total);
    },
  });
  const report = await mergeRecords(doc, texts, hashes, { ...options, progressBase: doc.checks.length, progressTotal: total });
  options.onProgress?.(total, total);
  return report;
}

/**
 * The merge of importBackup for a validated document whose checks' canonical texts and content
 * hashes are given (index for index): plans against the store's current state, then writes in
 * one strict transaction, planning again if another tab took a seq meanwhile. Also the merge of
 * records pulled from the plant server (sync-log.ts), so both apply the same checks.
 * @throws StoreError('cancelled' | 'quota-exceeded' | 'write-failed') with nothing written
 */
export async function mergeRecords(
  doc: BackupDocument,
  texts: string[],
  hashes: string[],
  options: LongWorkOptions & { progressBase?: number; progressTotal?: number } = {},
): Promise<ImportReport> {
  const db = await getDb();
  const base = options.progressBase ?? 0;
  const total = options.progressTotal ?? doc.checks.length + doc.vessels.length;
  for (let attempt = 0; ; attempt += 1) {
    throwIfAborted(options.signal);
    const plan = await planMerge(db, doc, texts, hashes);
    throwIfAborted(options.signal);
    try {
      // Done so far: what came before, plus every record the plan does not write.
      const skipped = doc.vessels.length - plan.vesselWrites.length + doc.checks.length - plan.checkAdds.length;
      await writePlan(db, plan, options, base + skipped, total);
      return plan.report;
    } catch (error) {
      // Another tab saved a check with a seq the plan gave out: plan again from the new state.
      if ((error as { name?: unknown }).name === 'ConstraintError' && attempt < 2) continue;
      throw error instanceof StoreError ? error : storeErrorFromWrite(error, 'Importing the backup');
    }
  }
}
