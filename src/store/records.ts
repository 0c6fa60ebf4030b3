// The shapes the store saves. Everything here is plain JSON (no Date, no undefined inside arrays,
// no class instances) so a record hashes, exports and imports without conversion. The check
// engine's types name what a vessel spec, a reading and a result hold (versioned: a result saved by
// an older release is a CheckResultV1), so the code that reads a stored one has its type at once;
// the store itself checks only that they are plain JSON.
import type { CheckResult, Reading, StoredCheckResult, VesselSpec } from '../core/index.ts';

/** Any JSON value. Numbers must be finite. */
export type JsonValue = null | boolean | number | string | JsonValue[] | { [key: string]: JsonValue };
/** A JSON object. */
export type JsonObject = { [key: string]: JsonValue };

/**
 * The check engine's VesselSpec (SI), stored exactly as the engine takes it; a spec saved before a
 * field was added simply lacks it (every later field is optional). The store never reads inside it.
 */
export type VesselSpecData = VesselSpec;

/** ISO 8601 date-time with an explicit UTC offset, e.g. "2026-12-01T22:05:00+01:00" (or "...Z"). */
export type IsoDateTime = string;

/** A vessel in the inventory. Mutable (edit, retire); checks keep their own snapshot of it. */
export interface VesselRecord {
  /** UUID. */
  id: string;
  /** The plant's tag for the vessel, as written on it (e.g. "FT-204"). 1 to 64 characters. */
  tag: string;
  /** `tag` lower-cased, for the case-insensitive prefix search (kept in step by the store). */
  tagKey: string;
  description: string;
  spec: VesselSpecData;
  /** A retired vessel is hidden from new checks but keeps its history. */
  retired: boolean;
  retiredAt: IsoDateTime | null;
  createdAt: IsoDateTime;
  updatedAt: IsoDateTime;
  /**
   * How often the plant wants the vessel checked, s (CHECK_INTERVAL_MIN_S to CHECK_INTERVAL_MAX_S of
   * the core's check-due.ts); null or absent (every vessel saved before issue 14): none set.
   */
  checkIntervalS?: number | null;
}

/**
 * What the UI passes to add a vessel. `spec` may be any object type (the engine's VesselSpec
 * interface included); the store checks at run time that it is plain JSON and keeps a copy.
 */
export interface NewVessel {
  tag: string;
  description?: string;
  spec: VesselSpec;
  /** The check interval, s; none when absent or null. */
  checkIntervalS?: number | null;
}

/** What the UI may change on a vessel (retire with retireVessel). */
export interface VesselPatch {
  tag?: string;
  description?: string;
  spec?: VesselSpec;
  /** The check interval, s; null clears it. */
  checkIntervalS?: number | null;
}

/** One input field as the technician typed it, before any conversion. */
export interface TypedInput {
  /** The text exactly as typed (decimal comma and all), e.g. "1,25". */
  text: string;
  /** The unit picked beside it, e.g. "bar", "degC", "kg". */
  unit: string;
  /** For pressures: whether the value was entered as gauge or absolute. Absent for other quantities. */
  reference?: 'gauge' | 'absolute';
}

/** A caution as the check engine reports it (ISO 3864 / ANSI Z535 signal words). */
export interface StoredCaution {
  signal: 'DANGER' | 'WARNING' | 'CAUTION' | 'NOTICE';
  message: string;
  rule: string;
}

/** What the UI passes to save a check. The store adds id, device, seq, time, hashes. */
export interface NewCheck {
  vesselId: string;
  technician: string;
  note?: string;
  /** When the reading was taken; defaults to now. Stored as ISO 8601 with this device's offset. */
  takenAt?: Date;
  /** Per field (e.g. "temperature", "pressure", "grossWeight"), the text and unit as typed. */
  inputs: Record<string, TypedInput>;
  /** The SI reading passed to evaluateCheck (K, Pa, kg ...), stored as-is (checked to be plain JSON). */
  reading: Reading;
  /** evaluateCheck's result, stored as-is (checked to be plain JSON). */
  result: CheckResult;
  /**
   * The vessel spec the check was evaluated with, when it differs from the stored vessel's: the
   * register's limits in its instrument figures and `instrumentsUsed` naming the instruments and
   * calibrations (core vesselWithInstruments). Absent: the stored vessel's spec is the snapshot.
   */
  vesselSpec?: VesselSpec;
  cautions: readonly StoredCaution[];
  appVersion: string;
  formulationId: string;
  /** For a correction: the id of the check this one corrects (that record stays as it was). */
  corrects?: string;
  /** Why the correction was made; required with `corrects`. */
  reason?: string;
}

/**
 * A saved check. Append-only: never overwritten or deleted. `hash` is SHA-256 over the canonical
 * serialisation of every other field (prevHash included), so each device's records form a chain.
 */
