// The "tankside-backup" file as a reader takes it (BACKUP-FORMAT.md is the reference): its shapes,
// its limits, and validation that refuses the whole file at the first field that breaks a rule.
// Reads format versions 1 to 4; writes (backup.ts) BACKUP_FORMAT_VERSION.
import { StoreError } from './errors.ts';
import { requireCautions, requireInputs, TEXT_LIMITS } from './checks.ts';
import { breathe, throwIfAborted } from './integrity.ts';
import type { CheckRecord, IsoDateTime, JsonObject, KindRecord, LogRecord, PublicJwk, VesselRecord } from './records.ts';
import { isKnownKind, RECORD_KINDS } from './record-kinds.ts';
import { parseIsoWithOffset } from './time.ts';
import { FORBIDDEN_KEYS, HEX64, requireJson, requireJsonObject, requireText, requireUuid } from './validate.ts';
import { DESCRIPTION_MAX, requireCheckInterval, TAG_MAX, tagKeyOf } from './vessels.ts';
import { EMPTY_REGISTER, type BackupRegister } from './backup-register.ts';
import { INSTRUMENT_KIND_IDS, INSTRUMENT_ROLES, INSTRUMENT_TEXT_LIMITS, type CalibrationEntry, type FittingRecord, type InstrumentRecord } from './instrument-records.ts';

export const BACKUP_FORMAT = 'tankside-backup';
/**
 * The version this app writes; it reads this one and every one before it. 3: the instrument
 * register; 4: a fitting's role may be `atmosphere` (the barometer's place), which a version-3
 * reader refuses, so such a reader now says the file is newer instead (renumbered at merge if
 * another room took 4 first).
 */
export const BACKUP_FORMAT_VERSION = 4;
/** The first version with the instrument register's lists. */
export const REGISTER_FORMAT_VERSION = 3;
/** Refused before parsing: a file longer than maxChars (UTF-16 code units), or holding more records. */
export interface BackupLimits {
  maxChars: number;
  maxVessels: number;
  maxChecks: number;
}
export const BACKUP_LIMITS: Readonly<BackupLimits> = { maxChars: 300_000_000, maxVessels: 100_000, maxChecks: 1_000_000 };

/** Where each device's chain ended when the backup was made, and (v2) the device's public key. */
export interface ChainHead {
  deviceId: string;
  count: number;
  headSeq: number;
  headHash: string;
  /** The device's signing key (v2); null for a device that never signed, and in every v1 file. */
  publicKey: PublicJwk | null;
}

/** The signature of one record's chain head (v2). */
export interface FileSignature {
  deviceId: string;
  seq: number;
  signature: string;
}

/** A record of a kind this version does not keep (v2 on): its chain fields, and the record as read. */
export interface OtherRecord {
  kind: string;
  id: string;
  deviceId: string;
  seq: number;
  prevHash: string;
  hash: string;
  record: JsonObject;
}

/** A parsed, validated backup. */
export interface BackupDocument {
  format: typeof BACKUP_FORMAT;
  /** The version the file was written as (1 to BACKUP_FORMAT_VERSION). */
  formatVersion: number;
  exportedAt: IsoDateTime;
  vessels: VesselRecord[];
  /** The checks, and the records of kinds this version keeps (record-kinds.ts), in file order. */
  checks: LogRecord[];
  /** Records of kinds this version does not keep, found among `checks` (v2 on), kept out of it. */
  others: OtherRecord[];
  chains: ChainHead[];
  signatures: FileSignature[];
  /** The instrument register (from REGISTER_FORMAT_VERSION on); absent or empty before it, and in a plant sync's pull. */
  register?: BackupRegister;
}