export interface CheckRecord {
  /** UUID (crypto.randomUUID()). */
  id: string;
  /** UUID of the device (app install) that saved it. */
  deviceId: string;
  /** 1, 2, 3 ... per device, in save order. */
  seq: number;
  /** When the reading was taken, ISO 8601 with the device's UTC offset. */
  time: IsoDateTime;
  /** `time` as milliseconds since 1970-01-01T00:00:00Z: the sort key (offsets make `time` strings unsortable). */
  timeMs: number;
  technician: string;
  note: string;
  vesselId: string;
  /** The vessel as the check used it: its stored spec, or (with a register) that spec with the instruments' limits and `instrumentsUsed`. */
  vessel: { tag: string; spec: VesselSpecData };
  inputs: Record<string, TypedInput>;
  /** The reading as evaluateCheck took it. */
  reading: Reading;
  /** The result as the engine of `appVersion` returned it: today's CheckResult, or an older version's (findingsOfStoredResult reads either). */
  result: StoredCheckResult;
  cautions: StoredCaution[];
  appVersion: string;
  formulationId: string;
  corrects: string | null;
  reason: string | null;
  /** The hash of the previous record on this device; 64 zeros for the first. */
  prevHash: string;
  /** SHA-256, lower-case hex, of the canonical serialisation of this record without `hash`. */
  hash: string;
}

/** Where a page of checks ends; pass it back as `before` to get the next (older) page. */
export interface CheckCursor {
  timeMs: number;
  id: string;
}

/** One page of checks, newest first. */
export interface CheckPage {
  checks: CheckRecord[];
  /** Cursor for the next older page, or null when there are no more. */
  next: CheckCursor | null;
}

/** Optional progress reporting and cancellation for long work (export, import, verification). */
export interface LongWorkOptions {
  signal?: AbortSignal;
  /** Called with records done so far and the total. */
  onProgress?: (done: number, total: number) => void;
}

/** The public half of a device key as a JSON Web Key (RFC 7517, EC members of RFC 7518 §6.2.1). */
export interface PublicJwk {
  crv: 'P-256';
  kty: 'EC';
  /** The curve point's x and y, 32 bytes each, base64url without padding (43 characters). */
  x: string;
  y: string;
}

/** This install's key pair as the store keeps it (settings key store:signingKey; signing.ts). */
export interface DeviceKey {
  privateKey: CryptoKey;
  publicKey: CryptoKey;
  publicJwk: PublicJwk;
  createdAt: IsoDateTime;
}

/** Another device's public key, as learnt from a backup it signed (settings key store:deviceKey:<deviceId>). */
export interface KnownDeviceKey {
  deviceId: string;
  publicJwk: PublicJwk;
  fingerprint: string;
  /** When this device first imported it. */
  learntAt: IsoDateTime;
}

/** The chain hash that the first record on a device points back to. */
export const GENESIS_HASH = '0'.repeat(64);

/**
 * A record of another kind than a check in a device's chain (BACKUP-FORMAT.md, "Records of other
 * kinds"): a cycle, a periodic test, later a review note. Same chain, seq, hash and signature as a
 * check; its own free-form `values` (plain JSON, read by the room that made it). The members are
 * fixed so that every member sorting before "prevHash" holds only plain strings or cautions: the
 * chain fields can then be cut from the canonical text without parsing it, as for a check
 * (integrity.ts chainFieldsOfText).
 */
export interface KindRecord {
  /** The record's kind: 1–32 lower-case letters, digits or dashes, never "check" (record-kinds.ts lists those this version keeps). */
  kind: string;
  id: string;
  deviceId: string;
  seq: number;
  /** When the record's subject happened (a cycle's start, a test's time), ISO 8601 with the device's offset. */
  time: IsoDateTime;
  timeMs: number;
  technician: string;
  note: string;
  /** The vessel it is about, or null for a record about no one vessel. */
  vesselId: string | null;
  /** The vessel's tag as it was when the record was saved; null with vesselId null. */
  vessel: { tag: string } | null;
  /** What the kind's room saved: its inputs, limits, evaluation (plain JSON). */
  values: JsonObject;
  /** The cautions shown with it, as a check's (signal word, message, rule). */
  cautions: StoredCaution[];
  appVersion: string;
  formulationId: string;
  prevHash: string;
  hash: string;
}

/** What the UI passes to appendRecord. The store adds kind, id, device, seq, time, hashes. */
export interface NewKindRecord {
  vesselId: string | null;
  technician: string;
  note?: string;
  /** When it happened; defaults to now. */
  takenAt?: Date;
  values: JsonObject;
  cautions: readonly StoredCaution[];
  appVersion: string;
  formulationId: string;
}

/** Any record of a device's chain: a check (no `kind` member) or a record of another kind. */
export type LogRecord = CheckRecord | KindRecord;

/** Whether a stored record is a check (a check carries no `kind` member). */
export function isCheckRecord(record: LogRecord): record is CheckRecord {
  return !('kind' in record);
}

/** One page of records of a kind, newest first unless asked otherwise. */
export interface KindRecordPage {
  records: KindRecord[];
  next: CheckCursor | null;
}