export function bad(field: string, problem: string): StoreError {
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
function requireKeys(field: string, value: Record<string, unknown>, keys: readonly string[], optional: readonly string[] = []): void {
  for (const key of Object.keys(value)) if (!keys.includes(key) && !optional.includes(key)) throw bad(`${field}.${key}`, 'unknown field');
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
const CHAIN_KEYS_V1 = ['deviceId', 'count', 'headSeq', 'headHash'] as const;
const CHAIN_KEYS = [...CHAIN_KEYS_V1, 'publicKey'] as const;
const TOP_KEYS_V1 = ['format', 'formatVersion', 'exportedAt', 'vessels', 'checks', 'chains'] as const;
const TOP_KEYS = [...TOP_KEYS_V1, 'signatures'] as const;
const TOP_KEYS_REGISTER = [...TOP_KEYS, 'instruments', 'calibrations', 'fittings'] as const;
const SIGNATURE_KEYS = ['deviceId', 'seq', 'signature'] as const;
const JWK_KEYS = ['crv', 'kty', 'x', 'y'] as const;
/** Chain fields a record of another kind must carry, and may carry beside anything else. */
const LINK_KEYS = ['id', 'deviceId', 'seq', 'prevHash', 'hash', 'kind'] as const;
/** Base64url of 32 bytes (a P-256 coordinate) and of 64 bytes (a signature, r ‖ s). */
const B64URL_32 = /^[A-Za-z0-9_-]{43}$/;
const B64URL_64 = /^[A-Za-z0-9_-]{86}$/;

/** One vessel record as BACKUP-FORMAT.md defines it. @throws StoreError('invalid-backup') naming the first bad field */
export function validateVessel(field: string, value: unknown): VesselRecord {
  const v = requireObject(field, value);
  // Since issue 14 a vessel may carry its check interval; one without it has none.
  requireKeys(field, v, VESSEL_KEYS, ['checkIntervalS']);
  within(() => {
    requireUuid(`${field}.id`, v['id']);
    requireText(`${field}.tag`, v['tag'], 1, TAG_MAX);
    requireText(`${field}.description`, v['description'], 0, DESCRIPTION_MAX);
    requireJsonObject(`${field}.spec`, v['spec']);
    if ('checkIntervalS' in v) requireCheckInterval(`${field}.checkIntervalS`, v['checkIntervalS']);
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

const INSTRUMENT_KEYS = ['id', 'tag', 'tagKey', 'spec', 'displayUnit', 'description', 'origin', 'retired', 'createdAt', 'updatedAt'] as const;
const CALIBRATION_KEYS = [
  'id', 'instrumentId', 'time', 'timeMs', 'asFoundError', 'asLeftError', 'referenceValue', 'nextDue', 'nextDueMs', 'who', 'certificate', 'enteredUnit', 'note', 'enteredAt',
] as const;
const FITTING_KEYS = ['id', 'vesselId', 'role', 'instrumentId', 'from', 'fromMs', 'reason', 'enteredAt'] as const;

function finiteOrNull(field: string, value: unknown): void {
  if (value !== null && (typeof value !== 'number' || !Number.isFinite(value))) throw bad(field, 'expected a finite number or null');
}

/** One instrument record. @throws StoreError('invalid-backup') naming the first bad field */
export function validateInstrumentRecord(field: string, value: unknown): InstrumentRecord {
  const v = requireObject(field, value);
  requireKeys(field, v, INSTRUMENT_KEYS);
  within(() => {
    requireUuid(`${field}.id`, v['id']);
    requireText(`${field}.tag`, v['tag'], 1, INSTRUMENT_TEXT_LIMITS.tag);
    requireJsonObject(`${field}.spec`, v['spec']);
    requireText(`${field}.displayUnit`, v['displayUnit'], 1, INSTRUMENT_TEXT_LIMITS.displayUnit);
    requireText(`${field}.description`, v['description'], 0, INSTRUMENT_TEXT_LIMITS.description);
    requireJsonObject(`${field}.origin`, v['origin']);
  });
  const tag = v['tag'] as string;
  if (tag.trim() !== tag) throw bad(`${field}.tag`, 'has spaces at the start or end');
  if (v['tagKey'] !== tag.toLowerCase()) throw bad(`${field}.tagKey`, 'does not match the tag');
  const spec = v['spec'] as Record<string, unknown>;
  if (spec['tag'] !== tag) throw bad(`${field}.spec.tag`, 'does not match the tag');
  if (!(INSTRUMENT_KIND_IDS as readonly unknown[]).includes(spec['kind'])) throw bad(`${field}.spec.kind`, `expected one of ${INSTRUMENT_KIND_IDS.join(', ')}`);
  const origin = v['origin'] as Record<string, unknown>;
  if (origin['kind'] !== 'entered' && origin['kind'] !== 'from-vessel') throw bad(`${field}.origin.kind`, 'expected "entered" or "from-vessel"');
  if (typeof v['retired'] !== 'boolean') throw bad(`${field}.retired`, 'expected true or false');
  requireIso(`${field}.createdAt`, v['createdAt']);
  requireIso(`${field}.updatedAt`, v['updatedAt']);
  return v as unknown as InstrumentRecord;
}

/** One calibration record. @throws StoreError('invalid-backup') naming the first bad field */
export function validateCalibrationRecord(field: string, value: unknown): CalibrationEntry {
  const c = requireObject(field, value);
  requireKeys(field, c, CALIBRATION_KEYS);
  within(() => {
    requireUuid(`${field}.id`, c['id']);
    requireUuid(`${field}.instrumentId`, c['instrumentId']);
    requireText(`${field}.who`, c['who'], 1, INSTRUMENT_TEXT_LIMITS.who);
    requireText(`${field}.certificate`, c['certificate'], 0, INSTRUMENT_TEXT_LIMITS.certificate);
    requireText(`${field}.enteredUnit`, c['enteredUnit'], 1, INSTRUMENT_TEXT_LIMITS.displayUnit);
    requireText(`${field}.note`, c['note'], 0, INSTRUMENT_TEXT_LIMITS.note);
  });
  if (c['timeMs'] !== requireIso(`${field}.time`, c['time'])) throw bad(`${field}.timeMs`, 'does not match time');
  if (typeof c['asFoundError'] !== 'number' || !Number.isFinite(c['asFoundError'])) throw bad(`${field}.asFoundError`, 'expected a finite number');
  finiteOrNull(`${field}.asLeftError`, c['asLeftError']);
  finiteOrNull(`${field}.referenceValue`, c['referenceValue']);
  if (c['nextDue'] === null) {
    if (c['nextDueMs'] !== null) throw bad(`${field}.nextDueMs`, 'expected null when nextDue is null');
  } else if (c['nextDueMs'] !== requireIso(`${field}.nextDue`, c['nextDue'])) throw bad(`${field}.nextDueMs`, 'does not match nextDue');
  requireIso(`${field}.enteredAt`, c['enteredAt']);
  return c as unknown as CalibrationEntry;
}

/** One fitting record. @throws StoreError('invalid-backup') naming the first bad field */
export function validateFittingRecord(field: string, value: unknown): FittingRecord {
  const f = requireObject(field, value);
  requireKeys(field, f, FITTING_KEYS);
  within(() => {
    requireUuid(`${field}.id`, f['id']);
    requireUuid(`${field}.vesselId`, f['vesselId']);
    if (f['instrumentId'] !== null) requireUuid(`${field}.instrumentId`, f['instrumentId']);
    requireText(`${field}.reason`, f['reason'], 0, INSTRUMENT_TEXT_LIMITS.reason);
  });
  if (!(INSTRUMENT_ROLES as readonly unknown[]).includes(f['role'])) throw bad(`${field}.role`, `expected one of ${INSTRUMENT_ROLES.join(', ')}`);
  if (f['fromMs'] !== requireIso(`${field}.from`, f['from'])) throw bad(`${field}.fromMs`, 'does not match from');
  requireIso(`${field}.enteredAt`, f['enteredAt']);
  return f as unknown as FittingRecord;
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

const KIND_KEYS = [
  'kind', 'id', 'deviceId', 'seq', 'time', 'timeMs', 'technician', 'note', 'vesselId', 'vessel', 'values',
  'cautions', 'appVersion', 'formulationId', 'prevHash', 'hash',
] as const;

/**
 * One record of a kind this version keeps (record-kinds.ts), as records.ts KindRecord defines it:
 * the envelope checked field by field, `values` as plain JSON.
 * @throws StoreError('invalid-backup') naming the first bad field
 */
export function validateKindRecord(field: string, value: unknown): KindRecord {
  const r = requireObject(field, value);
  if (!isKnownKind(r['kind'])) throw bad(`${field}.kind`, `expected one of ${RECORD_KINDS.join(', ')}`);
  requireKeys(field, r, KIND_KEYS);
  within(() => {
    requireUuid(`${field}.id`, r['id']);
    requireUuid(`${field}.deviceId`, r['deviceId']);
    requireText(`${field}.technician`, r['technician'], 1, TEXT_LIMITS.technician);
    requireText(`${field}.note`, r['note'], 0, TEXT_LIMITS.note);
    requireJsonObject(`${field}.values`, r['values']);
    requireCautions(`${field}.cautions`, r['cautions']);
    requireText(`${field}.appVersion`, r['appVersion'], 1, TEXT_LIMITS.version);
    requireText(`${field}.formulationId`, r['formulationId'], 1, TEXT_LIMITS.version);
  });
  requireSeq(`${field}.seq`, r['seq']);
  const ms = requireIso(`${field}.time`, r['time']);
  if (r['timeMs'] !== ms) throw bad(`${field}.timeMs`, 'does not match time');
  if (r['vesselId'] === null) {
    if (r['vessel'] !== null) throw bad(`${field}.vessel`, 'expected null when vesselId is null');
  } else {
    within(() => requireUuid(`${field}.vesselId`, r['vesselId']));
    const vessel = requireObject(`${field}.vessel`, r['vessel']);
    requireKeys(`${field}.vessel`, vessel, ['tag']);
    within(() => requireText(`${field}.vessel.tag`, vessel['tag'], 1, TAG_MAX));
  }
  requireHex64(`${field}.prevHash`, r['prevHash']);
  requireHex64(`${field}.hash`, r['hash']);
  return r as unknown as KindRecord;
}

/** A record of a kind this version does not keep (v2 on): its chain fields checked, the rest only as plain JSON. */
function validateOther(field: string, value: Record<string, unknown>): OtherRecord {
  for (const key of LINK_KEYS) if (!(key in value)) throw bad(`${field}.${key}`, 'missing');
  within(() => {
    requireText(`${field}.kind`, value['kind'], 1, 64);
    requireUuid(`${field}.id`, value['id']);
    requireUuid(`${field}.deviceId`, value['deviceId']);
    requireJson(field, value);
  });
  if (value['kind'] === 'check') throw bad(`${field}.kind`, 'a check carries no kind member');
  requireSeq(`${field}.seq`, value['seq']);
  requireHex64(`${field}.prevHash`, value['prevHash']);
  requireHex64(`${field}.hash`, value['hash']);
  return {
    kind: value['kind'] as string,
    id: value['id'] as string,
    deviceId: value['deviceId'] as string,
    seq: value['seq'] as number,
    prevHash: value['prevHash'] as string,
    hash: value['hash'] as string,
    record: value as JsonObject,
  };
}

/** A public JWK as the backup (and the plant server's device-key record) carries it; null stays null. @throws StoreError('invalid-backup') naming the field */
export function validatePublicKey(field: string, value: unknown): PublicJwk | null {
  if (value === null) return null;
  const k = requireObject(field, value);
  requireKeys(field, k, JWK_KEYS);
  if (k['kty'] !== 'EC') throw bad(`${field}.kty`, 'expected "EC"');
  if (k['crv'] !== 'P-256') throw bad(`${field}.crv`, 'expected "P-256"');
  for (const c of ['x', 'y'] as const) {
    if (typeof k[c] !== 'string' || !B64URL_32.test(k[c])) throw bad(`${field}.${c}`, 'expected 43 base64url characters (32 bytes)');
  }
  return { crv: 'P-256', kty: 'EC', x: k['x'] as string, y: k['y'] as string };
}

function validateSignature(field: string, value: unknown): FileSignature {
  const s = requireObject(field, value);
  requireKeys(field, s, SIGNATURE_KEYS);
  within(() => requireUuid(`${field}.deviceId`, s['deviceId']));
  requireSeq(`${field}.seq`, s['seq']);
  if (typeof s['signature'] !== 'string' || !B64URL_64.test(s['signature'])) {
    throw bad(`${field}.signature`, 'expected 86 base64url characters (64 bytes)');
  }
  return { deviceId: s['deviceId'] as string, seq: s['seq'] as number, signature: s['signature'] as string };
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
  const version = top['formatVersion'];
  if (typeof version !== 'number' || !Number.isInteger(version) || version < 1) throw bad('formatVersion', `expected a whole number from 1 to ${BACKUP_FORMAT_VERSION}`);
  requireKeys('file', top, version === 1 ? TOP_KEYS_V1 : version < REGISTER_FORMAT_VERSION ? TOP_KEYS : TOP_KEYS_REGISTER);
  requireIso('exportedAt', top['exportedAt']);
  const vessels = requireList('vessels', top['vessels'], limits.maxVessels).map((v, i) => validateVessel(`vessels[${i}]`, v));
  const listed = requireList('checks', top['checks'], limits.maxChecks);
  const checks: LogRecord[] = [];
  const others: OtherRecord[] = [];
  for (let i = 0; i < listed.length; i += 1) {
    if (i % VALIDATE_GROUP === 0) yield;
    const item = listed[i];
    // From v2 a record may name its kind; one without is a check, one of another kind is kept aside.
    if (version >= 2 && typeof item === 'object' && item !== null && !Array.isArray(item) && 'kind' in item) {
      // A kind this version keeps is held to its shape and kept; any other is checked for its links only.
      if (isKnownKind((item as Record<string, unknown>)['kind'])) checks.push(validateKindRecord(`checks[${i}]`, item));
      else others.push(validateOther(`checks[${i}]`, item as Record<string, unknown>));
    } else {
      checks.push(validateCheck(`checks[${i}]`, item));
    }
  }
  const chains = requireList('chains', top['chains'], limits.maxChecks).map((h, i): ChainHead => {
    const head = requireObject(`chains[${i}]`, h);
    requireKeys(`chains[${i}]`, head, version === 1 ? CHAIN_KEYS_V1 : CHAIN_KEYS);
    within(() => requireUuid(`chains[${i}].deviceId`, head['deviceId']));
    requireSeq(`chains[${i}].count`, head['count']);
    requireSeq(`chains[${i}].headSeq`, head['headSeq']);
    requireHex64(`chains[${i}].headHash`, head['headHash']);
    const publicKey = version === 1 ? null : validatePublicKey(`chains[${i}].publicKey`, head['publicKey']);
    return { deviceId: head['deviceId'] as string, count: head['count'] as number, headSeq: head['headSeq'] as number, headHash: head['headHash'] as string, publicKey };
  });
  const signatures: FileSignature[] = [];
  if (version >= 2) {
    const signed = requireList('signatures', top['signatures'], limits.maxChecks);
    for (let i = 0; i < signed.length; i += 1) {
      if (i % VALIDATE_GROUP === 0) yield;
      signatures.push(validateSignature(`signatures[${i}]`, signed[i]));
    }
  }
  const register: BackupRegister = version < REGISTER_FORMAT_VERSION ? EMPTY_REGISTER : {
    instruments: requireList('instruments', top['instruments'], limits.maxVessels).map((v, i) => validateInstrumentRecord(`instruments[${i}]`, v)),
    calibrations: requireList('calibrations', top['calibrations'], limits.maxChecks).map((v, i) => validateCalibrationRecord(`calibrations[${i}]`, v)),
    fittings: requireList('fittings', top['fittings'], limits.maxChecks).map((v, i) => validateFittingRecord(`fittings[${i}]`, v)),
  };
  requireUnique('instruments', register.instruments.map((r) => r.id));
  requireUnique('calibrations', register.calibrations.map((r) => r.id));
  requireUnique('fittings', register.fittings.map((r) => r.id));
  requireUnique('vessels', vessels.map((v) => v.id));
  requireUnique('checks', [...checks.map((c) => c.id), ...others.map((o) => o.id)]);
  requireUnique('chains', chains.map((h) => h.deviceId));
  requireUnique('signatures', signatures.map((s) => `${s.deviceId} seq ${s.seq}`));
  const keyed = new Set(chains.filter((h) => h.publicKey !== null).map((h) => h.deviceId));
  signatures.forEach((s, i) => {
    if (!keyed.has(s.deviceId)) throw bad(`signatures[${i}]`, `device ${s.deviceId} has no publicKey in chains`);
  });
  return { format: BACKUP_FORMAT, formatVersion: version, exportedAt: top['exportedAt'] as string, vessels, checks, others, chains, signatures, register };
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
    if (seen.has(id)) throw bad(`${field}[${i}]`, `${field === 'signatures' ? '' : 'id '}${id} appears twice in the file`);
    seen.add(id);
  });
}

